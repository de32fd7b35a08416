using System.Globalization;
using System.Text;
using System.Text.Json;
using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Core.Survey;

/// <summary>
/// Reads a site file: JSON written by a person, so comments and trailing commas are allowed, currents, voltages and
/// frequencies are written with their units (<c>"30mA"</c>, <c>"1V"</c>, <c>"10kHz"</c>; a bare number is refused
/// with the reading it most likely meant, as on the command line), and every mistake is reported with its 1-based line and
/// column and what was expected there.
/// </summary>
/// <remarks>
/// Layout:
/// <code>
/// { "site": "...", "defaults": { settings },
///   "captures": [ { "file": "c1.wav", "circuit": "...", settings }, ... ],
///   "upstream": [ { "name": "...", "device": "A", "rated": "100mA", "circuits": ["c2.wav", ...] }, ... ] }
/// </code>
/// A capture entry may say what the circuit was doing (<c>"state": "start-up"</c>); captures with the same
/// <c>circuit</c> name (trimmed, case ignored) are one circuit with one verdict, and must state the same device, IΔn,
/// regime and charging-point settings.
/// Settings keys: <c>rated</c>, <c>device</c> (a type, or a type with <c>+RDC-DD</c>), <c>sensor</c> (dc, ac, unknown),
/// <c>regime</c> (iec, na), <c>ev</c>, <c>chargerDcDetection</c> (the charging equipment detects 6 mA DC itself),
/// <c>scale</c>, <c>sensitivity</c>, <c>range</c>, <c>rate</c>, <c>channel</c>, <c>sum</c>; a null value means "not stated".
/// Identity keys (docs/report.md) at the top: <c>client</c>, <c>address</c>, <c>reportNumber</c>, <c>operator</c>,
/// <c>instrument</c>, <c>instrumentSerial</c>, <c>clamp</c>, <c>clampSerial</c>, <c>calibrationDue</c> (yyyy-mm-dd),
/// <c>date</c> (when recorded, where the file does not say), <c>productTest</c>; a capture entry may state its own
/// <c>reportNumber</c>, <c>date</c> and <c>productTest</c>.
/// Upstream <c>circuits</c> name captures by their <c>file</c> exactly as written in <c>captures</c>, or circuits by
/// their name; either way every capture of that circuit is behind the device.
/// </remarks>
public static class SiteConfigReader
{
    /// <summary>Largest site file read, bytes: 4 MiB (engineering choice: some 20 000 capture entries; a larger file
    /// is no site file, and refusing it keeps the reader's memory bounded).</summary>
    public const int MaxFileBytes = 4 << 20;

    /// <summary>Longest text (a value or a key), UTF-8 bytes: 4096, the longest path Linux accepts.</summary>
    public const int MaxTextBytes = 4096;

    /// <summary>Keys naming who, where and with what (docs/report.md): the report's identity block.</summary>
    private static readonly string[] IdentityKeys =
        ["client", "address", "reportNumber", "operator", "instrument", "instrumentSerial", "clamp", "clampSerial", "calibrationDue", "date", "productTest"];

    /// <summary>Identity keys a capture entry may state for itself (its own report number, recording date, product test).</summary>
    private static readonly string[] CaptureIdentityKeys = ["reportNumber", "date", "productTest"];

    private static readonly string[] TopKeys = ["site", "defaults", "captures", "upstream", .. IdentityKeys];

    private static readonly string[] SettingKeys =
        ["rated", "device", "sensor", "regime", "ev", "chargerDcDetection", "scale", "sensitivity", "range", "rate", "channel", "sum", "voltage", "voltageScale"];

    /// <summary>A setting (<see cref="Setting.Ref"/>) as a site file names it: <c>the site file's "channel"</c>; null for
    /// a setting the site file has no key for.</summary>
    /// <param name="property">The option property's name (<c>ImportOptions.Channel</c>: <c>Channel</c>).</param>
    public static string? KeyText(string property) => property switch
    {
        nameof(ImportOptions.ScaleA) => "scale",
        nameof(ImportOptions.SensitivityVPerA) => "sensitivity",
        nameof(ImportOptions.RangeV) => "range",
        nameof(ImportOptions.RateHz) => "rate",
        nameof(ImportOptions.Channel) => "channel",
        nameof(ImportOptions.SumChannels) => "sum",
        nameof(ImportOptions.Sensor) => "sensor",
        nameof(AssessmentOptions.RatedResidualCurrentA) => "rated",
        nameof(AssessmentOptions.InstalledType) => "device",
        nameof(AssessmentOptions.Regime) => "regime",
        nameof(AssessmentOptions.EvChargingPoint) => "ev",
        nameof(AssessmentOptions.ChargerDcDetection) => "chargerDcDetection",
        nameof(ImportOptions.VoltageChannels) => "voltage",
        nameof(ImportOptions.VoltageScale) => "voltageScale",
        _ => null,
    } is { } key ? $"the site file's \"{key}\"" : null;

