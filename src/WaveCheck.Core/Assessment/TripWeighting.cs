using WaveCheck.Core.Model;
namespace WaveCheck.Core.Assessment;

/// <summary>
/// How strongly a device type responds to residual current of a given kind, as a multiple of its mains-frequency
/// tripping current (1 at mains; 2.4: needs 2.4 times as much; infinity: does not respond). A standing current
/// divided by this factor is the mains-frequency current the device "feels"; the nuisance-trip margin uses it.
/// </summary>
/// <remarks>
/// <para>Model (each choice documented in docs/methods.md (Part II)):</para>
/// <list type="bullet">
/// <item>Types F, B, B+ at AC from mains to 1 kHz: the IEC 62423 §5.3 upper tripping limits (2.4 IΔn at 150 Hz,
/// 6 at 400 Hz, 14 at 1 kHz, from memory) relative to 1 IΔn at mains, linearly interpolated in log-frequency.
/// These are the limits a device must trip by, so the factor models a typical device; the lower limit stays
/// 0.5 IΔn at every frequency, so a device may respond more strongly than modelled.</item>
/// <item>Types AC and A at any AC frequency: factor 1 (engineering choice, conservative: their response away
/// from mains frequency is not specified, so no credit is taken for any fall in sensitivity).</item>
/// <item>Below mains frequency: factor 1 for every type (engineering choice, conservative).</item>
/// <item>Above 1 kHz: F and B hold the 1 kHz factor 14 (not defined above; no further credit); B+ uses
/// 420 mA / IΔn (DIN VDE 0664-400, from memory) but never more than 14; AC and A: 1.</item>
/// <item>Smooth DC: B and B+ 2 (IEC 62423: smooth DC trips by 2 IΔn, std); AC, A, F do not respond (infinity):
/// to them smooth DC is a blinding risk, reported apart.</item>
/// <item>The mean of pulsating DC on top of its floor: 1.4 for A, F, B, B+ (IEC 61008-1 pulsating-DC upper limit,
/// std); AC: 1 (not specified; conservative).</item>
/// </list>
/// Stateless and thread-safe.
/// </remarks>
public static class TripWeighting
{
    /// <summary>Factor for AC content at <paramref name="frequencyHz"/>.</summary>
    /// <param name="type">Device type.</param>
    /// <param name="frequencyHz">Frequency, hertz.</param>
    /// <param name="mainsHz">Mains frequency, hertz.</param>
    /// <param name="ratedA">IΔn, amperes (B+ above 1 kHz depends on it).</param>
    /// <param name="factors">The IEC 62423 factors and B+ limit to use; null for the defaults in <see cref="Limits"/>.</param>
    public static double AcFactor(DeviceType type, double frequencyHz, double mainsHz, double ratedA, TripFactors? factors = null)
    {
        var k = factors ?? TripFactors.Default;
        if (type is DeviceType.AC or DeviceType.A || frequencyHz <= mainsHz)
        {
            return 1.0;
        }

        if (frequencyHz > Limits.TypeBUpperFrequencyHz)
        {
            return HighFrequencyFactor(type, ratedA, k);
        }

        // Points of the IEC 62423 upper limits, interpolated linearly in log-frequency.
        ReadOnlySpan<double> fs = [mainsHz, 150, 400, Limits.TypeBUpperFrequencyHz];
        ReadOnlySpan<double> ks = [1.0, k.At150Hz, k.At400Hz, k.At1kHz];
        for (var i = 1; i < fs.Length; i++)
        {
            if (frequencyHz <= fs[i] && fs[i] > fs[i - 1])
            {
                var lo = Math.Max(fs[i - 1], mainsHz);
                var t = Math.Log(frequencyHz / lo) / Math.Log(fs[i] / lo);
                return ks[i - 1] + (t * (ks[i] - ks[i - 1]));
            }
        }

        return k.At1kHz;
    }

    /// <summary>Factor for content above 1 kHz (up to and beyond 20 kHz).</summary>
    /// <param name="type">Device type.</param>
    /// <param name="ratedA">IΔn, amperes.</param>
    /// <param name="factors">The factors to use; null for the defaults.</param>
    public static double HighFrequencyFactor(DeviceType type, double ratedA, TripFactors? factors = null)
    {
        var k = factors ?? TripFactors.Default;
        return type switch
        {
            DeviceType.AC or DeviceType.A => 1.0,
            DeviceType.BPlus => Math.Min(k.At1kHz, k.BPlusUpperLimitA / ratedA),
            _ => k.At1kHz,
        };
    }

    /// <summary>Factor for smooth DC.</summary>
    /// <param name="type">Device type.</param>
    public static double SmoothDcFactor(DeviceType type) =>
        type >= DeviceType.B ? Limits.TypeBSmoothDcFactor : double.PositiveInfinity;

    /// <summary>Factor for the mean of pulsating DC above its floor.</summary>
    /// <param name="type">Device type.</param>
    public static double PulsatingDcFactor(DeviceType type) =>
        type == DeviceType.AC ? 1.0 : Limits.PulsatingDcFactor;
}

/// <summary>The frequency factors of IEC 62423 §5.3 (upper tripping limits as multiples of IΔn, from memory) and the B+
/// upper limit (DIN VDE 0664-400, from memory), as applied: defaults from <see cref="Limits"/> or the user's.</summary>
/// <param name="At150Hz">Multiple of IΔn at 150 Hz.</param>
/// <param name="At400Hz">Multiple of IΔn at 400 Hz.</param>
/// <param name="At1kHz">Multiple of IΔn at 1 kHz.</param>
/// <param name="BPlusUpperLimitA">B+ upper tripping limit to 20 kHz, amperes.</param>
public sealed record TripFactors(double At150Hz, double At400Hz, double At1kHz, double BPlusUpperLimitA)
{
    /// <summary>The defaults of <see cref="Limits"/>.</summary>
    public static TripFactors Default { get; } = new(Limits.FrequencyFactor150Hz, Limits.FrequencyFactor400Hz,
        Limits.FrequencyFactor1kHz, Limits.BPlusUpperLimitA);
}
