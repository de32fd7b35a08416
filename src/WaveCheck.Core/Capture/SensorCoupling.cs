namespace WaveCheck.Core.Capture;

/// <summary>How the current sensor couples to the conductor: decides whether the capture can show DC at all.</summary>
public enum SensorCoupling
{
    /// <summary>Not stated: a DC reading cannot be trusted to be complete.</summary>
    Unknown,

    /// <summary>DC-coupled (fluxgate, Hall-effect, shunt): sees smooth DC.</summary>
    Dc,

    /// <summary>AC-coupled (plain current transformer, Rogowski): blind to smooth DC.</summary>
    Ac,
}

/// <summary>The words for sensor coupling on the command line, in site files and in JSON: <c>dc</c>, <c>ac</c>, <c>unknown</c>.</summary>
public static class SensorCouplingNames
{
    /// <summary>Parses <c>dc</c>, <c>ac</c> or <c>unknown</c> (case-insensitive).</summary>
    /// <param name="option">Where the text came from, for the message (e.g. <c>--sensor</c>).</param>
    /// <param name="text">The text.</param>
    /// <exception cref="OptionValueException">Any other word.</exception>
    public static SensorCoupling Parse(string option, string text) => text?.Trim().ToLowerInvariant() switch
    {
        "dc" => SensorCoupling.Dc,
        "ac" => SensorCoupling.Ac,
        "unknown" => SensorCoupling.Unknown,
        _ => throw new OptionValueException(option, text ?? string.Empty, "dc, ac or unknown"),
    };
}
