using System.Runtime.CompilerServices;
namespace WaveCheck.Core.Signal;

/// <summary>Outcome of looking for mains content at the start of a capture.</summary>
/// <param name="NominalHz">Nominal frequency to size windows with, hertz.</param>
/// <param name="FrequencyHz">Estimated frequency at the start, hertz (the nominal when not found).</param>
/// <param name="Found">True when clear mains content was found (tracking possible).</param>
/// <param name="FundamentalRmsA">RMS of the component found, amperes.</param>
/// <param name="AcRmsA">AC RMS of the stretch searched, amperes.</param>
public readonly record struct MainsDetection(double NominalHz, double FrequencyHz, bool Found, double FundamentalRmsA,
    double AcRmsA);

/// <summary>
/// Finding the mains frequency, and the phase measurements its tracking rests on. Detection: Hann-windowed spectrum of
/// the first seconds (block-averaged to about 1 to 2 kHz), the strongest bin near 50 or 60 Hz (or near the given
/// frequency), interpolated, then refined by the phase method below (first and last whole-cycle stretch) on the
/// full-rate samples. Tracking (<see cref="MainsTracker"/>, window by window through a capture): the Hann-weighted
/// phasor of each whole window (<see cref="PhasorKernel"/>; <see cref="WindowPhasor"/> is the direct form it is checked
/// against) referred to the sample clock; the phase advance between consecutive windows over their time offset gives
/// the frequency error. Stateless and thread-safe.
/// </summary>
/// <remarks>
/// Correlating over a whole number of cycles of the reference frequency rejects DC and the harmonics, so a
/// half-wave current tracks as well as a sine. The Hann interpolation δ = (2|X₊| − |X₀|)/(|X₀| + |X₊|) is exact for one
/// tone under a Hann window (common practice, no single source).
/// </remarks>
public static class MainsFrequency
{
    /// <summary>Tracking range around the nominal, as a fraction (±5 %).</summary>
    public const double TrackingRange = 0.05;

    /// <summary>Least fundamental RMS, as a share of the AC RMS, for mains content to count as present
    /// (engineering choice: a residual current whose mains part is below 5 % of its AC content gives no reliable phase).</summary>
    public const double MinFundamentalShare = 0.05;

    /// <summary>Least ratio of the peak bin's power to the median power of the bins around it (engineering choice:
    /// noise gives ratios of a few, a tone tens of thousands).</summary>
    public const double MinPeakToMedianPower = 100;

    /// <summary>Smallest fundamental RMS regarded as a signal at all, amperes (engineering choice: 100 nA).</summary>
    public const double MinFundamentalA = 1e-7;

