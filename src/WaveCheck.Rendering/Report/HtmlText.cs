using System.Net;

namespace WaveCheck.Rendering.Report;

/// <summary>Escaping for text placed in HTML: every user-supplied and file-derived string goes through here.</summary>
public static class HtmlText
{
    /// <summary>Text safe as HTML element content or a quoted attribute value (&amp;, &lt;, &gt;, &quot;, &#39; encoded); null becomes empty.</summary>
    public static string Encode(string? text) => string.IsNullOrEmpty(text) ? string.Empty : WebUtility.HtmlEncode(text);
}
