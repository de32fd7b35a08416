using System.Globalization;
using System.Text;

namespace WaveCheck.Cli.Tests;

/// <summary>One input of the corpus: what it writes, the command run on it, the exit code expected and the places
/// (file, line:column, byte, sample, option) the one-line message must name.</summary>
/// <param name="Name">Unique name, shown as the test case.</param>
/// <param name="Exit">Expected exit code (0 where a change is harmless and must stay so).</param>
/// <param name="Make">Writes the files into the given folder; returns the arguments and the places.</param>
public sealed record BadInputCase(string Name, int Exit, Func<string, (string[] Args, string[] Places)> Make)
{
    public override string ToString() => Name;
}

/// <summary>
/// The bad-input corpus, generated here (no stored files): each header field of each format changed to a value that
/// is malformed or out of bounds (docs/formats.md), the bounds of sample rates, channel and sample counts, line
/// lengths and scale factors, non-finite samples, and the site file's fields. The written files are small; the few
/// large ones (a 10 MB cell) are made only when their case runs.
/// </summary>
internal static class BadInputCorpus
{
    private const int Bad = 2;
    private const int Ok = 0;

    public static IEnumerable<BadInputCase> All() =>
        [.. Wav(), .. Csv(), .. Comtrade(), .. Site(), .. Options()];

    private static string[] Analyze(string path, params string[] extra) => ["analyze", path, "-q", .. extra];

    private static BadInputCase WavCase(string name, int exit, Action<WavSpec> change, Func<WavSpec, string[]> places,
        params string[] extra) =>
        new(name, exit, folder =>
        {
            var spec = new WavSpec();
            change(spec);
            var file = name + ".wav";
            var path = InputFiles.Write(folder, file, spec.Build());
            return (Analyze(path, extra), [.. extra.Length == 0 ? [file] : Array.Empty<string>(), .. places(spec)]);
        });

    private static string Byte(long offset) => string.Create(CultureInfo.InvariantCulture, $"byte {offset}");

