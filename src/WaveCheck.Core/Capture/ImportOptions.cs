namespace WaveCheck.Core.Capture;

/// <summary>
/// How to interpret a capture: the user's statements about calibration, channels and sensor, parsed at the edge.
/// Every value in SI units.
/// </summary>
public sealed record ImportOptions
{
    /// <summary>Amperes that full scale (1.0) of a WAV sample stands for (<c>--scale</c>).</summary>
    public double? ScaleA { get; init; }

    /// <summary>Clamp sensitivity, volts per ampere (<c>--sensitivity "10 mV/mA"</c> = 10 V/A).</summary>
    public double? SensitivityVPerA { get; init; }

    /// <summary>Logger input range, volts at full scale (<c>--range "1 V"</c>).</summary>
    public double? RangeV { get; init; }

    /// <summary>Sample rate for a CSV without a time column, hertz (<c>--rate</c>).</summary>
    public double? RateHz { get; init; }

    /// <summary>Channel that carries the residual current (<c>--channel</c>), by name (case-insensitive) or 1-based number.</summary>
    public string? Channel { get; init; }

    /// <summary>Channels summed to form the residual current (<c>--sum L1,L2,L3,N</c>).</summary>
    public IReadOnlyList<string>? SumChannels { get; init; }

    /// <summary>Declared sensor coupling (<c>--sensor</c>).</summary>
    public SensorCoupling Sensor { get; init; } = SensorCoupling.Unknown;

    /// <summary>Highest frequency the user cares about, hertz: a sample rate below twice this is warned about. Default 20 kHz (extended-frequency type B).</summary>
    public double BandOfInterestHz { get; init; } = 20_000;

    /// <summary>COMTRADE: deliver primary values (<c>--primary</c>) instead of secondary.</summary>
    public bool Primary { get; init; }

    /// <summary>The capture is only described (<c>info</c>), not judged: of several channels that could carry the
    /// residual current, none chosen, the first is shown with a <c>channel-guessed</c> warning instead of the refusal
    /// an analysis gets (<see cref="ChannelSelection"/>), so the file's channels can still be listed.</summary>
    public bool DescribeOnly { get; init; }

    /// <summary>Channels carrying the circuit's voltage to earth (<c>--voltage L1N</c>, or <c>--voltage U1,U2,U3</c>
    /// for the three phase-to-earth voltages), by name or 1-based number; null when the capture has none.</summary>
    public IReadOnlyList<string>? VoltageChannels { get; init; }

    /// <summary>Circuit volts per unit the file stores on a voltage channel (<c>--voltage-scale</c>): volts at full
    /// scale for a WAV file (required there), a probe or divider ratio for CSV and COMTRADE (default 1).</summary>
    public double? VoltageScale { get; init; }

    /// <summary>Checks each stated value against <see cref="CaptureLimits"/>; the message names the setting.</summary>
    /// <exception cref="OptionValueException">A value is out of bounds.</exception>
    public void Validate()
    {
        Check("scale", nameof(ScaleA), ScaleA, "A");
        Check("sensitivity", nameof(SensitivityVPerA), SensitivityVPerA, "V/A");
        Check("range", nameof(RangeV), RangeV, "V");
        Check("rate", nameof(RateHz), RateHz, "Hz");
        if (VoltageScale is { } v && !(v > 0 && v <= MaxVoltageScale))
        {
            throw new OptionValueException(Setting.Ref(nameof(VoltageScale)), v.ToString("G6", System.Globalization.CultureInfo.InvariantCulture),
                "a positive factor up to 1e6 (volts at WAV full scale, or a probe ratio for CSV and COMTRADE)");
        }
    }

    /// <summary>Largest <see cref="VoltageScale"/> accepted: a megavolt at full scale or a 10⁶:1 divider, beyond any
    /// low-voltage circuit (engineering choice, a bound against typing errors).</summary>
    public const double MaxVoltageScale = 1e6;

    private static void Check(string key, string property, double? value, string unit)
    {
        if (value is { } v && CaptureLimits.SettingProblem(key, v) is { } expected)
        {
            throw new OptionValueException(Setting.Ref(property),
                v.ToString("G6", System.Globalization.CultureInfo.InvariantCulture) + " " + unit, expected);
        }
    }
}
