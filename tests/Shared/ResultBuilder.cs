using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;
using WaveCheck.Core.Survey;

namespace WaveCheck.Tests.Shared;

/// <summary>
/// Hand-made results for the tests of Core and Rendering, one builder for both. Two kinds:
/// <list type="bullet">
/// <item>an instance (<c>new ResultBuilder { RmsA = ... }</c>) gives small <see cref="AnalysisResult"/>,
/// <see cref="AssessmentResult"/> and <see cref="SurveyRow"/> values with the figures a survey reads and everything else
/// empty;</item>
/// <item>the static <see cref="Typical"/>, <see cref="FlatZero"/> and <see cref="TypicalAssessment"/> are whole results
/// for the report and the plots (an invented workshop's heat-press controller): those tests check structure, not
/// numbers.</item>
/// </list>
/// Currents in amperes.
/// </summary>
internal sealed record ResultBuilder
{
    public const double MainsHz = 50;
    public const double RateHz = 25_000;
    public const double DurationS = 60;
    public const double RatedA = 0.030;

    /// <summary>A phase-controlled half-wave with a drive tone at 4.2 kHz, a minute long, two events.</summary>
    public static AnalysisResult Typical(string filePath = "workshop-press.wav")
    {
        // A half-wave fired at 90°: zero until 90°, then a sine arc to 180°, zero in the negative half; plus 2 mA DC and a small 4.2 kHz ripple.
        var samples = new double[(int)(RateHz / MainsHz * 10)];
        for (var i = 0; i < samples.Length; i++)
        {
            var phase = (i / RateHz * MainsHz % 1.0) * 360;
            var arc = phase is >= 90 and < 180 ? 0.012 * Math.Sin(phase * Math.PI / 180) : 0;
            samples[i] = 0.002 + arc + (0.0008 * Math.Sin(2 * Math.PI * 4200 * i / RateHz));
        }

        const int buckets = 1500;
        var min = new double[buckets];
        var max = new double[buckets];
        for (var k = 0; k < buckets; k++)
        {
            var swell = k is > 900 and < 960 ? 0.008 : 0;
            min[k] = 0.0012 - (swell / 4);
            max[k] = 0.0148 + swell + (0.001 * Math.Sin(k / 40.0));
        }

        var resolutionHz = 5.0;
        var bins = (int)(RateHz / 2 / resolutionHz) + 1;
        var freqs = new double[bins];
        var rms = new double[bins];
        for (var b = 0; b < bins; b++)
        {
            freqs[b] = b * resolutionHz;
            var f = freqs[b];
            var order = f / MainsHz;
            var nearHarmonic = Math.Abs(order - Math.Round(order)) < 1e-9 && order >= 1;
            rms[b] = nearHarmonic ? 0.005 / Math.Pow(order, 1.3) : 2e-6;
            if (Math.Abs(f - 4200) < 1e-9)
            {
                rms[b] = 0.00056;
            }
        }

        rms[0] = 0.0051;
        var harmonics = Enumerable.Range(1, 50).Select(n => new HarmonicValue(n, n * MainsHz, 0.005 / Math.Pow(n, 1.3), 0.006 / Math.Pow(n, 1.3))).ToList();
        var trend = Enumerable.Range(0, 300).Select(w => new WindowResult
        {
            StartS = w * 0.2,
            DurationS = 0.2,
            FrequencyHz = 50.01,
            RmsA = w is > 180 and < 192 ? 0.0105 : 0.0072 + (0.0003 * Math.Sin(w / 9.0)),
            DcA = 0.0051,
            AcRmsA = 0.0052,
            PeakPositiveA = 0.0148,
            PeakNegativeA = 0.0012,
            CrestFactor = 2.05,
            SmoothDcA = 0.0021,
            PulsatingDc = true,
            CurrentDelayAngleDeg = 90,
            MainsRmsA = 0.005,
            BelowMainsRmsA = 0.0001,
            HarmonicsRmsA = 0.003,
            Above1kHzRmsA = 0.0006,
            Above9kHzRmsA = 0.00001,
            ThdPercent = 62,
        }).ToList();
        var stats = new Dictionary<string, MetricStatistics>
        {
            ["rmsA"] = new(0.0073, 0.0081, 0.0105, 36.4),
            ["smoothDcA"] = new(0.0021, 0.0022, 0.0023, 12.0),
            ["above1kHzRmsA"] = new(0.0006, 0.00062, 0.0007, 40.2),
        };

        return new AnalysisResult
        {
            ToolVersion = "0.1.0-test",
            Capture = Capture(filePath, (long)(RateHz * DurationS), SensorCoupling.Dc),
            Mains = new MainsResult(50.01, 50, "detected", 49.97, 50.04, "zero crossings of the fundamental"),
            Summary = new SummaryResult(0.0073, 0.0051, 0.0052, 0.0148, 0.0148, 0.0012, 2.03),
            Components = new ComponentsResult
            {
                SmoothDcA = 0.0021,
                SmoothDcMaxA = 0.0023,
                PulsatingDc = true,
                PulsatingDcShare = 0.98,
                CurrentDelayAngleDeg = 90,
                MainsRmsA = 0.005,
                BelowMainsRmsA = 0.0001,
                HarmonicsRmsA = 0.003,
                Above1kHzRmsA = 0.0006,
                Above9kHzRmsA = 0.00001,
                ThdPercent = 62,
                Tones = [new ToneValue(4200, 0.00056), new ToneValue(8400, 0.00009)],
            },
            Harmonics = harmonics,
            Bands = [new BandValue(2000, 2200, 0.00001, 0.00002), new BandValue(4200, 4400, 0.00056, 0.0006)],
            Windows = new WindowsResult { Count = 300, CyclesPerWindow = 10, LengthS = 0.2, MaxSyncErrorPercent = 0.02, Statistics = stats },
            Events =
            [
                new EventRecord("alarm", 36.2, 2.4, 0.0105, "window RMS 10.5 mA above the 10 mA alarm"),
                new EventRecord("transient", 51.7, 0.001, 0.031, "peak 31.0 mA, 4.3 × the window RMS"),
            ],
            Warnings = [new CaptureWarning("nyquist", "Content above 12.5 kHz (Nyquist) cannot be seen at 25 kHz sampling.")],
            Spectrum = new SpectrumResult(resolutionHz, freqs, rms),
            Envelope = new EnvelopeResult(DurationS / buckets, min, max),
            // The window's own figures as the analysis measures them: its extremes are its samples' extremes.
            WorstWindow = new WaveformExcerpt(36.4, RateHz, samples, "window with the highest RMS",
                trend[182] with { PeakPositiveA = samples.Max(), PeakNegativeA = samples.Min() }),
            Trend = trend,
            TouchCurrent = new TouchCurrentResult(0.0073, 0.0148, 0.0009, 0.0004, 0.0011, 0.0005, 0.0051),
        };
    }

