using System.Buffers;
using System.Globalization;
using System.Text;
using System.Text.Json;
using WaveCheck.Core.Capture;

namespace WaveCheck.Core.Survey;

/// <summary>Walks a site file's bytes into a tree of placed values (<see cref="SiteJsonNode"/>), turning syntax errors
/// into messages with a 1-based line and column: positions are counted here, once, in file order.</summary>
internal ref struct SiteJsonParser
{
    private readonly string _path;
    private readonly ReadOnlySpan<byte> _utf8;
    private Utf8JsonReader _reader;
    private long _placedOffset;
    private long _placedLine = 1;
    private long _placedColumnChars;

    public SiteJsonParser(string path, ReadOnlySpan<byte> utf8)
    {
        _path = path;
        _utf8 = utf8;
        _reader = new Utf8JsonReader(utf8, new JsonReaderOptions
        {
            CommentHandling = JsonCommentHandling.Skip,
            AllowTrailingCommas = true,
        });
    }

    public SiteJsonNode ParseDocument()
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

    private SiteJsonNode ParseValue()
    {
        var (line, column) = Place(_reader.TokenStartIndex);
        switch (_reader.TokenType)
        {
            case JsonTokenType.StartObject:
                {
                    var members = new List<(string, SiteJsonNode, SiteJsonNode)>();
                    var seen = new HashSet<string>(StringComparer.Ordinal);
                    while (Next() != JsonTokenType.EndObject)
                    {
                        var (keyLine, keyColumn) = Place(_reader.TokenStartIndex);
                        var key = Text(keyLine, keyColumn);
                        var keySiteJsonNode = new SiteJsonNode { Kind = JsonTokenType.PropertyName, Line = keyLine, Column = keyColumn, Text = key };
                        if (!seen.Add(key))
                        {
                            throw new CaptureFormatException(_path, $"duplicate key \"{key}\": each key may appear once in an object", keyLine, keyColumn);
                        }

                        Next();
                        members.Add((key, keySiteJsonNode, ParseValue()));
                    }

                    return new SiteJsonNode { Kind = JsonTokenType.StartObject, Line = line, Column = column, Members = members };
                }

            case JsonTokenType.StartArray:
                {
                    var items = new List<SiteJsonNode>();
                    while (Next() != JsonTokenType.EndArray)
                    {
                        items.Add(ParseValue());
                    }

                    return new SiteJsonNode { Kind = JsonTokenType.StartArray, Line = line, Column = column, Items = items };
                }

            case JsonTokenType.String:
                return new SiteJsonNode { Kind = JsonTokenType.String, Line = line, Column = column, Text = Text(line, column) };
            case JsonTokenType.Number:
                {
                    var text = Encoding.UTF8.GetString(_reader.ValueSpan);
                    if (!_reader.TryGetDouble(out var number) || !double.IsFinite(number))
                    {
                        throw new CaptureFormatException(_path, $"the number {ShownText.Of(text)} is out of range", line, column);
                    }

                    return new SiteJsonNode { Kind = JsonTokenType.Number, Line = line, Column = column, Text = text, Number = number };
                }

            case JsonTokenType.True or JsonTokenType.False:
                return new SiteJsonNode
                {
                    Kind = _reader.TokenType,
                    Line = line,
                    Column = column,
                    Text = _reader.TokenType == JsonTokenType.True ? "true" : "false",
                };
            default:
                return new SiteJsonNode { Kind = JsonTokenType.Null, Line = line, Column = column, Text = "null" };
        }
    }

    /// <summary>The current string token, refused beyond <see cref="SiteConfigReader.MaxTextBytes"/> or when its escapes do not
    /// make text (a lone surrogate such as <c>\ud800</c>).</summary>
    private string Text(long line, long column)
    {
        if (_reader.ValueSpan.Length > SiteConfigReader.MaxTextBytes)
        {
            throw new CaptureFormatException(_path, string.Create(CultureInfo.InvariantCulture,
                $"a text of {_reader.ValueSpan.Length} bytes: at most {SiteConfigReader.MaxTextBytes} bytes are read"), line, column);
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

    /// <summary>Refuses bytes that are not UTF-8 with the line, the column and the byte offset of the first bad one.</summary>
    public static void RequireUtf8(string path, ReadOnlySpan<byte> utf8)
    {
        var offset = 0;
        while (offset < utf8.Length)
        {
            var status = Rune.DecodeFromUtf8(utf8[offset..], out _, out var consumed);
            if (status != OperationStatus.Done)
            {
                var before = utf8[..offset];
                var lineStart = before.LastIndexOf((byte)'\n') + 1;
                throw new CaptureFormatException(path, string.Create(CultureInfo.InvariantCulture,
                    $"byte offset {offset}: invalid UTF-8 (byte 0x{utf8[offset]:X2}): save the site file as UTF-8"),
                    1 + before.Count((byte)'\n'), 1 + Encoding.UTF8.GetCharCount(before[lineStart..]));
            }

            offset += consumed;
        }
    }
}
