using System.Runtime.InteropServices;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Export;

/// <summary>
/// Which file a path names, whatever the spelling: two paths name the same file when their identities are equal,
/// whether they are the same text, differ by <c>..</c>, pass through symbolic links (on either side), are hard links
/// of one another, or differ in case on a file system that folds case.
/// </summary>
/// <remarks>
/// .NET has no API for a file's inode, so on Linux the identity is the device (major, minor) and inode number from
/// <c>statx(2)</c> (glibc 2.28 or later; the kernel's <c>struct statx</c> has the same fixed layout on every
/// architecture, unlike <c>struct stat</c>, which is why statx and not stat is called). On macOS it is
/// <c>st_dev</c> and <c>st_ino</c> from <c>stat(2)</c> in its 64-bit-inode layout. Where neither is available
/// (Windows, a kernel or sandbox refusing statx) the identity falls back to the full path with symbolic links
/// resolved, case-folded where the file system folds case: hard links are then not recognised.
/// Every lookup follows symbolic links, as opening the path would.
/// </remarks>
internal readonly record struct FileIdentity(ulong Device, ulong Inode, string? CanonicalPath)
{
    /// <summary>The identity of the existing file or folder <paramref name="path"/>; null when nothing is there
    /// (including a dangling symbolic link).</summary>
    public static FileIdentity? Of(string path)
    {
        if (!Path.Exists(path))
        {
            return null;
        }

        if (OperatingSystem.IsLinux() && Native.Statx(path) is { } linux)
        {
            return linux;
        }

        if (OperatingSystem.IsMacOS() && Native.DarwinStat(path) is { } mac)
        {
            return mac;
        }

        return new FileIdentity(0, 0, CanonicalFallback(path));
    }

    /// <summary>Whether names in the existing folder <paramref name="folder"/> are looked up without regard to case:
    /// probed by asking for an entry (or the folder itself, in its parent) with its letters' case swapped.</summary>
    public static bool FoldsCase(string folder)
    {
        var full = Path.GetFullPath(folder);
        try
        {
            foreach (var entry in Directory.EnumerateFileSystemEntries(full).Take(64))
            {
                if (Probe(entry) is { } answer)
                {
                    return answer;
                }
            }
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // An unreadable folder: ask its parent instead.
        }

        for (var at = full; Path.GetDirectoryName(at) is { } parent; at = parent)
        {
            if (Probe(at) is { } answer)
            {
                return answer;
            }
        }

        // Nothing with a letter in it to ask about: the platform's usual file system.
        return OperatingSystem.IsWindows() || OperatingSystem.IsMacOS();
    }

    /// <summary>True or false when the swapped-case spelling of <paramref name="path"/>'s last name does or does not
    /// reach the same file; null when the name has no letter whose case can be swapped.</summary>
    private static bool? Probe(string path)
    {
        var name = Path.GetFileName(path);
        var swapped = SwapCase(name);
        if (swapped == name)
        {
            return null;
        }

        var other = Path.Combine(Path.GetDirectoryName(path)!, swapped);
        return Of(other) is { } found && Of(path) is { } original && found == original;
    }

    internal static string SwapCase(string name)
    {
        var chars = name.ToCharArray();
        for (var i = 0; i < chars.Length; i++)
        {
            var c = chars[i];
            var upper = char.ToUpperInvariant(c);
            chars[i] = upper != c ? upper : char.ToLowerInvariant(c);
        }

        return new string(chars);
    }

    private static string CanonicalFallback(string path)
    {
        var canonical = Resolve(Path.GetFullPath(path), 0);
        return OperatingSystem.IsWindows() || OperatingSystem.IsMacOS() ? canonical.ToUpperInvariant() : canonical;
    }

    /// <summary>The full path with every symbolic link along it replaced by its target, as far as 40 links deep
    /// (Linux's limit, MAXSYMLINKS).</summary>
    private static string Resolve(string full, int depth)
    {
        var root = Path.GetPathRoot(full) ?? "";
        var current = root;
        foreach (var part in full[root.Length..].Split([Path.DirectorySeparatorChar, Path.AltDirectorySeparatorChar], StringSplitOptions.RemoveEmptyEntries))
        {
            var next = Path.Combine(current, part);
            string? target = null;
            try
            {
                target = new FileInfo(next).LinkTarget;
            }
            catch (IOException)
            {
                // Unreadable: taken as it is.
            }

            current = target is not null && depth < 40
                ? Resolve(Path.GetFullPath(target, current), depth + 1)
                : next;
        }

        return current;
    }

    /// <summary>The few system calls .NET does not wrap. Each returns null when the call is missing or fails, so the
    /// caller falls back to comparing paths.</summary>
    private static class Native
    {
        private const int AtFdCwd = -100;
        private const uint StatxType = 0x1, StatxIno = 0x100;

        public static FileIdentity? Statx(string path)
        {
            try
            {
                var buffer = default(StatxBuffer);
                if (statx(AtFdCwd, path, 0, StatxType | StatxIno, ref buffer) != 0 || (buffer.Mask & StatxIno) == 0)
                {
                    return null;
                }

                return new FileIdentity(((ulong)buffer.DevMajor << 32) | buffer.DevMinor, buffer.Inode, null);
            }
            catch (Exception e) when (e is EntryPointNotFoundException or DllNotFoundException)
            {
                return null;
            }
        }

        public static FileIdentity? DarwinStat(string path)
        {
            try
            {
                var buffer = default(DarwinStatBuffer);
                var result = RuntimeInformation.ProcessArchitecture == Architecture.X64
                    ? stat_inode64(path, ref buffer)
                    : stat(path, ref buffer);
                return result == 0 ? new FileIdentity((uint)buffer.Device, buffer.Inode, null) : null;
            }
            catch (Exception e) when (e is EntryPointNotFoundException or DllNotFoundException)
            {
                return null;
            }
        }

        /// <summary>Linux <c>struct statx</c> (include/uapi/linux/stat.h): 256 bytes, fixed layout on every architecture.</summary>
        [StructLayout(LayoutKind.Explicit, Size = 256)]
        private struct StatxBuffer
        {
            [FieldOffset(0)] public uint Mask;
            [FieldOffset(32)] public ulong Inode;
            [FieldOffset(136)] public uint DevMajor;
            [FieldOffset(140)] public uint DevMinor;
        }

        /// <summary>Darwin <c>struct stat</c> with 64-bit inodes (sys/stat.h, <c>__DARWIN_STRUCT_STAT64</c>): 144 bytes.</summary>
        [StructLayout(LayoutKind.Explicit, Size = 144)]
        private struct DarwinStatBuffer
        {
            [FieldOffset(0)] public int Device;
            [FieldOffset(8)] public ulong Inode;
        }

#pragma warning disable SYSLIB1054 // DllImport keeps the project free of unsafe code (LibraryImport needs it).
        [DllImport("libc", SetLastError = true)]
        private static extern int statx(int dirfd, [MarshalAs(UnmanagedType.LPUTF8Str)] string path, int flags, uint mask, ref StatxBuffer buffer);

        [DllImport("libc", SetLastError = true)]
        private static extern int stat([MarshalAs(UnmanagedType.LPUTF8Str)] string path, ref DarwinStatBuffer buffer);

        [DllImport("libc", EntryPoint = "stat$INODE64", SetLastError = true)]
        private static extern int stat_inode64([MarshalAs(UnmanagedType.LPUTF8Str)] string path, ref DarwinStatBuffer buffer);
#pragma warning restore SYSLIB1054
    }
}
