namespace WaveCheck.Core.Tests.Signal;

/// <summary>Test waveforms built sample by sample from their closed-form definitions.</summary>
internal static class Synth
{
    public static double[] Make(double sampleRateHz, double durationS, Func<double, double> valueAt)
    {
        var n = (int)Math.Round(sampleRateHz * durationS);
        var samples = new double[n];
        for (var i = 0; i < n; i++)
        {
            samples[i] = valueAt(i / sampleRateHz);
        }

        return samples;
    }

    /// <summary>Phase-controlled half-wave: Ipk·sin θ for θ in [α, π) of each cycle, else 0.</summary>
    public static double PhaseCut(double t, double frequencyHz, double peakA, double alphaRad)
    {
        var theta = 2 * Math.PI * frequencyHz * t % (2 * Math.PI);
        return theta >= alphaRad && theta < Math.PI ? peakA * Math.Sin(theta) : 0;
    }

    /// <summary>Sine whose frequency steps at <paramref name="stepS"/> with continuous phase.</summary>
    public static double[] FrequencyStep(double sampleRateHz, double durationS, double f1, double f2, double stepS,
        double peakA)
    {
        var n = (int)Math.Round(sampleRateHz * durationS);
        var samples = new double[n];
        var phase = 0.0;
        for (var i = 0; i < n; i++)
        {
            samples[i] = peakA * Math.Sin(phase);
            phase += 2 * Math.PI * (i / sampleRateHz < stepS ? f1 : f2) / sampleRateHz;
        }

        return samples;
    }

    /// <summary>Gaussian noise (Box-Muller) from a seeded generator.</summary>
    public static double Gaussian(Random random) =>
        Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble());
}
