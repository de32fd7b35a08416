using System.Text;
using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Capture.Comtrade;
using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;
using WaveCheck.Core.Survey;
using WaveCheck.Core.Synthesis;
using WaveCheck.Core.Tests.Capture.Comtrade;

namespace WaveCheck.Core.Tests.Capture;

/// <summary>
/// Voltage channels in every format: named with <c>VoltageChannels</c> (the CLI's <c>--voltage</c>), set aside from the residual current, scaled to volts
/// (WAV by <c>--voltage-scale</c>, CSV and COMTRADE by their units and a probe ratio), and refused in clear words
/// when they cannot be one. The split's figures are checked within 1 % of the closed form I = V(1/R + jωC)
/// (Ohm's law and the capacitor's admittance, REFERENCE.md "Insulation").
/// </summary>
public sealed class VoltageChannelTests
{
    private const double R = 270e3, C = 33e-9;

    private static SynthCaptureSource Source() =>
        new([new RcLeakageComponent(new SupplyVoltage(230, 50, [(5, 0.03, 0)]), 0, R, C)], 20_000, 3,
            supply: new SupplyVoltage(230, 50, [(5, 0.03, 0)]));

    private static LeakageSplitResult Split(string path, ImportOptions options) =>
        Evaluation.Run(path, options with { Sensor = SensorCoupling.Dc }, new AnalysisOptions(), new AssessmentOptions()).Analysis.LeakageSplit!;

    private static void Within1Percent(double expected, double actual, string what) =>
        Assert.True(Math.Abs(actual - expected) <= 0.01 * Math.Abs(expected), $"{what}: expected {expected:G6}, got {actual:G6}");

    [Fact]
    public void WavVoltageChannelWithItsOwnFullScaleGivesRAndC()
    {
        using var folder = new TempFolder();
        var path = folder.File("leak.wav");
        using (var source = Source())
        {
            CaptureWriter.WriteWavWithVoltage(path, source, 0.005, 500, WavSampleFormat.Pcm24);
        }

        var split = Split(path, new ImportOptions { VoltageChannels = ["ch2"], VoltageScale = 500 });
        // 24-bit samples: quantisation far below 1 %.
        Within1Percent(R, split.ResistanceOhm!.Value, "R");
        Within1Percent(C, split.CapacitanceF.Mean, "C");
        Within1Percent(230, split.VoltageRmsV, "V");

        using var opened = CaptureOpener.Open(path, new ImportOptions { VoltageChannels = ["2"], VoltageScale = 500 });
        Assert.Equal([0], opened.Info.ResidualChannels);
        Assert.Equal(ChannelQuantity.Voltage, opened.Info.Channels[1].Quantity);
        Assert.DoesNotContain(opened.Warnings, w => w.Code == ChannelSelection.GuessedCode);
    }

