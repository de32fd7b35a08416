using System.Globalization;
using Spectre.Console;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Cli;

/// <summary>Prints an assessment for a person: the verdict first, then the type table, margins and cautions.</summary>
internal static class VerdictPrinter
{
    public static void Print(IAnsiConsole console, AssessmentResult a, bool showTouchCurrent)
    {
        var plain = ConsoleOutput.Plain;
        console.WriteLine();
        console.Write(new Text("VERDICT  ", new Style(decoration: Decoration.Bold)));
        console.WriteLine(a.Headline);
        if (a.InstalledType is { } installed)
        {
            console.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"Installed {a.InstalledProtection ?? "type " + installed.ToTradeName()}, IΔn {CurrentText.WithUnit(a.RatedResidualCurrentA)}: {Adequacy(a.InstalledAdequate)}"));
        }

        if (a.Blinding.Blinded == true)
        {
            console.Write(new Panel(new Text("BLINDING: " + a.Blinding.Explanation))
                .Border(plain ? BoxBorder.Ascii : BoxBorder.Heavy));
        }

        var types = new Table().Border(plain ? TableBorder.Ascii : TableBorder.Rounded).Title("Device types");
        types.AddColumn("type");
        types.AddColumn("verdict");
        types.AddColumn("evidence");
        foreach (var t in a.Types)
        {
            types.AddRow(new Text(t.Type.ToTradeName()), new Text(Suitability(t.Suitable)), new Text(string.Join("\n", t.Reasons)));
        }

        console.Write(types);

        var n = a.NuisanceTrip;
        var margins = new Table().Border(plain ? TableBorder.Ascii : TableBorder.Rounded)
            .Title(string.Create(CultureInfo.InvariantCulture, $"Margins for type {n.DeviceType.ToTradeName()}, IΔn {CurrentText.WithUnit(a.RatedResidualCurrentA)}"));
        margins.AddColumn("check");
        margins.AddColumn(new TableColumn("figure").RightAligned());
        margins.AddColumn("finding");
        margins.AddRow(new Text("nuisance tripping"),
            new Text($"{CurrentText.WithUnit(n.StandingA)} of {CurrentText.WithUnit(n.NonOperatingLimitA)}"),
            new Text(string.Create(CultureInfo.InvariantCulture,
                $"risk {VerdictText.Of(n.Risk)}: margin {CurrentText.WithUnit(n.MarginA)} ({n.MarginPercent:0} %). {n.Explanation}")));
        margins.AddRow(new Text($"leakage budget {a.LeakageBudgetText()}"), new Text(CurrentText.WithUnit(n.LeakageBudgetA)),
            new Text(n.WithinLeakageBudget ? "within" : "exceeded"));
        margins.AddRow(new Text("DC blinding"),
            new Text(a.Blinding.ToleranceA is { } tol
                ? $"{CurrentText.WithUnit(a.Blinding.SmoothDcA)} of {CurrentText.WithUnit(tol)}"
                : CurrentText.WithUnit(a.Blinding.SmoothDcA)),
            new Text(a.Blinding.Explanation));
        margins.AddRow(new Text($"EV charging (RDC-DD {CurrentText.WithUnit(a.EvCharging.RdcDdThresholdA)})"), new Text(CurrentText.WithUnit(a.EvCharging.SmoothDcA)),
            new Text(a.EvCharging.Recommendation));
        if (a.Gfci is { } g)
        {
            margins.AddRow(new Text("UL 943 Class A GFCI"), new Text(CurrentText.WithUnit(g.StandingRmsA)),
                new Text(Gfci(g.ClassATripsAlone, g.ClassATripTimeS)));
            margins.AddRow(new Text("UL 943C special purpose"), new Text(CurrentText.WithUnit(g.StandingRmsA)),
                new Text(Gfci(g.SpecialPurposeTripsAlone, g.SpecialPurposeTripTimeS)));
        }

        console.Write(margins);
        if (showTouchCurrent && a.TouchCurrent is { } tc)
        {
            var r = tc.Readings;
            var touch = new Table().Border(plain ? TableBorder.Ascii : TableBorder.Rounded)
                .Title("Touch current (IEC 60990 networks, recorded current taken as the current through the network)");
            touch.AddColumn("reading");
            touch.AddColumn(new TableColumn("value").RightAligned());
            touch.AddColumn("against");
            touch.AddRow(new Text("unweighted RMS / peak"), new Text($"{CurrentText.Milliamps(r.UnweightedRmsA)} / {CurrentText.WithUnit(r.UnweightedPeakA)}"), new Text(""));
            touch.AddRow(new Text("perception/reaction RMS / peak"), new Text($"{CurrentText.Milliamps(r.PerceptionRmsA)} / {CurrentText.WithUnit(r.PerceptionPeakA)}"), new Text(""));
            touch.AddRow(new Text("let-go RMS / peak"), new Text($"{CurrentText.Milliamps(r.LetGoRmsA)} / {CurrentText.WithUnit(r.LetGoPeakA)}"), new Text(""));
            touch.AddRow(new Text("DC"), new Text(CurrentText.WithUnit(r.DcA)), new Text(""));
            foreach (var c in tc.Comparisons)
            {
                touch.AddRow(new Text(c.Reading), new Text($"{CurrentText.WithUnit(c.ValueA)} of {CurrentText.WithUnit(c.LimitA)}"),
                    new Text($"{(c.Within ? "within" : "ABOVE")} {c.Limit} ({c.Source})"));
            }

            console.Write(touch);
        }

        console.WriteLine("Cautions:");
        foreach (var caution in a.Cautions)
        {
            console.WriteLine("  - " + caution);
        }
    }

    public static string Suitability(bool? suitable) => suitable switch
    {
        true => Symbol("✔", "+") + " suitable",
        false => Symbol("✘", "x") + " not suitable",
        null => "? cannot be determined",
    };

    private static string Adequacy(bool? adequate) => adequate switch
    {
        true => "adequate",
        false => "NOT adequate",
        null => "cannot be determined from this capture",
    };

    private static string Gfci(bool? trips, double? timeS) => trips switch
    {
        true => string.Create(CultureInfo.InvariantCulture, $"standing leakage alone trips it{(timeS is { } t ? $" in about {t:0.###} s" : "")}"),
        false => "standing leakage alone does not trip it",
        null => "may trip (between the must-not-trip and must-trip levels)",
    };

    private static string Symbol(string symbol, string ascii) => ConsoleOutput.Plain ? ascii : symbol;
}
