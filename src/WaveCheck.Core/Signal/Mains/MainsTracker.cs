using System.Globalization;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Signal;

/// <summary>
/// The mains frequency through a capture: found in its first seconds (<see cref="MainsFrequency.Detect"/>), then
/// tracked window by window from the phase advance of the Hann-weighted fundamental between consecutive whole windows
/// (<see cref="PhasorKernel"/>). The frequency tracked after a window sizes the next one. When no mains content was
/// found, the nominal frequency is kept and not tracked. Not thread-safe; one instance per capture.
/// </summary>
internal sealed class MainsTracker
{
    private readonly double _fs;
    private readonly double? _givenHz;
    private readonly int _headSamples;
    // Window lengths move by a sample or two as the frequency drifts: the last few kernels are kept.
    private readonly PhasorKernel?[] _phasorKernels = new PhasorKernel?[4];
    private int _phasorNext;
    private (double Re, double Im, double Centre)? _previousPhasor;

    /// <summary>Starts tracking from a detection.</summary>
    /// <param name="detection">What the first seconds showed.</param>
    /// <param name="sampleRateHz">Sample rate, hertz.</param>
    /// <param name="givenHz">The nominal frequency given by the user, hertz; null when detected.</param>
    /// <param name="headSamples">Samples the detection looked at.</param>
    public MainsTracker(MainsDetection detection, double sampleRateHz, double? givenHz, int headSamples)
    {
        Detection = detection;
        _fs = sampleRateHz;
        _givenHz = givenHz;
        _headSamples = headSamples;
        FrequencyHz = detection.FrequencyHz;
    }

    /// <summary>Finds the mains frequency in the first seconds of a capture and starts tracking it.</summary>
    /// <param name="headA">The first seconds of the capture, amperes.</param>
    /// <param name="sampleRateHz">Sample rate, hertz.</param>
    /// <param name="options">The nominal frequency given, if any, and whether to keep it when the capture contradicts it.</param>
    /// <param name="filePath">The capture's file, named in the message.</param>
    /// <exception cref="UserInputException">A given frequency is contradicted by the capture's mains content.</exception>
    public static MainsTracker Start(ReadOnlySpan<double> headA, double sampleRateHz, AnalysisOptions options, string filePath)
    {
        var mains = MainsFrequency.Detect(headA, sampleRateHz, options.MainsHz);
        if (options.MainsHz is { } given && !options.KeepGivenMains &&
            MainsFrequency.Contradicts(headA, sampleRateHz, given, mains) is { } seenHz)
        {
            throw new UserInputException(string.Create(CultureInfo.InvariantCulture,
                $"{Path.GetFileName(filePath)}: mains given as {given:0.##} Hz, but the capture's mains content in its first {headA.Length / sampleRateHz:0.#} s is at {seenHz:0.##} Hz; give {Setting.Ref(nameof(AnalysisOptions.MainsHz))} {Math.Round(seenHz / 10) * 10:0} or auto, or {Setting.Ref(nameof(AnalysisOptions.KeepGivenMains))} to keep {given:0.##} Hz"));
        }

        return new MainsTracker(mains, sampleRateHz, options.MainsHz, headA.Length);
    }

    /// <summary>What the first seconds showed.</summary>
    public MainsDetection Detection { get; }

    /// <summary>Nominal frequency the windows are sized for, hertz.</summary>
    public double NominalHz => Detection.NominalHz;

    /// <summary>The frequency tracked so far (it sizes the next window), hertz.</summary>
    public double FrequencyHz { get; private set; }

    /// <summary>The warning that the frequency was not found and is not tracked; null when it was found.</summary>
    public CaptureWarning? Warning => Detection.Found
        ? null
        : new CaptureWarning("mains-fallback", string.Create(CultureInfo.InvariantCulture,
            $"too little mains content to find the mains frequency: windows sized for {NominalHz:0.##} Hz, frequency not tracked"));

    /// <summary>
    /// Takes a whole window and returns the frequency tracked after it. A window with a strong enough fundamental
    /// (<see cref="MainsFrequency.MinFundamentalA"/>, <see cref="MainsFrequency.MinFundamentalShare"/>) following another
    /// gives arg(p_k · conj p_{k−1}) = 2π (f − f_nominal) Δt, unambiguous for |f − f_nominal| &lt; 1/(2Δt) = 2.5 Hz,
    /// accepted within <see cref="MainsFrequency.TrackingRange"/> of the nominal; otherwise the frequency stays.
    /// </summary>
    /// <param name="windowA">The window's samples, amperes.</param>
    /// <param name="startSample">Index of the window's first sample in the capture.</param>
    /// <param name="meanA">The window's mean, amperes.</param>
    /// <param name="acRmsA">The window's AC RMS, amperes.</param>
    public double Track(ReadOnlySpan<double> windowA, long startSample, double meanA, double acRmsA)
    {
        if (!Detection.Found)
        {
            return FrequencyHz;
        }

        var nominal = NominalHz;
        PhasorKernel? kernel = null;
        foreach (var k in _phasorKernels)
        {
            if (k?.Length == windowA.Length)
            {
                kernel = k;
            }
        }

        if (kernel is null)
        {
            kernel = new PhasorKernel(windowA.Length, _fs, nominal);
            _phasorKernels[_phasorNext] = kernel;
            _phasorNext = (_phasorNext + 1) % _phasorKernels.Length;
        }

        var (re, im, fundamental) = kernel.Phasor(windowA, startSample, meanA);
        var centre = startSample + ((windowA.Length - 1) / 2.0);
        var strong = fundamental >= MainsFrequency.MinFundamentalA && fundamental >= MainsFrequency.MinFundamentalShare * acRmsA;
        if (strong && _previousPhasor is { } previous)
        {
            var dr = (re * previous.Re) + (im * previous.Im);
            var di = (im * previous.Re) - (re * previous.Im);
            var dt = (centre - previous.Centre) / _fs;
            var hz = nominal + (Math.Atan2(di, dr) / (2 * Math.PI * dt));
            if (Math.Abs(hz - nominal) <= MainsFrequency.TrackingRange * nominal)
            {
                FrequencyHz = hz;
            }
        }

        _previousPhasor = strong ? (re, im, centre) : null;
        return FrequencyHz;
    }

    /// <summary>The mains figures of the capture: the frequency over its windows and how it was found.</summary>
    /// <param name="meanHz">Mean over the windows, hertz.</param>
    /// <param name="minHz">Lowest window frequency, hertz.</param>
    /// <param name="maxHz">Highest window frequency, hertz.</param>
    public MainsResult Result(double meanHz, double minHz, double maxHz)
    {
        var nominal = NominalHz;
        var found = Detection.Found;
        var source = !found ? "fallback" : _givenHz is null ? "detected" : "given";
        var method = found
            ? string.Create(CultureInfo.InvariantCulture,
                $"{(_givenHz is null ? "50/60 Hz chosen by the strongest" : "given nominal; found by the")} Hann-interpolated spectral peak of the first {_headSamples / _fs:0.##} s; tracked by the phase advance of the Hann-weighted fundamental between consecutive whole windows")
            : string.Create(CultureInfo.InvariantCulture,
                $"too little mains content: nominal {nominal:0.##} Hz used, not tracked");
        return new MainsResult(meanHz, nominal, source, minHz, maxHz, method);
    }
}
