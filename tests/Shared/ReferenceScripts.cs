using System.Runtime.CompilerServices;

namespace WaveCheck.Tests.Shared;

/// <summary>The reference scripts the tests compare with (numpy, scipy), all in <c>tests/reference/</c>.</summary>
internal static class ReferenceScripts
{
    /// <summary>Full path of a script in <c>tests/reference/</c>.</summary>
    /// <param name="name">File name, e.g. <c>periodogram.py</c>.</param>
    public static string Path(string name) =>
        System.IO.Path.Combine(System.IO.Path.GetDirectoryName(System.IO.Path.GetDirectoryName(ThisFile()))!, "reference", name);

    private static string ThisFile([CallerFilePath] string path = "") => path;
}
