using System.CommandLine;
using WaveCheck.Core;
using WaveCheck.Core.Capture;

namespace WaveCheck.Cli;

/// <summary>The options that describe how to read a capture, shared by every command that reads one.</summary>
internal sealed class ImportOptionSet
{
    public Option<double?> Scale { get; } = ValueOptions.Current("--scale",
        "Amperes that WAV full scale stands for, e.g. 0.1A or 100mA.", positive: true);

    public Option<double?> Sensitivity { get; } = ValueOptions.Sensitivity("--sensitivity",
        "Clamp sensitivity, e.g. \"10 mV/mA\"; with --range gives the WAV scale, alone converts voltage columns.");

    public Option<double?> Range { get; } = ValueOptions.Voltage("--range",
        "Logger input range (volts at full scale), e.g. \"1 V\".");

    public Option<double?> Rate { get; } = ValueOptions.Frequency("--rate",
        "Sample rate of a CSV without a time column, e.g. 10kHz.");

    public Option<string?> Channel { get; } = ValueOptions.Text("--channel",
        "Channel holding the residual current: its name (L1, or the header as written, L1_A) or its 1-based number.", "CHANNEL");

    public Option<string[]?> Sum { get; } = ValueOptions.Channels("--sum",
        "Form the residual current as the sum of these live-conductor channels, e.g. L1,L2,L3,N (or L1_A,L2_A,L3_A,N_A as the header writes them).");

    public Option<SensorCoupling?> Sensor { get; } = ValueOptions.Choice("--sensor",
        $"Sensor coupling: dc (sees DC), ac (blind to DC) or unknown (default {new ImportOptions().Sensor.ToString().ToLowerInvariant()}).",
        ValueOptions.SensorWords);

    public Option<bool> Primary { get; } = new("--primary")
    {
        Description = "COMTRADE: use primary values instead of secondary.",
    };

    public Option<string?> Voltage { get; } = new("--voltage")
    {
        Description = "Channel(s) carrying the circuit voltage to earth, by name or 1-based number: one (single-phase, e.g. L1N) or three (L1,L2,L3 to earth, e.g. U1,U2,U3); splits the leakage into resistive and capacitive parts.",
    };

    public Option<string?> VoltageScale { get; } = new("--voltage-scale")
    {
        Description = "Voltage channels: volts at WAV full scale (required for WAV, e.g. 500V), or a probe/divider ratio for CSV and COMTRADE (default 1).",
    };

    public void AddTo(Command command)
    {
        command.Options.Add(Scale);
        command.Options.Add(Sensitivity);
        command.Options.Add(Range);
        command.Options.Add(Rate);
        command.Options.Add(Channel);
        command.Options.Add(Sum);
        command.Options.Add(Sensor);
        command.Options.Add(Primary);
        command.Options.Add(Voltage);
        command.Options.Add(VoltageScale);
    }

    /// <summary>Gathers the values System.CommandLine parsed into SI quantities; checks bounds and combinations.</summary>
    /// <exception cref="OptionValueException">A value is out of bounds, or options conflict.</exception>
    public ImportOptions Read(ParseResult parse)
    {
        var scale = parse.GetValue(Scale);
        var sensitivity = parse.GetValue(Sensitivity);
        var range = parse.GetValue(Range);
        var rate = parse.GetValue(Rate);
        var channel = parse.GetValue(Channel);
        var sum = parse.GetValue(Sum) is { Length: > 0 } names ? names : null;

        if (scale is not null && (sensitivity is not null || range is not null))
        {
            throw new OptionValueException("--scale", Typed(parse, Scale), "either --scale or --sensitivity with --range, not both");
        }

        if (sensitivity is <= 0)
        {
            throw new OptionValueException("--sensitivity", Typed(parse, Sensitivity), "a positive sensitivity");
        }

        if (range is <= 0)
        {
            throw new OptionValueException("--range", Typed(parse, Range), "a positive voltage");
        }

        foreach (var (key, value, option) in new[] { ("scale", scale, Scale), ("sensitivity", sensitivity, Sensitivity), ("range", range, Range), ("rate", rate, Rate) })
        {
            if (value is { } v && CaptureLimits.SettingProblem(key, v) is { } expected)
            {
                throw new OptionValueException("--" + key, Typed(parse, option), expected);
            }
        }

        if (channel is not null && sum is not null)
        {
            throw new OptionValueException("--sum", string.Join(',', sum), "either --channel or --sum, not both");
        }

        var (voltage, voltageScale) = ReadVoltage(parse);
        return new ImportOptions
        {
            ScaleA = scale,
            SensitivityVPerA = sensitivity,
            RangeV = range,
            RateHz = rate,
            Channel = channel,
            SumChannels = sum,
            Sensor = parse.GetValue(Sensor) ?? new ImportOptions().Sensor,
            Primary = parse.GetValue(Primary),
            VoltageChannels = voltage,
            VoltageScale = voltageScale,
        };
    }

    /// <summary>The text the user typed for an option, for a message about its value.</summary>
    internal static string Typed(ParseResult parse, Option option) =>
        parse.GetResult(option) is { Tokens: [.., var last] } ? last.Value : string.Empty;

    private (IReadOnlyList<string>? Channels, double? Scale) ReadVoltage(ParseResult parse)
    {
        var voltageText = parse.GetValue(Voltage);
        var scaleText = parse.GetValue(VoltageScale);
        IReadOnlyList<string>? channels = null;
        if (voltageText is not null)
        {
            var names = voltageText.Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries);
            if (names.Length is not (1 or 3))
            {
                throw new OptionValueException("--voltage", voltageText, "one channel (single-phase) or three separated by commas (L1,L2,L3)");
            }

            channels = names;
        }

        double? scale = null;
        if (scaleText is not null)
        {
            var v = Quantity.ParseVoltageScale("--voltage-scale", scaleText);
            scale = v > 0 && v <= ImportOptions.MaxVoltageScale
                ? v
                : throw new OptionValueException("--voltage-scale", scaleText, "a positive factor up to 1e6 (volts at WAV full scale, e.g. 500V, or a probe ratio)");
        }

        return (channels, scale);
    }
}