    private static readonly string[] CaptureKeys = ["file", "circuit", "state", .. SettingKeys, .. CaptureIdentityKeys];

    private static readonly string[] UpstreamKeys = ["name", "device", "rated", "circuits"];

    /// <summary>Reads and checks a site file.</summary>
    /// <param name="path">The site file; capture files are resolved against its folder.</param>
    /// <exception cref="CaptureFormatException">The file is not valid JSON, or a value cannot be used.</exception>
    /// <exception cref="IOException">The file cannot be read.</exception>
    public static SiteConfig Read(string path)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        if (Directory.Exists(path))
        {
            throw new CaptureFormatException(path, "is a directory, not a site file");
        }

        using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read);
        if (stream.Length > MaxFileBytes)
        {
            throw new CaptureFormatException(path, string.Create(System.Globalization.CultureInfo.InvariantCulture,
                $"the site file is {stream.Length} bytes: at most {MaxFileBytes} bytes (4 MiB) are read"));
        }

        var bytes = new byte[stream.Length];
        stream.ReadExactly(bytes);
        return Parse(path, bytes);
    }

    /// <summary>Parses site-file content already in memory.</summary>
    /// <param name="path">Name of the file for messages; capture files are resolved against its folder.</param>
    /// <param name="utf8">The file's bytes (UTF-8, a byte-order mark is skipped).</param>
    /// <exception cref="CaptureFormatException">The content is not valid JSON, or a value cannot be used.</exception>
    public static SiteConfig Parse(string path, ReadOnlySpan<byte> utf8)
    {
        if (utf8.StartsWith((ReadOnlySpan<byte>)[0xEF, 0xBB, 0xBF]))
        {
            utf8 = utf8[3..];
        }

        if (utf8.Length > MaxFileBytes)
        {
            throw new CaptureFormatException(path, $"the site file is {utf8.Length} bytes: at most {MaxFileBytes} bytes (4 MiB) are read");
        }

        RequireUtf8(path, utf8);
        var tree = new Parser(path, utf8).ParseDocument();
        return new Interpreter(path).Read(tree);
    }

    /// <summary>Refuses bytes that are not UTF-8 with the line, the column and the byte offset of the first bad one.</summary>
    private static void RequireUtf8(string path, ReadOnlySpan<byte> utf8)
    {
        var offset = 0;
        while (offset < utf8.Length)
        {
            var status = System.Text.Rune.DecodeFromUtf8(utf8[offset..], out _, out var consumed);
            if (status != System.Buffers.OperationStatus.Done)
            {
                var before = utf8[..offset];
                var lineStart = before.LastIndexOf((byte)'\n') + 1;
                throw new CaptureFormatException(path, string.Create(System.Globalization.CultureInfo.InvariantCulture,
                    $"byte offset {offset}: invalid UTF-8 (byte 0x{utf8[offset]:X2}): save the site file as UTF-8"),
                    1 + before.Count((byte)'\n'), 1 + Encoding.UTF8.GetCharCount(before[lineStart..]));
            }

            offset += consumed;
        }
    }

    /// <summary>A JSON value with the place it starts at (1-based line and column).</summary>
    private sealed class Node
    {
        public required JsonTokenType Kind { get; init; }

        public required long Line { get; init; }

        public required long Column { get; init; }

        public string? Text { get; init; }

        public double Number { get; init; }

        public List<(string Key, Node KeyNode, Node Value)>? Members { get; init; }

        public List<Node>? Items { get; init; }

        public string Describe() => Kind switch
        {
            JsonTokenType.String => $"the text \"{ShownText.Of(Text)}\"",
            JsonTokenType.Number => $"the number {Text}",
            JsonTokenType.True or JsonTokenType.False => $"the value {Text}",
            JsonTokenType.Null => "null",
            JsonTokenType.StartObject => "an object",
            JsonTokenType.StartArray => "a list",
            _ => Kind.ToString(),
        };
    }

    /// <summary>Builds a tree of placed values from the reader, turning syntax errors into placed messages.</summary>
    private ref struct Parser
    {
        private readonly string _path;
        private readonly ReadOnlySpan<byte> _utf8;
        private Utf8JsonReader _reader;
        private long _placedOffset;
        private long _placedLine = 1;
        private long _placedColumnChars;

        public Parser(string path, ReadOnlySpan<byte> utf8)
        {
            _path = path;
            _utf8 = utf8;
            _reader = new Utf8JsonReader(utf8, new JsonReaderOptions
            {
                CommentHandling = JsonCommentHandling.Skip,
                AllowTrailingCommas = true,
            });
        }

        public Node ParseDocument()
        {
            try
            {
                if (!_reader.Read())
                {
                    throw new CaptureFormatException(_path, "the site file is empty: expected a JSON object { \"site\": ..., \"captures\": [...] }", 1, 1);
                }

                var root = ParseValue();
                if (_reader.Read())
                {
                    var (line, column) = Place(_reader.TokenStartIndex);
                    throw new CaptureFormatException(_path, "unexpected content after the end of the site object", line, column);
                }

                return root;
            }
            catch (JsonException e)
            {
                // System.Text.Json's positions are 0-based; people count from 1.
                throw new CaptureFormatException(_path, $"not valid JSON: {Plain(e.Message)}",
                    (e.LineNumber ?? 0) + 1, (e.BytePositionInLine ?? 0) + 1);
            }
        }

        private Node ParseValue()
        {
            var (line, column) = Place(_reader.TokenStartIndex);
            switch (_reader.TokenType)
            {
                case JsonTokenType.StartObject:
                    {
                        var members = new List<(string, Node, Node)>();
                        var seen = new HashSet<string>(StringComparer.Ordinal);
                        while (Next() != JsonTokenType.EndObject)
                        {
                            var (keyLine, keyColumn) = Place(_reader.TokenStartIndex);
                            var key = Text(keyLine, keyColumn);
                            var keyNode = new Node { Kind = JsonTokenType.PropertyName, Line = keyLine, Column = keyColumn, Text = key };
                            if (!seen.Add(key))
                            {
                                throw new CaptureFormatException(_path, $"duplicate key \"{key}\": each key may appear once in an object", keyLine, keyColumn);
                            }

                            Next();
                            members.Add((key, keyNode, ParseValue()));
                        }

                        return new Node { Kind = JsonTokenType.StartObject, Line = line, Column = column, Members = members };
                    }

                case JsonTokenType.StartArray:
                    {
                        var items = new List<Node>();
                        while (Next() != JsonTokenType.EndArray)
                        {
                            items.Add(ParseValue());
                        }

                        return new Node { Kind = JsonTokenType.StartArray, Line = line, Column = column, Items = items };
                    }

                case JsonTokenType.String:
                    return new Node { Kind = JsonTokenType.String, Line = line, Column = column, Text = Text(line, column) };
                case JsonTokenType.Number:
                    {
                        var text = Encoding.UTF8.GetString(_reader.ValueSpan);
                        if (!_reader.TryGetDouble(out var number) || !double.IsFinite(number))
                        {
                            throw new CaptureFormatException(_path, $"the number {ShownText.Of(text)} is out of range", line, column);
                        }

                        return new Node { Kind = JsonTokenType.Number, Line = line, Column = column, Text = text, Number = number };
                    }

                case JsonTokenType.True or JsonTokenType.False:
                    return new Node
                    {
                        Kind = _reader.TokenType,
                        Line = line,
                        Column = column,
                        Text = _reader.TokenType == JsonTokenType.True ? "true" : "false",
                    };
                default:
                    return new Node { Kind = JsonTokenType.Null, Line = line, Column = column, Text = "null" };
            }
        }

        /// <summary>The current string token, refused beyond <see cref="MaxTextBytes"/> or when its escapes do not
        /// make text (a lone surrogate such as <c>\ud800</c>).</summary>
        private string Text(long line, long column)
        {
            if (_reader.ValueSpan.Length > MaxTextBytes)
            {
                throw new CaptureFormatException(_path, string.Create(System.Globalization.CultureInfo.InvariantCulture,
                    $"a text of {_reader.ValueSpan.Length} bytes: at most {MaxTextBytes} bytes are read"), line, column);
            }

            try
            {
                return _reader.GetString()!;
            }
            catch (InvalidOperationException)
            {
                throw new CaptureFormatException(_path, "the text holds an escape that is no character (a lone \\u surrogate)", line, column);
            }
        }

        private JsonTokenType Next()
        {
            _reader.Read();
            return _reader.TokenType;
        }

        /// <summary>1-based line and column (in characters) of a byte offset. Offsets come in file order, so lines are
        /// counted on from the last place asked for: linear in the file, not quadratic.</summary>
        private (long Line, long Column) Place(long offset)
        {
            if (offset < _placedOffset)
            {
                (_placedOffset, _placedLine, _placedColumnChars) = (0, 1, 0);
            }

            var span = _utf8[(int)_placedOffset..(int)offset];
            var newlines = span.Count((byte)'\n');
            if (newlines > 0)
            {
                _placedLine += newlines;
                var lineStart = span.LastIndexOf((byte)'\n') + 1;
                _placedColumnChars = Encoding.UTF8.GetCharCount(span[lineStart..]);
            }
            else
            {
                _placedColumnChars += Encoding.UTF8.GetCharCount(span);
            }

            _placedOffset = offset;
            return (_placedLine, _placedColumnChars + 1L);
        }

        /// <summary>The reader's message without its own (0-based) position, which the caller states 1-based.</summary>
        private static string Plain(string message)
        {
            var at = message.IndexOf(" LineNumber:", StringComparison.Ordinal);
            return (at > 0 ? message[..at] : message).TrimEnd('.', ' ');
        }
    }

    /// <summary>Turns the placed tree into the site model, checking every value.</summary>
    private sealed class Interpreter(string path)
    {
        private readonly string _folder = Path.GetDirectoryName(Path.GetFullPath(path))!;

        public SiteConfig Read(Node root)
        {
            RequireKind(root, JsonTokenType.StartObject, "the site object { \"site\": ..., \"captures\": [...] }");
            string? site = null;
            var defaults = new CaptureSettingsPatch();
            Node? captures = null;
            Node? upstream = null;
            var identity = ReadIdentity(root, IdentityKeys);
            foreach (var (key, keyNode, value) in root.Members!)
            {
                switch (key)
                {
                    case "site": site = OptionalString(value, key); break;
                    case var _ when Array.IndexOf(IdentityKeys, key) >= 0: break;
                    case "defaults":
                        RequireKind(value, JsonTokenType.StartObject, "an object of settings such as { \"rated\": \"30mA\" }");
                        defaults = ReadSettings(value, SettingKeys, "defaults");
                        break;
                    case "captures": captures = value; break;
                    case "upstream": upstream = value; break;
                    default: throw UnknownKey(keyNode, TopKeys, "the site object");
                }
            }

            if (captures is null)
            {
                throw Error(root, "no \"captures\" list: expected \"captures\": [ { \"file\": \"c1.wav\" }, ... ]");
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

        /// <summary>The identity keys of <paramref name="item"/> among <paramref name="keys"/>; text values trimmed,
        /// blank text as not given.</summary>
        private ReportIdentity ReadIdentity(Node item, string[] keys)
        {
            var identity = ReportIdentity.Empty;
            foreach (var (key, _, value) in item.Members!)
            {
                if (Array.IndexOf(keys, key) < 0)
                {
                    continue;
                }

                identity = key switch
                {
                    "client" => identity with { Client = IdentityText(value, key) },
                    "address" => identity with { SiteAddress = IdentityText(value, key) },
                    "reportNumber" => identity with { ReportNumber = IdentityText(value, key) },
                    "operator" => identity with { Operator = IdentityText(value, key) },
                    "instrument" => identity with { Instrument = IdentityText(value, key) },
                    "instrumentSerial" => identity with { InstrumentSerial = IdentityText(value, key) },
                    "clamp" => identity with { Clamp = IdentityText(value, key) },
                    "clampSerial" => identity with { ClampSerial = IdentityText(value, key) },
                    "calibrationDue" => identity with { CalibrationDue = DateOf(value, key) },
                    "date" => identity with { StatedRecordedAt = TimeOf(value, key) },
                    "productTest" => identity with { ProductTest = BoolOf(value, key) ?? false },
                    _ => identity,
                };
            }

            return identity;
        }

        private string? IdentityText(Node value, string key) => OptionalString(value, key) is { } text && !string.IsNullOrWhiteSpace(text) ? text.Trim() : null;

        private DateOnly? DateOf(Node value, string key) =>
            OptionalString(value, key) is not { } text ? null
            : DateOnly.TryParseExact(text.Trim(), "yyyy-MM-dd", System.Globalization.CultureInfo.InvariantCulture, System.Globalization.DateTimeStyles.None, out var date) ? date
            : throw Error(value, $"\"{key}\": cannot use \"{text}\": expected a date such as \"2027-03-31\" (year-month-day)");

        private DateTimeOffset? TimeOf(Node value, string key) =>
            OptionalString(value, key) is not { } text ? null
            : DateTimeOffset.TryParse(text.Trim(), System.Globalization.CultureInfo.InvariantCulture,
                System.Globalization.DateTimeStyles.AssumeUniversal, out var time) && text.Trim().Length >= 10 ? time
            : throw Error(value, $"\"{key}\": cannot use \"{text}\": expected a date or date and time such as \"2026-11-20\" or \"2026-11-20T09:14:00Z\"");

        private List<SiteCapture> ReadCaptures(Node list)
        {
            RequireKind(list, JsonTokenType.StartArray, "a list of captures [ { \"file\": \"c1.wav\" }, ... ]");
            if (list.Items!.Count == 0)
            {
                throw Error(list, "the \"captures\" list is empty: expected at least one { \"file\": ... }");
            }

            var result = new List<SiteCapture>(list.Items.Count);
            var byPath = new Dictionary<string, Node>(StringComparer.Ordinal);
            foreach (var item in list.Items)
            {
                RequireKind(item, JsonTokenType.StartObject, "a capture entry { \"file\": \"c1.wav\", ... }");
                var fileNode = Member(item, "file")
                    ?? throw Error(item, "capture entry without \"file\": expected { \"file\": \"c1.wav\", ... }");
                var file = RequiredString(fileNode, "file");
                var full = Resolve(file);
                if (byPath.TryGetValue(full, out var first))
                {
                    throw Error(fileNode, $"capture \"{file}\" is listed twice (first at line {first.Line}): list each capture once");
                }

                byPath.Add(full, fileNode);
                var settings = ReadSettings(item, CaptureKeys, "a capture entry");
                result.Add(new SiteCapture(file, full, settings) { Identity = ReadIdentity(item, CaptureIdentityKeys) });
            }

            return result;
        }

        /// <summary>Refuses captures of one circuit that state different devices: a circuit has one device, so two
        /// captures that disagree on it are a mistake in the file (or two circuits sharing a name).</summary>
        private void RequireOneDevicePerCircuit(Node list, List<SiteCapture> captures, CaptureSettingsPatch defaults)
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
                    throw Error(node, $"capture \"{captures[i].File}\" of circuit \"{key}\" states {differs.Value.Later}, but \"{captures[earlier.Index].File}\" " +
                        $"(line {list.Items[earlier.Index].Line}) states {differs.Value.Earlier}: the captures of one circuit share its device; correct the entry, or give the circuits different names");
                }
            }
        }

        private static (string Earlier, string Later)? Difference(CaptureSettings a, CaptureSettings b)
        {
            static string Device(CaptureSettings s) => s.InstalledType is { } t ? $"\"device\": \"{t.ToTradeName()}{(s.InstalledRdcDd ? "+RDC-DD" : string.Empty)}\"" : "no \"device\"";
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

        private List<UpstreamGroup> ReadUpstream(Node list, List<SiteCapture> captures)
        {
            RequireKind(list, JsonTokenType.StartArray, "a list of upstream devices [ { \"name\": ..., \"circuits\": [...] } ]");
            var byFile = new Dictionary<string, SiteCapture>(StringComparer.Ordinal);
            foreach (var capture in captures)
            {
                byFile.TryAdd(capture.File, capture);
            }

            var names = new Dictionary<string, Node>(StringComparer.OrdinalIgnoreCase);
            var groups = new List<UpstreamGroup>(list.Items!.Count);
            foreach (var item in list.Items)
            {
                RequireKind(item, JsonTokenType.StartObject, "an upstream entry { \"name\": ..., \"device\": \"A\", \"rated\": \"100mA\", \"circuits\": [...] }");
                foreach (var (key, keyNode, _) in item.Members!)
                {
                    if (Array.IndexOf(UpstreamKeys, key) < 0)
                    {
                        throw UnknownKey(keyNode, UpstreamKeys, "an upstream entry");
                    }
                }

                var nameNode = Member(item, "name") ?? throw Error(item, "upstream entry without \"name\": expected e.g. \"name\": \"Q2 sub-board RCD\"");
                var name = RequiredString(nameNode, "name").Trim();
                if (names.TryGetValue(name, out var first))
                {
                    throw Error(nameNode, $"upstream device \"{name}\" is listed twice (first at line {first.Line}): give each a different name");
                }

                names.Add(name, nameNode);
                var deviceNode = Member(item, "device") ?? throw Error(item, $"upstream device \"{name}\" has no \"device\": expected a type AC, A, F, B or B+");
                var device = DeviceOf(deviceNode)?.Type ?? throw Error(deviceNode, "\"device\" of an upstream device cannot be null: expected AC, A, F, B or B+");
                var ratedNode = Member(item, "rated") ?? throw Error(item, $"upstream device \"{name}\" has no \"rated\": expected a current such as \"100mA\"");
                var rated = RatedOf(ratedNode) ?? throw Error(ratedNode, "\"rated\" of an upstream device cannot be null: expected a current such as \"100mA\"");
                var circuitsNode = Member(item, "circuits") ?? throw Error(item, $"upstream device \"{name}\" has no \"circuits\": expected a list of capture files");
                RequireKind(circuitsNode, JsonTokenType.StartArray, "a list of capture files [\"c2.wav\", ...] as written under \"captures\"");
                var members = new List<string>(circuitsNode.Items!.Count);
                var seen = new HashSet<string>(StringComparer.Ordinal);
                var memberPaths = new HashSet<string>(StringComparer.Ordinal);
                foreach (var circuit in circuitsNode.Items)
                {
                    var file = RequiredString(circuit, "circuits");
                    // A capture file as written under "captures", or a circuit's name: either way the whole circuit,
                    // every capture of it, is behind the device.
                    var circuitName = byFile.TryGetValue(file, out var capture) ? capture.Settings.Circuit?.Trim() : file.Trim();
                    var ofCircuit = string.IsNullOrEmpty(circuitName) ? [] : captures
                        .Where(c => string.Equals(c.Settings.Circuit?.Trim(), circuitName, StringComparison.OrdinalIgnoreCase)).ToList();
                    if (capture is null && ofCircuit.Count == 0)
                    {
                        throw Error(circuit, $"upstream device \"{name}\" names \"{file}\", which is neither a capture under \"captures\" nor a circuit's name: expected one of {Quote(byFile.Keys)}");
                    }

                    if (!seen.Add(file))
                    {
                        throw Error(circuit, $"upstream device \"{name}\" names \"{file}\" twice: name each circuit once");
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

        private CaptureSettingsPatch ReadSettings(Node item, string[] allowed, string where)
        {
            var patch = new CaptureSettingsPatch();
            foreach (var (key, keyNode, value) in item.Members!)
            {
                if (Array.IndexOf(allowed, key) < 0)
                {
                    throw UnknownKey(keyNode, allowed, where);
                }

                patch = key switch
                {
                    "file" => patch,
                    "reportNumber" or "date" or "productTest" => patch,
                    "circuit" => patch with { Circuit = OptionalString(value, key) },
                    "state" => patch with { State = OptionalString(value, key) },
                    "rated" => patch with { RatedResidualCurrentA = RatedOf(value) },
                    "device" => DeviceOf(value) is { } protection
                        ? patch with { InstalledType = protection.Type, InstalledRdcDd = protection.RdcDd }
                        : patch with { InstalledType = null },
                    "sensor" => patch with { Sensor = SensorOf(value) },
                    "regime" => patch with { Regime = RegimeOf(value) },
                    "ev" => patch with { Ev = BoolOf(value, key) },
                    "chargerDcDetection" => patch with { ChargerDcDetection = BoolOf(value, key) },
                    "scale" => patch with { ScaleA = Bounded(value, key, CurrentOf(value, key)) },
                    "sensitivity" => patch with { SensitivityVPerA = Bounded(value, key, QuantityOf(value, key, "V/A", Quantity.SensitivityForm, static (k, t) => Quantity.ParseSensitivityVPerA(k, t))) },
                    "range" => patch with { RangeV = Bounded(value, key, QuantityOf(value, key, "V", Quantity.VoltageForm, static (k, t) => Quantity.ParseVoltageV(k, t))) },
                    "rate" => patch with { RateHz = Bounded(value, key, QuantityOf(value, key, "Hz", Quantity.FrequencyForm, static (k, t) => Quantity.ParseFrequencyHz(k, t))) },
                    "channel" => patch with { Channel = ChannelOf(value) },
                    "sum" => patch with { Sum = SumOf(value) },
                    "voltage" => patch with { Voltage = VoltageOf(value) },
                    "voltageScale" => patch with { VoltageScale = VoltageScaleOf(value, key) },
                    _ => throw UnknownKey(keyNode, allowed, where),
                };
            }

            if (patch.Channel is not null && patch.Sum is not null)
            {
                throw Error(Member(item, "sum")!, "both \"channel\" and \"sum\" given: expected one of them (or null)");
            }

            return patch;
        }

        /// <summary>IΔn, checked here against the same range as <c>--rated</c> so that a bad value is blamed on this
        /// line of the site file, not on the capture and an option the user never typed.</summary>
        private double? RatedOf(Node value)
        {
            var rated = CurrentOf(value, "rated");
            if (rated is { } a)
            {
                try
                {
                    new AssessmentOptions { RatedResidualCurrentA = a }.Validate();
                }
                catch (OptionValueException e)
                {
                    throw Error(value, $"\"rated\": cannot use '{e.Text}': expected {e.Expected}");
                }
            }

            return rated;
        }

        /// <summary>A capture setting within the bounds every reader holds it to (<see cref="CaptureLimits"/>).</summary>
        private double? Bounded(Node value, string key, double? si) =>
            si is { } v && CaptureLimits.SettingProblem(key, v) is { } expected
                ? throw Error(value, $"\"{key}\": cannot use {value.Describe()}: expected {expected}")
                : si;

        private double? CurrentOf(Node value, string key)
        {
            var amperes = QuantityOf(value, key, "A", Quantity.CurrentForm, static (k, t) => Quantity.ParseCurrentA(k, t));
            return amperes is null or > 0 ? amperes : throw Error(value, $"\"{key}\" must be a positive current (got {value.Text})");
        }

        /// <summary>A quantity with its unit, by the one rule of <see cref="Quantity"/>: a bare number (a JSON number or
        /// a string without a unit) is refused with the reading it most likely meant.</summary>
        private double? QuantityOf(Node value, string key, string unit, string expected, Func<string, string, double> parse)
        {
            switch (value.Kind)
            {
                case JsonTokenType.Null: return null;
                case JsonTokenType.Number:
                    var suggestion = Quantity.Suggestion(value.Text!, unit);
                    throw Error(value, $"\"{key}\": {value.Text} has no unit: expected {expected}; did you mean \"{suggestion}\"?");
                case JsonTokenType.String:
                    double parsed;
                    try
                    {
                        parsed = parse(key, value.Text!);
                    }
                    catch (OptionValueException)
                    {
                        var hint = Quantity.Suggestion(value.Text!, unit) is { } s ? $"; did you mean \"{s}\"?" : string.Empty;
                        throw Error(value, $"\"{key}\": cannot use \"{value.Text}\": expected {expected}{hint}");
                    }

                    return parsed > 0 ? parsed : throw Error(value, $"\"{key}\" must be positive (got \"{value.Text}\"): expected {expected}");
                default:
                    throw Error(value, $"\"{key}\": cannot use {value.Describe()}: expected {expected}");
            }
        }

        private (DeviceType Type, bool RdcDd)? DeviceOf(Node value)
        {
            if (value.Kind == JsonTokenType.Null)
            {
                return null;
            }

            if (value.Kind == JsonTokenType.String && DeviceTypeNames.TryParseProtection(value.Text, out var type, out var rdcDd))
            {
                return (type, rdcDd);
            }

            var found = value.Kind == JsonTokenType.String ? $"\"{value.Text}\"" : value.Describe();
            throw Error(value, $"unknown device type {found}: expected \"AC\", \"A\", \"F\", \"B\" or \"B+\", optionally with +RDC-DD (\"A+RDC-DD\")");
        }

        private SensorCoupling? SensorOf(Node value)
        {
            var text = OptionalString(value, "sensor");
            return text?.Trim().ToLowerInvariant() switch
            {
                null => null,
                "dc" => SensorCoupling.Dc,
                "ac" => SensorCoupling.Ac,
                "unknown" => SensorCoupling.Unknown,
                _ => throw Error(value, $"\"sensor\": cannot use \"{text}\": expected \"dc\" (sees DC), \"ac\" (blind to DC) or \"unknown\""),
            };
        }

        private Regime? RegimeOf(Node value)
        {
            var text = OptionalString(value, "regime");
            return text is null ? null
                : RegimeNames.TryParse(text, out var regime) ? regime
                : throw Error(value, $"\"regime\": cannot use \"{text}\": expected \"iec\" or \"na\"");
        }

        private bool? BoolOf(Node value, string key) => value.Kind switch
        {
            JsonTokenType.Null => null,
            JsonTokenType.True => true,
            JsonTokenType.False => false,
            _ => throw Error(value, $"\"{key}\": cannot use {value.Describe()}: expected true or false"),
        };

        private string? ChannelOf(Node value) => value.Kind switch
        {
            JsonTokenType.Null => null,
            JsonTokenType.String when !string.IsNullOrWhiteSpace(value.Text) => value.Text!.Trim(),
            JsonTokenType.Number when value.Number >= 1 && value.Number == Math.Floor(value.Number) => value.Text,
            _ => throw Error(value, $"\"channel\": cannot use {value.Describe()}: expected a channel name or a 1-based number"),
        };

        private List<string>? VoltageOf(Node value)
        {
            List<string> names;
            switch (value.Kind)
            {
                case JsonTokenType.Null: return null;
                case JsonTokenType.String:
                    names = [.. value.Text!.Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries)];
                    break;
                case JsonTokenType.Number when value.Number >= 1 && value.Number == Math.Floor(value.Number):
                    names = [value.Text!];
                    break;
                case JsonTokenType.StartArray:
                    names = [.. value.Items!.Select(i => RequiredString(i, "voltage").Trim())];
                    break;
                default:
                    names = [];
                    break;
            }

            return names.Count is 1 or 3 ? names
                : throw Error(value, $"\"voltage\": cannot use {value.Describe()}: expected one voltage channel, or three (L1, L2, L3), e.g. \"ch2\" or [\"U1\", \"U2\", \"U3\"]");
        }

        private double? VoltageScaleOf(Node value, string key)
        {
            double? scale = value.Kind switch
            {
                JsonTokenType.Null => null,
                JsonTokenType.Number => double.Parse(value.Text!, NumberStyles.Float, CultureInfo.InvariantCulture),
                JsonTokenType.String => ParseOr(value, () => Quantity.ParseVoltageScale(key, value.Text!),
                    $"\"{key}\": cannot use \"{value.Text}\": expected volts at WAV full scale or a probe ratio, such as \"500V\" or 100"),
                _ => throw Error(value, $"\"{key}\": cannot use {value.Describe()}: expected volts at WAV full scale or a probe ratio, such as \"500V\" or 100"),
            };
            return scale is { } v && !(v > 0 && v <= ImportOptions.MaxVoltageScale)
                ? throw Error(value, $"\"voltageScale\": cannot use {value.Describe()}: expected a positive factor up to 1e6")
                : scale;
        }

        private double ParseOr(Node value, Func<double> parse, string message)
        {
            try
            {
                return parse();
            }
            catch (OptionValueException)
            {
                throw Error(value, message);
            }
        }

        private List<string>? SumOf(Node value)
        {
            List<string> names;
            switch (value.Kind)
            {
                case JsonTokenType.Null: return null;
                case JsonTokenType.String:
                    names = [.. value.Text!.Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries)];
                    break;
                case JsonTokenType.StartArray:
                    names = [.. value.Items!.Select(i => RequiredString(i, "sum").Trim())];
                    break;
                default:
                    names = [];
                    break;
            }

            return names.Count >= 2 ? names
                : throw Error(value, $"\"sum\": cannot use {value.Describe()}: expected two or more channel names, e.g. [\"L1\", \"L2\", \"L3\", \"N\"]");
        }

        private string? OptionalString(Node value, string key) => value.Kind switch
        {
            JsonTokenType.Null => null,
            JsonTokenType.String => value.Text,
            _ => throw Error(value, $"\"{key}\": cannot use {value.Describe()}: expected text in quotes"),
        };

        private string RequiredString(Node value, string key) =>
            value.Kind == JsonTokenType.String && !string.IsNullOrWhiteSpace(value.Text)
                ? value.Text!
                : throw Error(value, $"\"{key}\": cannot use {value.Describe()}: expected a file name in quotes");

        private void RequireKind(Node value, JsonTokenType kind, string expected)
        {
            if (value.Kind != kind)
            {
                throw Error(value, $"found {value.Describe()}: expected {expected}");
            }
        }

        private static Node? Member(Node item, string key)
        {
            foreach (var (k, _, v) in item.Members!)
            {
                if (k == key)
                {
                    return v;
                }
            }

            return null;
        }

        private string Resolve(string file) => Path.GetFullPath(Path.IsPathRooted(file) ? file : Path.Combine(_folder, file));

        private CaptureFormatException UnknownKey(Node keyNode, string[] known, string where)
        {
            var nearest = Nearest(keyNode.Text!, known);
            var hint = nearest is null ? string.Empty : $"did you mean \"{nearest}\"? ";
            return Error(keyNode, $"unknown key \"{keyNode.Text}\" in {where}: {hint}expected one of {Quote(known)}");
        }

        private CaptureFormatException Error(Node at, string problem) => new(path, problem, at.Line, at.Column);

        private static string Quote(IEnumerable<string> names) => string.Join(", ", names.Select(n => $"\"{n}\""));

        /// <summary>The known key closest to a mistyped one; null when none is close.</summary>
        internal static string? Nearest(string key, string[] known) => NearestName.Find(key, known);
    }
}
