using CsCheck;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;
using WaveCheck.Core.Synthesis;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>
/// CaptureAnalysis's own paths at 2 kS/s, where a whole capture takes milliseconds (issue 18: mutation testing): the
/// voltage carried beside the current through the detection buffer and into the windows for any cut of the capture
/// into blocks, the sample-rate limits and their messages, and what <see cref="CaptureAnalysis.Complete"/> carries
/// into the result. At 2 kS/s and 50 Hz a window of 10 cycles is 400 samples and the detection buffer 4 000 samples.
/// </summary>
public class CaptureAnalysisPathTests
{
    private const double Fs = 2_000;
    private const double DurationS = 3.1;
    private const double R = 330e3;
    private const double C = 47e-9;

    private static SynthCaptureSource LeakageCapture(int phases)
    {
        var supply = new SupplyVoltage(230, 50, [], Phases: phases);
        return new SynthCaptureSource([new RcLeakageComponent(supply, 0, R, C)], Fs, DurationS, supply: supply);
    }

    // Reads the source into blocks of the given capacities in turn, each a CaptureBlock of its own (the last capacity
    // repeats), and pushes each block as it is read.
    private static AnalysisResult Run(ICaptureSource source, AnalysisOptions options, IReadOnlyList<int> capacities)
    {
        var analysis = new CaptureAnalysis(source.Info, options);
        var blocks = capacities.Select(c => source.CreateBlock(c)).ToArray();
        for (var k = 0; ; k++)
        {
            var block = blocks[Math.Min(k, blocks.Length - 1)];
            if (!source.Read(block))
            {
                break;
            }

            analysis.Push(block);
        }

        return analysis.Complete();
    }

    // The whole capture through Analyzer, the path a file takes (blocks of Analyzer.BlockSamples).
    private static AnalysisResult Analyze(double[] samples, AnalysisOptions options, double? fullScaleA = null) =>
        Analyzer.Analyze(new MemoryCaptureSource(samples, Fs, fullScaleA: fullScaleA), options);

    private static void Within1Percent(double expected, double actual, string what) =>
        Assert.True(Math.Abs(actual - expected) <= 0.01 * Math.Abs(expected), $"{what}: expected {expected:G6}, got {actual:G6}");

    [Theory]
    [InlineData(new[] { 8192 })] // one block: the detection buffer's voltage, then the rest from an offset of 4 000
    [InlineData(new[] { 150, 4100, 1000 })] // a larger block after a smaller (the voltage buffer grows); detection ends inside the second
    [InlineData(new[] { 7 })] // windows and the detection buffer end inside blocks, again and again
    [InlineData(new[] { 4000, 400, 399, 401 })] // blocks ending exactly on the detection buffer's and a window's end
    public void The_voltage_travels_with_the_current_whatever_the_blocks(int[] capacities)
    {
        // Closed form (Ohm's law and the capacitor's admittance, REFERENCE.md "Insulation"): a voltage V across R ∥ C
        // to earth drives I_R = V/R in phase and I_C = VωC leading by 90°. Any voltage sample paired with the wrong
        // current sample turns the split (one sample is 3.6° at 50 Hz and 2 kS/s, which moves I_R by
        // I_C·sin 3.6° = 0.21 mA, 30 % of its 0.70 mA), and any window without its voltage is counted.
        using var source = LeakageCapture(1);
        var split = Run(source, new AnalysisOptions(), capacities).LeakageSplit!;
        Assert.Equal("single-phase", split.Kind);
        Assert.Equal(["U"], split.VoltageChannels);
        Assert.Equal(0, split.WindowsWithoutVoltage);
        Within1Percent(230 / R, split.ResistiveA.Mean, "I_R");
        Within1Percent(230 * 2 * Math.PI * 50 * C, split.CapacitiveA.Mean, "I_C");
        Within1Percent(R, split.ResistanceOhm!.Value, "R");
        Within1Percent(C, split.CapacitanceF.Mean, "C");
    }

    [Fact]
    public void Three_phase_voltages_are_named_L1_L2_L3_whatever_their_channels_are_called()
    {
        // The three channels are called U1, U2, U3 in the capture; the split names the phases L1, L2, L3 (IEC 60445
        // phase designations, common practice, no source), and a single voltage keeps its channel's name (above).
        using var source = LeakageCapture(3);
        Assert.Equal(["U1", "U2", "U3"], source.Info.Voltage!.Names);
        var split = Run(source, new AnalysisOptions(), [1000]).LeakageSplit!;
        Assert.Equal("three-phase", split.Kind);
        Assert.Equal(["L1", "L2", "L3"], split.VoltageChannels);
        Assert.Equal("L1", split.Location!.DominantPhase);
    }

