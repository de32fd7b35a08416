using System.Globalization;
using Parquet;
using Parquet.Schema;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Export;

/// <summary>A column of a table of <typeparamref name="TRow"/>: its name (SI unit in it), its text for CSV and its
/// typed Parquet field, defined once so the CSV and Parquet forms cannot drift apart.</summary>
internal abstract class TableColumn<TRow>(string name)
{
    public string Name { get; } = name;

    public abstract DataField Field { get; }

    /// <summary>The CSV cell: invariant-culture text; empty for null. Doubles round-trip ("R"); non-finite values are
    /// empty; text is neutralised for spreadsheets (<see cref="SpreadsheetText"/>).</summary>
    public abstract string Text(TRow row);

    public abstract Task WriteAsync(ParquetRowGroupWriter writer, IReadOnlyList<TRow> rows);
}

internal sealed class TextColumn<TRow>(string name, Func<TRow, string?> value, bool nullable) : TableColumn<TRow>(name)
{
    public override DataField Field { get; } = new DataField<string>(name, nullable);

    public override string Text(TRow row) => SpreadsheetText.Neutralise(value(row) ?? string.Empty);

    public override Task WriteAsync(ParquetRowGroupWriter writer, IReadOnlyList<TRow> rows)
    {
        var values = new string[rows.Count];
        for (var i = 0; i < values.Length; i++)
        {
            values[i] = value(rows[i])!;
        }

        return writer.WriteAsync(Field, values);
    }
}

internal sealed class NumberColumn<TRow>(string name, Func<TRow, double?> value) : TableColumn<TRow>(name)
{
    public override DataField Field { get; } = new DataField<double>(name, nullable: true);

    public override string Text(TRow row) =>
        value(row) is { } v && double.IsFinite(v) ? v.ToString("R", CultureInfo.InvariantCulture) : string.Empty;

    public override Task WriteAsync(ParquetRowGroupWriter writer, IReadOnlyList<TRow> rows)
    {
        var values = new double?[rows.Count];
        for (var i = 0; i < values.Length; i++)
        {
            // Non-finite numbers are stored as null, as in the JSON form.
            values[i] = value(rows[i]) is { } v && double.IsFinite(v) ? v : null;
        }

        return writer.WriteAsync(Field, (ReadOnlyMemory<double?>)values);
    }
}

internal sealed class FlagColumn<TRow>(string name, Func<TRow, bool?> value) : TableColumn<TRow>(name)
{
    public override DataField Field { get; } = new DataField<bool>(name, nullable: true);

    public override string Text(TRow row) => value(row) switch { true => "true", false => "false", null => string.Empty };

    public override Task WriteAsync(ParquetRowGroupWriter writer, IReadOnlyList<TRow> rows)
    {
        var values = new bool?[rows.Count];
        for (var i = 0; i < values.Length; i++)
        {
            values[i] = value(rows[i]);
        }

        return writer.WriteAsync(Field, (ReadOnlyMemory<bool?>)values);
    }
}

/// <summary>The columns of the per-capture survey table, in order; names are the JSON property names.</summary>
internal static class SurveyColumns
{
    public static IReadOnlyList<TableColumn<SurveyRow>> All { get; } =
    [
        new TextColumn<SurveyRow>("file", r => r.File, nullable: false),
        new TextColumn<SurveyRow>("circuit", r => r.Circuit, nullable: true),
        new TextColumn<SurveyRow>("installedType", r => r.InstalledType?.ToTradeName(), nullable: true),
        new NumberColumn<SurveyRow>("ratedResidualCurrentA", r => r.RatedResidualCurrentA),
        new TextColumn<SurveyRow>("requiredType", r => r.RequiredType?.ToTradeName(), nullable: true),
        new TextColumn<SurveyRow>("minimumType", r => r.MinimumType?.ToTradeName(), nullable: true),
        new TextColumn<SurveyRow>("verdict", r => VerdictText.Of(r.Verdict), nullable: false),
        new NumberColumn<SurveyRow>("rmsA", r => r.RmsA),
        new NumberColumn<SurveyRow>("worstWindowRmsA", r => r.WorstWindowRmsA),
        new NumberColumn<SurveyRow>("smoothDcA", r => r.SmoothDcA),
        new FlagColumn<SurveyRow>("smoothDcKnown", r => r.SmoothDcKnown),
        new NumberColumn<SurveyRow>("above1kHzRmsA", r => r.Above1kHzRmsA),
        new TextColumn<SurveyRow>("nuisanceRisk", r => r.NuisanceRisk is { } risk ? VerdictText.Of(risk) : null, nullable: true),
        new NumberColumn<SurveyRow>("nuisanceMarginA", r => r.NuisanceMarginA),
        new FlagColumn<SurveyRow>("blinded", r => r.Blinded),
        new TextColumn<SurveyRow>("headline", r => r.Headline, nullable: true),
        new TextColumn<SurveyRow>("error", r => r.Error, nullable: true),
        new TextColumn<SurveyRow>("reportPath", r => r.ReportPath, nullable: true),
        new NumberColumn<SurveyRow>("durationS", r => r.DurationS),
        new NumberColumn<SurveyRow>("sampleRateHz", r => r.SampleRateHz),
        new TextColumn<SurveyRow>("tripGeneral", r => r.TripGeneral, nullable: true),
        new TextColumn<SurveyRow>("tripS", r => r.TripS, nullable: true),
        new FlagColumn<SurveyRow>("tripAlert", r => r.TripAlert),
    ];
}
