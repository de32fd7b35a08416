using System.Buffers.Binary;
using System.Globalization;
using System.Text;

namespace WaveCheck.Cli.Tests;

/// <summary>
/// Builds small valid captures byte by byte (no stored blobs), with every header field open to change, for the
/// bad-input corpus and the mutation test: a 50 Hz sine of 10 mA peak, 4 kS/s, 0.5 s (two 200 ms windows).
/// </summary>
internal static class InputFiles
{
    public const int RateHz = 4000;
    public const int Samples = 2000;

    /// <summary>Sample n of the test signal as a fraction of full scale (full scale 20 mA: 10 mA peak is 0.5).</summary>
    public static double Fraction(int n) => 0.5 * Math.Sin(2 * Math.PI * 50 * n / RateHz);

    /// <summary>Writes <paramref name="bytes"/> to <paramref name="folder"/>/<paramref name="name"/>; returns the path.</summary>
    public static string Write(string folder, string name, byte[] bytes)
    {
        var path = Path.Combine(folder, name);
        File.WriteAllBytes(path, bytes);
        return path;
    }

    /// <summary>Writes text as UTF-8 without a byte-order mark; returns the path.</summary>
    public static string Write(string folder, string name, string text) =>
        Write(folder, name, new UTF8Encoding(false).GetBytes(text));

    /// <summary>A WAV file; change <see cref="WavSpec"/> fields before <see cref="WavSpec.Build"/> to break one.</summary>
    public static byte[] Wav(Action<WavSpec>? change = null)
    {
        var spec = new WavSpec();
        change?.Invoke(spec);
        return spec.Build();
    }

    /// <summary>The CSV text: <c>time [s],I [mA]</c> and one row per sample.</summary>
    public static string Csv(Func<int, string?>? row = null, string header = "time [s],I [mA]", int samples = Samples)
    {
        var text = new StringBuilder(header).Append('\n');
        for (var n = 0; n < samples; n++)
        {
            text.Append(row?.Invoke(n) ?? CsvRow(n)).Append('\n');
        }

        return text.ToString();
    }

    /// <summary>Row n of the CSV: time in seconds, current in mA.</summary>
    public static string CsvRow(int n) =>
        string.Create(CultureInfo.InvariantCulture, $"{n / (double)RateHz:R},{20 * Fraction(n):R}");

    /// <summary>The cfg lines of a COMTRADE record (2013): two analog channels IN and IL1 in amperes, a = 0.00002 A per
    /// count, 4 kHz, <see cref="Samples"/> samples. Line i of the file is element i − 1.</summary>
    public static List<string> CfgLines(string fileType = "ASCII") =>
    [
        "Invented Car Park,REC-9,2013",
        "2,2A,0D",
        "1,IN,N,Bay 3,A,0.00002,0,0,-32767,32767,1,1,S",
        "2,IL1,A,Bay 3,A,0.00002,0,0,-32767,32767,1,1,S",
        "50",
        "1",
        string.Create(CultureInfo.InvariantCulture, $"{RateHz},{Samples}"),
        "01/12/2026,08:15:30.125000",
        "01/12/2026,08:15:30.225000",
        fileType,
        "1",
        "+1,+1",
        "0,0",
    ];

    /// <summary>The cfg text from its lines.</summary>
    public static string Cfg(IEnumerable<string> lines) => string.Join("\r\n", lines) + "\r\n";

    /// <summary>Stored value (counts) of sample n: 10 mA peak at 20 µA per count.</summary>
    public static int Counts(int n) => (int)Math.Round(Fraction(n) * 1000);

    /// <summary>ASCII data lines; <paramref name="value"/> may replace channel 1's value of a sample.</summary>
    public static string DatAscii(Func<int, string?>? value = null, int samples = Samples)
    {
        var text = new StringBuilder();
        for (var n = 0; n < samples; n++)
        {
            var c = Counts(n);
            text.Append(CultureInfo.InvariantCulture, $"{n + 1},{n * 250},{value?.Invoke(n) ?? c.ToString(CultureInfo.InvariantCulture)},{c}\r\n");
        }

        return text.ToString();
    }