    private static IEnumerable<BadInputCase> Wav()
    {
        // RIFF header (Microsoft RIFF/WAVE; the fmt fields in the order of WAVEFORMATEX).
        yield return WavCase("wav-riff-id", Bad, s => s.RiffId = "RIFX", _ => [Byte(0)]);
        yield return WavCase("wav-wave-id", Bad, s => s.WaveId = "WAVX", _ => [Byte(8)]);
        yield return WavCase("wav-riff-size-zero", Bad, s => s.RiffSize = 0, _ => [Byte(4), "RIFF size 0"]);
        yield return WavCase("wav-riff-size-short", Bad, s => s.RiffSize = 40, _ => [Byte(4), "before the 'data' chunk"]);
        yield return WavCase("wav-riff-size-huge", Ok, s => s.RiffSize = uint.MaxValue, _ => []);

        // fmt chunk, field by field.
        yield return WavCase("wav-fmt-size-small", Bad, s => s.FmtSize = 14, s => [Byte(16), "at least 16"]);
        yield return WavCase("wav-fmt-tag", Bad, s => s.Tag = 2, _ => [Byte(WavSpec.TagOffset), "encoding tag 2"]);
        yield return WavCase("wav-channels-zero", Bad, s => s.Channels = 0, _ => [Byte(WavSpec.ChannelsOffset), "channel count 0"]);
        yield return WavCase("wav-channels-300", Bad, s => s.Channels = 300, _ => [Byte(WavSpec.ChannelsOffset), "channel count 300"]);
        // Two channels and nothing says which is the residual current: refused, naming both ways out (issue 14).
        yield return WavCase("wav-channels-2", Bad, s => s.Channels = 2, _ => ["2 channels could carry the residual current (ch1, ch2)", "--sum ch1,ch2", "--channel ch1"]);
        yield return WavCase("wav-rate-zero", Bad, s => s.Rate = 0, _ => [Byte(WavSpec.RateOffset), "outside 1 Hz to 10 MHz"]);
        yield return WavCase("wav-rate-int-max", Bad, s => s.Rate = int.MaxValue, _ => [Byte(WavSpec.RateOffset), "outside 1 Hz to 10 MHz"]);
        yield return WavCase("wav-rate-20MHz", Bad, s => s.Rate = 20_000_000, _ => [Byte(WavSpec.RateOffset)]);
        yield return WavCase("wav-rate-1", Bad, s => s.Rate = 1, _ => ["sample rate 1 Hz is too low to analyse"]);
        yield return WavCase("wav-byte-rate", Bad, s => s.ByteRate = 5, _ => [Byte(WavSpec.ByteRateOffset), "byte rate 5"]);
        yield return WavCase("wav-block-align", Bad, s => s.BlockAlign = 3, _ => [Byte(WavSpec.BlockAlignOffset), "block align 3"]);
        yield return WavCase("wav-bits-12", Bad, s => s.Bits = 12, _ => [Byte(WavSpec.BitsOffset), "12 bits"]);
        yield return WavCase("wav-bits-zero", Bad, s => s.Bits = 0, _ => [Byte(WavSpec.BitsOffset)]);
        yield return WavCase("wav-extensible-short", Bad, s => s.Tag = 0xFFFE, _ => [Byte(16), "at least 40"]);
        yield return WavCase("wav-extensible-guid", Bad, s =>
        {
            s.Tag = 0xFFFE;
            s.FmtSize = 40;
            s.FmtExtra = [22, 0, 32, 0, 4, 0, 0, 0, .. new byte[16]];
        }, _ => [Byte(20 + 24), "sub-format"]);
        yield return WavCase("wav-extensible-cbsize", Bad, s =>
        {
            s.Tag = 0xFFFE;
            s.FmtSize = 40;
            s.FmtExtra = [2, 0, 32, 0, 4, 0, 0, 0, .. new Guid("00000003-0000-0010-8000-00aa00389b71").ToByteArray()];
        }, _ => [Byte(20 + 16), "extension size 2"]);
        yield return WavCase("wav-extensible-valid-bits", Bad, s =>
        {
            s.Tag = 0xFFFE;
            s.FmtSize = 40;
            s.FmtExtra = [22, 0, 48, 0, 4, 0, 0, 0, .. new Guid("00000003-0000-0010-8000-00aa00389b71").ToByteArray()];
        }, _ => [Byte(20 + 18), "48 valid bits"]);
        yield return WavCase("wav-extensible-float", Ok, s =>
        {
            s.Tag = 0xFFFE;
            s.FmtSize = 40;
            s.FmtExtra = [22, 0, 32, 0, 4, 0, 0, 0, .. new Guid("00000003-0000-0010-8000-00aa00389b71").ToByteArray()];
        }, _ => []);
        yield return WavCase("wav-second-fmt", Bad, s => s.After = [.. "fmt "u8, 16, 0, 0, 0, .. new byte[16]],
            s => [Byte(s.DataOffset + 8 + (InputFiles.Samples * 4)), "second 'fmt '"]);

        // Our calibration chunk, every field.
        yield return WavCase("wav-cal-size-zero", Bad, s => s.CalibrationSize = 0, s => [Byte(s.CalibrationOffset + 4), "calibration chunk"]);
        yield return WavCase("wav-cal-size-huge", Bad, s => s.CalibrationSize = 5000, s => [Byte(s.CalibrationOffset + 4), "claims 5000 bytes"]);
        yield return WavCase("wav-cal-truncated", Bad, s =>
        {
            s.CalibrationSize = 200_000;
            s.SampleCount = 10;
        }, s => [Byte(s.CalibrationOffset + 4), "'wvck' chunk claims 200000 bytes"]);
        yield return WavCase("wav-cal-sensor-99", Bad, s => s.Calibration = "fullScaleA=0.02;sensor=99"u8.ToArray(), s => [Byte(s.CalibrationOffset), "sensor '99'"]);
        yield return WavCase("wav-cal-sensor-minus-1", Bad, s => s.Calibration = "fullScaleA=0.02;sensor=-1"u8.ToArray(), s => [Byte(s.CalibrationOffset), "sensor '-1'"]);
        yield return WavCase("wav-cal-scale-1e300", Bad, s => s.Calibration = "fullScaleA=1e300;sensor=dc"u8.ToArray(), s => [Byte(s.CalibrationOffset), "fullScaleA 1e300"]);
        yield return WavCase("wav-cal-scale-zero", Bad, s => s.Calibration = "fullScaleA=0;sensor=dc"u8.ToArray(), s => [Byte(s.CalibrationOffset), "fullScaleA 0"]);
        yield return WavCase("wav-cal-scale-negative", Bad, s => s.Calibration = "fullScaleA=-0.02;sensor=dc"u8.ToArray(), s => [Byte(s.CalibrationOffset), "fullScaleA -0.02"]);
        yield return WavCase("wav-cal-scale-text", Bad, s => s.Calibration = "fullScaleA=abc;sensor=dc"u8.ToArray(), s => [Byte(s.CalibrationOffset), "'abc' is not a number"]);
        yield return WavCase("wav-cal-scale-nan", Bad, s => s.Calibration = "fullScaleA=NaN;sensor=dc"u8.ToArray(), s => [Byte(s.CalibrationOffset), "fullScaleA NaN"]);
        yield return WavCase("wav-cal-no-scale", Bad, s => s.Calibration = "sensor=dc"u8.ToArray(), s => [Byte(s.CalibrationOffset), "no fullScaleA"]);
        yield return WavCase("wav-cal-twice", Bad, s => s.Calibration = "fullScaleA=0.02;fullScaleA=0.03"u8.ToArray(), s => [Byte(s.CalibrationOffset), "twice"]);
        yield return WavCase("wav-cal-not-pair", Bad, s => s.Calibration = "fullScaleA=0.02;dc"u8.ToArray(), s => [Byte(s.CalibrationOffset), "not key=value"]);
        yield return WavCase("wav-cal-not-utf8", Bad, s => s.Calibration = [.. "fullScaleA=0.02;sensor=\xff"u8.ToArray()[..24], 0xFF], s => [Byte(s.CalibrationOffset), "not UTF-8"]);
        yield return WavCase("wav-cal-unknown-key", Ok, s => s.Calibration = "fullScaleA=0.02;sensor=dc;later=1"u8.ToArray(), _ => []);
        yield return WavCase("wav-cal-missing", Bad, s => s.Calibration = null, _ => ["give --scale"]);
        yield return WavCase("wav-cal-missing-scale-1e300", Bad, s => s.Calibration = null, _ => ["--scale"], "--scale", "1e300A");

        // data chunk.
        yield return WavCase("wav-data-empty", Bad, s => s.SampleCount = 0, s => [Byte(s.DataOffset), "no samples"]);
        yield return WavCase("wav-data-3-bytes", Bad, s =>
        {
            s.SampleCount = 1;
            s.DataSize = 3;
            s.DataBytesPresent = 3;
        }, s => [Byte(s.DataOffset), "holds 3 bytes"]);
        yield return WavCase("wav-data-truncated", Ok, s => s.DataBytesPresent = 4 * 1900, _ => []);
        yield return WavCase("wav-data-second", Bad, s => s.After = [.. "data"u8, 4, 0, 0, 0, 0, 0, 0, 0],
            s => [Byte(s.DataOffset + 8 + (InputFiles.Samples * 4)), "second 'data' chunk"]);
        yield return WavCase("wav-too-short", Bad, s => s.SampleCount = 100, _ => ["100 samples", "one window needs 800 samples"]);
        yield return WavCase("wav-sample-nan", Bad, s => s.Sample = n => n == 10 ? double.NaN : InputFiles.Fraction(n),
            s => [Byte(s.SampleOffset(10)), "sample 10", "t = 0.0025 s", "NaN"]);
        yield return WavCase("wav-sample-plus-inf", Bad, s => s.Sample = n => n == 1500 ? double.PositiveInfinity : InputFiles.Fraction(n),
            s => [Byte(s.SampleOffset(1500)), "sample 1500", "+infinity"]);
        yield return WavCase("wav-sample-minus-inf-64", Bad, s =>
        {
            s.Bits = 64;
            s.Sample = n => n == 7 ? double.NegativeInfinity : InputFiles.Fraction(n);
        }, s => [Byte(s.SampleOffset(7)), "sample 7", "-infinity"]);
        yield return WavCase("wav-sample-huge", Bad, s => s.Sample = n => n == 3 ? 1e30 : InputFiles.Fraction(n),
            s => [Byte(s.SampleOffset(3)), "sample 3", "beyond"]);
        yield return WavCase("wav-chunk-beyond-end", Bad, s => s.After = [.. "LIST"u8, 0xFF, 0xFF, 0, 0, 1, 2],
            s => [Byte(s.DataOffset + 8 + (InputFiles.Samples * 4) + 4), "'LIST' chunk claims"]);
        yield return WavCase("wav-trailing-garbage", Ok, s => s.After = [0, 1, 2, 3, 4, 5, 6, 7, 8, 9], _ => []);
        yield return WavCase("wav-pcm16", Ok, s =>
        {
            s.Tag = 1;
            s.Bits = 16;
        }, _ => []);
    }

