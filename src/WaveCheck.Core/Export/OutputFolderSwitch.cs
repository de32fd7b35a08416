using System.Runtime.InteropServices;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Export;

/// <summary>
/// A folder of outputs replaced as one set, so that it always holds either the old complete set or the new complete
/// set, never a mix.
/// </summary>
/// <remarks>
/// <para>The scheme: the new set is written into a staging folder <c>.wc-XXXXXXXX.staging</c> created beside the
/// target (in the same parent folder, so on the same file system). <see cref="Commit"/> then switches it in:</para>
/// <list type="bullet">
/// <item>no target yet: one rename of the staging folder to the target;</item>
/// <item>a target exists, on Linux: one <c>renameat2(RENAME_EXCHANGE)</c> swaps the two folders atomically, and the
/// old set, now under the staging name, is deleted;</item>
/// <item>where that call is missing or refused (other systems, some file systems): the old folder is renamed aside to
/// <c>.wc-XXXXXXXX.old</c>, the staging folder renamed to the target and the old one deleted. Only a power cut or a
/// kill between those two renames can leave the target missing, with the old set intact under the <c>.old</c> name.</item>
/// </list>
/// <para>Disposing without <see cref="Commit"/> (an error, a cancellation) deletes the staging folder and leaves the
/// target as it was. A target that is a symbolic link to a folder keeps its link: the folder it points to is the one
/// replaced. What the target may hold and that no input lies in it is checked before, by <see cref="OutputPlan"/>.</para>
/// </remarks>
public sealed class OutputFolderSwitch : IDisposable
{
    private readonly string _real;
    private bool _committed;
    private bool _disposed;

    private OutputFolderSwitch(string target, string real, string staging)
    {
        TargetPath = target;
        _real = real;
        StagingPath = staging;
    }

    /// <summary>The target folder as the user gave it.</summary>
    public string TargetPath { get; }

    /// <summary>The staging folder, to write the new set into.</summary>
    public string StagingPath { get; }

    /// <summary>Creates the staging folder beside <paramref name="target"/> (and the target's parent, if missing).</summary>
    /// <param name="target">The folder to replace, as the user gave it.</param>
    /// <exception cref="OutputPathException">The target is a file, a root folder, or its path runs through a file.</exception>
    /// <exception cref="OutputWriteException">The staging folder cannot be created.</exception>
    public static OutputFolderSwitch Begin(string target)
    {
        ArgumentException.ThrowIfNullOrEmpty(target);
        var full = Path.GetFullPath(target);
        if (File.Exists(full))
        {
            throw new OutputPathException($"{target} is a file, not a folder");
        }

        var real = Directory.Exists(full) && new DirectoryInfo(full).ResolveLinkTarget(returnFinalTarget: true) is { } link
            ? link.FullName
            : Path.TrimEndingDirectorySeparator(full);
        var parent = Path.GetDirectoryName(real)
            ?? throw new OutputPathException($"{target} is a root folder: a survey folder is replaced as a whole, so it needs a folder of its own");
        AtomicFile.CreateFolder(target, parent);
        for (var attempt = 0; ; attempt++)
        {
            var staging = Path.Combine(parent, StagingName());
            if (Path.Exists(staging) && attempt < 5)
            {
                continue;
            }

            try
            {
                Directory.CreateDirectory(staging);
                return new OutputFolderSwitch(target, real, staging);
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                throw new OutputWriteException(target, e is UnauthorizedAccessException
                    ? $"permission denied creating a folder in {parent}"
                    : AtomicFile.Reason(e, staging, real), e);
            }
        }
    }

    /// <summary>Whether <paramref name="name"/> is a staging or set-aside folder of this class (a leftover of a killed run).</summary>
    public static bool IsWorkName(string name) =>
        name.StartsWith(".wc-", StringComparison.Ordinal) &&
        (name.EndsWith(".staging", StringComparison.Ordinal) || name.EndsWith(".old", StringComparison.Ordinal));

    /// <summary>Switches the staging folder in as the target; the old set is deleted.</summary>
    /// <exception cref="OutputWriteException">The switch failed; the target is as it was.</exception>
    public void Commit()
    {
        ObjectDisposedException.ThrowIf(_disposed, this);
        try
        {
            if (!Directory.Exists(_real))
            {
                Directory.Move(StagingPath, _real);
            }
            else if (Exchange(StagingPath, _real))
            {
                TryDeleteFolder(StagingPath);
            }
            else
            {
                var old = Path.Combine(Path.GetDirectoryName(_real)!, ".wc-" + AtomicFile.TempName()[4..12] + ".old");
                Directory.Move(_real, old);
                try
                {
                    Directory.Move(StagingPath, _real);
                }
                catch
                {
                    Directory.Move(old, _real);
                    throw;
                }

                TryDeleteFolder(old);
            }
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new OutputWriteException(TargetPath, AtomicFile.Reason(e, StagingPath, _real), e);
        }

        _committed = true;
    }

    /// <summary>The path the user will see for a file written in the staging folder.</summary>
    /// <param name="stagedPath">A path inside <see cref="StagingPath"/>.</param>
    public string ToTarget(string stagedPath)
    {
        ArgumentNullException.ThrowIfNull(stagedPath);
        var full = Path.GetFullPath(stagedPath);
        return full.StartsWith(StagingPath, StringComparison.Ordinal)
            ? Path.Join(TargetPath, Path.GetRelativePath(StagingPath, full))
            : stagedPath;
    }

    /// <summary>An output failure reported against the target path, not the staging folder.</summary>
    public OutputWriteException ToTarget(OutputWriteException e)
    {
        ArgumentNullException.ThrowIfNull(e);
        return e.TargetPath.Contains(StagingPath, StringComparison.Ordinal) || e.Reason.Contains(StagingPath, StringComparison.Ordinal)
            ? new OutputWriteException(ToTarget(e.TargetPath), e.Reason.Replace(StagingPath, _real, StringComparison.Ordinal), e)
            : e;
    }

    /// <summary>Deletes the staging folder unless committed; the target stays as it was.</summary>
    public void Dispose()
    {
        if (_disposed)
        {
            return;
        }

        _disposed = true;
        if (!_committed)
        {
            TryDeleteFolder(StagingPath);
        }
    }

    private static string StagingName() => ".wc-" + AtomicFile.TempName()[4..12] + ".staging";

    private static void TryDeleteFolder(string path)
    {
        try
        {
            Directory.Delete(path, recursive: true);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // Left behind under its .wc- name; the target is complete either way.
        }
    }

    /// <summary>Swaps two existing folders in one step (Linux renameat2 with RENAME_EXCHANGE, kernel 3.15, glibc
    /// 2.28); false where the call is missing or the file system refuses it.</summary>
    private static bool Exchange(string a, string b)
    {
        if (!OperatingSystem.IsLinux())
        {
            return false;
        }

        try
        {
            const int atFdCwd = -100;
            const uint renameExchange = 2;
            return renameat2(atFdCwd, a, atFdCwd, b, renameExchange) == 0;
        }
        catch (Exception e) when (e is EntryPointNotFoundException or DllNotFoundException)
        {
            return false;
        }
    }

#pragma warning disable SYSLIB1054 // DllImport keeps the project free of unsafe code (LibraryImport needs it).
    [DllImport("libc", SetLastError = true)]
    private static extern int renameat2(int oldDirFd, [MarshalAs(UnmanagedType.LPUTF8Str)] string oldPath,
        int newDirFd, [MarshalAs(UnmanagedType.LPUTF8Str)] string newPath, uint flags);
#pragma warning restore SYSLIB1054
}
