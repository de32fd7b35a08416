using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>
/// SpectrumPlans: the plan for a length, built once and kept while it is among the <c>capacity</c> most recently
/// used lengths (its doc comment). It says it is not thread-safe, so there is no concurrent test.
/// </summary>
public class SpectrumPlansTests
{
    [Fact]
    public void ReturnsAPlanOfTheAskedLengthThatComputesTheSpectrum()
    {
        // Closed form: a cosine of amplitude 1 on bin 3 of a 200-sample window has mean square 1/2, all of it in
        // bin 3 of the one-sided power spectrum (Parseval). 1e-12: rounding of one FFT on values of order 1.
        var plans = new SpectrumPlans();
        var plan = plans.For(200);
        Assert.Equal(200, plan.Length);
        Assert.Equal(101, plan.BinCount);
        var samples = new double[200];
        for (var j = 0; j < samples.Length; j++)
        {
            samples[j] = Math.Cos(2 * Math.PI * 3 * j / 200);
        }

        var power = new double[plan.BinCount];
        plan.Power(samples, power);
        for (var k = 0; k < power.Length; k++)
        {
            Assert.Equal(k == 3 ? 0.5 : 0.0, power[k], 1e-12);
        }
    }

    [Fact]
    public void TheSameLengthGivesTheSamePlan()
    {
        var plans = new SpectrumPlans();
        var first = plans.For(200);
        Assert.Same(first, plans.For(200));
        Assert.Same(first, plans.For(200));
        Assert.Equal(201, plans.For(201).Length);
        Assert.Same(first, plans.For(200));
    }

    [Fact]
    public void LengthsThatFitAreAllKeptWhileTheyAlternate()
    {
        // Common practice, no source: a cache of two keeps two alternating lengths without rebuilding either (the
        // tracked analysis's windows of 200 and 201 samples as the mains frequency wanders).
        var plans = new SpectrumPlans(capacity: 2);
        var a = plans.For(200);
        var b = plans.For(201);
        for (var round = 0; round < 3; round++)
        {
            Assert.Same(a, plans.For(200));
            Assert.Same(b, plans.For(201));
        }
    }

    [Fact]
    public void ANewLengthDropsTheLeastRecentlyUsedOne()
    {
        // Least recently used dropped (the class's doc comment): after 200, 201, 200 the oldest use is 201's, so 202
        // takes its place; 200 stays, 201 is built anew.
        var plans = new SpectrumPlans(capacity: 2);
        var a = plans.For(200);
        var b = plans.For(201);
        Assert.Same(a, plans.For(200));
        var c = plans.For(202);
        Assert.Equal(202, c.Length);
        Assert.Same(a, plans.For(200));
        Assert.Same(c, plans.For(202));
        var b2 = plans.For(201);
        Assert.NotSame(b, b2);
        Assert.Equal(201, b2.Length);

        // Now 200 is the least recently used (200, 202, 201 in that order of last use): it goes, 202 stays.
        Assert.Same(b2, plans.For(201));
        Assert.NotSame(a, plans.For(200));
    }

    [Fact]
    public void ACacheOfOneKeepsOnlyTheLastLength()
    {
        var plans = new SpectrumPlans(capacity: 1);
        var a = plans.For(64);
        Assert.Same(a, plans.For(64));
        var b = plans.For(65);
        Assert.Equal(65, b.Length);
        Assert.NotSame(a, plans.For(64));
    }

    [Theory]
    [InlineData(0)]
    [InlineData(-1)]
    public void RejectsACapacityBelowOne(int capacity)
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => new SpectrumPlans(capacity));
        Assert.Equal("capacity", ex.ParamName);
    }

    [Fact]
    public void ALengthTheSpectrumRejectsIsRejectedAndNothingIsCached()
    {
        // RealSpectrum needs at least 2 samples; the cache passes its error on and still serves other lengths.
        var plans = new SpectrumPlans(capacity: 1);
        Assert.Throws<ArgumentOutOfRangeException>(() => plans.For(1));
        Assert.Equal(2, plans.For(2).Length);
    }
}
