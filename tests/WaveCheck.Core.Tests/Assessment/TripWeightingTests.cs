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

    [Fact]
    public void BPlusAtOneKilohertzStillUsesTheTypeBCurve()
    {
        // IEC 62423 §5.3 (REFERENCE.md "Tripping ranges", mem) defines the curve up to and including 1 kHz: 14 IΔn
        // there for a B+ device too; the 420 mA limit (DIN VDE 0664-400, mem) applies only above 1 kHz. At 300 mA the
        // two differ (420/300 = 1.4), so the boundary is seen.
        Assert.Equal(14.0, TripWeighting.AcFactor(DeviceType.BPlus, 1000, 50, 0.300), 12);
        Assert.Equal(1.4, TripWeighting.AcFactor(DeviceType.BPlus, 1000.5, 50, 0.300), 12);
        // Between the points B+ follows the type B curve (hand calculation at 250 Hz as above).
        Assert.Equal(4.27487, TripWeighting.AcFactor(DeviceType.BPlus, 250, 50, 0.300), 4);
    }

    [Fact]
    public void TheUsersFactorsReplaceTheDefaultsEverywhere()
    {
        // Invented factors (not the standard's: a user override), so that each point shows which table was used:
        // 3 at 150 Hz, 8 at 400 Hz, 20 at 1 kHz, B+ limit 0.5 A.
        var mine = new TripFactors(3, 8, 20, 0.5);
        Assert.Equal(3.0, TripWeighting.AcFactor(DeviceType.B, 150, 50, 0.030, mine), 12);
        Assert.Equal(8.0, TripWeighting.AcFactor(DeviceType.B, 400, 50, 0.030, mine), 12);
        Assert.Equal(20.0, TripWeighting.AcFactor(DeviceType.F, 1000, 50, 0.030, mine), 12);
        // Hand calculation at 100 Hz: t = ln 2 / ln 3 = 0.630930; 1 + 0.630930 × 2 = 2.261860 (python3 math.log).
        Assert.Equal(2.261860, TripWeighting.AcFactor(DeviceType.B, 100, 50, 0.030, mine), 5);
        Assert.Equal(20.0, TripWeighting.AcFactor(DeviceType.B, 5000, 50, 0.030, mine), 12);
        Assert.Equal(20.0, TripWeighting.HighFrequencyFactor(DeviceType.B, 0.030, mine), 12);
        // B+ above 1 kHz: min(20, 0.5 / 0.030 = 16.667) and min(20, 0.5 / 0.010 = 50) = 20.
        Assert.Equal(0.5 / 0.030, TripWeighting.AcFactor(DeviceType.BPlus, 5000, 50, 0.030, mine), 12);
        Assert.Equal(20.0, TripWeighting.HighFrequencyFactor(DeviceType.BPlus, 0.010, mine), 12);
        // Types AC and A take no credit whatever the table (engineering choice, class remarks).
        Assert.Equal(1.0, TripWeighting.AcFactor(DeviceType.A, 5000, 50, 0.030, mine));
        Assert.Equal(1.0, TripWeighting.HighFrequencyFactor(DeviceType.AC, 0.030, mine));
    }

    [Fact]
    public void SixtyHertzMainsInterpolatesFromSixty()
    {
        // Hand calculation at 100 Hz on 60 Hz mains: t = ln(100/60)/ln(150/60) = 0.557493; 1 + 0.557493 × 1.4
        // = 1.780490 (the curve starts at 1 IΔn at the mains frequency; IEC 62423 §5.3 points, mem).
        Assert.Equal(1.780490, TripWeighting.AcFactor(DeviceType.B, 100, 60, 0.030), 5);
        // Between 150 and 400 Hz the mains frequency plays no part: 4.27487 at 250 Hz as on 50 Hz mains.
        Assert.Equal(4.27487, TripWeighting.AcFactor(DeviceType.B, 250, 60, 0.030), 4);
        // Hand calculation at 700 Hz: t = ln(700/400)/ln(1000/400) = 0.610740; 6 + 0.610740 × 8 = 10.885923.
        Assert.Equal(10.885923, TripWeighting.AcFactor(DeviceType.F, 700, 60, 0.030), 5);
    }

    [Theory]
    [InlineData(DeviceType.F)]
    [InlineData(DeviceType.B)]
    [InlineData(DeviceType.BPlus)]
    public void DcFactorsByType(DeviceType type)
    {
        // Smooth DC: only B and B+ respond, by 2 IΔn (IEC 62423, std); F does not (infinity). Pulsating DC: 1.4 IΔn
        // for every type from A up (IEC 61008-1, std).
        var smooth = TripWeighting.SmoothDcFactor(type);
        Assert.Equal(type == DeviceType.F ? double.PositiveInfinity : 2.0, smooth);
        Assert.Equal(1.4, TripWeighting.PulsatingDcFactor(type));
    }
}
