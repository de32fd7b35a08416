using System.CommandLine;
using System.CommandLine.Parsing;
using System.Globalization;
using WaveCheck.Core;
using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;

namespace WaveCheck.Cli;

/// <summary>
/// Options whose values System.CommandLine parses into typed values through custom parsers: help shows the kind of
/// value (<c>--rated &lt;CURRENT&gt;</c>), and every value that cannot be parsed becomes a parse error with one message,
/// printed in one place (<see cref="WaveCheckCommand.UsageLine"/>), before any command runs. The quantities go through
/// the one parser of Core (<see cref="Quantity"/>), so the command line, the site file and synth parts follow one rule.
/// </summary>
internal static class ValueOptions
{
    /// <summary>A current with its unit, amperes; null when not given.</summary>
    public static Option<double?> Current(string name, string description, bool positive = false) =>
        Typed<double?>(name, description, "CURRENT", text => positive ? Quantity.ParsePositiveCurrentA(name, text) : Quantity.ParseCurrentA(name, text));

    /// <summary>A frequency with its unit, hertz; null when not given.</summary>
    public static Option<double?> Frequency(string name, string description) =>
        Typed<double?>(name, description, "FREQUENCY", text => Quantity.ParseFrequencyHz(name, text));

    /// <summary>A frequency with its unit, or <c>auto</c> (null, as when not given).</summary>
    public static Option<double?> FrequencyOrAuto(string name, string description) =>
        Typed<double?>(name, description, "auto|FREQUENCY", text =>
            text.Trim().Equals("auto", StringComparison.OrdinalIgnoreCase) ? null : Quantity.ParseFrequencyHz(name, text));

    /// <summary>A voltage with its unit, volts; null when not given.</summary>
    public static Option<double?> Voltage(string name, string description) =>
        Typed<double?>(name, description, "VOLTAGE", text => Quantity.ParseVoltageV(name, text));

    /// <summary>A clamp sensitivity with its units, volts per ampere; null when not given.</summary>
    public static Option<double?> Sensitivity(string name, string description) =>
        Typed<double?>(name, description, "SENSITIVITY", text => Quantity.ParseSensitivityVPerA(name, text));

    /// <summary>A duration, seconds; null when not given.</summary>
    public static Option<double?> Duration(string name, string description) =>
        Typed<double?>(name, description, "DURATION", text => Quantity.ParseDurationS(name, text));

    /// <summary>A plain number (a share, a multiple); null when not given.</summary>
    public static Option<double?> Number(string name, string description, string example) =>
        Typed<double?>(name, description, "NUMBER", text =>
            double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var value) && double.IsFinite(value)
                ? value
                : throw new OptionValueException(name, text, $"a number such as {example}"));

    /// <summary>One word of a fixed set; help lists them (<c>&lt;iec|na&gt;</c>).</summary>
    public static Option<T?> Choice<T>(string name, string description, params (string Word, T Value)[] choices)
        where T : struct =>
        Typed<T?>(name, description, string.Join('|', choices.Select(c => c.Word)), text =>
        {
            foreach (var (word, value) in choices)
            {
                if (word.Equals(text.Trim(), StringComparison.OrdinalIgnoreCase))
                {
                    return value;
                }
            }

            throw new OptionValueException(name, text, Words(choices.Select(c => c.Word).ToList(), "or"));
        });

    /// <summary>A comma-separated set of flags of a fixed set (<c>upgrade,nuisance</c>).</summary>
    public static Option<Finding?> Findings(string name, string description, params (string Word, Finding Value)[] choices) =>
        Typed<Finding?>(name, description, string.Join(',', choices.Select(c => c.Word)), text =>
        {
            var findings = Finding.None;
            foreach (var word in text.Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries))
            {
                var match = choices.Where(c => c.Word.Equals(word, StringComparison.OrdinalIgnoreCase)).Select(c => (Finding?)c.Value).FirstOrDefault();
                findings |= match ?? throw new OptionValueException(name, text, Words(choices.Select(c => c.Word).ToList(), "and/or") + ", comma-separated");
            }

            return findings;
        });

    /// <summary>An installed protection: <c>A</c>, <c>B+</c>, <c>A+RDC-DD</c>; parsed once, here.</summary>
    public static Option<InstalledProtection?> Device(string name, string description) =>
        Typed<InstalledProtection?>(name, description, "TYPE", text =>
            DeviceTypeNames.TryParseProtection(text, out var type, out var rdcDd)
                ? new InstalledProtection(type, rdcDd ? DcDetection.RdcDd : DcDetection.None)
                : throw new OptionValueException(name, text, "AC, A, F, B or B+, optionally with +RDC-DD (e.g. A+RDC-DD)"));

    /// <summary>The measuring chain's accuracy, <c>2%+0.1mA</c>.</summary>
    public static Option<MeasurementAccuracy?> Accuracy(string name, string description) =>
        Typed<MeasurementAccuracy?>(name, description, "ACCURACY", text => MeasurementAccuracy.Parse(text, name));

    /// <summary>Two or more channel names (or numbers), comma-separated.</summary>
    public static Option<string[]?> Channels(string name, string description) =>
        Typed<string[]?>(name, description, "CHANNELS", text =>
        {
            var names = text.Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries);
            return names.Length >= 2 ? names : throw new OptionValueException(name, text, "two or more channel names separated by commas, e.g. L1,L2,L3,N");
        });

    /// <summary>A text value (a path, a name) with the kind of value shown in help.</summary>
    public static Option<string?> Text(string name, string description, string helpName, params string[] aliases) =>
        new(name, aliases) { Description = description, HelpName = helpName };

    /// <summary>How a sensor coupling is typed.</summary>
    public static readonly (string, SensorCoupling)[] SensorWords =
        [("dc", SensorCoupling.Dc), ("ac", SensorCoupling.Ac), ("unknown", SensorCoupling.Unknown)];

    /// <summary>How a rules regime is typed.</summary>
    public static readonly (string, Regime)[] RegimeWords = [("iec", Regime.Iec), ("na", Regime.Na)];

    private static Option<T> Typed<T>(string name, string description, string helpName, Func<string, T> parse) =>
        new(name)
        {
            Description = description,
            HelpName = helpName,
            Arity = ArgumentArity.ExactlyOne,
            CustomParser = result => Parse(result, parse),
        };

    private static T Parse<T>(ArgumentResult result, Func<string, T> parse)
    {
        var text = result.Tokens.Count > 0 ? result.Tokens[^1].Value : string.Empty;
        try
        {
            return parse(text);
        }
        catch (UserInputException e)
        {
            result.AddError(e.Message);
            return default!;
        }
    }

    private static string Words(IReadOnlyList<string> words, string conjunction) =>
        words.Count == 1 ? words[0] : $"{string.Join(", ", words.Take(words.Count - 1))} {conjunction} {words[^1]}";
}
