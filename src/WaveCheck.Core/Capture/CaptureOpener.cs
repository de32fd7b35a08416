namespace WaveCheck.Core.Capture;

/// <summary>Opens a capture file of any supported format for streaming, chosen by content and extension.</summary>
public static class CaptureOpener
{
    /// <summary>Opens <paramref name="path"/> with the user's import options.</summary>
    /// <param name="path">A WAV, CSV (or COMTRADE .cfg/.cff) file.</param>
    /// <param name="options">Calibration, channel choice, sensor coupling.</param>
    /// <returns>A source positioned at the first sample; the caller disposes it.</returns>
    /// <exception cref="CaptureFormatException">Missing, empty, a directory, unknown format, or malformed at a stated place.</exception>
    /// <exception cref="OptionValueException">An option is out of the bounds of <see cref="CaptureLimits"/>.</exception>
    public static ICaptureSource Open(string path, ImportOptions options)
    {
        ArgumentNullException.ThrowIfNull(path);
        ArgumentNullException.ThrowIfNull(options);
        options.Validate();
        if (Directory.Exists(path))
        {
            throw new CaptureFormatException(path, "is a directory, not a capture file");
        }

        if (!File.Exists(path))
        {
            throw new CaptureFormatException(path, "no such file");
        }

        var extension = Path.GetExtension(path).ToLowerInvariant();
        if (extension is ".cfg" or ".cff")
        {
            return Comtrade.ComtradeCaptureSource.Open(path, options);
        }

        var length = new FileInfo(path).Length;
        if (length == 0)
        {
            throw extension is ".csv" or ".txt" or ".tsv"
                ? new CaptureFormatException(path, "empty file (0 bytes)", line: 1, column: 1)
                : new CaptureFormatException(path, "empty file (0 bytes)", byteOffset: 0);
        }

        if (LooksLikeRiffWave(path) || extension == ".wav")
        {
            // A .wav whose bytes are not RIFF/WAVE is reported by the reader with the byte offset.
            return new WavCaptureSource(path, options);
        }

        if (extension is ".csv" or ".txt" or ".tsv")
        {
            return new CsvCaptureSource(path, options);
        }

        throw new CaptureFormatException(path,
            $"unknown capture format (extension '{(extension.Length == 0 ? "none" : extension)}', content not RIFF/WAVE): expected .wav, .csv, .txt, .tsv, or a COMTRADE .cfg or .cff (for a COMTRADE .dat, open the .cfg beside it)");
    }

    private static bool LooksLikeRiffWave(string path)
    {
        Span<byte> head = stackalloc byte[12];
        using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, 1);
        return stream.ReadAtLeast(head, 12, throwOnEndOfStream: false) == 12 &&
               head[..4].SequenceEqual("RIFF"u8) && head[8..].SequenceEqual("WAVE"u8);
    }
}
