using System.Text.Json;
using WaveCheck.Core.Assessment;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Core.Survey;

/// <summary>Turns the placed tree of a site file into the site model, checking every value: the site object, its
/// captures (each listed once, the captures of one circuit stating one device) and its upstream devices. The values
/// themselves are read by <see cref="SiteValues"/>, a capture's settings by <see cref="SiteSettingsReader"/>, the
/// identity keys by <see cref="SiteIdentityReader"/>.</summary>
internal sealed class SiteFileInterpreter(string path)
{
    /// <summary>Keys of the site object.</summary>
    private static readonly string[] TopKeys = ["site", "defaults", "captures", "upstream", .. SiteIdentityReader.Keys];

    /// <summary>Keys of a capture entry.</summary>
    private static readonly string[] CaptureKeys = ["file", "circuit", "state", .. SiteSettingsReader.Keys, .. SiteIdentityReader.CaptureKeys];

    /// <summary>Keys of an upstream entry.</summary>
    private static readonly string[] UpstreamKeys = ["name", "device", "rated", "circuits"];

    private readonly string _folder = Path.GetDirectoryName(Path.GetFullPath(path))!;

    private readonly SiteValues _values = new(path);

    public SiteConfig Read(SiteJsonNode root)
    {
        _values.RequireKind(root, JsonTokenType.StartObject, "the site object { \"site\": ..., \"captures\": [...] }");
        string? site = null;
        var defaults = new CaptureSettingsPatch();
        SiteJsonNode? captures = null;
        SiteJsonNode? upstream = null;
        var identity = SiteIdentityReader.Read(_values, root, SiteIdentityReader.Keys);
        foreach (var (key, keyNode, value) in root.Members!)
        {
            switch (key)
            {
                case "site": site = _values.OptionalString(value, key); break;
                case var _ when Array.IndexOf(SiteIdentityReader.Keys, key) >= 0: break;
                case "defaults":
                    _values.RequireKind(value, JsonTokenType.StartObject, "an object of settings such as { \"rated\": \"30mA\" }");
                    defaults = SiteSettingsReader.Read(_values, value, SiteSettingsReader.Keys, "defaults");
                    break;
                case "captures": captures = value; break;
                case "upstream": upstream = value; break;
                default: throw _values.UnknownKey(keyNode, TopKeys, "the site object");
            }
        }

        if (captures is null)
        {
            throw _values.Error(root, "no \"captures\" list: expected \"captures\": [ { \"file\": \"c1.wav\" }, ... ]");
        }

        var captureList = ReadCaptures(captures);
        RequireOneDevicePerCircuit(captures, captureList, defaults);
        var groups = upstream is null or { Kind: JsonTokenType.Null } ? [] : ReadUpstream(upstream, captureList);
        return new SiteConfig
        {
            ConfigPath = path,
            Site = string.IsNullOrWhiteSpace(site) ? Path.GetFileNameWithoutExtension(path) : site.Trim(),
            Defaults = defaults,
            Captures = captureList,
            Upstream = groups,
            Identity = identity with { Site = string.IsNullOrWhiteSpace(site) ? null : site.Trim() },
        };
    }

    private List<SiteCapture> ReadCaptures(SiteJsonNode list)
    {
        _values.RequireKind(list, JsonTokenType.StartArray, "a list of captures [ { \"file\": \"c1.wav\" }, ... ]");
        if (list.Items!.Count == 0)
        {
            throw _values.Error(list, "the \"captures\" list is empty: expected at least one { \"file\": ... }");
        }

        var result = new List<SiteCapture>(list.Items.Count);
        var byPath = new Dictionary<string, SiteJsonNode>(StringComparer.Ordinal);
        foreach (var item in list.Items)
        {
            _values.RequireKind(item, JsonTokenType.StartObject, "a capture entry { \"file\": \"c1.wav\", ... }");
            var fileNode = item.Member("file")
                ?? throw _values.Error(item, "capture entry without \"file\": expected { \"file\": \"c1.wav\", ... }");
            var file = _values.RequiredString(fileNode, "file");
            var full = Resolve(file);
            if (byPath.TryGetValue(full, out var first))
            {
                throw _values.Error(fileNode, $"capture \"{file}\" is listed twice (first at line {first.Line}): list each capture once");
            }

            byPath.Add(full, fileNode);
            var settings = SiteSettingsReader.Read(_values, item, CaptureKeys, "a capture entry");
            result.Add(new SiteCapture(file, full, settings) { Identity = SiteIdentityReader.Read(_values, item, SiteIdentityReader.CaptureKeys) });
        }

        return result;
    }

