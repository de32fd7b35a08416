using System.CommandLine;
using WaveCheck.Core;
using WaveCheck.Core.Capture;

namespace WaveCheck.Cli;

/// <summary>The options that describe how to read a capture, shared by every command that reads one.</summary>
internal sealed class ImportOptionSet
{
    public Option<string?> Scale { get; } = new("--scale")
    {
        Description = "Amperes that WAV full scale stands for, e.g. 0.1A or 100mA (a bare number is amperes).",
    };

    public Option<string?> Sensitivity { get; } = new("--sensitivity")
    {
        Description = "Clamp sensitivity, e.g. \"10 mV/mA\"; with --range gives the WAV scale, alone converts voltage columns.",
    };

    public Option<string?> Range { get; } = new("--range")
    {
        Description = "Logger input range (volts at full scale), e.g. \"1 V\".",
    };

    public Option<string?> Rate { get; } = new("--rate")
    {
        Description = "Sample rate of a CSV without a time column, e.g. 10kHz.",
    };

    public Option<string?> Channel { get; } = new("--channel")
    {
        Description = "Channel holding the residual current, by name or 1-based number.",
    };

    public Option<string?> Sum { get; } = new("--sum")
    {
        Description = "Form the residual current as the sum of these live-conductor channels, e.g. L1,L2,L3,N.",
    };

    public Option<string> Sensor { get; } = new("--sensor")
    {
        Description = "Sensor coupling: dc (sees DC), ac (blind to DC) or unknown.",
        DefaultValueFactory = _ => "unknown",
    };

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

    /// <summary>Parses the typed values once into SI quantities.</summary>
    /// <exception cref="OptionValueException">A value cannot be parsed, or options conflict.</exception>
    public ImportOptions Read(ParseResult parse)
    {
        var scaleText = parse.GetValue(Scale);
        var sensitivityText = parse.GetValue(Sensitivity);
        var rangeText = parse.GetValue(Range);
        var rateText = parse.GetValue(Rate);
        var channel = parse.GetValue(Channel);
        var sumText = parse.GetValue(Sum);
        var sensorText = parse.GetValue(Sensor) ?? "unknown";

        double? scale = scaleText is null ? null : Quantity.ParsePositiveCurrentA("--scale", scaleText);
        double? sensitivity = sensitivityText is null ? null : Quantity.ParseSensitivityVPerA("--sensitivity", sensitivityText);
        double? range = rangeText is null ? null : Quantity.ParseVoltageV("--range", rangeText);
        double? rate = rateText is null ? null : Quantity.ParseFrequencyHz("--rate", rateText);

        if (scale is not null && (sensitivity is not null || range is not null))
        {
            throw new OptionValueException("--scale", scaleText!, "either --scale or --sensitivity with --range, not both");
        }

        if (sensitivity is <= 0)
        {
            throw new OptionValueException("--sensitivity", sensitivityText!, "a positive sensitivity");
        }

        if (range is <= 0)
        {
            throw new OptionValueException("--range", rangeText!, "a positive voltage");
        }

        foreach (var (key, value, text) in new[] { ("scale", scale, scaleText), ("sensitivity", sensitivity, sensitivityText), ("range", range, rangeText), ("rate", rate, rateText) })
        {
            if (value is { } v && CaptureLimits.SettingProblem(key, v) is { } expected)
            {
                throw new OptionValueException("--" + key, text!, expected);
            }
        }

        if (channel is not null && sumText is not null)
        {
            throw new OptionValueException("--sum", sumText, "either --channel or --sum, not both");
        }

        IReadOnlyList<string>? sum = null;
        if (sumText is not null)
        {
            var names = sumText.Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries);
            if (names.Length < 2)
            {
                throw new OptionValueException("--sum", sumText, "two or more channel names separated by commas, e.g. L1,L2,L3,N");
            }

            sum = names;
        }

        var sensor = SensorCouplingNames.Parse("--sensor", sensorText);
        var (voltage, voltageScale) = ReadVoltage(parse);

        return new ImportOptions
        {
            ScaleA = scale,
            SensitivityVPerA = sensitivity,
            RangeV = range,
            RateHz = rate,
            Channel = channel,
            SumChannels = sum,
            Sensor = sensor,
            Primary = parse.GetValue(Primary),
            VoltageChannels = voltage,
            VoltageScale = voltageScale,
        };
    }

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
            var v = Quantity.ParseVoltageV("--voltage-scale", scaleText);
            scale = v > 0 && v <= ImportOptions.MaxVoltageScale
                ? v
                : throw new OptionValueException("--voltage-scale", scaleText, "a positive factor up to 1e6 (volts at WAV full scale, e.g. 500V, or a probe ratio)");
        }

        return (channels, scale);
    }
}
