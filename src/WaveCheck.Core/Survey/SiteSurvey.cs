using WaveCheck.Core.Assessment;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Survey;

/// <summary>What a survey writes besides its rows, and how.</summary>
public sealed record SiteSurveyOptions
{
    /// <summary>Folder the survey's files go into; created if missing, replaced as a whole (see <see cref="SiteSurvey"/>).</summary>
    public required string OutputDirectory { get; init; }

    /// <summary>How messages name <see cref="OutputDirectory"/>: the front end's option for it (the CLI's
    /// <c>--output</c>); by default in plain words.</summary>
    public string OutputOption { get; init; } = "the output folder";

    /// <summary>The site file the jobs came from, if any: an input, so never inside the output folder.</summary>
    public string? SiteFile { get; init; }

    /// <summary>How a capture's error row names a setting (<see cref="Setting.Ref"/>): the front end's word for it, such
    /// as a site-file key (<see cref="SiteConfigReader.KeyText"/>) or a command-line flag. Default: the property name.</summary>
    public Func<string, string> SettingName { get; init; } = Setting.PropertyName;

    /// <summary>Site name for the summary.</summary>
    public string Site { get; init; } = "unnamed site";

    /// <summary>Measurement settings shared by every capture.</summary>
    public AnalysisOptions Analysis { get; init; } = new();

    /// <summary>Also write <c>captures.parquet</c> and <c>windows.parquet</c>.</summary>
    public bool Parquet { get; init; }

    /// <summary>Captures analysed at once; null for one per core.</summary>
    public int? MaxParallel { get; init; }

    /// <summary>
    /// Writes one capture's report to the path it is given (<c>reports/STEM.html</c> in the folder being written, the
    /// stem unique within the survey); null to write none. Called from worker threads, once per capture.
    /// </summary>
    public Action<SurveyJob, Evaluation, string>? WriteReport { get; init; }

    /// <summary>Writes the index page to the path it is given (<c>index.html</c> in the folder being written), after
    /// the rows and upstream checks are known; null to write none.</summary>
    public Action<SurveyDocument, string>? WriteIndex { get; init; }
}

/// <summary>
/// A survey of many captures: each measured and judged in parallel (bounded memory: one capture's analysis per
/// worker), a bad capture isolated in its row, upstream devices checked against the sum of their circuits, and the
/// summary written as CSV, JSON and (optionally) Parquet.
/// </summary>
/// <remarks>
/// The output folder is replaced as one set (<see cref="OutputNames"/>): everything is written into a staging folder
/// beside it and switched in at the end (<see cref="OutputFolderSwitch"/>), so the folder holds either the previous
/// survey's complete set or this one's, never a mix, whatever interrupts the run. Before any work,
/// <see cref="OutputPlan"/> refuses an output folder that holds anything but those names, or any capture or site file
/// the survey reads (<c>survey D -o D</c> with a capture named <c>survey.csv</c> is refused, never overwritten).
/// </remarks>
public static class SiteSurvey
{
    /// <summary>The entries a survey writes in its output folder; the folder may hold nothing else.</summary>
    public static IReadOnlyList<string> OutputNames { get; } =
        ["survey.csv", "survey.json", "actions.csv", "index.html", "reports", "captures.parquet", "windows.parquet"];

    /// <summary>Runs the survey and writes <c>survey.csv</c>, <c>survey.json</c>, <c>actions.csv</c> (and Parquet tables, reports, the
    /// index) into the output folder, as one set.</summary>
    /// <param name="jobs">One per capture.</param>
    /// <param name="upstream">Upstream devices and the captures behind them.</param>
    /// <param name="options">Output and measurement settings.</param>
    /// <param name="progress">Captures done and total.</param>
    /// <param name="cancellationToken">Stops the survey between blocks of every capture; the output folder is then
    /// left as it was and the staging folder deleted.</param>
    /// <returns>The summary, as written to <c>survey.json</c>.</returns>
    /// <exception cref="OutputPathException">The output folder may not be replaced (see remarks).</exception>
    /// <exception cref="OutputWriteException">An output could not be written (the message names it as it would have been
    /// in the output folder); the output folder is as it was.</exception>
    /// <exception cref="OperationCanceledException">Cancelled; the output folder is as it was.</exception>
    public static SurveyDocument Run(IReadOnlyList<SurveyJob> jobs, IReadOnlyList<UpstreamGroup> upstream,
        SiteSurveyOptions options, IProgress<(int Done, int Total)>? progress = null, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(jobs);
        ArgumentNullException.ThrowIfNull(upstream);
        ArgumentNullException.ThrowIfNull(options);
        var plan = new OutputPlan();
        foreach (var job in jobs)
        {
            plan.AddCapture(job.File);
        }

        if (options.SiteFile is { } siteFile)
        {
            plan.AddInput(siteFile, "the site file");
        }

        plan.AddReplacedFolder(options.OutputDirectory, options.OutputOption, [.. OutputNames]);
        plan.Check();
        cancellationToken.ThrowIfCancellationRequested();
        using var folder = OutputFolderSwitch.Begin(options.OutputDirectory);
        try
        {
            var document = Write(jobs, upstream, options, folder.StagingPath, progress, cancellationToken);
            cancellationToken.ThrowIfCancellationRequested();
            folder.Commit();
            return document;
        }
        catch (OutputWriteException e)
        {
            throw folder.ToTarget(e);
        }
    }

