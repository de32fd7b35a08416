namespace WaveCheck.Core.Synthesis;

/// <summary>
/// One part of a synthesized residual current. Components add into a buffer, so a test waveform of the standards
/// (a half-wave on smooth DC, a composite converter current) is a sum of simple parts.
/// Implementations are immutable and thread-safe.
/// </summary>
public abstract class WaveformComponent
{
    /// <summary>Adds this component's samples for <c>[startSample, startSample + destinationA.Length)</c> into the buffer.</summary>
    /// <param name="startSample">Index of the first sample from the start of the waveform.</param>
    /// <param name="sampleRateHz">Sample rate, hertz.</param>
    /// <param name="destinationA">Buffer to add into, amperes.</param>
    public abstract void AddTo(long startSample, double sampleRateHz, Span<double> destinationA);

    /// <summary>A short description with the parameters, for metadata and logs.</summary>
    public abstract string Describe();

    /// <summary>Phase of mains at a sample, radians in [0, 2π), with the sine's positive zero crossing at 0.</summary>
    protected static double Phase(long sample, double sampleRateHz, double frequencyHz, double phaseDeg = 0)
    {
        // Reduce the cycle count before multiplying by 2π to keep precision on long waveforms.
        var cycles = sample * (frequencyHz / sampleRateHz) + phaseDeg / 360.0;
        cycles -= Math.Floor(cycles);
        return cycles * 2 * Math.PI;
    }
}

/// <summary>A sinusoid: <c>i(t) = √2 · RmsA · sin(2π f t + φ)</c>.</summary>
/// <param name="RmsA">RMS, amperes.</param>
/// <param name="FrequencyHz">Frequency, hertz.</param>
/// <param name="PhaseDeg">Phase at t = 0, degrees.</param>
public sealed class SineComponent(double RmsA, double FrequencyHz, double PhaseDeg = 0) : WaveformComponent
{
    /// <inheritdoc />
    public override void AddTo(long startSample, double sampleRateHz, Span<double> destinationA)
    {
        var peak = RmsA * Math.Sqrt(2);
        for (var i = 0; i < destinationA.Length; i++)
        {
            destinationA[i] += peak * Math.Sin(Phase(startSample + i, sampleRateHz, FrequencyHz, PhaseDeg));
        }
    }

    /// <inheritdoc />
    public override string Describe() => $"sine {RmsA * 1e3:0.###} mA rms at {FrequencyHz:0.###} Hz, phase {PhaseDeg:0.#}°";
}

/// <summary>
/// Phase-controlled half-wave (pulsating DC): <c>Ipk · sin θ</c> for θ in [α, π) of each mains cycle, zero elsewhere,
/// α the current-delay angle. α = 0 is the plain half-wave rectified sine. Negative polarity mirrors it.
/// </summary>
/// <remarks>The test currents of IEC 61008-1 / IEC 61009-1 for type A at delay angles 0°, 90° and 135°.</remarks>
/// <param name="PeakA">Peak of the underlying sine, amperes.</param>
/// <param name="FrequencyHz">Mains frequency, hertz.</param>
/// <param name="DelayAngleDeg">Current-delay angle α, degrees, 0 to 180.</param>
/// <param name="Negative">True for the negative half-wave.</param>
public sealed class HalfWaveComponent(double PeakA, double FrequencyHz, double DelayAngleDeg = 0, bool Negative = false)
    : WaveformComponent
{
    /// <inheritdoc />
    public override void AddTo(long startSample, double sampleRateHz, Span<double> destinationA)
    {
        var alpha = DelayAngleDeg * Math.PI / 180;
        var sign = Negative ? -1.0 : 1.0;
        for (var i = 0; i < destinationA.Length; i++)
        {
            var theta = Phase(startSample + i, sampleRateHz, FrequencyHz);
            if (theta >= alpha && theta < Math.PI)
            {
                destinationA[i] += sign * PeakA * Math.Sin(theta);
            }
        }
    }

    /// <inheritdoc />
    public override string Describe() =>
        $"half-wave {(Negative ? "negative" : "positive")} {PeakA * 1e3:0.###} mA peak at {FrequencyHz:0.###} Hz, delay angle {DelayAngleDeg:0.#}°";
}

/// <summary>Smooth DC: a constant current, either polarity.</summary>
/// <param name="LevelA">Level, amperes (signed).</param>
public sealed class SmoothDcComponent(double LevelA) : WaveformComponent
{
    /// <inheritdoc />
    public override void AddTo(long startSample, double sampleRateHz, Span<double> destinationA)
    {
        for (var i = 0; i < destinationA.Length; i++)
        {
            destinationA[i] += LevelA;
        }
    }

