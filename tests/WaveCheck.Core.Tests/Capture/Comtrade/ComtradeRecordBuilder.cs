using System.Buffers.Binary;
using System.Globalization;
using System.Text;
using WaveCheck.Core.Capture.Comtrade;

namespace WaveCheck.Core.Tests.Capture.Comtrade;

/// <summary>One analog channel of a test record: its cfg fields and its waveform, in the cfg's unit on the PS side.</summary>
internal sealed record TestChannel(string Id, string Phase, string Unit, double A, double B, double Min, double Max,
    double Primary, double Secondary, char PS, Func<double, double> ValueAt);

/// <summary>
/// Writes small COMTRADE records for the tests, laid out as C37.111-1999 clause 6 / -2013 clauses 7 to 9 describe
/// them (from memory): cfg lines in order; ASCII data <c>n,timestamp,A1..An,D1..Dm</c>; binary data per sample
/// uint32 n, uint32 timestamp, analog values, 16-bit status words, little-endian; .cff sections.
/// </summary>
internal sealed class ComtradeRecordBuilder
{
    public string Station { get; set; } = "Harbour Clinic Substation";

    public string RevisionField { get; set; } = "2013";

    public ComtradeDataFileType FileType { get; set; } = ComtradeDataFileType.Binary;

    public List<TestChannel> Channels { get; } = [];

    public int DigitalCount { get; set; } = 2;

    /// <summary>(rate Hz, endsamp) lines; an empty list writes nrates = 0 with <see cref="TimestampOnlyEnd"/>.</summary>
    public List<(double RateHz, long EndSample)> Sections { get; } = [];

    public long TimestampOnlyEnd { get; set; }

    /// <summary>Sample rate used for the time stamps when the cfg gives none.</summary>
    public double StampRateHz { get; set; } = 4000;

    public string Start { get; set; } = "01/12/2026,08:15:30.125000";

    public string Trigger { get; set; } = "01/12/2026,08:15:30.225000";

    public double TimeMultiplier { get; set; } = 1;

    /// <summary>The 2013 time code line, or null to leave it out.</summary>
    public string? TimeCodeLine { get; set; } = "+1,+1";

    /// <summary>(channel, 0-based sample) pairs written as missing values.</summary>
    public HashSet<(int Channel, long Sample)> Missing { get; } = [];

    public long TotalSamples => Sections.Count == 0 ? TimestampOnlyEnd : Sections[^1].EndSample;

    /// <summary>Time of a 0-based sample, seconds from the first, over the rate sections.</summary>
    public double TimeOf(long sample)
    {
        if (Sections.Count == 0)
        {
            return sample / StampRateHz;
        }

        double t = 0;
        long previousEnd = 0;
        foreach (var (rate, end) in Sections)
        {
            if (sample < end)
            {
                return t + ((sample - previousEnd) / rate);
            }

            t += (end - previousEnd) / rate;
            previousEnd = end;
        }

        throw new ArgumentOutOfRangeException(nameof(sample));
    }

    public List<string> CfgLines()
    {
        var inv = CultureInfo.InvariantCulture;
        var lines = new List<string>
        {
            RevisionField.Length == 0 ? $"{Station},FDR-3 recorder" : $"{Station},FDR-3 recorder,{RevisionField}",
            $"{Channels.Count + DigitalCount},{Channels.Count}A,{DigitalCount}D",
        };
        for (var c = 0; c < Channels.Count; c++)
        {
            var ch = Channels[c];
            lines.Add(string.Create(inv,
                $"{c + 1},{ch.Id},{ch.Phase},Feeder 3,{ch.Unit},{ch.A:R},{ch.B:R},0,{ch.Min:R},{ch.Max:R},{ch.Primary:R},{ch.Secondary:R},{ch.PS}"));
        }

        for (var d = 0; d < DigitalCount; d++)
        {
            lines.Add($"{d + 1},Status {d + 1},,Feeder 3,0");
        }

        lines.Add("50");
        if (Sections.Count == 0)
        {
            lines.Add("0");
            lines.Add($"0,{TimestampOnlyEnd}");
        }
        else
        {
            lines.Add(Sections.Count.ToString(inv));
            lines.AddRange(Sections.Select(s => string.Create(inv, $"{s.RateHz:R},{s.EndSample}")));
        }

        lines.Add(Start);
        lines.Add(Trigger);
        lines.Add(FileType.ToString().ToUpperInvariant());
        lines.Add(TimeMultiplier.ToString("R", inv));
        if (TimeCodeLine is not null)
        {
            lines.Add(TimeCodeLine);
            lines.Add("0,0");
        }

        return lines;
    }

