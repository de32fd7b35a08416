using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class WindowSlotTests
{
    [Theory]
    [InlineData(11, 6)]
    [InlineData(2_000, 1_001)]
    [InlineData(10_529, 5_265)]
    public void PowerHoldsTheRealSpectrumBinsOfTheLongestWindow(int capacity, int bins)
    {
        // Closed form: a real FFT of N samples has N/2 + 1 bins, 0 .. Nyquist (numpy 1.24: np.fft.rfft(np.zeros(11))
        // has 6, of 2 000 samples 1 001, of 10 529 samples 5 265).
        Assert.Equal(bins, new WindowSlot(capacity, 50, 0).Power.Length);
    }

    [Theory]
    [InlineData(8, 5)]
    [InlineData(9, 5)]
    [InlineData(11, 6)]
    public void BinsAreThoseOfTheWindowNotOfTheBuffer(int length, int bins)
    {
        // Closed form N/2 + 1 of the window's own length (numpy 1.24: np.fft.rfft of 8, 9 and 11 samples has 5, 5
        // and 6 bins), in a buffer sized for 11 samples.
        var slot = new WindowSlot(11, 50, 0) { Length = length };
        Assert.Equal(bins, slot.Bins.Length);
        Assert.Equal(length, slot.Window.Length);
    }

    [Fact]
    public void MeanAndAcRmsFollowFromTheSumAndTheSumOfSquares()
    {
        // x = [4, −1, 7, 2, −3, 5, 1, 0] mA: sum 15 mA, sum of squares 105 mA². Closed form: mean = Σx/N = 1.875 mA,
        // AC RMS = √(Σx²/N − mean²) = √(13.125 − 3.515625) mA = 3.0998991919093115 mA (numpy 1.24: x.mean(),
        // x.std() with ddof=0). 1e-15 A: double rounding only.
        var slot = new WindowSlot(11, 50, 0) { Length = 8, Moments = (0.015, 0.000105, -0.003, 0.007) };
        Assert.Equal(0.001875, slot.MeanA, 1e-15);
        Assert.Equal(0.0030998991919093115, slot.AcRmsA, 1e-15);
    }

    [Fact]
    public void AcRmsOfAPureDcWindowIsZero()
    {
        // Closed form: a constant window has no AC (mean square = mean²), 2 mA over 4 samples here; the AC RMS is
        // zero, not the root of a rounding residue.
        var slot = new WindowSlot(11, 50, 0) { Length = 4, Moments = (0.008, 0.000016, 0.002, 0.002) };
        Assert.Equal(0.002, slot.MeanA, 1e-15);
        Assert.Equal(0, slot.AcRmsA, 1e-9);
    }
}
