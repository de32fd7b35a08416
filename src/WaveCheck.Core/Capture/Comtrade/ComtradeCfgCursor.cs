namespace WaveCheck.Core.Capture.Comtrade;

/// <summary>Walks the lines of a cfg, handing out each as its fields; the end of the cfg is the end of the lines or
/// trailing blank lines.</summary>
internal sealed class ComtradeCfgCursor(string file, IReadOnlyList<string> lines, int firstLineNumber)
{
    private int _index;

    public ComtradeCfgFields Next(string expected)
    {
        if (!TryNext(out var fields))
        {
            throw new CaptureFormatException(file,
                $"the cfg ends early: expected {expected}", firstLineNumber + _index);
        }

        return fields;
    }

    /// <summary>Next line, or false at the end (trailing blank lines count as the end).</summary>
    public bool TryNext(out ComtradeCfgFields fields)
    {
        if (_index >= lines.Count || (string.IsNullOrWhiteSpace(lines[_index]) && RestIsBlank()))
        {
            fields = null!;
            return false;
        }

        var parts = lines[_index].Split(',');
        for (var i = 0; i < parts.Length; i++)
        {
            parts[i] = parts[i].Trim();
        }

        fields = new ComtradeCfgFields(file, firstLineNumber + _index, parts);
        _index++;
        return true;
    }

    private bool RestIsBlank()
    {
        for (var i = _index; i < lines.Count; i++)
        {
            if (!string.IsNullOrWhiteSpace(lines[i]))
            {
                return false;
            }
        }

        return true;
    }
}
