using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary><see cref="MainsFrequency.Contradicts"/>: a declared mains frequency is contradicted only by a free
/// detection outside its ±5 % range that is at least 3 times the component found near it (or when none was found
/// there). 0.5 s at 1 kHz of synthetic tones.</summary>
public class MainsFrequencyContradictionTests
{
    private const double Fs = 1000;

    private static double[] Tones(params (double FrequencyHz, double PeakA)[] tones) =>
        Synth.Make(Fs, 0.5, t =>
        {
            var v = 0.0;
            var phase = 0.3;
            foreach (var (f, a) in tones)
            {
                v += a * Math.Sin((2 * Math.PI * f * t) + phase);
                phase += 0.7;
            }

            return v;
        });

    private static readonly MainsDetection NotFound = new(50, 50, false, 0, 0.007);

    [Theory]
    [InlineData(50.0)] // on the declared frequency
    [InlineData(50.3)] // 0.6 % off
    [InlineData(53.0)] // held at the range's edge, 52.5 Hz = 50 Hz + 5 % exactly
    public void WithinTheRangeNothingContradicts(double frequencyHz)
    {
        // Contract: within ±TrackingRange·declared (inclusive) the capture agrees with a declared 50 Hz, whatever
        // was found with it (here: nothing, the strongest case for a contradiction). A 53 Hz tone is held at
        // 52.5 Hz by the free detection (closed form: 50·1.05, and 52.5 − 50 = 2.5 = 0.05·50 in doubles).
        var x = Tones((frequencyHz, 0.01));
        var free = MainsFrequency.Detect(x, Fs, null);
        Assert.True(free.Found);
        Assert.InRange(free.FrequencyHz, 47.5, 52.5);
        Assert.Null(MainsFrequency.Contradicts(x, Fs, 50, NotFound));
    }

    [Fact]
    public void SixtyHertzWithNothingAtFiftyContradicts()
    {
        // A clean 60 Hz sine declared as 50 Hz: nothing is found near 50 Hz, so the capture's 60 Hz stands.
        var x = Tones((60, 0.01));
        var given = MainsFrequency.Detect(x, Fs, 50);
        Assert.False(given.Found);
        Assert.Equal(60, MainsFrequency.Contradicts(x, Fs, 50, given)!.Value, 1e-3);
    }

    [Theory]
    [InlineData(0.002, true)] // 10 mA at 60 Hz against 2 mA at 50 Hz: 5 times, contradicts
    [InlineData(0.005, false)] // against 5 mA: only 2 times, the declaration stands
    public void AStrongerSixtyHertzContradictsOnlyAtThreeTimesTheFifty(double fiftyPeakA, bool contradicts)
    {
        // ContradictionRatio = 3 (engineering choice). Both components are found, each near its own frequency; the
        // RMS ratio is the peak ratio (closed form), 5 or 2.
        var x = Tones((60, 0.01), (50, fiftyPeakA));
        var given = MainsFrequency.Detect(x, Fs, 50);
        Assert.True(given.Found);
        Assert.Equal(fiftyPeakA / Math.Sqrt(2), given.FundamentalRmsA, fiftyPeakA / Math.Sqrt(2) * 0.05);
        var seen = MainsFrequency.Contradicts(x, Fs, 50, given);
        if (contradicts)
        {
            Assert.Equal(60, seen!.Value, 0.05);
        }
        else
        {
            Assert.Null(seen);
        }
    }

    [Fact]
    public void ExactlyThreeTimesContradicts()
    {
        // "At least ContradictionRatio times": a given component of exactly a third of the free one (3·g equals it
        // in doubles) contradicts, one a step of the last digit larger does not.
        var x = Tones((60, 0.01));
        var free = MainsFrequency.Detect(x, Fs, null);
        var third = free.FundamentalRmsA / MainsFrequency.ContradictionRatio;
        foreach (var candidate in new[] { third, Math.BitDecrement(third), Math.BitIncrement(third) })
        {
            if (MainsFrequency.ContradictionRatio * candidate == free.FundamentalRmsA)
            {
                third = candidate;
            }
        }

        Assert.Equal(free.FundamentalRmsA, MainsFrequency.ContradictionRatio * third);
        var atThree = new MainsDetection(50, 50, true, third, free.AcRmsA);
        Assert.Equal(free.FrequencyHz, MainsFrequency.Contradicts(x, Fs, 50, atThree));
        var aboveThird = atThree with { FundamentalRmsA = Math.BitIncrement(Math.BitIncrement(third)) };
        Assert.True(MainsFrequency.ContradictionRatio * aboveThird.FundamentalRmsA > free.FundamentalRmsA);
        Assert.Null(MainsFrequency.Contradicts(x, Fs, 50, aboveThird));
    }
}
