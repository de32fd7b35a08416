using WaveCheck.Core.Model;

namespace WaveCheck.Rendering;

/// <summary>
/// Which harmonic groups and frequency bands a report table lists and a spectrum marks: those at or above
/// max(<see cref="FloorA"/>, <see cref="FundamentalShare"/> × the fundamental). The full tables stay in the analysis
/// JSON and the per-window CSV.
/// </summary>
/// <remarks>
/// Engineering choice, not a standard's figure: 0.1 mA is a tenth of the smallest significance threshold the
/// assessment uses (1 mA) and well below any residual current a device reacts to; 1 % of the fundamental is where a
/// harmonic stops mattering beside it. Below both, a row is noise to a reader (a 2-second capture printed a 50-row
/// table of microamperes). The assessment's own thresholds are not affected: this only decides what is listed.
/// </remarks>
public static class TableSignificance
{
    /// <summary>Absolute floor, amperes: 0.1 mA (engineering choice, see remarks).</summary>
    public const double FloorA = 1e-4;

    /// <summary>Share of the fundamental (harmonic group 1): 1 % (engineering choice, see remarks).</summary>
    public const double FundamentalShare = 0.01;

    /// <summary>The level at and above which a row is listed, amperes.</summary>
    /// <param name="fundamentalA">RMS of harmonic group 1, amperes (0 or NaN: no fundamental, the floor alone).</param>
    public static double LevelA(double fundamentalA) =>
        Math.Max(FloorA, double.IsFinite(fundamentalA) ? FundamentalShare * fundamentalA : 0);

    /// <summary>The level for <paramref name="analysis"/>: from its harmonic group 1.</summary>
    public static double LevelA(AnalysisResult analysis)
    {
        ArgumentNullException.ThrowIfNull(analysis);
        return LevelA(analysis.Harmonics.FirstOrDefault(h => h.Order == 1)?.RmsA ?? 0);
    }

    /// <summary>The rule in words, for the report under a table.</summary>
    public const string Rule = "at or above 0.1 mA and at or above 1 % of the fundamental (an engineering choice of this report, not a standard's limit)";

    /// <summary>Whether a value is listed.</summary>
    public static bool Significant(double valueA, double levelA) => double.IsFinite(valueA) && valueA >= levelA;
}
