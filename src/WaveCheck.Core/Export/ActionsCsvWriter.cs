using System.Text;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Export;

/// <summary>
/// Writes the remedial schedule as <c>actions.csv</c>: one row per circuit or upstream device that needs action, most
/// urgent first; the same conventions as <see cref="SurveyCsvWriter"/> (SI units in the header names, invariant
/// numbers, RFC 4180 quoting, CRLF, text cells neutralised for spreadsheets by <see cref="SpreadsheetText"/>).
/// </summary>
public static class ActionsCsvWriter
{
    private static readonly IReadOnlyList<TableColumn<RemedialAction>> Columns =
    [
        new NumberColumn<RemedialAction>("rank", a => a.Rank),
        new TextColumn<RemedialAction>("priority", a => VerdictText.Of(a.Priority), nullable: false),
        new TextColumn<RemedialAction>("circuit", a => a.Circuit, nullable: false),
        new FlagColumn<RemedialAction>("upstream", a => a.Upstream),
        new TextColumn<RemedialAction>("installedType", a => a.InstalledType?.ToTradeName(), nullable: true),
        new NumberColumn<RemedialAction>("ratedResidualCurrentA", a => a.RatedResidualCurrentA),
        new TextColumn<RemedialAction>("required", a => a.Required, nullable: false),
        new TextColumn<RemedialAction>("reason", a => a.Reason, nullable: false),
    ];

    /// <summary>The header names, in column order.</summary>
    public static IReadOnlyList<string> Header { get; } = [.. Columns.Select(c => c.Name)];

    /// <summary>Writes the schedule whole or not at all.</summary>
    /// <param name="path">Target file.</param>
    /// <param name="actions">The schedule, in order.</param>
    public static void Write(string path, IReadOnlyList<RemedialAction> actions)
    {
        ArgumentNullException.ThrowIfNull(actions);
        AtomicFile.Write(path, stream =>
        {
            using var writer = new StreamWriter(stream, new UTF8Encoding(false), 1 << 16, leaveOpen: true);
            Write(writer, actions);
        });
    }

    /// <summary>Writes the schedule to a text writer.</summary>
    /// <param name="writer">Receives the CSV text.</param>
    /// <param name="actions">The schedule, in order.</param>
    public static void Write(TextWriter writer, IReadOnlyList<RemedialAction> actions)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(actions);
        writer.Write(string.Join(',', Header.Select(SurveyCsvWriter.Quote)));
        writer.Write("\r\n");
        foreach (var action in actions)
        {
            writer.Write(string.Join(',', Columns.Select(c => SurveyCsvWriter.Quote(c.Text(action)))));
            writer.Write("\r\n");
        }
    }
}
