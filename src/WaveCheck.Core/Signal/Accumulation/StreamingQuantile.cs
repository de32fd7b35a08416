namespace WaveCheck.Core.Signal;

/// <summary>
/// A quantile of a stream in bounded memory: exact while at most <see cref="ExactCapacity"/> values have been seen,
/// then the P² estimate (Jain and Chlamtac, "The P² algorithm for dynamic calculation of quantiles and histograms
/// without storing observations", CACM 28(10), 1985), five markers moved by piecewise-parabolic interpolation.
/// Not thread-safe.
/// </summary>
public sealed class StreamingQuantile
{
    /// <summary>Values kept for an exact answer before the estimate takes over.</summary>
    public const int ExactCapacity = 4096;

    private readonly double _p;
    private readonly double[] _exact = new double[ExactCapacity];
    private readonly double[] _height = new double[5];
    private readonly double[] _position = new double[5];
    private readonly double[] _desired = new double[5];
    private readonly double[] _increment = new double[5];

    /// <summary>Creates an estimator of quantile <paramref name="p"/>.</summary>
    /// <param name="p">Quantile, strictly between 0 and 1 (0.95 for the 95th percentile).</param>
    public StreamingQuantile(double p)
    {
        if (!(p > 0 && p < 1))
        {
            throw new ArgumentOutOfRangeException(nameof(p), p, "quantile must lie strictly between 0 and 1");
        }

        _p = p;
        _increment[0] = 0;
        _increment[1] = p / 2;
        _increment[2] = p;
        _increment[3] = (1 + p) / 2;
        _increment[4] = 1;
    }

    /// <summary>Values seen.</summary>
    public long Count { get; private set; }

    /// <summary>Adds a value (NaN is ignored).</summary>
    public void Add(double value)
    {
        if (double.IsNaN(value))
        {
            return;
        }

        if (Count < ExactCapacity)
        {
            _exact[Count] = value;
        }

        Count++;
        if (Count <= 5)
        {
            if (Count == 5)
            {
                Array.Copy(_exact, _height, 5);
                Array.Sort(_height);
                for (var i = 0; i < 5; i++)
                {
                    _position[i] = i + 1;
                    _desired[i] = 1 + (4 * _increment[i]);
                }
            }

            return;
        }

        int cell;
        if (value < _height[0])
        {
            _height[0] = value;
            cell = 0;
        }
        else if (value >= _height[4])
        {
            _height[4] = value;
            cell = 3;
        }
        else
        {
            cell = 0;
            while (cell < 3 && value >= _height[cell + 1])
            {
                cell++;
            }
        }

        for (var i = cell + 1; i < 5; i++)
        {
            _position[i]++;
        }

        for (var i = 0; i < 5; i++)
        {
            _desired[i] += _increment[i];
        }

        for (var i = 1; i <= 3; i++)
        {
            var d = _desired[i] - _position[i];
            if ((d >= 1 && _position[i + 1] - _position[i] > 1) || (d <= -1 && _position[i - 1] - _position[i] < -1))
            {
                var s = Math.Sign(d);
                var candidate = Parabolic(i, s);
                _height[i] = _height[i - 1] < candidate && candidate < _height[i + 1] ? candidate : Linear(i, s);
                _position[i] += s;
            }
        }
    }

    /// <summary>The quantile (linear interpolation between order statistics while exact); NaN when empty.</summary>
    public double Value
    {
        get
        {
            if (Count == 0)
            {
                return double.NaN;
            }

            if (Count <= ExactCapacity)
            {
                var n = (int)Count;
                var sorted = new double[n];
                Array.Copy(_exact, sorted, n);
                Array.Sort(sorted);
                var rank = _p * (n - 1);
                var lo = (int)Math.Floor(rank);
                var hi = Math.Min(lo + 1, n - 1);
                return sorted[lo] + ((rank - lo) * (sorted[hi] - sorted[lo]));
            }

            return _height[2];
        }
    }

    private double Parabolic(int i, int s)
    {
        var q = _height;
        var n = _position;
        return q[i] + (s / (n[i + 1] - n[i - 1]) *
            ((((n[i] - n[i - 1] + s) * (q[i + 1] - q[i])) / (n[i + 1] - n[i])) +
             (((n[i + 1] - n[i] - s) * (q[i] - q[i - 1])) / (n[i] - n[i - 1]))));
    }

    private double Linear(int i, int s) => _height[i] + (s * (_height[i + s] - _height[i]) / (_position[i + s] - _position[i]));
}
