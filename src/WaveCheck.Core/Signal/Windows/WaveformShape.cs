using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace WaveCheck.Core.Signal;

/// <summary>
/// Smooth DC, pulsating DC and current-delay angle of a window, from the distribution of its samples
/// (histograms, no sorting). Holds scratch histograms: not thread-safe; one instance per thread.
/// </summary>
/// <remarks>
/// <para>Definitions (engineering choices, stated so they can be checked):</para>
/// <para>Let P2 and P98 be the window's 2nd and 98th percentiles. The <b>floor band</b> is the samples within the rest
/// band W (<see cref="DefaultRestBandA"/>, 2 mA) above P2 (or below P98 for negative pulses). A window is <b>pulsating
/// DC</b> when, in every mains cycle of the window, its samples rest in one floor band for a single interval of at
/// least <see cref="MinRestDeg"/> (150°, the IEC 61008-1 definition), short excursions of noise bridged. A half-wave
/// rests for 180° or more; a two-pulse rectified current of more than 2.3 mA peak rests less than 150° in one piece
/// (|sin θ| ≤ W/Ipk about each zero), a three- or six-pulse current only when its ripple is within W, and then its
/// floor is its smooth DC. A current resting that long at both extremes (a square wave, or anything whose whole range
/// is within W) is not pulsating.</para>
/// <para><b>Smooth DC</b> of a pulsating window is the median of the floor-band samples (so 30 mA half-wave pulses on
/// 8 mA give 8 mA, not the mean of 17.5 mA); of any other window (AC with an offset, DC with ripple, pure DC) it is
/// the mean. A full-wave rectified sine without phase control has no resting floor and so is reported as AC on a
/// smooth DC equal to its mean.</para>
/// <para><b>Current-delay angle</b> α of a phase-controlled half-wave (conduction from α to π of each cycle): with
/// r = (mean − floor)/(max − floor), closed form r = (1 + cos α)/(2π) for α ≤ 90° and (1 + cos α)/(2π sin α) above,
/// solved for α. It is reported only when the window has one conduction start per cycle and a conducting share close
/// to (π − α)/(2π); otherwise null. Percentiles come from a 4096-bin histogram of the window's range; the floor value is
/// refined by a second 4096-bin histogram inside its coarse bin (resolution range/16.7 million).</para>
/// <para>Kept in one file of about 400 lines: the percentiles, the rest test, the floor's median and the delay angle
/// are one algorithm over the same histograms and per-sample bins, which splitting would have to pass around.</para>
/// </remarks>
public sealed class WaveformShape
{
    /// <summary>Default width of the floor band, amperes: 0.002 A (see remarks).</summary>
    /// <remarks>Engineering choice: twice the 1 mA DC significance, so other current of up to about ±1 mA on the rest
    /// (a little capacitive leakage, noise) still lets a half-wave read as pulsating DC, while a rectified current from
    /// several phases, whose ripple is larger, never rests. An absolute width, not a share of the window's range, so
    /// that adding content to a waveform cannot widen the band and hide what rides on the rest (the verdict stays
    /// monotone). IEC 61008-1's definition allows up to 6 mA; this is stricter, the safe side.</remarks>
    public const double DefaultRestBandA = 0.002;

    private readonly double _restBandA;

