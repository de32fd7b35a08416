using System.CommandLine;
using System.Globalization;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Cli.Commands;

/// <summary><c>wavecheck info FILE</c>: what a capture holds and whether it can be trusted, without analysing it.</summary>
internal static class InfoCommand
{
    public static Command Create()
    {
        var file = new Argument<string>("file") { Description = "Capture file: WAV, CSV/TXT/TSV, or COMTRADE .cfg/.cff." };
        var json = ValueOptions.Text("--json", "Also write the facts as JSON to this file, or '-' for stdout (then no table).", "FILE|-");
        var import = new ImportOptionSet();
        var command = new Command("info",
            "Show a capture's format, channels, rate, calibration, range and warnings. Examples:\n" +
            "  wavecheck info clamp.wav --sensitivity \"10 mV/mA\" --range \"1 V\" --sensor dc\n" +
            "  wavecheck info logger.csv --sum L1,L2,L3,N --json -");
        command.Arguments.Add(file);
        command.Options.Add(json);
        import.AddTo(command);
        command.SetAction(parse => CliRun.Guard(parse, run =>
        {
            var options = import.Read(parse) with { DescribeOnly = true };
            var path = parse.GetValue(file)!;
            var jsonPath = parse.GetValue(json);
            var plan = new OutputPlan();
            plan.AddCapture(path);
            if (jsonPath is not null and not "-")
            {
                plan.AddOutputFile(jsonPath, "--json");
            }

            plan.Check();
            run.Plan = plan;
            using var source = CaptureOpener.Open(path, options);
            var scan = CaptureScan.Run(source, options.BandOfInterestHz);
            var info = source.Info.InWords(SettingFlags.Of);
            List<CaptureWarning> warnings = [.. source.Warnings.Concat(scan.Warnings).Select(w => w.InWords(SettingFlags.Of))];
            if (jsonPath is not null)
            {
                ResultJson.Write(jsonPath, new InfoReport("wavecheck.info/1", info, scan.Channels, warnings),
                    ResultJson.TypeInfo<InfoReport>(CliJsonContext.Default), run.Token, run.Terminal.Out);
                plan.MarkWritten("--json");
                if (jsonPath == "-")
                {
                    return CliRun.Ok;
                }
            }

            Print(new Screen(run.Terminal), info, scan, warnings);
            return CliRun.Ok;
        }));
        return command;
    }

    private static void Print(Screen screen, CaptureInfo info, CaptureScanResult scan, List<CaptureWarning> warnings)
    {
        var facts = new TextTable(info.FilePath, new("capture"), new("value"));
        void Row(string name, string value) => facts.AddRow(name, value);

        Row("format", info.Format);
        Row("encoding", info.Encoding);
        Row("channels", string.Join(", ", info.Channels.Select(c => $"{c.Name} [{c.SourceUnit}]")));
        Row("residual current", info.ResidualSource);
        Row("sample rate", Hz(info.SampleRateHz) + (info.MeasuredSampleRateHz is { } m ? $" (measured {Hz(m)})" : " (stated by the file)"));
        Row("samples", info.SampleCount.ToString("N0", CultureInfo.InvariantCulture) + (info.SampleCountExact ? "" : " (estimate)"));
        Row("duration", string.Create(CultureInfo.InvariantCulture, $"{info.DurationS:0.######} s"));
        Row("Nyquist", Hz(info.NyquistHz));
        Row("start", info.StartTime?.ToString("yyyy-MM-dd HH:mm:ss.ffffff zzz", CultureInfo.InvariantCulture) ?? "not stated in the file");
        if (info.TriggerTime is { } trigger)
        {
            var offset = info.TriggerOffsetS is { } s ? string.Create(CultureInfo.InvariantCulture, $" ({s:0.######} s after the start)") : "";
            Row("trigger", trigger.ToString("yyyy-MM-dd HH:mm:ss.ffffff zzz", CultureInfo.InvariantCulture) + offset);
        }
        Row("scale", string.Create(CultureInfo.InvariantCulture, $"{info.Calibration.ScaleA:G6} A per stored unit: {info.Calibration.Source}"));
        Row("full scale", info.FullScaleA is { } fs ? CurrentText.WithUnit(fs) : "not known");
        Row("sensor coupling", info.SensorCoupling.ToString().ToLowerInvariant());
        var gaps = warnings.Count(w => w.Code == "time-gap");
        Row("time gaps", gaps == 0 ? "none found" : $"{gaps} warning{(gaps == 1 ? "" : "s")}, see below");
        screen.Table(facts);

        var channels = new TextTable(null, new("channel"), new("unit"), new("min", Right: true), new("max", Right: true),
            new("mean", Right: true), new("clipped"));

        foreach (var s in scan.Channels)
        {
            var clipped = s.ClippedSamples == 0
                ? "no"
                : string.Create(CultureInfo.InvariantCulture, $"{s.ClippedSamples} ({100 * s.ClippedShare:0.###} %) from {s.FirstClipS:0.######} s");
            channels.AddRow(s.Name, s.Unit == "A" ? "mA" : s.Unit, Value(s.MinSi, s.Unit), Value(s.MaxSi, s.Unit),
                Value(s.MeanSi, s.Unit), clipped);
        }

        screen.Table(channels);
        if (warnings.Count == 0)
        {
            screen.Paragraph("No warnings.");
            return;
        }

        screen.Paragraph("Warnings:");
        foreach (var w in warnings)
        {
            screen.Paragraph(w.Message, $"  [{w.Code}] ", "    ");
        }
    }

    /// <summary>A channel statistic for the table: currents in mA, anything else as a plain number.</summary>
    private static string Value(double si, string unit) =>
        unit == "A" ? CurrentText.Milliamps(si) : si.ToString("G4", CultureInfo.InvariantCulture);

    private static string Hz(double hz) => string.Create(CultureInfo.InvariantCulture, $"{hz:G7} Hz");

    /// <summary>The JSON form of <c>info</c>.</summary>
    internal sealed record InfoReport(string Schema, CaptureInfo Capture, IReadOnlyList<ChannelStats> Channels,
        IReadOnlyList<CaptureWarning> Warnings);
}
