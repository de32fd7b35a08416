namespace WaveCheck.Core.Model;

/// <summary>
/// The residual current split against the circuit voltage (JSON <c>leakageSplit</c>): the part in phase with the
/// voltage (resistive: insulation conductance) and the part in quadrature (capacitive: filter and cable
/// capacitance), per window and summarised over the capture. Present only when the capture carries a voltage channel.
/// </summary>
/// <remarks>Formulas and their status: docs/methods.md, "Resistive and capacitive leakage".</remarks>
public sealed record LeakageSplitResult
{
    /// <summary><c>single-phase</c> (one voltage) or <c>three-phase</c> (three phase-to-earth voltages).</summary>
    public required string Kind { get; init; }

    /// <summary>The voltage channels used, L1 first.</summary>
    public required IReadOnlyList<string> VoltageChannels { get; init; }

    /// <summary>Windows split.</summary>
    public required int Windows { get; init; }

    /// <summary>Windows left out because their voltage fundamental was below
    /// <see cref="MinimumVoltageV"/> (voltage channel open or not connected).</summary>
    public required int WindowsWithoutVoltage { get; init; }

    /// <summary>A window's voltage fundamental must reach this to be split, volts.</summary>
    public required double MinimumVoltageV { get; init; }

    /// <summary>Mean over windows of the voltage's fundamental RMS (three-phase: the mean of the three), volts.</summary>
    public required double VoltageRmsV { get; init; }

    /// <summary>Mean over windows of the tracked mains frequency, hertz.</summary>
    public required double FrequencyHz { get; init; }

    /// <summary>Resistive current I_R: the residual current's fundamental in phase with the voltage, RMS, amperes,
    /// signed (negative: see <see cref="Notes"/>). Three-phase: the sum of the resistive parts of the located leakage.</summary>
    public required MetricStatistics ResistiveA { get; init; }

    /// <summary>Capacitive current I_C: the fundamental leading the voltage by 90°, RMS, amperes, signed (negative:
    /// inductive). Three-phase: the sum of the capacitive parts of the located leakage.</summary>
    public required MetricStatistics CapacitiveA { get; init; }

    /// <summary>Leakage resistance R = V / I_R from the mean conductance over windows, ohms; null when the resistive
    /// part is not positive.</summary>
    public double? ResistanceOhm { get; init; }

    /// <summary>Least R of any window (the window of largest conductance), ohms; null when no window has a positive
    /// resistive part.</summary>
    public double? LeastResistanceOhm { get; init; }

    /// <summary>Start of the window of <see cref="LeastResistanceOhm"/>, seconds.</summary>
    public double? LeastResistanceTimeS { get; init; }

    /// <summary>Capacitance C = I_C / (2π f V) per window, farads (signed), statistics over windows.</summary>
    public required MetricStatistics CapacitanceF { get; init; }

    /// <summary>Single-phase with voltage harmonics: the least-squares fit of I_n = V_n (G + j n ω C) over the orders
    /// where voltage and current are both significant; null for three-phase.</summary>
    public RcFitResult? Fit { get; init; }

    /// <summary>Three-phase: where the asymmetry lies; null for single-phase.</summary>
    public PhaseLocationResult? Location { get; init; }

    /// <summary>Mean phasors over windows, angles referred to the first voltage, for the phasor plot.</summary>
    public required IReadOnlyList<PhasorValue> Phasors { get; init; }

    /// <summary>I_R and I_C of windows in time order, averaged in pairs when there are more windows than fit.</summary>
    public required IReadOnlyList<LeakageTrendPoint> Trend { get; init; }

    /// <summary>What the figures mean and what to do, in the words of the trade: the insulation finding, a negative
    /// or inductive part, the model test, the assumptions.</summary>
    public IReadOnlyList<string> Notes { get; init; } = [];

    /// <summary>The insulation finding against the minimum insulation resistance; null until assessed.</summary>
    public InsulationFinding? Insulation { get; init; }
}

/// <summary>The R-C model fitted over harmonic orders.</summary>
/// <param name="ResistanceOhm">1 / G of the mean fitted conductance, ohms; null when G is not positive.</param>
/// <param name="CapacitanceF">Mean fitted capacitance, farads.</param>
/// <param name="Residual">Relative fit residual, statistics over the windows fitted over two or more orders:
/// √(Σ|I_n − V_n(G + jnωC)|² / Σ|I_n|²).</param>
/// <param name="WindowsTested">Windows with two or more orders, where the residual tests the model.</param>
/// <param name="Orders">Harmonic orders used in any window, ascending.</param>
/// <param name="ResidualLimit">Above this residual the leakage is "not a simple R-C leakage"; null until assessed.</param>
/// <param name="SimpleRc">False when the 95th percentile of the residual exceeds the limit; null when no window
/// tested the model (a sine voltage: one order, an exact fit).</param>
public sealed record RcFitResult(double? ResistanceOhm, double CapacitanceF, MetricStatistics Residual, int WindowsTested,
    IReadOnlyList<int> Orders, double? ResidualLimit, bool? SimpleRc);

