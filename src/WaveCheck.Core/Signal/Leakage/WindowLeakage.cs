using System.Numerics;

namespace WaveCheck.Core.Signal;

/// <summary>What <see cref="LeakageWindowMeasurement"/> found in one window (a value in its <see cref="WindowSlot"/>).</summary>
internal struct WindowLeakage
{
    /// <summary>False when the voltage was too low to refer to (the window is counted, not split).</summary>
    public bool Valid;

    /// <summary>Start of the window, seconds.</summary>
    public double StartS;

    /// <summary>The window's fundamental, cycles·fs/L, hertz.</summary>
    public double FrequencyHz;

    /// <summary>Fundamental RMS of the voltage (three-phase: mean of the three), volts.</summary>
    public double VoltageRmsV;

    /// <summary>Resistive part, amperes, signed (three-phase: sum over the located resistive directions).</summary>
    public double ResistiveA;

    /// <summary>Capacitive part, amperes, signed (three-phase: sum over the located capacitive directions).</summary>
    public double CapacitiveA;

    /// <summary>Conductance drawing the resistive part, siemens, signed.</summary>
    public double ConductanceS;

    /// <summary>Capacitance drawing the capacitive part, farads, signed.</summary>
    public double CapacitanceF;

    /// <summary>Residual current fundamental referred to the first voltage's angle, amperes.</summary>
    public Complex CurrentReferredA;

    /// <summary>Three-phase: L2's and L3's voltage referred to L1's angle, volts.</summary>
    public Complex Voltage2V;

    /// <summary>Three-phase: L3's voltage referred to L1's angle, volts.</summary>
    public Complex Voltage3V;

    /// <summary>Single-phase: the R-C fit over the significant orders.</summary>
    public RcFit Fit;

    /// <summary>Single-phase: bit n set when order n was fitted.</summary>
    public int FitOrderMask;

    /// <summary>Three-phase: the larger of the two located directions.</summary>
    public LeakageDirection First;

    /// <summary>Three-phase: the smaller of the two located directions.</summary>
    public LeakageDirection Second;
}

/// <summary>
/// Splits one window's residual current against the voltage samples carried alongside it in its slot: the
/// fundamental phasors by <see cref="LeakageSplit.BinPhasor"/> at bin = cycles (the window holds whole cycles), the
/// harmonic fit of a single-phase window over the orders where both voltage and current are significant, the
/// location of a three-phase one. Depends on the window alone; holds no state: thread-safe.
/// </summary>
internal sealed class LeakageWindowMeasurement
{
    /// <summary>A window whose voltage fundamental is below this is not split, volts.</summary>
    /// <remarks>Engineering choice: well below any low-voltage supply (a 230 V system sags to 90 % in normal
    /// service) and well above what an open or floating input picks up, so a disconnected channel is reported
    /// instead of turned into a resistance.</remarks>
    public const double MinimumVoltageV = 20;

    /// <summary>Highest harmonic order fitted.</summary>
    /// <remarks>Engineering choice: supply voltage harmonics above the 13th are small fractions of a per cent in
    /// low-voltage networks (common practice, no source), below what would carry the fit.</remarks>
    public const int MaxFitOrder = 13;

    /// <summary>An order above the fundamental is fitted when its voltage is at least this share of the
    /// fundamental's.</summary>
    /// <remarks>Engineering choice: 1 %, the order of the smaller voltage harmonics of a public supply, and 20 times
    /// the ~0.05 % resolution of a 16-bit recording of the voltage.</remarks>
    public const double FitVoltageShare = 0.01;

    /// <summary>... and its current at least this share of the current's fundamental (and above
    /// <see cref="FitCurrentFloorA"/>): above the noise, so the order carries information.</summary>
    /// <remarks>Engineering choice.</remarks>
    public const double FitCurrentShare = 0.001;

    /// <summary>Absolute current floor of a fitted order, amperes (engineering choice: 1 µA).</summary>
    public const double FitCurrentFloorA = 1e-6;

    private readonly double _fs;
    private readonly int _cycles;
    private readonly int _phases;

    /// <summary>Sets up the split of the windows of one capture.</summary>
    /// <param name="sampleRateHz">Sample rate, hertz.</param>
    /// <param name="cycles">Mains cycles per window.</param>
    /// <param name="phases">Voltage channels: 1 or 3.</param>
    public LeakageWindowMeasurement(double sampleRateHz, int cycles, int phases)
    {
        _fs = sampleRateHz;
        _cycles = cycles;
        _phases = phases;
    }

