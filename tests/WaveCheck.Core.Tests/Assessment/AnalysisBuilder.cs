using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Tests.Assessment;

/// <summary>
/// Builds the <see cref="AnalysisResult"/> an ideal analysis would report for a waveform made of named parts, each
/// window alike (so window maxima equal capture values). RMS of the whole by Parseval: orthogonal parts add in
/// quadrature (closed form). Half-wave parts come from a plain DFT of the ideal waveform, independent of the code
/// under test.
/// </summary>
internal sealed class AnalysisBuilder
{
    private static readonly System.Collections.Concurrent.ConcurrentDictionary<double, (double Mean, double[] Rms)> UnitHalfWaves = new();

    private readonly Dictionary<int, double> _harmonics = [];
    private readonly List<BandValue> _bands = [];
    private readonly List<ToneValue> _tones = [];
    private double _mainsHz = 50, _sampleRateHz = 50_000, _smoothDcA, _pulsatingMeanA, _mainsA, _belowMainsA, _above1kA, _above9kA;
    private bool _pulsating;
    private double? _angleDeg;
    private SensorCoupling _coupling = SensorCoupling.Dc;
    private TouchCurrentResult? _touch;

    public AnalysisBuilder Mains(double hz) { _mainsHz = hz; return this; }

    public AnalysisBuilder SampleRate(double hz) { _sampleRateHz = hz; return this; }

    public AnalysisBuilder Coupling(SensorCoupling c) { _coupling = c; return this; }

    /// <summary>Sinusoidal component at mains frequency, RMS amperes.</summary>
    public AnalysisBuilder Sine(double rmsA) { _mainsA = Math.Sqrt((_mainsA * _mainsA) + (rmsA * rmsA)); return this; }

    public AnalysisBuilder SmoothDc(double a) { _smoothDcA = a; return this; }

    public AnalysisBuilder BelowMains(double rmsA) { _belowMainsA = rmsA; return this; }

    public AnalysisBuilder Harmonic(int order, double rmsA) { _harmonics[order] = rmsA; return this; }

    /// <summary>Content above 1 kHz (and the part of it above 9 kHz), RMS amperes, with a band that holds it.</summary>
    public AnalysisBuilder HighFrequency(double frequencyHz, double rmsA)
    {
        _above1kA = Math.Sqrt((_above1kA * _above1kA) + (rmsA * rmsA));
        if (frequencyHz > 9000)
        {
            _above9kA = Math.Sqrt((_above9kA * _above9kA) + (rmsA * rmsA));
        }

        var low = frequencyHz >= 9000 ? Math.Floor(frequencyHz / 2000) * 2000 : Math.Floor(frequencyHz / 200) * 200;
        _bands.Add(new BandValue(low, low + (frequencyHz >= 9000 ? 2000 : 200), rmsA, rmsA));
        return this;
    }

    public AnalysisBuilder Tone(double hz, double rmsA) { _tones.Add(new ToneValue(hz, rmsA)); return this; }

    public AnalysisBuilder Touch(TouchCurrentResult t) { _touch = t; return this; }

    /// <summary>
    /// Phase-controlled half-wave of peak <paramref name="peakA"/> conducting from α to π, by a plain DFT of the ideal
    /// waveform (8000 samples per cycle: harmonics to order 400 = 20 kHz at 50 Hz).
    /// </summary>
    public AnalysisBuilder HalfWave(double peakA, double delayAngleDeg)
    {
        // The waveform is linear in its peak: the DFT of a unit peak is made once per angle and scaled.
        var (unitMean, unitRms) = UnitHalfWaves.GetOrAdd(delayAngleDeg, angle =>
        {
            var unit = IdealHalfWave.Cycle(1.0, angle, 8000);
            var orders = new double[401];
            for (var k = 1; k <= 400; k++)
            {
                orders[k] = IdealHalfWave.HarmonicRms(unit, k);
            }

            return (unit.Average(), orders);
        });
        var mean = unitMean * peakA;
        double above1kSq = 0;
        for (var k = 1; k <= 400; k++)
        {
            var rms = unitRms[k] * peakA;
            if (k == 1)
            {
                Sine(rms);
            }
            else if (k * _mainsHz <= 1000)
            {
                _harmonics[k] = rms;
            }
            else
            {
                above1kSq += rms * rms;
            }
        }

        _above1kA = Math.Sqrt((_above1kA * _above1kA) + above1kSq);
        _pulsatingMeanA = mean;
        _pulsating = true;
        _angleDeg = delayAngleDeg;
        return this;
    }

