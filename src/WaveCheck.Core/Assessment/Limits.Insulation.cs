namespace WaveCheck.Core.Assessment;

/// <summary>The thresholds that read a resistive and capacitive leakage split (docs/methods.md, "Resistive and
/// capacitive leakage").</summary>
public static partial class Limits
{
    /// <summary>Minimum insulation resistance of a circuit up to 500 V: 1 MΩ (tested at 500 V DC).</summary>
    /// <remarks>IEC 60364-6 (initial verification, insulation resistance table), from memory (REFERENCE.md,
    /// "Insulation": SELV/PELV 0.5 MΩ at 250 V, above 500 V 1 MΩ at 1000 V). A resistance read from the leakage at
    /// operating voltage is not that test (AC at 230 V, loads connected), so a figure below it is a reason to test,
    /// not a test result.</remarks>
    public const double MinimumInsulationResistanceOhm = 1e6;

    /// <summary>Above this relative residual of the fit I_n = V_n (G + j n ω C), the leakage is "not a simple R-C
    /// leakage": 0.2.</summary>
    /// <remarks>Engineering choice: an R ∥ C leakage fits to the noise (a few per cent); a load's own harmonic leakage
    /// (a rectifier, a converter's common-mode current) added on orders where the voltage carries harmonics leaves
    /// far more. 20 % leaves room for the sensors' phase and gain differences between orders.</remarks>
    public const double LeakageFitResidualLimit = 0.2;

    /// <summary>Phase uncertainty between the current and voltage channels counted when the resistive part is
    /// compared with a limit: 2°.</summary>
    /// <remarks>Engineering choice (common practice, no source): of the order of a leakage clamp's phase error at
    /// mains frequency. It moves sin 2° ≈ 3.5 % of the whole current between the resistive and the capacitive part,
    /// which matters for a mostly capacitive leakage; counted on the safe side (a lower resistance).</remarks>
    public const double LeakagePhaseUncertaintyDeg = 2.0;
}
