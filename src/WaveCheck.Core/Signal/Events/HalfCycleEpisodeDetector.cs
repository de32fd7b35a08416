using WaveCheck.Core.Model;

namespace WaveCheck.Core.Signal;

/// <summary>
/// Finds the episodes of a capture in which the residual current's RMS over a half-cycle reaches a given current,
/// and for each one how long it stayed at or above each of a set of levels: what a residual-current device's
/// operating and break times are stated against (IEC 61008-1 / IEC 61009-1: a residual current "suddenly applied"
/// at a multiple of IΔn, and the time until the device breaks). Fed window by window in time order; each window of N
/// tracked mains cycles is cut into 2N equal half-cycles. Streaming and bounded: per level a few running figures,
/// per episode an envelope of at most <see cref="EnvelopeCapacity"/> points (pairs merged, the larger kept, when
/// full), at most <see cref="MaxEpisodes"/> episodes listed (the figures of the rest are folded into one maximum
/// per level). Not thread-safe; one instance per capture.
/// </summary>
/// <remarks>
/// <para>A half-cycle's RMS is the RMS of its samples, the mean included: for a sine it equals the sine's RMS
/// whatever the phase at which the half-cycle starts, so the half-cycles need not be aligned to zero crossings.</para>
/// <para>A stretch at or above a level goes on through at most <see cref="BridgedHalfCycles"/> half-cycle below it
/// (engineering choice: a half-wave current, or a half-cycle that straddles the pulse of one, leaves every other
/// half-cycle low, and a device's core does not forget a pulse within a half-cycle; bridging only ever lengthens a
/// stretch, which moves every finding built on it towards "may trip" or "will trip").</para>
/// </remarks>
internal sealed class HalfCycleEpisodeDetector
{
    /// <summary>Most episodes listed (engineering choice: enough for a day of switch-on surges of one circuit; the
    /// rest are counted and their longest stretches kept per level).</summary>
    public const int MaxEpisodes = 200;

    /// <summary>Most points of an episode's envelope (engineering choice: 256 half-cycles, 2.56 s at 50 Hz, are kept
    /// one by one, longer than every break time of the standards; a longer episode's envelope holds the larger of
    /// each pair of points).</summary>
    public const int EnvelopeCapacity = 256;

    /// <summary>Half-cycles below a level that a stretch at or above it bridges (engineering choice, see remarks).</summary>
    public const int BridgedHalfCycles = 1;

    private readonly double _fs;
    private readonly double[] _levelsA;
    private readonly double _thresholdA;
    private readonly List<HalfCycleEpisode> _episodes = [];
    private readonly double[] _unlistedMaxRunS;

    // Per level: start of the open stretch (NaN when none), end of its last half-cycle at or above the level, and the
    // half-cycles below it since then.
    private readonly double[] _runStartS;
    private readonly double[] _runLastEndS;
    private readonly int[] _runGap;
    private readonly double[] _episodeMaxRunS;

    private double _quietSquares;
    private long _quietSamples;
    private bool _open;
    private double _startS;
    private double _lastEndS;
    private int _gap;
    private double _peakA;
    private double _maxRmsA;
    private double _sum;
    private double _sumSquares;
    private long _samples;
    private int _halfCycles;
    private double _halfCycleSeconds;
    private readonly List<double> _envelope = [];
    private int _stride = 1;
    private int _strideFill;
    private double _strideMax;

    // The half-cycles after the last one at or above the threshold, held until the episode goes on or closes.
    private readonly List<(double PeakA, double RmsA, double Sum, double SumSquares, int Samples, double LengthS)> _pending = [];

    /// <summary>Sets up the detection.</summary>
    /// <param name="sampleRateHz">Sample rate, hertz.</param>
    /// <param name="levelsA">Levels, amperes, each at least 0; the lowest opens and closes an episode.</param>
    public HalfCycleEpisodeDetector(double sampleRateHz, IReadOnlyList<double> levelsA)
    {
        ArgumentNullException.ThrowIfNull(levelsA);
        if (levelsA.Count == 0)
        {
            throw new ArgumentException("at least one level is needed", nameof(levelsA));
        }

        _fs = sampleRateHz;
        _levelsA = [.. levelsA];
        _thresholdA = _levelsA.Min();
        if (!(_thresholdA >= 0) || _levelsA.Any(l => !double.IsFinite(l)))
        {
            throw new ArgumentOutOfRangeException(nameof(levelsA), "levels must be finite and at least 0 A");
        }

        _unlistedMaxRunS = new double[_levelsA.Length];
        _runStartS = new double[_levelsA.Length];
        _runLastEndS = new double[_levelsA.Length];
        _runGap = new int[_levelsA.Length];
        _episodeMaxRunS = new double[_levelsA.Length];
    }

    /// <summary>Episodes found so far (listed or not).</summary>
    public int Found { get; private set; }

    /// <summary>Takes the next window.</summary>
    /// <param name="windowA">The window's samples, amperes: <paramref name="cycles"/> tracked mains cycles.</param>
    /// <param name="startS">Time of its first sample, seconds.</param>
    /// <param name="cycles">Mains cycles in the window.</param>
    public void Add(ReadOnlySpan<double> windowA, double startS, int cycles)
    {
        var halves = 2 * cycles;
        var length = windowA.Length;
        for (var h = 0; h < halves; h++)
        {
            // Boundaries rounded from the window's own length, so the half-cycles tile it exactly.
            var from = (int)((long)h * length / halves);
            var to = (int)((long)(h + 1) * length / halves);
            if (to <= from)
            {
                continue;
            }

            var part = windowA[from..to];
            double sum = 0, squares = 0, peak = 0;
            foreach (var x in part)
            {
                sum += x;
                squares += x * x;
                peak = Math.Max(peak, Math.Abs(x));
            }

            var n = part.Length;
            Take(startS + (from / _fs), n / _fs, Math.Sqrt(squares / n), peak, sum, squares, n);
        }
    }

