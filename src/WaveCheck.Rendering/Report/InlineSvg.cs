using System.Text.RegularExpressions;

namespace WaveCheck.Rendering.Report;

/// <summary>Turns a standalone SVG document into markup for embedding in HTML.</summary>
internal static partial class InlineSvg
{
    [GeneratedRegex(@"<\?xml[^>]*\?>\s*")]
    private static partial Regex XmlDeclaration();

    [GeneratedRegex(@"\bid=""([^""]+)""")]
    private static partial Regex IdAttribute();

    [GeneratedRegex(@"url\(#([^)]+)\)")]
    private static partial Regex UrlReference();

    [GeneratedRegex(@"href=""#([^""]+)""")]
    private static partial Regex HrefReference();

    [GeneratedRegex(@"<svg\b([^>]*)\bwidth=""(\d+)""\s+height=""(\d+)""")]
    private static partial Regex RootSize();

    /// <summary>
    /// Drops the XML declaration, prefixes every id and reference with <paramref name="idPrefix"/> (each plot's
    /// exporter numbers its clip paths from the same start, and ids must be unique in one HTML document), and adds a
    /// viewBox so CSS can scale the plot to the page width.
    /// </summary>
    public static string Prepare(string svg, string idPrefix, string title)
    {
        var text = XmlDeclaration().Replace(svg, string.Empty);
        text = IdAttribute().Replace(text, m => $"id=\"{idPrefix}{m.Groups[1].Value}\"");
        text = UrlReference().Replace(text, m => $"url(#{idPrefix}{m.Groups[1].Value})");
        text = HrefReference().Replace(text, m => $"href=\"#{idPrefix}{m.Groups[1].Value}\"");
        text = RootSize().Replace(text, m =>
            $"<svg{m.Groups[1].Value}width=\"{m.Groups[2].Value}\" height=\"{m.Groups[3].Value}\" viewBox=\"0 0 {m.Groups[2].Value} {m.Groups[3].Value}\" role=\"img\" aria-label=\"{HtmlText.Encode(title)}\"", 1);
        return text.Trim();
    }
}
