using WaveCheck.Core.Model;
namespace WaveCheck.Core.Assessment;

/// <summary>
/// What the user tells the assessment: the device, the regime, and any threshold they disagree with.
/// Every threshold property is null for the default in <see cref="Limits"/>; a value given replaces the default
/// outright (for the significance thresholds: replaces max(floor, fraction × RMS) with the fixed value).
/// Immutable; safe to share between threads.
/// </summary>
public sealed record AssessmentOptions
{
    /// <summary>Rated residual operating current IΔn, amperes (CLI <c>--rated</c>).</summary>
    public double RatedResidualCurrentA { get; init; } = Limits.DefaultRatedResidualCurrentA;

    /// <summary>Installed device type (CLI <c>--device</c>); null when not given: margins are then for the required type.</summary>
    public DeviceType? InstalledType { get; init; }

    /// <summary>Installed device's timing (CLI <c>--timing general|s</c>): general type or time-delayed type S; null
    /// when not given (the trip replay then treats both as installed, and raises its "would have tripped" finding on
    /// the general type's shorter break times: the safe side).</summary>
    public DeviceTiming? InstalledTiming { get; init; }

    /// <summary>Regime (CLI <c>--regime iec|na</c>).</summary>
    public Regime Regime { get; init; } = Regime.Iec;

    /// <summary>The circuit feeds an EV charging point (CLI <c>--ev</c>): IEC 60364-7-722 guidance is given as a requirement.</summary>
    public bool EvChargingPoint { get; init; }

    /// <summary>DC fault-current detection fitted beside the installed device (CLI <c>--device A+RDC-DD</c>).</summary>
    public bool InstalledRdcDd { get; init; }

    /// <summary>The charging equipment provides 6 mA DC fault detection itself, as its maker declares (CLI
    /// <c>--charger-dc-detection</c>); only with <see cref="EvChargingPoint"/>.</summary>
    public bool ChargerDcDetection { get; init; }

    /// <summary>Accuracy of the measuring chain (CLI <c>--accuracy</c>); null for <see cref="MeasurementAccuracy.Default"/>.</summary>
    public MeasurementAccuracy? Accuracy { get; init; }

    /// <summary>Smooth DC counted as present, amperes (CLI <c>--dc-threshold</c>); default 1 mA.</summary>
    public double? DcThresholdA { get; init; }

    /// <summary>Sub-mains / non-harmonic content counted as a converter signature, amperes (CLI <c>--below-mains-threshold</c>);
    /// default max(1 mA, 0.05 IΔn).</summary>
    public double? BelowMainsThresholdA { get; init; }

    /// <summary>Harmonic content to 1 kHz counted as non-sinusoidal, amperes (CLI <c>--harmonic-threshold</c>);
    /// default max(1 mA, 0.1 IΔn).</summary>
    public double? HarmonicThresholdA { get; init; }

    /// <summary>Content above 1 kHz counted as present, amperes (CLI <c>--hf-threshold</c>); default max(1 mA, 0.1 IΔn).</summary>
    public double? HighFrequencyThresholdA { get; init; }

    /// <summary>Share of windows (0..1) that must be pulsating DC to count (CLI <c>--pulsating-share</c>); default 0: any window.</summary>
    public double? PulsatingShareThreshold { get; init; }

    /// <summary>Type A smooth-DC tolerance, amperes (CLI <c>--type-a-dc</c>); default 6 mA (IEC 61008-1).</summary>
    public double? TypeASmoothDcToleranceA { get; init; }

    /// <summary>Type F smooth-DC tolerance, amperes (CLI <c>--type-f-dc</c>); default 10 mA (IEC 62423).</summary>
    public double? TypeFSmoothDcToleranceA { get; init; }

    /// <summary>RDC-DD DC threshold, amperes (CLI <c>--rdc-dd</c>); default 6 mA (IEC 62955).</summary>
    public double? RdcDdThresholdA { get; init; }

    /// <summary>Leakage budget as a fraction of IΔn (CLI <c>--leakage-budget</c>); default 0.3 (IEC 60364-5-53 §531.3.2).</summary>
    public double? LeakageBudgetFraction { get; init; }

    /// <summary>Nuisance risk "possible" boundary as a fraction of IΔn (CLI <c>--risk-possible</c>); default 0.3.</summary>
    public double? PossibleRiskFraction { get; init; }

    /// <summary>Nuisance risk "likely" boundary as a fraction of IΔn (CLI <c>--risk-likely</c>); default 0.5.</summary>
    public double? LikelyRiskFraction { get; init; }

    /// <summary>IEC 62423 upper tripping limit at 150 Hz as a multiple of IΔn (CLI <c>--frequency-factors</c>, first value);
    /// default 2.4, from memory.</summary>
    public double? FrequencyFactor150Hz { get; init; }

    /// <summary>IEC 62423 upper tripping limit at 400 Hz as a multiple of IΔn (second value of <c>--frequency-factors</c>);
    /// default 6, from memory.</summary>
    public double? FrequencyFactor400Hz { get; init; }