    [Fact]
    public void Any_cut_into_blocks_gives_the_same_split()
    {
        // Property (the streaming contract, CaptureAnalysis's summary): the analysis does not depend on how the
        // capture arrives. Reference: the same capture in one block. The leakage figures are sums over each window's
        // samples, which do not depend on the blocks, so they agree to rounding (1e-12 relative).
        using var whole = LeakageCapture(1);
        var expected = Run(whole, new AnalysisOptions(), [8192]).LeakageSplit!;
        Gen.Int[1, 2500].Array[1, 4].Sample(capacities =>
        {
            using var source = LeakageCapture(1);
            var split = Run(source, new AnalysisOptions(), capacities).LeakageSplit!;
            Assert.Equal(expected.ResistiveA.Mean, split.ResistiveA.Mean, 1e-12 * expected.ResistiveA.Mean);
            Assert.Equal(expected.CapacitiveA.Mean, split.CapacitiveA.Mean, 1e-12 * expected.CapacitiveA.Mean);
            Assert.Equal(0, split.WindowsWithoutVoltage);
        }, iter: 25);
    }

    [Fact]
    public void A_voltage_capture_refuses_bare_current_samples()
    {
        using var source = LeakageCapture(1);
        var analysis = new CaptureAnalysis(source.Info, new AnalysisOptions());
        var ex = Assert.Throws<InvalidOperationException>(() => analysis.Push(new double[10]));
        Assert.Contains("Push(CaptureBlock)", ex.Message, StringComparison.Ordinal);
        Assert.Equal(0, analysis.SampleCount);
    }

    [Fact]
    public void A_missing_block_is_refused_as_an_argument()
    {
        var analysis = new CaptureAnalysis(new MemoryCaptureSource(new double[10], Fs).Info, new AnalysisOptions());
        Assert.Throws<ArgumentNullException>(() => analysis.Push((CaptureBlock)null!));
    }

    [Fact]
    public void Blocks_and_bare_samples_give_the_same_result_without_a_voltage()
    {
        // The block path without a voltage hands the current on unchanged: the whole result serialises the same.
        var samples = Synth.Make(Fs, 2.5, t => (0.01 * Math.Sin(2 * Math.PI * 50 * t)) + 0.002);
        var bare = new CaptureAnalysis(new MemoryCaptureSource(samples, Fs).Info, new AnalysisOptions());
        bare.Push(samples);
        var viaBlocks = Run(new MemoryCaptureSource(samples, Fs), new AnalysisOptions(), [700]);
        Assert.Equal(ResultJson.Serialize(bare.Complete()), ResultJson.Serialize(viaBlocks));
    }

    [Fact]
    public void The_envelope_holds_every_sample()
    {
        // Closed form: the envelope's extremes are the capture's extremes, sample for sample (min and max are exact).
        var samples = Synth.Make(Fs, 2.5, t => (0.01 * Math.Sin(2 * Math.PI * 50 * t)) + (t is > 1.3 and < 1.3005 ? 0.05 : 0));
        var result = Analyze(samples, new AnalysisOptions());
        var envelope = result.Envelope;
        Assert.Equal(samples.Max(), envelope.MaxA.Max());
        Assert.Equal(samples.Min(), envelope.MinA.Min());
        Assert.Equal(samples.Length / Fs, envelope.MaxA.Count * envelope.BucketDurationS, 1e-9);
    }

    [Fact]
    public void The_highest_sample_rate_is_taken_and_one_above_it_refused()
    {
        // The limit itself is inside the range (CaptureLimits.RateRange: "... to 10 MHz"); above it the reader's own
        // message is given, not the "too low" one.
        var info = new MemoryCaptureSource(new double[10], Fs).Info;
        _ = new CaptureAnalysis(info with { SampleRateHz = CaptureLimits.MaxSampleRateHz }, new AnalysisOptions());
        var above = CaptureLimits.MaxSampleRateHz * 1.5;
        var ex = Assert.Throws<CaptureFormatException>(() =>
            new CaptureAnalysis(info with { SampleRateHz = above }, new AnalysisOptions()));
        Assert.Equal(CaptureLimits.RateProblem(above), ex.Problem);
    }

    [Theory]
    [InlineData(null, 120.0, "sample rate 120 Hz is too low to analyse: the mains frequency (up to 60 Hz) must lie below half the sample rate, so more than 120 Hz is needed")]
    [InlineData(16.7, 30.0, "sample rate 30 Hz is too low to analyse: the mains frequency (up to 16.7 Hz) must lie below half the sample rate, so more than 33.4 Hz is needed")]
    public void Too_slow_a_sample_rate_is_refused_with_the_least_it_needs(double? mainsHz, double rateHz, string problem)
    {
        // Nyquist–Shannon: the fundamental must lie below fs/2, so fs must exceed twice the highest mains frequency
        // (60 Hz when detected, else the one given).
        var info = new MemoryCaptureSource(new double[10], rateHz).Info;
        var ex = Assert.Throws<CaptureFormatException>(() => new CaptureAnalysis(info, new AnalysisOptions { MainsHz = mainsHz }));
        Assert.Equal(problem, ex.Problem);
    }

