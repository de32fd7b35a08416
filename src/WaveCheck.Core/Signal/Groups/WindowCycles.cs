namespace WaveCheck.Core.Signal;

/// <summary>
/// How many mains cycles one analysis window spans: the IEC 61000-4-7 window of about 200 ms, on which the harmonic
/// groups of <see cref="HarmonicGroups"/> are defined (bin N·n holds harmonic n of a window of N cycles). Stateless.
/// </summary>
public static class WindowCycles
{
    /// <summary>Cycles per window for a nominal frequency: 10 at 50 Hz, 12 at 60 Hz (IEC 61000-4-7), else the count
    /// nearest 200 ms (engineering choice), at least 2.</summary>
    /// <param name="nominalHz">Nominal mains frequency, hertz.</param>
    public static int For(double nominalHz) =>
        nominalHz == 50 ? 10 : nominalHz == 60 ? 12 : Math.Max(2, (int)Math.Round(0.2 * nominalHz));
}
