namespace WaveCheck.Core.Signal;

/// <summary>
/// The frequency ranges above the harmonic groups: the bands reported above 2 kHz and where "above 1 kHz" and
/// "above 9 kHz" start, in bins of a synchronised window (bin k at k·f/N hertz). Stateless.
/// </summary>
/// <remarks>
/// Bands: 200 Hz bands centred 2100 … 8900 Hz (IEC 61000-4-7 Annex B; band edges from memory), then 2 kHz bands from
/// 9 kHz to the Nyquist frequency or the upper end given (IEC 61000-4-30 Annex C: 150 kHz); each the sum of its bins,
/// edges rounded to the nearest bin, lower edge exclusive, upper inclusive.
/// </remarks>
public static class FrequencyBands
{
    /// <summary>Where type B's range ends and the "above 1 kHz" content starts, hertz (IEC 62423 composite current).</summary>
    public const double OneKHz = 1000;

    /// <summary>Where the "above 9 kHz" content starts, hertz (IEC 61000-4-7 Annex B ends at 9 kHz).</summary>
    public const double NineKHz = 9000;

    /// <summary>The bands seen at a sample rate, in ascending order of their lower edge.</summary>
    /// <param name="sampleRateHz">Sample rate, hertz (bands end at half of it).</param>
    /// <param name="highBandUpperHz">Upper end of the 2 kHz bands above 9 kHz, hertz.</param>
    public static (double LowHz, double HighHz)[] For(double sampleRateHz, double highBandUpperHz)
    {
        var nyquist = sampleRateHz / 2;
        var bands = new List<(double, double)>();
        for (var centre = 2100.0; centre <= 8900; centre += 200)
        {
            if (centre - 100 < nyquist)
            {
                bands.Add((centre - 100, Math.Min(centre + 100, nyquist)));
            }
        }

        var top = Math.Min(nyquist, highBandUpperHz);
        for (var low = 9000.0; low < top; low += 2000)
        {
            bands.Add((low, Math.Min(low + 2000, top)));
        }

        return [.. bands];
    }

    /// <summary>Bins of a band: the lower edge exclusive, the upper inclusive, each rounded to the nearest bin.</summary>
    /// <param name="lowHz">Lower edge, hertz.</param>
    /// <param name="highHz">Upper edge, hertz.</param>
    /// <param name="resolutionHz">Bin spacing of the window, hertz.</param>
    public static (int From, int To) Bins(double lowHz, double highHz, double resolutionHz) =>
        ((int)Math.Round(lowHz / resolutionHz) + 1, (int)Math.Round(highHz / resolutionHz));

    /// <summary>
    /// First bin above the harmonic group centred on <paramref name="frequencyHz"/>: half a group (N/2 bins) beyond the
    /// bin nearest it. A component at 1 kHz (the top of type B's range, part of type F's composite test current) leaks
    /// into its neighbours whenever the window is a few hundredths of a hertz off synchronisation, and IEC 61000-4-7
    /// counts those bins to its group, so "above 1 kHz" starts after them; likewise for 9 kHz.
    /// </summary>
    /// <param name="frequencyHz">The frequency, hertz.</param>
    /// <param name="resolutionHz">Bin spacing of the window, hertz.</param>
    /// <param name="cycles">Mains cycles per window.</param>
    public static int FirstBinAbove(double frequencyHz, double resolutionHz, int cycles) =>
        (int)Math.Round(frequencyHz / resolutionHz) + (cycles / 2) + 1;
}
