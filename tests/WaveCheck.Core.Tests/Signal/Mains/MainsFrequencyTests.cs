using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class MainsFrequencyTests
{
    private const double Fs = 10_000;

    private static AnalysisResult Analyze(double[] samples, double? mainsHz = null) =>
        Analyzer.Analyze(new MemoryCaptureSource(samples, Fs), new AnalysisOptions { MainsHz = mainsHz });

    [Theory]
    [InlineData(49.5, 50)]
    [InlineData(50.0, 50)]
    [InlineData(50.5, 50)]
    [InlineData(59.7, 60)]
    [InlineData(60.0, 60)]
    public void TracksSyntheticMainsWithinAHundredthOfAHertz(double frequencyHz, double nominalHz)
    {
        // Closed form: a 10 s half-wave-rectified current on smooth DC with 1 % noise; every window's frequency and
        // the mean within 0.01 Hz (the brief's tracking requirement).
        var random = new Random(1);
        var samples = Synth.Make(Fs, 10, t => 0.002 + Synth.PhaseCut(t, frequencyHz, 0.02, 0) + (0.0002 * Synth.Gaussian(random)));
        var result = Analyze(samples);
        Assert.Equal("detected", result.Mains.Source);
        Assert.Equal(nominalHz, result.Mains.NominalHz);
        Assert.Equal(frequencyHz, result.Mains.FrequencyHz, 0.01);
        Assert.InRange(result.Mains.MinHz, frequencyHz - 0.01, frequencyHz + 0.01);
        Assert.InRange(result.Mains.MaxHz, frequencyHz - 0.01, frequencyHz + 0.01);
        Assert.Equal(nominalHz == 50 ? 10 : 12, result.Windows.CyclesPerWindow);
        // Window length is a whole number of samples: at most half a sample off exact cycles (IEC 61000-4-7 sync).
        Assert.InRange(result.Windows.MaxSyncErrorPercent, 0, 0.5 / (Fs * result.Windows.LengthS) * 100 * 1.1);
    }

    [Fact]
    public void FollowsAFrequencyStep()
    {
        // A 50.0 → 50.4 Hz step at 5 s (continuous phase): windows starting 0.5 s after the step read 50.4 ± 0.01 Hz.
        // Closed form of the window count: 10 cycles each, so 0.2 s before the step (25 windows, 24 of them ending
        // before 5.0 s) and 10/50.4 = 0.19841 s after it: ⌊5/0.19841⌋ = 25 more, 50 in all, of which those starting
        // after 5.5 s number ⌊(10 − 5.5)/0.19841⌋ = 22; together they cover the 10 s but for less than one window.
        // Without these counts the test would pass on an analysis that sends no window.
        var samples = Synth.FrequencyStep(Fs, 10, 50.0, 50.4, 5.0, 0.01);
        var windows = new List<WindowResult>();
        var options = new AnalysisOptions { WindowCompleted = windows.Add };
        Analyzer.Analyze(new MemoryCaptureSource(samples, Fs), options);
        var before = windows.Where(w => w.StartS + w.DurationS < 5.0).ToList();
        var after = windows.Where(w => w.StartS > 5.5).ToList();
        Assert.Equal(50, windows.Count);
        Assert.Equal(24, before.Count);
        Assert.Equal(22, after.Count);
        Assert.InRange(windows.Sum(w => w.DurationS), 10 - 0.2, 10);
        Assert.All(before, w => Assert.Equal(50.0, w.FrequencyHz, 0.01));
        Assert.All(after, w => Assert.Equal(50.4, w.FrequencyHz, 0.01));
    }

    [Fact]
    public void FallsBackOnPureDc()
    {
        // No mains content: nominal 50 Hz, source fallback, a warning.
        var result = Analyze(Synth.Make(Fs, 3, _ => 0.006));
        Assert.Equal("fallback", result.Mains.Source);
        Assert.Equal(50, result.Mains.FrequencyHz);
        Assert.Contains(result.Warnings, w => w.Code == "mains-fallback");
    }

    [Fact]
    public void FallsBackOnMotorFrequencyOnly()
    {
        // A 10 Hz motor-frequency current has nothing near 50 or 60 Hz.
        var result = Analyze(Synth.Make(Fs, 3, t => 0.01 * Math.Sin(2 * Math.PI * 10 * t)));
        Assert.Equal("fallback", result.Mains.Source);
        Assert.Contains(result.Warnings, w => w.Code == "mains-fallback");
    }

    [Fact]
    public void FallsBackOnNoise()
    {
        var random = new Random(5);
        var result = Analyze(Synth.Make(Fs, 3, _ => 0.001 * Synth.Gaussian(random)));
        Assert.Equal("fallback", result.Mains.Source);
    }

    [Fact]
    public void GivenNominalIsStillTracked()
    {
        // --mains 60 with a 59.8 Hz current: nominal 60, source given, tracked within 0.01 Hz.
        var result = Analyze(Synth.Make(Fs, 4, t => 0.01 * Math.Sin(2 * Math.PI * 59.8 * t)), 60);
        Assert.Equal("given", result.Mains.Source);
        Assert.Equal(60, result.Mains.NominalHz);
        Assert.Equal(59.8, result.Mains.FrequencyHz, 0.01);
    }

    [Fact]
    public void GivenNominalWithoutMainsContentFallsBackToIt()
    {
        var result = Analyze(Synth.Make(Fs, 3, _ => 0.006), 60);
        Assert.Equal("fallback", result.Mains.Source);
        Assert.Equal(60, result.Mains.NominalHz);
        Assert.Equal(12, result.Windows.CyclesPerWindow);
    }
}
