using WaveCheck.Core;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class CaptureAnalysisTests
{
    private const double Fs = 50_000;
    private const double F = 50;

    private static AnalysisResult Analyze(double[] samples, AnalysisOptions? options = null,
        SensorCoupling sensor = SensorCoupling.Dc, double? fullScaleA = null) =>
        Analyzer.Analyze(new MemoryCaptureSource(samples, Fs, sensor, fullScaleA: fullScaleA), options ?? new AnalysisOptions());

    [Fact]
    public void SineRmsIsPeakOverRootTwo()
    {
        // Closed form: RMS = Ipk/√2, mean 0, crest √2; all of it in harmonic group 1. 0.2 % of reading.
        var result = Analyze(Synth.Make(Fs, 2, t => 0.02 * Math.Sin(2 * Math.PI * F * t)));
        var rms = 0.02 / Math.Sqrt(2);
        Assert.Equal(rms, result.Summary.RmsA, 0.002 * rms);
        Assert.Equal(0, result.Summary.DcA, 1e-6);
        Assert.Equal(Math.Sqrt(2), result.Summary.CrestFactor, 0.002);
        Assert.Equal(rms, result.Components.MainsRmsA, 0.002 * rms);
        Assert.Equal(rms, result.Harmonics[0].RmsA, 0.002 * rms);
        Assert.Equal(10, result.Windows.Count);
        Assert.Equal(0, result.Components.HarmonicsRmsA, 1e-6 * rms);
        Assert.False(result.Components.PulsatingDc);
    }

    [Fact]
    public void HalfWaveMatchesItsFourierSeries()
    {
        // Closed form (half-wave rectified sine): mean Ipk/π, RMS Ipk/2, fundamental Ipk/2 peak, even orders
        // 2Ipk/(π(n²−1)) peak, odd orders above 1 zero. 0.2 % of reading; 0.1 % of Ipk for the small orders.
        const double ipk = 0.03;
        var result = Analyze(Synth.Make(Fs, 2, t => Synth.PhaseCut(t, F, ipk, 0)));
        Assert.Equal(ipk / Math.PI, result.Summary.DcA, 0.002 * ipk / Math.PI);
        Assert.Equal(ipk / 2, result.Summary.RmsA, 0.002 * ipk / 2);
        Assert.Equal(ipk / 2 / Math.Sqrt(2), result.Harmonics[0].RmsA, 0.002 * ipk / 2);
        for (var n = 2; n <= 50; n++)
        {
            var expected = n % 2 == 0 ? 2 * ipk / (Math.PI * ((n * n) - 1)) / Math.Sqrt(2) : 0;
            Assert.Equal(expected, result.Harmonics[n - 1].RmsA, 0.001 * ipk);
        }

        Assert.True(result.Components.PulsatingDc);
        Assert.Equal(0, result.Components.SmoothDcA, 1e-9);
        Assert.Equal(0, result.Components.CurrentDelayAngleDeg!.Value, 0.5);
    }

    [Fact]
    public void OddLengthWindowsGiveTheSameFourierSeries()
    {
        // 49.776 Hz at 10 kS/s: windows of 2009 samples (odd), whose spectra are computed two at a time.
        // Closed form as in HalfWaveMatchesItsFourierSeries; 0.1 % of Ipk (the window is 0.0003 % off whole cycles).
        const double ipk = 0.03;
        var samples = Synth.Make(10_000, 3, t => Synth.PhaseCut(t, 49.776, ipk, 0));
        var result = Analyzer.Analyze(new MemoryCaptureSource(samples, 10_000), new AnalysisOptions());
        Assert.Equal(1, result.WorstWindow.SamplesA.Count % 2);
        Assert.Equal(ipk / 2 / Math.Sqrt(2), result.Harmonics[0].RmsA, 0.001 * ipk);
        for (var n = 2; n <= 20; n++)
        {
            var expected = n % 2 == 0 ? 2 * ipk / (Math.PI * ((n * n) - 1)) / Math.Sqrt(2) : 0;
            Assert.Equal(expected, result.Harmonics[n - 1].RmsA, 0.001 * ipk);
        }
    }

    [Theory]
    [InlineData(90)]
    [InlineData(135)]
    public void PhaseControlledHalfWaveMeanAndRms(double alphaDeg)
    {
        // Closed form: mean Ipk(1 + cos α)/(2π), RMS² = Ipk²((π − α)/2 + sin 2α/4)/(2π). 0.2 % of reading plus one
        // sample of the firing step (see WaveformShapeTests).
        const double ipk = 0.03;
        var alpha = alphaDeg * Math.PI / 180;
        var result = Analyze(Synth.Make(Fs, 2, t => Synth.PhaseCut(t, F, ipk, alpha)));
        var mean = ipk * (1 + Math.Cos(alpha)) / (2 * Math.PI);
        var rms = ipk * Math.Sqrt((((Math.PI - alpha) / 2) + (Math.Sin(2 * alpha) / 4)) / (2 * Math.PI));
        var step = ipk * Math.Sin(alpha);
        Assert.Equal(mean, result.Summary.DcA, (0.002 * mean) + (step / 1000));
        Assert.Equal(rms, result.Summary.RmsA, (0.002 * rms) + (step / Math.Sqrt(1000) * 0.02));
        Assert.Equal(alphaDeg, result.Components.CurrentDelayAngleDeg!.Value, 0.5);
    }

    [Fact]
    public void RmsAndDcBetterThanPointTwoPercent()
    {
        // Closed form with orthogonal parts (Parseval): 5 mA DC + 10 mA rms at 50 Hz + 2 mA rms at 1 kHz + 1 mA rms at
        // 12 kHz: RMS² = Σ RMS_i². Components: above 1 kHz holds only the 12 kHz tone (1 kHz itself is harmonic 20,
        // not above), above 9 kHz the same; the 12 kHz tone is reported among tones.
        var result = Analyze(Synth.Make(Fs, 3, t => 0.005 + (0.01 * Math.Sqrt(2) * Math.Sin(2 * Math.PI * F * t))
            + (0.002 * Math.Sqrt(2) * Math.Sin(2 * Math.PI * 1000 * t)) + (0.001 * Math.Sqrt(2) * Math.Sin(2 * Math.PI * 12030 * t))));
        var rms = Math.Sqrt((0.005 * 0.005) + (0.01 * 0.01) + (0.002 * 0.002) + (0.001 * 0.001));
        Assert.Equal(rms, result.Summary.RmsA, 0.002 * rms);
        Assert.Equal(0.005, result.Summary.DcA, 0.002 * 0.005);
        Assert.Equal(0.005, result.Components.SmoothDcA, 0.002 * 0.005);
        Assert.Equal(0.01, result.Components.MainsRmsA, 0.002 * 0.01);
        Assert.Equal(0.002, result.Harmonics[19].RmsA, 0.002 * 0.002);
        Assert.Equal(0.001, result.Components.Above1kHzRmsA, 0.002 * 0.001);
        Assert.Equal(0.001, result.Components.Above9kHzRmsA, 0.002 * 0.001);
        Assert.Equal(20, result.Components.ThdPercent!.Value, 0.05);
        var tone = Assert.Single(result.Components.Tones);
        Assert.Equal(12030, tone.FrequencyHz, 0.5);
        Assert.Equal(0.001, tone.RmsA, 0.002 * 0.001);
        var band = Assert.Single(result.Bands, b => b.LowHz < 12030 && b.HighHz >= 12030);
        Assert.Equal(0.001, band.RmsA, 0.002 * 0.001);
    }

    [Fact]
    public void MotorFrequencyIsBelowMains()
    {
        // 10 Hz (bin 2 of 5 Hz) lies below the fundamental's group: closed form RMS 3 mA.
        var result = Analyze(Synth.Make(Fs, 2, t => (0.01 * Math.Sin(2 * Math.PI * F * t)) + (0.003 * Math.Sqrt(2) * Math.Sin(2 * Math.PI * 10 * t))));
        Assert.Equal(0.003, result.Components.BelowMainsRmsA, 0.002 * 0.003);
        Assert.Contains(result.Components.Tones, t => Math.Abs(t.FrequencyHz - 10) < 0.5);
    }

    [Theory]
    [InlineData(1000)]
    [InlineData(4097)]
    public void ResultDoesNotDependOnBlockSize(int blockSize)
    {
        // Streaming equivalence: the same capture pushed in blocks of 65 536 and of another size gives equal figures.
        var random = new Random(9);
        var samples = Synth.Make(Fs, 3, t => 0.004 + Synth.PhaseCut(t, 50.2, 0.02, 1) + (0.0003 * Synth.Gaussian(random)));
        var info = new MemoryCaptureSource(samples, Fs).Info;
        var big = new CaptureAnalysis(info, new AnalysisOptions());
        var small = new CaptureAnalysis(info, new AnalysisOptions());
        for (var i = 0; i < samples.Length; i += 65536)
        {
            big.Push(samples.AsSpan(i, Math.Min(65536, samples.Length - i)));
        }

        for (var i = 0; i < samples.Length; i += blockSize)
        {
            small.Push(samples.AsSpan(i, Math.Min(blockSize, samples.Length - i)));
        }

        var a = big.Complete();
        var b = small.Complete();
        Assert.Equal(a.Windows.Count, b.Windows.Count);
        Assert.Equal(a.Mains, b.Mains);
        Assert.Equal(a.Summary.RmsA, b.Summary.RmsA, 1e-12);
        Assert.Equal(a.Summary.PeakA, b.Summary.PeakA);
        Assert.Equal(a.Components.SmoothDcA, b.Components.SmoothDcA, 1e-15);
        for (var n = 0; n < a.Harmonics.Count; n++)
        {
            Assert.Equal(a.Harmonics[n].RmsA, b.Harmonics[n].RmsA, 1e-15);
        }

        Assert.Equal(a.Envelope.MaxA, b.Envelope.MaxA);
        Assert.Equal(ResultJson.Serialize(a.Windows), ResultJson.Serialize(b.Windows));
    }

    [Fact]
    public void AlarmWindowsMergeAndTransientsAreFound()
    {
        // 10 mA rms, 25 mA rms from 1.0 s to 1.6 s (three windows), an 80 mA spike at 2.5 s (8 times the RMS, above the default factor 6).
        var samples = Synth.Make(Fs, 3, t => (t >= 1.0 && t < 1.6 ? 0.025 : 0.01) * Math.Sqrt(2) * Math.Sin(2 * Math.PI * F * t));
        samples[(int)(2.5 * Fs) + 3] = 0.08;
        var result = Analyze(samples, new AnalysisOptions { AlarmA = 0.02 });
        var alarm = Assert.Single(result.Events, e => e.Kind == "alarm");
        Assert.Equal(1.0, alarm.StartS, 1e-9);
        Assert.Equal(0.6, alarm.DurationS, 1e-9);
        Assert.Equal(0.025, alarm.ValueA, 0.002 * 0.025);
        var transient = Assert.Single(result.Events, e => e.Kind == "transient");
        Assert.Equal(2.5 + (3 / Fs), transient.StartS, 1e-9);
        Assert.Equal(0.08, transient.ValueA);
        Assert.True(result.Events[0].StartS <= result.Events[1].StartS);
    }

    [Fact]
    public void WarnsAboutWhatItCannotSee()
    {
        // 2.1 s at 50 Hz: ten windows and a 0.1 s tail; unknown sensor; Nyquist 25 kHz < 150 kHz; clipping at 15 mA.
        var samples = Synth.Make(Fs, 2.1, t => Math.Clamp(0.02 * Math.Sin(2 * Math.PI * F * t), -0.015, 0.015));
        var result = Analyze(samples, sensor: SensorCoupling.Unknown, fullScaleA: 0.015);
        Assert.Contains(result.Warnings, w => w.Code == "partial-window" && w.Message.Contains("5000 samples"));
        Assert.Contains(result.Warnings, w => w.Code == "band-limit" && w.Message.Contains("25000 Hz"));
        Assert.Contains(result.Warnings, w => w.Code == "dc-unknown");
        var clip = Assert.Single(result.Warnings, w => w.Code == "clipping");
        Assert.Equal(0, clip.TimeS);
        Assert.All(result.Trend, w => Assert.True(w.Clipped));
        var blind = Analyze(samples, sensor: SensorCoupling.Ac);
        Assert.Contains(blind.Warnings, w => w.Code == "dc-blind");
    }

    [Fact]
    public void ShortCaptureIsRefusedWithTheLengthFoundAndNeeded()
    {
        // IEC 61000-4-7: one window is 10 cycles at 50 Hz = 200 ms = 10 000 samples at 50 kS/s; 50 ms holds 2 500.
        var samples = Synth.Make(Fs, 0.05, t => 0.01 * Math.Sin(2 * Math.PI * F * t));
        var ex = Assert.Throws<CaptureFormatException>(() => Analyze(samples));
        Assert.Contains("holds 2500 samples (0.05 s", ex.Message);
        Assert.Contains("one window needs 10000 samples (0.2 s, 10 cycles of 50 Hz)", ex.Message);
    }

    [Fact]
    public void EmptyCaptureIsRefused()
    {
        var ex = Assert.Throws<CaptureFormatException>(() => Analyze([]));
        Assert.Contains("holds 0 samples", ex.Message);
    }

    [Theory]
    [InlineData(1.0, null)]
    [InlineData(120.0, null)]
    [InlineData(800.0, 400.0)]
    public void RateTooLowForTheMainsIsRefusedBeforeAnyWindow(double fs, double? mainsHz)
    {
        // Nyquist: a fundamental at f needs a rate above 2f (60 Hz is the highest detected; 400 Hz when given).
        var samples = new double[(int)(fs * 5)];
        var ex = Assert.Throws<CaptureFormatException>(() =>
            Analyzer.Analyze(new MemoryCaptureSource(samples, fs), new AnalysisOptions { MainsHz = mainsHz }));
        Assert.Contains("too low to analyse", ex.Message);
    }

    [Fact]
    public void RateJustAboveTwiceTheMainsIsAnalysedWithoutHanging()
    {
        // 121 S/s against the 120 S/s floor: windows of round(10 · 121 / 50) = 24 samples (the window rule above).
        var result = Analyze2(Synth.Make(121, 3, t => 0.01 * Math.Sin(2 * Math.PI * F * t)), 121);
        Assert.True(result.Windows.Count > 0);
    }

    private static AnalysisResult Analyze2(double[] samples, double fs) =>
        Analyzer.Analyze(new MemoryCaptureSource(samples, fs), new AnalysisOptions());

    [Fact]
    public void WorstWindowIsTheOneWithHighestRms()
    {
        var samples = Synth.Make(Fs, 2, t => (t >= 0.8 && t < 1.0 ? 0.03 : 0.01) * Math.Sin(2 * Math.PI * F * t));
        var result = Analyze(samples);
        Assert.Equal(0.8, result.WorstWindow.StartS, 1e-9);
        Assert.Equal(10000, result.WorstWindow.SamplesA.Count);
        Assert.Equal(0.8, result.Windows.Statistics["rmsA"].TimeOfMaxS, 1e-9);
        Assert.Equal(0.03 / Math.Sqrt(2), result.Windows.Statistics["rmsA"].Max, 0.002 * 0.03);
    }

    [Fact]
    public void The_worst_window_carries_its_own_figures_even_when_the_trend_is_decimated()
    {
        // 30 minutes at 1 kS/s are 9000 windows, more than the trend table's 2000 rows: its rows are merged windows.
        // One second (t = 600 to 601 s, five windows) carries a 20 mA sine on 5 mA DC; the rest a 10 mA sine.
        const double fs = 1000;
        var samples = Synth.Make(fs, 1800, t => t >= 600 && t < 601
            ? 0.005 + (0.020 * Math.Sin(2 * Math.PI * F * t))
            : 0.010 * Math.Sin(2 * Math.PI * F * t));
        var result = Analyzer.Analyze(new MemoryCaptureSource(samples, fs), new AnalysisOptions { MainsHz = F });
        Assert.True(result.Trend.Count < result.Windows.Count, "the trend table must be decimated for this test");
        var worst = result.WorstWindow;
        var figures = Assert.IsType<WindowResult>(worst.Figures);
        Assert.InRange(worst.StartS, 600 - 1e-9, 600.8 + 1e-9); // a window wholly inside the loud second
        Assert.Equal(worst.StartS, figures.StartS);

        // The figures are those of the samples carried: RMS, mean and extremes by their definitions.
        var x = worst.SamplesA;
        var sumSq = 0.0;
        foreach (var v in x)
        {
            sumSq += v * v;
        }

        Assert.Equal(Math.Sqrt(sumSq / x.Count), figures.RmsA, 1e-12);
        Assert.Equal(x.Average(), figures.DcA, 1e-12);
        Assert.Equal(x.Max(), figures.PeakPositiveA);
        Assert.Equal(x.Min(), figures.PeakNegativeA);
        // Closed form: a 20 mA-peak sine on 5 mA DC has RMS √(5² + 20²/2) mA, harmonic group 1 = 20/√2 mA.
        Assert.Equal(Math.Sqrt((0.005 * 0.005) + (0.020 * 0.020 / 2)), figures.RmsA, 1e-4);
        Assert.Equal(0.020 / Math.Sqrt(2), figures.MainsRmsA, 1e-4);
        Assert.Equal(0.005, figures.DcA, 1e-4);
    }

    [Fact]
    public void StatisticsCoverEveryWindowMetric()
    {
        var result = Analyze(Synth.Make(Fs, 1, t => 0.01 * Math.Sin(2 * Math.PI * F * t)));
        foreach (var name in new[] { "frequencyHz", "rmsA", "dcA", "acRmsA", "peakPositiveA", "peakNegativeA", "crestFactor",
                     "smoothDcA", "currentDelayAngleDeg", "mainsRmsA", "belowMainsRmsA", "harmonicsRmsA",
                     "above1kHzRmsA", "above9kHzRmsA", "thdPercent" })
        {
            Assert.True(result.Windows.Statistics.ContainsKey(name), name);
        }

        // Signed metric: the negative peak's maximum is the most negative value.
        Assert.Equal(-0.01, result.Windows.Statistics["peakNegativeA"].Max, 1e-6);
    }

    [Fact]
    public void SerialisesUnderTheAnalysisContract()
    {
        // Contract (AnalysisResult): schema wavecheck.analysis/1, camelCase, statistics keyed by WindowResult names;
        // a metric never measured (delay angle of a sine) serialises as null, not NaN.
        var result = Analyze(Synth.Make(Fs, 1, t => 0.01 * Math.Sin(2 * Math.PI * F * t)));
        using var json = System.Text.Json.JsonDocument.Parse(ResultJson.Serialize(result));
        var root = json.RootElement;
        Assert.Equal("wavecheck.analysis/1", root.GetProperty("schema").GetString());
        Assert.Equal("detected", root.GetProperty("mains").GetProperty("source").GetString());
        var angle = root.GetProperty("windows").GetProperty("statistics").GetProperty("currentDelayAngleDeg");
        Assert.Equal(System.Text.Json.JsonValueKind.Null, angle.GetProperty("mean").ValueKind);
        Assert.Equal(50, root.GetProperty("harmonics").GetArrayLength());
        Assert.Equal(result.Bands.Count, root.GetProperty("bands").GetArrayLength());
    }

    [Theory]
    [InlineData(1_000)]
    [InlineData(400_000)]
    public void LowAndHighSampleRatesWork(double fs)
    {
        // Closed form as in SineRmsIsPeakOverRootTwo. At 1 kS/s only orders up to 9 fit below Nyquist (the rest are
        // null in JSON: not seen); at 400 kS/s the 2 kHz bands run to 150 kHz.
        var samples = Synth.Make(fs, 1, t => 0.02 * Math.Sin(2 * Math.PI * F * t));
        var result = Analyzer.Analyze(new MemoryCaptureSource(samples, fs, SensorCoupling.Dc), new AnalysisOptions());
        Assert.Equal(0.02 / Math.Sqrt(2), result.Components.MainsRmsA, 0.002 * 0.02);
        Assert.Equal(50, result.Mains.FrequencyHz, 0.01);
        if (fs < 2000)
        {
            Assert.Empty(result.Bands);
            Assert.True(double.IsNaN(result.Harmonics[20].RmsA));
        }
        else
        {
            Assert.Equal(150_000, result.Bands[^1].HighHz);
            Assert.Equal(35 + 71, result.Bands.Count);
            Assert.DoesNotContain(result.Warnings, w => w.Code == "band-limit");
        }
    }

    [Fact]
    public void RejectsBadOptions()
    {
        var info = new MemoryCaptureSource([0.0], Fs).Info;
        var ex = Assert.Throws<OptionValueException>(() => new CaptureAnalysis(info, new AnalysisOptions { AlarmA = -1 }));
        Assert.Contains("AlarmA", ex.Message);
        Assert.Throws<OptionValueException>(() => new CaptureAnalysis(info, new AnalysisOptions { MainsHz = 0.1 }));
    }

    [Fact]
    public void SinksSeeEverySample()
    {
        var sink = new CountingSink();
        Analyze(Synth.Make(Fs, 0.7, _ => 0.001), new AnalysisOptions { Sinks = [sink] });
        Assert.Equal(35000, sink.Count);
        Assert.Equal(35000 * 0.001, sink.Sum, 1e-9);
    }

    private sealed class CountingSink : ISampleSink
    {
        public long Count { get; private set; }

        public double Sum { get; private set; }

        public void Push(ReadOnlySpan<double> samplesA)
        {
            Count += samplesA.Length;
            foreach (var x in samplesA)
            {
                Sum += x;
            }
        }
    }
}
