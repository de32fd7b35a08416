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
    [InlineData(0.004, null, false)] // exactly the must-not-trip level: not below it
    [InlineData(0.005, null, false)]
    [InlineData(0.006, true, false)] // exactly the must-trip level: must trip
    [InlineData(0.015, true, null)] // exactly the UL 943C lower threshold: inside the band
    [InlineData(0.020, true, true)] // exactly the UL 943C upper threshold: trips, with a time
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

    [Theory]
    // The notes' wording per branch is the product (what a person reads). Levels: UL 943 Class A 6 mA must trip,
    // 4 mA must not; UL 943C 15 to 20 mA (REFERENCE.md, std).
    [InlineData(0.003, "3.00 mA: below the must-not-trip level.", "3.00 mA: below the threshold.")]
    [InlineData(0.005, "5.00 mA: between the two levels: may trip.", "5.00 mA: below the threshold.")]
    [InlineData(0.017, "17.0 mA: trips on the standing current alone.", "17.0 mA: inside the threshold band: may trip.")]
    [InlineData(0.025, "25.0 mA: trips on the standing current alone.", "25.0 mA: trips on the standing current alone.")]
    public void NotesSayWhereTheStandingCurrentLies(double standingA, string classA, string special)
    {
        var notes = Gfci.Assess(standingA).Notes;
        Assert.Equal(
            new[]
            {
                "Class A (UL 943): must trip at 6.00 mA and above, must not trip below 4.00 mA; standing " + classA,
                "Special purpose (UL 943C classes C, D, E): trip threshold 15.0 mA to 20.0 mA; standing " + special,
                "Trip time T = (20 / I)^1.43 s, I in mA rms, stated for 6 to 264 mA (UL 943).",
                "UL 943 states no DC sensitivity requirement: a GFCI's response to smooth or pulsating DC is not specified; ask the maker.",
                "The standing current is the worst window's true RMS (DC included), the conservative reading.",
            },
            notes);
    }

    [Fact]
    public void AboveTheFormulasRangeTheNotesSaySo()
    {
        // UL 943 states the formula for 6 to 264 mA: 264 mA itself is inside, 300 mA is not.
        Assert.Equal(5, Gfci.Assess(0.264).Notes.Count);
        var notes = Gfci.Assess(0.300).Notes;
        Assert.Equal(6, notes.Count);
        Assert.Equal("The standing current 300 mA is above the formula's 264 mA range; the time shown is the formula's value.", notes[^1]);
    }

    [Fact]
    public void ANegativeStandingCurrentIsRefused()
    {
        // An RMS is never negative: a negative figure is a caller's bug.
        Assert.Equal("standingRmsA", Assert.Throws<ArgumentOutOfRangeException>(() => Gfci.Assess(-0.001)).ParamName);
    }
}
