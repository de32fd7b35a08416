using System.Globalization;
using System.Text;
using WaveCheck.Core.Capture;

namespace WaveCheck.Core.Tests.Capture;

public sealed class CsvCaptureSourceTests : IDisposable
{
    private const double RateHz = 1000;
    private const int Rows = 1200; // more than the reader's 400-line look-ahead, so the streaming part is exercised
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    /// <summary>The reference residual current: 12 mA at 50 Hz on 2 mA DC, amperes.</summary>
    private static readonly double[] ReferenceA = Signals.Sine(Rows, RateHz, 50, 0.012, 0.4, 0.002);

    private static string R(double v, bool decimalComma = false)
    {
        var s = v.ToString("R", CultureInfo.InvariantCulture);
        return decimalComma ? s.Replace('.', ',') : s;
    }

    private static string Build(string preamble, string header, Func<int, string> row)
    {
        var text = new StringBuilder(preamble);
        text.Append(header).Append('\n');
        for (var n = 0; n < Rows; n++)
        {
            text.Append(row(n)).Append('\n');
        }

        return text.ToString();
    }

    public static TheoryData<string, string, double?, double?> Dialects()
    {
        var t0 = new DateTimeOffset(2026, 3, 1, 10, 0, 0, TimeSpan.Zero);
        var d = new TheoryData<string, string, double?, double?>
        {
            { "comma", Build("", "time [s],I [mA]", n => $"{R(n / RateHz)},{R(ReferenceA[n] * 1e3)}"), null, null },
            { "semicolon-decimal-comma", Build("", "Zeit [s];I [mA]", n => $"{R(n / RateHz, true)};{R(ReferenceA[n] * 1e3, true)}"), null, null },
            { "tab-amperes-by-name", Build("", "t\tIleak (A)", n => $"{R(n / RateHz)}\t{R(ReferenceA[n])}"), null, null },
            { "tab-decimal-comma", Build("", "tijd\tI [mA]", n => $"{R(n / RateHz, true)}\t{R(ReferenceA[n] * 1e3, true)}"), null, null },
            {
                "comments-and-metadata",
                Build("# exported by a bench logger\n# site: invented workshop\nlogger: bench unit 3\nrate = 1 kHz\n\n", "time [ms],residual_mA",
                    n => $"{R(n * 1e3 / RateHz)},{R(ReferenceA[n] * 1e3)}"),
                null, null
            },
            { "microamperes", Build("", "time [s],I [µA]", n => $"{R(n / RateHz)},{R(ReferenceA[n] * 1e6)}"), null, null },
            { "uA-suffix", Build("", "time_s,leak_uA", n => $"{R(n / RateHz)},{R(ReferenceA[n] * 1e6)}"), null, null },
            // 10 mV/mA = 10 V/A: the clamp's output in mV is 10 000 × the current in A (closed form).
            { "millivolts-with-sensitivity", Build("", "time [s],U clamp [mV]", n => $"{R(n / RateHz)},{R(ReferenceA[n] * 1e4)}"), 10.0, null },
            {
                "iso-timestamps",
                Build("", "timestamp,I [mA]",
                    n => $"{t0.AddTicks(n * TimeSpan.TicksPerMillisecond).ToString("yyyy-MM-dd'T'HH:mm:ss.fffK", CultureInfo.InvariantCulture)},{R(ReferenceA[n] * 1e3)}"),
                null, null
            },
            { "ms-time-column", Build("", "time [ms],I [mA]", n => $"{R(n * 1e3 / RateHz)},{R(ReferenceA[n] * 1e3)}"), null, null },
            { "no-time-column-with-rate", Build("", "I [mA]", n => R(ReferenceA[n] * 1e3)), null, RateHz },
        };
        return d;
    }

    [Theory]
    [MemberData(nameof(Dialects))]
    public void EveryDialectGivesTheSameAmperes(string name, string text, double? sensitivity, double? rate)
    {
        var path = _folder.Write($"{name}.csv", text);
        using var source = CaptureOpener.Open(path, new ImportOptions { SensitivityVPerA = sensitivity, RateHz = rate });
        Assert.False(source.Info.SampleCountExact);
        var (residual, _) = Signals.ReadAll(source, 500);
        Assert.True(source.Info.SampleCountExact);
        Assert.Equal(Rows, source.Info.SampleCount);
        Assert.Equal(RateHz, source.Info.SampleRateHz, 1e-6);
        Assert.Equal(Rows, residual.Length);
        // Decimal text written with round-trip precision; unit factors (1e-3, 1e-6, 1/10) add a few ulps: 1e-12 A is ample.
        for (var n = 0; n < Rows; n++)
        {
            Assert.Equal(ReferenceA[n], residual[n], 1e-12);
        }

        Assert.DoesNotContain(source.Warnings, w => w.Code.StartsWith("time-", StringComparison.Ordinal));
        if (rate is null)
        {
            Assert.Equal(RateHz, source.Info.MeasuredSampleRateHz!.Value, 1e-6);
        }
    }

