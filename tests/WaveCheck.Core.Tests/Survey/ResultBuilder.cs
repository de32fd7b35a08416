using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;
using WaveCheck.Core.Survey;

namespace WaveCheck.Core.Tests.Survey;

/// <summary>Builds small <see cref="AnalysisResult"/> and <see cref="AssessmentResult"/> instances with the figures a
/// survey reads; everything else empty. Currents in amperes.</summary>
internal sealed record ResultBuilder
{
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
