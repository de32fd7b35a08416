using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>
/// <see cref="MainsTracker"/> at its thresholds (least fundamental, least share, edge of the tracking range), over
/// windows of different lengths, without mains content, and its messages.
/// </summary>
public class MainsTrackerMutantTests
{
    // 6400 S/s and 50 Hz: 1/128 cycle a sample, exact in binary, so every kernel angle at a multiple of 128 samples is
    // exactly zero. A window of 257 samples has Hann weight exactly 1 at its centre (n = 128) and exactly 0 at both ends.
    private const double ImpulseFs = 6400;
    private const int ImpulseLength = 257;

    private static MainsTracker FoundAt50Hz(double sampleRateHz) =>
        new(new MainsDetection(50, 50, true, 0.01, 0.01), sampleRateHz, null, 20_000);

    /// <summary>
    /// A zero-mean window: <paramref name="centreA"/> at its centre, <paramref name="firstA"/> and
    /// <paramref name="lastA"/> at its ends (where the Hann weight is zero).
    /// </summary>
    private static double[] Impulse(double centreA, double firstA, double lastA)
    {
        var w = new double[ImpulseLength];
        w[0] = firstA;
        w[ImpulseLength / 2] = centreA;
        w[^1] = lastA;
        return w;
    }

    private static double[] Impulse(double centreA) => Impulse(centreA, -centreA, 0);

    // The AC RMS of a window given its sum of squares (the windows here have mean exactly zero).
    private static double AcRms(double[] w)
    {
        var squares = 0.0;
        foreach (var v in w)
        {
            squares += v * v;
        }

        return Math.Sqrt(squares / w.Length);
    }

    [Fact]
    public void A_half_turn_over_exactly_the_range_edge_is_accepted_and_just_beyond_it_is_not()
    {
        // Closed form: an impulse b at the centre of a Hann window (weight 1) where the 50 Hz reference is at zero
        // phase has phasor b (real, exact). Its sign flipped Δt later is a phase advance of exactly π, read as
        // f = 50 + 1/(2Δt). Δt = 1280/6400 = 0.2 s gives 52.5 Hz, exactly the ±5 % edge of the tracking range
        // (MainsTracker.Track doc: accepted within TrackingRange of the nominal, edge included); Δt = 1152/6400 s gives
        // 52.78 Hz, outside, and the frequency stays.
        const double b = 1e-3;
        var tracker = FoundAt50Hz(ImpulseFs);
        Assert.Equal(50, tracker.Track(Impulse(b), 0, 0, AcRms(Impulse(b))));
        Assert.Equal(52.5, tracker.Track(Impulse(-b), 1280, 0, AcRms(Impulse(-b))));

        var beyond = FoundAt50Hz(ImpulseFs);
        beyond.Track(Impulse(b), 0, 0, AcRms(Impulse(b)));
        Assert.Equal(50, beyond.Track(Impulse(-b), 1152, 0, AcRms(Impulse(-b))));
    }

    [Fact]
    public void A_fundamental_of_exactly_the_least_rms_counts_as_strong()
    {
        // MainsFrequency.MinFundamentalA: the *smallest* fundamental regarded as a signal, so equal counts. Closed form:
        // the impulse's fundamental RMS is |b|·√2/((L − 1)/2) = |b|·√2/128; b = 9.050966799187807e-06 makes it exactly
        // 1e-7 in binary64 (found with /usr/bin/python3 float arithmetic, checked below). Its share of the AC RMS is
        // √257/128 = 0.125, above 5 %. A half-turn over 1 s then reads 50.5 Hz.
        const double tiny = 9.050966799187807e-06;
        Assert.Equal(MainsFrequency.MinFundamentalA, new PhasorKernel(ImpulseLength, ImpulseFs, 50).Phasor(Impulse(-tiny), 6400, 0).RmsA);

        var tracker = FoundAt50Hz(ImpulseFs);
        tracker.Track(Impulse(1e-3), 0, 0, AcRms(Impulse(1e-3)));
        Assert.Equal(50.5, tracker.Track(Impulse(-tiny), 6400, 0, AcRms(Impulse(-tiny))));
    }

