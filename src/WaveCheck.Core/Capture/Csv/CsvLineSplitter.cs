using Sylvan.Data.Csv;

namespace WaveCheck.Core.Capture;

/// <summary>
/// Splits one line of delimited text into its cells with Sylvan.Data.Csv, the parser that reads the rows after the
/// header, so that the look-ahead (<see cref="CsvDialect"/>) and the reading agree on where a cell ends: a quoted cell
/// may hold the delimiter, a quote inside a cell is text, a quote opened and not closed is a fault, and a line
/// starting with <c>#</c> is a comment. Cells are trimmed of white space, as the reader trims them. Reuses one
/// buffer; not thread-safe.
/// </summary>
internal sealed class CsvLineSplitter
{
    /// <summary>The parser refuses a smaller buffer.</summary>
    private const int MinBuffer = 4096;

    private readonly char[] _buffer;
    private readonly Dictionary<char, CsvDataReaderOptions> _options = [];

    /// <summary>Creates a splitter for lines of up to <paramref name="longestLine"/> characters.</summary>
    /// <param name="longestLine">Length of the longest line to split.</param>
    public CsvLineSplitter(int longestLine) => _buffer = new char[Math.Max(MinBuffer, longestLine + 2)];

    /// <summary>Splits <paramref name="line"/>.</summary>
    /// <param name="line">One line, without its line end.</param>
    /// <param name="delimiter">The field delimiter.</param>
    /// <param name="fault">When null is returned: the 1-based column and what is wrong.</param>
    /// <returns>The cells (none for a comment line or an empty one), or null when the parser cannot split the line.</returns>
    public string[]? Split(string line, char delimiter, out (int Column, string Problem) fault)
    {
        fault = default;
        if (!_options.TryGetValue(delimiter, out var options))
        {
            options = new CsvDataReaderOptions { HasHeaders = false, Delimiter = delimiter };
            _options[delimiter] = options;
        }

        try
        {
            using var reader = CsvDataReader.Create(new StringReader(line), _buffer, options);
            if (!reader.Read())
            {
                return [];
            }

            var cells = new string[reader.RowFieldCount];
            for (var i = 0; i < cells.Length; i++)
            {
                cells[i] = reader.GetFieldSpan(i).Trim().ToString();
            }

            return cells;
        }
        catch (CsvFormatException e)
        {
            fault = (e.FieldOrdinal + 1, CsvCells.DescribeFault(e));
            return null;
        }
    }
}