    private static SurveyDocument Write(IReadOnlyList<SurveyJob> jobs, IReadOnlyList<UpstreamGroup> upstream,
        SiteSurveyOptions options, string folder, IProgress<(int Done, int Total)>? progress, CancellationToken cancellationToken)
    {
        var stems = UniqueStems(jobs);
        using var windows = options.Parquet
            ? ParquetTables.OpenWindows(Path.Combine(folder, "windows.parquet"))
            : null;

        // Captures run side by side, so each analysis gets its share of the cores, not all of them: no nested
        // parallelism (ProcessorCount captures each with ProcessorCount workers oversubscribed the machine).
        var parallel = Math.Max(1, Math.Min(options.MaxParallel ?? Environment.ProcessorCount, jobs.Count));
        var perCapture = Math.Max(1, Math.Min(options.Analysis.WorkerCount, Environment.ProcessorCount / parallel));
        var outcomes = SurveyRunner.Run(jobs, (job, token) =>
        {
            var analysisOptions = windows is null
                ? options.Analysis with { WorkerCount = perCapture }
                : options.Analysis with { WorkerCount = perCapture, WindowCompleted = w => windows.Add(job.File, w) };
            // Worded once, as the survey's user gave the settings, before the report and the row take any text.
            var evaluation = Evaluation.Run(job.File, job.Settings.Import, analysisOptions, ToAssessmentOptions(job.Settings),
                cancellationToken: token).InWords(options.SettingName);
            string? report = null;
            if (options.WriteReport is { } writeReport)
            {
                report = $"reports/{stems[job]}.html";
                token.ThrowIfCancellationRequested();
                writeReport(job, evaluation, Path.Combine(folder, "reports", stems[job] + ".html"));
            }

            return new SurveyOutcome(SurveyRows.From(job.File, job.Settings, evaluation.Analysis, evaluation.Assessment, report));
        }, progress, options.MaxParallel, cancellationToken, options.SettingName);

        var rows = outcomes.Select(o => o.Row).ToList();
        var circuits = CircuitVerdicts.From(rows);
        var upstreamResults = UpstreamCheck.EvaluateAll(upstream, rows);
        var document = new SurveyDocument
        {
            Site = options.Site,
            GeneratedAt = DateTimeOffset.Now,
            Rows = rows,
            Circuits = circuits,
            Actions = RemedialSchedule.From(circuits, upstreamResults),
            Upstream = upstreamResults,
            Cautions = SurveyCautions.All,
        };
        SurveyCsvWriter.Write(Path.Combine(folder, "survey.csv"), rows);
        ActionsCsvWriter.Write(Path.Combine(folder, "actions.csv"), document.Actions);
        SurveyJson.Write(Path.Combine(folder, "survey.json"), document);
        if (windows is not null)
        {
            ParquetTables.WriteCaptures(Path.Combine(folder, "captures.parquet"), rows);
            windows.Complete();
        }

        cancellationToken.ThrowIfCancellationRequested();
        options.WriteIndex?.Invoke(document, Path.Combine(folder, "index.html"));
        return document;
    }

    /// <summary>The assessment settings a capture's survey settings stand for.</summary>
    public static AssessmentOptions ToAssessmentOptions(CaptureSettings settings)
    {
        ArgumentNullException.ThrowIfNull(settings);
        return new AssessmentOptions
        {
            RatedResidualCurrentA = settings.RatedResidualCurrentA,
            InstalledType = settings.InstalledProtection?.Type,
            Regime = settings.Regime,
            EvChargingPoint = settings.Ev,
            InstalledRdcDd = settings.InstalledProtection?.DcDetection == DcDetection.RdcDd,
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