    /// <summary>A capture of all zeros: no events, no tones, nearly empty arrays.</summary>
    public static AnalysisResult FlatZero() => new()
    {
        ToolVersion = "0.1.0-test",
        Capture = Capture("flat.csv", 1000, SensorCoupling.Unknown),
        Mains = new MainsResult(50, 50, "fallback", 50, 50, "nominal: too little mains content"),
        Summary = new SummaryResult(0, 0, 0, 0, 0, 0, 0),
        Components = new ComponentsResult
        {
            SmoothDcA = 0,
            SmoothDcMaxA = 0,
            PulsatingDc = false,
            MainsRmsA = 0,
            BelowMainsRmsA = 0,
            HarmonicsRmsA = 0,
            Above1kHzRmsA = 0,
            Above9kHzRmsA = 0,
            Tones = [],
        },
        Harmonics = [],
        Bands = [],
        Windows = new WindowsResult { Count = 0, CyclesPerWindow = 10, LengthS = 0.2, MaxSyncErrorPercent = 0, Statistics = new Dictionary<string, MetricStatistics>() },
        Events = [],
        Warnings = [],
        Spectrum = new SpectrumResult(5, [0.0], [0.0]),
        Envelope = new EnvelopeResult(0.1, [0.0], [0.0]),
        WorstWindow = new WaveformExcerpt(0, 1000, [0.0, 0.0, 0.0], "window with the highest RMS"),
        Trend = [],
    };

