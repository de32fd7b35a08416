using System.Runtime.InteropServices;
using System.Security.Cryptography;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Export;

/// <summary>
/// Writes an output file whole or not at all: into a temporary file beside the target, then renamed over it.
/// A crash or an error part-way leaves any previous file untouched and no half-written one.
/// </summary>
/// <remarks>
/// The temporary file is <c>.wc-XXXXXXXX.tmp</c> (8 random letters and digits) in the target's folder, so the rename
/// stays on one file system and a target name as long as the file system allows still works. Errors name the
/// target, never the temporary file. A target that exists read-only is refused (<see cref="OutputPathException"/>):
/// the rename would otherwise replace it regardless of its mode. A cancelled write deletes the temporary file and
/// leaves the target as it was. Which outputs may be written at all (not over an input, not twice) is decided
/// beforehand by <see cref="OutputPlan"/>.
/// </remarks>
public static class AtomicFile
{
    private const string TempPrefix = ".wc-";
    private const string TempSuffix = ".tmp";

    /// <summary>Writes through <paramref name="write"/> into a temporary file, then moves it to <paramref name="path"/>.</summary>
    /// <param name="path">Target file; its folder is created if missing.</param>
    /// <param name="write">Writes the whole content to the stream it is given.</param>
    /// <param name="cancellationToken">Checked before the file is created and before it is moved into place; pass
    /// the same token to the work inside <paramref name="write"/> to stop it part-way.</param>
    /// <exception cref="OutputPathException">The target is a folder or read-only, or a part of its folder is a file.</exception>
    /// <exception cref="OutputWriteException">Writing failed (disk full, permission denied); the message names <paramref name="path"/>.</exception>
    /// <exception cref="OperationCanceledException">Cancelled; nothing was written.</exception>
    public static void Write(string path, Action<Stream> write, CancellationToken cancellationToken = default)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        ArgumentNullException.ThrowIfNull(write);
        var full = Path.GetFullPath(path);
        var folder = Path.GetDirectoryName(full) ?? throw new OutputPathException($"{path}: a file name is needed, not a folder");
        CheckTarget(path, full);
        cancellationToken.ThrowIfCancellationRequested();
        CreateFolder(path, folder);
        var (temp, file) = CreateTemp(path, folder);
        try
        {
            write(new TargetStream(file, path, temp));
            Guard(path, temp, () =>
            {
                file.Flush(flushToDisk: true);
                file.Dispose();
            });
            cancellationToken.ThrowIfCancellationRequested();
            Guard(path, temp, () => File.Move(temp, full, overwrite: true));
        }
        catch
        {
            Abandon(file, temp);
            throw;
        }
    }

    /// <summary>Writes text (UTF-8, no BOM) whole or not at all.</summary>
    /// <param name="path">Target file.</param>
    /// <param name="text">The whole content.</param>
    /// <param name="cancellationToken">As for <see cref="Write"/>.</param>
    public static void WriteText(string path, string text, CancellationToken cancellationToken = default) =>
        Write(path, s =>
        {
            using var writer = new StreamWriter(s, new System.Text.UTF8Encoding(false), 1 << 16, leaveOpen: true);
            writer.Write(text);
        }, cancellationToken);

    /// <summary>Refuses a target that is a folder or an existing read-only file, or whose folder path runs through a file.</summary>
    /// <param name="given">The path as the user gave it, for the message.</param>
    /// <param name="full">Its full form.</param>
    /// <exception cref="OutputPathException">The target cannot be written.</exception>
    internal static void CheckTarget(string given, string full)
    {
        if (Directory.Exists(full))
        {
            throw new OutputPathException($"{given} is a folder: a file name is needed");
        }

        if (File.Exists(full) && IsReadOnly(full))
        {
            throw new OutputPathException($"{given} exists and is read-only: it was not replaced (make it writable, or choose another path)");
        }

        if (FileInFolderPath(full) is { } file)
        {
            throw new OutputPathException($"{given}: {AsGiven(given, file)} is a file, not a folder");
        }
    }

    /// <summary><paramref name="full"/> spelt as the user spelt <paramref name="given"/>: relative to the current
    /// folder when that was relative.</summary>
    internal static string AsGiven(string given, string full) =>
        Path.IsPathRooted(given) ? full : Path.GetRelativePath(Environment.CurrentDirectory, full);

    /// <summary>The nearest existing ancestor of <paramref name="full"/> when it is a file rather than a folder; else null.</summary>
    internal static string? FileInFolderPath(string full)
    {
        for (var at = Path.GetDirectoryName(full); at is not null; at = Path.GetDirectoryName(at))
        {
            if (Directory.Exists(at))
            {
                return null;
            }

            if (File.Exists(at))
            {
                return at;
            }
        }

        return null;
    }

    /// <summary>Whether the existing file may not be written: no write permission for this user, or no write bit set
    /// at all (a chmod 444 file, which a superuser could otherwise write regardless).</summary>
    internal static bool IsReadOnly(string full)
    {
        if (OperatingSystem.IsWindows())
        {
            return File.GetAttributes(full).HasFlag(FileAttributes.ReadOnly);
        }

        const UnixFileMode anyWrite = UnixFileMode.UserWrite | UnixFileMode.GroupWrite | UnixFileMode.OtherWrite;
        if ((File.GetUnixFileMode(full) & anyWrite) == 0)
        {
            return true;
        }

        try
        {
            const int writeOk = 2; // W_OK in unistd.h, the same on Linux and macOS
            return access(full, writeOk) != 0;
        }
        catch (Exception e) when (e is EntryPointNotFoundException or DllNotFoundException)
        {
            return false;
        }
    }

    /// <summary>A new, empty temporary file in <paramref name="folder"/>, open for writing.</summary>
    /// <param name="target">The output path as the user gave it, for messages.</param>
    /// <param name="folder">An existing folder.</param>
    internal static (string Temp, FileStream Stream) CreateTemp(string target, string folder)
    {
        for (var attempt = 0; ; attempt++)
        {
            var temp = Path.Combine(folder, TempName());
            try
            {
                return (temp, new FileStream(temp, FileMode.CreateNew, FileAccess.ReadWrite, FileShare.None, 1 << 16));
            }
            catch (IOException) when (File.Exists(temp) && attempt < 5)
            {
                // That random name is taken (one in 36^8): draw another.
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                throw new OutputWriteException(target, Reason(e, temp, Path.Combine(folder, Path.GetFileName(target))), e);
            }
        }
    }

    /// <summary>A temporary name: <c>.wc-</c>, 8 random lower-case letters and digits, <c>.tmp</c>.</summary>
    internal static string TempName() =>
        TempPrefix + RandomNumberGenerator.GetString("abcdefghijklmnopqrstuvwxyz0123456789", 8) + TempSuffix;

    /// <summary>Whether <paramref name="name"/> is one of this class's temporary names (a leftover of a killed run).</summary>
    internal static bool IsTempName(string name) =>
        name.Length == TempPrefix.Length + 8 + TempSuffix.Length &&
        name.StartsWith(TempPrefix, StringComparison.Ordinal) && name.EndsWith(TempSuffix, StringComparison.Ordinal);

    /// <summary>Creates the target's folder, naming the target (not a temporary file) when that fails.</summary>
    internal static void CreateFolder(string target, string folder)
    {
        try
        {
            Directory.CreateDirectory(folder);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw FileInFolderPath(Path.Combine(folder, "x")) is { } file
                ? new OutputPathException($"{target}: {AsGiven(target, file)} is a file, not a folder")
                : new OutputWriteException(target, e is UnauthorizedAccessException
                    ? $"permission denied creating the folder {folder}"
                    : e.Message, e);
        }
    }

    /// <summary>The file system's reason, with the temporary file's name taken out (it means nothing to the user).</summary>
    internal static string Reason(Exception e, string temp, string target)
    {
        if (e is UnauthorizedAccessException)
        {
            return $"permission denied writing in {Path.GetDirectoryName(target)}";
        }

        var message = e.Message
            .Replace($" : '{temp}'", "", StringComparison.Ordinal)
            .Replace(temp, target, StringComparison.Ordinal)
            .Replace(Path.GetFileName(temp), Path.GetFileName(target), StringComparison.Ordinal);
        return message.TrimEnd('.', ' ');
    }

    private static void Guard(string target, string temp, Action step)
    {
        try
        {
            step();
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException && e is not OutputWriteException)
        {
            throw new OutputWriteException(target, Reason(e, temp, Path.GetFullPath(target)), e);
        }
    }

    /// <summary>Closes and deletes a temporary file that will not be used, keeping the first error as the one reported.</summary>
    internal static void Abandon(FileStream file, string temp)
    {
        try
        {
            // Closing flushes what is buffered, which may fail again (a full disk): the handle is closed regardless.
            file.Dispose();
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // The first error is the one to report.
        }

        TryDelete(temp);
    }

    private static void TryDelete(string path)
    {
        try
        {
            File.Delete(path);
        }
        catch (IOException)
        {
            // The temporary file is left behind; the target was not touched.
        }
        catch (UnauthorizedAccessException)
        {
            // As above.
        }
    }

