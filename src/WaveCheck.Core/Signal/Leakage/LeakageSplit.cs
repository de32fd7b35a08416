using System.Numerics;

namespace WaveCheck.Core.Signal;

/// <summary>The fundamental of a residual current split against its voltage.</summary>
/// <param name="VoltageRmsV">|V|, RMS, volts.</param>
/// <param name="ResistiveA">I_R = Re(I·V*)/|V|: the part in phase with the voltage, RMS, amperes, signed.</param>
/// <param name="CapacitiveA">I_C = Im(I·V*)/|V|: the part leading the voltage by 90°, RMS, amperes, signed.</param>
/// <param name="FrequencyHz">Frequency of the phasors, hertz.</param>
public readonly record struct LeakageComponents(double VoltageRmsV, double ResistiveA, double CapacitiveA, double FrequencyHz)
{
    /// <summary>G = I_R / V, siemens.</summary>
    public double ConductanceS => ResistiveA / VoltageRmsV;

    /// <summary>R = V / I_R, ohms (infinite for no resistive part, negative for a negative one).</summary>
    public double ResistanceOhm => VoltageRmsV / ResistiveA;

    /// <summary>C = I_C / (2π f V), farads.</summary>
    public double CapacitanceF => CapacitiveA / (2 * Math.PI * FrequencyHz * VoltageRmsV);
}

/// <summary>A conductance and a capacitance fitted over harmonic orders.</summary>
/// <param name="ConductanceS">G, siemens.</param>
/// <param name="CapacitanceF">C, farads.</param>
/// <param name="Residual">√(Σ|I_n − V_n(G + jnωC)|² / Σ|I_n|²), 0 for a perfect fit; NaN when nothing was fitted.</param>
/// <param name="Orders">Orders fitted.</param>
public readonly record struct RcFit(double ConductanceS, double CapacitanceF, double Residual, int Orders);

/// <summary>One of the six directions of a three-phase leakage, with the current along it.</summary>
/// <param name="Phase">0 for L1, 1 for L2, 2 for L3.</param>
/// <param name="Capacitive">True for the direction leading the phase voltage by 90°, false for the voltage's own.</param>
/// <param name="CurrentA">Current along the direction, RMS, amperes, not negative.</param>
public readonly record struct LeakageDirection(int Phase, bool Capacitive, double CurrentA)
{
    /// <summary>Index 0..5 of the direction: 2·phase, plus 1 when capacitive.</summary>
    public int Index => (2 * Phase) + (Capacitive ? 1 : 0);
}

/// <summary>
/// The arithmetic of splitting a residual current against the circuit voltage, on RMS phasors. Pure functions;
/// thread-safe.
/// </summary>
/// <remarks>
/// A leakage to earth through an insulation resistance R and a capacitance C in parallel draws, at the voltage
/// phasor V and angular frequency ω, I = V (1/R + jωC) (Ohm's law and the capacitor's admittance; REFERENCE.md,
/// "Insulation"): the resistive part in phase with V, the capacitive part leading it by 90°. docs/methods.md gives
/// each formula with its status.
/// </remarks>
public static class LeakageSplit
{
    /// <summary>The RMS phasor of DFT bin <paramref name="bin"/> of a window: √2/L · Σ x_n e^{−2πi·bin·n/L}.</summary>
    /// <param name="samples">The window, L samples (at least 2).</param>
    /// <param name="bin">The bin, 1 to ⌊(L − 1)/2⌋ (below the Nyquist bin): the harmonic order times the cycles in the window.</param>
    /// <remarks>Goertzel's recurrence (one multiply-add a sample): s_n = x_n + 2cos(ω)s_{n−1} − s_{n−2}, then
    /// X = e^{iω}s_{L−1} − s_{L−2} with ω = 2π·bin/L. A synchronised rectangular window of whole cycles puts each
    /// harmonic in its own bin, and DC in none.</remarks>
    public static Complex BinPhasor(ReadOnlySpan<double> samples, int bin)
    {
        var length = samples.Length;
        if (length < 2 || bin < 1 || 2 * bin >= length)
        {
            throw new ArgumentOutOfRangeException(nameof(bin), $"bin must lie in 1..{(length - 1) / 2} for a window of {length} samples (got {bin})");
        }

        var w = 2 * Math.PI * bin / length;
        var (sin, cos) = Math.SinCos(w);
        var coefficient = 2 * cos;
        double s1 = 0, s2 = 0;
        foreach (var x in samples)
        {
            var s0 = x + (coefficient * s1) - s2;
            s2 = s1;
            s1 = s0;
        }

        var scale = Math.Sqrt(2) / length;
        return new Complex(((cos * s1) - s2) * scale, sin * s1 * scale);
    }

    /// <summary>Splits the current phasor into the parts in phase with and in quadrature to the voltage.</summary>
    /// <param name="voltageV">Voltage phasor, RMS, volts (not zero).</param>
    /// <param name="currentA">Residual current phasor at the same frequency, RMS, amperes.</param>
    /// <param name="frequencyHz">Their frequency, hertz.</param>
    public static LeakageComponents Split(Complex voltageV, Complex currentA, double frequencyHz)
    {
        var v = voltageV.Magnitude;
        var referred = currentA * Complex.Conjugate(voltageV) / v;
        return new LeakageComponents(v, referred.Real, referred.Imaginary, frequencyHz);
    }

