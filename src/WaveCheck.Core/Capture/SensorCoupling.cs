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
