using System.Runtime.InteropServices;

namespace WaveCheck.Tests.Shared;

/// <summary>Hard links for tests: .NET has no API for them, so libc's link(2) (POSIX).</summary>
internal static class HardLink
{
    public static void Create(string existing, string link)
    {
        if (LinkNative(existing, link) != 0)
        {
            throw new IOException($"link({existing}, {link}) failed: errno {Marshal.GetLastPInvokeError()}");
        }
    }

#pragma warning disable SYSLIB1054 // DllImport: the test project does not allow unsafe code either.
    [DllImport("libc", EntryPoint = "link", SetLastError = true)]
    private static extern int LinkNative([MarshalAs(UnmanagedType.LPUTF8Str)] string existing, [MarshalAs(UnmanagedType.LPUTF8Str)] string link);
#pragma warning restore SYSLIB1054
}
