using System.Globalization;
using Spectre.Console;
using WaveCheck.Core.Assessment;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Cli;

/// <summary>
/// Prints an assessment for a person: the verdict, one line per device type, one per margin and the first cautions
/// for the first screen; the full tables for <c>--details</c>. Evidence shared by several types is said once.
/// Verdicts are words (<c>suitable</c>, <c>NOT suitable</c>, <c>open</c>), never a sign that could be read as part of
/// a type's name such as B+.
/// </summary>
internal static class VerdictPrinter
{
    /// <summary>Width of the labels in the left margin of the summary.</summary>
    public const string Indent = "          ";

    /// <summary>Cautions on the first screen; the rest with <c>--details</c> and in the report.</summary>
    public const int SummaryCautions = 3;

    private static readonly Style? Bold = new(decoration: Decoration.Bold);
    private static readonly Style? Bad = new(Color.Red, decoration: Decoration.Bold);
    private static readonly Style? Good = new(Color.Green);
    private static readonly Style? Open = new(Color.Yellow);

    /// <summary>The verdict (in full with its reasons for <c>--details</c>, else its lead: the type lines below give the
    /// reasons), and the installed device's adequacy.</summary>
    public static void Verdict(Screen screen, AssessmentResult a, bool full = true)
    {
        screen.Paragraph(full ? a.Headline : Lead(a), Label("VERDICT"), labelStyle: Bold);
        if (a.InstalledType is not null)
        {
            screen.Paragraph(Installed(a), Label("Installed"), style: AdequacyStyle(a.InstalledAdequate), labelStyle: Bold);
        }
    }

    /// <summary>The verdict without its reasons: the headline's lead, and the least type when the verdict is open.</summary>
    private static string Lead(AssessmentResult a)
    {
        var lead = a.Headline.Split(": ", 2)[0];
        return a.RequiredType is null ? lead + $"; at least type {a.MinimumType.ToTradeName()}" : lead;
    }

    /// <summary>The verdict in one line, for the last line of the output.</summary>
    public static void LastLine(Screen screen, AssessmentResult a)
    {
        var lead = Lead(a);
        var installed = a.InstalledType is null ? "" : "; installed " + Installed(a);
        screen.Paragraph(lead + installed, Label("VERDICT"), labelStyle: Bold);
    }

    /// <summary>One line per device type: its verdict and the classes of residual current it rests on, cut at a word
    /// with an ellipsis where they do not fit (the full evidence is in <see cref="Tables"/>); "as X" where a type's
    /// evidence is that of an earlier type.</summary>
    public static void TypeLines(Screen screen, AssessmentResult a)
    {
        foreach (var (t, index) in a.Types.Select((t, i) => (t, i)))
        {
            var same = a.Types.Take(index).FirstOrDefault(e => e.Suitable == t.Suitable && e.Reasons.SequenceEqual(t.Reasons));
            var evidence = same is not null ? "as " + same.Type.ToTradeName() : string.Join("; ", ShortReasons(t));
            var label = index == 0 ? Label("Types") : Indent;
            var verdict = SuitabilityWord(t.Suitable).PadRight(14);
            var room = screen.Width - label.Length - 4 - verdict.Length;
            screen.Write([(label, Bold), (t.Type.ToTradeName().PadRight(4), Bold), (verdict, SuitabilityStyle(t.Suitable)),
                (Shorten(evidence, room, screen.Plain ? "..." : "…"), null)]);
        }
    }

    /// <summary><paramref name="text"/> if it fits in <paramref name="room"/> columns, else as many whole words as fit
    /// before <paramref name="ellipsis"/>.</summary>
    internal static string Shorten(string text, int room, string ellipsis)
    {
        if (text.Length <= room)
        {
            return text;
        }

        var cut = room - ellipsis.Length;
        while (cut > 0 && !(text[cut] == ' ' && text[cut - 1] != ' '))
        {
            cut--;
        }

        return cut <= 0 ? (room >= ellipsis.Length ? ellipsis : "") : text[..cut].TrimEnd(';', ',', ':', ' ') + ellipsis;
    }

