using System.Globalization;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Core.Capture;

/// <summary>Figures of one channel (or of the residual current) over the whole capture, SI units.</summary>
/// <param name="Name">Channel name, or <c>residual</c>.</param>
/// <param name="Unit">SI unit of the figures: <c>A</c> or <c>V</c>.</param>
/// <param name="MinSi">Smallest value.</param>
/// <param name="MaxSi">Largest value.</param>
/// <param name="MeanSi">Arithmetic mean.</param>
/// <param name="SampleCount">Samples seen.</param>
/// <param name="ClippedSamples">Samples judged clipped.</param>
/// <param name="ClippedShare">Clipped samples as a share of all (0..1).</param>
/// <param name="FirstClipS">Time of the first clipped sample, seconds; null if none.</param>
/// <param name="FullScaleSi">Clipping level used, where known; null when the channel's own extremes were used.</param>
public sealed record ChannelStats(string Name, string Unit, double MinSi, double MaxSi, double MeanSi, long SampleCount,
    long ClippedSamples, double ClippedShare, double? FirstClipS, double? FullScaleSi);

/// <summary>What <see cref="CaptureScan"/> found.</summary>
/// <param name="Channels">One entry per channel of the file, then one for the residual current.</param>
/// <param name="Warnings">Clipping, flat channels, a sample rate too low for the band of interest.</param>
public sealed record CaptureScanResult(IReadOnlyList<ChannelStats> Channels, IReadOnlyList<CaptureWarning> Warnings);

/// <summary>
/// Streaming checks of a capture's samples: per-channel min/max/mean, clipping, flat or all-zero channels, and a sample
/// rate too low for the band of interest. Feed every block with <see cref="Push"/>, then call <see cref="Complete"/>.
/// Memory does not grow with the capture. Not thread-safe.
/// </summary>
/// <remarks>
/// Clipping, full scale known: samples with |x| ≥ (1 − 0.1 %) of full scale (engineering choice: a recorder's last
/// code or two). Full scale unknown: runs of three or more samples in a row at exactly the channel's own maximum or
/// minimum (engineering choice: a real peak of a smooth wave rarely repeats exactly three times). A flat channel is
/// not reported as clipped.
/// </remarks>
public sealed class CaptureScan
{
    /// <summary>Engineering choice: within 0.1 % of full scale counts as clipped.</summary>
    public const double ClipMargin = 0.001;

    /// <summary>Engineering choice: an extreme repeated this many times in a row counts as clipped when full scale is unknown.</summary>
    public const int ClipRun = 3;

    private readonly CaptureInfo _info;
    private readonly double _bandOfInterestHz;
    private readonly Accumulator[] _accumulators;

    /// <summary>Starts a scan.</summary>
    /// <param name="info">The capture (channels, full scale, rate).</param>
    /// <param name="bandOfInterestHz">Highest frequency of interest, hertz (<see cref="ImportOptions.BandOfInterestHz"/>).</param>
    public CaptureScan(CaptureInfo info, double bandOfInterestHz)
    {
        ArgumentNullException.ThrowIfNull(info);
        _info = info;
        _bandOfInterestHz = bandOfInterestHz;
        _accumulators = new Accumulator[info.Channels.Count + 1];
        for (var c = 0; c < info.Channels.Count; c++)
        {
            var channel = info.Channels[c];
            _accumulators[c] = new Accumulator(channel.Name, channel.Quantity == ChannelQuantity.Voltage ? "V" : "A", channel.FullScaleSi);
        }

        _accumulators[^1] = new Accumulator("residual", "A", info.FullScaleA);
    }

    /// <summary>Takes one block.</summary>
    public void Push(CaptureBlock block)
    {
        ArgumentNullException.ThrowIfNull(block);
        var count = Math.Min(block.ChannelCount, _accumulators.Length - 1);
        for (var c = 0; c < count; c++)
        {
            _accumulators[c].Push(block.Channel(c), block.StartSample, block.SampleRateHz);
        }

        _accumulators[^1].Push(block.ResidualA, block.StartSample, block.SampleRateHz);
    }