    /// <summary>Refuses captures of one circuit that state different devices: a circuit has one device, so two
    /// captures that disagree on it are a mistake in the file (or two circuits sharing a name).</summary>
    private void RequireOneDevicePerCircuit(SiteJsonNode list, List<SiteCapture> captures, CaptureSettingsPatch defaults)
    {
        var first = new Dictionary<string, (int Index, CaptureSettings Settings)>(StringComparer.OrdinalIgnoreCase);
        for (var i = 0; i < captures.Count; i++)
        {
            var settings = captures[i].Settings.ApplyTo(defaults.ApplyTo(new CaptureSettings()));
            if (string.IsNullOrWhiteSpace(settings.Circuit))
            {
                continue;
            }

            var key = settings.Circuit.Trim();
            if (!first.TryGetValue(key, out var earlier))
            {
                first.Add(key, (i, settings));
                continue;
            }

            var differs = Difference(earlier.Settings, settings);
            if (differs is not null)
            {
                var node = list.Items![i];
                throw _values.Error(node, $"capture \"{captures[i].File}\" of circuit \"{key}\" states {differs.Value.Later}, but \"{captures[earlier.Index].File}\" " +
                    $"(line {list.Items[earlier.Index].Line}) states {differs.Value.Earlier}: the captures of one circuit share its device; correct the entry, or give the circuits different names");
            }
        }
    }

    private static (string Earlier, string Later)? Difference(CaptureSettings a, CaptureSettings b)
    {
        static string Device(CaptureSettings s) => s.InstalledProtection is { } p ? $"\"device\": \"{p.ToTradeName()}\"" : "no \"device\"";
        if (Device(a) != Device(b))
        {
            return (Device(a), Device(b));
        }

        if (a.RatedResidualCurrentA != b.RatedResidualCurrentA)
        {
            return ($"\"rated\": {CurrentText.WithUnit(a.RatedResidualCurrentA)}", $"\"rated\": {CurrentText.WithUnit(b.RatedResidualCurrentA)}");
        }

        if (a.Regime != b.Regime)
        {
            return ($"\"regime\": \"{RegimeText(a.Regime)}\"", $"\"regime\": \"{RegimeText(b.Regime)}\"");
        }

        if (a.Ev != b.Ev)
        {
            return ($"\"ev\": {(a.Ev ? "true" : "false")}", $"\"ev\": {(b.Ev ? "true" : "false")}");
        }

        return a.ChargerDcDetection != b.ChargerDcDetection
            ? ($"\"chargerDcDetection\": {(a.ChargerDcDetection ? "true" : "false")}", $"\"chargerDcDetection\": {(b.ChargerDcDetection ? "true" : "false")}")
            : null;
    }

    private static string RegimeText(Regime regime) => regime == Regime.Na ? "na" : "iec";

