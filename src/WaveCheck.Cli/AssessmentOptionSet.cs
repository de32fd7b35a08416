using System.CommandLine;
using System.Globalization;
using WaveCheck.Core;
using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;

namespace WaveCheck.Cli;

/// <summary>The options that say what device the waveform is judged against and which thresholds the user overrides.</summary>
internal sealed class AssessmentOptionSet
{
    public Option<double?> Rated { get; } = ValueOptions.Current("--rated",
        $"Rated residual operating current IΔn of the device, e.g. 30mA, 100mA, 300mA (default {Quantity.CurrentAsTyped(Limits.DefaultRatedResidualCurrentA)}).",
        positive: true);

    public Option<InstalledProtection?> Device { get; } = ValueOptions.Device("--device",
        "Installed device type: AC, A, F, B or B+, with +RDC-DD when a 6 mA DC detection device (IEC 62955) is fitted beside it, e.g. A+RDC-DD (margins and the adequacy verdict are for it).");

    public Option<DeviceTiming?> Timing { get; } = ValueOptions.Choice("--timing",
        "Installed device's timing for the trip replay: general (no delay) or s (time-delayed, selective). Not given: both are replayed, and the general type's shorter break times decide where a device should have tripped.",
        ("general", DeviceTiming.General), ("s", DeviceTiming.S));

    public Option<bool> ChargerDcDetection { get; } = new("--charger-dc-detection")
    {
        Description = "With --ev: the charging equipment provides 6 mA DC fault detection itself, as its maker declares (IEC 60364-7-722).",
    };

    public Option<MeasurementAccuracy?> Accuracy { get; } = ValueOptions.Accuracy("--accuracy",
        $"Accuracy of the clamp and logger, as a share of the reading plus a current, e.g. 3%+0.5mA (default {MeasurementAccuracy.Default}). A figure within it of a limit is at the limit and resolved to the safe side.");

    public Option<Regime?> Regime { get; } = ValueOptions.Choice("--regime",
        $"iec (residual-current devices) or na (also UL 943 GFCI classes) (default {new AssessmentOptions().Regime.ToText()}).",
        ValueOptions.RegimeWords);

    public Option<bool> Ev { get; } = new("--ev")
    {
        Description = "The circuit feeds an EV charging point (IEC 60364-7-722 and the 6 mA DC of IEC 62955).",
    };

    public Option<double[]?> FrequencyFactors { get; } = new("--frequency-factors")
    {
        Description = $"Type F/B tripping limits at 150 Hz, 400 Hz and 1 kHz as multiples of IΔn (default {Number(Limits.FrequencyFactor150Hz)},{Number(Limits.FrequencyFactor400Hz)},{Number(Limits.FrequencyFactor1kHz)}: IEC 62423 §5.3, from memory).",
        HelpName = "F150,F400,F1K",
        Arity = ArgumentArity.ExactlyOne,
        CustomParser = result =>
        {
            var text = result.Tokens.Count > 0 ? result.Tokens[^1].Value : string.Empty;
            var parts = text.Split(',', StringSplitOptions.TrimEntries);
            var values = new double[parts.Length];
            if (parts.Length != 3 || !parts.Select((p, i) => double.TryParse(p, NumberStyles.Float, CultureInfo.InvariantCulture, out values[i])).All(ok => ok))
            {
                result.AddError(new OptionValueException("--frequency-factors", text, "three numbers separated by commas, such as 2.4,6,14").Message);
                return null;
            }

            return values;
        },
    };

    public Option<double?> BPlusLimit { get; } = ValueOptions.Current("--bplus-limit",
        $"B+ upper tripping limit up to 20 kHz (default {Quantity.CurrentAsTyped(Limits.BPlusUpperLimitA)}: DIN VDE 0664-400, from memory).");

