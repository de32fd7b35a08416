using System.Text.Json;

namespace WaveCheck.Core.Survey;

/// <summary>Channel names: the residual-current channel, the channels summed to form it, the voltage channels.</summary>
internal sealed partial class SiteValues
{
    private const string VoltageExpected = "expected one voltage channel, or three (L1, L2, L3), e.g. \"ch2\" or [\"U1\", \"U2\", \"U3\"]";

    private const string SumExpected = "expected two or more channel names, e.g. [\"L1\", \"L2\", \"L3\", \"N\"]";

    /// <summary>The residual-current channel: a name, or a 1-based number; null for null.</summary>
    public string? ChannelOf(SiteJsonNode value) => value.Kind switch
    {
        JsonTokenType.Null => null,
        JsonTokenType.String when !string.IsNullOrWhiteSpace(value.Text) => value.Text!.Trim(),
        JsonTokenType.Number when value.IsChannelNumber => value.Text,
        _ => throw Error(value, $"\"channel\": cannot use {value.Describe()}: expected a channel name or a 1-based number"),
    };

    /// <summary>Voltage channels: one, or three (L1, L2, L3); a single channel may be given by its 1-based number.</summary>
    public List<string>? VoltageOf(SiteJsonNode value, string key) =>
        ChannelList(value, key, numberAllowed: true, static count => count is 1 or 3, VoltageExpected);

    /// <summary>Channels summed to form the residual current: two or more.</summary>
    public List<string>? SumOf(SiteJsonNode value, string key) =>
        ChannelList(value, key, numberAllowed: false, static count => count >= 2, SumExpected);

    /// <summary>A list of channel names, the one rule for every key that takes several: text with commas
    /// (<c>"L1, N"</c>) or a list of texts, names trimmed and empty pieces dropped; null for null. A value of
    /// another kind, or a count <paramref name="countFits"/> refuses, is refused with <paramref name="expected"/>.</summary>
    /// <param name="value">The value.</param>
    /// <param name="key">Its key, for messages.</param>
    /// <param name="numberAllowed">A 1-based channel number is a list of one.</param>
    /// <param name="countFits">Whether a list of this many names is usable.</param>
    /// <param name="expected">What the key takes, for the message.</param>
    private List<string>? ChannelList(SiteJsonNode value, string key, bool numberAllowed, Func<int, bool> countFits, string expected)
    {
        List<string> names;
        switch (value.Kind)
        {
            case JsonTokenType.Null: return null;
            case JsonTokenType.String:
                names = [.. value.Text!.Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries)];
                break;
            case JsonTokenType.Number when numberAllowed && value.IsChannelNumber:
                names = [value.Text!];
                break;
            case JsonTokenType.StartArray:
                names = [.. value.Items!.Select(i => RequiredString(i, key).Trim())];
                break;
            default:
                names = [];
                break;
        }

        return countFits(names.Count) ? names : throw Error(value, $"\"{key}\": cannot use {value.Describe()}: {expected}");
    }
}
