using WaveCheck.Core.Model;

namespace WaveCheck.Core.Signal;

/// <summary>
/// The statistics of every window figure over a capture (mean, 95th percentile, maximum with its time), by name as
/// they appear in <see cref="WindowsResult.Statistics"/>, in bounded memory (<see cref="MetricAccumulator"/>). A
/// figure a window does not have (no delay angle, no THD) is left out for that window. Not thread-safe.
/// </summary>
internal sealed class WindowMetrics
{
    private readonly (string Name, Func<WindowResult, double> Get, MetricAccumulator Stats)[] _metrics =
    [
        ("frequencyHz", w => w.FrequencyHz, new MetricAccumulator(false)),
        ("rmsA", w => w.RmsA, new MetricAccumulator(false)),
        ("dcA", w => w.DcA, new MetricAccumulator(true)),
        ("acRmsA", w => w.AcRmsA, new MetricAccumulator(false)),
        ("peakPositiveA", w => w.PeakPositiveA, new MetricAccumulator(false)),
        ("peakNegativeA", w => w.PeakNegativeA, new MetricAccumulator(true)),
        ("crestFactor", w => w.CrestFactor, new MetricAccumulator(false)),
        ("smoothDcA", w => w.SmoothDcA, new MetricAccumulator(true)),
        ("currentDelayAngleDeg", w => w.CurrentDelayAngleDeg ?? double.NaN, new MetricAccumulator(false)),
        ("mainsRmsA", w => w.MainsRmsA, new MetricAccumulator(false)),
        ("belowMainsRmsA", w => w.BelowMainsRmsA, new MetricAccumulator(false)),
        ("harmonicsRmsA", w => w.HarmonicsRmsA, new MetricAccumulator(false)),
        ("above1kHzRmsA", w => w.Above1kHzRmsA, new MetricAccumulator(false)),
        ("above9kHzRmsA", w => w.Above9kHzRmsA, new MetricAccumulator(false)),
        ("thdPercent", w => w.ThdPercent ?? double.NaN, new MetricAccumulator(false)),
    ];

    /// <summary>Adds a window's figures.</summary>
    public void Add(WindowResult window)
    {
        foreach (var metric in _metrics)
        {
            metric.Stats.Add(metric.Get(window), window.StartS);
        }
    }

    /// <summary>The statistics by figure name.</summary>
    public Dictionary<string, MetricStatistics> Result()
    {
        var statistics = new Dictionary<string, MetricStatistics>(_metrics.Length);
        foreach (var metric in _metrics)
        {
            statistics[metric.Name] = metric.Stats.Result();
        }

        return statistics;
    }
}