    /// <summary>
    /// Least-squares fit of I_n = V_n (G + j n ω C) over the given orders: minimises Σ|I_n − V_n(G + jnωC)|² over real
    /// G and C. The two columns V_n and j n ω V_n are orthogonal in the real inner product Re(a·b*), so the normal
    /// equations decouple: G = Σ Re(I_n V_n*) / Σ|V_n|², C = Σ nω Im(I_n V_n*) / Σ (nω)²|V_n|².
    /// </summary>
    /// <param name="voltagesV">Voltage phasors per order, RMS, volts.</param>
    /// <param name="currentsA">Current phasors per order, RMS, amperes.</param>
    /// <param name="orders">The harmonic orders n.</param>
    /// <param name="fundamentalHz">The fundamental frequency, hertz.</param>
    public static RcFit Fit(ReadOnlySpan<Complex> voltagesV, ReadOnlySpan<Complex> currentsA, ReadOnlySpan<int> orders,
        double fundamentalHz)
    {
        if (voltagesV.Length != currentsA.Length || voltagesV.Length != orders.Length)
        {
            throw new ArgumentException($"one voltage and one current per order expected (got {voltagesV.Length}, {currentsA.Length}, {orders.Length})");
        }

        var omega = 2 * Math.PI * fundamentalHz;
        double gNum = 0, gDen = 0, cNum = 0, cDen = 0, currentSquares = 0;
        for (var k = 0; k < orders.Length; k++)
        {
            var v = voltagesV[k];
            var product = currentsA[k] * Complex.Conjugate(v);
            var v2 = (v.Real * v.Real) + (v.Imaginary * v.Imaginary);
            var nw = orders[k] * omega;
            gNum += product.Real;
            gDen += v2;
            cNum += nw * product.Imaginary;
            cDen += nw * nw * v2;
            currentSquares += Complex.Abs(currentsA[k]) * Complex.Abs(currentsA[k]);
        }

        if (gDen <= 0)
        {
            return new RcFit(double.NaN, double.NaN, double.NaN, 0);
        }

        var g = gNum / gDen;
        var c = cNum / cDen;
        var misfit = 0.0;
        for (var k = 0; k < orders.Length; k++)
        {
            var model = voltagesV[k] * new Complex(g, orders[k] * omega * c);
            var e = currentsA[k] - model;
            misfit += (e.Real * e.Real) + (e.Imaginary * e.Imaginary);
        }

        var residual = currentSquares > 0 ? Math.Sqrt(misfit / currentSquares) : 0;
        return new RcFit(g, c, residual, orders.Length);
    }

    /// <summary>
    /// Locates a three-phase leakage: the residual phasor written as a non-negative combination of the two nearest
    /// of the six directions V_k/|V_k| (resistive on phase k) and jV_k/|V_k| (capacitive on phase k), the pair that
    /// brackets it most tightly.
    /// </summary>
    /// <param name="voltagesV">The three phase-to-earth voltage phasors, L1, L2, L3, RMS, volts.</param>
    /// <param name="currentA">The residual current phasor, RMS, amperes.</param>
    /// <returns>The two directions, the larger current first (both zero for a zero current).</returns>
    /// <remarks>Balanced capacitances (and balanced resistances) to earth draw currents that sum to zero on balanced
    /// voltages, so the residual current shows only the asymmetry: an extra path on one phase, or a missing one
    /// (which appears as the opposite of that phase's direction, between the two others' directions).</remarks>
    public static (LeakageDirection First, LeakageDirection Second) Locate(ReadOnlySpan<Complex> voltagesV, Complex currentA)
    {
        if (voltagesV.Length != 3)
        {
            throw new ArgumentException($"three phase voltages expected (got {voltagesV.Length})", nameof(voltagesV));
        }

        Span<Complex> directions = stackalloc Complex[6];
        for (var p = 0; p < 3; p++)
        {
            var unit = voltagesV[p] / voltagesV[p].Magnitude;
            directions[2 * p] = unit;
            directions[(2 * p) + 1] = unit * Complex.ImaginaryOne;
        }

        if (currentA.Magnitude == 0)
        {
            return (new LeakageDirection(0, false, 0), new LeakageDirection(0, true, 0));
        }

        var best = (A: -1, B: -1, X: 0.0, Y: 0.0, Span: double.PositiveInfinity);
        for (var a = 0; a < 6; a++)
        {
            for (var b = a + 1; b < 6; b++)
            {
                // I = x·d_a + y·d_b, solved by Cramer's rule on the real and imaginary parts.
                var (da, db) = (directions[a], directions[b]);
                var det = (da.Real * db.Imaginary) - (da.Imaginary * db.Real);
                if (Math.Abs(det) < 1e-9)
                {
                    continue;
                }

                var x = ((currentA.Real * db.Imaginary) - (currentA.Imaginary * db.Real)) / det;
                var y = ((da.Real * currentA.Imaginary) - (da.Imaginary * currentA.Real)) / det;
                var tolerance = 1e-12 * currentA.Magnitude;
                if (x < -tolerance || y < -tolerance)
                {
                    continue;
                }

                var span = Math.Acos(Math.Clamp((da.Real * db.Real) + (da.Imaginary * db.Imaginary), -1, 1));
                if (span < best.Span)
                {
                    best = (a, b, Math.Max(x, 0), Math.Max(y, 0), span);
                }
            }
        }

        var first = new LeakageDirection(best.A / 2, best.A % 2 == 1, best.X);
        var second = new LeakageDirection(best.B / 2, best.B % 2 == 1, best.Y);
        return first.CurrentA >= second.CurrentA ? (first, second) : (second, first);
    }
}
