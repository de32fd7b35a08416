using WaveCheck.Core.Capture;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>
/// <see cref="EventDetector"/> exactly at its limits: a peak equal to the factor times the RMS or to the floor, a tie
/// for the largest sample, a clipped stretch still open at the end, and exactly as many stretches and transients as
/// are listed. The rules are the ones docs/methods.md states (a transient's peak "exceeds" 6 × the window RMS and
/// 1 mA); the values are powers of two so that the products are exact.
/// </summary>
public class EventDetectorBoundaryTests
{
    private const double Fs = 8_192;

    private static EventDetector Detector(double factor = 4, double floorA = 1.0 / 1024) =>
        new(Fs, new AnalysisOptions { TransientFactor = factor, TransientFloorA = floorA }, fullScaleA: 0.0625);

    private static double[] Spike(double valueA, int at = 17)
    {
        var window = new double[1024];
        window[at] = valueA;
        return window;
    }

    [Fact]
    public void A_peak_equal_to_the_factor_times_the_rms_is_not_a_transient()
    {
        // docs/methods.md: the peak must exceed the factor times the RMS. RMS 2^-7 A, factor 4: 2^-5 A is equal (no
        // event), the next double above it exceeds (one event).
        const double rmsA = 1.0 / 128, peakA = 4 * rmsA;
        var equal = Detector();
        equal.Add(Spike(peakA), WindowSlots.Result(0, rmsA), peakA);
        equal.Close();
        Assert.Empty(equal.Events);

        var above = Detector();
        var justAbove = Math.BitIncrement(peakA);
        above.Add(Spike(justAbove), WindowSlots.Result(0, rmsA), justAbove);
        above.Close();
        Assert.Equal("transient", Assert.Single(above.Events).Kind);
    }

    [Fact]
    public void A_peak_equal_to_the_floor_is_not_a_transient()
    {
        // docs/methods.md: the peak must also exceed the floor. Floor 2^-10 A, RMS 2^-14 A (so 4 × RMS is far below):
        // a peak of exactly the floor gives no event, the next double above gives one.
        const double floorA = 1.0 / 1024, rmsA = 1.0 / 16384;
        var equal = Detector(floorA: floorA);
        equal.Add(Spike(floorA), WindowSlots.Result(0, rmsA), floorA);
        equal.Close();
        Assert.Empty(equal.Events);

        var above = Detector(floorA: floorA);
        var justAbove = Math.BitIncrement(floorA);
        above.Add(Spike(justAbove), WindowSlots.Result(0, rmsA), justAbove);
        above.Close();
        Assert.Single(above.Events);
    }

    [Fact]
    public void Of_two_samples_equally_large_the_first_places_the_transient()
    {
        // Common practice, no source: the event is placed at the first sample reaching the peak (the peak is reached
        // there first). +2^-5 A at sample 100 and −2^-5 A at sample 300 of a window starting at 1 s: the event starts
        // at 1 s + 100/8192 s and carries +2^-5 A.
        var window = Spike(1.0 / 32, at: 100);
        window[300] = -1.0 / 32;
        var detector = Detector();
        detector.Add(window, WindowSlots.Result(1, 1.0 / 1024), 1.0 / 32);
        detector.Close();
        var e = Assert.Single(detector.Events);
        Assert.Equal(1 + (100 / Fs), e.StartS, 1e-12);
        Assert.Equal(1.0 / 32, e.ValueA);
        Assert.Equal(1 / Fs, e.DurationS, 1e-15);
    }

    [Fact]
    public void A_clipped_stretch_still_open_at_the_end_is_reported_when_closed()
    {
        // The capture ends inside a clipped stretch (windows 0.4 to 0.8 s): Close must report it, with its start.
        var detector = Detector();
        var quiet = new double[1024];
        detector.Add(quiet, WindowSlots.Result(0, 0.001), 0);
        detector.Add(quiet, WindowSlots.Result(0.2, 0.001), 0);
        detector.Add(quiet, WindowSlots.Result(0.4, 0.001, clipped: true), 0);
        detector.Add(quiet, WindowSlots.Result(0.6, 0.001, clipped: true), 0);
        Assert.Empty(detector.Warnings);
        detector.Close();
        var warning = Assert.Single(detector.Warnings);
        Assert.Equal("clipping", warning.Code);
        Assert.Equal(0.4, warning.TimeS!.Value, 1e-12);
        Assert.Contains("from 0.4 s to 0.8 s", warning.Message);
    }

    private static List<CaptureWarning> CountWarnings(int clippedStretches, int transients)
    {
        var detector = Detector();
        var quiet = new double[1024];
        var spike = Spike(1.0 / 32);
        var t = 0.0;
        for (var i = 0; i < clippedStretches; i++, t += 0.4)
        {
            detector.Add(quiet, WindowSlots.Result(t, 0.001, clipped: true), 0);
            detector.Add(quiet, WindowSlots.Result(t + 0.2, 0.001), 0);
        }

        for (var i = 0; i < transients; i++, t += 0.2)
        {
            detector.Add(spike, WindowSlots.Result(t, 1.0 / 1024), 1.0 / 32);
        }

        detector.Close();
        var warnings = new List<CaptureWarning>();
        detector.AddCountWarnings(warnings);
        return warnings;
    }

    [Fact]
    public void Exactly_as_many_stretches_and_transients_as_are_listed_need_no_count_warning()
    {
        // The class's contract: a warning counts only what was found but not listed; at exactly the limits nothing is
        // left out.
        Assert.Empty(CountWarnings(EventDetector.MaxClippingWarnings, EventDetector.MaxTransients));
    }

    [Fact]
    public void One_more_than_listed_is_counted_in_a_warning()
    {
        var warnings = CountWarnings(EventDetector.MaxClippingWarnings + 1, EventDetector.MaxTransients + 1);
        Assert.Equal(2, warnings.Count);
        Assert.Equal(("clipping", "1 more clipped stretches not listed"), (warnings[0].Code, warnings[0].Message));
        Assert.Equal(("transients-truncated", "1001 transients found; the first 1000 are listed"), (warnings[1].Code, warnings[1].Message));
    }
}
