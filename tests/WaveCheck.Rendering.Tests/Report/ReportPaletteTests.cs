using System.Globalization;
using WaveCheck.Rendering.Report;

namespace WaveCheck.Rendering.Tests.Report;

/// <summary>The report's colours against WCAG 2.x's contrast ratio (success criterion 1.4.3: at least 4.5:1 for normal text).</summary>
public class ReportPaletteTests
{
    [Theory]

    // WCAG 2.x, definition of contrast ratio: black on white is 21:1, a colour on itself 1:1; #777777 on white is
    // the often-quoted 4.48:1 that just fails AA.
    [InlineData("#000000", "#ffffff", 21.0)]
    [InlineData("#ffffff", "#ffffff", 1.0)]
    [InlineData("#777777", "#ffffff", 4.48)]
    public void Contrast_ratio_matches_the_published_examples(string ink, string paper, double expected) =>
        Assert.Equal(expected, Contrast(ink, paper), 2);

    [Fact]
    public void Every_text_pair_of_the_palette_has_at_least_4_5_to_1()
    {
        foreach (var (name, ink, paper) in ReportPalette.Pairs)
        {
            var ratio = Contrast(ink, paper);
            Assert.True(ratio >= 4.5, $"{name}: {ink} on {paper} is {ratio:0.00}:1, below 4.5:1");
        }
    }

    /// <summary>WCAG 2.x contrast ratio (L1 + 0.05) / (L2 + 0.05), L1 the lighter relative luminance.</summary>
    private static double Contrast(string a, string b)
    {
        var (la, lb) = (Luminance(a), Luminance(b));
        return (Math.Max(la, lb) + 0.05) / (Math.Min(la, lb) + 0.05);
    }

    /// <summary>WCAG 2.x relative luminance: sRGB channels linearised (c/12.92 up to 0.03928, else ((c+0.055)/1.055)^2.4),
    /// weighted 0.2126 R + 0.7152 G + 0.0722 B.</summary>
    private static double Luminance(string hex)
    {
        double Channel(int offset)
        {
            var c = int.Parse(hex.AsSpan(1 + offset, 2), NumberStyles.HexNumber, CultureInfo.InvariantCulture) / 255.0;
            return c <= 0.03928 ? c / 12.92 : Math.Pow((c + 0.055) / 1.055, 2.4);
        }

        return (0.2126 * Channel(0)) + (0.7152 * Channel(2)) + (0.0722 * Channel(4));
    }
}