    [Theory]
    [InlineData(1, "the capture holds 1 sample (0.0005 s at 2000 Hz): too short to analyse; one window needs 400 samples (0.2 s, 10 cycles of 50 Hz)")]
    [InlineData(399, "the capture holds 399 samples (0.1995 s at 2000 Hz): too short to analyse; one window needs 400 samples (0.2 s, 10 cycles of 50 Hz)")]
    public void A_capture_shorter_than_a_window_is_refused_with_its_length(int count, string problem)
    {
        // IEC 61000-4-7: a window is 10 cycles at 50 Hz, 400 samples at 2 kS/s.
        var samples = Synth.Make(Fs, count / Fs, t => 0.01 * Math.Sin(2 * Math.PI * 50 * t));
        Assert.Equal(count, samples.Length);
        var analysis = new CaptureAnalysis(new MemoryCaptureSource(samples, Fs).Info, new AnalysisOptions { MainsHz = 50 });
        analysis.Push(samples);
        var ex = Assert.Throws<CaptureFormatException>(() => analysis.Complete());
        Assert.Equal(problem, ex.Problem);
    }

    [Fact]
    public void Complete_carries_the_readers_description_and_warnings_first()
    {
        // A capture of smooth DC alone has no mains to find: the fallback warning follows the reader's warnings.
        var samples = Enumerable.Repeat(0.004, 5_000).ToArray();
        var source = new MemoryCaptureSource(samples, Fs);
        var analysis = new CaptureAnalysis(source.Info, new AnalysisOptions());
        analysis.Push(samples);
        var final = source.Info with { SampleCount = samples.Length, FilePath = "final" };
        var fromReader = new CaptureWarning("reader-note", "from the reader");
        var result = analysis.Complete(final, [fromReader]);
        Assert.Same(final, result.Capture);
        Assert.Equal(fromReader, result.Warnings[0]);
        Assert.Equal("mains-fallback", result.Warnings[1].Code);

        var plain = new CaptureAnalysis(source.Info, new AnalysisOptions());
        plain.Push(samples);
        Assert.Same(source.Info, plain.Complete().Capture);
    }

    [Theory]
    [InlineData(1.5, 1.7, 0.2)] // 1.5 s = 75 cycles, a half-cycle boundary; 20 half-cycles
    [InlineData(2.5, 3.0, 0.5)] // still open at the end of the capture (3 s): closed with it
    public void Half_cycle_episodes_are_placed_at_their_time_in_seconds(double fromS, double toS, double durationS)
    {
        // A 30 mA RMS burst on a 2 mA sine: the episode at the 15 mA level starts where the burst does and lasts as
        // long (HalfCycleEpisodeDetector's half-cycles are whole, the burst begins on a zero crossing).
        var samples = Synth.Make(Fs, 3, t =>
            (t >= fromS && t < toS ? 0.030 : 0.002) * Math.Sqrt(2) * Math.Sin(2 * Math.PI * 50 * t));
        var result = Analyze(samples, new AnalysisOptions { MainsHz = 50, HalfCycleLevelsA = [0.015] });
        var episode = Assert.Single(result.HalfCycleEpisodes!.Episodes);
        Assert.Equal(fromS, episode.StartS, 1e-9);
        Assert.Equal(durationS, episode.DurationS, 1e-9);
    }

    [Fact]
    public void Missing_capture_description_or_options_are_refused_as_arguments()
    {
        var info = new MemoryCaptureSource(new double[10], Fs).Info;
        Assert.Equal("info", Assert.Throws<ArgumentNullException>(() => new CaptureAnalysis(null!, new AnalysisOptions())).ParamName);
        Assert.Equal("options", Assert.Throws<ArgumentNullException>(() => new CaptureAnalysis(info, null!)).ParamName);
    }

