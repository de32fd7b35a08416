using WaveCheck.Core.Capture;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class ToneFinderTests
{
    [Theory]
    [InlineData(16_002.5)]
    [InlineData(7_301.0)]
    [InlineData(3_333.3)]
    public void OffBinToneIsInterpolated(double frequencyHz)
    {
        // Closed form (Dirichlet kernel of a rectangular window): a 1 mA rms tone between 5 Hz bins, next to a
        // 10 mA rms 50 Hz fundamental, is found within 0.2 Hz and 1 % of its RMS (the two-bin formulas neglect the
        // negative-frequency image, about 1/(2k) of the bin's value).
        const double fs = 50_000;
        var samples = Synth.Make(fs, 2, t => (0.01 * Math.Sqrt(2) * Math.Sin(2 * Math.PI * 50 * t))
            + (0.001 * Math.Sqrt(2) * Math.Sin(2 * Math.PI * frequencyHz * t)));
        var result = Analyzer.Analyze(new MemoryCaptureSource(samples, fs), new AnalysisOptions());
        var tone = Assert.Single(result.Components.Tones);
        Assert.Equal(frequencyHz, tone.FrequencyHz, 0.2);
        Assert.Equal(0.001, tone.RmsA, 0.01 * 0.001);
    }

    [Fact]
    public void HarmonicsAreNotTones()
    {
        // IEC 61000-4-7 subgroups: content on harmonic bins of orders 1..50 is harmonic, not a tone.
        const double fs = 50_000;
        var samples = Synth.Make(fs, 1, t => (0.01 * Math.Sin(2 * Math.PI * 50 * t)) + (0.003 * Math.Sin(2 * Math.PI * 250 * t)));
        var result = Analyzer.Analyze(new MemoryCaptureSource(samples, fs), new AnalysisOptions());
        Assert.Empty(result.Components.Tones);
    }
}
