using System.Globalization;

namespace WaveCheck.Core.Capture;

/// <summary>
/// Which channels form the residual current, resolved once from <see cref="ImportOptions.Channel"/> or
/// <see cref="ImportOptions.SumChannels"/> against the channels a file holds, and how each chosen channel's SI value
/// becomes amperes. Every reader (WAV, CSV, COMTRADE) chooses through here, so a choice is refused, guessed and
/// warned about in the same words whatever the format.
/// </summary>
/// <param name="Indices">Indices into the channel list, summed to form the residual current.</param>
/// <param name="Source">What forms it, for a person: a channel name or <c>L1+L2+L3+N</c>.</param>
/// <param name="Warning">A <c>channel-guessed</c> note when the choice was made for the user, else null.</param>
internal sealed record ChannelSelection(IReadOnlyList<int> Indices, string Source, CaptureWarning? Warning)
{
    /// <summary>Code of the warning given when the residual channel was chosen for the user.</summary>
    public const string GuessedCode = "channel-guessed";

    /// <summary>Resolves the user's choice.</summary>
    /// <param name="channels">Channels of the file.</param>
    /// <param name="options">The user's options.</param>
    /// <param name="candidates">Channels that may carry the residual current when nothing is chosen, most likely
    /// first; the first is used.</param>
    /// <param name="noCandidate">The problem when nothing is chosen and <paramref name="candidates"/> is empty, in
    /// the words of the format.</param>
    /// <param name="fail">Builds the exception for a problem (the caller knows the place in the file).</param>
    /// <param name="unnamedReason">Null when the file's own labels make the candidates certain; otherwise why the
    /// first candidate is only a guess, which is then warned about even when it is the only one.</param>
    /// <exception cref="Exception">What <paramref name="fail"/> builds: an unknown channel name or number, a channel
    /// summed twice, or no candidate.</exception>
    public static ChannelSelection Resolve(IReadOnlyList<ChannelInfo> channels, ImportOptions options,
        IReadOnlyList<int> candidates, string noCandidate, Func<string, Exception> fail, string? unnamedReason = null)
    {
        if (options.SumChannels is { Count: > 0 } sum)
        {
            var indices = new List<int>(sum.Count);
            foreach (var name in sum)
            {
                var index = Find(channels, name, Setting.Ref(nameof(ImportOptions.SumChannels)), fail);
                if (indices.Contains(index))
                {
                    throw fail($"{Setting.Ref(nameof(ImportOptions.SumChannels))} names channel '{channels[index].Name}' twice");
                }

                indices.Add(index);
            }

            return new ChannelSelection(indices, string.Join('+', indices.Select(i => channels[i].Name)), null);
        }

        if (options.Channel is { } chosen)
        {
            var index = Find(channels, chosen, Setting.Ref(nameof(ImportOptions.Channel)), fail);
            return new ChannelSelection([index], channels[index].Name, null);
        }

        if (candidates.Count == 0)
        {
            throw fail(noCandidate);
        }

        var first = channels[candidates[0]].Name;
        if (candidates.Count == 1)
        {
            var note = unnamedReason is null
                ? null
                : new CaptureWarning(GuessedCode,
                    $"The only current channel, '{first}', is used as the residual current, though {unnamedReason}. Choose another with --channel or add channels with --sum.");
            return new ChannelSelection([candidates[0]], first, note);
        }

        var others = string.Join(", ", candidates.Skip(1).Select(i => channels[i].Name));
        var why = unnamedReason is null ? string.Empty : $", as {unnamedReason}";
        var warning = new CaptureWarning(GuessedCode,
            $"Several current channels; using the first, '{first}' (others: {others}){why}. Choose with --channel or add them with --sum.");
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

    /// <summary>Per selected channel, the factor from its SI value to amperes: 1 for a current, 1/sensitivity for a
    /// voltage (a clamp's output recorded on a voltage input).</summary>
    /// <param name="channels">Channels of the file.</param>
    /// <param name="options">The user's options (<see cref="ImportOptions.SensitivityVPerA"/>).</param>
    /// <param name="fail">Builds the exception for a problem with the channel at the given index.</param>
    /// <returns>One factor per entry of <see cref="Indices"/>.</returns>
    public double[] AmperesPerSiUnit(IReadOnlyList<ChannelInfo> channels, ImportOptions options, Func<int, string, Exception> fail)
    {
        var factors = new double[Indices.Count];
        for (var k = 0; k < factors.Length; k++)
        {
            var channel = channels[Indices[k]];
            factors[k] = channel.Quantity switch
            {
                ChannelQuantity.Current => 1.0,
                ChannelQuantity.Voltage when options.SensitivityVPerA is { } sensitivity => 1.0 / sensitivity,
                ChannelQuantity.Voltage => throw fail(Indices[k],
                    $"channel '{channel.Name}' is a voltage ({channel.SourceUnit}): give {Setting.Ref(nameof(ImportOptions.SensitivityVPerA))} (e.g. \"10 mV/mA\") to turn it into a current"),
                _ => throw fail(Indices[k],
                    $"channel '{channel.Name}' is in '{channel.SourceUnit}', neither a current nor a voltage; choose another with {Setting.Ref(nameof(ImportOptions.Channel))}"),
            };
        }

        return factors;
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