    [Fact]
    public void The_tail_after_the_last_window_is_in_the_summary_and_named_in_a_warning()
    {
        // 6 200 samples at 2 kS/s and 50 Hz: 15 windows of 400 samples, then a tail of 200 samples (0.1 s from 3.0 s)
        // held at 20 mA. The windows hold 150 whole cycles of a 10 mA sine, whose samples sum to zero (closed form:
        // Σ sin(2πk/40) over whole periods is 0), so the capture's mean is 20 mA · 200/6 200 and its mean square
        // (0.01²/2 · 6 000 + 0.02² · 200)/6 200. Tolerance 1e-12 A (rounding of the sums).
        var samples = Synth.Make(Fs, 3.1, t => t < 3.0 ? 0.01 * Math.Sin(2 * Math.PI * 50 * t) : 0.02);
        var analysis = new CaptureAnalysis(new MemoryCaptureSource(samples, Fs).Info, new AnalysisOptions { MainsHz = 50 });
        analysis.Push(samples);
        var result = analysis.Complete();
        Assert.Equal(15, analysis.WindowCount);
        Assert.Equal(15, result.Windows.Count);
        Assert.Equal(0.02 * 200 / 6200, result.Summary.DcA, 1e-12);
        Assert.Equal(Math.Sqrt(((0.01 * 0.01 / 2 * 6000) + (0.02 * 0.02 * 200)) / 6200), result.Summary.RmsA, 1e-12);
        var partial = Assert.Single(result.Warnings, w => w.Code == "partial-window");
        Assert.Equal("the last 0.1 s (200 samples) after the last complete window are not analysed as a window; they are in the summary and the envelope", partial.Message);
        Assert.Equal(3.0, partial.TimeS!.Value, 1e-12);
    }

    [Fact]
    public void A_capture_of_whole_windows_has_no_tail_warning()
    {
        var samples = Synth.Make(Fs, 3.0, t => 0.01 * Math.Sin(2 * Math.PI * 50 * t));
        var analysis = new CaptureAnalysis(new MemoryCaptureSource(samples, Fs).Info, new AnalysisOptions { MainsHz = 50 });
        Assert.Equal(0, analysis.WindowCount);
        analysis.Push(samples);
        var result = analysis.Complete();
        Assert.Equal(15, analysis.WindowCount);
        Assert.DoesNotContain(result.Warnings, w => w.Code == "partial-window");
    }

    [Fact]
    public void Every_window_is_reported_to_the_caller_once_in_time_order()
    {
        var samples = Synth.Make(Fs, 3.1, t => 0.01 * Math.Sin(2 * Math.PI * 50 * t));
        var starts = new List<double>();
        var result = Analyze(samples, new AnalysisOptions { MainsHz = 50, WindowCompleted = w => starts.Add(w.StartS) });
        Assert.Equal(result.Windows.Count, starts.Count);
        Assert.Equal(15, starts.Count);
        for (var k = 0; k < starts.Count; k++)
        {
            Assert.Equal(k * 0.2, starts[k], 1e-12);
        }
    }

    [Fact]
    public void Clipped_stretches_beyond_the_listed_ones_are_counted()
    {
        // 44 windows, every other one holding one sample at the full scale of 50 mA: 22 clipped stretches, of which
        // EventDetector.MaxClippingWarnings (20) are listed and the other 2 counted.
        var samples = Synth.Make(Fs, 8.8, t => 0.01 * Math.Sin(2 * Math.PI * 50 * t));
        for (var w = 0; w < 44; w += 2)
        {
            samples[(w * 400) + 100] = 0.05;
        }

        var result = Analyze(samples, new AnalysisOptions { MainsHz = 50 }, fullScaleA: 0.05);
        var clipping = result.Warnings.Where(w => w.Code == "clipping").ToList();
        Assert.Equal(EventDetector.MaxClippingWarnings + 1, clipping.Count);
        Assert.Equal("2 more clipped stretches not listed", clipping[^1].Message);
    }

    [Theory]
    [InlineData(1000.0, false)] // the band's upper end at exactly fs/2: all of it is seen
    [InlineData(1000.5, true)]
    public void The_band_limit_warning_starts_above_half_the_sample_rate(double upperHz, bool warned)
    {
        // Nyquist–Shannon: a capture at fs sees up to fs/2.
        var samples = Synth.Make(Fs, 2.5, t => 0.01 * Math.Sin(2 * Math.PI * 50 * t));
        var result = Analyze(samples, new AnalysisOptions { MainsHz = 50, HighBandUpperHz = upperHz });
        var warnings = result.Warnings.Where(w => w.Code == "band-limit").ToList();
        Assert.Equal(warned ? 1 : 0, warnings.Count);
        if (warned)
        {
            Assert.StartsWith("nothing above 1000 Hz is seen (sample rate 2000 S/s)", warnings[0].Message, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void The_result_names_the_tool_version_that_made_it()
    {
        // The version of the assembly that measured (AnalysisResult.ToolVersion), major.minor.patch, never the
        // placeholder for an assembly without one.
        var samples = Synth.Make(Fs, 2.5, t => 0.01 * Math.Sin(2 * Math.PI * 50 * t));
        var result = Analyze(samples, new AnalysisOptions());
        var version = typeof(CaptureAnalysis).Assembly.GetName().Version!;
        Assert.Equal($"{version.Major}.{version.Minor}.{version.Build}", result.ToolVersion);
    }
}
