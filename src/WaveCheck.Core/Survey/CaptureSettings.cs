using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Survey;

/// <summary>
/// Everything needed to analyse and assess one capture of a survey: how to read it, the device it is judged against,
/// the rules and what the circuit is. Built by <see cref="SiteConfig.Jobs"/> from the site file's defaults, the capture's
/// own entry and the command line's overrides.
/// </summary>
public sealed record CaptureSettings
{
    /// <summary>Rated residual operating current IΔn used when nothing else is given, amperes (30 mA: the common
    /// additional-protection rating, IEC 60364-4-41 §415.1; engineering choice as a default).</summary>
    public const double DefaultRatedResidualCurrentA = 0.030;

    /// <summary>How to read the capture (calibration, channel, sensor coupling).</summary>
    public ImportOptions Import { get; init; } = new();

    /// <summary>Rated residual operating current IΔn of the device protecting the circuit, amperes.</summary>
    public double RatedResidualCurrentA { get; init; } = DefaultRatedResidualCurrentA;

    /// <summary>Protection installed on the circuit as stated: its type, with a 6 mA DC detection device (RDC-DD,
    /// IEC 62955) where one is fitted beside it (<c>"A+RDC-DD"</c>); null when not known.</summary>
    public InstalledProtection? InstalledProtection { get; init; }

    /// <summary>The charging equipment provides 6 mA DC fault detection itself, as its maker declares.</summary>
    public bool ChargerDcDetection { get; init; }

    /// <summary>Rules to judge by: <c>iec</c> or <c>na</c> (UL 943).</summary>
    public Regime Regime { get; init; } = Regime.Iec;

    /// <summary>The circuit feeds an EV charging point (IEC 60364-7-722 guidance applies).</summary>
    public bool Ev { get; init; }

    /// <summary>Circuit name for a person, e.g. <c>C1 panel saw drive</c>; null when not given.</summary>
    public string? Circuit { get; init; }

    /// <summary>What the circuit was doing during this capture, e.g. <c>start-up</c>; null when not given.</summary>
    public string? State { get; init; }

    /// <summary>The installed protection as the assessment judges it: as stated, and at a charging point whose
    /// equipment declares its own 6 mA DC detection, with that detection (an RDC-DD, where fitted, is the one that
    /// counts); null when no device is stated.</summary>
    public InstalledProtection? JudgedProtection =>
        InstalledProtection is { DcDetection: DcDetection.None } stated && Ev && ChargerDcDetection
            ? stated with { DcDetection = DcDetection.Charger }
            : InstalledProtection;
}

/// <summary>
/// Values that may be stated for a capture, each optional: the site file's <c>defaults</c>, one capture's entry, or the
/// command line's overrides. Null means "not stated here". Currents in amperes.
/// </summary>
public sealed record CaptureSettingsPatch
{
    /// <summary>Rated residual operating current IΔn, amperes.</summary>
    public double? RatedResidualCurrentA { get; init; }

    /// <summary>Installed protection: the type, with an RDC-DD beside it where one is fitted.</summary>
    public InstalledProtection? InstalledProtection { get; init; }

    /// <summary>The charging equipment provides 6 mA DC fault detection itself.</summary>
    public bool? ChargerDcDetection { get; init; }

    /// <summary>Sensor coupling.</summary>
    public SensorCoupling? Sensor { get; init; }

    /// <summary><c>iec</c> or <c>na</c>.</summary>
    public Regime? Regime { get; init; }

    /// <summary>EV charging point.</summary>
    public bool? Ev { get; init; }

    /// <summary>Amperes at WAV full scale.</summary>
    public double? ScaleA { get; init; }

    /// <summary>Clamp sensitivity, volts per ampere.</summary>
    public double? SensitivityVPerA { get; init; }

    /// <summary>Logger input range, volts at full scale.</summary>
    public double? RangeV { get; init; }

    /// <summary>Sample rate of a CSV without a time column, hertz.</summary>
    public double? RateHz { get; init; }

    /// <summary>Residual-current channel by name or 1-based number.</summary>
    public string? Channel { get; init; }

    /// <summary>Channels summed to form the residual current.</summary>
    public IReadOnlyList<string>? Sum { get; init; }

    /// <summary>Voltage channels (one, or three for L1, L2, L3).</summary>
    public IReadOnlyList<string>? Voltage { get; init; }

    /// <summary>Circuit volts per stored unit of the voltage channels.</summary>
    public double? VoltageScale { get; init; }

    /// <summary>Circuit name.</summary>
    public string? Circuit { get; init; }

    /// <summary>Operating state during the capture.</summary>
    public string? State { get; init; }

    /// <summary>Applies the values stated in this patch on top of <paramref name="settings"/>; unstated values keep theirs.</summary>
    /// <remarks>A stated channel clears an inherited sum and the other way round, so a capture's own choice of residual
    /// source wins over a default of the other kind.</remarks>
    public CaptureSettings ApplyTo(CaptureSettings settings)
    {
        ArgumentNullException.ThrowIfNull(settings);
        var import = settings.Import;
        import = import with
        {
            ScaleA = ScaleA ?? import.ScaleA,
            SensitivityVPerA = SensitivityVPerA ?? import.SensitivityVPerA,
            RangeV = RangeV ?? import.RangeV,
            RateHz = RateHz ?? import.RateHz,
            Channel = Channel ?? (Sum is not null ? null : import.Channel),
            SumChannels = Sum ?? (Channel is not null ? null : import.SumChannels),
            Sensor = Sensor ?? import.Sensor,
            VoltageChannels = Voltage ?? import.VoltageChannels,
            VoltageScale = VoltageScale ?? import.VoltageScale,
        };
        return settings with
        {
            Import = import,
            RatedResidualCurrentA = RatedResidualCurrentA ?? settings.RatedResidualCurrentA,
            InstalledProtection = InstalledProtection ?? settings.InstalledProtection,
            ChargerDcDetection = ChargerDcDetection ?? settings.ChargerDcDetection,
            Regime = Regime ?? settings.Regime,
            Ev = Ev ?? settings.Ev,
            Circuit = Circuit ?? settings.Circuit,
            State = State ?? settings.State,
        };
    }
}