    [Fact]
    public void DialectIsNamedInTheEncoding()
    {
        var path = _folder.Write("d.csv", "# note\nZeit [s];I [mA]\n0,000;1,5\n0,001;1,6\n0,002;1,7\n");
        using var source = CaptureOpener.Open(path, new ImportOptions());
        Assert.Equal("delimiter ';', decimal comma, 1 preamble lines", source.Info.Encoding);
        Assert.True(source.Info.SampleCountExact); // the look-ahead saw the whole file
        Assert.Equal(3, source.Info.SampleCount);
    }

    [Fact]
    public void AGapIsReportedWhereItWasPlaced()
    {
        // 1 kHz time axis with rows 400..409 removed: 10 samples (0.010 s) missing after t = 0.399 s (closed form).
        var text = new StringBuilder("time [s],I [mA]\n");
        for (var n = 0; n < 1000; n++)
        {
            if (n is >= 400 and < 410)
            {
                continue;
            }

            text.Append(CultureInfo.InvariantCulture, $"{R(n / RateHz)},{R(Math.Sin(n * 0.3))}\n");
        }

        var path = _folder.Write("gap.csv", text.ToString());
        using var source = CaptureOpener.Open(path, new ImportOptions());
        Signals.ReadAll(source);
        var gap = Assert.Single(source.Warnings, w => w.Code == "time-gap");
        Assert.Equal(0.399, gap.TimeS!.Value, 1e-9);
        Assert.Contains("0.01 s (about 10 samples) missing after t = 0.399 s", gap.Message);
        // header is line 1, sample n sits on line n + 2 while n < 400; the row after the gap (n = 410) is on line 402.
        Assert.Contains("line 402", gap.Message);
        Assert.Equal(990, source.Info.SampleCount);
    }

    [Fact]
    public void RateFromTheFirstLinesThatDiffersFromTheWholeFileIsWarnedWithoutBlamingRate()
    {
        // 1 ms steps for 400 lines, then 1.1 ms: the median of the first lines gives 1000 Hz, the whole file's mean
        // step about 1.06 ms (closed form: (400 x 1 + 600 x 1.1) / 1000), more than 1 % apart. No --rate was given,
        // so the warning must not name it as the rate used.
        var text = new StringBuilder("time [s],I [mA]\n");
        var t = 0.0;
        for (var n = 0; n < 1000; n++)
        {
            text.Append(CultureInfo.InvariantCulture, $"{R(t)},{R(Math.Cos(n * 0.2))}\n");
            t += n < 400 ? 1e-3 : 1.1e-3;
        }

        var path = _folder.Write("drift.csv", text.ToString());
        using var source = CaptureOpener.Open(path, new ImportOptions());
        Signals.ReadAll(source);
        var mismatch = Assert.Single(source.Warnings, w => w.Code == "rate-mismatch");
        Assert.StartsWith("the median time step of the first lines gives 1000 Hz", mismatch.Message);
        Assert.Contains("give ⟦RateHz⟧ to set it", mismatch.Message);
    }

    [Fact]
    public void JitterAndStepsBackwardsAreWarnedNotFixed()
    {
        var text = new StringBuilder("time [s],I [mA]\n");
        for (var n = 0; n < 600; n++)
        {
            // steps alternate 0.9 ms and 1.1 ms: standard deviation 0.1 ms, 10 % of the 1 ms median (closed form).
            var t = n * 1e-3 + (n % 2 == 1 ? -1e-4 : 0);
            if (n == 300)
            {
                t = 0.2; // a step backwards at line 302
            }

            text.Append(CultureInfo.InvariantCulture, $"{R(t)},{R(Math.Cos(n * 0.2))}\n");
        }

        var path = _folder.Write("jitter.csv", text.ToString());
        using var source = CaptureOpener.Open(path, new ImportOptions());
        Signals.ReadAll(source);
        var jitter = Assert.Single(source.Warnings, w => w.Code == "time-jitter");
        Assert.Contains("10 % of the median step", jitter.Message);
        var back = Assert.Single(source.Warnings, w => w.Code == "time-non-monotonic");
        Assert.Contains("line 302", back.Message);
    }

