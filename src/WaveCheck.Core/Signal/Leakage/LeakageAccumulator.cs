using System.Numerics;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Signal;

/// <summary>
/// Folds the windows' leakage splits (<see cref="WindowLeakage"/>) into the capture's <see cref="LeakageSplitResult"/>
/// in bounded memory: running statistics, sums of phasors, and a trend whose points are averaged in pairs when full.
/// Not thread-safe.
/// </summary>
internal sealed class LeakageAccumulator
{
    /// <summary>Most points kept in the trend; pairs are averaged when it is full.</summary>
    public const int MaxTrendPoints = 512;

    /// <summary>The assumption of the three-phase location, stated with its figures.</summary>
    public const string ThreePhaseAssumption =
        "balanced capacitances (and resistances) to earth on balanced voltages draw currents that cancel, so the residual current shows only the asymmetry: an extra leakage on one phase, or a missing one, which appears as leakage on the other two";

    private readonly IReadOnlyList<string> _names;
    private readonly bool _threePhase;
    private readonly MetricAccumulator _resistive = new(signed: true);
    private readonly MetricAccumulator _capacitive = new(signed: true);
    private readonly MetricAccumulator _capacitance = new(signed: true);
    private readonly MetricAccumulator _residual = new(signed: false);
    private readonly double[] _directionSum = new double[6];
    private readonly double[] _directionMax = new double[6];
    private readonly int[] _dominantCount = new int[6];
    private readonly List<LeakageTrendPoint> _trend = [];
    private int _trendStride = 1;
    private int _pending;
    private double _pendingStart, _pendingR, _pendingC;
    private int _windows;
    private int _withoutVoltage;
    private double _voltageSum, _frequencySum, _conductanceSum, _fitConductanceSum, _fitCapacitanceSum;
    private int _fitWindows;
    private double _maxConductance = double.NaN, _maxConductanceTimeS;
    private int _orderMask;
    private Complex _currentSum, _voltage2Sum, _voltage3Sum;
    private double _phaseVoltageSum1, _phaseVoltageSum2, _phaseVoltageSum3;

    /// <summary>Starts the fold for a capture's voltage channels.</summary>
    /// <param name="voltageNames">The voltage channels' names, L1 first (one or three).</param>
    public LeakageAccumulator(IReadOnlyList<string> voltageNames)
    {
        _names = voltageNames;
        _threePhase = voltageNames.Count == 3;
    }

    /// <summary>Adds a window's split, in time order.</summary>
    public void Add(in WindowLeakage w)
    {
        if (!w.Valid)
        {
            _withoutVoltage++;
            return;
        }

        _windows++;
        _voltageSum += w.VoltageRmsV;
        _frequencySum += w.FrequencyHz;
        _resistive.Add(w.ResistiveA, w.StartS);
        _capacitive.Add(w.CapacitiveA, w.StartS);
        _capacitance.Add(w.CapacitanceF, w.StartS);
        _conductanceSum += w.ConductanceS;
        if (w.ConductanceS > 0 && !(w.ConductanceS <= _maxConductance))
        {
            _maxConductance = w.ConductanceS;
            _maxConductanceTimeS = w.StartS;
        }

        _currentSum += w.CurrentReferredA;
        if (_threePhase)
        {
            AddLocation(w);
        }
        else if (w.Fit.Orders > 0)
        {
            _fitWindows++;
            _fitConductanceSum += w.Fit.ConductanceS;
            _fitCapacitanceSum += w.Fit.CapacitanceF;
            _orderMask |= w.FitOrderMask;
            if (w.Fit.Orders >= 2)
            {
                _residual.Add(w.Fit.Residual, w.StartS);
            }
        }

        AddTrend(w.StartS, w.ResistiveA, w.CapacitiveA);
    }

    private void AddLocation(in WindowLeakage w)
    {
        _voltage2Sum += w.Voltage2V;
        _voltage3Sum += w.Voltage3V;
        _phaseVoltageSum1 += (3 * w.VoltageRmsV) - w.Voltage2V.Magnitude - w.Voltage3V.Magnitude;
        _phaseVoltageSum2 += w.Voltage2V.Magnitude;
        _phaseVoltageSum3 += w.Voltage3V.Magnitude;
        foreach (var d in (ReadOnlySpan<LeakageDirection>)[w.First, w.Second])
        {
            _directionSum[d.Index] += d.CurrentA;
            _directionMax[d.Index] = Math.Max(_directionMax[d.Index], d.CurrentA);
        }

        if (w.First.CurrentA > 0)
        {
            _dominantCount[w.First.Index]++;
        }
    }

    private void AddTrend(double startS, double resistiveA, double capacitiveA)
    {
        if (_pending == 0)
        {
            _pendingStart = startS;
        }

        _pendingR += resistiveA;
        _pendingC += capacitiveA;
        if (++_pending < _trendStride)
        {
            return;
        }

        _trend.Add(new LeakageTrendPoint(_pendingStart, _pendingR / _pending, _pendingC / _pending));
        (_pending, _pendingR, _pendingC) = (0, 0, 0);
        if (_trend.Count < MaxTrendPoints)
        {
            return;
        }

        // Full: average neighbours in pairs and take twice as many windows per point from now on.
        for (var i = 0; i < _trend.Count / 2; i++)
        {
            var (a, b) = (_trend[2 * i], _trend[(2 * i) + 1]);
            _trend[i] = new LeakageTrendPoint(a.StartS, (a.ResistiveA + b.ResistiveA) / 2, (a.CapacitiveA + b.CapacitiveA) / 2);
        }

        _trend.RemoveRange(_trend.Count / 2, _trend.Count - (_trend.Count / 2));
        _trendStride *= 2;
    }

