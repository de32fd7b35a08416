using System.Globalization;

namespace WaveCheck.Core.Capture;

/// <summary>
/// Which channels form the residual current, resolved once from <see cref="ImportOptions.Channel"/> or
/// <see cref="ImportOptions.SumChannels"/> against the channels a file holds.
/// </summary>
/// <param name="Indices">Indices into the channel list, summed to form the residual current.</param>
/// <param name="Source">What forms it, for a person: a channel name or <c>L1+L2+L3+N</c>.</param>
/// <param name="Warning">A note when the choice was made for the user (several candidates), else null.</param>
internal sealed record ChannelSelection(IReadOnlyList<int> Indices, string Source, CaptureWarning? Warning)
{
    /// <summary>Resolves the user's choice.</summary>
    /// <param name="channels">Channels of the file.</param>
    /// <param name="options">The user's options.</param>
    /// <param name="candidates">Channels that may carry a current when nothing is chosen, in file order.</param>
    /// <param name="fail">Builds the exception for a problem (the caller knows the place in the file).</param>
    public static ChannelSelection Resolve(IReadOnlyList<ChannelInfo> channels, ImportOptions options,
        IReadOnlyList<int> candidates, Func<string, Exception> fail)
    {
        if (options.SumChannels is { Count: > 0 } sum)
        {
            var indices = new List<int>(sum.Count);
            foreach (var name in sum)
            {
                var index = Find(channels, name, "--sum", fail);
                if (indices.Contains(index))
                {
                    throw fail($"--sum names channel '{channels[index].Name}' twice");
                }

                indices.Add(index);
            }

            return new ChannelSelection(indices, string.Join('+', indices.Select(i => channels[i].Name)), null);
        }

        if (options.Channel is { } chosen)
        {
            var index = Find(channels, chosen, "--channel", fail);
            return new ChannelSelection([index], channels[index].Name, null);
        }

        if (candidates.Count == 0)
        {
            throw fail("no current or voltage column found: name the unit in the header, e.g. 'I [mA]'");
        }

        if (candidates.Count == 1)
        {
            return new ChannelSelection([candidates[0]], channels[candidates[0]].Name, null);
        }

        var first = channels[candidates[0]].Name;
        var others = string.Join(", ", candidates.Skip(1).Select(i => channels[i].Name));
        var warning = new CaptureWarning("channel-guessed",
            $"Several current channels; using the first, '{first}' (others: {others}). Choose with --channel or add them with --sum.");
        return new ChannelSelection([candidates[0]], first, warning);
    }

    private static int Find(IReadOnlyList<ChannelInfo> channels, string wanted, string option, Func<string, Exception> fail)
    {
        var text = wanted.Trim();
        for (var i = 0; i < channels.Count; i++)
        {
            if (string.Equals(channels[i].Name, text, StringComparison.OrdinalIgnoreCase))
            {
                return i;
            }
        }

        if (int.TryParse(text, NumberStyles.None, CultureInfo.InvariantCulture, out var number))
        {
            if (number >= 1 && number <= channels.Count)
            {
                return number - 1;
            }

            throw fail($"{option} {text}: channel number out of range 1..{channels.Count}");
        }

        var names = string.Join(", ", channels.Select(c => c.Name));
        throw fail($"{option}: no channel named '{text}' (channels: {names})");
    }

    /// <summary>Forms the residual current (amperes) of a block from the channels' SI values.</summary>
    /// <param name="block">Block whose channel buffers hold <paramref name="length"/> valid samples.</param>
    /// <param name="length">Valid samples.</param>
    /// <param name="toAmperes">Per selected channel: factor from its SI value to amperes (1 for currents, 1/sensitivity for volts).</param>
    public void FormResidual(CaptureBlock block, int length, ReadOnlySpan<double> toAmperes)
    {
        var residual = block.ResidualBuffer[..length];
        var first = block.ChannelBuffer(Indices[0])[..length];
        var k0 = toAmperes[0];
        if (k0 == 1)
        {
            first.CopyTo(residual);
        }
        else
        {
            for (var n = 0; n < residual.Length; n++)
            {
                residual[n] = first[n] * k0;
            }
        }

        for (var c = 1; c < Indices.Count; c++)
        {
            var channel = block.ChannelBuffer(Indices[c])[..length];
            var k = toAmperes[c];
            for (var n = 0; n < residual.Length; n++)
            {
                residual[n] += channel[n] * k;
            }
        }
    }
}