    /// <summary>Binary data (BINARY: int16, BINARY32: int32, FLOAT32: float); <paramref name="value"/> may replace
    /// channel 1's value of a sample (FLOAT32 only).</summary>
    public static byte[] DatBinary(string fileType, Func<int, float?>? value = null, int samples = Samples)
    {
        var valueBytes = fileType == "BINARY" ? 2 : 4;
        var frame = 8 + (2 * valueBytes);
        var bytes = new byte[samples * frame];
        for (var n = 0; n < samples; n++)
        {
            var at = bytes.AsSpan(n * frame, frame);
            BinaryPrimitives.WriteUInt32LittleEndian(at, (uint)(n + 1));
            BinaryPrimitives.WriteUInt32LittleEndian(at[4..], (uint)(n * 250));
            for (var c = 0; c < 2; c++)
            {
                var v = at.Slice(8 + (c * valueBytes), valueBytes);
                switch (fileType)
                {
                    case "BINARY": BinaryPrimitives.WriteInt16LittleEndian(v, (short)Counts(n)); break;
                    case "BINARY32": BinaryPrimitives.WriteInt32LittleEndian(v, Counts(n)); break;
                    default: BinaryPrimitives.WriteSingleLittleEndian(v, c == 0 && value?.Invoke(n) is { } f ? f : Counts(n)); break;
                }
            }
        }

        return bytes;
    }

    /// <summary>A site file naming one capture, with <paramref name="entry"/> added to the capture's entry.</summary>
    public static string Site(string capture = "c1.wav", string entry = "\"rated\": \"30mA\", \"device\": \"A\"") =>
        "{\n  \"site\": \"Invented Workshop\",\n  \"defaults\": { \"sensor\": \"dc\" },\n" +
        $"  \"captures\": [\n    {{ \"file\": \"{capture}\", \"circuit\": \"C1 saw\", {entry} }}\n  ]\n}}\n";

    /// <summary>1-based <c>line:column</c> of the first <paramref name="token"/> in <paramref name="text"/> (columns in characters).</summary>
    public static string PlaceOf(string text, string token)
    {
        var at = text.IndexOf(token, StringComparison.Ordinal);
        Assert.True(at >= 0, $"'{token}' not in the text");
        var line = 1 + text.AsSpan(0, at).Count('\n');
        var column = at - (text.LastIndexOf('\n', Math.Max(0, at - 1)) + 1) + 1;
        return string.Create(CultureInfo.InvariantCulture, $"{line}:{column}");
    }
}

/// <summary>Every field of a WAV file, settable; the defaults make a valid mono IEEE float file with our calibration
/// chunk. The fmt chunk comes first, so its fields lie at fixed offsets (<see cref="TagOffset"/> and on).</summary>
internal sealed class WavSpec
{
    public const int TagOffset = 20;
    public const int ChannelsOffset = 22;
    public const int RateOffset = 24;
    public const int ByteRateOffset = 28;
    public const int BlockAlignOffset = 32;
    public const int BitsOffset = 34;

    public string RiffId { get; set; } = "RIFF";
    public uint? RiffSize { get; set; }
    public string WaveId { get; set; } = "WAVE";
    public int FmtSize { get; set; } = 16;
    public ushort Tag { get; set; } = 3;
    public ushort Channels { get; set; } = 1;
    public uint Rate { get; set; } = InputFiles.RateHz;
    public uint? ByteRate { get; set; }
    public ushort? BlockAlign { get; set; }
    public ushort Bits { get; set; } = 32;
    public byte[] FmtExtra { get; set; } = [];
    public byte[]? Calibration { get; set; } = "fullScaleA=0.02;sensor=dc"u8.ToArray();
    public uint? CalibrationSize { get; set; }
    public int SampleCount { get; set; } = InputFiles.Samples;
    public Func<int, double>? Sample { get; set; }
    public uint? DataSize { get; set; }
    public int DataBytesPresent { get; set; } = -1;
    public byte[] After { get; set; } = [];

