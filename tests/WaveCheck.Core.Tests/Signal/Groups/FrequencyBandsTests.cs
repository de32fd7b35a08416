using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class FrequencyBandsTests
{
    [Fact]
    public void BandsAt50kSamplesPerSecond()
    {
        // IEC 61000-4-7 Annex B: 35 bands of 200 Hz centred 2100 … 8900 Hz (2000–9000 Hz), then 2 kHz bands from
        // 9 kHz to the Nyquist frequency, 25 kHz: 9–11, …, 23–25 kHz, 8 more.
        var bands = FrequencyBands.For(50_000, 150_000);
        Assert.Equal(35 + 8, bands.Length);
        Assert.Equal((2000.0, 2200.0), bands[0]);
        Assert.Equal((8800.0, 9000.0), bands[34]);
        Assert.Equal((9000.0, 11_000.0), bands[35]);
        Assert.Equal((23_000.0, 25_000.0), bands[^1]);
        for (var b = 1; b < bands.Length; b++)
        {
            // Ascending and tiling: the measurement relies on the order (a band beyond the spectrum ends the list).
            Assert.Equal(bands[b - 1].HighHz, bands[b].LowHz);
        }
    }

    [Fact]
    public void BandsEndAtTheNyquistFrequencyOrTheUpperEnd()
    {
        // 10 kS/s: Nyquist 5 kHz, so 200 Hz bands up to 4800–5000 Hz and none above; 150 kHz caps the 2 kHz bands.
        var low = FrequencyBands.For(10_000, 150_000);
        Assert.Equal(15, low.Length);
        Assert.Equal((4800.0, 5000.0), low[^1]);
        var high = FrequencyBands.For(1_000_000, 150_000);
        Assert.Equal((149_000.0, 150_000.0), high[^1]);
        Assert.Equal(35 + 71, high.Length);
    }

    [Theory]
    [InlineData(5.0, 10, 206)]
    [InlineData(4.9975, 10, 206)]
    [InlineData(5.0, 12, 207)]
    public void OneKilohertzRangeStartsHalfAGroupAboveIt(double resolutionHz, int cycles, int expected)
    {
        // Closed form: round(1000/Δf) + N/2 + 1; at 5 Hz resolution and 10 cycles bin 200 holds 1 kHz, its group runs
        // to bin 205 (half-weighted edge), so "above 1 kHz" starts at bin 206.
        Assert.Equal(expected, FrequencyBands.FirstBinAbove(FrequencyBands.OneKHz, resolutionHz, cycles));
    }

    [Fact]
    public void BandBinsExcludeTheLowerEdgeAndIncludeTheUpper()
    {
        // 2000–2200 Hz at 5 Hz resolution: bins 401 (2005 Hz) to 440 (2200 Hz).
        Assert.Equal((401, 440), FrequencyBands.Bins(2000, 2200, 5));
    }
}