    /// <summary>IEC 62423 upper tripping limit at 1 kHz as a multiple of IΔn (third value of <c>--frequency-factors</c>);
    /// default 14, from memory.</summary>
    public double? FrequencyFactor1kHz { get; init; }

    /// <summary>B+ upper tripping limit up to 20 kHz, amperes (CLI <c>--bplus-limit</c>); default 420 mA
    /// (DIN VDE 0664-400, from memory).</summary>
    public double? BPlusUpperLimitA { get; init; }

    /// <summary>Checks every value; the message names the setting (<see cref="Setting.Ref"/>), the value and the range expected.</summary>
    /// <exception cref="OptionValueException">A value is out of range.</exception>
    public void Validate()
    {
        CheckCurrent(Setting.Ref(nameof(RatedResidualCurrentA)), RatedResidualCurrentA, allowZero: false);
        CheckCurrent(Setting.Ref(nameof(DcThresholdA)), DcThresholdA);
        CheckCurrent(Setting.Ref(nameof(BelowMainsThresholdA)), BelowMainsThresholdA);
        CheckCurrent(Setting.Ref(nameof(HarmonicThresholdA)), HarmonicThresholdA);
        CheckCurrent(Setting.Ref(nameof(HighFrequencyThresholdA)), HighFrequencyThresholdA);
        CheckCurrent(Setting.Ref(nameof(TypeASmoothDcToleranceA)), TypeASmoothDcToleranceA);
        CheckCurrent(Setting.Ref(nameof(TypeFSmoothDcToleranceA)), TypeFSmoothDcToleranceA);
        CheckCurrent(Setting.Ref(nameof(RdcDdThresholdA)), RdcDdThresholdA, allowZero: false);
        CheckFraction(Setting.Ref(nameof(PulsatingShareThreshold)), PulsatingShareThreshold);
        CheckFraction(Setting.Ref(nameof(LeakageBudgetFraction)), LeakageBudgetFraction);
        CheckFraction(Setting.Ref(nameof(PossibleRiskFraction)), PossibleRiskFraction);
        CheckFraction(Setting.Ref(nameof(LikelyRiskFraction)), LikelyRiskFraction);
        CheckCurrent(Setting.Ref(nameof(BPlusUpperLimitA)), BPlusUpperLimitA, allowZero: false);
        var f150 = FrequencyFactor150Hz ?? Limits.FrequencyFactor150Hz;
        var f400 = FrequencyFactor400Hz ?? Limits.FrequencyFactor400Hz;
        var f1k = FrequencyFactor1kHz ?? Limits.FrequencyFactor1kHz;
        if (!(f150 >= 1 && f400 >= f150 && f1k >= f400 && f1k <= 1000))
        {
            throw new OptionValueException(Setting.Ref(nameof(FrequencyFactor150Hz)), $"{Text(f150)},{Text(f400)},{Text(f1k)}",
                "three multiples of IΔn at 150 Hz, 400 Hz and 1 kHz, each at least the one before and at least 1, such as 2.4,6,14");
        }
        if ((TypeASmoothDcToleranceA ?? Limits.TypeASmoothDcToleranceA) > (TypeFSmoothDcToleranceA ?? Limits.TypeFSmoothDcToleranceA))
        {
            throw new OptionValueException(Setting.Ref(nameof(TypeASmoothDcToleranceA)), Text(TypeASmoothDcToleranceA ?? Limits.TypeASmoothDcToleranceA) + " A",
                $"a tolerance no greater than type F's {Text(TypeFSmoothDcToleranceA ?? Limits.TypeFSmoothDcToleranceA)} A (types are ordered by capability)");
        }

        if ((PossibleRiskFraction ?? Limits.PossibleRiskFraction) > (LikelyRiskFraction ?? Limits.LikelyRiskFraction))
        {
            throw PossibleRiskFraction is null
                ? new OptionValueException(Setting.Ref(nameof(LikelyRiskFraction)), Text(LikelyRiskFraction!.Value),
                    $"a fraction of IΔn no smaller than the 'possible' boundary {Text(Limits.PossibleRiskFraction)}")
                : new OptionValueException(Setting.Ref(nameof(PossibleRiskFraction)), Text(PossibleRiskFraction.Value),
                    $"a fraction of IΔn no greater than the 'likely' boundary {Text(LikelyRiskFraction ?? Limits.LikelyRiskFraction)}");
        }
    }

    private static void CheckCurrent(string option, double? valueA, bool allowZero = true)
    {
        if (valueA is not { } v)
        {
            return;
        }

        if (!double.IsFinite(v) || v < 0 || (!allowZero && v == 0) || v > 100)
        {
            throw new OptionValueException(option, Text(v) + " A",
                allowZero ? "a current from 0 to 100 A, such as 6mA" : "a current above 0 and up to 100 A, such as 30mA");
        }
    }

    private static void CheckFraction(string option, double? value)
    {
        if (value is { } v && (!double.IsFinite(v) || v <= 0 || v > 1))
        {
            throw new OptionValueException(option, Text(v), "a fraction above 0 and at most 1, such as 0.3");
        }
    }

    private static string Text(double v) => v.ToString("G6", System.Globalization.CultureInfo.InvariantCulture);
}
