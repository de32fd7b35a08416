using System.CommandLine;
using System.Globalization;
using System.Text;
using Spectre.Console;
using WaveCheck.Core;
using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Signal;
using WaveCheck.Rendering.Plots;
using WaveCheck.Rendering.Report;
using WaveCheck.Core.Model;
using WaveCheck.Core.Export;
using WaveCheck.Core.Text;

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
        var mains = new Option<string>("--mains")
        {
            Description = "Mains frequency: auto (find 50 or 60 Hz), 50, 60 or another frequency such as 400Hz; tracked within ±5 %.",
            DefaultValueFactory = _ => "auto",
        };
        var mainsAsGiven = new Option<bool>("--mains-as-given")
        {
            Description = "Keep the --mains frequency even where the capture's own mains content contradicts it (otherwise that stops with an error).",
        };
        var restBand = new Option<string?>("--rest-band")
        {
            Description = "Band above its floor within which the current counts as at rest, for the 150° test of pulsating DC (default 2mA; IEC 61008-1 allows 6 mA).",
        };
        var alarm = new Option<string?>("--alarm")
        {
            Description = "Record windows whose RMS exceeds this current as alarm events, e.g. 15mA (with --fail-on alarm: exit code 1).",
        };
        var json = new Option<string?>("--json") { Description = "Write the full analysis and assessment as JSON to this file, or - for stdout." };
        var touch = new Option<bool>("--touch") { Description = "Also print the IEC 60990 weighted touch-current readings and common limits (equipment testing)." };
        var windowsCsv = new Option<string?>("--windows-csv") { Description = "Write one CSV row per 10/12-cycle window (SI units) to this file." };

        var command = new Command("analyze",
            "Measure a residual-current capture and tell which RCD type it demands. Examples:\n" +
            "  wavecheck analyze fan.wav --scale 100mA --sensor dc --device A --rated 30mA --report fan.html\n" +
            "  wavecheck analyze log.csv --sum L1,L2,L3,N --rate 10kHz --alarm 15mA --json result.json");
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
        outputs.AddTo(command);
        outputs.AddIdentityTo(command);
        command.SetAction(parse => CliRun.Guard(run =>
        {
            var import = imports.Read(parse);
            var assessmentOptions = assessment.Read(parse);
            var mainsText = parse.GetValue(mains) ?? "auto";
            var options = new AnalysisOptions
            {
                MainsHz = mainsText.Trim().Equals("auto", StringComparison.OrdinalIgnoreCase)
                    ? null
                    : Quantity.ParseFrequencyHz("--mains", mainsText),
                KeepGivenMains = parse.GetValue(mainsAsGiven),
                RestBandA = parse.GetValue(restBand) is { } rb ? Quantity.ParsePositiveCurrentA("--rest-band", rb, bareUnit: "mA") : WaveformShape.DefaultRestBandA,
                AlarmA = parse.GetValue(alarm) is { } alarmText ? Quantity.ParseCurrentA("--alarm", alarmText, bareUnit: "mA") : null,
            };
            options.Validate();
            var plotFormat = outputs.ReadPlotFormat(parse);
            var failOn = outputs.ReadFailOn(parse);
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
            var evaluation = ProgressDisplay.Run(parse.GetValue(outputs.Quiet), $"analysing {Path.GetFileName(path)}", progress =>
                csvPath is null
                    ? Evaluation.Run(source, options, assessmentOptions, progress, token)
                    : EvaluateWithCsv(source, options, assessmentOptions, csvPath, progress, token));
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
                ResultJson.Write(jsonPath, result, token, Console.Out);
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
                    Console.Error.WriteLine(TerminalText.Clean($"PDF printed with {browser}: {pdfPath}"));
                }
            }

            if (jsonPath != "-")
            {
                var console = ConsoleOutput.Create();
                VerdictPrinter.Print(console, evaluation.Assessment, parse.GetValue(touch));
                Print(console, result);
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

    private static void Print(IAnsiConsole console, AnalysisResult result)
    {
        var s = result.Summary;
        var c = result.Components;
        var m = result.Mains;
        var table = new Table().Border(TableBorder.Rounded).Title(Markup.Escape(result.Capture.FilePath));
        table.AddColumn("quantity");
        table.AddColumn(new TableColumn("value").RightAligned());
        table.AddColumn("note");
        void Row(string name, string value, string note = "") =>
            table.AddRow(Markup.Escape(name), Markup.Escape(value), Markup.Escape(note));
        Row("RMS", CurrentText.WithUnit(s.RmsA), "true RMS, whole capture");
        Row("mean (DC)", CurrentText.WithUnit(s.DcA));
        Row("smooth DC", CurrentText.WithUnit(c.SmoothDcA), $"worst window {CurrentText.WithUnit(c.SmoothDcMaxA)}");
        Row("AC RMS", CurrentText.WithUnit(s.AcRmsA));
        Row("peak + / −", $"{CurrentText.Milliamps(s.PeakPositiveA)} / {CurrentText.Milliamps(s.PeakNegativeA)} mA",
            string.Create(CultureInfo.InvariantCulture, $"crest factor {s.CrestFactor:0.00}"));
        Row("mains", string.Create(CultureInfo.InvariantCulture, $"{m.FrequencyHz:0.000} Hz"),
            string.Create(CultureInfo.InvariantCulture, $"{m.Source}, {m.MinHz:0.000} to {m.MaxHz:0.000} Hz"));
        Row("fundamental", CurrentText.WithUnit(c.MainsRmsA), "harmonic group 1");
        Row("below mains", CurrentText.WithUnit(c.BelowMainsRmsA));
        Row("harmonics 2-50", CurrentText.WithUnit(c.HarmonicsRmsA),
            c.ThdPercent is { } thd ? string.Create(CultureInfo.InvariantCulture, $"THD {thd:0.0} %") : "no fundamental");
        Row("above 1 kHz", CurrentText.WithUnit(c.Above1kHzRmsA));
        Row("above 9 kHz", CurrentText.WithUnit(c.Above9kHzRmsA));
        Row("pulsating DC", c.PulsatingDc ? "yes" : "no",
            string.Create(CultureInfo.InvariantCulture, $"{c.PulsatingDcShare * 100:0} % of windows")
            + (c.CurrentDelayAngleDeg is { } angle ? string.Create(CultureInfo.InvariantCulture, $", delay angle {angle:0} °") : ""));
        foreach (var tone in c.Tones)
        {
            Row("tone", CurrentText.WithUnit(tone.RmsA), string.Create(CultureInfo.InvariantCulture, $"{tone.FrequencyHz:0.#} Hz"));
        }

        Row("windows", result.Windows.Count.ToString(CultureInfo.InvariantCulture),
            string.Create(CultureInfo.InvariantCulture, $"{result.Windows.CyclesPerWindow} cycles, {result.Events.Count} events"));
        console.Write(table);
        foreach (var warning in result.Warnings)
        {
            console.MarkupLine($"[yellow]warning[/] {Markup.Escape(warning.Code)}: {Markup.Escape(warning.Message)}");
        }
    }
}