    /// <summary>Creates the measure with its scratch histograms.</summary>
    /// <param name="restBandA">Width of the floor band, amperes (&gt; 0).</param>
    public WaveformShape(double restBandA = DefaultRestBandA)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(restBandA);
        _restBandA = restBandA;
    }

    /// <summary>Least rest at the floor, in one piece, in every mains cycle for a pulsating window: 150°.</summary>
    /// <remarks>IEC 61008-1 definition of pulsating direct current (a current that in each period of the rated
    /// frequency is zero, or does not exceed 6 mA DC, for a single interval of at least 150°), from memory. A two-,
    /// three- or six-pulse rectified current never rests so long and is not pulsating DC.</remarks>
    public const double MinRestDeg = 150;

    /// <summary>How much longer, in degrees per cycle, the floor side must dwell in its band than the opposite extreme
    /// does in its own: 30°. Engineering choice: a sine rests equally long at both extremes; a half-wave rests at its
    /// floor 180° or more and near its peak well under 150°.</summary>
    public const double RestContrastDeg = 30;

    /// <summary>Longest excursion out of the floor band, as a share of the cycle, that still counts as part of one rest
    /// (noise on the floor must not split it): 1 % (3.6°). Engineering choice.</summary>
    public const double RestGapShare = 0.01;

    /// <summary>Level above the floor, as a share of the pulse height, where conduction counts as started.</summary>
    public const double ConductionShare = 0.02;

    /// <summary>Level above the floor, as a share of the pulse height, that a new conduction start must reach after
    /// falling back to <see cref="ConductionShare"/> (hysteresis against noise; engineering choice).</summary>
    public const double StartShare = 0.10;

    /// <summary>Largest difference between the measured and the expected conducting share for a delay angle.</summary>
    public const double ConductionShareTolerance = 0.05;

    private const int Bins = 4096;
    private readonly int[] _coarse = new int[Bins];
    private readonly int[] _parts = new int[4 * Bins];
    private readonly int[] _fine = new int[Bins];
    private ushort[] _binOf = [];

    /// <summary>Measures a window.</summary>
    /// <param name="samplesA">The window, amperes.</param>
    /// <param name="cycles">Mains cycles in the window (≥ 1).</param>
    /// <param name="meanA">The window's mean, amperes.</param>
    /// <param name="minA">Smallest sample, amperes.</param>
    /// <param name="maxA">Largest sample, amperes.</param>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public ShapeFigures Measure(ReadOnlySpan<double> samplesA, int cycles, double meanA, double minA, double maxA)
    {
        var n = samplesA.Length;
        var range = maxA - minA;
        if (n < 4 || !(range > 1e-12 + (1e-9 * Math.Max(Math.Abs(minA), Math.Abs(maxA)))))
        {
            return new ShapeFigures(meanA, false, null);
        }

        var scale = Bins / range;
        if (_binOf.Length < n)
        {
            _binOf = new ushort[n];
        }

        // Each sample's coarse bin is kept, so the refinement below need not compute it again. Four interleaved
        // partial histograms: on a flat floor consecutive samples fall in one bin, and a single histogram would make
        // each increment wait for the one before.
        var binOf = _binOf.AsSpan(0, n);
        var parts = _parts.AsSpan();
        parts.Clear();
        var i = 0;
        for (; i + 4 <= n; i += 4)
        {
            var b0 = Math.Min((int)((samplesA[i] - minA) * scale), Bins - 1);
            var b1 = Math.Min((int)((samplesA[i + 1] - minA) * scale), Bins - 1);
            var b2 = Math.Min((int)((samplesA[i + 2] - minA) * scale), Bins - 1);
            var b3 = Math.Min((int)((samplesA[i + 3] - minA) * scale), Bins - 1);
            (binOf[i], binOf[i + 1], binOf[i + 2], binOf[i + 3]) = ((ushort)b0, (ushort)b1, (ushort)b2, (ushort)b3);
            parts[b0]++;
            parts[Bins + b1]++;
            parts[(2 * Bins) + b2]++;
            parts[(3 * Bins) + b3]++;
        }

        for (; i < n; i++)
        {
            var bin = Math.Min((int)((samplesA[i] - minA) * scale), Bins - 1);
            binOf[i] = (ushort)bin;
            parts[bin]++;
        }

        var coarse = _coarse.AsSpan();
        coarse.Clear();
        for (var k = 0; k < 4; k++)
        {
            var part = MemoryMarshal.Cast<int, Vector<int>>(parts.Slice(k * Bins, Bins));
            var sum = MemoryMarshal.Cast<int, Vector<int>>(coarse);
            for (var v = 0; v < sum.Length; v++)
            {
                sum[v] += part[v];
            }
        }

        var width = range / Bins;
        var p2 = CoarseQuantile(0.02 * (n - 1), minA, width);
        var p98 = CoarseQuantile(0.98 * (n - 1), minA, width);
        var spread = p98 - p2;
        if (!(spread > range * 1e-6))
        {
            return new ShapeFigures(meanA, false, null);
        }

        var lowLimit = p2 + _restBandA;
        var highLimit = p98 - _restBandA;
        var dwellLow = CountBelow(lowLimit, minA, scale) / (double)n;
        var dwellHigh = (n - CountBelow(highLimit, minA, scale)) / (double)n;

        // Pulsating DC rests at its floor for a single interval of at least 150° in each cycle (IEC 61008-1
        // definition): a floor side holding less than that share of the samples cannot qualify. A current that rests
        // that long at both extremes (a square wave) is bipolar AC, not pulsating DC.
        // The floor side must also hold clearly more than the other (by RestContrastDeg): a sine whose peak is near
        // the band width rests about equally long at both extremes, and noise must not pick one of them as a floor.
        var restShare = MinRestDeg / 360.0;
        var contrast = RestContrastDeg / 360.0;
        bool positive;
        if (dwellLow >= restShare && dwellHigh < restShare && dwellLow - dwellHigh >= contrast)
        {
            positive = true;
        }
        else if (dwellHigh >= restShare && dwellLow < restShare && dwellHigh - dwellLow >= contrast)
        {
            positive = false;
        }
        else
        {
            return new ShapeFigures(meanA, false, null);
        }

        // Exact count of the floor band, and a rest of at least 150° in one piece in every cycle.
        var limit = positive ? lowLimit : highLimit;
        var inBand = 0;
        for (var c = 0; c < cycles; c++)
        {
            var from = (int)((long)c * n / cycles);
            var to = (int)((long)(c + 1) * n / cycles);
            var cycle = samplesA[from..to];
            inBand += CountOnFloorSide(cycle, limit, positive);
            if (LongestCircularRest(cycle, limit, positive) < restShare * cycle.Length)
            {
                return new ShapeFigures(meanA, false, null);
            }
        }

        // Median of the floor band: rank inBand/2 from the bottom (positive) or from the top (negative).
        var rank = positive ? (inBand - 1) / 2.0 : n - 1 - ((inBand - 1) / 2.0);
        var floor = RefinedQuantile(samplesA, rank, minA, scale);
        var angle = DelayAngle(samplesA, cycles, positive, floor, meanA, positive ? maxA : minA);
        return new ShapeFigures(floor, true, angle);
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private double? DelayAngle(ReadOnlySpan<double> samplesA, int cycles, bool positive, double floor, double mean,
        double extreme)
    {
        var sign = positive ? 1.0 : -1.0;
        var height = sign * (extreme - floor);
        if (!(height > 0))
        {
            return null;
        }

        var r = sign * (mean - floor) / height;
        if (r <= 0 || r > 1.02 / Math.PI)
        {
            return null;
        }

        var alpha = r >= 1 / (2 * Math.PI)
            ? Math.Acos(Math.Clamp((2 * Math.PI * r) - 1, -1, 1))
            : 2 * Math.Atan(1 / (2 * Math.PI * r));

        // Conduction structure: one start per cycle (counted with hysteresis, so noise on the floor does not flicker)
        // and the expected conducting share.
        var threshold = ConductionShare * height;
        var rise = StartShare * height;
        var starts = 0;
        var conducting = 0;
        var on = sign * (samplesA[^1] - floor) > rise;
        foreach (var x in samplesA)
        {
            // Without branches: whether a sample conducts or starts a pulse is data, not a pattern to predict.
            var level = sign * (x - floor);
            var above = level > threshold;
            conducting += above ? 1 : 0;
            var next = on ? above : level > rise;
            starts += !on && next ? 1 : 0;
            on = next;
        }

        var edge = Math.Asin(ConductionShare);
        var expected = (Math.PI - alpha - edge - Math.Max(0, edge - alpha)) / (2 * Math.PI);
        var share = conducting / (double)samplesA.Length;
        if (Math.Abs(starts - cycles) > Math.Max(1, cycles / 4) || Math.Abs(share - expected) > ConductionShareTolerance)
        {
            return null;
        }

        return alpha * 180 / Math.PI;
    }

    /// <summary>Longest run of samples on the floor side of <paramref name="limit"/> in one cycle, taken as circular
    /// (a rest that spans the cycle's cut counts whole), with excursions up to <see cref="RestGapShare"/> of the cycle
    /// bridged.</summary>
    private static int LongestCircularRest(ReadOnlySpan<double> cycle, double limit, bool positive)
    {
        var n = cycle.Length;
        var gapLimit = Math.Max(1, (int)(RestGapShare * n));
        var best = 0;
        var run = 0;
        var gap = 0;
        var leading = -1;
        for (var i = 0; i < n; i++)
        {
            var rest = positive ? cycle[i] <= limit : cycle[i] >= limit;
            if (rest)
            {
                run += gap + 1;
                gap = 0;
            }
            else if (run > 0 && ++gap <= gapLimit)
            {
                continue;
            }
            else
            {
                leading = leading < 0 ? run : leading;
                best = Math.Max(best, run);
                run = 0;
                gap = 0;
            }
        }

        if (leading < 0)
        {
            // Never left the band for long: the whole cycle rests.
            return run == 0 ? 0 : n;
        }

        // The run still open at the end joins, across a short gap, the one the cycle began with.
        var tail = run > 0 && leading > 0 ? run + gap + leading : run;
        return Math.Max(best, Math.Min(n, tail));
    }

    /// <summary>Samples at or below <paramref name="limit"/> (<paramref name="below"/>) or at or above it, counted on
    /// whole vectors.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static int CountOnFloorSide(ReadOnlySpan<double> samplesA, double limit, bool below)
    {
        var count = 0L;
        var i = 0;
        if (Vector.IsHardwareAccelerated && samplesA.Length >= Vector<double>.Count)
        {
            var values = MemoryMarshal.Cast<double, Vector<double>>(samplesA);
            var bound = new Vector<double>(limit);
            var hits = Vector<long>.Zero;
            foreach (var v in values)
            {
                // A true lane is all ones, −1 as an integer.
                hits -= below ? Vector.LessThanOrEqual(v, bound) : Vector.GreaterThanOrEqual(v, bound);
            }

            count = Vector.Sum(hits);
            i = values.Length * Vector<double>.Count;
        }

        for (; i < samplesA.Length; i++)
        {
            count += (below ? samplesA[i] <= limit : samplesA[i] >= limit) ? 1 : 0;
        }

        return (int)count;
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private double CoarseQuantile(double rank, double min, double width)
    {
        var cumulative = 0;
        for (var b = 0; b < Bins; b++)
        {
            var count = _coarse[b];
            if (cumulative + count > rank)
            {
                return min + ((b + ((rank - cumulative + 0.5) / count)) * width);
            }

            cumulative += count;
        }

        return min + (Bins * width);
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private int CountBelow(double limit, double min, double scale)
    {
        var last = Math.Min((int)((limit - min) * scale), Bins - 1);
        var count = 0;
        for (var b = 0; b <= last; b++)
        {
            count += _coarse[b];
        }

        return count;
    }

    /// <summary>Sample value at a (fractional) rank: finds its coarse bin, then histograms that bin finely.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private double RefinedQuantile(ReadOnlySpan<double> samplesA, double rank, double min, double scale)
    {
        var width = 1 / scale;
        var cumulative = 0;
        var bin = 0;
        for (; bin < Bins - 1; bin++)
        {
            if (cumulative + _coarse[bin] > rank)
            {
                break;
            }

            cumulative += _coarse[bin];
        }

        var low = min + (bin * width);
        var fineScale = Bins * scale;
        Array.Clear(_fine);
        var lowest = double.PositiveInfinity;
        var highest = double.NegativeInfinity;
        var binOf = _binOf.AsSpan(0, samplesA.Length);
        for (var i = 0; i < samplesA.Length; i++)
        {
            var x = samplesA[i];
            if (binOf[i] == bin)
            {
                _fine[Math.Clamp((int)((x - low) * fineScale), 0, Bins - 1)]++;
                lowest = Math.Min(lowest, x);
                highest = Math.Max(highest, x);
            }
        }

        var fineWidth = width / Bins;
        for (var b = 0; b < Bins; b++)
        {
            var count = _fine[b];
            if (cumulative + count > rank)
            {
                var value = low + ((b + 0.5) * fineWidth);
                return Math.Clamp(value, lowest, highest);
            }

            cumulative += count;
        }

        return highest;
    }
}