    [Fact]
    public void SumOfThreePhasesAndNeutralEqualsTheImbalance()
    {
        // Kirchhoff's current law: I1 + I2 + I3 + IN = residual. Balanced 10 A phases; the neutral returns all but a
        // residual of 8 mA at 50 Hz plus 3 mA DC, which leaks to earth.
        const int count = 2000;
        var i1 = Signals.Sine(count, 10_000, 50, 10 * Math.Sqrt(2));
        var i2 = Signals.Sine(count, 10_000, 50, 10 * Math.Sqrt(2), -2 * Math.PI / 3);
        var i3 = Signals.Sine(count, 10_000, 50, 10 * Math.Sqrt(2), 2 * Math.PI / 3);
        var residual = Signals.Sine(count, 10_000, 50, 0.008, 0.5, 0.003);
        var text = new StringBuilder("time [s],L1 [A],L2 [A],L3 [A],N [A]\n");
        for (var n = 0; n < count; n++)
        {
            var neutral = residual[n] - (i1[n] + i2[n] + i3[n]);
            text.Append(CultureInfo.InvariantCulture, $"{R(n / 10_000.0)},{R(i1[n])},{R(i2[n])},{R(i3[n])},{R(neutral)}\n");
        }

        var path = _folder.Write("three-phase.csv", text.ToString());
        using var source = CaptureOpener.Open(path, new ImportOptions { SumChannels = ["l1", "L2", "L3", "n"] });
        Assert.Equal("L1+L2+L3+N", source.Info.ResidualSource);
        Assert.Equal([0, 1, 2, 3], source.Info.ResidualChannels);
        var (sum, _) = Signals.ReadAll(source);
        // The sum cancels 14 A peaks: double rounding of four ~14 A terms leaves ~4·2^-52·14 A ≈ 1e-14 A; 1e-12 A is safe.
        for (var n = 0; n < count; n++)
        {
            Assert.Equal(residual[n], sum[n], 1e-12);
        }
    }

    [Fact]
    public void SeveralCurrentColumnsWithoutAChoiceAreRefusedAndTheHeaderAsWrittenChooses()
    {
        var path = _folder.Write("two.csv", "time [s],Ia [mA],Ib [mA]\n0,1,2\n0.001,3,4\n0.002,5,6\n");
        var refused = Assert.Throws<CaptureFormatException>(() => CaptureOpener.Open(path, new ImportOptions()));
        Assert.Equal(1, refused.Line);
        Assert.StartsWith("2 channels could carry the residual current (Ia, Ib) and none is named as the residual current: give SumChannels Ia,Ib",
            refused.Problem, StringComparison.Ordinal);

        using var second = CaptureOpener.Open(path, new ImportOptions { Channel = "2" });
        Assert.Equal("Ib", second.Info.ResidualSource);
        Assert.Equal(0.006, Signals.ReadAll(second).Residual[2], 1e-15);

        // The header cell exactly as written names the same column as its parsed name.
        using var written = CaptureOpener.Open(path, new ImportOptions { Channel = "Ia [mA]" });
        Assert.Equal("Ia", written.Info.ResidualSource);
        Assert.Equal(0.005, Signals.ReadAll(written).Residual[2], 1e-15);
    }

    [Fact]
    public void OfSeveralCurrentColumnsTheOneNamedAsTheResidualCurrentIsTaken()
    {
        // A logger that records the phases and the residual current: the column named so is used, without a guess.
        var path = _folder.Write("named.csv", "time_s,L1_A,L2_A,I_res_mA\n0,10,-10,1\n0.001,11,-11,2\n0.002,12,-12,3\n");
        using var source = CaptureOpener.Open(path, new ImportOptions());
        Assert.Equal("I_res", source.Info.ResidualSource);
        Assert.DoesNotContain(source.Warnings, w => w.Code == ChannelSelection.GuessedCode);
        Assert.Equal(0.003, Signals.ReadAll(source).Residual[2], 1e-15);   // 3 mA, column unit mA

        // N is the neutral conductor in such an export, not a residual name: L1, L2, N without a choice are refused.
        var conductors = _folder.Write("conductors.csv", "time_s,L1_A,L2_A,N_A\n0,10,-10,0\n0.001,11,-11,0\n");
        Assert.Throws<CaptureFormatException>(() => CaptureOpener.Open(conductors, new ImportOptions()));
    }

