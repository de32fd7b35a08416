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
    public Option<string> Rated { get; } = new("--rated")
    {
        Description = "Rated residual operating current IΔn of the device, e.g. 30mA, 100mA, 300mA.",
        DefaultValueFactory = _ => "30mA",
    };

    public Option<string?> Device { get; } = new("--device")
    {
        Description = "Installed device type: AC, A, F, B or B+, with +RDC-DD when a 6 mA DC detection device (IEC 62955) is fitted beside it, e.g. A+RDC-DD (margins and the adequacy verdict are for it).",
    };

    public Option<string?> Timing { get; } = new("--timing")
    {
        Description = "Installed device's timing for the trip replay: general (no delay) or s (time-delayed, selective). Not given: both are replayed, and the general type's shorter break times decide where a device should have tripped.",
    };

    public Option<bool> ChargerDcDetection { get; } = new("--charger-dc-detection")
    {
        Description = "With --ev: the charging equipment provides 6 mA DC fault detection itself, as its maker declares (IEC 60364-7-722).",
    };

    public Option<string?> Accuracy { get; } = new("--accuracy")
    {
        Description = "Accuracy of the clamp and logger, as a share of the reading plus a current, e.g. 3%+0.5mA (default 2%+0.1mA). A figure within it of a limit is at the limit and resolved to the safe side.",
    };

    public Option<string> Regime { get; } = new("--regime")
    {
        Description = "iec (residual-current devices) or na (also UL 943 GFCI classes).",
        DefaultValueFactory = _ => "iec",
    };

    public Option<bool> Ev { get; } = new("--ev")
    {
        Description = "The circuit feeds an EV charging point (IEC 60364-7-722 and the 6 mA DC of IEC 62955).",
    };

    public Option<string?> FrequencyFactors { get; } = new("--frequency-factors")
    {
        Description = "Type F/B tripping limits at 150 Hz, 400 Hz and 1 kHz as multiples of IΔn (default 2.4,6,14: IEC 62423 §5.3, from memory).",
    };

    public Option<string?> BPlusLimit { get; } = new("--bplus-limit")
    {
        Description = "B+ upper tripping limit up to 20 kHz (default 420mA: DIN VDE 0664-400, from memory).",
    };

    private readonly (Option<string?> Option, bool Fraction, Func<AssessmentOptions, double, AssessmentOptions> Apply)[] _thresholds;

    public AssessmentOptionSet()
    {
        _thresholds =
        [
            (Threshold("--dc-threshold", "Smooth DC counted as present (type B), e.g. 2mA (default 1mA)."),
                false, (o, v) => o with { DcThresholdA = v }),
            (Threshold("--below-mains-threshold", "Motor-frequency content (sub-mains, tones up to 2 x mains) counted as a converter's composite current, type F (default: max(1 mA, 0.05 IΔn))."),
                false, (o, v) => o with { BelowMainsThresholdA = v }),
            (Threshold("--harmonic-threshold", "AC at other frequencies up to 1 kHz counted as present, type B (default: max(1 mA, 0.1 IΔn))."),
                false, (o, v) => o with { HarmonicThresholdA = v }),
            (Threshold("--hf-threshold", "Content 1-20 kHz counted as present, type B+, e.g. 3mA (default: max(1 mA, 0.1 IΔn))."),
                false, (o, v) => o with { HighFrequencyThresholdA = v }),
            (Threshold("--type-a-dc", "Smooth DC a type A device tolerates (default 6mA, IEC 61008-1)."),
                false, (o, v) => o with { TypeASmoothDcToleranceA = v }),
            (Threshold("--type-f-dc", "Smooth DC a type F device tolerates (default 10mA, IEC 62423)."),
                false, (o, v) => o with { TypeFSmoothDcToleranceA = v }),
            (Threshold("--rdc-dd", "DC threshold of an RDC-DD (default 6mA, IEC 62955)."),
                false, (o, v) => o with { RdcDdThresholdA = v }),
            (Threshold("--pulsating-share", "Share of windows (0 to 1) that must be pulsating DC to count (default: any window)."),
                true, (o, v) => o with { PulsatingShareThreshold = v }),
            (Threshold("--leakage-budget", "Leakage budget as a fraction of IΔn (default 0.3, IEC 60364-5-53 §531.3.2)."),
                true, (o, v) => o with { LeakageBudgetFraction = v }),
            (Threshold("--risk-possible", "Nuisance risk 'possible' from this fraction of IΔn (default 0.3)."),
                true, (o, v) => o with { PossibleRiskFraction = v }),
            (Threshold("--risk-likely", "Nuisance risk 'likely' from this fraction of IΔn (default 0.5)."),
                true, (o, v) => o with { LikelyRiskFraction = v }),
        ];
    }

    private static Option<string?> Threshold(string name, string description) => new(name) { Description = description };

    public void AddTo(Command command)
    {
        command.Options.Add(Rated);
        command.Options.Add(Device);
        command.Options.Add(Timing);
        command.Options.Add(Regime);
        command.Options.Add(Ev);
        command.Options.Add(ChargerDcDetection);
        command.Options.Add(Accuracy);
        foreach (var (option, _, _) in _thresholds)
        {
            command.Options.Add(option);
        }

        command.Options.Add(FrequencyFactors);
        command.Options.Add(BPlusLimit);
    }

    /// <summary>Parses the typed values once; checks ranges.</summary>
    /// <exception cref="OptionValueException">A value cannot be parsed or is out of range.</exception>
    public AssessmentOptions Read(ParseResult parse)
    {
        var ratedText = parse.GetValue(Rated) ?? "30mA";
        var options = new AssessmentOptions { RatedResidualCurrentA = Quantity.ParseCurrentA("--rated", ratedText, bareUnit: "mA") };
        if (parse.GetValue(Device) is { } deviceText)
        {
            options = DeviceTypeNames.TryParseProtection(deviceText, out var type, out var rdcDd)
                ? options with { InstalledType = type, InstalledRdcDd = rdcDd }
                : throw new OptionValueException("--device", deviceText, "AC, A, F, B or B+, optionally with +RDC-DD (e.g. A+RDC-DD)");
        }

        if (parse.GetValue(Timing) is { } timingText)
        {
            options = options with
            {
                InstalledTiming = timingText.Trim().ToLowerInvariant() switch
                {
                    "general" or "g" => DeviceTiming.General,
                    "s" or "selective" or "time-delayed" => DeviceTiming.S,
                    _ => throw new OptionValueException("--timing", timingText, "general or s"),
                },
            };
        }

        var regimeText = parse.GetValue(Regime) ?? "iec";
        options = RegimeNames.TryParse(regimeText, out var regime)
            ? options with { Regime = regime }
            : throw new OptionValueException("--regime", regimeText, "iec or na");
        options = options with { EvChargingPoint = parse.GetValue(Ev), ChargerDcDetection = parse.GetValue(ChargerDcDetection) };
        if (options.ChargerDcDetection && !options.EvChargingPoint)
        {
            throw new UserInputException("--charger-dc-detection: declares a charging point's own DC detection, so it goes with --ev; add --ev or leave it out");
        }

        if (parse.GetValue(Accuracy) is { } accuracyText)
        {
            options = options with { Accuracy = MeasurementAccuracy.Parse(accuracyText) };
        }

        foreach (var (option, fraction, apply) in _thresholds)
        {
            if (parse.GetValue(option) is not { } text)
            {
                continue;
            }

            var value = fraction
                ? double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var f)
                    ? f
                    : throw new OptionValueException(option.Name, text, "a number such as 0.3")
                : Quantity.ParseCurrentA(option.Name, text, bareUnit: "mA");
            options = apply(options, value);
        }

        if (parse.GetValue(FrequencyFactors) is { } factorsText)
        {
            var parts = factorsText.Split(',', StringSplitOptions.TrimEntries);
            var values = new double[parts.Length];
            if (parts.Length != 3 || !parts.Select((p, i) => double.TryParse(p, NumberStyles.Float, CultureInfo.InvariantCulture, out values[i])).All(ok => ok))
            {
                throw new OptionValueException("--frequency-factors", factorsText, "three numbers separated by commas, such as 2.4,6,14");
            }

            options = options with { FrequencyFactor150Hz = values[0], FrequencyFactor400Hz = values[1], FrequencyFactor1kHz = values[2] };
        }

        if (parse.GetValue(BPlusLimit) is { } limitText)
        {
            options = options with { BPlusUpperLimitA = Quantity.ParseCurrentA("--bplus-limit", limitText, bareUnit: "mA") };
        }

        options.Validate();
        return options;
    }
}
