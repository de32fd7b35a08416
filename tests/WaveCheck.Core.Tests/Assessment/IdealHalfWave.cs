namespace WaveCheck.Core.Tests.Assessment;

/// <summary>The ideal phase-controlled half-wave and a plain DFT of it: the reference the closed forms are checked against.</summary>
internal static class IdealHalfWave
{
    /// <summary>One cycle of sin θ for α &lt; θ &lt; π (0 otherwise), <paramref name="n"/> midpoint samples.</summary>
    public static double[] Cycle(double peak, double delayAngleDeg, int n)
    {
        var alpha = delayAngleDeg * Math.PI / 180;
        var x = new double[n];
        for (var i = 0; i < n; i++)
        {
            var th = 2 * Math.PI * (i + 0.5) / n;
            x[i] = th > alpha && th < Math.PI ? peak * Math.Sin(th) : 0;
        }

        return x;
    }

    /// <summary>RMS of harmonic <paramref name="k"/> of one cycle by a plain DFT.</summary>
    public static double HarmonicRms(double[] cycle, int k)
    {
        double re = 0, im = 0;
        var n = cycle.Length;
        for (var i = 0; i < n; i++)
        {
            var ph = 2 * Math.PI * k * (i + 0.5) / n;
            re += cycle[i] * Math.Cos(ph);
            im += cycle[i] * Math.Sin(ph);
        }

        return Math.Sqrt((re * re) + (im * im)) * 2 / n / Math.Sqrt(2);
    }
}
