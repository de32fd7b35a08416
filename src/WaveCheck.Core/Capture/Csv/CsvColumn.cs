using System.Text.RegularExpressions;

namespace WaveCheck.Core.Capture;

/// <summary>What a CSV column holds, read from its header cell (name and unit).</summary>
internal enum CsvColumnKind
{
    /// <summary>Seconds (after the unit factor) from some origin.</summary>
    TimeSeconds,

    /// <summary>ISO 8601 date-time stamps.</summary>
    TimeStamp,

    /// <summary>A current: value × factor = amperes.</summary>
    Current,

    /// <summary>A voltage: value × factor = volts.</summary>
    Voltage,

    /// <summary>No unit we can use (an index, a status flag): skipped with a warning.</summary>
    Ignored,
}

/// <summary>One CSV header cell understood.</summary>
/// <param name="FileColumn">1-based field number in the file.</param>
/// <param name="Name">Header text without the unit.</param>
/// <param name="Unit">Unit as written, empty if none.</param>
/// <param name="Kind">What it holds.</param>
/// <param name="Factor">Stored value × factor = SI value (seconds, amperes, volts).</param>
internal sealed partial record CsvColumn(int FileColumn, string Name, string Unit, CsvColumnKind Kind, double Factor)
{
    private static readonly Dictionary<string, (CsvColumnKind Kind, double Factor)> Units =
        new(StringComparer.OrdinalIgnoreCase)
        {
            ["A"] = (CsvColumnKind.Current, 1),
            ["mA"] = (CsvColumnKind.Current, 1e-3),
            ["uA"] = (CsvColumnKind.Current, 1e-6),
            ["µA"] = (CsvColumnKind.Current, 1e-6),
            ["μA"] = (CsvColumnKind.Current, 1e-6),
            ["kA"] = (CsvColumnKind.Current, 1e3),
            ["V"] = (CsvColumnKind.Voltage, 1),
            ["mV"] = (CsvColumnKind.Voltage, 1e-3),
            ["uV"] = (CsvColumnKind.Voltage, 1e-6),
            ["µV"] = (CsvColumnKind.Voltage, 1e-6),
            ["μV"] = (CsvColumnKind.Voltage, 1e-6),
            ["kV"] = (CsvColumnKind.Voltage, 1e3),
            ["s"] = (CsvColumnKind.TimeSeconds, 1),
            ["sec"] = (CsvColumnKind.TimeSeconds, 1),
            ["ms"] = (CsvColumnKind.TimeSeconds, 1e-3),
            ["us"] = (CsvColumnKind.TimeSeconds, 1e-6),
            ["µs"] = (CsvColumnKind.TimeSeconds, 1e-6),
            ["μs"] = (CsvColumnKind.TimeSeconds, 1e-6),
            ["ns"] = (CsvColumnKind.TimeSeconds, 1e-9),
        };

    private static readonly HashSet<string> TimeNames = new(StringComparer.OrdinalIgnoreCase)
    {
        "time", "t", "timestamp", "datetime", "zeit", "temps", "tiempo", "tempo", "tijd", "czas",
    };

    [GeneratedRegex(@"^(?<name>.*?)\s*[\[(](?<unit>[^\])]*)[\])]\s*$")]
    private static partial Regex Bracketed();

    [GeneratedRegex(@"^(?<name>.+?)\s*[_\s/]\s*(?<unit>[A-Za-zµμ]+)$")]
    private static partial Regex Suffixed();

    /// <summary>Reads a header cell.</summary>
    /// <param name="fileColumn">1-based field number.</param>
    /// <param name="text">The cell, quotes removed.</param>
    /// <param name="firstValue">The column's first data value, to tell seconds from timestamps in a unit-less time column.</param>
    /// <param name="problem">Set when the header names a unit we do not know.</param>
    public static CsvColumn Parse(int fileColumn, string text, string? firstValue, out string? problem)
    {
        problem = null;
        var cell = text.Trim();
        var bracketed = Bracketed().Match(cell);
        if (bracketed.Success)
        {
            var name = bracketed.Groups["name"].Value.Trim();
            var unit = bracketed.Groups["unit"].Value.Trim();
            if (Units.TryGetValue(unit, out var known))
            {
                return new CsvColumn(fileColumn, name.Length > 0 ? name : unit, unit, known.Kind, known.Factor);
            }

            problem = $"unknown unit '{unit}' in column header '{cell}': expected A, mA, µA, V, mV for values or s, ms, µs for time";
            return new CsvColumn(fileColumn, name, unit, CsvColumnKind.Ignored, 1);
        }

        var suffixed = Suffixed().Match(cell);
        if (suffixed.Success && Units.TryGetValue(suffixed.Groups["unit"].Value, out var suffix))
        {
            return new CsvColumn(fileColumn, suffixed.Groups["name"].Value, suffixed.Groups["unit"].Value, suffix.Kind, suffix.Factor);
        }

        if (Units.TryGetValue(cell, out var bare))
        {
            return new CsvColumn(fileColumn, cell, cell, bare.Kind, bare.Factor);
        }

        if (TimeNames.Contains(cell))
        {
            var numeric = firstValue is not null && firstValue.Length > 0 &&
                          (char.IsDigit(firstValue[0]) || firstValue[0] is '-' or '+' or '.') &&
                          !firstValue.Contains(':', StringComparison.Ordinal) &&
                          !(firstValue.Length >= 10 && firstValue[4] == '-' && firstValue[7] == '-');
            return numeric
                ? new CsvColumn(fileColumn, cell, "s", CsvColumnKind.TimeSeconds, 1)
                : new CsvColumn(fileColumn, cell, "ISO 8601", CsvColumnKind.TimeStamp, 1);
        }

        return new CsvColumn(fileColumn, cell, "", CsvColumnKind.Ignored, 1);
    }
}