    /// <summary>Offset of the calibration chunk's header.</summary>
    public int CalibrationOffset => 12 + 8 + FmtSize;

    /// <summary>Offset of the data chunk's header.</summary>
    public int DataOffset => CalibrationOffset + (Calibration is null ? 0 : 8 + Calibration.Length + (Calibration.Length & 1));

    /// <summary>Offset of the first byte of sample <paramref name="n"/>.</summary>
    public int SampleOffset(int n) => DataOffset + 8 + (n * Channels * (Bits / 8));

    public byte[] Build()
    {
        var align = BlockAlign ?? (ushort)(Channels * (Bits / 8));
        var body = new MemoryStream();
        var w = new BinaryWriter(body);
        w.Write(Encoding.ASCII.GetBytes("fmt "));
        w.Write(FmtSize);
        var fmt = new byte[Math.Max(FmtSize, 16)];
        BinaryPrimitives.WriteUInt16LittleEndian(fmt, Tag);
        BinaryPrimitives.WriteUInt16LittleEndian(fmt.AsSpan(2), Channels);
        BinaryPrimitives.WriteUInt32LittleEndian(fmt.AsSpan(4), Rate);
        BinaryPrimitives.WriteUInt32LittleEndian(fmt.AsSpan(8), ByteRate ?? (uint)(Rate * align));
        BinaryPrimitives.WriteUInt16LittleEndian(fmt.AsSpan(12), align);
        BinaryPrimitives.WriteUInt16LittleEndian(fmt.AsSpan(14), Bits);
        FmtExtra.AsSpan(0, Math.Min(FmtExtra.Length, Math.Max(0, FmtSize - 16))).CopyTo(fmt.AsSpan(16));
        w.Write(fmt, 0, FmtSize);
        if (Calibration is { } payload)
        {
            w.Write(Encoding.ASCII.GetBytes("wvck"));
            w.Write(CalibrationSize ?? (uint)payload.Length);
            w.Write(payload);
            if ((payload.Length & 1) == 1)
            {
                w.Write((byte)0);
            }
        }

        var data = new MemoryStream();
        var d = new BinaryWriter(data);
        for (var n = 0; n < SampleCount; n++)
        {
            for (var c = 0; c < Channels; c++)
            {
                var x = Sample?.Invoke(n) ?? InputFiles.Fraction(n);
                switch (Tag, Bits)
                {
                    case (1, 16): d.Write((short)Math.Round(x * 32767)); break;
                    case (3, 64): d.Write(x); break;
                    case (_, 32) when Tag != 1: d.Write((float)x); break;
                    default: d.Write(new byte[Bits / 8]); break;
                }
            }
        }

        var samples = data.ToArray();
        var present = DataBytesPresent < 0 ? samples.Length : Math.Min(DataBytesPresent, samples.Length);
        w.Write(Encoding.ASCII.GetBytes("data"));
        w.Write(DataSize ?? (uint)samples.Length);
        w.Write(samples, 0, present);
        w.Write(After);
        w.Flush();

        var bytes = new byte[12 + body.Length];
        Encoding.ASCII.GetBytes(RiffId).AsSpan(0, 4).CopyTo(bytes);
        BinaryPrimitives.WriteUInt32LittleEndian(bytes.AsSpan(4), RiffSize ?? (uint)(bytes.Length - 8));
        Encoding.ASCII.GetBytes(WaveId).AsSpan(0, 4).CopyTo(bytes.AsSpan(8));
        body.ToArray().CopyTo(bytes, 12);
        return bytes;
    }
}
