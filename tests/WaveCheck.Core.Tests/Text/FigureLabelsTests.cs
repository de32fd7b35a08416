using WaveCheck.Core.Text;

namespace WaveCheck.Core.Tests.Text;

/// <summary>One quantity, one label; no code identifier and no signed zero for a person.</summary>
public class FigureLabelsTests
{
    [Theory]
    [InlineData(-1e-9, "0.000")]
    [InlineData(-4.9e-7, "0.000")]
    [InlineData(-5.1e-7, "-0.001")]
    [InlineData(0.0, "0.000")]
    [InlineData(-0.0123, "-12.3")]
    public void Milliamps_never_writes_a_signed_zero(double amperes, string expected)
    {
        // IEEE 754 negative zero is the extreme case of a tiny negative value.
        Assert.Equal("0.000", CurrentText.Milliamps(-0.0));
        // Common practice, no source: a value that rounds to zero at the shown resolution (0.001 mA) has no sign;
        // one that rounds to a non-zero value keeps it.
        Assert.Equal(expected, CurrentText.Milliamps(amperes));
    }

    [Fact]
    public void Every_per_window_figure_has_words_of_its_own()
    {
        // The names the analysis keeps statistics for (WindowMetrics, in the JSON's windows.statistics).
        string[] names =
        [
            "frequencyHz", "rmsA", "dcA", "acRmsA", "peakPositiveA", "peakNegativeA", "crestFactor", "smoothDcA",
            "currentDelayAngleDeg", "mainsRmsA", "belowMainsRmsA", "harmonicsRmsA", "above1kHzRmsA", "above9kHzRmsA", "thdPercent",
        ];

        var labels = names.Select(FigureLabels.Metric).ToList();

        Assert.Equal(names.Length, labels.Distinct(StringComparer.Ordinal).Count());
        // A code identifier has a lower-case run followed by a capital (acRmsA); "1 kHz" has a single letter before it.
        Assert.All(labels, l => Assert.DoesNotMatch("[a-z]{2,}[A-Z]", l));
        Assert.All(names, n => Assert.True(FigureLabels.MetricRank(n) < names.Length, n));
    }

    [Theory]
    [InlineData("typeASmoothDcToleranceA", "type A smooth-DC tolerance")]
    [InlineData("someNewLimitA", "some new limit")]
    [InlineData("windowLengthHz", "window length hz")]
    public void Threshold_names_become_words(string name, string expected) =>
        Assert.Equal(expected, FigureLabels.Threshold(name));

    [Fact]
    public void From_memory_becomes_value_to_confirm_and_code_names_become_words()
    {
        var text = FigureLabels.ForClient("IEC 62423 §5.3 upper limit 14 IΔn at 1 kHz (from memory); see accuracyReadingFraction");

        Assert.Contains("(value to confirm against the standard)", text, StringComparison.Ordinal);
        Assert.DoesNotContain("from memory", text, StringComparison.Ordinal);
        Assert.DoesNotContain("accuracyReadingFraction", text, StringComparison.Ordinal);
        Assert.Contains("'measurement uncertainty, share of reading'", text, StringComparison.Ordinal);
    }
}
