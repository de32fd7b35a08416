namespace WaveCheck.Core.Synthesis;

/// <summary>
/// The settings of the synthesizer that its messages name (<see cref="Setting.Ref"/>): it has no options record, so
/// its settings are named here, and each front end writes them in its own words (the CLI: <c>--supply</c>, and the
/// <c>synth</c> command's parts).
/// </summary>
public static class SynthesisSettings
{
    /// <summary>The supply voltage description (<see cref="SupplySpec.ParseSupply"/>).</summary>
    public const string Supply = nameof(Supply);

    /// <summary>The waveform parts (<see cref="SynthesisSpec.Parse"/>, <see cref="SupplySpec.ParseLeak"/>).</summary>
    public const string Parts = nameof(Parts);

    /// <summary><see cref="Supply"/> marked for a message.</summary>
    public static string SupplyRef => Setting.Ref(Supply);

    /// <summary><see cref="Parts"/> marked for a message.</summary>
    public static string PartsRef => Setting.Ref(Parts);
}
