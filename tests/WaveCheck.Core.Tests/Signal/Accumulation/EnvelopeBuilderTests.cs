using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class EnvelopeBuilderTests
{
    [Fact]
    public void StaysBoundedAndKeepsEveryPeak()
    {
        // A ramp of 10 million samples with one spike: at most 4000 buckets, the spike survives every merge
        // (min/max of a union is the min/max of the parts).
        var envelope = new EnvelopeBuilder(50_000, 1000);
        var block = new double[65536];
        long index = 0;
        for (var b = 0; b < 153; b++)
        {
            for (var i = 0; i < block.Length; i++, index++)
            {
                block[i] = index == 7_777_777 ? 5.0 : index * 1e-9;
            }

            envelope.Push(block);
        }

        var result = envelope.Result();
        Assert.InRange(result.MaxA.Count, 2000, EnvelopeBuilder.MaxBuckets);
        Assert.Equal(5.0, result.MaxA.Max());
        Assert.Equal(0, result.MinA[0]);
        var samplesPerBucket = result.BucketDurationS * 50_000;
        Assert.Equal(Math.Ceiling(index / samplesPerBucket), result.MaxA.Count);
    }
}
