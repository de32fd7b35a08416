using System.Globalization;

namespace WaveCheck.Core.Synthesis;

/// <summary>
/// A synthesized supply voltage to earth: a sine of <see cref="RmsV"/> at the mains frequency with optional
/// harmonics, on one phase or on three (L2 lagging L1 by 120°, L3 leading it by 120°; each harmonic n shifted by n
/// times the phase's angle, as on a balanced three-phase supply). Immutable and thread-safe.
/// </summary>
/// <param name="RmsV">Fundamental RMS, volts.</param>
/// <param name="FrequencyHz">Mains frequency, hertz.</param>
/// <param name="Harmonics">Harmonics: order n ≥ 2, RMS as a share of the fundamental's, phase at t = 0 in degrees.</param>
/// <param name="Phases">1 or 3.</param>
public sealed record SupplyVoltage(double RmsV, double FrequencyHz, IReadOnlyList<(int Order, double Share, double PhaseDeg)> Harmonics,
    int Phases = 1)
{
    /// <summary>The phase angle of phase <paramref name="phase"/> (0 for L1, 1 for L2, 2 for L3), degrees: 0, −120, +120.</summary>
    public static double PhaseAngleDeg(int phase) => phase switch
    {
        0 => 0,
        1 => -120,
        2 => 120,
        _ => throw new ArgumentOutOfRangeException(nameof(phase), phase, "0, 1 or 2"),
    };

    /// <summary>Every sine of one phase: (order, peak volts, phase at t = 0 in radians).</summary>
    public IEnumerable<(int Order, double PeakV, double PhaseRad)> Sines(int phase)
    {
        var shift = PhaseAngleDeg(phase);
        yield return (1, RmsV * Math.Sqrt(2), shift * Math.PI / 180);
        foreach (var (order, share, phaseDeg) in Harmonics)
        {
            yield return (order, share * RmsV * Math.Sqrt(2), (phaseDeg + (order * shift)) * Math.PI / 180);
        }
    }

    /// <summary>Writes phase <paramref name="phase"/>'s voltage for samples [start, start + destination.Length).</summary>
    public void Write(int phase, long startSample, double sampleRateHz, Span<double> destinationV)
    {
        destinationV.Clear();
        foreach (var (order, peak, phi) in Sines(phase))
        {
            var cyclesPerSample = order * FrequencyHz / sampleRateHz;
            for (var i = 0; i < destinationV.Length; i++)
            {
                var cycles = (startSample + i) * cyclesPerSample;
                cycles -= Math.Floor(cycles);
                destinationV[i] += peak * Math.Sin((2 * Math.PI * cycles) + phi);
            }
        }
    }

    /// <summary>A short description.</summary>
    public string Describe() => string.Create(CultureInfo.InvariantCulture,
        $"{(Phases == 3 ? "three-phase " : "")}{RmsV:0.#} V to earth at {FrequencyHz:0.###} Hz{string.Concat(Harmonics.Select(h => $", h{h.Order} {h.Share * 100:0.##} %"))}");
}

/// <summary>
/// The leakage current of a resistance and a capacitance in parallel from one phase of a <see cref="SupplyVoltage"/>
/// to earth, in closed form for each sine of the voltage V_n sin(nωt + φ): V_n/R · sin(nωt + φ) + nωC·V_n · cos(nωt + φ)
/// (Ohm's law and i = C dv/dt).
/// </summary>
/// <param name="Supply">The supply.</param>
/// <param name="OnPhase">0 for L1 (or the single phase), 1 for L2, 2 for L3.</param>
/// <param name="ResistanceOhm">R, ohms; null for none (an open circuit).</param>
/// <param name="CapacitanceF">C, farads; 0 for none. Negative: a capacitance missing from a balanced set.</param>
public sealed class RcLeakageComponent(SupplyVoltage Supply, int OnPhase, double? ResistanceOhm, double CapacitanceF) : WaveformComponent
{
    /// <inheritdoc />
    public override void AddTo(long startSample, double sampleRateHz, Span<double> destinationA)
    {
        var conductance = ResistanceOhm is { } r ? 1 / r : 0;
        foreach (var (order, peak, phi) in Supply.Sines(OnPhase))
        {
            var cyclesPerSample = order * Supply.FrequencyHz / sampleRateHz;
            var inPhase = peak * conductance;
            var quadrature = peak * 2 * Math.PI * order * Supply.FrequencyHz * CapacitanceF;
            for (var i = 0; i < destinationA.Length; i++)
            {
                var cycles = (startSample + i) * cyclesPerSample;
                cycles -= Math.Floor(cycles);
                var (sin, cos) = Math.SinCos((2 * Math.PI * cycles) + phi);
                destinationA[i] += (inPhase * sin) + (quadrature * cos);
            }
        }
    }

    /// <inheritdoc />
    public override string Describe() => string.Create(CultureInfo.InvariantCulture,
        $"leakage on L{OnPhase + 1}: {(ResistanceOhm is { } r ? $"{r / 1e3:0.###} kΩ" : "no R")} ∥ {CapacitanceF * 1e9:0.###} nF");
}
