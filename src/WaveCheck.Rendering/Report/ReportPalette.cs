namespace WaveCheck.Rendering.Report;

/// <summary>
/// This project's colours for the verdict box: one pair (text on background) per outcome, each with a contrast
/// ratio of at least 4.5:1 (WCAG 2.x, success criterion 1.4.3, level AA for normal text), tested. The outcomes also
/// differ by word, symbol and border style, so no reader depends on telling the hues apart (the pairs differ in
/// lightness too: green-blue, vermilion-red, ochre are told apart by the common forms of colour blindness).
/// </summary>
public static class ReportPalette
{
    /// <summary>Text of an adequate outcome: deep blue-green.</summary>
    public const string AdequateInk = "#0b5345";

    /// <summary>Background of an adequate outcome.</summary>
    public const string AdequatePaper = "#e3f4ef";

    /// <summary>Text of a not-adequate outcome: dark vermilion.</summary>
    public const string NotAdequateInk = "#8f1d0a";

    /// <summary>Background of a not-adequate outcome.</summary>
    public const string NotAdequatePaper = "#fdeae4";

    /// <summary>Text of a cannot-tell outcome: dark ochre.</summary>
    public const string CannotTellInk = "#5c4400";

    /// <summary>Background of a cannot-tell outcome.</summary>
    public const string CannotTellPaper = "#fdf3d1";

    /// <summary>Body text.</summary>
    public const string Ink = "#1a1a1a";

    /// <summary>Secondary text (captions, notes).</summary>
    public const string Muted = "#4d4d4d";

    /// <summary>Page background.</summary>
    public const string Page = "#ffffff";

    /// <summary>Table header and panel background.</summary>
    public const string Panel = "#f2f2f2";

    /// <summary>Every text-on-background pair the report uses, for the contrast test.</summary>
    public static IReadOnlyList<(string Name, string Ink, string Paper)> Pairs =>
    [
        ("adequate", AdequateInk, AdequatePaper),
        ("not adequate", NotAdequateInk, NotAdequatePaper),
        ("cannot tell", CannotTellInk, CannotTellPaper),
        ("body", Ink, Page),
        ("muted", Muted, Page),
        ("muted on panel", Muted, Panel),
        ("body on panel", Ink, Panel),
    ];
}
