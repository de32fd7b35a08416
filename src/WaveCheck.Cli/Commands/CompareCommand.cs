using System.CommandLine;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Survey;
using WaveCheck.Rendering;

namespace WaveCheck.Cli.Commands;

/// <summary><c>wavecheck compare BEFORE AFTER [--html FILE]</c>: what changed per circuit between two results.</summary>
internal static class CompareCommand
{
    public static Command Create()
    {
        var before = new Argument<string>("before") { Description = "Earlier result: an analysis JSON file (analyze --json) or a survey folder (or its survey.json)." };
        var after = new Argument<string>("after") { Description = "Later result of the same kind." };
        var html = new Option<string?>("--html") { Description = "Also write the comparison as an HTML page." };
        var json = new Option<string?>("--json") { Description = "Also write the comparison as JSON (schema wavecheck.retest/1); - for stdout." };
        var command = new Command("compare",
            "What changed per circuit between two results, for a retest after a remedy or a yearly inspection. Examples:\n" +
            "  wavecheck compare survey-2025 survey-2026 --html retest.html\n" +
            "  wavecheck compare bay3-before.json bay3-after.json")
        {
            before, after, html, json,
        };
        command.SetAction(parse => CliRun.Guard(parse, run =>
        {
            var beforePath = parse.GetValue(before)!;
            var afterPath = parse.GetValue(after)!;
            var htmlPath = parse.GetValue(html);
            var jsonPath = parse.GetValue(json);
            var plan = new OutputPlan();
            foreach (var input in new[] { beforePath, afterPath })
            {
                plan.AddInput(Directory.Exists(input) ? Path.Combine(input, "survey.json") : input, "a compared result");
            }

            if (htmlPath is not null)
            {
                plan.AddOutputFile(htmlPath, "--html");
            }

            if (jsonPath is not null and not "-")
            {
                plan.AddOutputFile(jsonPath, "--json");
            }

            plan.Check();
            run.Plan = plan;
            var earlier = Retest.Load(beforePath);
            var later = Retest.Load(afterPath);
            if ((earlier.Site is null) != (later.Site is null))
            {
                throw new Core.UserInputException(
                    $"compare: {(earlier.Site is null ? beforePath : afterPath)} is an analysis and {(earlier.Site is null ? afterPath : beforePath)} a survey: compare two analyses or two surveys");
            }

            var comparison = Retest.Compare(earlier, later);
            if (htmlPath is not null)
            {
                RetestWriter.Write(htmlPath, comparison);
                plan.MarkWritten("--html");
            }

            if (jsonPath is not null)
            {
                ResultJson.Write(jsonPath, comparison, run.Token, run.Terminal.Out);
                plan.MarkWritten("--json");
            }

            if (jsonPath != "-")
            {
                Print(new Screen(run.Terminal), comparison);
            }

            return CliRun.Ok;
        }));
        return command;
    }

    private static void Print(Screen screen, RetestComparison comparison)
    {
        var table = new TextTable(comparison.Site is { } site ? $"Retest: {site}" : "Retest",
            new("circuit"), new("outcome"), new("required"), new("verdict"), new("worst-window RMS", Right: true),
            new("smooth DC", Right: true), new("nuisance margin", Right: true));
        foreach (var change in comparison.Circuits)
        {
            table.AddRow(
                change.Circuit + (change.Match == RetestMatch.File ? " (by file name)" : ""),
                RetestWriter.OutcomeLabel(change.Outcome),
                RetestWriter.Pair(change, c => c.RequiredType?.ToTradeName() ?? (c.MinimumType is { } m ? $"at least {m.ToTradeName()}" : "-")),
                RetestWriter.Pair(change, c => VerdictText.Of(c.Verdict)),
                RetestWriter.Pair(change, c => Amps(c.WorstWindowRmsA)),
                RetestWriter.Pair(change, c => Amps(c.SmoothDcA)),
                RetestWriter.Pair(change, c => Amps(c.NuisanceMarginA)));
        }

        screen.Table(table);
        foreach (var change in comparison.Circuits.Where(c => c.Outcome != RetestOutcome.Unchanged || c.Changes is not ["no change"]))
        {
            screen.Paragraph(string.Join("; ", change.Changes), change.Circuit + ": ", "  ");
        }

        screen.Paragraph(RetestWriter.Tally(comparison.Circuits));
    }

    private static string Amps(double? amperes) => amperes is { } a ? Core.Text.CurrentText.WithUnit(a) : "-";
}
