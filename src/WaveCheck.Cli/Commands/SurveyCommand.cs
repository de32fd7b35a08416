using System.CommandLine;
using System.Globalization;
using WaveCheck.Core;
using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Survey;
using WaveCheck.Core.Text;
using WaveCheck.Rendering;
using WaveCheck.Rendering.Report;

namespace WaveCheck.Cli.Commands;

/// <summary><c>wavecheck survey DIR|FILES... [--config site.json]</c>: many captures of a site, judged in parallel, one summary.</summary>
internal static class SurveyCommand
{
    /// <summary>File endings a folder is searched for.</summary>
    private static readonly string[] CaptureExtensions = [".wav", ".csv", ".tsv", ".txt", ".cfg", ".cff"];

    public static Command Create()
    {
        var paths = new Argument<string[]>("capture")
        {
            Description = "Capture files or folders of them. With --config the site file names the captures (relative to itself); a folder may still be given beside it, as in 'survey site/ --config site/site.json', but files may not.",
            Arity = ArgumentArity.ZeroOrMore,
        };
        var config = ValueOptions.Text("--config", "Site file (JSON) mapping captures to circuits, devices and upstream devices.", "FILE");
        var output = new Option<string>("--output", "-o") { Description = "Folder for the summary and reports.", HelpName = "DIR", DefaultValueFactory = _ => "wavecheck-survey" };
        var parquet = new Option<bool>("--parquet") { Description = "Also write captures.parquet and windows.parquet." };
        var quiet = new Option<bool>("--quiet", "-q") { Description = "No progress display." };
        var failOn = ValueOptions.Findings("--fail-on",
            "Exit with code 1 on: upgrade (an installed device not adequate; needs --device or devices in the site file), nuisance, error (a capture that could not be read); comma-separated.",
            ("upgrade", Finding.Upgrade), ("nuisance", Finding.Nuisance), ("error", Finding.Error));
        var rated = ValueOptions.Current("--rated", "IΔn for every capture, e.g. 30mA (overrides the site file).", positive: true);
        var device = ValueOptions.Device("--device", "Installed type for every capture: AC, A, F, B or B+, optionally with +RDC-DD (overrides the site file).");
        var sensor = ValueOptions.Choice("--sensor", "Sensor coupling for every capture: dc, ac or unknown (overrides the site file).", ValueOptions.SensorWords);
        var scale = ValueOptions.Current("--scale", "WAV full scale for every capture, e.g. 100mA (overrides the site file).", positive: true);
        var regime = ValueOptions.Choice("--regime", "iec or na for every capture (overrides the site file).", ValueOptions.RegimeWords);
        var pdf = ValueOptions.Text("--pdf",
            "Also print the index (circuits, remedial schedule, upstream checks) to this PDF file, outside --output, with a Chromium, Chrome or Edge found on this machine (headless).",
            "FILE");

        var command = new Command("survey",
            "Judge every capture of a site in parallel and write a summary (CSV, JSON, HTML index, reports). Examples:\n" +
            "  wavecheck survey samples --config samples/site.json -o survey\n" +
            "  wavecheck survey logs/ --device A --rated 30mA --sensor dc --parquet")
        {
            paths, config, output, parquet, quiet, failOn, rated, device, sensor, scale, regime, pdf,
        };
        command.SetAction(parse => CliRun.Guard(parse, run =>
        {
            var overrides = new CaptureSettingsPatch
            {
                RatedResidualCurrentA = parse.GetValue(rated),
                InstalledProtection = parse.GetValue(device),
                Sensor = parse.GetValue(sensor),
                ScaleA = parse.GetValue(scale),
                Regime = parse.GetValue(regime),
            };
            var fail = parse.GetValue(failOn) ?? Finding.None;
            var given = parse.GetValue(paths) ?? [];
            var configPath = parse.GetValue(config);
            if (configPath is not null && given.Length > 0 && !(given.Length == 1 && Directory.Exists(given[0])))
            {
                throw new OptionValueException("--config", configPath, "a site file alone (or beside the site's folder), or capture files without one: not both");
            }

            IReadOnlyList<SurveyJob> jobs;
            IReadOnlyList<UpstreamGroup> upstream = [];
            var site = "unnamed site";
            Func<SurveyJob, ReportIdentity>? identityOf = null;
            if (configPath is not null)
            {
                var siteConfig = SiteConfigReader.Read(configPath);
                identityOf = job => siteConfig.IdentityOf(job.File, job.Settings.Circuit);
                jobs = siteConfig.Jobs(overrides);
                upstream = siteConfig.Upstream;
                site = siteConfig.Site;
            }
            else
            {
                var files = ExpandPaths(given);
                var settings = overrides.ApplyTo(new CaptureSettings());
                jobs = [.. files.Select(f => new SurveyJob(f, settings with { Circuit = Path.GetFileNameWithoutExtension(f) }))];
            }

            if (fail.HasFlag(Finding.Upgrade) && !jobs.Any(j => j.Settings.InstalledProtection is not null))
            {
                throw new UserInputException(ReportOptionSet.UpgradeWithoutDevice + (configPath is null ? "" : " (or \"device\" in the site file)"));
            }

            foreach (var ratedA in jobs.Select(j => j.Settings.RatedResidualCurrentA).Distinct())
            {
                AssessmentOptionSet.WarnAboutRating(run.Terminal, ratedA);
            }

            var pdfPath = parse.GetValue(pdf);
            if (pdfPath is not null)
            {
                CheckPdf(pdfPath, parse.GetValue(output)!, jobs, configPath);
            }

            // Settings given as flags override the site file's: an error row names those by their flag.
            var onCommandLine = new HashSet<string>(
                new (bool Given, string Property)[]
                {
                    (overrides.RatedResidualCurrentA is not null, nameof(AssessmentOptions.RatedResidualCurrentA)),
                    (overrides.InstalledProtection is not null, nameof(AssessmentOptions.InstalledType)),
                    (overrides.Sensor is not null, nameof(ImportOptions.Sensor)),
                    (overrides.ScaleA is not null, nameof(ImportOptions.ScaleA)),
                    (overrides.Regime is not null, nameof(AssessmentOptions.Regime)),
                }.Where(s => s.Given).Select(s => s.Property), StringComparer.Ordinal);
            var document = Run(jobs, upstream, site, configPath, parse.GetValue(output)!, parse.GetValue(parquet), parse.GetValue(quiet), run,
                SettingFlags.ForSurvey(configPath is not null, onCommandLine), identityOf);
            if (pdfPath is not null)
            {
                var browser = PdfPrinter.Print(SurveyIndexWriter.Render(document), pdfPath, run.Token);
                run.Terminal.Error.WriteLine(TerminalText.Clean($"PDF printed with {browser}: {pdfPath}"));
            }

            return Exit(run.Terminal, document, fail);
        }));
        return command;
    }