    /// <summary>One line per margin for the device assessed: nuisance tripping, leakage budget, DC blinding, and the
    /// RDC-DD threshold for a charging point. The device is named on the first line when none was installed.</summary>
    public static void MarginLines(Screen screen, AssessmentResult a, bool chargingPoint)
    {
        var n = a.NuisanceTrip;
        var label = Label("Margins");
        if (a.InstalledType is null)
        {
            screen.Paragraph(string.Create(CultureInfo.InvariantCulture, $"for type {n.DeviceType.ToTradeName()}, IΔn {Ma(a.RatedResidualCurrentA)}"), label, labelStyle: Bold);
            label = Indent;
        }

        Margin(screen, label, "nuisance", string.Create(CultureInfo.InvariantCulture,
            $"risk {VerdictText.Of(n.Risk)}: {Ma(n.StandingA)} of {Ma(n.NonOperatingLimitA)} ({a.NonOperatingLimitText()}), margin {n.MarginPercent:0} %"),
            n.Risk == RiskLevel.Low ? Good : n.Risk == RiskLevel.Likely ? Bad : Open);
        Margin(screen, Indent, "budget", $"{(n.WithinLeakageBudget ? "within" : "exceeded")}: {Ma(n.StandingA)} against {Ma(n.LeakageBudgetA)} ({a.LeakageBudgetText()})",
            n.WithinLeakageBudget ? Good : Open);
        var b = a.Blinding;
        var tolerance = b.ToleranceA is { } tol ? $", type {b.DeviceType.ToTradeName()} works with {Ma(tol)}" : "";
        Margin(screen, Indent, "blinding", b.Blinded switch
        {
            true => $"BLINDED: smooth DC {Ma(b.SmoothDcA)}{tolerance}",
            false => $"none: smooth DC {Ma(b.SmoothDcA)}{tolerance}",
            null => "cannot be determined: this sensor does not show DC",
        }, b.Blinded switch { true => Bad, false => Good, null => Open });
        if (chargingPoint)
        {
            var ev = a.EvCharging;
            Margin(screen, Indent, "EV", ev.DcAboveRdcDdThreshold switch
            {
                true => $"smooth DC {Ma(ev.SmoothDcA)} reaches the RDC-DD's {Ma(ev.RdcDdThresholdA)}",
                false => $"smooth DC {Ma(ev.SmoothDcA)} below the RDC-DD's {Ma(ev.RdcDdThresholdA)}",
                null => "cannot be determined: this sensor does not show DC",
            }, ev.DcAboveRdcDdThreshold == true ? Bad : null);
        }
    }

    /// <summary>The first cautions that are not stated with every verdict and not already a margin line (blinding,
    /// the charging point's choice), in the assessment's order; returns how many cautions in all were left out.</summary>
    public static int TopCautions(Screen screen, AssessmentResult a, int count)
    {
        var specific = a.Cautions.Where(c => !StandingCautions.All.Contains(c) && c != a.Blinding.Explanation &&
                                             c != a.EvCharging.Recommendation).ToList();
        var shown = specific.Take(count).ToList();
        var label = Label("Cautions");
        foreach (var caution in shown)
        {
            screen.Paragraph(caution, label + "- ", Indent + "  ", labelStyle: Bold);
            label = Indent;
        }

        return a.Cautions.Count - shown.Count;
    }

