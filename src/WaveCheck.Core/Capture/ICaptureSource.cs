namespace WaveCheck.Core.Capture;

/// <summary>
/// A capture opened for streaming: fills <see cref="CaptureBlock"/>s one after another, so a capture of any length
/// is read with bounded memory. Not thread-safe; one consumer at a time.
/// </summary>
public interface ICaptureSource : IDisposable
{
    /// <summary>What is known about the capture. For one-pass formats (CSV) some figures (sample count, measured rate)
    /// are final only after the last block has been read.</summary>
    CaptureInfo Info { get; }

    /// <summary>Warnings found so far (gaps, truncation, clipping); complete after the last block.</summary>
    IReadOnlyList<CaptureWarning> Warnings { get; }

    /// <summary>Creates a block sized for this source (channel count, sample rate).</summary>
    /// <param name="capacity">Samples per channel per block; 65 536 is a good default.</param>
    CaptureBlock CreateBlock(int capacity = 65536);

    /// <summary>Reads the next samples into <paramref name="block"/>.</summary>
    /// <returns>False at the end of the capture (then <c>block.Length</c> is 0).</returns>
    /// <exception cref="CaptureFormatException">The data is malformed at a stated place.</exception>
    bool Read(CaptureBlock block);
}
