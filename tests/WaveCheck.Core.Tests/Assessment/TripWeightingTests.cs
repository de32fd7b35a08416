using WaveCheck.Core.Assessment;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Tests.Assessment;

/// <summary>Tripping factors: IEC 62423 §5.3 upper limits (from memory), log-frequency interpolation.</summary>
public class TripWeightingTests
{
    [Theory]
    [InlineData(50, 1.0)]
    [InlineData(150, 2.4)]
    [InlineData(400, 6.0)]
    [InlineData(1000, 14.0)]
    // Hand calculation at 250 Hz: t = ln(250/150)/ln(400/150) = 0.52080; 2.4 + 0.52080 x 3.6 = 4.27487.
    [InlineData(250, 4.27487)]
    // 100 Hz: t = ln(2)/ln(3) = 0.63093; 1 + 0.63093 x 1.4 = 1.88330.
    [InlineData(100, 1.88330)]
    [InlineData(5000, 14.0)]
    [InlineData(10, 1.0)]
    public void TypeBFactorsAtTheTabulatedPointsAndBetween(double frequencyHz, double expected)
    {
        Assert.Equal(expected, TripWeighting.AcFactor(DeviceType.B, frequencyHz, 50, 0.030), 4);
        Assert.Equal(expected, TripWeighting.AcFactor(DeviceType.F, frequencyHz, 50, 0.030), 4);
    }

    [Fact]
    public void SixtyHertzMainsStartsTheCurveAtSixty()
    {
        Assert.Equal(1.0, TripWeighting.AcFactor(DeviceType.B, 60, 60, 0.030), 12);
        Assert.Equal(2.4, TripWeighting.AcFactor(DeviceType.B, 150, 60, 0.030), 12);
    }

    [Theory]
    [InlineData(DeviceType.AC)]
    [InlineData(DeviceType.A)]
    public void TypesAcAndACountEveryFrequencyInFull(DeviceType type)
    {
        Assert.Equal(1.0, TripWeighting.AcFactor(type, 400, 50, 0.030));
        Assert.Equal(1.0, TripWeighting.HighFrequencyFactor(type, 0.030));
        Assert.True(double.IsPositiveInfinity(TripWeighting.SmoothDcFactor(type)));
    }

    [Fact]
    public void DcFactors()
    {
        Assert.Equal(2.0, TripWeighting.SmoothDcFactor(DeviceType.B)); // IEC 62423, std
        Assert.Equal(1.4, TripWeighting.PulsatingDcFactor(DeviceType.A)); // IEC 61008-1, std
        Assert.Equal(1.0, TripWeighting.PulsatingDcFactor(DeviceType.AC)); // conservative choice
        Assert.Equal(14.0, TripWeighting.HighFrequencyFactor(DeviceType.BPlus, 0.030), 12); // 420/30 = 14
        Assert.Equal(1.4, TripWeighting.HighFrequencyFactor(DeviceType.BPlus, 0.300), 12); // 420/300
    }
}