/// <summary>Three-phase location of the leakage: the residual phasor as a non-negative combination of the two nearest
/// of the six directions (resistive or capacitive on L1, L2, L3).</summary>
/// <param name="Directions">The six directions, each with its mean current over windows and the equivalent resistance
/// (resistive) or capacitance (capacitive) that would draw it.</param>
/// <param name="DominantPhase"><c>L1</c>, <c>L2</c> or <c>L3</c>: the phase of the direction with the largest mean current.</param>
/// <param name="DominantKind"><c>resistive</c> or <c>capacitive</c>.</param>
/// <param name="DominantShare">Share of windows in which that direction carried the larger of its two parts, 0..1.</param>
/// <param name="Assumption">The model's assumption, stated with the figures.</param>
public sealed record PhaseLocationResult(IReadOnlyList<LeakageDirectionValue> Directions, string DominantPhase,
    string DominantKind, double DominantShare, string Assumption);

/// <summary>One of the six directions of a three-phase location.</summary>
/// <param name="Phase"><c>L1</c>, <c>L2</c> or <c>L3</c>.</param>
/// <param name="Kind"><c>resistive</c> or <c>capacitive</c>.</param>
/// <param name="MeanA">Mean over windows of the current along this direction (zero in windows where it is not one of
/// the two nearest), RMS, amperes.</param>
/// <param name="MaxA">Largest window value, amperes.</param>
/// <param name="ResistanceOhm">Resistive: the phase's voltage over <paramref name="MeanA"/>, ohms; else null.</param>
/// <param name="CapacitanceF">Capacitive: <paramref name="MeanA"/> / (2π f V), farads; else null.</param>
public sealed record LeakageDirectionValue(string Phase, string Kind, double MeanA, double MaxA, double? ResistanceOhm,
    double? CapacitanceF);

/// <summary>A mean phasor: RMS magnitude and angle referred to the first voltage.</summary>
/// <param name="Name">E.g. <c>U L1</c>, <c>I residual</c>, <c>I_R</c>, <c>I_C</c>.</param>
/// <param name="Unit"><c>V</c> or <c>A</c>.</param>
/// <param name="Rms">Magnitude, RMS, in <paramref name="Unit"/>.</param>
/// <param name="AngleDeg">Angle, degrees, counter-clockwise (leading) positive.</param>
public sealed record PhasorValue(string Name, string Unit, double Rms, double AngleDeg);

/// <summary>One point of the leakage trend.</summary>
/// <param name="StartS">Start of the (first) window, seconds.</param>
/// <param name="ResistiveA">I_R, amperes.</param>
/// <param name="CapacitiveA">I_C, amperes.</param>
public sealed record LeakageTrendPoint(double StartS, double ResistiveA, double CapacitiveA);

/// <summary>The resistive leakage read as an insulation resistance and compared with the minimum insulation
/// resistance of the installation rules.</summary>
/// <param name="State"><c>below-minimum</c> (possible insulation fault), <c>at-limit</c> (cannot be ruled out within the
/// measurement's uncertainty), <c>above-minimum</c>, or <c>not-resolved</c> (no voltage or no resistive part).</param>
/// <param name="ResistanceOhm">The least window resistance compared, ohms; null when not positive.</param>
/// <param name="MinimumOhm">The minimum insulation resistance used, ohms.</param>
/// <param name="ResistiveLimitA">The resistive current at which R reaches the minimum at the measured voltage, amperes.</param>
/// <param name="UncertaintyA">Uncertainty of the resistive current counted: the measuring chain's accuracy plus the
/// share of the whole current a phase error between the two sensors moves into it, amperes.</param>
/// <param name="Message">The finding and what to do, for a person.</param>
public sealed record InsulationFinding(string State, double? ResistanceOhm, double MinimumOhm, double ResistiveLimitA,
    double UncertaintyA, string Message)
{
    /// <summary>The finding and what to do in one sentence, without the reasoning (a terminal's first screen); the
    /// same as <see cref="Message"/> where that is short already.</summary>
    public string Summary { get; init; } = Message;
}

/// <summary>The states of an <see cref="InsulationFinding"/>, as written in JSON.</summary>
public static class InsulationState
{
    /// <summary>Possible insulation fault: the resistance is below the minimum beyond the measurement's uncertainty.</summary>
    public const string BelowMinimum = "below-minimum";

    /// <summary>A fault cannot be ruled out within the measurement's uncertainty.</summary>
    public const string AtLimit = "at-limit";

    /// <summary>Above the minimum beyond the uncertainty.</summary>
    public const string AboveMinimum = "above-minimum";

    /// <summary>No voltage or no resistive part to judge.</summary>
    public const string NotResolved = "not-resolved";
}