    /// <summary>A verdict that goes with <see cref="Typical"/>: type A required, installed type AC not adequate.</summary>
    public static AssessmentResult TypicalAssessment(bool blinded = false) => new()
    {
        RequiredType = DeviceType.A,
        MinimumType = DeviceType.A,
        Headline = "Pulsating DC from a phase-controlled half-wave (α = 90°): type A or better is required.",
        RatedResidualCurrentA = RatedA,
        InstalledType = DeviceType.AC,
        InstalledAdequate = false,
        Regime = Regime.Iec,
        Accuracy = "2%+0.1mA",
        Classes =
        [
            new ClassResult(ResidualCurrentClass.MainsAc, "sinusoidal AC at mains frequency", ClassPresence.Present, 0.005, 0.001, DeviceType.AC, false, "mains-frequency component 5.00 mA"),
            new ClassResult(ResidualCurrentClass.PulsatingDc, "pulsating DC", ClassPresence.Present, 0.0024, 0.001, DeviceType.A, false, "pulsating DC: pulses with a mean of 2.40 mA"),
            new ClassResult(ResidualCurrentClass.SmoothDc, "smooth DC or multi-phase rectified current", ClassPresence.AtLimit, 0.00095, 0.001, DeviceType.B, true, "smooth DC 0.950 mA at the limit"),
        ],
        Types =
        [
            new TypeVerdict(DeviceType.AC, false, ["pulsating DC 98 % of windows; type AC is not specified for it (IEC 61008-1)"]),
            new TypeVerdict(DeviceType.A, true, ["smooth DC 2.30 mA within the 6 mA type A tolerance (IEC 61008-1)"]),
            new TypeVerdict(DeviceType.F, true, ["covers type A (IEC 62423)"]),
            new TypeVerdict(DeviceType.B, true, ["covers type F (IEC 62423)"]),
            new TypeVerdict(DeviceType.BPlus, null, ["content above 12.5 kHz cannot be seen at this sample rate"]),
        ],
        NuisanceTrip = new NuisanceTripResult(RiskLevel.Low, DeviceType.A, 0.0068, 0.015, 0.0082, 54.7, 0.009, true,
            [new FrequencyContribution("mains", 45, 55, 0.005, 1, 0.005), new FrequencyContribution("1-20 kHz", 1000, 20000, 0.0006, double.PositiveInfinity, 0)],
            "standing current 6.80 mA is 45 % of the 15.0 mA non-operating limit"),
        Blinding = new BlindingResult(DeviceType.A, blinded ? 0.0084 : 0.0023, 0.006, blinded, blinded ? "smooth DC above the 6 mA tolerance of type A" : "smooth DC 2.30 mA within 6 mA"),
        EvCharging = new EvChargingResult(0.006, 0.0023, false, "type A with an RDC-DD (IEC 62955) suffices while DC stays below 6 mA"),
        Gfci = new GfciResult(0.0073, true, 3.1, false, null, ["UL 943 states no DC sensitivity requirement"]),
        TouchCurrent = new TouchCurrentAssessment(
            new TouchCurrentResult(0.0073, 0.0148, 0.0009, 0.0004, 0.0011, 0.0005, 0.0051),
            [new LimitComparison("IEC 62368-1 ES1, 0.707 mA peak", 0.000707, "perception peak", 0.0009, false, "std")]),
        Cautions =
        [
            "Verify on site with a calibrated instrument before choosing a device.",
            "Local wiring codes take precedence.",
        ],
        Thresholds =
        [
            new ThresholdUse("dcSignificanceA", 0.006, "A", "IEC 61008-1 type A smooth DC tolerance"),
            new ThresholdUse("nonOperatingShare", 0.5, "1", "IEC 61008-1 §5.3.12"),
        ],
    };

    private static CaptureInfo Capture(string filePath, long samples, SensorCoupling coupling) => new()
    {
        FilePath = filePath,
        Format = "wav",
        Encoding = "PCM 24-bit, 1 channel",
        Channels = [new ChannelInfo(0, "ch1", "FS", ChannelQuantity.Current, 0.1, 0.1)],
        ResidualSource = "ch1",
        ResidualChannels = [0],
        SampleRateHz = samples == 1000 ? 1000 : RateHz,
        SampleCount = samples,
        Calibration = Calibration.Amperes("file states amperes"),
        SensorCoupling = coupling,
    };

