namespace WaveCheck.Core.Signal;

/// <summary>
/// The IEC 60990 touch-current measuring networks as analog transfer functions from their component values, and
/// their digital (bilinear) counterparts.
/// </summary>
/// <remarks>
/// <para><b>Model.</b> The recorded residual current I is taken as the current injected into the network's terminals
/// A–B (the current through the body model). Each function is H(s) = reading / I, the reading being the network's
/// output voltage divided by 500 Ω, as IEC 60990 defines it. Derivation by nodal analysis (ground at terminal B,
/// node T at the top of RB):</para>
/// <list type="bullet">
/// <item>Fig. 3, unweighted: RS ∥ CS carries I in series and RB (500 Ω) carries all of it: U1 = 500 I, H1(s) = 1.</item>
/// <item>Fig. 4, perception/reaction: R1 + C1 in series across RB, U2 across C1. The voltage at T is
/// I·(RB ∥ (R1 + 1/sC1)) and U2 = V_T/(1 + sR1C1), which reduces to H2(s) = (RB/500) / (1 + s C1 (R1 + RB)):
/// one real pole at 1/(2π C1 (R1 + RB)) = 689 Hz.</item>
/// <item>Fig. 5, let-go: ladder R1 – C1 – R2 – C2 across RB, U3 across C2. With a = 1 + sR2C2:
/// V1 = a U3, V_T = b U3 with b = a(1 + sR1C1) + sR1C2, and I = V_T/RB + s(aC1 + C2) U3, so
/// H3(s) = (RB/500) / (1 + s(R1C1 + R2C2 + R1C2 + RB(C1 + C2)) + s² C1C2R2(R1 + RB)).</item>
/// </list>
/// <para><b>Assumption.</b> Under current drive RS ∥ CS shapes no reading; the standard drives the network with the
/// touch voltage, where RS ∥ CS does matter. A residual-current capture has no touch voltage, so the readings here
/// weight the measured current itself; they equal the standard's readings when the source impedance is high
/// compared with the network (a current source), and are an approximation otherwise.</para>
/// <para><b>Discretisation.</b> Bilinear transform s = 2·fs·(1 − z⁻¹)/(1 + z⁻¹) without prewarping (as
/// <c>scipy.signal.bilinear</c>): the digital response at f equals the analog one at (fs/π)·tan(πf/fs), 0.13 % above
/// f at 1 kHz and 50 kS/s. Stateless and thread-safe.</para>
/// </remarks>
public static class TouchCurrentNetworks
{
    /// <summary>RS, 1500 Ω (IEC 60990 Fig. 3, std).</summary>
    public const double RsOhm = 1500;

    /// <summary>CS, 0.22 µF (IEC 60990 Fig. 3, std).</summary>
    public const double CsF = 0.22e-6;

    /// <summary>RB, 500 Ω (IEC 60990 Fig. 3, std).</summary>
    public const double RbOhm = 500;

    /// <summary>The reading is the output voltage divided by 500 Ω (IEC 60990; readout from memory).</summary>
    public const double ReadingOhm = 500;

    /// <summary>Perception/reaction network R1, 10 kΩ (IEC 60990 Fig. 4, std).</summary>
    public const double PerceptionR1Ohm = 10e3;

    /// <summary>Perception/reaction network C1, 0.022 µF (IEC 60990 Fig. 4, std).</summary>
    public const double PerceptionC1F = 0.022e-6;

    /// <summary>Let-go network R1, 10 kΩ (IEC 60990 Fig. 5, from memory).</summary>
    public const double LetGoR1Ohm = 10e3;

    /// <summary>Let-go network C1, 6.2 nF (IEC 60990 Fig. 5, from memory).</summary>
    public const double LetGoC1F = 6.2e-9;

    /// <summary>Let-go network R2, 20 kΩ (IEC 60990 Fig. 5, from memory).</summary>
    public const double LetGoR2Ohm = 20e3;

