using System.CommandLine;
using System.Globalization;
using System.Text;
using Spectre.Console;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Results;
using WaveCheck.Core.Signal;

namespace WaveCheck.Cli.Commands;

/// <summary><c>wavecheck analyze FILE</c>: measures a capture and prints a summary; JSON and a per-window CSV on request.</summary>
internal static class AnalyzeCommand
{
    private static readonly (string Name, Func<WindowResult, double?> Value)[] CsvColumns =
    [
        ("startS", w => w.StartS), ("durationS", w => w.DurationS), ("frequencyHz", w => w.FrequencyHz),
        ("rmsA", w => w.RmsA), ("dcA", w => w.DcA), ("acRmsA", w => w.AcRmsA), ("peakPositiveA", w => w.PeakPositiveA),
        ("peakNegativeA", w => w.PeakNegativeA), ("crestFactor", w => w.CrestFactor), ("smoothDcA", w => w.SmoothDcA),
        ("pulsatingDc", w => w.PulsatingDc ? 1 : 0), ("currentDelayAngleDeg", w => w.CurrentDelayAngleDeg),
        ("mainsRmsA", w => w.MainsRmsA), ("belowMainsRmsA", w => w.BelowMainsRmsA), ("harmonicsRmsA", w => w.HarmonicsRmsA),
        ("above1kHzRmsA", w => w.Above1kHzRmsA), ("above9kHzRmsA", w => w.Above9kHzRmsA), ("thdPercent", w => w.ThdPercent),
        ("clipped", w => w.Clipped ? 1 : 0),
    ];

    public static Command Create()
    {
        var file = new Argument<string>("file") { Description = "Capture to analyse (WAV or CSV)." };
        var imports = new ImportOptionSet();
        var mains = new Option<string>("--mains")
        {
            Description = "Mains frequency: auto (find 50 or 60 Hz), 50, 60 or another frequency such as 400Hz; tracked within ±5 %.",
            DefaultValueFactory = _ => "auto",
        };
        var alarm = new Option<string?>("--alarm")
        {
            Description = "Record windows whose RMS exceeds this current, e.g. 30mA, and exit with code 1 if any does.",
        };
        var json = new Option<string?>("--json") { Description = "Write the full analysis as JSON to this file, or - for stdout." };
        var windowsCsv = new Option<string?>("--windows-csv") { Description = "Write one CSV row per 10/12-cycle window (SI units) to this file." };

        var command = new Command("analyze", "Measure a residual-current capture: RMS, DC, smooth DC, harmonics, bands, events.");
        command.Arguments.Add(file);
        imports.AddTo(command);
        command.Options.Add(mains);
        command.Options.Add(alarm);
        command.Options.Add(json);
        command.Options.Add(windowsCsv);
        command.SetAction(parse => CliRun.Guard(() =>
        {
            var import = imports.Read(parse);
            var mainsText = parse.GetValue(mains) ?? "auto";
            var options = new AnalysisOptions
            {
                MainsHz = mainsText.Trim().Equals("auto", StringComparison.OrdinalIgnoreCase)
                    ? null
                    : Quantity.ParseFrequencyHz("--mains", mainsText),
                AlarmA = parse.GetValue(alarm) is { } alarmText ? Quantity.ParseCurrentA("--alarm", alarmText) : null,
            };
            options.Validate();
            var jsonPath = parse.GetValue(json);
            var csvPath = parse.GetValue(windowsCsv);
            using var source = CaptureOpener.Open(parse.GetValue(file)!, import);
            var result = csvPath is null ? Analyzer.Analyze(source, options) : AnalyzeWithCsv(source, options, csvPath);
            if (jsonPath is not null)
            {
                ResultJson.Write(jsonPath, result);
            }

            if (jsonPath != "-")
            {
                Print(result);
            }

            return result.Events.Any(e => e.Kind == "alarm") ? CliRun.Finding : CliRun.Ok;
        }));
        return command;
    }

    /// <summary>Streams each window's row into the CSV as it completes; the file appears only when the run succeeds.</summary>
    private static AnalysisResult AnalyzeWithCsv(ICaptureSource source, AnalysisOptions options, string path)
    {
        AnalysisResult? result = null;
        AtomicFile.Write(path, stream =>
        {
            using var writer = new StreamWriter(stream, new UTF8Encoding(false), 1 << 16, leaveOpen: true);
            writer.WriteLine(string.Join(',', CsvColumns.Select(c => c.Name)));
            var row = new StringBuilder(256);
            result = Analyzer.Analyze(source, options with
            {
                WindowCompleted = w =>
                {
                    // Flags are 1/0, a figure not measured in the window (delay angle, THD) an empty cell.
                    row.Clear();
                    for (var i = 0; i < CsvColumns.Length; i++)
                    {
                        if (i > 0)
                        {
                            row.Append(',');
                        }

                        if (CsvColumns[i].Value(w) is { } v && double.IsFinite(v))
                        {
                            row.Append(v.ToString("G10", CultureInfo.InvariantCulture));
                        }
                    }

                    writer.WriteLine(row);
                },
            });
        });
        return result!;
    }

    private static void Print(AnalysisResult result)
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
        AnsiConsole.Write(table);
        foreach (var warning in result.Warnings)
        {
            AnsiConsole.MarkupLine($"[yellow]warning[/] {Markup.Escape(warning.Code)}: {Markup.Escape(warning.Message)}");
        }
    }
}