    public double RmsA { get; init; } = 0.004;

    public double WorstWindowRmsA { get; init; } = 0.005;

    public double SmoothDcMaxA { get; init; }

    public double Above1kHzRmsA { get; init; }

    public long SampleCount { get; init; } = 500_000;

    public double SampleRateHz { get; init; } = 50_000;

    public DeviceType? RequiredType { get; init; } = DeviceType.A;

    public DeviceType MinimumType { get; init; } = DeviceType.A;

    public DeviceType? InstalledType { get; init; } = DeviceType.A;

    public bool? InstalledAdequate { get; init; } = true;

    public double RatedResidualCurrentA { get; init; } = 0.030;

    public bool? Blinded { get; init; } = false;

    public RiskLevel NuisanceRisk { get; init; } = RiskLevel.Low;

    public double NuisanceMarginA { get; init; } = 0.010;

    public string Headline { get; init; } = "pulsating DC: type A";

    public AnalysisResult Analysis(string file = "c1.wav") => new()
    {
        ToolVersion = "test",
        Capture = new CaptureInfo
        {
            FilePath = file,
            Format = "wav",
            Encoding = "PCM 24-bit, 1 channel",
            Channels = [],
            ResidualSource = "1",
            ResidualChannels = [0],
            SampleRateHz = SampleRateHz,
            SampleCount = SampleCount,
            Calibration = Calibration.Amperes("test"),
        },
        Mains = new MainsResult(50, 50, "detected", 49.9, 50.1, "test"),
        Summary = new SummaryResult(RmsA, 0, RmsA, 0, 0, 0, 0),
        Components = new ComponentsResult
        {
            SmoothDcA = SmoothDcMaxA,
            SmoothDcMaxA = SmoothDcMaxA,
            PulsatingDc = false,
            MainsRmsA = RmsA,
            BelowMainsRmsA = 0,
            HarmonicsRmsA = 0,
            Above1kHzRmsA = Above1kHzRmsA,
            Above9kHzRmsA = 0,
            Tones = [],
        },
        Harmonics = [],
        Bands = [],
        Windows = new WindowsResult
        {
            Count = 1,
            CyclesPerWindow = 10,
            LengthS = 0.2,
            MaxSyncErrorPercent = 0,
            Statistics = new Dictionary<string, MetricStatistics> { ["rmsA"] = new(RmsA, WorstWindowRmsA, WorstWindowRmsA, 0) },
        },
        Events = [],
        Warnings = [],
        Spectrum = new SpectrumResult(5, [], []),
        Envelope = new EnvelopeResult(1, [], []),
        WorstWindow = new WaveformExcerpt(0, SampleRateHz, [], "test"),
        Trend = [],
    };

    public AssessmentResult Assessment() => new()
    {
        RequiredType = RequiredType,
        MinimumType = MinimumType,
        Headline = Headline,
        RatedResidualCurrentA = RatedResidualCurrentA,
        InstalledType = InstalledType,
        InstalledAdequate = InstalledAdequate,
        Regime = Regime.Iec,
        Types = [],
        NuisanceTrip = new NuisanceTripResult(NuisanceRisk, InstalledType ?? DeviceType.A, WorstWindowRmsA, 0.5 * RatedResidualCurrentA,
            NuisanceMarginA, 0, 0.3 * RatedResidualCurrentA, true, [], "test"),
        Blinding = new BlindingResult(InstalledType ?? DeviceType.A, Math.Abs(SmoothDcMaxA), 0.006, Blinded, "test"),
        EvCharging = new EvChargingResult(0.006, Math.Abs(SmoothDcMaxA), Blinded is null ? null : Math.Abs(SmoothDcMaxA) >= 0.006, "test"),
        Cautions = [],
        Thresholds = [],
    };

    /// <summary>The survey row these figures give.</summary>
    public SurveyRow Row(string file, string? circuit = null) =>
        SurveyRows.From(file, new CaptureSettings { Circuit = circuit }, Analysis(file), Assessment(), null);
}
