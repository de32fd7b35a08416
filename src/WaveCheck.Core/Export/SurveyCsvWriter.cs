using System.Text;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Export;

/// <summary>
/// Writes the survey as CSV, one row per capture: header names carry their SI unit (<c>rmsA</c>, <c>durationS</c>),
/// numbers in invariant culture with full precision, empty fields for nulls, quoting per RFC 4180 (CRLF line ends).
/// Text cells that a spreadsheet would run as a formula get a leading single quote (<see cref="SpreadsheetText"/>).
/// </summary>
public static class SurveyCsvWriter
{
    /// <summary>The header names, in column order.</summary>
    public static IReadOnlyList<string> Header { get; } = [.. SurveyColumns.All.Select(c => c.Name)];

    /// <summary>Writes the table whole or not at all.</summary>
    /// <param name="path">Target file.</param>
    /// <param name="rows">One per capture, in order.</param>
    public static void Write(string path, IReadOnlyList<SurveyRow> rows)
    {
        ArgumentNullException.ThrowIfNull(rows);
        AtomicFile.Write(path, stream =>
        {
            using var writer = new StreamWriter(stream, new UTF8Encoding(false), 1 << 16, leaveOpen: true);
            Write(writer, rows);
        });
    }

    /// <summary>Writes the table to a text writer.</summary>
    /// <param name="writer">Receives the CSV text.</param>
    /// <param name="rows">One per capture, in order.</param>
    public static void Write(TextWriter writer, IReadOnlyList<SurveyRow> rows)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(rows);
        var columns = SurveyColumns.All;
        WriteRecord(writer, columns.Count, i => columns[i].Name);
        foreach (var row in rows)
        {
            WriteRecord(writer, columns.Count, i => columns[i].Text(row));
        }
    }

    /// <summary>A field as RFC 4180 wants it: quoted when it holds a comma, a quote or a line break, quotes doubled.</summary>
    public static string Quote(string field)
    {
        ArgumentNullException.ThrowIfNull(field);
        return field.AsSpan().IndexOfAny(",\"\r\n") < 0 ? field : "\"" + field.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"";
    }

    private static void WriteRecord(TextWriter writer, int count, Func<int, string> field)
    {
        for (var i = 0; i < count; i++)
        {
            if (i > 0)
            {
                writer.Write(',');
            }

            writer.Write(Quote(field(i)));
        }

        writer.Write("\r\n");
    }
}
