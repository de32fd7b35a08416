using WaveCheck.Core.Results;

namespace WaveCheck.Core.Signal;

/// <summary>
/// Streams residual-current samples through the three IEC 60990 networks (<see cref="TouchCurrentNetworks"/>) and
/// keeps the peak and RMS of each weighted reading and the DC of the unweighted one. Memory is constant.
/// </summary>
/// <remarks>
/// The filters start from rest, and a waveform that begins mid-cycle makes them ring (a 1 kHz sine started at zero
/// overshoots the let-go reading's steady peak by some 20 %). The first <see cref="SettlingS"/> (5 ms) of samples
/// therefore feed the filters but not the figures (engineering choice: over 15 times the slowest time constant,
/// 0.30 ms of the let-go network's 524 Hz pole, so the start-up term has decayed below 1e-6). NaN samples make the
/// figures NaN (the analysis reports such data before this point). With no samples past the settling time the
/// figures are 0. Not thread-safe: one instance per stream.
/// </remarks>
public sealed class TouchCurrentMeter : ISampleSink
{
    private readonly TouchCurrentFilter _unweighted, _perception, _letGo;
    /// <summary>Start-up time excluded from the figures, seconds.</summary>
    public const double SettlingS = 0.005;

    private readonly long _settlingSamples;
    private long _seen;
    private long _count;
    private double _sumU, _sumSqU, _sumSqP, _sumSqL, _peakU, _peakP, _peakL;

    /// <summary>Creates a meter for a sample rate.</summary>
    /// <param name="sampleRateHz">Sample rate, hertz.</param>
    /// <exception cref="ArgumentOutOfRangeException">The rate is not a positive finite number.</exception>
    public TouchCurrentMeter(double sampleRateHz)
    {
        _unweighted = TouchCurrentNetworks.Discretise(TouchCurrentNetworks.Unweighted(), sampleRateHz);
        _perception = TouchCurrentNetworks.Discretise(TouchCurrentNetworks.Perception(), sampleRateHz);
        _letGo = TouchCurrentNetworks.Discretise(TouchCurrentNetworks.LetGo(), sampleRateHz);
        _settlingSamples = (long)Math.Ceiling((SettlingS * sampleRateHz) - 1e-9); // 1e-9: 0.005 x 1e5 is not exactly 500
    }

    /// <inheritdoc />
    public void Push(ReadOnlySpan<double> samplesA)
    {
        foreach (var x in samplesA)
        {
            var u = _unweighted.Process(x);
            var p = _perception.Process(x);
            var l = _letGo.Process(x);
            if (_seen++ < _settlingSamples)
            {
                continue;
            }

            _count++;
            _sumU += u;
            _sumSqU += u * u;
            _sumSqP += p * p;
            _sumSqL += l * l;
            _peakU = Math.Max(_peakU, Math.Abs(u));
            _peakP = Math.Max(_peakP, Math.Abs(p));
            _peakL = Math.Max(_peakL, Math.Abs(l)); // Math.Max propagates NaN
        }
    }

    /// <summary>Figures so far, amperes (reading = network output voltage / 500 Ω).</summary>
    public TouchCurrentResult Result
    {
        get
        {
            if (_count == 0)
            {
                return new TouchCurrentResult(0, 0, 0, 0, 0, 0, 0);
            }

            double Rms(double sumSq) => Math.Sqrt(sumSq / _count);
            return new TouchCurrentResult(Rms(_sumSqU), _peakU, _peakP, Rms(_sumSqP), _peakL, Rms(_sumSqL), _sumU / _count);
        }
    }
}