    /// <inheritdoc />
    public override string Describe() => $"smooth DC {LevelA * 1e3:0.###} mA";
}

/// <summary>
/// Output of a three-phase six-pulse bridge, the residual current of a fault on a drive's DC link: the upper envelope
/// of the six line-to-line sines, scaled so its mean is <c>MeanA</c>. Ripple at 6 × mains (300 Hz at 50 Hz),
/// peak-to-peak 1 − cos 30° ≈ 13.4 % of the peak (closed form of the bridge rectifier).
/// </summary>
/// <param name="MeanA">Mean (smooth DC) of the rectified current, amperes; sign gives the polarity.</param>
/// <param name="FrequencyHz">Mains frequency, hertz.</param>
public sealed class SixPulseComponent(double MeanA, double FrequencyHz) : WaveformComponent
{
    /// <inheritdoc />
    public override void AddTo(long startSample, double sampleRateHz, Span<double> destinationA)
    {
        // Mean of the six-pulse envelope is (3/π)·peak (closed form), so peak = mean·π/3.
        var peak = MeanA * Math.PI / 3;
        for (var i = 0; i < destinationA.Length; i++)
        {
            var theta = Phase(startSample + i, sampleRateHz, FrequencyHz);
            // Within each 60° segment the envelope is cos of the distance to the segment centre.
            var segment = theta % (Math.PI / 3);
            destinationA[i] += peak * Math.Cos(segment - Math.PI / 6);
        }
    }

    /// <inheritdoc />
    public override string Describe() => $"six-pulse rectified {MeanA * 1e3:0.###} mA mean at {FrequencyHz:0.###} Hz mains";
}

/// <summary>
/// Output of a p-pulse rectifier (p = 2: single-phase bridge, full-wave; 3: three-phase star; 6: three-phase bridge),
/// the residual current of a fault behind it: the upper envelope of p sines evenly spaced over a mains period, scaled
/// so its mean is <c>MeanA</c>. Closed forms: mean = peak · (p/π) · sin(π/p); the current falls to zero only for
/// p = 2, and then only at instants, so none of them is pulsating DC (IEC 61008-1 definition).
/// </summary>
/// <param name="MeanA">Mean of the rectified current, amperes; sign gives the polarity.</param>
/// <param name="FrequencyHz">Mains frequency, hertz.</param>
/// <param name="Pulses">Pulses per mains period: 2, 3 or 6.</param>
/// <param name="PhaseDeg">Phase of the first pulse's peak, degrees.</param>
public sealed class RectifiedComponent(double MeanA, double FrequencyHz, int Pulses, double PhaseDeg = 0) : WaveformComponent
{
    /// <inheritdoc />
    public override void AddTo(long startSample, double sampleRateHz, Span<double> destinationA)
    {
        var peak = MeanA * Math.PI / (Pulses * Math.Sin(Math.PI / Pulses));
        var segmentRad = 2 * Math.PI / Pulses;
        for (var i = 0; i < destinationA.Length; i++)
        {
            var theta = Phase(startSample + i, sampleRateHz, FrequencyHz, PhaseDeg);
            destinationA[i] += peak * Math.Cos((theta % segmentRad) - (segmentRad / 2));
        }
    }

    /// <inheritdoc />
    public override string Describe() => $"{Pulses}-pulse rectified {MeanA * 1e3:0.###} mA mean at {FrequencyHz:0.###} Hz mains";
}

/// <summary>
/// High-frequency leakage of a PWM inverter through cable and filter capacitance: a carrier at the switching
/// frequency with its second harmonic at half the amplitude, its envelope modulated at the motor frequency.
/// </summary>
/// <param name="RmsA">RMS of the carrier component, amperes.</param>
/// <param name="SwitchingHz">Switching frequency, hertz (2 to 16 kHz typical, REFERENCE.md).</param>
/// <param name="MotorHz">Motor (output) frequency modulating the envelope, hertz; 0 for none.</param>
public sealed class SwitchingComponent(double RmsA, double SwitchingHz, double MotorHz = 0) : WaveformComponent
{
    /// <inheritdoc />
    public override void AddTo(long startSample, double sampleRateHz, Span<double> destinationA)
    {
        var peak = RmsA * Math.Sqrt(2);
        for (var i = 0; i < destinationA.Length; i++)
        {
            var n = startSample + i;
            var envelope = MotorHz > 0 ? 0.75 + 0.25 * Math.Cos(Phase(n, sampleRateHz, MotorHz)) : 1.0;
            destinationA[i] += envelope * peak * (Math.Sin(Phase(n, sampleRateHz, SwitchingHz))
                                                  + 0.5 * Math.Sin(Phase(n, sampleRateHz, 2 * SwitchingHz)));
        }
    }

