namespace WaveCheck.Core.Signal;

/// <summary>Per-index mean square and largest value over windows, for harmonic groups and bands. Not thread-safe.</summary>
internal sealed class GroupAccumulator(int size)
{
    private readonly double[] _sum = new double[size];
    private readonly double[] _max = new double[size];
    private readonly int[] _count = new int[size];

    /// <summary>Adds one window's mean square at <paramref name="index"/>, A².</summary>
    public void Add(int index, double meanSquare)
    {
        _sum[index] += meanSquare;
        _max[index] = Math.Max(_max[index], meanSquare);
        _count[index]++;
    }

    /// <summary>Square root of the mean over windows, amperes; NaN where no window could see it.</summary>
    public double Rms(int index) => _count[index] > 0 ? Math.Sqrt(_sum[index] / _count[index]) : double.NaN;

    /// <summary>Square root of the largest window value, amperes; NaN where no window could see it.</summary>
    public double Max(int index) => _count[index] > 0 ? Math.Sqrt(_max[index]) : double.NaN;
}