    private static BadInputCase CsvCase(string name, int exit, Func<string> text, Func<string, string[]> places,
        params string[] extra) =>
        new(name, exit, folder =>
        {
            var file = name + ".csv";
            var content = text();
            var path = InputFiles.Write(folder, file, content);
            return (Analyze(path, extra), [.. extra.Length == 0 ? [file] : Array.Empty<string>(), .. places(content)]);
        });

    private static string At(string file, string place) => $"{file}:{place}";

    private static IEnumerable<BadInputCase> Csv()
    {
        static string Rows(int from, int to) =>
            string.Concat(Enumerable.Range(from, to - from).Select(n => InputFiles.CsvRow(n) + "\n"));
        var header = "time [s],I [mA]\n";

        yield return CsvCase("csv-empty", Bad, () => "", _ => ["empty file"]);
        yield return CsvCase("csv-header-only", Bad, () => header, _ => ["csv-header-only.csv:2:1", "no data rows"]);
        yield return CsvCase("csv-one-row", Bad, () => header + Rows(0, 1), _ => ["csv-one-row.csv:2:1", "only one data row"]);
        yield return CsvCase("csv-one-row-rate", Bad, () => "I [mA]\n5\n", _ => ["1 sample", "one window needs"], "--rate", "10kHz");
        yield return CsvCase("csv-450-comments", Ok, () => string.Concat(Enumerable.Repeat("# logger note\n", 450)) + InputFiles.Csv(), _ => []);
        yield return CsvCase("csv-450-comments-only", Bad, () => string.Concat(Enumerable.Repeat("# logger note\n", 450)),
            _ => ["csv-450-comments-only.csv:450:1", "450 comment or blank lines"]);
        yield return CsvCase("csv-header-unit", Bad, () => "time [s],I [furlong]\n" + Rows(0, 10), _ => ["csv-header-unit.csv:1:2", "unknown unit 'furlong'"]);
        yield return CsvCase("csv-header-time-unit", Bad, () => "time [xs],I [mA]\n" + Rows(0, 10), _ => ["csv-header-time-unit.csv:1:1", "unknown unit 'xs'"]);
        yield return CsvCase("csv-header-no-unit", Bad, () => "time [s],I\n" + Rows(0, 10), _ => ["csv-header-no-unit.csv:1:1", "no current or voltage column"]);
        yield return CsvCase("csv-header-2000-columns", Bad,
            () => "time [s]," + string.Join(',', Enumerable.Range(0, 2000).Select(i => $"I{i} [mA]")) + "\n0," + string.Join(',', Enumerable.Repeat("1", 2000)) + "\n",
            _ => ["csv-header-2000-columns.csv:1:1", "2001 columns"]);
        yield return CsvCase("csv-header-300-channels", Bad,
            () => "time [s]," + string.Join(',', Enumerable.Range(0, 300).Select(i => $"I{i} [mA]")) + "\n" +
                  string.Concat(Enumerable.Range(0, 3).Select(n => $"{n * 0.001}," + string.Join(',', Enumerable.Repeat("1", 300)) + "\n")),
            _ => ["csv-header-300-channels.csv:1:258", "300 current and voltage columns"]);
        yield return CsvCase("csv-time-decreasing", Bad, () => header + "0,1\n-0.001,2\n-0.002,3\n", _ => ["csv-time-decreasing.csv:2:1", "does not increase"]);
        yield return CsvCase("csv-time-step-1e-12", Bad, () => header + string.Concat(Enumerable.Range(0, 50).Select(n => $"{n}e-12,1\n")),
            _ => ["csv-time-step-1e-12.csv:2:1", "median step is 1E-12 s", "outside 1 Hz to 10 MHz"]);
        yield return CsvCase("csv-time-step-1e6", Bad, () => header + string.Concat(Enumerable.Range(0, 50).Select(n => $"{n}e6,1\n")),
            _ => ["csv-time-step-1e6.csv:2:1", "median step is 1E+06 s"]);
        // The look-ahead reads its time cells as the reader reads every later row: the same words for one fault.
        yield return CsvCase("csv-time-text", Bad, () => header + Rows(0, 5) + "x,1\n" + Rows(6, 10), _ => ["csv-time-text.csv:7:1", "'x' is not a number"]);
        yield return CsvCase("csv-time-text-late", Bad, () => header + Rows(0, 1000) + "x,1\n" + Rows(1001, 1100), _ => ["csv-time-text-late.csv:1002:1", "'x' is not a number"]);
        yield return CsvCase("csv-short-row", Bad, () => "time [s],I1 [mA],U [mV]\n0,1,2\n0.001,2\n", _ => ["csv-short-row.csv:3:3", "row has 2 fields"]);
        yield return CsvCase("csv-cell-text", Bad, () => InputFiles.Csv(n => n == 1200 ? "0.3,abc" : null), _ => ["csv-cell-text.csv:1202:2", "'abc' is not a number"]);
        yield return CsvCase("csv-cell-nan", Bad, () => InputFiles.Csv(n => n == 3 ? $"{3 / 4000.0:R},nan" : null), _ => ["csv-cell-nan.csv:5:2", "not a finite number"]);
        yield return CsvCase("csv-cell-infinity", Bad, () => InputFiles.Csv(n => n == 1500 ? "0.375,Infinity" : null), _ => ["csv-cell-infinity.csv:1502:2", "not a finite number"]);
        yield return CsvCase("csv-cell-1e309", Bad, () => InputFiles.Csv(n => n == 1500 ? "0.375,1e309" : null), _ => ["csv-cell-1e309.csv:1502:2", "not a finite number"]);
        yield return CsvCase("csv-cell-kA-1e308", Bad, () => "time [s],I [kA]\n" + Rows(0, 1500) + "0.375,1e308\n", _ => ["csv-cell-kA-1e308.csv:1502:2", "+infinity"]);
        yield return CsvCase("csv-cell-1e15-A", Bad, () => "time [s],I [A]\n" + Rows(0, 1500) + "0.375,1e15\n", _ => ["csv-cell-1e15-A.csv:1502:2", "beyond"]);
        yield return CsvCase("csv-quote-unbalanced-early", Bad, () => header + Rows(0, 5) + "\"0.00125,1\n" + Rows(6, 10),
            _ => ["csv-quote-unbalanced-early.csv:7:1", "unbalanced quote"]);
        yield return CsvCase("csv-quote-unbalanced-late", Bad, () => header + Rows(0, 1000) + "\"0.25,1\n" + Rows(1001, 1100),
            _ => ["csv-quote-unbalanced-late.csv:1002:1"]);
        yield return CsvCase("csv-quoted-newline", Bad,
            () => "time [s],note,I [mA]\n" + string.Concat(Enumerable.Range(0, 1000).Select(n => $"{n / 4000.0:R},x,1\n")) + "0.25,\"first\nsecond\",1\n",
            _ => ["csv-quoted-newline.csv:1002:2", "'first\\nsecond' holds a line break"]);
        yield return CsvCase("csv-cell-10MB-early", Bad, () => header + Rows(0, 5) + "0.00125," + new string('1', 10_000_000) + "\n" + Rows(6, 10),
            _ => ["csv-cell-10MB-early.csv:7:1", "longer than 1048576 characters"]);
        yield return CsvCase("csv-cell-10MB-late", Bad, () => header + Rows(0, 1000) + "0.25," + new string('1', 10_000_000) + "\n" + Rows(1001, 1100),
            _ => ["csv-cell-10MB-late.csv:1002:2", "longer than 1048576 characters"]);
        yield return CsvCase("csv-no-header", Bad, () => Rows(0, 10), _ => ["csv-no-header.csv:1:1", "no header line"]);
        yield return CsvCase("csv-no-time-no-rate", Bad, () => "I [mA]\n1\n2\n", _ => ["csv-no-time-no-rate.csv:1:1", "give --rate"]);
        yield return CsvCase("csv-rate-1Hz", Bad, () => "I [mA]\n" + string.Concat(Enumerable.Repeat("1\n", 100)), _ => ["too low to analyse"], "--rate", "1Hz");
        yield return CsvCase("csv-rate-1e15Hz", Bad, () => "I [mA]\n1\n2\n", _ => ["--rate", "1e15Hz", "1 Hz to 10 MHz"], "--rate", "1e15Hz");
        yield return CsvCase("csv-voltage-tiny-sensitivity", Bad, () => "time [s],U [V]\n" + Rows(0, 10), _ => ["--sensitivity", "1E-12 V/A to 1E+09 V/A"], "--sensitivity", "1e-20 V/A");
        yield return CsvCase("csv-timestamp-bad", Bad, () => "time,I [mA]\n2026-01-01T00:00:00Z,1\n2026-01-01T00:00:01Z,1\n2026-13-45T00:00:02Z,1\n",
            _ => ["csv-timestamp-bad.csv:4:1", "ISO 8601"]);
    }