    /// <summary>Let-go network C2, 9.1 nF (IEC 60990 Fig. 5, from memory).</summary>
    public const double LetGoC2F = 9.1e-9;

    /// <summary>Fig. 3 unweighted reading U1/500 Ω per ampere injected: H1(s) = RB/500.</summary>
    public static AnalogTransferFunction Unweighted() => new([RbOhm / ReadingOhm], [1.0]);

    /// <summary>Fig. 4 perception/reaction reading U2/500 Ω per ampere: (RB/500) / (1 + s C1 (R1 + RB)).</summary>
    public static AnalogTransferFunction Perception() =>
        new([RbOhm / ReadingOhm], [1.0, PerceptionC1F * (PerceptionR1Ohm + RbOhm)]);

    /// <summary>Fig. 5 let-go reading U3/500 Ω per ampere: (RB/500) / (1 + s τ1 + s² τ2²).</summary>
    public static AnalogTransferFunction LetGo()
    {
        const double r1 = LetGoR1Ohm, c1 = LetGoC1F, r2 = LetGoR2Ohm, c2 = LetGoC2F, rb = RbOhm;
        var s1 = (r1 * c1) + (r2 * c2) + (r1 * c2) + (rb * (c1 + c2));
        var s2 = c1 * c2 * r2 * (r1 + rb);
        return new([rb / ReadingOhm], [1.0, s1, s2]);
    }

    /// <summary>Discretises <paramref name="analog"/> (order ≤ 2) by the bilinear transform without prewarping.</summary>
    /// <param name="analog">Analog transfer function.</param>
    /// <param name="sampleRateHz">Sample rate, hertz.</param>
    /// <returns>A fresh streaming section (its own state).</returns>
    public static TouchCurrentFilter Discretise(AnalogTransferFunction analog, double sampleRateHz)
    {
        ArgumentNullException.ThrowIfNull(analog);
        if (!(sampleRateHz > 0) || !double.IsFinite(sampleRateHz))
        {
            throw new ArgumentOutOfRangeException(nameof(sampleRateHz), sampleRateHz, "sample rate must be a positive number of hertz");
        }

        var order = Math.Max(analog.Numerator.Count, analog.Denominator.Count) - 1;
        if (order > 2)
        {
            throw new ArgumentException($"order must be at most 2 (got {order})", nameof(analog));
        }

        var k = 2 * sampleRateHz;
        var b = Map(analog.Numerator, order, k);
        var a = Map(analog.Denominator, order, k);
        var a0 = a[0];
        return new TouchCurrentFilter(b[0] / a0, b[1] / a0, b[2] / a0, a[1] / a0, a[2] / a0, sampleRateHz);
    }

    /// <summary>Σ c_k K^k (1 − z⁻¹)^k (1 + z⁻¹)^(N − k), coefficients of z⁰, z⁻¹, z⁻².</summary>
    private static double[] Map(IReadOnlyList<double> poly, int order, double k)
    {
        var result = new double[3];
        Span<double> term = stackalloc double[3];
        for (var p = 0; p < poly.Count; p++)
        {
            term.Clear();
            term[0] = poly[p] * Math.Pow(k, p);
            var degree = 0;
            for (var i = 0; i < p; i++)
            {
                MultiplyByOnePlus(term, ref degree, -1);
            }

            for (var i = p; i < order; i++)
            {
                MultiplyByOnePlus(term, ref degree, +1);
            }

            for (var i = 0; i < 3; i++)
            {
                result[i] += term[i];
            }
        }

        return result;
    }

    /// <summary>Multiplies a polynomial in z⁻¹ by (1 + sign·z⁻¹).</summary>
    private static void MultiplyByOnePlus(Span<double> poly, ref int degree, int sign)
    {
        for (var i = degree + 1; i >= 1; i--)
        {
            poly[i] += sign * poly[i - 1];
        }

        degree++;
    }
}
