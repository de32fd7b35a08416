using System.Runtime.InteropServices;
using System.Text;
using System.Text.RegularExpressions;

namespace WaveCheck.Core.Capture.Comtrade;

/// <summary>
/// Where a record's configuration and data are: a .cfg with its .dat beside it, or the sections of a single .cff
/// file (C37.111-2013 clause 9, from memory: <c>--- file type: CFG ---</c>, <c>INF</c>, <c>HDR</c>,
/// <c>DAT ASCII</c> or <c>DAT BINARY: n</c> with n the section's bytes).
/// </summary>
internal sealed partial record ComtradeContainer(
    string CfgPath, IReadOnlyList<string> CfgLines, int CfgFirstLine, string DataPath, long DataOffset,
    long? DataBytes, long DataFirstLine, bool SingleFile)
{
    [GeneratedRegex(@"^---\s*file\s+type\s*:\s*(?<kind>[A-Za-z]+)(?:\s+(?<form>[A-Za-z0-9]+))?\s*(?::?\s*(?<bytes>\d+))?\s*---\s*$",
        RegexOptions.IgnoreCase | RegexOptions.CultureInvariant)]
    private static partial Regex SectionHeader();

    /// <summary>Finds the cfg and data of <paramref name="path"/> (.cfg or .cff).</summary>
    /// <exception cref="CaptureFormatException">No data file beside the cfg; a .cff without its sections.</exception>
    public static ComtradeContainer Locate(string path) =>
        path.EndsWith(".cff", StringComparison.OrdinalIgnoreCase) ? ReadCff(path) : ForCfg(path);

    private static ComtradeContainer ForCfg(string path)
    {
        var length = new FileInfo(path).Length;
        if (length > CaptureLimits.MaxConfigBytes)
        {
            throw new CaptureFormatException(path, string.Create(System.Globalization.CultureInfo.InvariantCulture,
                $"the cfg is {length} bytes: a configuration of at most {CaptureLimits.MaxConfigBytes} bytes (16 MiB) is read"));
        }

        var lines = new List<string>();
        using (var text = new StreamReader(path, Encoding.UTF8))
        {
            var reader = new BoundedLineReader(text, path);
            while (reader.TryRead(out var line))
            {
                lines.Add(line);
            }
        }

        var dir = Path.GetDirectoryName(Path.GetFullPath(path))!;
        var stem = Path.GetFileNameWithoutExtension(path);
        var dataPath = FindBeside(dir, stem) ?? throw new CaptureFormatException(path,
            $"data file not found: expected {Path.Combine(dir, stem + ".dat")} (or .DAT) beside the cfg");
        return new ComtradeContainer(path, lines, 1, dataPath, 0, null, 1, false);
    }

    private static string? FindBeside(string dir, string stem)
    {
        foreach (var candidate in (string[])[stem + ".dat", stem + ".DAT"])
        {
            var full = Path.Combine(dir, candidate);
            if (File.Exists(full))
            {
                return full;
            }
        }

        foreach (var file in Directory.EnumerateFiles(dir, "*", new EnumerationOptions { MatchCasing = MatchCasing.CaseInsensitive }))
        {
            if (Path.GetFileName(file).Equals(stem + ".dat", StringComparison.OrdinalIgnoreCase))
            {
                return file;
            }
        }

        return null;
    }

    private static ComtradeContainer ReadCff(string path)
    {
        using var stream = new BufferedStream(File.OpenRead(path), 1 << 16);
        var line = new List<byte>(256);
        long lineNumber = 0;
        List<string>? cfg = null;
        var cfgFirst = 0;
        long? dataOffset = null;
        long? dataBytes = null;
        long dataFirstLine = 0;
        string? current = null;
        long cfgBytes = 0;
        while (ReadLine(stream, line, path, lineNumber + 1))
        {
            lineNumber++;
            var text = Encoding.UTF8.GetString(CollectionsMarshal.AsSpan(line)).TrimEnd('\r');
            var header = text.StartsWith("---", StringComparison.Ordinal) ? SectionHeader().Match(text) : null;
            if (header is null)
            {
                if (current is null && text.Trim().Length > 0)
                {
                    throw new CaptureFormatException(path,
                        $"not a COMTRADE .cff: expected '--- file type: CFG ---', found '{Shorten(text)}'", lineNumber);
                }

                if (current == "CFG")
                {
                    cfgBytes += line.Count + 1;
                    if (cfgBytes > CaptureLimits.MaxConfigBytes)
                    {
                        throw new CaptureFormatException(path, string.Create(System.Globalization.CultureInfo.InvariantCulture,
                            $"the CFG section is longer than {CaptureLimits.MaxConfigBytes} bytes (16 MiB), the most read"), lineNumber);
                    }

                    cfg!.Add(text);
                }

                continue;
            }

            if (header is { Success: false })
            {
                throw new CaptureFormatException(path,
                    $"section header '{Shorten(text)}' is not '--- file type: CFG|INF|HDR|DAT ASCII|DAT BINARY: n ---'", lineNumber);
            }

            var kind = header.Groups["kind"].Value.ToUpperInvariant();
            var form = header.Groups["form"].Value.ToUpperInvariant();
            switch (kind)
            {
                case "CFG":
                    cfg = [];
                    cfgFirst = (int)lineNumber + 1;
                    current = kind;
                    break;
                case "INF" or "HDR":
                    current = kind; // contents not used
                    break;
                case "DAT" when form == "ASCII":
                    dataOffset = stream.Position;
                    dataFirstLine = lineNumber + 1;
                    current = "DAT";
                    break;
                case "DAT" when form is "BINARY" or "BINARY32" or "FLOAT32":
                    if (!header.Groups["bytes"].Success)
                    {
                        throw new CaptureFormatException(path,
                            $"binary data section header '{Shorten(text)}' does not give its byte count (DAT BINARY: n)", lineNumber);
                    }

                    dataOffset = stream.Position;
                    if (!long.TryParse(header.Groups["bytes"].Value, System.Globalization.NumberStyles.None,
                            System.Globalization.CultureInfo.InvariantCulture, out var sectionBytes))
                    {
                        throw new CaptureFormatException(path,
                            $"binary data section header gives {Shorten(header.Groups["bytes"].Value)} bytes, more than any file holds", lineNumber);
                    }

                    dataBytes = sectionBytes;
                    stream.Seek(Math.Min(sectionBytes, stream.Length - stream.Position), SeekOrigin.Current);
                    current = "DAT";
                    break;
                default:
                    throw new CaptureFormatException(path,
                        $"unknown section type '{(kind + " " + form).Trim()}': expected CFG, INF, HDR, DAT ASCII or DAT BINARY", lineNumber, 1);
            }

            // Once both are found the rest (an ASCII data section, or sections after the data) need not be scanned.
            if (cfg is not null && dataOffset is not null && current != "CFG")
            {
                break;
            }
        }

        if (cfg is null)
        {
            throw new CaptureFormatException(path, "the .cff has no '--- file type: CFG ---' section");
        }

        if (dataOffset is null)
        {
            throw new CaptureFormatException(path, "the .cff has no '--- file type: DAT ... ---' section");
        }

        return new ComtradeContainer(path, cfg, cfgFirst, path, dataOffset.Value, dataBytes, dataFirstLine, true);
    }

    /// <summary>The next line's bytes (without the newline); a line longer than the limit is refused as soon as it
    /// gets there, so an INF or HDR section of one huge line costs no more memory than a short one.</summary>
    private static bool ReadLine(Stream stream, List<byte> line, string path, long lineNumber)
    {
        line.Clear();
        int b;
        while ((b = stream.ReadByte()) >= 0)
        {
            if (b == '\n')
            {
                return true;
            }

            if (line.Count == CaptureLimits.MaxLineLength)
            {
                throw new CaptureFormatException(path,
                    $"the line is longer than {CaptureLimits.MaxLineLength} bytes (1 MiB), the limit for a line of a COMTRADE file", lineNumber);
            }

            line.Add((byte)b);
        }

        return line.Count > 0;
    }

    private static string Shorten(string text) => ShownText.Of(text);
}
