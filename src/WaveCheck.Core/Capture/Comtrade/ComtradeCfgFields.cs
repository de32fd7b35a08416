using System.Globalization;

namespace WaveCheck.Core.Capture.Comtrade;

/// <summary>The comma-separated fields of one cfg line, trimmed, with the place for messages.</summary>
internal sealed class ComtradeCfgFields(string file, int line, string[] values)
{
    public int Line => line;

    public int Count => values.Length;

    public string this[int index] => index < values.Length ? values[index] : string.Empty;

    /// <summary>A field as shown in a message: control characters escaped, cut when long.</summary>
    public string Shown(int index) => ShownText.Of(this[index]);

    public CaptureFormatException Error(int field, string problem) => new(file, problem, line, field);

    public void RequireFields(int count, string what, string form)
    {
        if (values.Length < count)
        {
            throw new CaptureFormatException(file,
                $"{what}: expected {count} fields ({form}), found {values.Length}", line);
        }
    }

    public double Number(int field, string what)
    {
        var text = this[field - 1];
        if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var v) || !double.IsFinite(v))
        {
            throw Error(field, $"{what} '{ShownText.Of(text)}' is not a number");
        }

        return v;
    }

    public long Long(int field, string what)
    {
        var text = this[field - 1];
        if (!long.TryParse(text, NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture, out var v))
        {
            throw Error(field, $"{what} '{ShownText.Of(text)}' is not a whole number");
        }

        return v;
    }

    public int Int(int field, string what)
    {
        var v = Long(field, what);
        return v is < int.MinValue or > int.MaxValue ? throw Error(field, $"{what} '{Shown(field - 1)}' is out of range") : (int)v;
    }
}
