using WaveCheck.Core.Assessment;
using WaveCheck.Core.Results;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Survey;

/// <summary>What a survey writes besides its rows, and how.</summary>
public sealed record SiteSurveyOptions
{
    /// <summary>Folder the survey's files go into; created if missing.</summary>
    public required string OutputDirectory { get; init; }

    /// <summary>Site name for the summary.</summary>
    public string Site { get; init; } = "unnamed site";

    /// <summary>Measurement settings shared by every capture.</summary>
    public AnalysisOptions Analysis { get; init; } = new();

    /// <summary>Also write <c>captures.parquet</c> and <c>windows.parquet</c>.</summary>
    public bool Parquet { get; init; }

    /// <summary>Captures analysed at once; null for one per core.</summary>
    public int? MaxParallel { get; init; }

    /// <summary>
    /// Writes one capture's report and returns its path relative to <see cref="OutputDirectory"/>; null to write none.
    /// Called from worker threads, once per capture, with its job, its evaluation and a file stem unique within the survey.
    /// </summary>
    public Func<SurveyJob, Evaluation, string, string?>? WriteReport { get; init; }
}

/// <summary>
/// A survey of many captures: each measured and judged in parallel (bounded memory: one capture's analysis per
/// worker), a bad capture isolated in its row, upstream devices checked against the sum of their circuits, and the
/// summary written as CSV, JSON and (optionally) Parquet.
/// </summary>
public static class SiteSurvey
{
    /// <summary>Runs the survey and writes <c>survey.csv</c>, <c>survey.json</c> (and Parquet tables) into the output folder.</summary>
    /// <param name="jobs">One per capture.</param>
    /// <param name="upstream">Upstream devices and the captures behind them.</param>
    /// <param name="options">Output and measurement settings.</param>
    /// <param name="progress">Captures done and total.</param>
    /// <returns>The summary, as written to <c>survey.json</c>.</returns>
    public static SurveyDocument Run(IReadOnlyList<SurveyJob> jobs, IReadOnlyList<UpstreamGroup> upstream,
        SiteSurveyOptions options, IProgress<(int Done, int Total)>? progress = null)
    {
        ArgumentNullException.ThrowIfNull(jobs);
        ArgumentNullException.ThrowIfNull(upstream);
        ArgumentNullException.ThrowIfNull(options);
        Directory.CreateDirectory(options.OutputDirectory);
        var stems = UniqueStems(jobs);
        using var windows = options.Parquet
            ? ParquetTables.OpenWindows(Path.Combine(options.OutputDirectory, "windows.parquet"))
            : null;

        var outcomes = SurveyRunner.Run(jobs, (job, _) =>
        {
            var analysisOptions = windows is null
                ? options.Analysis
                : options.Analysis with { WindowCompleted = w => windows.Add(job.File, w) };
            var evaluation = Evaluation.Run(job.File, job.Settings.Import, analysisOptions, ToAssessmentOptions(job.Settings));
            var report = options.WriteReport?.Invoke(job, evaluation, stems[job]);
            return new SurveyOutcome(SurveyRow.From(job.File, job.Settings, evaluation.Analysis, evaluation.Assessment, report));
        }, progress, options.MaxParallel);

        var rows = outcomes.Select(o => o.Row).ToList();
        var document = new SurveyDocument
        {
            Site = options.Site,
            GeneratedAt = DateTimeOffset.Now,
            Rows = rows,
            Upstream = UpstreamCheck.EvaluateAll(upstream, rows),
        };
        SurveyCsvWriter.Write(Path.Combine(options.OutputDirectory, "survey.csv"), rows);
        SurveyJson.Write(Path.Combine(options.OutputDirectory, "survey.json"), document);
        if (windows is not null)
        {
            ParquetTables.WriteCaptures(Path.Combine(options.OutputDirectory, "captures.parquet"), rows);
            windows.Complete();
        }

        return document;
    }

    /// <summary>The assessment settings a capture's survey settings stand for.</summary>
    public static AssessmentOptions ToAssessmentOptions(CaptureSettings settings)
    {
        ArgumentNullException.ThrowIfNull(settings);
        return new AssessmentOptions
        {
            RatedResidualCurrentA = settings.RatedResidualCurrentA,
            InstalledType = settings.InstalledType,
            Regime = RegimeNames.TryParse(settings.Regime, out var regime) ? regime : Regime.Iec,
            EvChargingPoint = settings.Ev,
            InstalledRdcDd = settings.InstalledRdcDd,
            ChargerDcDetection = settings.Ev && settings.ChargerDcDetection,
        };
    }

    /// <summary>A file stem per job, unique within the survey (a numeric suffix where two captures share a name).</summary>
    private static Dictionary<SurveyJob, string> UniqueStems(IReadOnlyList<SurveyJob> jobs)
    {
        var used = new HashSet<string>(StringComparer.OrdinalIgnoreCase);
        var stems = new Dictionary<SurveyJob, string>(ReferenceEqualityComparer.Instance);
        foreach (var job in jobs)
        {
            var stem = Path.GetFileNameWithoutExtension(job.File);
            var candidate = stem;
            for (var n = 2; !used.Add(candidate); n++)
            {
                candidate = $"{stem}-{n}";
            }

            stems[job] = candidate;
        }

        return stems;
    }
}