    [Fact]
    public void WavVoltageChannelWithoutAScaleIsRefused()
    {
        using var folder = new TempFolder();
        var path = folder.File("leak.wav");
        using (var source = Source())
        {
            CaptureWriter.WriteWavWithVoltage(path, source, 0.005, 500, WavSampleFormat.Pcm16);
        }

        var e = Assert.Throws<CaptureFormatException>(() => CaptureOpener.Open(path, new ImportOptions { VoltageChannels = ["ch2"] }));
        Assert.Contains("VoltageChannels on a WAV file needs VoltageScale", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void CsvVoltageColumnInVoltsGivesRAndC()
    {
        using var folder = new TempFolder();
        var path = folder.File("leak.csv");
        using (var source = Source())
        {
            CaptureWriter.WriteCsvWithVoltage(path, source);
        }

        Assert.StartsWith("time [s],I [mA],U [V]", File.ReadLines(path).First(), StringComparison.Ordinal);
        var split = Split(path, new ImportOptions { VoltageChannels = ["U"] });
        Within1Percent(R, split.ResistanceOhm!.Value, "R");
        Within1Percent(C, split.CapacitanceF.Mean, "C");
        Assert.Equal([1, 5], split.Fit!.Orders);
    }

    [Fact]
    public void CsvVoltageScaleIsAProbeRatio()
    {
        // A 100:1 probe recorded in mV: 3.25 V peak on the column is 325 V on the circuit.
        var text = new StringBuilder("time [s],I [mA],probe [mV]\n");
        for (var n = 0; n < 20_000; n++)
        {
            var t = n / 10_000.0;
            var v = 325.0 * Math.Sin(2 * Math.PI * 50 * t);
            text.Append(FormattableString.Invariant($"{t},{v / R * 1000},{v / 100 * 1000}\n"));
        }

        using var folder = new TempFolder();
        var path = folder.Write("probe.csv", text.ToString());
        using (var opened = CaptureOpener.Open(path, new ImportOptions { VoltageChannels = ["probe"], VoltageScale = 100 }))
        {
            Assert.Equal(100, opened.Info.Voltage!.VoltsPerSiUnit[0], 12);
            Assert.Contains("⟦VoltageScale⟧ 100", opened.Info.Voltage.Source, StringComparison.Ordinal);
        }

        var split = Split(path, new ImportOptions { VoltageChannels = ["probe"], VoltageScale = 100 });
        Within1Percent(325 / Math.Sqrt(2), split.VoltageRmsV, "V");
        Within1Percent(R, split.ResistanceOhm!.Value, "R");
    }

    [Theory]
    [InlineData(new[] { "I" }, null, "VoltageChannels: channel 'I' is in 'mA', not a voltage (V, mV or kV)")]
    [InlineData(new[] { "U", "I" }, null, "VoltageChannels names 2 channels: expected one (single-phase, line to earth or neutral) or three (L1,L2,L3 to earth)")]
    [InlineData(new[] { "U", "u", "I" }, null, "VoltageChannels names channel 'U' twice")]
    [InlineData(new[] { "W" }, null, "VoltageChannels: no channel named 'W' (channels: I, U)")]
    [InlineData(null, 10.0, "VoltageScale was given without VoltageChannels: name the voltage channel(s)")]
    public void CsvVoltageChoicesThatCannotBeAreRefused(string[]? voltage, double? scale, string message)
    {
        using var folder = new TempFolder();
        var path = folder.Write("bad.csv", "time [s],I [mA],U [V]\n0,1,2\n0.001,1,2\n0.002,1,2\n");
        var e = Assert.Throws<CaptureFormatException>(() => CaptureOpener.Open(path, new ImportOptions { VoltageChannels = voltage, VoltageScale = scale, RateHz = null }));
        Assert.Contains(message, e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void AChannelCannotBeBothVoltageAndResidual()
    {
        using var folder = new TempFolder();
        var path = folder.Write("both.csv", "time [s],I [mA],U [V]\n0,1,2\n0.001,1,2\n0.002,1,2\n");
        var e = Assert.Throws<CaptureFormatException>(() => CaptureOpener.Open(path,
            new ImportOptions { VoltageChannels = ["U"], SumChannels = ["I", "U"], SensitivityVPerA = 10 }));
        Assert.Contains("channel 'U' is named by VoltageChannels and also forms the residual current", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void ComtradeVoltageInKilovoltsIsDeliveredInVolts()
    {
        // The feeder record's UL1 is stored in kV (0.325 kV peak): the voltage input holds 325 V peak.
        var builder = ComtradeCaptureSourceTests.Feeder(ComtradeDataFileType.Binary);
        using var folder = new TempFolder();
        var path = builder.Write(folder.Path, "feeder");
        using var source = CaptureOpener.Open(path, new ImportOptions { Channel = "IN", VoltageChannels = ["UL1"] });
        var voltage = source.Info.Voltage!;
        Assert.Equal(["UL1"], voltage.Names);
        var block = source.CreateBlock(800);
        Assert.True(source.Read(block));
        var volts = new double[block.Length];
        voltage.Form(block, 0, volts);
        // Quantisation: half a step of 0.5 kV / 32767 is 7.6 mV.
        Assert.Equal(325, volts.Max(), 0.05);
    }

    [Fact]
    public void SiteFileKeysNameTheVoltage()
    {
        var json = """
            { "captures": [ { "file": "a.wav", "voltage": "ch2", "voltageScale": "500V" },
                            { "file": "b.csv", "voltage": ["U1", "U2", "U3"] } ] }
            """;
        var jobs = SiteConfigReader.Parse(Path.Combine(Path.GetTempPath(), "site.json"), Encoding.UTF8.GetBytes(json)).Jobs();
        Assert.Equal(["ch2"], jobs[0].Settings.Import.VoltageChannels);
        Assert.Equal(500, jobs[0].Settings.Import.VoltageScale);
        Assert.Equal(["U1", "U2", "U3"], jobs[1].Settings.Import.VoltageChannels);

        var e = Assert.ThrowsAny<UserInputException>(() => SiteConfigReader.Parse(Path.Combine(Path.GetTempPath(), "site.json"),
            Encoding.UTF8.GetBytes("""{ "captures": [ { "file": "a.wav", "voltage": ["U1", "U2"] } ] }""")));
        Assert.Contains("expected one voltage channel, or three", e.Message, StringComparison.Ordinal);
    }
}
