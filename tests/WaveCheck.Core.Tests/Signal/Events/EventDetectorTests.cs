using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class EventDetectorTests
{
    private const double Fs = 10_000;

    private static readonly double[] Quiet = new double[2_000];

    private static EventDetector Detector(double? alarmA = null) =>
        new(Fs, new AnalysisOptions { AlarmA = alarmA }, fullScaleA: 0.05);

    [Fact]
    public void AnAlarmCoversEachStretchOfWindowsAboveTheCurrent()
    {
        // Windows of 0.2 s with RMS 5, 12, 15, 11, 4, 20 mA against a 10 mA alarm: one event from 0.2 to 0.8 s with
        // the highest 15 mA, and one from 1.0 s still open at the end, closed there with 20 mA.
        var detector = Detector(alarmA: 0.010);
        var rms = new[] { 0.005, 0.012, 0.015, 0.011, 0.004, 0.020 };
        for (var i = 0; i < rms.Length; i++)
        {
            detector.Add(Quiet, WindowSlots.Result(i * 0.2, rms[i]), 0);
        }

        Assert.Single(detector.Events);
        detector.Close();
        Assert.Equal(2, detector.Events.Count);
        var (first, second) = (detector.Events[0], detector.Events[1]);
        Assert.Equal(("alarm", 0.2, 0.6, 0.015), (first.Kind, first.StartS, first.DurationS, first.ValueA), new Near());
        Assert.Equal(("alarm", 1.0, 0.2, 0.020), (second.Kind, second.StartS, second.DurationS, second.ValueA), new Near());
        Assert.Contains("for 0.6 s", first.Message);
        Assert.Empty(detector.Warnings);
    }

    [Fact]
    public void ATransientIsPlacedAtItsLargestSample()
    {
        // A −50 mA spike at sample 123 of a window starting at 2 s whose RMS is 2 mA: 25 times the RMS (over 6) and over
        // 1 mA, so one event at 2 s + 123/fs, one sample long, with the spike's signed value.
        var w = new double[2_000];
        w[7] = 0.03;
        w[123] = -0.05;
        var detector = Detector();
        detector.Add(w, WindowSlots.Result(2.0, 0.002), 0.05);
        detector.Close();
        var e = Assert.Single(detector.Events);
        Assert.Equal("transient", e.Kind);
        Assert.Equal(2.0 + (123 / Fs), e.StartS, 1e-12);
        Assert.Equal(1 / Fs, e.DurationS);
        Assert.Equal(-0.05, e.ValueA);
        Assert.Contains("25.0 times the window RMS", e.Message);
    }

    [Theory]
    [InlineData(0.0119, 0.002)] // 5.95 times the RMS: below the factor of 6
    [InlineData(0.0009, 0.0001)] // 9 times the RMS but below the 1 mA floor
    public void NoTransientBelowTheFactorOrTheFloor(double peakA, double rmsA)
    {
        var w = new double[2_000];
        w[5] = peakA;
        var detector = Detector();
        detector.Add(w, WindowSlots.Result(0, rmsA), peakA);
        detector.Close();
        Assert.Empty(detector.Events);
    }

    [Fact]
    public void TransientsBeyondTheLimitAreCountedNotListed()
    {
        var w = new double[2_000];
        w[1] = 0.05;
        var detector = Detector();
        for (var i = 0; i < EventDetector.MaxTransients + 5; i++)
        {
            detector.Add(w, WindowSlots.Result(i * 0.2, 0.002), 0.05);
        }

        detector.Close();
        Assert.Equal(EventDetector.MaxTransients, detector.Events.Count);
        var warnings = new List<WaveCheck.Core.Capture.CaptureWarning>();
        detector.AddCountWarnings(warnings);
        var warning = Assert.Single(warnings);
        Assert.Equal("transients-truncated", warning.Code);
        Assert.Equal("1005 transients found; the first 1000 are listed", warning.Message);
    }

    [Fact]
    public void ClippedStretchesBecomeWarningsUpToTheLimit()
    {
        // 25 stretches of two clipped windows, each followed by a clean one: the first 20 listed with their times
        // (start of the stretch), the other 5 counted.
        var detector = Detector();
        var t = 0.0;
        for (var stretch = 0; stretch < 25; stretch++)
        {
            for (var i = 0; i < 3; i++, t += 0.2)
            {
                detector.Add(Quiet, WindowSlots.Result(t, 0.001, clipped: i < 2), 0);
            }
        }

        detector.Close();
        Assert.Equal(EventDetector.MaxClippingWarnings, detector.Warnings.Count);
        Assert.All(detector.Warnings, w => Assert.Equal("clipping", w.Code));
        Assert.Equal(0.6, detector.Warnings[1].TimeS!.Value, 1e-9);
        Assert.Contains("from 0.6 s to 1 s", detector.Warnings[1].Message);
        Assert.Contains("±50.0 mA", detector.Warnings[1].Message);
        var counts = new List<WaveCheck.Core.Capture.CaptureWarning>();
        detector.AddCountWarnings(counts);
        Assert.Equal("5 more clipped stretches not listed", Assert.Single(counts).Message);
    }

    [Fact]
    public void EventsAreInTimeOrderOnceClosed()
    {
        // An alarm from 0 s is only recorded when it ends, after a transient at 0.2 s was: Close puts them in order.
        var w = new double[2_000];
        w[0] = 0.2;
        var detector = Detector(alarmA: 0.010);
        detector.Add(Quiet, WindowSlots.Result(0, 0.020), 0);
        detector.Add(w, WindowSlots.Result(0.2, 0.020), 0.2);
        detector.Add(Quiet, WindowSlots.Result(0.4, 0.001), 0);
        Assert.Equal(["transient", "alarm"], detector.Events.Select(e => e.Kind));
        detector.Close();
        Assert.Equal(["alarm", "transient"], detector.Events.Select(e => e.Kind));
    }

    // Tuples of (kind, start, duration, value) compared with 1e-12 on the numbers (sums of 0.2 s steps).
    private sealed class Near : IEqualityComparer<(string, double, double, double)>
    {
        public bool Equals((string, double, double, double) a, (string, double, double, double) b) =>
            a.Item1 == b.Item1 && Math.Abs(a.Item2 - b.Item2) < 1e-12 && Math.Abs(a.Item3 - b.Item3) < 1e-12 &&
            Math.Abs(a.Item4 - b.Item4) < 1e-12;

        public int GetHashCode((string, double, double, double) obj) => obj.Item1.GetHashCode();
    }
}