    /// <summary>Looks for mains content in <paramref name="samplesA"/> (the first seconds of a capture).</summary>
    /// <param name="samplesA">Samples, amperes.</param>
    /// <param name="sampleRateHz">Sample rate, hertz.</param>
    /// <param name="givenHz">Nominal frequency given by the user, hertz; null to choose between 50 and 60 Hz.</param>
    public static MainsDetection Detect(ReadOnlySpan<double> samplesA, double sampleRateHz, double? givenHz)
    {
        var fallbackHz = givenHz ?? 50.0;
        var mean = Mean(samplesA);
        var acRms = AcRms(samplesA, mean);
        var lost = new MainsDetection(fallbackHz, fallbackHz, false, 0, acRms);
        var decimation = Math.Max(1, (int)(sampleRateHz / 1000));
        var rate = sampleRateHz / decimation;
        var count = samplesA.Length / decimation;
        if (count < 16 || count / rate < 0.1)
        {
            return lost;
        }

        var reduced = new double[count];
        for (var i = 0; i < count; i++)
        {
            var sum = 0.0;
            var block = samplesA.Slice(i * decimation, decimation);
            foreach (var x in block)
            {
                sum += x;
            }

            var hann = 0.5 - (0.5 * Math.Cos(2 * Math.PI * i / count));
            reduced[i] = ((sum / decimation) - mean) * hann;
        }

        var spectrum = new RealSpectrum(count);
        var power = new double[spectrum.BinCount];
        spectrum.Power(reduced, power);
        var resolution = rate / count;

        var best = -1;
        foreach (var nominal in givenHz is null ? [50.0, 60.0] : new[] { givenHz.Value })
        {
            var from = Math.Max(1, (int)Math.Ceiling(nominal * (1 - TrackingRange) / resolution));
            var to = Math.Min(power.Length - 2, (int)Math.Floor(nominal * (1 + TrackingRange) / resolution));
            for (var k = from; k <= to; k++)
            {
                if (best < 0 || power[k] > power[best])
                {
                    best = k;
                }
            }
        }

        if (best < 1 || !(power[best] > 0))
        {
            return lost;
        }

        var median = MedianAround(power, best, resolution, givenHz);
        if (power[best] < MinPeakToMedianPower * median)
        {
            return lost;
        }

        var side = power[best + 1] >= power[best - 1] ? 1 : -1;
        var m0 = Math.Sqrt(power[best]);
        var m1 = Math.Sqrt(power[best + side]);
        var delta = ((2 * m1) - m0) / (m0 + m1);
        var coarseHz = (best + (side * Math.Clamp(delta, 0, 1))) * resolution;
        var chosen = givenHz ?? (Math.Abs(coarseHz - 50) < Math.Abs(coarseHz - 60) ? 50.0 : 60.0);

        // Refine on full-rate samples with the phase method over the longest whole-cycle halves.
        var frequency = coarseHz;
        var fundamental = 0.0;
        for (var iteration = 0; iteration < 3; iteration++)
        {
            var halfCycles = (int)Math.Floor(samplesA.Length * frequency / sampleRateHz / 2);
            var measured = MeasureWindow(samplesA, sampleRateHz, frequency, halfCycles, mean, out fundamental);
            if (measured is null)
            {
                return lost;
            }

            frequency = Math.Clamp(measured.Value, chosen * (1 - TrackingRange), chosen * (1 + TrackingRange));
        }

        if (fundamental < MinFundamentalA || fundamental < MinFundamentalShare * acRms)
        {
            return lost;
        }

        return new MainsDetection(chosen, frequency, true, fundamental, acRms);
    }

    /// <summary>
    /// Whether a declared mains frequency is contradicted by the capture: detection without it finds 50 or 60 Hz
    /// outside the tracking range of the declared value, and that component is at least
    /// <see cref="ContradictionRatio"/> times the one found near the declared value (or none was found there).
    /// </summary>
    /// <param name="samplesA">The first seconds of the capture, amperes.</param>
    /// <param name="sampleRateHz">Sample rate, hertz.</param>
    /// <param name="givenHz">Declared mains frequency, hertz.</param>
    /// <param name="given">Detection with the declared frequency.</param>
    /// <returns>The frequency the capture shows, hertz; null when it does not contradict the declared one.</returns>
    public static double? Contradicts(ReadOnlySpan<double> samplesA, double sampleRateHz, double givenHz, MainsDetection given)
    {
        var free = Detect(samplesA, sampleRateHz, null);
        if (!free.Found || Math.Abs(free.FrequencyHz - givenHz) <= TrackingRange * givenHz)
        {
            return null;
        }

        return !given.Found || free.FundamentalRmsA >= ContradictionRatio * given.FundamentalRmsA ? free.FrequencyHz : null;
    }

    /// <summary>How much stronger the undeclared 50 or 60 Hz component must be to contradict a declared mains
    /// frequency: 3 (engineering choice: a real mains current dominates its neighbourhood by far more; a motor
    /// frequency near 60 Hz on a 50 Hz supply stays beside a mains component of its own order).</summary>
    public const double ContradictionRatio = 3.0;

