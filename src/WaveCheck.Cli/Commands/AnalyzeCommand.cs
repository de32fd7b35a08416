using System.CommandLine;
using System.Globalization;
using System.Text;
using Spectre.Console;
using WaveCheck.Core;
using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;
using WaveCheck.Core.Text;
using WaveCheck.Rendering.Plots;
using WaveCheck.Rendering.Report;

namespace WaveCheck.Cli.Commands;

/// <summary><c>wavecheck analyze FILE</c>: measures a capture and prints a summary; JSON and a per-window CSV on request.</summary>
internal static class AnalyzeCommand
{
    public static Command Create()
    {
        var file = new Argument<string>("file") { Description = "Capture to analyse (WAV, CSV, or COMTRADE .cfg/.cff)." };
        var imports = new ImportOptionSet();
        var assessment = new AssessmentOptionSet();
        var outputs = new ReportOptionSet();
        var mains = ValueOptions.FrequencyOrAuto("--mains",
            "Mains frequency: auto (find 50 or 60 Hz), 50Hz, 60Hz or another frequency such as 400Hz; tracked within ±5 % (default auto).");
        var mainsAsGiven = new Option<bool>("--mains-as-given")
        {
            Description = "Keep the --mains frequency even where the capture's own mains content contradicts it (otherwise that stops with an error).",
        };
        var restBand = ValueOptions.Current("--rest-band",
            $"Band above its floor within which the current counts as at rest, for the 150° test of pulsating DC (default {Quantity.CurrentAsTyped(WaveformShape.DefaultRestBandA)}; IEC 61008-1 allows 6 mA).",
            positive: true);
        var alarm = ValueOptions.Current("--alarm",
            "Record windows whose RMS exceeds this current as alarm events, e.g. 15mA (with --fail-on alarm: exit code 1).");
        var json = ValueOptions.Text("--json", "Write the full analysis and assessment as JSON to this file, or - for stdout.", "FILE|-");
        var touch = new Option<bool>("--touch") { Description = "Also print the IEC 60990 weighted touch-current readings and common limits (equipment testing)." };
        var windowsCsv = ValueOptions.Text("--windows-csv", "Write one CSV row per 10/12-cycle window (SI units) to this file.", "FILE");
        var details = new Option<bool>("--details") { Description = "Print the full tables (evidence per type, margins with explanations, measurements) and every caution, not only the first screen." };

        var command = new Command("analyze",
            "Measure a residual-current capture and tell which RCD type it demands. Examples:\n" +
            "  wavecheck analyze fan.wav --scale 100mA --sensor dc --device A --rated 30mA --report fan.html\n" +
            "  wavecheck analyze log.csv --sum L1,L2,L3,N --rate 10kHz --alarm 15mA --json result.json");
        command.Aliases.Add("analyse");
        command.Arguments.Add(file);
        imports.AddTo(command);
        assessment.AddTo(command);
        command.Options.Add(mains);
        command.Options.Add(mainsAsGiven);
        command.Options.Add(restBand);
        command.Options.Add(alarm);
        command.Options.Add(json);
        command.Options.Add(windowsCsv);
        command.Options.Add(touch);
        command.Options.Add(details);
        outputs.AddTo(command);
        outputs.AddIdentityTo(command);
        command.SetAction(parse => CliRun.Guard(parse, run =>
        {
            var import = imports.Read(parse);
            var assessmentOptions = assessment.Read(parse);
            AssessmentOptionSet.WarnAboutRating(run.Terminal, assessmentOptions.RatedResidualCurrentA);
            var options = new AnalysisOptions
            {
                MainsHz = parse.GetValue(mains),
                KeepGivenMains = parse.GetValue(mainsAsGiven),
                RestBandA = parse.GetValue(restBand) ?? WaveformShape.DefaultRestBandA,
                AlarmA = parse.GetValue(alarm),
            };
            options.Validate();
            var plotFormat = outputs.ReadPlotFormat(parse);
            var failOn = outputs.ReadFailOn(parse, deviceGiven: assessmentOptions.InstalledType is not null);
            var jsonPath = parse.GetValue(json);
            var csvPath = parse.GetValue(windowsCsv);
            var plotsDir = parse.GetValue(outputs.Plots);
            var reportPath = parse.GetValue(outputs.Report);
            var pdfPath = parse.GetValue(outputs.Pdf);
            var path = parse.GetValue(file)!;

            var plan = new OutputPlan();
            plan.AddCapture(path);
            if (jsonPath is not null and not "-")
            {
                plan.AddOutputFile(jsonPath, "--json");
            }

            if (csvPath is not null)
            {
                plan.AddOutputFile(csvPath, "--windows-csv");
            }

            if (plotsDir is not null)
            {
                plan.AddOutputFolder(plotsDir, "--plots", Enum.GetValues<PlotKind>().Select(k => PlotRenderer.FileName(k, plotFormat)));
            }

            if (reportPath is not null)
            {
                plan.AddOutputFile(reportPath, "--report");
            }

            if (pdfPath is not null)
            {
                plan.AddOutputFile(pdfPath, "--pdf");
            }

            plan.Check();
            if (pdfPath is not null && PdfPrinter.FindBrowser() is null)
            {
                // Said before the analysis, so that nothing is written for a run that cannot finish.
                throw new UserInputException($"--pdf {pdfPath}: {PdfPrinter.InstallHint}");
            }

            run.Plan = plan;
            var token = run.Token;

            using var source = CaptureOpener.Open(path, import);
            var evaluation = ProgressDisplay.Run(run.Terminal, parse.GetValue(outputs.Quiet), $"analysing {Path.GetFileName(path)}", progress =>
                csvPath is null
                    ? Evaluation.Run(source, options, assessmentOptions, progress, token)
                    : EvaluateWithCsv(source, options, assessmentOptions, csvPath, progress, token))
                .InWords(SettingFlags.Of);
            if (csvPath is not null)
            {
                plan.MarkWritten("--windows-csv");
            }

            // The report's identity travels into the JSON too, with the capture's digest, so a filed report and its
            // analysis can be matched to the capture.
            var result = jsonPath is null && reportPath is null && pdfPath is null
                ? evaluation.Analysis
                : evaluation.Analysis with { Identity = CaptureDigest.WithDigest(outputs.ReadIdentity(parse), path, token) };
            if (jsonPath is not null)
            {
                ResultJson.Write(jsonPath, result, token, run.Terminal.Out);
                plan.MarkWritten("--json");
            }

            if (plotsDir is not null)
            {
                token.ThrowIfCancellationRequested();
                PlotRenderer.WriteAll(result, evaluation.Assessment, plotsDir, plotFormat);
                plan.MarkWritten("--plots");
            }

            if (reportPath is not null || pdfPath is not null)
            {
                token.ThrowIfCancellationRequested();
                var html = ReportWriter.Render(result, evaluation.Assessment, new ReportContext(
                    parse.GetValue(outputs.Site), parse.GetValue(outputs.Circuit), parse.GetValue(outputs.Note),
                    DateTimeOffset.Now, result.ToolVersion)
                { Identity = result.Identity!, Paper = parse.GetValue(outputs.Paper) });
                if (reportPath is not null)
                {
                    AtomicFile.WriteText(reportPath, html, token);
                    plan.MarkWritten("--report");
                }

                if (pdfPath is not null)
                {
                    var browser = PdfPrinter.Print(html, pdfPath, token);
                    plan.MarkWritten("--pdf");
                    run.Terminal.Error.WriteLine(TerminalText.Clean($"PDF printed with {browser}: {pdfPath}"));
                }
            }

            if (jsonPath != "-")
            {
                List<AnalysisPrinter.Written> written = [];
                foreach (var (what, where) in new[] { ("report", reportPath), ("JSON", jsonPath), ("plots", plotsDir), ("windows", csvPath) })
                {
                    if (where is not null)
                    {
                        written.Add(new(what, where));
                    }
                }

                AnalysisPrinter.Print(new Screen(run.Terminal), result, evaluation.Assessment, parse.GetValue(details),
                    parse.GetValue(touch), assessmentOptions.EvChargingPoint, written);
            }

            return Exit(evaluation, failOn);
        }));
        return command;
    }

    /// <summary>Exit code 1 only for the findings the user asked to fail on.</summary>
    internal static int Exit(Evaluation evaluation, FailOnFindings failOn)
    {
        return (Findings.Of(evaluation.Analysis) & (Finding)failOn) != Finding.None ? CliRun.Finding : CliRun.Ok;
    }

    /// <summary>Streams each window's row into the CSV as it completes; the file appears only when the run succeeds.</summary>
    private static Evaluation EvaluateWithCsv(ICaptureSource source, AnalysisOptions options,
        AssessmentOptions assessmentOptions, string path, IProgress<double>? progress, CancellationToken token)
    {
        Evaluation? result = null;
        AtomicFile.Write(path, stream =>
        {
            using var writer = new StreamWriter(stream, new UTF8Encoding(false), 1 << 16, leaveOpen: true);
            writer.WriteLine(WindowTable.CsvHeader);
            result = Evaluation.Run(source, options with
            {
                WindowCompleted = w => writer.WriteLine(WindowTable.CsvLine(w)),
            }, assessmentOptions, progress, token);
        }, token);
        return result!;
    }
}
