using WaveCheck.Core.Results;

namespace WaveCheck.Core.Signal;

/// <summary>
/// Streams residual-current samples through the three IEC 60990 networks (<see cref="TouchCurrentNetworks"/>) and
/// keeps the peak and RMS of each weighted reading and the DC of the unweighted one. Memory is constant.
/// </summary>
/// <remarks>
/// The filters start from rest; their time constants are below 0.35 ms, so the start-up transient is over within
/// the first few milliseconds and cannot raise a peak above the steady value for a step from rest. NaN samples make
/// the figures NaN (the analysis reports such data before this point). With no samples the figures are 0.
/// Not thread-safe: one instance per stream.
/// </remarks>
public sealed class TouchCurrentMeter : ISampleSink
{
    private readonly TouchCurrentFilter _unweighted, _perception, _letGo;
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
    }

    /// <inheritdoc />
    public void Push(ReadOnlySpan<double> samplesA)
    {
        foreach (var x in samplesA)
        {
            var u = _unweighted.Process(x);
            var p = _perception.Process(x);
            var l = _letGo.Process(x);
            _sumU += u;
            _sumSqU += u * u;
            _sumSqP += p * p;
            _sumSqL += l * l;
            _peakU = Math.Max(_peakU, Math.Abs(u));
            _peakP = Math.Max(_peakP, Math.Abs(p));
            _peakL = Math.Max(_peakL, Math.Abs(l)); // Math.Max propagates NaN
        }

        _count += samplesA.Length;
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
