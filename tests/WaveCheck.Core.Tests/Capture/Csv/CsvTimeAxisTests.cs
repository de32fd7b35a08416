using System.Globalization;
using WaveCheck.Core.Capture;

namespace WaveCheck.Core.Tests.Capture;

/// <summary>The CSV time axis on its own: the nominal step of the first lines and the faults of the whole axis.</summary>
public sealed class CsvTimeAxisTests
{
    private static readonly CsvColumn Seconds = new(1, "time", "s", CsvColumnKind.TimeSeconds, 1);

    private static Exception Fail(string problem) => new InvalidDataException(problem);

    [Fact]
    public void The_median_step_is_not_moved_by_a_gap_among_the_first_lines()
    {
        // Steps 1, 1, 5, 1, 1 ms: the median is 1 ms (closed form), the mean would be 1.8 ms.
        double[] times = [0, 0.001, 0.002, 0.007, 0.008, 0.009];
        Assert.Equal(0.001, CsvTimeAxis.MedianStep(times, rateGiven: false, Fail), 1e-15);

        // An even count of steps takes the mean of the middle two: steps 1, 2, 3, 4 ms give 2.5 ms.
        Assert.Equal(0.0025, CsvTimeAxis.MedianStep([0, 0.001, 0.003, 0.006, 0.010], rateGiven: false, Fail), 1e-15);
    }

    [Fact]
    public void Too_few_values_or_steps_that_do_not_increase_are_refused_unless_the_rate_is_given()
    {
        Assert.Contains("only one data row", Assert.Throws<InvalidDataException>(() => CsvTimeAxis.MedianStep([0.5], false, Fail)).Message);
        Assert.True(double.IsNaN(CsvTimeAxis.MedianStep([0.5], true, Fail)));
        Assert.Contains("median step is not positive",
            Assert.Throws<InvalidDataException>(() => CsvTimeAxis.MedianStep([0, 0, 0, 1], false, Fail)).Message);
        // A step of 1 ns is a rate of 1 GHz, beyond the 10 MHz bound (CaptureLimits.MaxSampleRateHz).
        Assert.Contains("check the time unit",
            Assert.Throws<InvalidDataException>(() => CsvTimeAxis.MedianStep([0, 1e-9, 2e-9], false, Fail)).Message);
    }

    [Fact]
    public void A_gap_and_a_step_back_are_placed_and_the_mean_good_step_gives_the_rate()
    {
        // 1 kHz: rows 0..9, then 13 (3 samples missing after t = 9 ms), then 12 (a step back), then 14..19.
        var axis = new CsvTimeAxis(Seconds, 0.001, rateGiven: false);
        int[] samples = [0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 13, 12, 14, 15, 16, 17, 18, 19];
        for (var i = 0; i < samples.Length; i++)
        {
            var cell = (samples[i] / 1000.0).ToString("R", CultureInfo.InvariantCulture);
            Assert.Null(axis.TryRead(cell, NumberFormatInfo.InvariantInfo, out var t));
            axis.Add(t, line: i + 2);
        }

        var measured = axis.Finish(1000, 1000);
        // Steps of 4 ms (9 → 13) and 2 ms (12 → 14) are both above 1.5 median steps: gaps of 3 and 1 samples.
        var gaps = axis.Warnings.Where(w => w.Code == "time-gap").Select(w => w.Message).ToArray();
        Assert.Equal(
        [
            "Gap in the time column at line 12: 0.003 s (about 3 samples) missing after t = 0.009 s.",
            "Gap in the time column at line 14: 0.001 s (about 1 samples) missing after t = 0.012 s.",
        ], gaps);
        var back = Assert.Single(axis.Warnings, w => w.Code == "time-non-monotonic");
        Assert.StartsWith("Time does not increase at line 13", back.Message, StringComparison.Ordinal);
        // Good steps: 9 of 1 ms before the gap, 5 of 1 ms after; mean 1 ms: 1000 Hz.
        Assert.Equal(1000, measured!.Value, 1e-6);
        Assert.DoesNotContain(axis.Warnings, w => w.Code is "time-jitter" or "rate-mismatch");
    }

    [Fact]
    public void Time_stamps_count_from_the_first_row()
    {
        var stamps = new CsvColumn(1, "timestamp", "ISO 8601", CsvColumnKind.TimeStamp, 1);
        var axis = new CsvTimeAxis(stamps, 0.5, rateGiven: false);
        Assert.Null(axis.TryRead("2026-02-03T08:15:00Z", NumberFormatInfo.InvariantInfo, out var t0));
        axis.Add(t0, 2);
        Assert.Null(axis.TryRead("2026-02-03T09:15:00.5+01:00", NumberFormatInfo.InvariantInfo, out var t1));
        Assert.Equal(0, t0);
        Assert.Equal(0.5, t1); // the same instant plus 0.5 s, written one hour east of UTC
        Assert.Equal("'08:99' is not an ISO 8601 time stamp", axis.TryRead("08:99", NumberFormatInfo.InvariantInfo, out _));
    }
}
