using WaveCheck.Core.Model;

namespace WaveCheck.Core.Export;

/// <summary>
/// Keeps a text cell of a CSV file from being run as a formula when the file is opened in a spreadsheet: a cell
/// beginning with <c>=</c>, <c>+</c>, <c>-</c>, <c>@</c>, a tab or a carriage return gets a single quote in front,
/// which spreadsheets show as text (the prefix of the OWASP "CSV Injection" guidance). A circuit named
/// <c>=HYPERLINK("http://x","open")</c> is written as <c>'=HYPERLINK(...)</c>.
/// </summary>
/// <remarks>Only text cells pass through here; number cells are written as numbers (a negative number stays
/// <c>-0.004</c>), so a reader of the CSV gets figures unchanged. A reader that needs a text cell exactly as it was
/// drops one leading quote where the next character is one of the six above.</remarks>
public static class SpreadsheetText
{
    /// <summary>The cell, with a leading single quote when it begins with a character a spreadsheet reads as a formula.</summary>
    /// <param name="cell">A text cell, before CSV quoting.</param>
    public static string Neutralise(string cell)
    {
        ArgumentNullException.ThrowIfNull(cell);
        return cell.Length > 0 && StartsFormula(cell[0]) ? "'" + cell : cell;
    }

    /// <summary>Whether a cell beginning with <paramref name="c"/> may be read as a formula (= + - @ tab CR).</summary>
    public static bool StartsFormula(char c) => c is '=' or '+' or '-' or '@' or '\t' or '\r';
}