    /// <summary>Finishes the scan.</summary>
    /// <param name="info">The capture's final description (for one-pass formats, read after the last block); null to use the one given at the start.</param>
    public CaptureScanResult Complete(CaptureInfo? info = null)
    {
        info ??= _info;
        var stats = new List<ChannelStats>(_accumulators.Length);
        var warnings = new List<CaptureWarning>();
        for (var i = 0; i < _accumulators.Length; i++)
        {
            var s = _accumulators[i].Result();
            stats.Add(s);
            var residualRepeatsAChannel = i == _accumulators.Length - 1 && info.ResidualChannels.Count == 1;
            if (s.SampleCount == 0 || residualRepeatsAChannel)
            {
                continue;
            }

            if (s.MaxSi == s.MinSi)
            {
                warnings.Add(s.MaxSi == 0
                    ? new CaptureWarning("all-zero", $"Channel '{s.Name}' is zero throughout: is the sensor connected?")
                    : new CaptureWarning("flat", $"Channel '{s.Name}' holds one value throughout ({Show(s.MaxSi, s.Unit)}): is the sensor connected?"));
            }
            else if (s.ClippedSamples > 0)
            {
                var how = s.FullScaleSi is { } fs
                    ? $"within 0.1 % of full scale {Show(fs, s.Unit)}"
                    : $"at the channel's own extreme ({Show(s.MaxSi, s.Unit)} / {Show(s.MinSi, s.Unit)}) {ClipRun} or more times in a row";
                warnings.Add(new CaptureWarning("clipping", string.Create(CultureInfo.InvariantCulture,
                    $"Channel '{s.Name}' may clip: {s.ClippedSamples} samples ({100 * s.ClippedShare:0.###} %) {how}, first at t = {s.FirstClipS:0.######} s; peaks above the recorder's range are lost."),
                    s.FirstClipS));
            }
        }

        if (info.SampleRateHz < 2 * _bandOfInterestHz)
        {
            warnings.Add(new CaptureWarning("rate-low", string.Create(CultureInfo.InvariantCulture,
                $"Sample rate {info.SampleRateHz:G6} Hz shows frequencies up to {info.NyquistHz:G6} Hz (Nyquist); the band of interest reaches {_bandOfInterestHz:G6} Hz, so components above {info.NyquistHz:G6} Hz are not seen and may alias.")));
        }

        return new CaptureScanResult(stats, warnings);
    }

    /// <summary>Reads <paramref name="source"/> to its end and scans it.</summary>
    /// <param name="source">An opened capture.</param>
    /// <param name="bandOfInterestHz">Highest frequency of interest, hertz.</param>
    /// <param name="blockCapacity">Samples per block.</param>
    public static CaptureScanResult Run(ICaptureSource source, double bandOfInterestHz, int blockCapacity = 65536)
    {
        ArgumentNullException.ThrowIfNull(source);
        var scan = new CaptureScan(source.Info, bandOfInterestHz);
        var block = source.CreateBlock(blockCapacity);
        while (source.Read(block))
        {
            scan.Push(block);
        }

        return scan.Complete(source.Info);
    }

    private static string Show(double value, string unit) =>
        unit == "A" ? CurrentText.WithUnit(value) : value.ToString("G4", CultureInfo.InvariantCulture) + " " + unit;

    /// <summary>Running figures of one channel.</summary>
    private sealed class Accumulator(string name, string unit, double? fullScale)
    {
        private double _min = double.PositiveInfinity;
        private double _max = double.NegativeInfinity;
        private double _sum;
        private long _count;
        private long _clipped;
        private double? _firstClipS;

        // Full scale unknown: runs at the current extreme, restarted whenever a new extreme appears.
        private ExtremeRuns _atMax;
        private ExtremeRuns _atMin;

        public void Push(ReadOnlySpan<double> x, long startSample, double rateHz)
        {
            var limit = fullScale is { } fs ? fs * (1 - ClipMargin) : double.PositiveInfinity;
            for (var n = 0; n < x.Length; n++)
            {
                var v = x[n];
                _sum += v;
                if (fullScale is not null)
                {
                    if (Math.Abs(v) >= limit)
                    {
                        _clipped++;
                        _firstClipS ??= (startSample + n) / rateHz;
                    }
                }
                else
                {
                    TrackExtremes(v, startSample + n, rateHz);
                }

                if (v < _min)
                {
                    _min = v;
                }

                if (v > _max)
                {
                    _max = v;
                }
            }

            _count += x.Length;
        }

        private void TrackExtremes(double v, long index, double rateHz)
        {
            _atMax.Track(v > _max, v == _max, index, rateHz);
            _atMin.Track(v < _min, v == _min, index, rateHz);
        }

        public ChannelStats Result()
        {
            var clipped = _clipped;
            var first = _firstClipS;
            if (fullScale is null && _max == _min)
            {
                clipped = 0; // a flat channel is reported as flat, not as clipped
                first = null;
            }
            else if (fullScale is null)
            {
                clipped = _atMax.Clipped + _atMin.Clipped;
                first = (_atMax.FirstS, _atMin.FirstS) switch
                {
                    ({ } a, { } b) => Math.Min(a, b),
                    ({ } a, null) => a,
                    (null, var b) => b,
                };
            }

            return _count == 0
                ? new ChannelStats(name, unit, double.NaN, double.NaN, double.NaN, 0, 0, 0, null, fullScale)
                : new ChannelStats(name, unit, _min, _max, _sum / _count, _count, clipped, clipped / (double)_count, first, fullScale);
        }
    }

    /// <summary>Samples in runs of <see cref="ClipRun"/> or more at one extreme; starts over when a new extreme appears.</summary>
    private struct ExtremeRuns
    {
        private long _run;

        public long Clipped { get; private set; }

        public double? FirstS { get; private set; }

        public void Track(bool newExtreme, bool atExtreme, long index, double rateHz)
        {
            if (newExtreme)
            {
                _run = 1;
                Clipped = 0;
                FirstS = null;
            }
            else if (atExtreme)
            {
                _run++;
                if (_run == ClipRun)
                {
                    Clipped += ClipRun;
                    FirstS ??= (index - ClipRun + 1) / rateHz;
                }
                else if (_run > ClipRun)
                {
                    Clipped++;
                }
            }
            else
            {
                _run = 0;
            }
        }
    }
}
