using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Core.Survey;

/// <summary>
/// Joins a survey's captures into circuits and gives each circuit one verdict: the strongest requirement over its
/// captures, never weaker than any of them (docs/methods.md Part III, "one verdict per circuit").
/// </summary>
/// <remarks>
/// Captures belong to one circuit when they carry the same circuit name (trimmed, case ignored); a capture without a
/// circuit name is a circuit of its own. The rules, each on the side of safety:
/// <list type="bullet">
/// <item>Required type: the strongest of the captures' required types. When a capture could not decide its own
/// (a class left open, or the capture failed), the circuit's is undecided too, unless a capture already needs the
/// strongest type there is (B+), which nothing can raise.</item>
/// <item>Minimum type: the strongest of every analysed capture's required and minimum types.</item>
/// <item>Verdict: <c>upgrade</c> when any capture finds the device not adequate (a failed or undecided capture cannot
/// make a device that is already too weak adequate); otherwise <c>error</c> when no capture could be analysed,
/// <c>cannot-tell</c> when any capture failed or could not decide, <c>ok</c> only when every capture is ok.</item>
/// <item>Figures: the worst over the captures (largest standing current, DC of largest magnitude, smallest margin,
/// highest risk; blinded when any capture blinds the device).</item>
/// </list>
/// </remarks>
public static class CircuitVerdicts
{
    /// <summary>One verdict per circuit, in the order each circuit first appears in <paramref name="rows"/>.</summary>
    /// <param name="rows">The survey's rows.</param>
    public static IReadOnlyList<CircuitVerdict> From(IReadOnlyList<SurveyRow> rows)
    {
        ArgumentNullException.ThrowIfNull(rows);
        var groups = new List<List<SurveyRow>>();
        var byKey = new Dictionary<string, List<SurveyRow>>(StringComparer.OrdinalIgnoreCase);
        foreach (var row in rows)
        {
            var key = KeyOf(row);
            if (!byKey.TryGetValue(key, out var group))
            {
                group = [];
                byKey.Add(key, group);
                groups.Add(group);
            }

            group.Add(row);
        }

        return [.. groups.Select(Of)];
    }

    /// <summary>What joins captures into a circuit: the trimmed circuit name (compare case-insensitively), or the
    /// file for a capture without one.</summary>
    public static string KeyOf(SurveyRow row)
    {
        ArgumentNullException.ThrowIfNull(row);
        return string.IsNullOrWhiteSpace(row.Circuit) ? "file\u0000" + row.File : "circuit\u0000" + row.Circuit.Trim();
    }

    /// <summary>The verdict of one circuit over its captures.</summary>
    /// <param name="captures">The circuit's rows, at least one.</param>
    public static CircuitVerdict Of(IReadOnlyList<SurveyRow> captures)
    {
        ArgumentNullException.ThrowIfNull(captures);
        if (captures.Count == 0)
        {
            throw new ArgumentException("a circuit needs at least one capture (got none)", nameof(captures));
        }

        var analysed = captures.Where(r => r.Verdict != SurveyVerdict.Error).ToList();
        var failed = captures.Count - analysed.Count;
        DeviceType? strongestKnown = analysed.Select(r => r.RequiredType).Where(t => t is not null).DefaultIfEmpty(null).Max();
        var undecided = failed > 0 || analysed.Any(r => r.RequiredType is null);
        DeviceType? required = !undecided ? strongestKnown
            : strongestKnown == DeviceType.BPlus ? DeviceType.BPlus
            : null;
        DeviceType? minimum = analysed.SelectMany(r => new[] { r.RequiredType, r.MinimumType })
            .Where(t => t is not null).DefaultIfEmpty(null).Max();

        var verdict = captures.Any(r => r.Verdict == SurveyVerdict.Upgrade) ? SurveyVerdict.Upgrade
            : analysed.Count == 0 ? SurveyVerdict.Error
            : captures.Any(r => r.Verdict is SurveyVerdict.Error or SurveyVerdict.CannotTell) ? SurveyVerdict.CannotTell
            : SurveyVerdict.Ok;

        var deciding = Deciding(verdict, analysed);
        var name = captures.Select(r => r.Circuit?.Trim()).FirstOrDefault(c => !string.IsNullOrEmpty(c))
            ?? Path.GetFileName(captures[0].File);
        return new CircuitVerdict
        {
            Circuit = name,
            InstalledType = analysed.Select(r => r.InstalledType).FirstOrDefault(i => i is not null)
                ?? captures.Select(r => r.InstalledType).FirstOrDefault(i => i is not null),
            RatedResidualCurrentA = captures.Min(r => r.RatedResidualCurrentA),
            RequiredType = required,
            MinimumType = minimum,
            AcceptedProtection = Accepted(required, analysed),
            Verdict = verdict,
            Reason = Reason(verdict, captures, analysed, deciding),
            DecidingFile = deciding?.File,
            WorstWindowRmsA = Max(analysed, r => r.WorstWindowRmsA ?? r.RmsA),
            SmoothDcA = analysed.Select(r => r.SmoothDcA).Where(d => d is not null).OrderByDescending(d => Math.Abs(d!.Value)).FirstOrDefault(),
            SmoothDcKnown = analysed.Count == 0 ? null : analysed.All(r => r.SmoothDcKnown == true),
            Above1kHzRmsA = Max(analysed, r => r.Above1kHzRmsA),
            NuisanceRisk = analysed.Select(r => r.NuisanceRisk).Where(k => k is not null).DefaultIfEmpty(null).Max(),
            NuisanceMarginA = analysed.Select(r => r.NuisanceMarginA).Where(m => m is not null).DefaultIfEmpty(null).Min(),
            Blinded = analysed.Count == 0 ? null
                : analysed.Any(r => r.Blinded == true) ? true
                : analysed.Any(r => r.Blinded is null) ? null
                : false,
            TripAlert = analysed.Any(r => r.TripAlert == true) ? true : analysed.Any(r => r.TripAlert == false) ? false : null,
            Captures = [.. captures.Select(r => new CircuitCapture(r.File, r.State, r.Verdict, r.RequiredType, r.MinimumType,
                r.WorstWindowRmsA ?? r.RmsA, r.ReportPath))],
        };
    }

