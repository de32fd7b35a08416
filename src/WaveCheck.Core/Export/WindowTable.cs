using System.Text;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Export;

/// <summary>
/// The per-window table in one column list (SI units, names ending in their unit), shared by the
/// <c>--windows-csv</c> file and the survey's Parquet window table so the two cannot drift apart.
/// </summary>
public static class WindowTable
{
    /// <summary>The window columns for rows of any type, reading each row's <see cref="WindowResult"/> through <paramref name="window"/>.</summary>
    internal static IReadOnlyList<TableColumn<TRow>> Columns<TRow>(Func<TRow, WindowResult> window) =>
    [
        new NumberColumn<TRow>("startS", r => window(r).StartS),
        new NumberColumn<TRow>("durationS", r => window(r).DurationS),
        new NumberColumn<TRow>("frequencyHz", r => window(r).FrequencyHz),
        new NumberColumn<TRow>("rmsA", r => window(r).RmsA),
        new NumberColumn<TRow>("dcA", r => window(r).DcA),
        new NumberColumn<TRow>("acRmsA", r => window(r).AcRmsA),
        new NumberColumn<TRow>("peakPositiveA", r => window(r).PeakPositiveA),
        new NumberColumn<TRow>("peakNegativeA", r => window(r).PeakNegativeA),
        new NumberColumn<TRow>("crestFactor", r => window(r).CrestFactor),
        new NumberColumn<TRow>("smoothDcA", r => window(r).SmoothDcA),
        new FlagColumn<TRow>("pulsatingDc", r => window(r).PulsatingDc),
        new NumberColumn<TRow>("currentDelayAngleDeg", r => window(r).CurrentDelayAngleDeg),
        new NumberColumn<TRow>("mainsRmsA", r => window(r).MainsRmsA),
        new NumberColumn<TRow>("belowMainsRmsA", r => window(r).BelowMainsRmsA),
        new NumberColumn<TRow>("harmonicsRmsA", r => window(r).HarmonicsRmsA),
        new NumberColumn<TRow>("above1kHzRmsA", r => window(r).Above1kHzRmsA),
        new NumberColumn<TRow>("above9kHzRmsA", r => window(r).Above9kHzRmsA),
        new NumberColumn<TRow>("thdPercent", r => window(r).ThdPercent),
        new FlagColumn<TRow>("clipped", r => window(r).Clipped),
    ];

    private static readonly IReadOnlyList<TableColumn<WindowResult>> CsvColumns = Columns<WindowResult>(w => w);

    /// <summary>The CSV header line.</summary>
    public static string CsvHeader { get; } = string.Join(',', CsvColumns.Select(c => c.Name));

    /// <summary>One window as a CSV line (invariant culture, round-trip numbers, empty cell for a figure not measured).</summary>
    public static string CsvLine(WindowResult window)
    {
        ArgumentNullException.ThrowIfNull(window);
        var line = new StringBuilder(256);
        for (var i = 0; i < CsvColumns.Count; i++)
        {
            if (i > 0)
            {
                line.Append(',');
            }

            line.Append(CsvColumns[i].Text(window));
        }

        return line.ToString();
    }
}
