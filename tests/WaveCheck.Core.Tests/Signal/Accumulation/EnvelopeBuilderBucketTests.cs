using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>
/// <see cref="EnvelopeBuilder"/>'s first bucket length (the least power of two that fits the expected length into
/// <see cref="EnvelopeBuilder.MaxBuckets"/> buckets, capped at 2^40) and blocks that end inside a bucket.
/// </summary>
public class EnvelopeBuilderBucketTests
{
    [Theory]
    [InlineData(0L, 1L)]
    [InlineData(4000L, 1L)]
    [InlineData(4001L, 2L)]
    [InlineData(16_000L, 4L)]
    [InlineData(16_001L, 8L)]
    [InlineData(4000L * 1024, 1024L)]
    [InlineData((4000L * 1024) + 1, 2048L)]
    public void The_first_bucket_is_the_least_power_of_two_that_fits(long expectedSamples, long bucketSamples)
    {
        // Closed form: the least 2^k with 2^k · 4000 ≥ expected (so 4000 samples still fit one sample a bucket).
        // BucketDurationS = samples / rate; rate 1 Hz makes it the sample count.
        Assert.Equal(bucketSamples, new EnvelopeBuilder(1, expectedSamples).Result().BucketDurationS);
    }

    [Fact]
    public void An_absurd_expected_length_stops_at_two_to_the_forty()
    {
        // The documented cap (a header's claim must not double the bucket into an overflow): 2^40 samples a bucket.
        Assert.Equal(Math.Pow(2, 40), new EnvelopeBuilder(1, long.MaxValue).Result().BucketDurationS);
        Assert.Equal(Math.Pow(2, 40), new EnvelopeBuilder(1, (1L << 40) * EnvelopeBuilder.MaxBuckets).Result().BucketDurationS);
    }

    [Fact]
    public void Blocks_that_end_inside_a_bucket_fill_it_before_the_next_starts()
    {
        // Two-sample buckets (expected 8000 samples) fed one sample, then three, then two: the buckets are the
        // consecutive pairs {1, 2}, {3, 4}, {5, 6} whatever the block boundaries (closed form: min and max of each pair).
        var envelope = new EnvelopeBuilder(2, 8000);
        envelope.Push([1]);
        envelope.Push([2, -3, 4]);
        envelope.Push([5, -6]);
        var result = envelope.Result();
        Assert.Equal(1.0, result.BucketDurationS);
        Assert.Equal([1.0, -3, -6], result.MinA);
        Assert.Equal([2.0, 4, 5], result.MaxA);
    }
}