    public AnalysisResult Build()
    {
        double harmonicsSq = 0;
        foreach (var h in _harmonics.Values)
        {
            harmonicsSq += h * h;
        }

        var dc = _smoothDcA + (Math.Sign(_smoothDcA) >= 0 ? _pulsatingMeanA : -_pulsatingMeanA);
        var acSq = (_mainsA * _mainsA) + (_belowMainsA * _belowMainsA) + harmonicsSq + (_above1kA * _above1kA);
        foreach (var t in _tones)
        {
            acSq += t.RmsA * t.RmsA;
        }

        var rms = Math.Sqrt((dc * dc) + acSq);
        var stats = new Dictionary<string, MetricStatistics>
        {
            ["rmsA"] = Stat(rms),
            ["dcA"] = Stat(dc),
            ["smoothDcA"] = Stat(_smoothDcA),
            ["mainsRmsA"] = Stat(_mainsA),
            ["belowMainsRmsA"] = Stat(_belowMainsA),
            ["harmonicsRmsA"] = Stat(Math.Sqrt(harmonicsSq)),
            ["above1kHzRmsA"] = Stat(_above1kA),
            ["above9kHzRmsA"] = Stat(_above9kA),
        };
        var harmonics = new List<HarmonicValue> { new(1, _mainsHz, _mainsA, _mainsA) };
        for (var order = 2; order <= 50; order++)
        {
            var v = _harmonics.GetValueOrDefault(order);
            harmonics.Add(new HarmonicValue(order, order * _mainsHz, v, v));
        }

        return new AnalysisResult
        {
            ToolVersion = "test",
            Capture = new CaptureInfo
            {
                FilePath = "built.csv",
                Format = "memory",
                Encoding = "float64",
                Channels = [new ChannelInfo(0, "I", "A", ChannelQuantity.Current, 1.0, null)],
                ResidualSource = "I",
                ResidualChannels = [0],
                SampleRateHz = _sampleRateHz,
                SampleCount = (long)(_sampleRateHz * 60),
                Calibration = Calibration.Amperes("test"),
                SensorCoupling = _coupling,
            },
            Mains = new MainsResult(_mainsHz, _mainsHz, "detected", _mainsHz, _mainsHz, "test"),
            Summary = new SummaryResult(rms, dc, Math.Sqrt(acSq), 0, 0, 0, 0),
            Components = new ComponentsResult
            {
                SmoothDcA = _smoothDcA,
                SmoothDcMaxA = _smoothDcA,
                PulsatingDc = _pulsating,
                PulsatingDcShare = _pulsating ? 1 : 0,
                CurrentDelayAngleDeg = _angleDeg,
                MainsRmsA = _mainsA,
                BelowMainsRmsA = _belowMainsA,
                HarmonicsRmsA = Math.Sqrt(harmonicsSq),
                Above1kHzRmsA = _above1kA,
                Above9kHzRmsA = _above9kA,
                Tones = _tones,
                // As the analysis does: harmonic groups of windows that are not pulsating DC, the group at 1 kHz apart.
                NonPulsatingHarmonicsTo1kMaxA = _pulsating ? 0 : Math.Sqrt(HarmonicsSq(2, (int)Math.Round(1000 / _mainsHz) - 1)),
                NonPulsating1kGroupMaxA = _pulsating ? 0 : _harmonics.GetValueOrDefault((int)Math.Round(1000 / _mainsHz)),
                PulsatingMeanMaxA = _pulsating ? _pulsatingMeanA : 0,
            },
            Harmonics = harmonics,
            Bands = _bands,
            Windows = new WindowsResult { Count = 300, CyclesPerWindow = 10, LengthS = 0.2, MaxSyncErrorPercent = 0, Statistics = stats },
            Events = [],
            Warnings = [],
            Spectrum = new SpectrumResult(5, [], []),
            Envelope = new EnvelopeResult(1, [], []),
            WorstWindow = new WaveformExcerpt(0, _sampleRateHz, [], "test"),
            Trend = [],
            TouchCurrent = _touch,
        };
    }

    private static MetricStatistics Stat(double v) => new(v, v, v, 0);

    private double HarmonicsSq(int from, int to)
    {
        double sum = 0;
        for (var order = from; order <= to; order++)
        {
            var v = _harmonics.GetValueOrDefault(order);
            sum += v * v;
        }

        return sum;
    }
}