    private List<UpstreamGroup> ReadUpstream(SiteJsonNode list, List<SiteCapture> captures)
    {
        _values.RequireKind(list, JsonTokenType.StartArray, "a list of upstream devices [ { \"name\": ..., \"circuits\": [...] } ]");
        var byFile = new Dictionary<string, SiteCapture>(StringComparer.Ordinal);
        foreach (var capture in captures)
        {
            byFile.TryAdd(capture.File, capture);
        }

        var names = new Dictionary<string, SiteJsonNode>(StringComparer.OrdinalIgnoreCase);
        var groups = new List<UpstreamGroup>(list.Items!.Count);
        foreach (var item in list.Items)
        {
            _values.RequireKind(item, JsonTokenType.StartObject, "an upstream entry { \"name\": ..., \"device\": \"A\", \"rated\": \"100mA\", \"circuits\": [...] }");
            foreach (var (key, keyNode, _) in item.Members!)
            {
                if (Array.IndexOf(UpstreamKeys, key) < 0)
                {
                    throw _values.UnknownKey(keyNode, UpstreamKeys, "an upstream entry");
                }
            }

            var nameNode = item.Member("name") ?? throw _values.Error(item, "upstream entry without \"name\": expected e.g. \"name\": \"Q2 sub-board RCD\"");
            var name = _values.RequiredString(nameNode, "name").Trim();
            if (names.TryGetValue(name, out var first))
            {
                throw _values.Error(nameNode, $"upstream device \"{name}\" is listed twice (first at line {first.Line}): give each a different name");
            }

            names.Add(name, nameNode);
            var deviceNode = item.Member("device") ?? throw _values.Error(item, $"upstream device \"{name}\" has no \"device\": expected a type AC, A, F, B or B+");
            var device = _values.DeviceOf(deviceNode)?.Type ?? throw _values.Error(deviceNode, "\"device\" of an upstream device cannot be null: expected AC, A, F, B or B+");
            var ratedNode = item.Member("rated") ?? throw _values.Error(item, $"upstream device \"{name}\" has no \"rated\": expected a current such as \"100mA\"");
            var rated = _values.RatedOf(ratedNode) ?? throw _values.Error(ratedNode, "\"rated\" of an upstream device cannot be null: expected a current such as \"100mA\"");
            var circuitsNode = item.Member("circuits") ?? throw _values.Error(item, $"upstream device \"{name}\" has no \"circuits\": expected a list of capture files");
            _values.RequireKind(circuitsNode, JsonTokenType.StartArray, "a list of capture files [\"c2.wav\", ...] as written under \"captures\"");
            var members = new List<string>(circuitsNode.Items!.Count);
            var seen = new HashSet<string>(StringComparer.Ordinal);
            var memberPaths = new HashSet<string>(StringComparer.Ordinal);
            foreach (var circuit in circuitsNode.Items)
            {
                var file = _values.RequiredString(circuit, "circuits");
                // A capture file as written under "captures", or a circuit's name: either way the whole circuit,
                // every capture of it, is behind the device.
                var circuitName = byFile.TryGetValue(file, out var capture) ? capture.Settings.Circuit?.Trim() : file.Trim();
                var ofCircuit = string.IsNullOrEmpty(circuitName) ? [] : captures
                    .Where(c => string.Equals(c.Settings.Circuit?.Trim(), circuitName, StringComparison.OrdinalIgnoreCase)).ToList();
                if (capture is null && ofCircuit.Count == 0)
                {
                    throw _values.Error(circuit, $"upstream device \"{name}\" names \"{file}\", which is neither a capture under \"captures\" nor a circuit's name: expected one of {SiteValues.Quote(byFile.Keys)}");
                }

                if (!seen.Add(file))
                {
                    throw _values.Error(circuit, $"upstream device \"{name}\" names \"{file}\" twice: name each circuit once");
                }

                foreach (var member in capture is not null && ofCircuit.Count == 0 ? [capture] : ofCircuit)
                {
                    if (memberPaths.Add(member.Path))
                    {
                        members.Add(member.Path);
                    }
                }
            }

            groups.Add(new UpstreamGroup(name, device, rated, members));
        }

        return groups;
    }

    private string Resolve(string file) => Path.GetFullPath(Path.IsPathRooted(file) ? file : Path.Combine(_folder, file));
}
