using WaveCheck.Core.Assessment;

namespace WaveCheck.Core.Tests.Assessment;

/// <summary>UL 943 Class A and UL 943C special-purpose levels; trip time T = (20/I)^1.43 s (UL 943).</summary>
public class GfciTests
{
    [Theory]
    // Hand calculations of (20/I)^1.43, I in mA: 2^1.43 = e^(1.43 ln 2) = 2.6945; (20/6)^1.43 = e^(1.43 x 1.20397) = 5.5939;
    // (20/264)^1.43 = e^(1.43 ln 0.0757576) = 0.024978; (20/20)^1.43 = 1.
    [InlineData(0.010, 2.6945)]
    [InlineData(0.006, 5.5939)]
    [InlineData(0.264, 0.024978)]
    [InlineData(0.020, 1.0)]
    public void TripTimeFollowsTheFormula(double currentA, double expectedS)
    {
        Assert.Equal(expectedS, Gfci.TripTimeS(currentA)!.Value, 4);
    }

    [Fact]
    public void NoTripTimeBelowSixMilliamps() => Assert.Null(Gfci.TripTimeS(0.0059));

    [Theory]
    // UL 943 Class A: must trip >= 6 mA, must not trip < 4 mA; UL 943C: 15 to 20 mA.
    [InlineData(0.003, false, false)]
    [InlineData(0.005, null, false)]
    [InlineData(0.010, true, false)]
    [InlineData(0.017, true, null)]
    [InlineData(0.025, true, true)]
    public void LevelsDecideTripsAlone(double standingA, bool? classA, bool? special)
    {
        var g = Gfci.Assess(standingA);
        Assert.Equal(classA, g.ClassATripsAlone);
        Assert.Equal(special, g.SpecialPurposeTripsAlone);
        Assert.Equal(special == true, g.SpecialPurposeTripTimeS is not null);
    }

    [Fact]
    public void SpecialPurposeTimeUsesTheSameFormula()
    {
        // (20/25)^1.43 = e^(1.43 ln 0.8) = 0.72681 s.
        Assert.Equal(0.72681, Gfci.Assess(0.025).SpecialPurposeTripTimeS!.Value, 4);
    }

    [Fact]
    public void NotesStateThatUl943HasNoDcRequirement()
    {
        Assert.Contains(Gfci.Assess(0.010).Notes, n => n.Contains("no DC sensitivity requirement"));
        Assert.Contains(Gfci.Assess(0.300).Notes, n => n.Contains("264 mA"));
    }
}
