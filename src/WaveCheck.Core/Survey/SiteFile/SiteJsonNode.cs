using System.Text.Json;
using WaveCheck.Core.Capture;

namespace WaveCheck.Core.Survey;

/// <summary>A JSON value of a site file with the place it starts at (1-based line and column), so that every later
/// check can name where the user must look.</summary>
internal sealed class SiteJsonNode
{
    public required JsonTokenType Kind { get; init; }

    public required long Line { get; init; }

    public required long Column { get; init; }

    public string? Text { get; init; }

    public double Number { get; init; }

    public List<(string Key, SiteJsonNode KeyNode, SiteJsonNode Value)>? Members { get; init; }

    public List<SiteJsonNode>? Items { get; init; }

    /// <summary>True for a JSON number that is a whole number from 1 up: a 1-based channel number.</summary>
    public bool IsChannelNumber => Kind == JsonTokenType.Number && Number >= 1 && Number == Math.Floor(Number);

    /// <summary>The value as a message names it: <c>the text "x"</c>, <c>the number 3</c>, <c>a list</c>.</summary>
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

    /// <summary>The value of <paramref name="key"/> in this object; null when the key is absent.</summary>
    public SiteJsonNode? Member(string key)
    {
        foreach (var (k, _, v) in Members!)
        {
            if (k == key)
            {
                return v;
            }
        }

        return null;
    }
}
