using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core;

/// <summary>A capture measured and judged: the analysis with its touch-current figures and, inside it, the verdict.</summary>
/// <param name="Analysis">What was measured, with its <see cref="AnalysisResult.Assessment"/> (the one holder of the verdict).</param>
public sealed record Evaluation(AnalysisResult Analysis)
{
    /// <summary>What the capture demands: the analysis's own assessment.</summary>
    public AssessmentResult Assessment => Analysis.Assessment
        ?? throw new InvalidOperationException("an evaluation always carries its assessment");

    /// <summary>A capture whose samples all lie within this span is flat (engineering choice: 1 µA, below any
    /// residual current that matters and above the quantisation of a 16-bit recorder on a 30 mA range).</summary>
    public const double FlatSpanA = 1e-6;

    /// <summary>
    /// Reads one capture in one streaming pass (analysis and IEC 60990 touch-current networks together), then assesses it.
    /// </summary>
    /// <param name="source">An opened capture; read to its end, not disposed.</param>
    /// <param name="analysisOptions">Measurement settings.</param>
    /// <param name="assessmentOptions">The device and thresholds to judge against.</param>
    /// <param name="progress">Receives the share read, 0..1.</param>
    /// <param name="cancellationToken">Stops the reading between blocks.</param>
    /// <exception cref="UserInputException">Malformed data, or an option out of range.</exception>
    /// <exception cref="OperationCanceledException">Cancelled.</exception>
    public static Evaluation Run(ICaptureSource source, AnalysisOptions analysisOptions, AssessmentOptions assessmentOptions,
        IProgress<double>? progress = null, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(source);
        ArgumentNullException.ThrowIfNull(analysisOptions);
        ArgumentNullException.ThrowIfNull(assessmentOptions);
        analysisOptions.Validate();
        assessmentOptions.Validate();
        var meter = new TouchCurrentMeter(source.Info.SampleRateHz);
        var levels = analysisOptions.HalfCycleLevelsA.Count > 0 ? analysisOptions.HalfCycleLevelsA : TripReplayAssessor.LevelsFor(assessmentOptions);
        var analysis = Analyzer.Analyze(source, analysisOptions with { Sinks = [.. analysisOptions.Sinks, meter], HalfCycleLevelsA = levels },
            progress, cancellationToken);
        analysis = analysis with { TouchCurrent = meter.Result };
        if (analysis.Summary.PeakPositiveA - analysis.Summary.PeakNegativeA <= FlatSpanA)
        {
            // A verdict on a dead channel would read as "type AC sufficient": say loudly that nothing was recorded.
            analysis = analysis with
            {
                Warnings =
                [
                    .. analysis.Warnings,
                    new CaptureWarning("flat", "the residual current is flat (every sample within 1 µA of one value): check that the clamp is closed round all live conductors, the logger channel and the calibration before trusting any verdict"),
                ],
            };
        }

        if (analysis.Components.MainsRmsA >= Limits.ImplausibleResidualMainsRmsA)
        {
            // First in the list: a verdict on a load current would read "type AC sufficient" and must not be trusted.
            analysis = analysis with
            {
                Warnings = [ImplausibleResidual(analysis.Components.MainsRmsA, source.Info.ResidualSource), .. analysis.Warnings],
            };
        }

        if (analysis.LeakageSplit is { } split)
        {
            analysis = analysis with
            {
                LeakageSplit = LeakageInterpretation.Interpret(split, assessmentOptions.Accuracy ?? MeasurementAccuracy.Default),
            };
        }

        var assessment = DeviceTypeAssessor.Assess(analysis, assessmentOptions);
        assessment = assessment with
        {
            TripReplay = TripReplayAssessor.Replay(analysis, assessmentOptions),
        };
        return new Evaluation(analysis with { Assessment = assessment });
    }

    /// <summary>The evaluation with the settings its texts name written as <paramref name="settingName"/> gives them
    /// (<see cref="ResultWording"/>): a front end calls it once, before any output.</summary>
    /// <param name="settingName">From a property name (<c>SumChannels</c>) to the user's word for it (<c>--sum</c>).</param>
    public Evaluation InWords(Func<string, string> settingName) => new(Analysis.InWords(settingName));

    /// <summary>Code of the warning for a residual current too large at mains frequency to be one.</summary>
    public const string ImplausibleResidualCode = "implausible-residual";

    /// <summary>The warning for a residual current whose mains-frequency RMS reaches
    /// <see cref="Limits.ImplausibleResidualMainsRmsA"/>.</summary>
    /// <param name="mainsRmsA">Mains-frequency RMS, amperes.</param>
    /// <param name="source">The channel or sum that formed it.</param>
    public static CaptureWarning ImplausibleResidual(double mainsRmsA, string source) =>
        new(ImplausibleResidualCode,
            $"'{source}' carries {Text.CurrentText.WithUnit(mainsRmsA)} at mains frequency, at or above {Text.CurrentText.WithUnit(Limits.ImplausibleResidualMainsRmsA)} (an engineering choice: more than any residual-current device in use would hold): it looks like one conductor's load current, not a residual current; clamp all live conductors together, or add every live conductor's channel with {Setting.Ref(nameof(ImportOptions.SumChannels))}, before trusting any verdict");

    /// <summary>Opens <paramref name="path"/> and runs <see cref="Run(ICaptureSource, AnalysisOptions, AssessmentOptions, IProgress{double}?, CancellationToken)"/>.</summary>
    /// <exception cref="CaptureFormatException">The file cannot be read as a capture.</exception>
    public static Evaluation Run(string path, ImportOptions importOptions, AnalysisOptions analysisOptions,
        AssessmentOptions assessmentOptions, IProgress<double>? progress = null, CancellationToken cancellationToken = default)
    {
        using var source = CaptureOpener.Open(path, importOptions);
        return Run(source, analysisOptions, assessmentOptions, progress, cancellationToken);
    }
}