    [Fact]
    public void A_fundamental_of_exactly_the_least_share_counts_as_strong()
    {
        // MainsFrequency.MinFundamentalShare: the *least* share of the AC RMS, so equal counts. Fundamental F = b·√2/128
        // (closed form, as above); the AC RMS a with 0.05·a == F in binary64 is searched next to F/0.05, and the window
        // is given exactly that AC RMS by splitting the rest of the energy between its two ends (Hann weight 0, so the
        // phasor is unchanged): centre −b, end t, start b − t (zero mean), (b − t)² + b² + t² = 257a².
        const double b = 1e-3;
        var fundamentalA = Math.Sqrt(b * b) * Math.Sqrt(2) / 128;
        var acA = Math.BitDecrement(Math.BitDecrement(fundamentalA / MainsFrequency.MinFundamentalShare));
        for (var i = 0; i < 8 && MainsFrequency.MinFundamentalShare * acA != fundamentalA; i++)
        {
            acA = Math.BitIncrement(acA);
        }

        Assert.Equal(fundamentalA, MainsFrequency.MinFundamentalShare * acA);
        var rest = (ImpulseLength * acA * acA) - (b * b);
        var t = (b - Math.Sqrt((2 * rest) - (b * b))) / 2; // root of 2t² − 2bt + 2b² − 257a² = 0
        var window = Impulse(-b, b - t, t);
        Assert.Equal(acA, AcRms(window), acA * 1e-12);
        Assert.Equal(fundamentalA, new PhasorKernel(ImpulseLength, ImpulseFs, 50).Phasor(window, 6400, 0).RmsA);

        var tracker = FoundAt50Hz(ImpulseFs);
        tracker.Track(Impulse(b), 0, 0, AcRms(Impulse(b)));
        Assert.Equal(50.5, tracker.Track(window, 6400, 0, acA));
    }

    [Fact]
    public void Without_mains_content_even_strong_windows_leave_the_nominal()
    {
        // MainsTracker doc: when no mains content was found, the nominal is kept and not tracked. The same two windows
        // that read 50.5 Hz above (half a turn over 1 s) must leave it at 50 Hz.
        var tracker = new MainsTracker(new MainsDetection(50, 50, false, 0, 0), ImpulseFs, null, 20_000);
        Assert.Equal(50, tracker.Track(Impulse(1e-3), 0, 0, AcRms(Impulse(1e-3))));
        Assert.Equal(50, tracker.Track(Impulse(-1e-3), 6400, 0, AcRms(Impulse(-1e-3))));
    }

    [Fact]
    public void Windows_of_different_lengths_are_compared_at_their_centres()
    {
        // Closed form: a Hann-weighted (symmetric) window measures a tone's phase at the window's centre, so a 51 Hz
        // cosine against a 50 Hz reference advances 2π·1 Hz·Δt between centres. Windows [0, 2000) and [2000, 3000) at
        // 10 kS/s have centres 999.5 and 2499.5, Δt = 0.15 s (not the 0.2 s between starts). Tolerance 0.01 Hz (the
        // tracking requirement, as in MainsTrackerTests); the 102 Hz image leaks below 2e-4 rad per window.
        const double fs = 10_000;
        var x = Synth.Make(fs, 0.3, t => 0.01 * Math.Cos((2 * Math.PI * 51 * t) + 0.4));
        var tracker = FoundAt50Hz(fs);
        var first = x.AsSpan(0, 2000);
        var second = x.AsSpan(2000, 1000);
        Assert.Equal(50, tracker.Track(first, 0, Mean(first), 0.01 / Math.Sqrt(2)));
        Assert.Equal(51, tracker.Track(second, 2000, Mean(second), 0.01 / Math.Sqrt(2)), 0.01);
    }

    private static double Mean(ReadOnlySpan<double> w)
    {
        var sum = 0.0;
        foreach (var v in w)
        {
            sum += v;
        }

        return sum / w.Length;
    }

    [Theory]
    [InlineData(59.6, 50, 60)]
    [InlineData(50.4, 60, 50)]
    public void A_contradicted_frequency_names_the_nominal_nearest_to_what_the_capture_shows(double toneHz, double givenHz, int suggestedHz)
    {
        // Common practice, no source: mains is 50 or 60 Hz, so the message suggests the one nearest the frequency seen.
        // Template: the message with its settings still marked (UserInputException).
        var sine = Synth.Make(10_000, 2, t => 0.01 * Math.Sin(2 * Math.PI * toneHz * t));
        var ex = Assert.Throws<UserInputException>(() =>
            MainsTracker.Start(sine, 10_000, new AnalysisOptions { MainsHz = givenHz }, "c.wav"));
        Assert.Contains($"; give {Setting.Ref(nameof(AnalysisOptions.MainsHz))} {suggestedHz} or auto, or "
            + $"{Setting.Ref(nameof(AnalysisOptions.KeepGivenMains))} to keep {givenHz} Hz", ex.Template);
    }

    [Fact]
    public void A_detected_frequency_says_it_chose_between_50_and_60_Hz()
    {
        // The result's method text says how the frequency was found (docs/methods.md; common practice, no source).
        var sine = Synth.Make(10_000, 2, t => 0.01 * Math.Sin(2 * Math.PI * 50 * t));
        var tracker = MainsTracker.Start(sine, 10_000, new AnalysisOptions(), "d.wav");
        var result = tracker.Result(50, 50, 50);
        Assert.Equal("detected", result.Source);
        Assert.StartsWith("50/60 Hz chosen by the strongest Hann-interpolated spectral peak of the first 2 s", result.Method);
    }
}
