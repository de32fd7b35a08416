using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class WindowCyclesTests
{
    [Theory]
    [InlineData(50, 10)] // IEC 61000-4-7: 10 cycles at 50 Hz
    [InlineData(60, 12)] // and 12 at 60 Hz, both about 200 ms
    [InlineData(400, 80)] // other nominal frequencies: the count nearest 200 ms
    [InlineData(16.7, 3)]
    [InlineData(1, 2)] // at least 2
    public void CyclesNearest200Ms(double nominalHz, int expected)
    {
        Assert.Equal(expected, WindowCycles.For(nominalHz));
        Assert.Equal(expected, CaptureAnalysis.CyclesFor(nominalHz));
    }
}