    /// <inheritdoc />
    public override string Describe() =>
        $"switching leakage {RmsA * 1e3:0.###} mA rms at {SwitchingHz:0.###} Hz (+2nd), motor {MotorHz:0.###} Hz";
}

/// <summary>White Gaussian noise of a stated RMS, reproducible from a seed whatever the block size.</summary>
/// <param name="RmsA">RMS, amperes.</param>
/// <param name="Seed">Seed.</param>
public sealed class NoiseComponent(double RmsA, int Seed = 1) : WaveformComponent
{
    /// <inheritdoc />
    public override void AddTo(long startSample, double sampleRateHz, Span<double> destinationA)
    {
        for (var i = 0; i < destinationA.Length; i++)
        {
            destinationA[i] += RmsA * Gaussian((ulong)(startSample + i));
        }
    }

    /// <inheritdoc />
    public override string Describe() => $"noise {RmsA * 1e3:0.###} mA rms, seed {Seed}";

    // Counter-based generator (SplitMix64 of seed and index) so block boundaries do not change the noise.
    private double Gaussian(ulong index)
    {
        var u1 = ToUnit(Mix(index * 2 + ((ulong)Seed << 40)));
        var u2 = ToUnit(Mix(index * 2 + 1 + ((ulong)Seed << 40)));
        return Math.Sqrt(-2 * Math.Log(u1)) * Math.Cos(2 * Math.PI * u2);
    }

    private static ulong Mix(ulong z)
    {
        z += 0x9E3779B97F4A7C15UL;
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return z ^ (z >> 31);
    }

    private static double ToUnit(ulong bits) => ((bits >> 11) + 0.5) / (1UL << 53);
}

/// <summary>
/// A surge: a sinusoid switched on at <c>StartS</c> for <c>DurationS</c>, zero outside, with an optional exponential
/// decay of its amplitude, <c>i(t) = √2 · RmsA · e^(−(t − t₀)/τ) · sin(2π f t + φ)</c> for t₀ ≤ t &lt; t₀ + d.
/// A switch-on surge of a filter's capacitance or a motor's inrush (decaying), or the rectangular test current of a
/// break-time test (no decay, IEC 61008-1: a residual current of a stated multiple of IΔn suddenly applied).
/// </summary>
/// <param name="RmsA">RMS at the start of the surge, amperes.</param>
/// <param name="FrequencyHz">Frequency, hertz.</param>
/// <param name="StartS">Switch-on time, seconds from the start of the waveform.</param>
/// <param name="DurationS">How long it flows, seconds.</param>
/// <param name="DecayS">Time constant τ of the amplitude's decay, seconds; 0 for a constant amplitude.</param>
/// <param name="PhaseDeg">Phase of the underlying sine at t = 0, degrees.</param>
public sealed class SurgeComponent(double RmsA, double FrequencyHz, double StartS, double DurationS, double DecayS = 0,
    double PhaseDeg = 0) : WaveformComponent
{
    /// <inheritdoc />
    public override void AddTo(long startSample, double sampleRateHz, Span<double> destinationA)
    {
        var peak = RmsA * Math.Sqrt(2);
        // Sample indices of the switching instants (half-open: [first, end)), rounded once so that block boundaries
        // do not change where the surge starts or stops.
        var first = (long)Math.Round(StartS * sampleRateHz);
        var end = (long)Math.Round((StartS + DurationS) * sampleRateHz);
        for (var i = Math.Max(0, first - startSample); i < destinationA.Length && startSample + i < end; i++)
        {
            var n = startSample + i;
            var envelope = DecayS > 0 ? Math.Exp(-((n - first) / sampleRateHz) / DecayS) : 1.0;
            destinationA[(int)i] += envelope * peak * Math.Sin(Phase(n, sampleRateHz, FrequencyHz, PhaseDeg));
        }
    }

    /// <inheritdoc />
    public override string Describe() =>
        $"surge {RmsA * 1e3:0.###} mA rms at {FrequencyHz:0.###} Hz from {StartS:0.######} s for {DurationS * 1e3:0.###} ms"
        + (DecayS > 0 ? $", decay {DecayS * 1e3:0.###} ms" : string.Empty);
}