    /// <summary>Closes the episode still open at the end of the capture.</summary>
    public void Close()
    {
        if (_open)
        {
            CloseEpisode();
        }
    }

    /// <summary>The episodes, in time order, with the levels and the folded figures of those not listed.</summary>
    public HalfCycleEpisodesResult Result() => new()
    {
        LevelsA = _levelsA,
        ThresholdA = _thresholdA,
        BridgedHalfCycles = BridgedHalfCycles,
        Found = Found,
        Episodes = [.. _episodes],
        UnlistedMaxRunS = Found > _episodes.Count ? [.. _unlistedMaxRunS] : null,
        QuietRmsA = _quietSamples > 0 ? Math.Sqrt(_quietSquares / _quietSamples) : null,
    };

    private void Take(double startS, double lengthS, double rmsA, double peakA, double sum, double squares, int n)
    {
        var endS = startS + lengthS;
        var above = rmsA >= _thresholdA;
        if (!_open && !above)
        {
            _quietSquares += squares;
            _quietSamples += n;
            return;
        }

        if (!_open)
        {
            Open(startS);
        }

        for (var j = 0; j < _levelsA.Length; j++)
        {
            if (rmsA >= _levelsA[j])
            {
                if (double.IsNaN(_runStartS[j]))
                {
                    _runStartS[j] = startS;
                }

                _runLastEndS[j] = endS;
                _runGap[j] = 0;
            }
            else if (!double.IsNaN(_runStartS[j]) && ++_runGap[j] > BridgedHalfCycles)
            {
                CloseRun(j);
            }
        }

        if (above)
        {
            foreach (var p in _pending)
            {
                Fold(p.PeakA, p.RmsA, p.Sum, p.SumSquares, p.Samples, p.LengthS);
            }

            _pending.Clear();
            Fold(peakA, rmsA, sum, squares, n, lengthS);
            _lastEndS = endS;
            _gap = 0;
            return;
        }

        _pending.Add((peakA, rmsA, sum, squares, n, lengthS));
        if (++_gap > BridgedHalfCycles)
        {
            CloseEpisode();
        }
    }

    private void Open(double startS)
    {
        _open = true;
        _startS = startS;
        _lastEndS = startS;
        _gap = 0;
        _peakA = _maxRmsA = _sum = _sumSquares = _halfCycleSeconds = 0;
        _samples = 0;
        _halfCycles = 0;
        _envelope.Clear();
        _stride = 1;
        _strideFill = 0;
        _strideMax = 0;
        Array.Fill(_runStartS, double.NaN);
        Array.Clear(_runGap);
        Array.Clear(_episodeMaxRunS);
    }

    private void Fold(double peakA, double rmsA, double sum, double squares, int n, double lengthS)
    {
        _peakA = Math.Max(_peakA, peakA);
        _maxRmsA = Math.Max(_maxRmsA, rmsA);
        _sum += sum;
        _sumSquares += squares;
        _samples += n;
        _halfCycles++;
        _halfCycleSeconds += lengthS;
        _strideMax = Math.Max(_strideMax, rmsA);
        if (++_strideFill < _stride)
        {
            return;
        }

        _envelope.Add(_strideMax);
        _strideFill = 0;
        _strideMax = 0;
        if (_envelope.Count == EnvelopeCapacity)
        {
            // Full: each pair becomes its larger point and a point now stands for twice as many half-cycles.
            for (var i = 0; i < EnvelopeCapacity / 2; i++)
            {
                _envelope[i] = Math.Max(_envelope[2 * i], _envelope[(2 * i) + 1]);
            }

            _envelope.RemoveRange(EnvelopeCapacity / 2, EnvelopeCapacity / 2);
            _stride *= 2;
        }
    }

    private void CloseRun(int j)
    {
        _episodeMaxRunS[j] = Math.Max(_episodeMaxRunS[j], _runLastEndS[j] - _runStartS[j]);
        _runStartS[j] = double.NaN;
        _runGap[j] = 0;
    }

    private void CloseEpisode()
    {
        for (var j = 0; j < _levelsA.Length; j++)
        {
            if (!double.IsNaN(_runStartS[j]))
            {
                CloseRun(j);
            }
        }

        if (_strideFill > 0)
        {
            _envelope.Add(_strideMax);
        }

        _open = false;
        foreach (var p in _pending)
        {
            _quietSquares += p.SumSquares;
            _quietSamples += p.Samples;
        }

        _pending.Clear();
        Found++;
        if (_episodes.Count >= MaxEpisodes)
        {
            for (var j = 0; j < _levelsA.Length; j++)
            {
                _unlistedMaxRunS[j] = Math.Max(_unlistedMaxRunS[j], _episodeMaxRunS[j]);
            }

            return;
        }

        var mean = _sum / _samples;
        _episodes.Add(new HalfCycleEpisode
        {
            StartS = _startS,
            DurationS = _lastEndS - _startS,
            HalfCycleS = _halfCycleSeconds / _halfCycles,
            PeakA = _peakA,
            MaxHalfCycleRmsA = _maxRmsA,
            RmsA = Math.Sqrt(_sumSquares / _samples),
            MeanA = mean,
            LongestRunS = [.. _episodeMaxRunS],
            EnvelopeStepS = _stride * (_halfCycleSeconds / _halfCycles),
            EnvelopeRmsA = [.. _envelope],
        });
    }
}
