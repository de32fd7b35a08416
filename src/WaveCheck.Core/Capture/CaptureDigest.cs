using System.Security.Cryptography;
using WaveCheck.Core.Capture.Comtrade;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Capture;

/// <summary>
/// The SHA-256 of a capture's bytes, read in blocks (memory does not grow with the file), so that a filed report can
/// be matched to the capture it was made from. A COMTRADE .cfg is hashed together with its .dat (cfg bytes first, then
/// data bytes): either changed changes the digest.
/// </summary>
public static class CaptureDigest
{
    /// <summary>Hex digits shown in a report: 12 (48 bits; engineering choice: short enough to copy by hand, long
    /// enough that two different captures of one firm's archive practically never share it).</summary>
    public const int ShortLength = 12;

    private const int BlockBytes = 1 << 16;

    /// <summary>The SHA-256 of <paramref name="files"/> read one after the other, as 64 lower-case hex digits.</summary>
    /// <param name="files">Files to hash, in order.</param>
    /// <param name="cancellationToken">Checked between blocks.</param>
    /// <exception cref="IOException">A file cannot be read.</exception>
    public static string Sha256(IReadOnlyList<string> files, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(files);
        using var hash = IncrementalHash.CreateHash(HashAlgorithmName.SHA256);
        var buffer = new byte[BlockBytes];
        foreach (var file in files)
        {
            using var stream = new FileStream(file, FileMode.Open, FileAccess.Read, FileShare.Read, 1, FileOptions.SequentialScan);
            int read;
            while ((read = stream.Read(buffer, 0, buffer.Length)) > 0)
            {
                cancellationToken.ThrowIfCancellationRequested();
                hash.AppendData(buffer, 0, read);
            }
        }

        return Convert.ToHexStringLower(hash.GetHashAndReset());
    }

    /// <summary>The files that make the capture at <paramref name="path"/>: a COMTRADE .cfg and its .dat, else the
    /// file itself.</summary>
    /// <exception cref="CaptureFormatException">A .cfg without its data file.</exception>
    public static IReadOnlyList<string> FilesOf(string path)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        return path.EndsWith(".cfg", StringComparison.OrdinalIgnoreCase)
            ? [path, ComtradeContainer.Locate(path).DataPath]
            : [path];
    }

    /// <summary>An identity's digest fields for the capture at <paramref name="path"/> (see <see cref="FilesOf"/>).</summary>
    /// <param name="identity">The identity to complete.</param>
    /// <param name="path">The capture as the user named it.</param>
    /// <param name="cancellationToken">Checked between blocks.</param>
    public static ReportIdentity WithDigest(ReportIdentity identity, string path, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(identity);
        var files = FilesOf(path);
        var full = Sha256(files, cancellationToken);
        return identity with
        {
            CaptureSha256 = full,
            CaptureDigest = full[..ShortLength],
            DigestFiles = [.. files.Select(System.IO.Path.GetFileName).OfType<string>()],
        };
    }
}