    private readonly (Option<double?> Option, Func<AssessmentOptions, double, AssessmentOptions> Apply)[] _thresholds =
    [
        (ValueOptions.Current("--dc-threshold", $"Smooth DC counted as present (type B), e.g. 2mA (default {Quantity.CurrentAsTyped(Limits.DcSignificanceA)})."),
            (o, v) => o with { DcThresholdA = v }),
        (ValueOptions.Current("--below-mains-threshold", $"Motor-frequency content (sub-mains, tones up to {Number(Limits.MotorFrequencyTopMultiple)} x mains) counted as a converter's composite current, type F (default: max({Quantity.CurrentAsTyped(Limits.SignificanceFloorA)}, {Number(Limits.MotorFrequencySignificanceFraction)} IΔn))."),
            (o, v) => o with { BelowMainsThresholdA = v }),
        (ValueOptions.Current("--harmonic-threshold", $"AC at other frequencies up to 1 kHz counted as present, type B (default: max({Quantity.CurrentAsTyped(Limits.SignificanceFloorA)}, {Number(Limits.HarmonicSignificanceFraction)} IΔn))."),
            (o, v) => o with { HarmonicThresholdA = v }),
        (ValueOptions.Current("--hf-threshold", $"Content 1-20 kHz counted as present, type B+, e.g. 3mA (default: max({Quantity.CurrentAsTyped(Limits.SignificanceFloorA)}, {Number(Limits.HighFrequencySignificanceFraction)} IΔn))."),
            (o, v) => o with { HighFrequencyThresholdA = v }),
        (ValueOptions.Current("--type-a-dc", $"Smooth DC a type A device tolerates (default {Quantity.CurrentAsTyped(Limits.TypeASmoothDcToleranceA)}, IEC 61008-1)."),
            (o, v) => o with { TypeASmoothDcToleranceA = v }),
        (ValueOptions.Current("--type-f-dc", $"Smooth DC a type F device tolerates (default {Quantity.CurrentAsTyped(Limits.TypeFSmoothDcToleranceA)}, IEC 62423)."),
            (o, v) => o with { TypeFSmoothDcToleranceA = v }),
        (ValueOptions.Current("--rdc-dd", $"DC threshold of an RDC-DD (default {Quantity.CurrentAsTyped(Limits.RdcDdThresholdA)}, IEC 62955)."),
            (o, v) => o with { RdcDdThresholdA = v }),
        (ValueOptions.Number("--pulsating-share", $"Share of windows (0 to 1) that must be pulsating DC to count (default {Number(Limits.PulsatingShareThreshold)}: any window).", "0.3"),
            (o, v) => o with { PulsatingShareThreshold = v }),
        (ValueOptions.Number("--leakage-budget", $"Leakage budget as a fraction of IΔn (default {Number(Limits.LeakageBudgetFraction)}, IEC 60364-5-53 §531.3.2).", "0.3"),
            (o, v) => o with { LeakageBudgetFraction = v }),
        (ValueOptions.Number("--risk-possible", $"Nuisance risk 'possible' from this fraction of IΔn (default {Number(Limits.PossibleRiskFraction)}).", "0.3"),
            (o, v) => o with { PossibleRiskFraction = v }),
        (ValueOptions.Number("--risk-likely", $"Nuisance risk 'likely' from this fraction of IΔn (default {Number(Limits.LikelyRiskFraction)}).", "0.5"),
            (o, v) => o with { LikelyRiskFraction = v }),
    ];

    public void AddTo(Command command)
    {
        command.Options.Add(Rated);
        command.Options.Add(Device);
        command.Options.Add(Timing);
        command.Options.Add(Regime);
        command.Options.Add(Ev);
        command.Options.Add(ChargerDcDetection);
        command.Options.Add(Accuracy);
        foreach (var (option, _) in _thresholds)
        {
            command.Options.Add(option);
        }

        command.Options.Add(FrequencyFactors);
        command.Options.Add(BPlusLimit);
    }

    /// <summary>Gathers the values System.CommandLine parsed; checks ranges and combinations.</summary>
    /// <exception cref="OptionValueException">A value is out of range.</exception>
    /// <exception cref="UserInputException">Options that do not go together.</exception>
    public AssessmentOptions Read(ParseResult parse)
    {
        var options = new AssessmentOptions();
        if (parse.GetValue(Rated) is { } rated)
        {
            options = options with { RatedResidualCurrentA = rated };
        }

        if (parse.GetValue(Device) is { } device)
        {
            options = options with { InstalledType = device.Type, InstalledRdcDd = device.DcDetection == DcDetection.RdcDd };
        }

        if (parse.GetValue(Regime) is { } regime)
        {
            options = options with { Regime = regime };
        }

        if (parse.GetValue(Timing) is { } timing)
        {
            options = options with { InstalledTiming = timing };
        }

        options = options with { EvChargingPoint = parse.GetValue(Ev), ChargerDcDetection = parse.GetValue(ChargerDcDetection) };
        if (options.ChargerDcDetection && !options.EvChargingPoint)
        {
            throw new UserInputException("--charger-dc-detection: declares a charging point's own DC detection, so it goes with --ev; add --ev or leave it out");
        }

        if (parse.GetValue(Accuracy) is { } accuracy)
        {
            options = options with { Accuracy = accuracy };
        }

        foreach (var (option, apply) in _thresholds)
        {
            if (parse.GetValue(option) is { } value)
            {
                options = apply(options, value);
            }
        }

        if (parse.GetValue(FrequencyFactors) is { Length: 3 } factors)
        {
            options = options with { FrequencyFactor150Hz = factors[0], FrequencyFactor400Hz = factors[1], FrequencyFactor1kHz = factors[2] };
        }

        if (parse.GetValue(BPlusLimit) is { } limit)
        {
            options = options with { BPlusUpperLimitA = limit };
        }

        options.Validate();
        return options;
    }

    /// <summary>A stderr line when IΔn is off the ratings in use (the result carries the same caution).</summary>
    public static void WarnAboutRating(Terminal terminal, double ratedA)
    {
        if (!Limits.IsRatingInUse(ratedA))
        {
            terminal.Error.WriteLine("wavecheck: warning: " + TerminalText.Clean(DeviceTypeAssessor.RatingCaution(ratedA)));
        }
    }

    private static string Number(double value) => value.ToString("G6", CultureInfo.InvariantCulture);
}