    private static BadInputCase CfgCase(string name, int exit, Action<List<string>> change, string[] places,
        string fileType = "ASCII", Func<string>? datAscii = null, Func<byte[]>? datBinary = null, string[]? extra = null)
    {
        return new(name, exit, folder =>
        {
            var lines = InputFiles.CfgLines(fileType);
            change(lines);
            var cfg = InputFiles.Write(folder, name + ".cfg", InputFiles.Cfg(lines));
            if (fileType == "ASCII")
            {
                InputFiles.Write(folder, name + ".dat", datAscii?.Invoke() ?? InputFiles.DatAscii());
            }
            else
            {
                InputFiles.Write(folder, name + ".dat", datBinary?.Invoke() ?? InputFiles.DatBinary(fileType));
            }

            return (Analyze(cfg, extra ?? []), [.. places.Select(p => p.Replace("@", name, StringComparison.Ordinal))]);
        });
    }

    /// <summary>Sets field <paramref name="field"/> (1-based) of cfg line <paramref name="line"/> (1-based).</summary>
    private static Action<List<string>> Field(int line, int field, string value) => lines =>
    {
        var fields = lines[line - 1].Split(',');
        fields[field - 1] = value;
        lines[line - 1] = string.Join(',', fields);
    };

    private static IEnumerable<BadInputCase> Comtrade()
    {
        // Line 1: station, device, revision year.
        yield return CfgCase("cfg-revision", Bad, Field(1, 3, "2014"), ["@.cfg:1:3", "revision year '2014'"]);
        // Line 2: TT,##A,##D.
        yield return CfgCase("cfg-total", Bad, Field(2, 1, "3"), ["@.cfg:2:1", "total channel count 3"]);
        yield return CfgCase("cfg-total-text", Bad, Field(2, 1, "x"), ["@.cfg:2:1", "not a whole number"]);
        yield return CfgCase("cfg-analog-text", Bad, Field(2, 2, "xA"), ["@.cfg:2:2", "analog channel count 'xA'"]);
        yield return CfgCase("cfg-analog-300000", Bad, lines => lines[1] = "300000,300000A,0D", ["@.cfg:2:2", "300000"]);
        yield return CfgCase("cfg-analog-overflow", Bad, lines => lines[1] = "1,99999999999999999999A,0D", ["@.cfg:2:"]);
        yield return CfgCase("cfg-digital-99999", Bad, lines => lines[1] = "99999,0A,99999D", ["@.cfg:2:3", "digital channel count 99999"]);
        // Analog channel line: An,ch_id,ph,ccbm,uu,a,b,skew,min,max,primary,secondary,PS.
        yield return CfgCase("cfg-an-zero", Bad, Field(3, 1, "0"), ["@.cfg:3:1", "channel number 0"]);
        yield return CfgCase("cfg-an-overflow", Bad, Field(3, 1, "99999999999"), ["@.cfg:3:1", "out of range"]);
        yield return CfgCase("cfg-multiplier-text", Bad, Field(3, 6, "x1"), ["@.cfg:3:6", "multiplier 'x1'"]);
        yield return CfgCase("cfg-multiplier-zero", Bad, Field(3, 6, "0"), ["@.cfg:3:6", "multiplier is 0"]);
        yield return CfgCase("cfg-multiplier-1e308", Bad, Field(3, 6, "1e308"), ["@.cfg:3:6", "multiplier 1E+308"]);
        yield return CfgCase("cfg-multiplier-infinity", Bad, Field(3, 6, "Infinity"), ["@.cfg:3:6", "not a number"]);
        yield return CfgCase("cfg-offset-1e300", Bad, Field(3, 7, "1e300"), ["@.cfg:3:7", "offset 1e300"]);
        yield return CfgCase("cfg-skew-text", Bad, Field(3, 8, "abc"), ["@.cfg:3:8", "skew 'abc'"]);
        yield return CfgCase("cfg-min-text", Bad, Field(3, 9, "abc"), ["@.cfg:3:9", "minimum 'abc'"]);
        yield return CfgCase("cfg-max-text", Bad, Field(3, 10, "abc"), ["@.cfg:3:10", "maximum 'abc'"]);
        yield return CfgCase("cfg-primary-negative", Bad, Field(3, 11, "-5"), ["@.cfg:3:11", "primary factor -5"]);
        yield return CfgCase("cfg-secondary-text", Bad, Field(3, 12, "abc"), ["@.cfg:3:12", "secondary factor 'abc'"]);
        yield return CfgCase("cfg-ps-flag", Bad, Field(3, 13, "Q"), ["@.cfg:3:13", "flag 'Q'"]);
        yield return CfgCase("cfg-analog-short", Bad, lines => lines[2] = "1,IN,N,Bay 3,A,0.00002", ["@.cfg:3", "expected 13 fields"]);
        yield return CfgCase("cfg-unit-unknown", Ok, Field(3, 5, "furlong"), []);
        yield return CfgCase("cfg-unit-unknown-chosen", Bad, Field(3, 5, "furlong"), ["@.cfg", "neither a current nor a voltage"], extra: ["--channel", "IN"]);
        // Line frequency, nrates, samp,endsamp.
        yield return CfgCase("cfg-line-frequency", Bad, Field(5, 1, "1e300"), ["@.cfg:5:1", "line frequency"]);
        yield return CfgCase("cfg-nrates-negative", Bad, Field(6, 1, "-1"), ["@.cfg:6:1", "number of sample rates -1"]);
        yield return CfgCase("cfg-nrates-huge", Bad, Field(6, 1, "2000000000"), ["@.cfg:6:1", "number of sample rates 2000000000"]);
        yield return CfgCase("cfg-rate-zero", Bad, Field(7, 1, "0"), ["@.cfg:7:1", "rate 0 Hz"]);
        yield return CfgCase("cfg-rate-1e300", Bad, Field(7, 1, "1e300"), ["@.cfg:7:1", "outside 1 Hz to 10 MHz"]);
        yield return CfgCase("cfg-rate-1e-300", Bad, Field(7, 1, "1e-300"), ["@.cfg:7:1", "outside 1 Hz to 10 MHz"]);
        yield return CfgCase("cfg-endsamp-zero", Bad, Field(7, 2, "0"), ["@.cfg:7:2", "does not follow 0"]);
        yield return CfgCase("cfg-endsamp-long-max", Bad, Field(7, 2, "9223372036854775807"), ["@.cfg:7:2", "9223372036854775807"]);
        yield return CfgCase("cfg-endsamp-long-max-binary", Bad, Field(7, 2, "9223372036854775807"), ["@.cfg:7:2"], "BINARY");
        yield return CfgCase("cfg-endsamp-beyond-data", Bad, Field(7, 2, "1000000000"), ["@.cfg:7:2", "more than the data can hold"]);
        yield return CfgCase("cfg-endsamp-beyond-binary", Bad, Field(7, 2, "1000000000"), ["@.dat", "the data ends after 2000 whole samples"], "BINARY32");
        yield return CfgCase("cfg-endsamp-text", Bad, Field(7, 2, "x"), ["@.cfg:7:2", "not a whole number"]);
        // Start and trigger stamps.
        yield return CfgCase("cfg-date-overflow", Bad, Field(8, 1, "01/12/99999999999"), ["@.cfg:8:1", "is not dd/mm/yyyy"]);
        yield return CfgCase("cfg-day-overflow", Bad, Field(8, 1, "99999999999/12/2026"), ["@.cfg:8:1", "is not dd/mm/yyyy"]);
        yield return CfgCase("cfg-seconds-overflow", Bad, Field(8, 2, "08:15:99999999999.125"), ["@.cfg:8:2", "is not hh:mm:ss"]);
        yield return CfgCase("cfg-hours-overflow", Bad, Field(9, 2, "99999999999:15:30.1"), ["@.cfg:9:2", "is not hh:mm:ss"]);
        yield return CfgCase("cfg-date-text", Bad, Field(8, 1, "aa/bb/cccc"), ["@.cfg:8:1"]);
        yield return CfgCase("cfg-date-not-calendar", Ok, Field(8, 1, "31/02/2026"), []);
        // Data file type, timemult, time codes.
        yield return CfgCase("cfg-file-type", Bad, Field(10, 1, "HEX"), ["@.cfg:10:1", "data file type 'HEX'"]);
        yield return CfgCase("cfg-timemult-zero", Bad, Field(11, 1, "0"), ["@.cfg:11:1", "time stamp multiplier 0"]);
        yield return CfgCase("cfg-timemult-1e300", Bad, Field(11, 1, "1e300"), ["@.cfg:11:1", "time stamp multiplier 1e300"]);
        yield return CfgCase("cfg-time-code", Bad, Field(12, 1, "+99"), ["@.cfg:12:1", "time code '+99'"]);
        yield return CfgCase("cfg-ends-early", Bad, lines => lines.RemoveRange(6, lines.Count - 6), ["@.cfg:7", "ends early"]);
        yield return CfgCase("cfg-long-line", Bad, lines => lines[0] = new string('x', 2_000_000), ["@.cfg:1", "longer than 1048576"]);
        // Data values.
        yield return CfgCase("dat-infinity", Bad, _ => { }, ["@.dat:101:3", "sample 100", "'Infinity' is not a finite number"],
            datAscii: () => InputFiles.DatAscii(n => n == 100 ? "Infinity" : null));
        yield return CfgCase("dat-1e309", Bad, _ => { }, ["@.dat:101:3", "'1e309' is not a finite number"],
            datAscii: () => InputFiles.DatAscii(n => n == 100 ? "1e309" : null));
        yield return CfgCase("dat-nan-text", Bad, _ => { }, ["@.dat:101:3", "'NaN' is not a finite number"],
            datAscii: () => InputFiles.DatAscii(n => n == 100 ? "NaN" : null));
        yield return CfgCase("dat-value-text", Bad, _ => { }, ["@.dat:6:3", "'x' is not a number"],
            datAscii: () => InputFiles.DatAscii(n => n == 5 ? "x" : null));
        yield return CfgCase("dat-missing-value", Ok, _ => { }, [],
            datAscii: () => InputFiles.DatAscii(n => n == 5 ? "" : null));
        yield return CfgCase("dat-huge-after-scaling", Bad, Field(3, 6, "1e9"), ["@.dat:1002:3", "sample 1001", "beyond"],
            datAscii: () => InputFiles.DatAscii(n => n == 1001 ? "1e10" : null));
        yield return CfgCase("dat-short", Bad, _ => { }, ["@.dat", "the data ends after 1500 samples"],
            datAscii: () => InputFiles.DatAscii(samples: 1500));
        yield return CfgCase("dat-long-line", Bad, _ => { }, ["@.dat:6", "longer than 1048576 bytes"],
            datAscii: () => InputFiles.DatAscii(n => n == 5 ? new string('1', 2_000_000) : null));
        yield return CfgCase("dat-float32-infinity", Bad, _ => { }, ["@.dat", "byte 19208", "sample 1200", "+infinity"], "FLOAT32",
            datBinary: () => InputFiles.DatBinary("FLOAT32", n => n == 1200 ? float.PositiveInfinity : null));
        yield return CfgCase("dat-float32-nan-missing", Ok, _ => { }, [], "FLOAT32",
            datBinary: () => InputFiles.DatBinary("FLOAT32", n => n == 1200 ? float.NaN : null));
        yield return CfgCase("dat-float32-1e30-scaled", Bad, _ => { }, ["@.dat", "sample 3", "beyond"], "FLOAT32",
            datBinary: () => InputFiles.DatBinary("FLOAT32", n => n == 3 ? 1e30f : null));
        yield return new BadInputCase("dat-missing", Bad, folder =>
        {
            var cfg = InputFiles.Write(folder, "lonely.cfg", InputFiles.Cfg(InputFiles.CfgLines()));
            return (Analyze(cfg), ["lonely.cfg", "data file not found"]);
        });

        // .cff: one file, sections.
        yield return CffCase("cff-ok", Ok, "--- file type: DAT ASCII ---", []);
        yield return CffCase("cff-size-overflow", Bad, "--- file type: DAT BINARY: 99999999999999999999999 ---", ["cff-size-overflow.cff:15", "bytes"]);
        yield return CffCase("cff-section-unknown", Bad, "--- file type: XYZ ---", ["cff-section-unknown.cff:15", "unknown section type 'XYZ'"]);
        yield return new BadInputCase("cff-no-cfg", Bad, folder =>
        {
            var path = InputFiles.Write(folder, "cff-no-cfg.cff", "--- file type: DAT ASCII ---\n" + InputFiles.DatAscii());
            return (Analyze(path), ["cff-no-cfg.cff", "no '--- file type: CFG ---' section"]);
        });
    }

