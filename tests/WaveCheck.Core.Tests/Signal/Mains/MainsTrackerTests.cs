using WaveCheck.Core.Capture;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class MainsTrackerTests
{
    private const double Fs = 10_000;

    // Cuts windows of 10 cycles of the frequency tracked so far (as the analysis does) and tracks each; returns each
    // window's start and the frequency tracked after it.
    private static List<(double StartS, double Hz)> TrackThrough(MainsTracker tracker, double[] samples)
    {
        var tracked = new List<(double, double)>();
        long start = 0;
        while (true)
        {
            var length = (int)Math.Round(10 * Fs / tracker.FrequencyHz);
            if (start + length > samples.Length)
            {
                return tracked;
            }

            var w = samples.AsSpan((int)start, length);
            var (sum, squares, _, _) = SampleMath.Moments(w);
            var mean = sum / length;
            var ac = Math.Sqrt(Math.Max(0, (squares / length) - (mean * mean)));
            tracked.Add((start / Fs, tracker.Track(w, start, mean, ac)));
            start += length;
        }
    }

    [Fact]
    public void FollowsAFrequencyStepWindowByWindow()
    {
        // Closed form: a sine at 50.0 Hz, then 50.4 Hz from 3 s (continuous phase). Every window wholly before the
        // step reads 50.0 Hz and every window starting 0.5 s after it 50.4 Hz, within 0.01 Hz (the tracking
        // requirement, as in MainsFrequencyTests).
        var samples = Synth.FrequencyStep(Fs, 6, 50.0, 50.4, 3.0, 0.01);
        var tracker = MainsTracker.Start(samples.AsSpan(0, 20_000), Fs, new AnalysisOptions(), "step.wav");
        Assert.True(tracker.Detection.Found);
        Assert.Equal(50, tracker.NominalHz);
        Assert.Null(tracker.Warning);
        var tracked = TrackThrough(tracker, samples);
        Assert.All(tracked.Where(t => t.StartS + 0.2 <= 3.0), t => Assert.Equal(50.0, t.Hz, 0.01));
        Assert.All(tracked.Where(t => t.StartS >= 3.5), t => Assert.Equal(50.4, t.Hz, 0.01));
        Assert.Contains(tracked, t => t.StartS >= 3.5);
    }

    [Fact]
    public void AWindowWithoutAFundamentalLeavesTheFrequencyAndBreaksThePhaseChain()
    {
        // After tracking a 50.3 Hz sine, a silent window (no fundamental: the phase is undefined) keeps the frequency,
        // and so does the next strong window, which has no strong window before it to compare its phase with.
        var sine = Synth.Make(Fs, 3, t => 0.01 * Math.Sin(2 * Math.PI * 50.3 * t));
        var tracker = MainsTracker.Start(sine.AsSpan(0, 20_000), Fs, new AnalysisOptions(), "gap.wav");
        var hz = TrackThrough(tracker, sine)[^1].Hz;
        Assert.Equal(50.3, hz, 0.01);
        var length = (int)Math.Round(10 * Fs / hz);
        Assert.Equal(hz, tracker.Track(new double[length], 30_000, 0, 0));
        var shifted = Synth.Make(Fs, 0.5, t => 0.01 * Math.Sin((2 * Math.PI * 50.3 * t) + 1.0));
        Assert.Equal(hz, tracker.Track(shifted.AsSpan(0, length), 30_000 + length, 0, 0.01 / Math.Sqrt(2)));
    }

    [Fact]
    public void WithoutMainsContentTheNominalIsKeptAndSaidSo()
    {
        var dc = Synth.Make(Fs, 3, _ => 0.006);
        var tracker = MainsTracker.Start(dc.AsSpan(0, 20_000), Fs, new AnalysisOptions { MainsHz = 60 }, "dc.wav");
        Assert.False(tracker.Detection.Found);
        Assert.Equal(60, tracker.FrequencyHz);
        Assert.Equal(60, tracker.Track(dc.AsSpan(0, 2_000), 0, 0.006, 0));
        Assert.Equal("mains-fallback", tracker.Warning!.Code);
        var result = tracker.Result(60, 60, 60);
        Assert.Equal("fallback", result.Source);
        Assert.Contains("not tracked", result.Method);
    }

    [Fact]
    public void AGivenFrequencyTheCaptureContradictsStopsWithTheFileNamed()
    {
        var sine = Synth.Make(Fs, 2, t => 0.01 * Math.Sin(2 * Math.PI * 60 * t));
        var ex = Assert.Throws<UserInputException>(() =>
            MainsTracker.Start(sine, Fs, new AnalysisOptions { MainsHz = 50 }, "/data/c9.wav"));
        Assert.StartsWith("c9.wav: mains given as 50 Hz, but the capture's mains content in its first 2 s is at 60", ex.Message);

        var kept = MainsTracker.Start(sine, Fs, new AnalysisOptions { MainsHz = 50, KeepGivenMains = true }, "/data/c9.wav");
        Assert.Equal(50, kept.NominalHz);
    }

    [Fact]
    public void AGivenFrequencyTheCaptureShowsIsTrackedAsGiven()
    {
        var sine = Synth.Make(Fs, 2, t => 0.01 * Math.Sin(2 * Math.PI * 50.2 * t));
        var tracker = MainsTracker.Start(sine, Fs, new AnalysisOptions { MainsHz = 50 }, "c1.wav");
        Assert.Equal(50.2, tracker.FrequencyHz, 0.01);
        var result = tracker.Result(50.2, 50.1, 50.3);
        Assert.Equal(("given", 50.0, 50.1, 50.3), (result.Source, result.NominalHz, result.MinHz, result.MaxHz));
        Assert.StartsWith("given nominal; found by the Hann-interpolated spectral peak of the first 2 s", result.Method);
    }
}
