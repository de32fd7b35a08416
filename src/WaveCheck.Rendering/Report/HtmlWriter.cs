using System.Text;

namespace WaveCheck.Rendering.Report;

/// <summary>Accumulates HTML; <see cref="Text"/> escapes, <see cref="Raw"/> is for the writer's own markup only.</summary>
internal sealed class HtmlWriter
{
    private readonly StringBuilder builder = new(1 << 16);

    /// <summary>Appends markup written by the report itself (never user- or file-derived text).</summary>
    public HtmlWriter Raw(string markup)
    {
        builder.Append(markup);
        return this;
    }

    /// <summary>Appends text, HTML-escaped.</summary>
    public HtmlWriter Text(string? text)
    {
        builder.Append(HtmlText.Encode(text));
        return this;
    }

    /// <inheritdoc />
    public override string ToString() => builder.ToString();
}