    private static BadInputCase CffCase(string name, int exit, string dataHeader, string[] places) =>
        new(name, exit, folder =>
        {
            var path = InputFiles.Write(folder, name + ".cff",
                "--- file type: CFG ---\n" + InputFiles.Cfg(InputFiles.CfgLines()) + dataHeader + "\n" + InputFiles.DatAscii());
            return (Analyze(path), places);
        });

    private static BadInputCase SiteCase(string name, int exit, Func<string> site, Func<string, string[]> places,
        Func<byte[]>? capture = null, Func<string, byte[]>? bytes = null) =>
        new(name, exit, folder =>
        {
            InputFiles.Write(folder, "c1.wav", capture?.Invoke() ?? InputFiles.Wav());
            var text = site();
            var path = InputFiles.Write(folder, name + ".json", bytes?.Invoke(text) ?? new UTF8Encoding(false).GetBytes(text));
            return (["survey", "--config", path, "-o", Path.Combine(folder, "out"), "-q"], [capture is null ? name + ".json" : "c1.wav", .. places(text)]);
        });

    private static IEnumerable<BadInputCase> Site()
    {
        string[] At(string text, string token) => [InputFiles.PlaceOf(text, token)];

        yield return SiteCase("site-ok", Ok, () => InputFiles.Site(), _ => []);
        yield return SiteCase("site-rated-200A", Bad, () => InputFiles.Site(entry: "\"rated\": \"200A\""),
            t => [.. At(t, "\"200A\""), "\"rated\"", "up to 100 A"]);
        yield return SiteCase("site-rated-zero", Bad, () => InputFiles.Site(entry: "\"rated\": \"0mA\""), t => [.. At(t, "\"0mA\""), "\"rated\""]);
        yield return SiteCase("site-rated-bare", Bad, () => InputFiles.Site(entry: "\"rated\": 30"), t => [.. At(t, "30 }"), "has no unit", "did you mean \"30mA\"?"]);
        yield return SiteCase("site-rated-text", Bad, () => InputFiles.Site(entry: "\"rated\": \"lots\""), t => [.. At(t, "\"lots\""), "\"rated\""]);
        yield return SiteCase("site-rated-1e400", Bad, () => InputFiles.Site(entry: "\"rated\": 1e400"), t => [.. At(t, "1e400"), "out of range"]);
        yield return SiteCase("site-scale-1e300", Bad, () => InputFiles.Site(entry: "\"scale\": \"1e300A\""), t => [.. At(t, "\"1e300A\""), "\"scale\""]);
        yield return SiteCase("site-rate-1e15", Bad, () => InputFiles.Site(entry: "\"rate\": \"1e15Hz\""), t => [.. At(t, "\"1e15Hz\""), "1 Hz to 10 MHz"]);
        yield return SiteCase("site-rate-1", Bad, () => InputFiles.Site(entry: "\"rate\": 0.5"), t => [.. At(t, "0.5"), "\"rate\""]);
        yield return SiteCase("site-sensitivity-tiny", Bad, () => InputFiles.Site(entry: "\"sensitivity\": \"1e-20 V/A\""), t => [.. At(t, "\"1e-20 V/A\""), "\"sensitivity\""]);
        yield return SiteCase("site-range-huge", Bad, () => InputFiles.Site(entry: "\"range\": \"1e20V\""), t => [.. At(t, "\"1e20V\""), "\"range\""]);
        yield return SiteCase("site-device", Bad, () => InputFiles.Site(entry: "\"device\": \"Z\""), t => [.. At(t, "\"Z\""), "unknown device type"]);
        yield return SiteCase("site-sensor", Bad, () => InputFiles.Site(entry: "\"sensor\": \"maybe\""), t => [.. At(t, "\"maybe\""), "\"sensor\""]);
        yield return SiteCase("site-regime", Bad, () => InputFiles.Site(entry: "\"regime\": \"eu\""), t => [.. At(t, "\"eu\""), "\"regime\""]);
        yield return SiteCase("site-ev", Bad, () => InputFiles.Site(entry: "\"ev\": \"yes\""), t => [.. At(t, "\"yes\""), "\"ev\""]);
        yield return SiteCase("site-channel", Bad, () => InputFiles.Site(entry: "\"channel\": -1"), t => [.. At(t, "-1"), "\"channel\""]);
        yield return SiteCase("site-sum", Bad, () => InputFiles.Site(entry: "\"sum\": \"L1\""), t => [.. At(t, "\"L1\""), "\"sum\""]);
        yield return SiteCase("site-unknown-key", Bad, () => InputFiles.Site(entry: "\"ratd\": \"30mA\""), t => [.. At(t, "\"ratd\""), "did you mean \"rated\""]);
        yield return SiteCase("site-duplicate-key", Bad, () => InputFiles.Site(entry: "\"rated\": \"30mA\", \"rated\": \"10mA\""), t => [.. At(t, "\"rated\": \"10mA\""), "duplicate key"]);
        yield return SiteCase("site-not-json", Bad, () => "{ \"site\": ", _ => ["site-not-json.json:1:", "not valid JSON"]);
        yield return SiteCase("site-empty", Bad, () => "", _ => ["site-empty.json:1:1", "empty"]);
        yield return SiteCase("site-trailing", Bad, () => InputFiles.Site() + "{}", _ => ["site-trailing.json:8:1"]);
        yield return SiteCase("site-captures-empty", Bad, () => "{ \"captures\": [] }", _ => ["site-captures-empty.json:1:15", "empty"]);
        yield return SiteCase("site-invalid-utf8", Bad, () => InputFiles.Site().Replace("C1 saw", "C1 s~w", StringComparison.Ordinal),
            t => [.. At(t, "~"), "invalid UTF-8 (byte 0xFF)", "byte offset"],
            bytes: t => [.. Encoding.UTF8.GetBytes(t).Select(b => b == (byte)'~' ? (byte)0xFF : b)]);
        yield return SiteCase("site-lone-surrogate", Bad, () => InputFiles.Site().Replace("C1 saw", "C1 \\ud800", StringComparison.Ordinal),
            t => [.. At(t, "\"C1 \\ud800\""), "lone"]);
        yield return SiteCase("site-string-20MB", Bad, () => InputFiles.Site().Replace("C1 saw", new string('s', 20_000_000), StringComparison.Ordinal),
            _ => ["at most 4194304 bytes"]);
        yield return SiteCase("site-string-5000", Bad, () => InputFiles.Site().Replace("C1 saw", new string('s', 5000), StringComparison.Ordinal),
            t => [.. At(t, "\"sss"), "at most 4096 bytes"]);
        yield return SiteCase("site-capture-nan", Bad, () => InputFiles.Site(),
            _ => ["sample 10", "NaN"], () => InputFiles.Wav(s => s.Sample = n => n == 10 ? double.NaN : InputFiles.Fraction(n)));
        yield return SiteCase("site-capture-rate-int-max", Bad, () => InputFiles.Site(),
            _ => [Byte(WavSpec.RateOffset)], () => InputFiles.Wav(s => s.Rate = int.MaxValue));
        yield return SiteCase("site-upstream-rated", Bad,
            () => InputFiles.Site().Replace("  ]\n}", "  ],\n  \"upstream\": [ { \"name\": \"Q1\", \"device\": \"A\", \"rated\": \"500A\", \"circuits\": [\"c1.wav\"] } ]\n}", StringComparison.Ordinal),
            t => [.. At(t, "\"500A\""), "\"rated\""]);
    }