    /// <summary>How a capture is named in a circuit's reason: its state, or its file name.</summary>
    public static string CaptureName(string file, string? state) =>
        string.IsNullOrWhiteSpace(state) ? Path.GetFileName(file) : $"{state.Trim()} ({Path.GetFileName(file)})";

    private static SurveyRow? Deciding(SurveyVerdict verdict, List<SurveyRow> analysed)
    {
        var candidates = verdict switch
        {
            SurveyVerdict.Upgrade => analysed.Where(r => r.Verdict == SurveyVerdict.Upgrade).ToList(),
            SurveyVerdict.CannotTell when analysed.Any(r => r.Verdict == SurveyVerdict.CannotTell) =>
                analysed.Where(r => r.Verdict == SurveyVerdict.CannotTell).ToList(),
            _ => analysed,
        };

        // The first of those that demands the most (a decided type before an open one of the same level).
        SurveyRow? best = null;
        foreach (var row in candidates)
        {
            if (best is null || Demand(row) > Demand(best))
            {
                best = row;
            }
        }

        return best;
    }

    private static int Demand(SurveyRow row) =>
        row.RequiredType is { } r ? 2 * (int)r + 1 : row.MinimumType is { } m ? 2 * (int)m : -1;

    private static string? Accepted(DeviceType? required, List<SurveyRow> analysed)
    {
        if (required is not { } type)
        {
            return null;
        }

        var texts = analysed.Where(r => r.RequiredType == type).Select(r => r.AcceptedProtection)
            .Distinct(StringComparer.Ordinal).ToList();
        // Captures that need the same type but accept different alternatives: the type alone satisfies all of them.
        return texts.Count == 1 && texts[0] is { } only ? only : $"type {type.ToTradeName()}";
    }

    private static string Reason(SurveyVerdict verdict, IReadOnlyList<SurveyRow> captures, List<SurveyRow> analysed, SurveyRow? deciding)
    {
        var failed = captures.Where(r => r.Verdict == SurveyVerdict.Error).ToList();
        if (analysed.Count == 0)
        {
            return captures.Count == 1
                ? $"the capture could not be analysed: {failed[0].Error}"
                : $"none of the {captures.Count} captures could be analysed; first: {failed[0].Error}";
        }

        var finding = deciding is null ? string.Empty
            : captures.Count == 1 ? deciding.Headline ?? string.Empty
            : $"{CaptureName(deciding.File, deciding.State)}: {deciding.Headline}";
        if (verdict == SurveyVerdict.CannotTell && failed.Count > 0)
        {
            var names = string.Join(", ", failed.Select(r => CaptureName(r.File, r.State)));
            var missing = $"{failed.Count} of {captures.Count} captures could not be analysed ({names}): the circuit's requirement is not shown in full";
            return finding.Length == 0 ? missing : $"{missing}; {finding}";
        }

        return finding;
    }

    private static double? Max(List<SurveyRow> rows, Func<SurveyRow, double?> figure) =>
        rows.Select(figure).Where(v => v is not null).DefaultIfEmpty(null).Max();
}