    /// <summary>Before any work: a browser to print with, and a PDF path that replaces no input and lies outside the
    /// output folder (which a survey replaces as a whole, so a file of its own there would stop the next survey).</summary>
    private static void CheckPdf(string pdfPath, string outputDirectory, IReadOnlyList<SurveyJob> jobs, string? configPath)
    {
        if (PdfPrinter.FindBrowser() is null)
        {
            throw new UserInputException($"--pdf {pdfPath}: {PdfPrinter.InstallHint}");
        }

        var folder = Path.GetFullPath(outputDirectory) + Path.DirectorySeparatorChar;
        if (Path.GetFullPath(pdfPath).StartsWith(folder, StringComparison.Ordinal))
        {
            throw new OptionValueException("--pdf", pdfPath, $"a file outside --output {outputDirectory}, which each survey replaces as a whole");
        }

        var plan = new OutputPlan();
        foreach (var job in jobs)
        {
            plan.AddCapture(job.File);
        }

        if (configPath is not null)
        {
            plan.AddInput(configPath, "the site file");
        }

        plan.AddOutputFile(pdfPath, "--pdf");
        plan.Check();
    }

    /// <summary>Runs the survey with reports and the index; prints the summary. Shared with <c>demo</c>.</summary>
    internal static SurveyDocument Run(IReadOnlyList<SurveyJob> jobs, IReadOnlyList<UpstreamGroup> upstream, string site,
        string? siteFile, string outputDirectory, bool parquet, bool quiet, RunContext run, Func<string, string>? settingName = null,
        Func<SurveyJob, ReportIdentity>? identityOf = null)
    {
        run.Describe = () => $"nothing written: --output {outputDirectory} is as it was, and no temporary or staging files are left";
        var options = new SiteSurveyOptions
        {
            OutputDirectory = outputDirectory,
            OutputOption = "--output",
            SettingName = settingName ?? SettingFlags.ForSurvey(siteFile is not null, new HashSet<string>()),
            SiteFile = siteFile,
            Site = site,
            Parquet = parquet,
            WriteReport = (job, evaluation, path) =>
                ReportWriter.Write(path, evaluation.Analysis, evaluation.Assessment,
                    new ReportContext(site, job.Settings.Circuit, null, DateTimeOffset.Now, evaluation.Analysis.ToolVersion)
                    {
                        Identity = CaptureDigest.WithDigest(identityOf?.Invoke(job) ?? ReportIdentity.Empty, job.File, run.Token),
                    }),
            WriteIndex = (document, path) => SurveyIndexWriter.Write(path, document),
        };
        SurveyDocument document;
        try
        {
            document = ProgressDisplay.Run(run.Terminal, quiet, $"surveying {jobs.Count} captures", progress =>
                SiteSurvey.Run(jobs, upstream, options,
                    progress is null ? null : new SurveyProgress(done => progress.Report(done.Done / (double)Math.Max(1, done.Total))),
                    run.Token));
        }
        catch (OutputWriteException e)
        {
            throw new OutputWriteException(e.TargetPath, $"{e.Reason}; the survey was not written, --output {outputDirectory} is as it was", e);
        }

        run.Describe = () => $"every output written (--output {outputDirectory})";
        Print(new Screen(run.Terminal), document, outputDirectory);
        return document;
    }