    private static IEnumerable<BadInputCase> Options()
    {
        static BadInputCase Option(string name, string[] places, params string[] options) =>
            new(name, Bad, folder =>
            {
                var path = InputFiles.Write(folder, "c1.wav", InputFiles.Wav());
                return (Analyze(path, options), places);
            });

        yield return Option("option-rate-1e15", ["--rate", "'1e15Hz'"], "--rate", "1e15Hz");
        yield return Option("option-rate-zero", ["--rate", "'0Hz'"], "--rate", "0Hz");
        yield return Option("option-scale-zero", ["--scale", "'0A'"], "--scale", "0A");
        yield return Option("option-scale-1e300", ["--scale", "'1e300A'"], "--scale", "1e300A");
        yield return Option("option-sensitivity-tiny", ["--sensitivity", "'1e-300 V/A'"], "--sensitivity", "1e-300 V/A", "--range", "1V");
        yield return Option("option-range-huge", ["--range", "'1e20V'"], "--sensitivity", "10 mV/mA", "--range", "1e20V");
        yield return Option("option-risk-likely", ["--risk-likely", "'0.2'", "'possible' boundary"], "--risk-likely", "0.2");
        yield return Option("option-risk-possible", ["--risk-possible", "'0.6'"], "--risk-possible", "0.6");
        yield return Option("option-mains", ["--mains"], "--mains", "1e9Hz");
    }
}