#pragma warning disable SYSLIB1054 // DllImport keeps the project free of unsafe code (LibraryImport needs it).
    [DllImport("libc", SetLastError = true)]
    private static extern int access([MarshalAs(UnmanagedType.LPUTF8Str)] string path, int mode);
#pragma warning restore SYSLIB1054

    /// <summary>The temporary file as the writer sees it: failures to write it are reported against the target.</summary>
    private sealed class TargetStream(FileStream inner, string target, string temp) : Stream
    {
        public override bool CanRead => inner.CanRead;

        public override bool CanSeek => inner.CanSeek;

        public override bool CanWrite => inner.CanWrite;

        public override long Length => inner.Length;

        public override long Position
        {
            get => inner.Position;
            set => Run(() => inner.Position = value);
        }

        public override void Flush() => Run(inner.Flush);

        public override Task FlushAsync(CancellationToken cancellationToken) => RunAsync(() => inner.FlushAsync(cancellationToken));

        public override int Read(byte[] buffer, int offset, int count) => inner.Read(buffer, offset, count);

        public override long Seek(long offset, SeekOrigin origin)
        {
            long position = 0;
            Run(() => position = inner.Seek(offset, origin));
            return position;
        }

        public override void SetLength(long value) => Run(() => inner.SetLength(value));

        public override void Write(byte[] buffer, int offset, int count) => Run(() => inner.Write(buffer, offset, count));

        public override void Write(ReadOnlySpan<byte> buffer)
        {
            try
            {
                inner.Write(buffer);
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                throw Wrap(e);
            }
        }

        public override void WriteByte(byte value) => Run(() => inner.WriteByte(value));

        public override Task WriteAsync(byte[] buffer, int offset, int count, CancellationToken cancellationToken) =>
            RunAsync(() => inner.WriteAsync(buffer, offset, count, cancellationToken));

        public override ValueTask WriteAsync(ReadOnlyMemory<byte> buffer, CancellationToken cancellationToken = default) =>
            new(RunAsync(() => inner.WriteAsync(buffer, cancellationToken).AsTask()));

        private void Run(Action action)
        {
            try
            {
                action();
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                throw Wrap(e);
            }
        }

        private async Task RunAsync(Func<Task> action)
        {
            try
            {
                await action().ConfigureAwait(false);
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                throw Wrap(e);
            }
        }

        private OutputWriteException Wrap(Exception e) =>
            e as OutputWriteException ?? new OutputWriteException(target, Reason(e, temp, Path.GetFullPath(target)), e);
    }
}