    internal static int Exit(Terminal terminal, SurveyDocument document, Finding asked)
    {
        if (document.Rows.Count > 0 && document.Rows.All(r => r.Verdict == SurveyVerdict.Error))
        {
            CliRun.PrintError(terminal, $"survey: none of the {document.Rows.Count} captures could be read; first: {document.Rows[0].Error}");
            return CliRun.BadInput;
        }

        return (Findings.Of(document) & asked) != Finding.None ? CliRun.Finding : CliRun.Ok;
    }

    private static void Print(Screen screen, SurveyDocument document, string outputDirectory)
    {
        var table = new TextTable(document.Site, new("capture"), new("circuit"), new("installed"), new("required"), new("verdict"),
            new("RMS", Right: true), new("smooth DC", Right: true), new("> 1 kHz", Right: true), new("nuisance"));
        foreach (var row in document.Rows)
        {
            table.AddRow(
                Path.GetFileName(row.File),
                row.Circuit ?? "",
                row.InstalledType is { } i ? $"{i.ToTradeName()} {CurrentText.WithUnit(row.RatedResidualCurrentA)}" : "-",
                row.RequiredType?.ToTradeName() ?? (row.MinimumType is { } m ? $"at least {m.ToTradeName()}" : "-"),
                row.Verdict == SurveyVerdict.Error ? "error: " + row.Error : SurveyIndexWriter.VerdictLabel(row.Verdict),
                row.RmsA is { } rms ? CurrentText.WithUnit(rms) : "",
                row.SmoothDcA is { } dc ? CurrentText.WithUnit(dc) : "",
                row.Above1kHzRmsA is { } hf ? CurrentText.WithUnit(hf) : "",
                row.NuisanceRisk is { } risk ? VerdictText.Of(risk) : "");
        }

        screen.Table(table);
        CircuitSummary.Print(screen, document);
        foreach (var u in document.Upstream)
        {
            screen.Paragraph(string.Create(CultureInfo.InvariantCulture,
                $"upstream {u.Name} (type {u.DeviceType.ToTradeName()}, {CurrentText.WithUnit(u.RatedResidualCurrentA)}): leakage {VerdictText.Of(u.LeakageRisk)}: {u.LeakageExplanation}"), "", "  ");
            screen.Paragraph($"DC {VerdictText.Of(u.DcRisk)}: {u.DcExplanation}", "  ");
            screen.Paragraph($"type {VerdictText.Of(u.TypeRisk)}: {u.TypeExplanation}", "  ");
        }

        screen.Paragraph($"Summary: {Path.Combine(outputDirectory, "index.html")} (also survey.csv, survey.json, actions.csv, reports/)", "", "  ");
    }

    private static List<string> ExpandPaths(IReadOnlyList<string> given)
    {
        if (given.Count == 0)
        {
            throw new OptionValueException("survey", "", "capture files or folders, or --config site.json");
        }

        var files = new List<string>();
        foreach (var path in given)
        {
            if (Directory.Exists(path))
            {
                files.AddRange(Directory.EnumerateFiles(path)
                    .Where(f => CaptureExtensions.Contains(Path.GetExtension(f).ToLowerInvariant()))
                    .Order(StringComparer.Ordinal));
            }
            else
            {
                // Missing files become error rows, like any other capture that cannot be read.
                files.Add(path);
            }
        }

        if (files.Count == 0)
        {
            throw new CaptureFormatException(given[0], $"no capture files ({string.Join(", ", CaptureExtensions)}) found");
        }

        return files;
    }

    private sealed class SurveyProgress(Action<(int Done, int Total)> report) : IProgress<(int Done, int Total)>
    {
        public void Report((int Done, int Total) value) => report(value);
    }
}