    /// <summary>The full tables: every type with its evidence (shared evidence in one row), the margins with their
    /// explanations, touch current when asked, and every caution.</summary>
    public static void Tables(Screen screen, AssessmentResult a, bool showTouchCurrent)
    {
        var types = new TextTable("Device types", new("type"), new("verdict"), new("evidence"));
        foreach (var group in a.Types.GroupBy(t => (t.Suitable, Evidence: string.Join("\n", t.Reasons))))
        {
            types.AddRow(string.Join(", ", group.Select(t => t.Type.ToTradeName())),
                new TextTable.Cell(SuitabilityWord(group.Key.Suitable), SuitabilityStyle(group.Key.Suitable)),
                group.Key.Evidence);
        }

        screen.Table(types);

        var n = a.NuisanceTrip;
        var margins = new TextTable(string.Create(CultureInfo.InvariantCulture, $"Margins for type {n.DeviceType.ToTradeName()}, IΔn {Ma(a.RatedResidualCurrentA)}"),
            new("check"), new("figure", Right: true), new("finding"));
        margins.AddRow("nuisance tripping", $"{Ma(n.StandingA)} of {Ma(n.NonOperatingLimitA)}",
            string.Create(CultureInfo.InvariantCulture, $"risk {VerdictText.Of(n.Risk)}: margin {Ma(n.MarginA)} ({n.MarginPercent:0} %). {n.Explanation}"));
        margins.AddRow($"leakage budget {a.LeakageBudgetText()}", Ma(n.LeakageBudgetA), n.WithinLeakageBudget ? "within" : "exceeded");
        margins.AddRow("DC blinding",
            a.Blinding.ToleranceA is { } tol ? $"{Ma(a.Blinding.SmoothDcA)} of {Ma(tol)}" : Ma(a.Blinding.SmoothDcA),
            new TextTable.Cell(a.Blinding.Explanation, a.Blinding.Blinded == true ? Bad : null));
        margins.AddRow($"EV charging (RDC-DD {Ma(a.EvCharging.RdcDdThresholdA)})", Ma(a.EvCharging.SmoothDcA), a.EvCharging.Recommendation);
        if (a.Gfci is { } g)
        {
            margins.AddRow("UL 943 Class A GFCI", Ma(g.StandingRmsA), Gfci(g.ClassATripsAlone, g.ClassATripTimeS));
            margins.AddRow("UL 943C special purpose", Ma(g.StandingRmsA), Gfci(g.SpecialPurposeTripsAlone, g.SpecialPurposeTripTimeS));
        }

        screen.Table(margins);
        if (showTouchCurrent && a.TouchCurrent is { } tc)
        {
            var r = tc.Readings;
            var touch = new TextTable("Touch current (IEC 60990 networks, recorded current taken as the current through the network)",
                new("reading"), new("value", Right: true), new("against"));
            touch.AddRow("unweighted RMS / peak", $"{CurrentText.Milliamps(r.UnweightedRmsA)} / {Ma(r.UnweightedPeakA)}", "");
            touch.AddRow("perception/reaction RMS / peak", $"{CurrentText.Milliamps(r.PerceptionRmsA)} / {Ma(r.PerceptionPeakA)}", "");
            touch.AddRow("let-go RMS / peak", $"{CurrentText.Milliamps(r.LetGoRmsA)} / {Ma(r.LetGoPeakA)}", "");
            touch.AddRow("DC", Ma(r.DcA), "");
            foreach (var c in tc.Comparisons)
            {
                touch.AddRow(c.Reading, $"{Ma(c.ValueA)} of {Ma(c.LimitA)}",
                    new TextTable.Cell($"{(c.Within ? "within" : "ABOVE")} {c.Limit} ({c.Source})", c.Within ? null : Bad));
            }

            screen.Table(touch);
        }

        screen.Paragraph("", "Cautions", labelStyle: Bold);
        foreach (var caution in a.Cautions)
        {
            screen.Paragraph(caution, "  - ", style: caution == a.Blinding.Explanation ? Bad : null);
        }
    }

    /// <summary>A verdict on a type in words.</summary>
    public static string SuitabilityWord(bool? suitable) => suitable switch
    {
        true => "suitable",
        false => "NOT suitable",
        null => "open",
    };

    public static string Label(string name) => (name + " ").PadRight(Indent.Length);

    private static Style? SuitabilityStyle(bool? suitable) => suitable switch
    {
        true => Good,
        false => Bad,
        null => Open,
    };

    private static Style? AdequacyStyle(bool? adequate) => adequate switch
    {
        true => Good,
        false => Bad,
        null => Open,
    };

    private static void Margin(Screen screen, string label, string name, string text, Style? style) =>
        screen.Paragraph(text, label + name.PadRight(10), Indent + new string(' ', 10), style: style, labelStyle: Bold);

    private static string Installed(AssessmentResult a) => string.Create(CultureInfo.InvariantCulture,
        $"type {a.InstalledProtection?.ToTradeName() ?? a.InstalledType?.ToTradeName()}, IΔn {Ma(a.RatedResidualCurrentA)}: {Adequacy(a.InstalledAdequate)}");

    /// <summary>A type's reasons in a few words: for a type not suitable or open, any rule that applies whatever the
    /// figures by its lead before the first colon, then the name of each class of residual current the verdict rests
    /// on (<see cref="TypeVerdict.Classes"/>, whose findings close its reasons); for a suitable type, each reason's lead.</summary>
    private static IEnumerable<string> ShortReasons(TypeVerdict t)
    {
        static string Lead(string reason) => reason.Split(": ", 2)[0];
        if (t.Suitable == true)
        {
            return t.Reasons.Select(Lead);
        }

        var rules = t.Reasons.Count - t.Classes.Count;
        return t.Reasons.Take(rules).Select(Lead).Concat(t.Classes.Select(c => c.Describe()));
    }

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

    private static string Ma(double amperes) => CurrentText.WithUnit(amperes);
}