    /// <summary>The stored value x of a channel at a sample: (v − b) / a, rounded for the integer forms.</summary>
    public double Stored(int channel, long sample)
    {
        var ch = Channels[channel];
        var x = (ch.ValueAt(TimeOf(sample)) - ch.B) / ch.A;
        return FileType == ComtradeDataFileType.Float32 ? (float)x : Math.Round(x);
    }

    /// <summary>Time stamp in file units: microseconds / timemult.</summary>
    public long Stamp(long sample) => (long)Math.Round(TimeOf(sample) * 1e6 / TimeMultiplier);

    public byte[] Data()
    {
        if (FileType == ComtradeDataFileType.Ascii)
        {
            var text = new StringBuilder();
            for (long i = 0; i < TotalSamples; i++)
            {
                text.Append(CultureInfo.InvariantCulture, $"{i + 1},{Stamp(i)}");
                for (var c = 0; c < Channels.Count; c++)
                {
                    text.Append(',');
                    if (!Missing.Contains((c, i)))
                    {
                        text.Append(Stored(c, i).ToString("R", CultureInfo.InvariantCulture));
                    }
                }

                for (var d = 0; d < DigitalCount; d++)
                {
                    text.Append(",0");
                }

                text.Append("\r\n");
            }

            return Encoding.ASCII.GetBytes(text.ToString());
        }

        var valueBytes = FileType == ComtradeDataFileType.Binary ? 2 : 4;
        var frame = 8 + (Channels.Count * valueBytes) + (2 * ((DigitalCount + 15) / 16));
        var bytes = new byte[frame * TotalSamples];
        for (long i = 0; i < TotalSamples; i++)
        {
            var f = bytes.AsSpan((int)(i * frame), frame);
            BinaryPrimitives.WriteUInt32LittleEndian(f, (uint)(i + 1));
            BinaryPrimitives.WriteUInt32LittleEndian(f[4..], (uint)Stamp(i));
            for (var c = 0; c < Channels.Count; c++)
            {
                var at = f[(8 + (c * valueBytes))..];
                var missing = Missing.Contains((c, i));
                switch (FileType)
                {
                    case ComtradeDataFileType.Binary:
                        BinaryPrimitives.WriteInt16LittleEndian(at, missing ? short.MinValue : checked((short)Stored(c, i)));
                        break;
                    case ComtradeDataFileType.Binary32:
                        BinaryPrimitives.WriteInt32LittleEndian(at, missing ? int.MinValue : checked((int)Stored(c, i)));
                        break;
                    default:
                        BinaryPrimitives.WriteSingleLittleEndian(at, missing ? float.NaN : (float)Stored(c, i));
                        break;
                }
            }
        }

        return bytes;
    }

    /// <summary>Writes name.cfg and name.dat (or name.cff) in <paramref name="dir"/>; returns the path to open.</summary>
    public string Write(string dir, string name, bool singleFile = false)
    {
        var cfg = string.Join("\r\n", CfgLines()) + "\r\n";
        var data = Data();
        if (!singleFile)
        {
            File.WriteAllText(Path.Combine(dir, name + ".cfg"), cfg, Encoding.ASCII);
            File.WriteAllBytes(Path.Combine(dir, name + ".dat"), data);
            return Path.Combine(dir, name + ".cfg");
        }

        using var stream = new MemoryStream();
        var dat = FileType == ComtradeDataFileType.Ascii ? "--- file type: DAT ASCII ---" : $"--- file type: DAT BINARY: {data.Length} ---";
        stream.Write(Encoding.ASCII.GetBytes(
            "--- file type: CFG ---\r\n" + cfg + "--- file type: INF ---\r\n[Harbour Clinic]\r\nnote=test\r\n"
            + "--- file type: HDR ---\r\nFeeder 3 earth-fault record\r\n" + dat + "\r\n"));
        stream.Write(data);
        File.WriteAllBytes(Path.Combine(dir, name + ".cff"), stream.ToArray());
        return Path.Combine(dir, name + ".cff");
    }
}

/// <summary>A temporary directory removed after the test.</summary>
internal sealed class TempDir : IDisposable
{
    public TempDir()
    {
        Path = System.IO.Path.Combine(System.IO.Path.GetTempPath(), "wavecheck-comtrade-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(Path);
    }

    public string Path { get; }

    public void Dispose() => Directory.Delete(Path, recursive: true);
}
