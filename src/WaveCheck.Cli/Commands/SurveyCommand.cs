using System.CommandLine;
using System.Globalization;
using Spectre.Console;
using WaveCheck.Core;
using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Survey;
using WaveCheck.Rendering;
using WaveCheck.Rendering.Report;
using WaveCheck.Core.Model;
using WaveCheck.Core.Export;
using WaveCheck.Core.Text;

namespace WaveCheck.Cli.Commands;

/// <summary><c>wavecheck survey DIR|FILES... [--config site.json]</c>: many captures of a site, judged in parallel, one summary.</summary>
internal static class SurveyCommand
{
    /// <summary>File endings a folder is searched for.</summary>
    private static readonly string[] CaptureExtensions = [".wav", ".csv", ".tsv", ".txt", ".cfg", ".cff"];

    public static Command Create()
    {
        var paths = new Argument<string[]>("capture") { Description = "Capture files or folders of them (not with --config).", Arity = ArgumentArity.ZeroOrMore };
        var config = new Option<string?>("--config") { Description = "Site file (JSON) mapping captures to circuits, devices and upstream devices." };
        var output = new Option<string>("--output", "-o") { Description = "Folder for the summary and reports.", DefaultValueFactory = _ => "wavecheck-survey" };
        var parquet = new Option<bool>("--parquet") { Description = "Also write captures.parquet and windows.parquet." };
        var quiet = new Option<bool>("--quiet", "-q") { Description = "No progress display." };
        var failOn = new Option<string?>("--fail-on") { Description = "Exit with code 1 on: upgrade, nuisance, error (a capture that could not be read); comma-separated." };
        var rated = new Option<string?>("--rated") { Description = "IΔn for every capture, e.g. 30mA (overrides the site file)." };
        var device = new Option<string?>("--device") { Description = "Installed type for every capture: AC, A, F, B or B+ (overrides the site file)." };
        var sensor = new Option<string?>("--sensor") { Description = "Sensor coupling for every capture: dc, ac or unknown (overrides the site file)." };
        var scale = new Option<string?>("--scale") { Description = "WAV full scale for every capture, e.g. 100mA (overrides the site file)." };
        var regime = new Option<string?>("--regime") { Description = "iec or na for every capture (overrides the site file)." };

        var command = new Command("survey",
            "Judge every capture of a site in parallel and write a summary (CSV, JSON, HTML index, reports). Examples:\n" +
            "  wavecheck survey samples --config samples/site.json -o survey\n" +
            "  wavecheck survey logs/ --device A --rated 30mA --sensor dc --parquet")
        {
            paths, config, output, parquet, quiet, failOn, rated, device, sensor, scale, regime,
        };
        command.SetAction(parse => CliRun.Guard(run =>
        {
            var overrides = new CaptureSettingsPatch
            {
                RatedResidualCurrentA = parse.GetValue(rated) is { } r ? Quantity.ParsePositiveCurrentA("--rated", r, bareUnit: "mA") : null,
                InstalledType = parse.GetValue(device) is { } d
                    ? DeviceTypeNames.TryParseProtection(d, out var t, out _) ? t : throw new OptionValueException("--device", d, "AC, A, F, B or B+, optionally with +RDC-DD")
                    : null,
                InstalledRdcDd = parse.GetValue(device) is { } dd && DeviceTypeNames.TryParseProtection(dd, out _, out var rdc) ? rdc : null,
                Sensor = parse.GetValue(sensor) is { } s ? SensorCouplingNames.Parse("--sensor", s) : null,
                ScaleA = parse.GetValue(scale) is { } sc ? Quantity.ParsePositiveCurrentA("--scale", sc) : null,
                Regime = parse.GetValue(regime) is { } rg
                    ? RegimeNames.TryParse(rg, out var parsedRegime) ? parsedRegime : throw new OptionValueException("--regime", rg, "iec or na")
                    : null,
            };
            var fail = ParseFailOn(parse.GetValue(failOn));
            var given = parse.GetValue(paths) ?? [];
            var configPath = parse.GetValue(config);
            if (configPath is not null && given.Length > 0 && !(given.Length == 1 && Directory.Exists(given[0])))
            {
                throw new OptionValueException("--config", configPath, "a site file alone, or capture files without one: not both");
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

            var document = Run(jobs, upstream, site, configPath, parse.GetValue(output)!, parse.GetValue(parquet), parse.GetValue(quiet), run, identityOf);
            return Exit(document, fail);
        }));
        return command;
    }

    /// <summary>Runs the survey with reports and the index; prints the summary. Shared with <c>demo</c>.</summary>
    internal static SurveyDocument Run(IReadOnlyList<SurveyJob> jobs, IReadOnlyList<UpstreamGroup> upstream, string site,
        string? siteFile, string outputDirectory, bool parquet, bool quiet, RunContext run, Func<SurveyJob, ReportIdentity>? identityOf = null)
    {
        run.Describe = () => $"nothing written: --output {outputDirectory} is as it was, and no temporary or staging files are left";
        var options = new SiteSurveyOptions
        {
            OutputDirectory = outputDirectory,
            OutputOption = "--output",
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
            document = ProgressDisplay.Run(quiet, $"surveying {jobs.Count} captures", progress =>
                SiteSurvey.Run(jobs, upstream, options,
                    progress is null ? null : new SurveyProgress(done => progress.Report(done.Done / (double)Math.Max(1, done.Total))),
                    run.Token));
        }
        catch (OutputWriteException e)
        {
            throw new OutputWriteException(e.TargetPath, $"{e.Reason}; the survey was not written, --output {outputDirectory} is as it was", e);
        }

        run.Describe = () => $"every output written (--output {outputDirectory})";
        Print(ConsoleOutput.Create(), document, outputDirectory);
        return document;
    }

    internal static int Exit(SurveyDocument document, (bool Upgrade, bool Nuisance, bool Error) fail)
    {
        if (document.Rows.Count > 0 && document.Rows.All(r => r.Verdict == SurveyVerdict.Error))
        {
            CliRun.PrintError($"survey: none of the {document.Rows.Count} captures could be read; first: {document.Rows[0].Error}");
            return CliRun.BadInput;
        }

        var asked = (fail.Upgrade ? Finding.Upgrade : Finding.None) | (fail.Nuisance ? Finding.Nuisance : Finding.None)
            | (fail.Error ? Finding.Error : Finding.None);
        return (Findings.Of(document) & asked) != Finding.None ? CliRun.Finding : CliRun.Ok;
    }

    private static void Print(IAnsiConsole console, SurveyDocument document, string outputDirectory)
    {
        var plain = ConsoleOutput.Plain;
        var table = new Table().Border(plain ? TableBorder.Ascii : TableBorder.Rounded).Title(Markup.Escape(document.Site));
        foreach (var column in new[] { "capture", "circuit", "installed", "required", "verdict", "RMS", "smooth DC", "> 1 kHz", "nuisance" })
        {
            table.AddColumn(column);
        }

        foreach (var row in document.Rows)
        {
            table.AddRow(
                new Text(Path.GetFileName(row.File)),
                new Text(row.Circuit ?? ""),
                new Text(row.InstalledType is { } i ? $"{i} {CurrentText.WithUnit(row.RatedResidualCurrentA)}" : "-"),
                new Text(row.RequiredType?.ToTradeName() ?? (row.MinimumType is { } m ? $"≥ {m.ToTradeName()}?" : "-")),
                new Text(row.Verdict == SurveyVerdict.Error ? "error: " + row.Error : SurveyIndexWriter.VerdictLabel(row.Verdict)),
                new Text(row.RmsA is { } rms ? CurrentText.WithUnit(rms) : ""),
                new Text(row.SmoothDcA is { } dc ? CurrentText.WithUnit(dc) : ""),
                new Text(row.Above1kHzRmsA is { } hf ? CurrentText.WithUnit(hf) : ""),
                new Text(row.NuisanceRisk is { } risk ? VerdictText.Of(risk) : ""));
        }

        console.Write(table);
        foreach (var u in document.Upstream)
        {
            console.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"upstream {u.Name} (type {u.DeviceType.ToTradeName()}, {CurrentText.WithUnit(u.RatedResidualCurrentA)}): leakage {VerdictText.Of(u.LeakageRisk)}: {u.LeakageExplanation}"));
            console.WriteLine($"  DC {VerdictText.Of(u.DcRisk)}: {u.DcExplanation}");
            console.WriteLine($"  type {VerdictText.Of(u.TypeRisk)}: {u.TypeExplanation}");
        }

        console.WriteLine($"Summary: {Path.Combine(outputDirectory, "index.html")} (also survey.csv, survey.json, reports/)");
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

    private static (bool Upgrade, bool Nuisance, bool Error) ParseFailOn(string? text)
    {
        var result = (Upgrade: false, Nuisance: false, Error: false);
        foreach (var word in (text ?? "").Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries))
        {
            switch (word.ToLowerInvariant())
            {
                case "upgrade": result.Upgrade = true; break;
                case "nuisance": result.Nuisance = true; break;
                case "error": result.Error = true; break;
                default: throw new OptionValueException("--fail-on", text!, "upgrade, nuisance and/or error, comma-separated");
            }
        }

        return result;
    }


    private sealed class SurveyProgress(Action<(int Done, int Total)> report) : IProgress<(int Done, int Total)>
    {
        public void Report((int Done, int Total) value) => report(value);
    }
}
