using System.Globalization;
using Sylvan.Data.Csv;

namespace WaveCheck.Core.Capture;

/// <summary>
/// How the cells of delimited text are read as numbers and time stamps, with the problem stated the same way
/// wherever in the file the cell lies (the look-ahead of <see cref="CsvDialect"/> and the rows of
/// <see cref="CsvCaptureSource"/>).
/// </summary>
internal static class CsvCells
{
    private static readonly NumberFormatInfo DecimalComma =
        NumberFormatInfo.ReadOnly(new NumberFormatInfo { NumberDecimalSeparator = ",", NegativeSign = "-" });

    /// <summary>The number format of a dialect: invariant, or invariant with a decimal comma.</summary>
    /// <param name="decimalComma">Whether the file writes <c>0,5</c> for one half.</param>
    public static NumberFormatInfo NumberFormat(bool decimalComma) =>
        decimalComma ? DecimalComma : NumberFormatInfo.InvariantInfo;

    /// <summary>Reads a cell (already trimmed) as a finite number.</summary>
    /// <param name="cell">The cell's text.</param>
    /// <param name="number">The dialect's number format.</param>
    /// <param name="value">The number; meaningful only when no problem is returned.</param>
    /// <returns>Null, or what is wrong with the cell, quoting it.</returns>
    public static string? TryParseNumber(ReadOnlySpan<char> cell, NumberFormatInfo number, out double value)
    {
        if (double.TryParse(cell, NumberStyles.Float, number, out value))
        {
            return double.IsFinite(value)
                ? null
                : $"'{ShownText.Of(cell)}' is not a finite number: NaN and infinities are not measurements";
        }

        return cell.IsEmpty
            ? "empty cell: expected a number"
            : $"'{ShownText.Of(cell)}' is not a number{(number.NumberDecimalSeparator == "," ? " (decimal comma expected)" : "")}";
    }

    /// <summary>Reads a cell as an ISO 8601 time stamp (UTC when it states no offset).</summary>
    /// <param name="cell">The cell's text.</param>
    /// <param name="stamp">The time; meaningful only when no problem is returned.</param>
    /// <returns>Null, or what is wrong with the cell, quoting it.</returns>
    public static string? TryParseStamp(ReadOnlySpan<char> cell, out DateTimeOffset stamp) =>
        DateTimeOffset.TryParse(cell, CultureInfo.InvariantCulture, DateTimeStyles.AssumeUniversal | DateTimeStyles.AllowWhiteSpaces, out stamp)
            ? null
            : $"'{ShownText.Of(cell)}' is not an ISO 8601 time stamp";

    /// <summary>What a fault of the parser means for a capture, in the same words for a line of the look-ahead and
    /// a row of the reading.</summary>
    /// <param name="fault">What Sylvan.Data.Csv threw.</param>
    public static string DescribeFault(CsvFormatException fault) => fault switch
    {
        CsvRecordTooLargeException => string.Create(CultureInfo.InvariantCulture,
            $"the row is longer than {CaptureLimits.MaxLineLength} characters (1 MiB), the limit for a line of a capture; a quote opened and never closed also makes a row run on"),
        CsvInvalidCharacterException { InvalidCharacter: '"' } =>
            "unbalanced quote: the field opens a quote that the line does not close (a capture row must be one line)",
        CsvInvalidCharacterException other =>
            $"'{ShownText.Of([other.InvalidCharacter])}' follows the closing quote of a quoted field: expected the delimiter or the end of the line",
        _ => $"the row cannot be read as delimited text: {fault.Message}",
    };
}