    /// <summary>Splits the window in <paramref name="slot"/>, whose <see cref="WindowSlot.Volts"/> hold its voltages.</summary>
    public WindowLeakage Measure(WindowSlot slot)
    {
        var current = slot.Window;
        var length = current.Length;
        var result = new WindowLeakage
        {
            StartS = slot.Start / _fs,
            FrequencyHz = _cycles * _fs / length,
        };
        if (2 * _cycles >= length)
        {
            return result;
        }

        var i1 = LeakageSplit.BinPhasor(current, _cycles);
        var v1 = LeakageSplit.BinPhasor(slot.Volts[0].AsSpan(0, length), _cycles);
        if (_phases == 3)
        {
            return ThreePhase(slot, result, i1, v1);
        }

        result.VoltageRmsV = v1.Magnitude;
        if (v1.Magnitude < MinimumVoltageV)
        {
            return result;
        }

        var split = LeakageSplit.Split(v1, i1, result.FrequencyHz);
        result.Valid = true;
        result.ResistiveA = split.ResistiveA;
        result.CapacitiveA = split.CapacitiveA;
        result.ConductanceS = split.ConductanceS;
        result.CapacitanceF = split.CapacitanceF;
        result.CurrentReferredA = new Complex(split.ResistiveA, split.CapacitiveA);
        Fit(slot, ref result, v1, i1);
        return result;
    }

    private void Fit(WindowSlot slot, ref WindowLeakage result, Complex v1, Complex i1)
    {
        var current = slot.Window;
        var voltage = slot.Volts[0].AsSpan(0, current.Length);
        Span<Complex> voltages = stackalloc Complex[MaxFitOrder];
        Span<Complex> currents = stackalloc Complex[MaxFitOrder];
        Span<int> orders = stackalloc int[MaxFitOrder];
        voltages[0] = v1;
        currents[0] = i1;
        orders[0] = 1;
        var count = 1;
        var mask = 1 << 1;
        var currentFloor = Math.Max(FitCurrentFloorA, FitCurrentShare * i1.Magnitude);
        for (var n = 2; n <= MaxFitOrder && 2 * n * _cycles < current.Length; n++)
        {
            var vn = LeakageSplit.BinPhasor(voltage, n * _cycles);
            if (vn.Magnitude < FitVoltageShare * v1.Magnitude)
            {
                continue;
            }

            var iN = LeakageSplit.BinPhasor(current, n * _cycles);
            if (iN.Magnitude < currentFloor)
            {
                continue;
            }

            voltages[count] = vn;
            currents[count] = iN;
            orders[count] = n;
            count++;
            mask |= 1 << n;
        }

        result.Fit = LeakageSplit.Fit(voltages[..count], currents[..count], orders[..count], result.FrequencyHz);
        result.FitOrderMask = mask;
    }

    private WindowLeakage ThreePhase(WindowSlot slot, WindowLeakage result, Complex i1, Complex v1)
    {
        var length = slot.Window.Length;
        Span<Complex> voltages = stackalloc Complex[3];
        voltages[0] = v1;
        voltages[1] = LeakageSplit.BinPhasor(slot.Volts[1].AsSpan(0, length), _cycles);
        voltages[2] = LeakageSplit.BinPhasor(slot.Volts[2].AsSpan(0, length), _cycles);
        result.VoltageRmsV = (voltages[0].Magnitude + voltages[1].Magnitude + voltages[2].Magnitude) / 3;
        if (voltages[0].Magnitude < MinimumVoltageV || voltages[1].Magnitude < MinimumVoltageV || voltages[2].Magnitude < MinimumVoltageV)
        {
            return result;
        }

        var reference = Complex.Conjugate(v1) / v1.Magnitude;
        result.Valid = true;
        result.CurrentReferredA = i1 * reference;
        result.Voltage2V = voltages[1] * reference;
        result.Voltage3V = voltages[2] * reference;
        var (first, second) = LeakageSplit.Locate(voltages, i1);
        result.First = first;
        result.Second = second;
        var omega = 2 * Math.PI * result.FrequencyHz;
        foreach (var d in (ReadOnlySpan<LeakageDirection>)[first, second])
        {
            var v = voltages[d.Phase].Magnitude;
            if (d.Capacitive)
            {
                result.CapacitiveA += d.CurrentA;
                result.CapacitanceF += d.CurrentA / (omega * v);
            }
            else
            {
                result.ResistiveA += d.CurrentA;
                result.ConductanceS += d.CurrentA / v;
            }
        }

        return result;
    }
}