    /// <summary>The capture's split (before interpretation: see Assessment.LeakageInterpretation).</summary>
    public LeakageSplitResult Result()
    {
        var trend = new List<LeakageTrendPoint>(_trend);
        if (_pending > 0)
        {
            trend.Add(new LeakageTrendPoint(_pendingStart, _pendingR / _pending, _pendingC / _pending));
        }

        var count = Math.Max(_windows, 1);
        var voltage = _windows > 0 ? _voltageSum / count : double.NaN;
        var frequency = _windows > 0 ? _frequencySum / count : double.NaN;
        var meanConductance = _conductanceSum / count;
        var meanCurrent = _currentSum / count;
        var notes = new List<string>();
        var phasors = new List<PhasorValue>();
        if (_windows > 0)
        {
            phasors.Add(new PhasorValue("U " + (_threePhase ? "L1" : _names[0]), "V", _threePhase ? _phaseVoltageSum1 / count : voltage, 0));
            if (_threePhase)
            {
                phasors.Add(Phasor("U L2", "V", _voltage2Sum / count));
                phasors.Add(Phasor("U L3", "V", _voltage3Sum / count));
            }

            phasors.Add(Phasor("I residual", "A", meanCurrent));
            if (!_threePhase)
            {
                phasors.Add(new PhasorValue("I_R", "A", meanCurrent.Real, 0));
                phasors.Add(new PhasorValue("I_C", "A", meanCurrent.Imaginary, 90));
            }
        }

        var result = new LeakageSplitResult
        {
            Kind = _threePhase ? "three-phase" : "single-phase",
            VoltageChannels = _names,
            Windows = _windows,
            WindowsWithoutVoltage = _withoutVoltage,
            MinimumVoltageV = LeakageWindowMeasurement.MinimumVoltageV,
            VoltageRmsV = voltage,
            FrequencyHz = frequency,
            ResistiveA = _resistive.Result(),
            CapacitiveA = _capacitive.Result(),
            ResistanceOhm = _windows > 0 && meanConductance > 0 ? 1 / meanConductance : null,
            LeastResistanceOhm = double.IsNaN(_maxConductance) ? null : 1 / _maxConductance,
            LeastResistanceTimeS = double.IsNaN(_maxConductance) ? null : _maxConductanceTimeS,
            CapacitanceF = _capacitance.Result(),
            Fit = _threePhase || _fitWindows == 0 ? null : FitResult(),
            Location = _threePhase && _windows > 0 ? Location(frequency) : null,
            Phasors = phasors,
            Trend = trend,
        };
        if (_windows == 0)
        {
            notes.Add(string.Create(System.Globalization.CultureInfo.InvariantCulture,
                $"No window had a voltage fundamental of at least {LeakageWindowMeasurement.MinimumVoltageV:0} V on every voltage channel: check that the voltage channel is connected and its scale ({Setting.Ref(nameof(WaveCheck.Core.Capture.ImportOptions.VoltageScale))}); nothing was split."));
        }
        else if (_withoutVoltage > 0)
        {
            notes.Add(string.Create(System.Globalization.CultureInfo.InvariantCulture,
                $"{_withoutVoltage} window(s) had a voltage below {LeakageWindowMeasurement.MinimumVoltageV:0} V and were not split (supply interrupted, or the voltage channel lost)."));
        }

        if (_windows > 0 && !_threePhase)
        {
            if (result.ResistiveA.Mean < 0)
            {
                notes.Add("The part in phase with the voltage is negative: no leakage draws that. Check the clamp's orientation (arrow towards the load) and that the voltage channel is line to earth (or neutral), not reversed.");
            }

            if (result.CapacitiveA.Mean < 0)
            {
                notes.Add("The quadrature part lags the voltage (inductive): not a capacitive leakage; with a clamp the right way round, a fault through a winding or a wrong phase reference is more likely.");
            }
        }

        if (_threePhase)
        {
            notes.Add("Assumption: " + ThreePhaseAssumption + ".");
        }

        return result with { Notes = notes };
    }

    private RcFitResult FitResult()
    {
        var g = _fitConductanceSum / _fitWindows;
        var orders = new List<int>();
        for (var n = 1; n <= LeakageWindowMeasurement.MaxFitOrder; n++)
        {
            if ((_orderMask & (1 << n)) != 0)
            {
                orders.Add(n);
            }
        }

        return new RcFitResult(g > 0 ? 1 / g : null, _fitCapacitanceSum / _fitWindows, _residual.Result(), (int)_residual.Count,
            orders, null, null);
    }

    private PhaseLocationResult Location(double frequencyHz)
    {
        var phaseVoltages = new[] { _phaseVoltageSum1 / _windows, _phaseVoltageSum2 / _windows, _phaseVoltageSum3 / _windows };
        var directions = new List<LeakageDirectionValue>(6);
        var dominant = 0;
        for (var d = 0; d < 6; d++)
        {
            var mean = _directionSum[d] / _windows;
            var phase = d / 2;
            var capacitive = d % 2 == 1;
            var v = phaseVoltages[phase];
            directions.Add(new LeakageDirectionValue($"L{phase + 1}", capacitive ? "capacitive" : "resistive", mean, _directionMax[d],
                !capacitive && mean > 0 ? v / mean : null,
                capacitive ? mean / (2 * Math.PI * frequencyHz * v) : null));
            if (mean > _directionSum[dominant] / _windows)
            {
                dominant = d;
            }
        }

        return new PhaseLocationResult(directions, $"L{(dominant / 2) + 1}", dominant % 2 == 1 ? "capacitive" : "resistive",
            _dominantCount[dominant] / (double)_windows, ThreePhaseAssumption);
    }

    private static PhasorValue Phasor(string name, string unit, Complex value) =>
        new(name, unit, value.Magnitude, value.Phase * 180 / Math.PI);
}
