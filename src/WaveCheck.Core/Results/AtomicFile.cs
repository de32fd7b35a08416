namespace WaveCheck.Core.Results;

/// <summary>
/// Writes an output file whole or not at all: into a temporary file beside the target, then renamed over it.
/// A crash or an error part-way leaves any previous file untouched and no half-written one.
/// </summary>
public static class AtomicFile
{
    /// <summary>Writes through <paramref name="write"/> into a temporary file, then moves it to <paramref name="path"/>.</summary>
    /// <param name="path">Target file; its folder is created if missing.</param>
    /// <param name="write">Writes the whole content to the stream it is given.</param>
    public static void Write(string path, Action<Stream> write)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        var full = Path.GetFullPath(path);
        var folder = Path.GetDirectoryName(full)!;
        Directory.CreateDirectory(folder);
        var temp = Path.Combine(folder, $".{Path.GetFileName(full)}.{Environment.ProcessId}.{Guid.NewGuid():N}.tmp");
        try
        {
            using (var stream = new FileStream(temp, FileMode.CreateNew, FileAccess.Write, FileShare.None, 1 << 16))
            {
                write(stream);
                stream.Flush(flushToDisk: true);
            }

            File.Move(temp, full, overwrite: true);
        }
        catch
        {
            TryDelete(temp);
            throw;
        }
    }

    /// <summary>Writes text (UTF-8, no BOM) whole or not at all.</summary>
    public static void WriteText(string path, string text) =>
        Write(path, s =>
        {
            using var writer = new StreamWriter(s, new System.Text.UTF8Encoding(false), 1 << 16, leaveOpen: true);
            writer.Write(text);
        });

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
}