    [Fact]
    public void TheFixtureFromAnInventedLoggerReads()
    {
        using var source = CaptureOpener.Open(TempFolder.Fixture("invented-logger-semicolon.csv"), new ImportOptions());
        var (residual, _) = Signals.ReadAll(source);
        Assert.Equal(8, residual.Length);
        Assert.Equal(2000, source.Info.SampleRateHz, 1e-9); // 0,5 ms steps (closed form: 1 / 0.0005 s)
        Assert.Equal(-0.0031, residual[3], 1e-15); // written as -3,1 mA on line 8
        Assert.Equal(SensorCoupling.Unknown, source.Info.SensorCoupling);
    }

    [Fact]
    public void TheIsoFixtureReadsItsStartTime()
    {
        using var source = CaptureOpener.Open(TempFolder.Fixture("invented-clinic-iso.tsv"), new ImportOptions());
        Assert.Equal(new DateTimeOffset(2026, 2, 3, 8, 15, 0, TimeSpan.Zero), source.Info.StartTime);
        var (residual, _) = Signals.ReadAll(source);
        Assert.Equal(6, residual.Length);
        Assert.Equal(250e-6, residual[1], 1e-15); // 250 µA on line 4
    }

    public static TheoryData<string, string, ImportOptions, long, long, string> BadFiles() => new()
    {
        { "non-numeric.csv", "time [s],I [mA]\n0,1\n0.001,2\n0.002,abc\n", new ImportOptions(), 4, 2, "'abc' is not a number" },
        { "empty-cell.csv", "time [s],I [mA]\n0,1\n0.001,\n0.002,3\n", new ImportOptions(), 3, 2, "empty cell" },
        { "bad-decimal.csv", "time [s];I [mA]\n0,000;1,5\n0,001;1.6\n0,002;1,7\n", new ImportOptions(), 3, 2, "decimal comma expected" },
        { "unknown-unit.csv", "time [s],I [furlong]\n0,1\n0.001,2\n", new ImportOptions(), 1, 2, "unknown unit 'furlong'" },
        { "missing-channel.csv", "time [s],I [mA]\n0,1\n0.001,2\n", new ImportOptions { Channel = "L7" }, 1, 1, "no channel named 'L7'" },
        { "missing-sum.csv", "time [s],L1 [A],L2 [A]\n0,1,2\n0.001,2,3\n", new ImportOptions { SumChannels = ["L1", "N"] }, 1, 1, "no channel named 'N'" },
        { "header-only.csv", "# a logger\ntime [s],I [mA]\n", new ImportOptions(), 3, 1, "no data rows" },
        { "comments-only.csv", "# nothing here\n\n", new ImportOptions(), 2, 1, "no header: the file holds only 2 comment or blank lines" },
        { "no-rate.csv", "I [mA]\n1\n2\n3\n", new ImportOptions(), 1, 1, "give RateHz" },
        { "volts.csv", "time [s],t2,U [mV]\n0,1,5\n0.001,1,6\n", new ImportOptions(), 1, 3, "give SensitivityVPerA" },
        { "short-row.csv", "time [s],I1 [mA],I2 [mA]\n0,1,2\n0.001,2,3\n0.002,4\n", new ImportOptions { Channel = "I1" }, 4, 3, "row has 2 fields, the header has 3" },
        { "no-header.csv", "0,1\n0.001,2\n", new ImportOptions(), 1, 1, "no header line" },
    };

    [Theory]
    [MemberData(nameof(BadFiles))]
    public void BadInputNamesLineAndColumn(string name, string text, ImportOptions options, long line, long column, string problem)
    {
        var path = _folder.Write(name, text);
        var ex = Assert.Throws<CaptureFormatException>(() =>
        {
            using var source = CaptureOpener.Open(path, options);
            Signals.ReadAll(source);
        });
        Assert.Equal(path, ex.FilePath);
        Assert.Equal(line, ex.Line);
        Assert.Equal(column, ex.Column);
        Assert.Contains(problem, ex.Problem);
        Assert.StartsWith($"{path}:{line}:{column}: ", ex.Message);
    }
}