    /// <summary>
    /// Frequency of the component near <paramref name="referenceHz"/> from the phase advance between the first and the
    /// last stretch of <paramref name="halfCycles"/> reference cycles in <paramref name="samplesA"/>.
    /// </summary>
    /// <param name="samplesA">A window, amperes.</param>
    /// <param name="sampleRateHz">Sample rate, hertz.</param>
    /// <param name="referenceHz">Frequency expected, hertz.</param>
    /// <param name="halfCycles">Cycles per stretch (at least 1; about half the window).</param>
    /// <param name="meanA">The window's mean, removed before correlating, amperes.</param>
    /// <param name="fundamentalRmsA">RMS of the component (mean of the two stretches), amperes.</param>
    /// <returns>The frequency, hertz; null when the window is too short or the component is zero.</returns>
    public static double? MeasureWindow(ReadOnlySpan<double> samplesA, double sampleRateHz, double referenceHz,
        int halfCycles, double meanA, out double fundamentalRmsA)
    {
        fundamentalRmsA = 0;
        var stretch = (int)Math.Round(halfCycles * sampleRateHz / referenceHz);
        var offset = samplesA.Length - stretch;
        if (halfCycles < 1 || stretch < 4 || offset <= 0)
        {
            return null;
        }

        var omega = 2 * Math.PI * referenceHz / sampleRateHz;
        var (r1, i1) = CorrelateHann(samplesA[..stretch], omega, 0, meanA);
        var (r2, i2) = CorrelateHann(samplesA.Slice(offset, stretch), omega, offset, meanA);
        var m1 = Math.Sqrt((r1 * r1) + (i1 * i1));
        var m2 = Math.Sqrt((r2 * r2) + (i2 * i2));

        // The Hann weights of a stretch of L samples sum to (L − 1)/2 (closed form).
        fundamentalRmsA = (m1 + m2) / 2 * Math.Sqrt(2) / ((stretch - 1) / 2.0);
        if (!(m1 > 0) || !(m2 > 0))
        {
            return null;
        }

        // arg(c2 · conj c1) = (ω_true − ω_ref)·offset.
        var dr = (r2 * r1) + (i2 * i1);
        var di = (i2 * r1) - (r2 * i1);
        var phase = Math.Atan2(di, dr);
        return referenceHz + (phase * sampleRateHz / (2 * Math.PI * offset));
    }

    /// <summary>
    /// The fundamental's phasor over a whole window, Hann-weighted and referred to the capture's sample clock at
    /// <paramref name="referenceHz"/>: the phase of consecutive windows then advances by 2π(f − f_ref)·Δt, so the
    /// frequency follows from two windows 200 ms apart. Over a whole 10-cycle window the Hann main lobe is ±10 Hz
    /// wide, so a drive's motor current at 37 Hz stays outside it (its leakage is about 2 %), where a half-window
    /// stretch would take it in and be dragged by up to ±1 Hz.
    /// </summary>
    /// <param name="samplesA">The window, amperes.</param>
    /// <param name="sampleRateHz">Sample rate, hertz.</param>
    /// <param name="referenceHz">Reference frequency (the nominal), hertz.</param>
    /// <param name="startSample">Index of the window's first sample in the capture.</param>
    /// <param name="meanA">The window's mean, removed first, amperes.</param>
    /// <returns>Real and imaginary part (unnormalised) and the component's RMS, amperes.</returns>
    public static (double Re, double Im, double RmsA) WindowPhasor(ReadOnlySpan<double> samplesA, double sampleRateHz,
        double referenceHz, long startSample, double meanA)
    {
        var omega = 2 * Math.PI * referenceHz / sampleRateHz;
        var (re, im) = CorrelateHann(samplesA, omega, startSample, meanA);
        var rms = samplesA.Length > 1 ? Math.Sqrt((re * re) + (im * im)) * Math.Sqrt(2) / ((samplesA.Length - 1) / 2.0) : 0;
        return (re, im, rms);
    }

