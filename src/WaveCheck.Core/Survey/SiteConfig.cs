using WaveCheck.Core.Assessment;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Survey;

/// <summary>
/// A site file as read by <see cref="SiteConfigReader"/>: the site's name, defaults for every capture, the captures
/// with their circuits and devices, and the upstream devices that several circuits share.
/// </summary>
public sealed record SiteConfig
{
    /// <summary>The site file as the user named it.</summary>
    public required string ConfigPath { get; init; }

    /// <summary>Site name for the summary's title.</summary>
    public required string Site { get; init; }

    /// <summary>Values that apply to every capture unless its entry states its own.</summary>
    public required CaptureSettingsPatch Defaults { get; init; }

    /// <summary>The captures, in the order of the file.</summary>
    public required IReadOnlyList<SiteCapture> Captures { get; init; }

    /// <summary>Upstream devices, each with the captures of the circuits it protects.</summary>
    public required IReadOnlyList<UpstreamGroup> Upstream { get; init; }

    /// <summary>Client, address, report number, operator, instruments: what every report of the site states.</summary>
    public ReportIdentity Identity { get; init; } = ReportIdentity.Empty;

    /// <summary>The identity of the report on <paramref name="capturePath"/>: its entry's own keys over the site's,
    /// with the circuit as the entry names it.</summary>
    /// <param name="capturePath">A capture's resolved path (<see cref="SiteCapture.Path"/>).</param>
    /// <param name="circuit">The circuit as the job's settings name it; null: not given.</param>
    public ReportIdentity IdentityOf(string capturePath, string? circuit)
    {
        var own = Captures.FirstOrDefault(c => c.Path == capturePath)?.Identity ?? ReportIdentity.Empty;
        return (own with { Circuit = string.IsNullOrWhiteSpace(circuit) ? null : circuit.Trim() }).Over(Identity);
    }

    /// <summary>One job per capture, settings merged in this order (later wins): built-in defaults, the site file's
    /// <c>defaults</c>, the capture's entry, then <paramref name="overrides"/> (the command line).</summary>
    /// <param name="overrides">Values from the command line that apply to every capture; null for none.</param>
    public IReadOnlyList<SurveyJob> Jobs(CaptureSettingsPatch? overrides = null)
    {
        var jobs = new List<SurveyJob>(Captures.Count);
        foreach (var capture in Captures)
        {
            var settings = Defaults.ApplyTo(new CaptureSettings());
            settings = capture.Settings.ApplyTo(settings);
            if (overrides is not null)
            {
                settings = overrides.ApplyTo(settings);
            }

            jobs.Add(new SurveyJob(capture.Path, settings));
        }

        return jobs;
    }
}

/// <summary>A capture listed in the site file.</summary>
/// <param name="File">The file as written in the site file (relative to the site file's folder, or absolute).</param>
/// <param name="Path">The file resolved against the site file's folder: what jobs open and rows carry.</param>
/// <param name="Settings">What the entry states.</param>
public sealed record SiteCapture(string File, string Path, CaptureSettingsPatch Settings)
{
    /// <summary>What the entry states of the report's identity (its own report number, recording date, product test).</summary>
    public ReportIdentity Identity { get; init; } = ReportIdentity.Empty;
}

/// <summary>An upstream device shared by several circuits (a sub-board RCD, a main switch RCD).</summary>
/// <param name="Name">For a person, e.g. <c>Q2 sub-board RCD</c>.</param>
/// <param name="Device">Its type.</param>
/// <param name="RatedResidualCurrentA">Its IΔn, amperes.</param>
/// <param name="Members">Resolved paths of the captures of the circuits downstream of it (the same strings as
/// <see cref="SiteCapture.Path"/>).</param>
public sealed record UpstreamGroup(string Name, DeviceType Device, double RatedResidualCurrentA, IReadOnlyList<string> Members);
