using WaveCheck.Core.Model;

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
    private readonly TouchCurrentFilter _perception, _letGo;

    // The unweighted network (IEC 60990 Fig. 3) is a plain gain, RB/500 Ω: its reading is the input scaled.
    private readonly double _unweightedGain;
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
        var unweighted = TouchCurrentNetworks.Discretise(TouchCurrentNetworks.Unweighted(), sampleRateHz);
        var (gain, b1, b2, a1, a2) = unweighted.Coefficients;
        if (b1 != 0 || b2 != 0 || a1 != 0 || a2 != 0)
        {
            throw new InvalidOperationException("the unweighted network is expected to be a plain gain");
        }

        _unweightedGain = gain;
        _perception = TouchCurrentNetworks.Discretise(TouchCurrentNetworks.Perception(), sampleRateHz);
        _letGo = TouchCurrentNetworks.Discretise(TouchCurrentNetworks.LetGo(), sampleRateHz);
        _settlingSamples = (long)Math.Ceiling((SettlingS * sampleRateHz) - 1e-9); // 1e-9: 0.005 x 1e5 is not exactly 500
    }

    /// <inheritdoc />
    public void Push(ReadOnlySpan<double> samplesA)
    {
        // The settling samples feed the filters only.
        var settling = (int)Math.Clamp(_settlingSamples - _seen, 0, samplesA.Length);
        foreach (var x in samplesA[..settling])
        {
            _perception.Process(x);
            _letGo.Process(x);
        }

        _seen += samplesA.Length;
        samplesA = samplesA[settling..];
        if (samplesA.IsEmpty)
        {
            return;
        }

        var g = _unweightedGain;
        var (sum, squares, min, max) = SampleMath.Moments(samplesA);
        _sumU += g * sum;
        _sumSqU += g * g * squares;
        _peakU = Math.Max(_peakU, Math.Abs(g) * Math.Max(Math.Abs(min), Math.Abs(max)));

        // The same sections as TouchCurrentFilter.Process, with coefficients, states and sums in locals so that the
        // two independent recurrences overlap in the pipeline instead of going through memory every sample.
        var (pb0, pb1, pb2, pa1, pa2) = _perception.Coefficients;
        var (lb0, lb1, lb2, la1, la2) = _letGo.Coefficients;
        var (p1, p2) = _perception.State;
        var (l1, l2) = _letGo.State;
        double sumSqP = _sumSqP, sumSqL = _sumSqL, peakP = _peakP, peakL = _peakL;
        foreach (var x in samplesA)
        {
            var p = (pb0 * x) + p1;
            p1 = ((pb1 * x) + p2) - (pa1 * p);
            p2 = (pb2 * x) - (pa2 * p);
            var l = (lb0 * x) + l1;
            l1 = ((lb1 * x) + l2) - (la1 * l);
            l2 = (lb2 * x) - (la2 * l);
            sumSqP += p * p;
            sumSqL += l * l;
            peakP = Math.Max(peakP, Math.Abs(p));
            peakL = Math.Max(peakL, Math.Abs(l)); // Math.Max propagates NaN
        }

        _perception.State = (p1, p2);
        _letGo.State = (l1, l2);
        (_sumSqP, _sumSqL, _peakP, _peakL) = (sumSqP, sumSqL, peakP, peakL);
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