    /// <summary>
    /// Σ (x_n − mean)·w_n·e^{−iω(start+n)} with the Hann weight w_n = ½ − ½cos(θn), θ = 2π/(L − 1). The weight
    /// matters: with a plain (rectangular) stretch, a strong sub-mains component (a drive's 12 Hz motor current) leaks
    /// into the correlation at a few per cent and drags the phase, so the tracked frequency wanders by ±0.05 Hz and
    /// the windows lose their synchronisation; Hann sidelobes fall as 1/f³ and make that leakage negligible. A
    /// symmetric weight keeps the phase referred to the stretch's centre, so the phase difference between the two
    /// stretches is unchanged. Computed as three plain correlations, since
    /// cos θn = ½(e^{iθn} + e^{−iθn}): W = ½C(ω) − ¼e^{−iθ·start}C(ω − θ) − ¼e^{iθ·start}C(ω + θ).
    /// </summary>
    private static (double Re, double Im) CorrelateHann(ReadOnlySpan<double> x, double omega, long start, double mean)
    {
        var theta = 2 * Math.PI / Math.Max(1, x.Length - 1);
        var (cr, ci) = Correlate(x, omega, start, mean);
        var (lr, li) = Correlate(x, omega - theta, start, mean);
        var (ur, ui) = Correlate(x, omega + theta, start, mean);
        var cosS = Math.Cos(theta * start);
        var sinS = Math.Sin(theta * start);

        // e^{−iθs}·(lr + i·li) and e^{+iθs}·(ur + i·ui).
        var lowRe = (lr * cosS) + (li * sinS);
        var lowIm = (li * cosS) - (lr * sinS);
        var upRe = (ur * cosS) - (ui * sinS);
        var upIm = (ui * cosS) + (ur * sinS);
        return ((0.5 * cr) - (0.25 * (lowRe + upRe)), (0.5 * ci) - (0.25 * (lowIm + upIm)));
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static (double Re, double Im) Correlate(ReadOnlySpan<double> x, double omega, long start, double mean)
    {
        // Σ (x_n − mean) e^{−iω(start+n)} with four interleaved rotating phasors (n ≡ 0..3 mod 4, stepped by e^{−4iω}:
        // independent chains the processor overlaps), re-anchored every 1024 samples against drift.
        double sumRe = 0, sumIm = 0;
        var stepRe = Math.Cos(4 * omega);
        var stepIm = -Math.Sin(4 * omega);
        Span<double> pr = stackalloc double[4];
        Span<double> pi = stackalloc double[4];
        for (var block = 0; block < x.Length; block += 1024)
        {
            for (var k = 0; k < 4; k++)
            {
                var angle = -omega * (start + block + k);
                pr[k] = Math.Cos(angle);
                pi[k] = Math.Sin(angle);
            }

            double p0r = pr[0], p0i = pi[0], p1r = pr[1], p1i = pi[1], p2r = pr[2], p2i = pi[2], p3r = pr[3], p3i = pi[3];
            double s0r = 0, s0i = 0, s1r = 0, s1i = 0, s2r = 0, s2i = 0, s3r = 0, s3i = 0;
            var end = Math.Min(x.Length, block + 1024);
            var n = block;
            for (; n + 4 <= end; n += 4)
            {
                var v0 = x[n] - mean;
                var v1 = x[n + 1] - mean;
                var v2 = x[n + 2] - mean;
                var v3 = x[n + 3] - mean;
                s0r += v0 * p0r;
                s0i += v0 * p0i;
                s1r += v1 * p1r;
                s1i += v1 * p1i;
                s2r += v2 * p2r;
                s2i += v2 * p2i;
                s3r += v3 * p3r;
                s3i += v3 * p3i;
                (p0r, p0i) = ((p0r * stepRe) - (p0i * stepIm), (p0r * stepIm) + (p0i * stepRe));
                (p1r, p1i) = ((p1r * stepRe) - (p1i * stepIm), (p1r * stepIm) + (p1i * stepRe));
                (p2r, p2i) = ((p2r * stepRe) - (p2i * stepIm), (p2r * stepIm) + (p2i * stepRe));
                (p3r, p3i) = ((p3r * stepRe) - (p3i * stepIm), (p3r * stepIm) + (p3i * stepRe));
            }

            sumRe += s0r + s1r + s2r + s3r;
            sumIm += s0i + s1i + s2i + s3i;
            for (; n < end; n++)
            {
                var angle = -omega * (start + n);
                var v = x[n] - mean;
                sumRe += v * Math.Cos(angle);
                sumIm += v * Math.Sin(angle);
            }
        }

        return (sumRe, sumIm);
    }

    private static double MedianAround(double[] power, int peak, double resolution, double? givenHz)
    {
        var centre = givenHz ?? 55.0;
        var from = Math.Max(1, (int)(centre * 0.7 / resolution));
        var to = Math.Min(power.Length - 1, (int)(centre * 1.3 / resolution));
        var values = new List<double>();
        for (var k = from; k <= to; k++)
        {
            if (Math.Abs(k - peak) > 2)
            {
                values.Add(power[k]);
            }
        }

        if (values.Count == 0)
        {
            return 0;
        }

        values.Sort();
        return values[values.Count / 2];
    }

    private static double Mean(ReadOnlySpan<double> x)
    {
        var sum = 0.0;
        foreach (var v in x)
        {
            sum += v;
        }

        return x.Length > 0 ? sum / x.Length : 0;
    }

    private static double AcRms(ReadOnlySpan<double> x, double mean)
    {
        var sum = 0.0;
        foreach (var v in x)
        {
            sum += (v - mean) * (v - mean);
        }

        return x.Length > 0 ? Math.Sqrt(sum / x.Length) : 0;
    }
}
