using System.Globalization;

namespace WaveCheck.Core.Capture;

/// <summary>
/// Which channels form the residual current, resolved once from <see cref="ImportOptions.Channel"/> or
/// <see cref="ImportOptions.SumChannels"/> against the channels a file holds, and how each chosen channel's SI value
/// becomes amperes. Every reader (WAV, CSV, COMTRADE) chooses through here, so a choice is refused and warned about
/// in the same words whatever the format. Of several channels none named as the residual current, none is taken.
/// </summary>
/// <param name="Indices">Indices into the channel list, summed to form the residual current.</param>
/// <param name="Source">What forms it, for a person: a channel name or <c>L1+L2+L3+N</c>.</param>
/// <param name="Warning">A <c>channel-guessed</c> note when the only candidate was taken without the file naming it
/// as the residual current, else null.</param>
internal sealed record ChannelSelection(IReadOnlyList<int> Indices, string Source, CaptureWarning? Warning)
{
    /// <summary>Code of the warning given when the residual channel was chosen for the user.</summary>
    public const string GuessedCode = "channel-guessed";

    /// <summary>Resolves the user's choice.</summary>
    /// <param name="channels">Channels of the file.</param>
    /// <param name="options">The user's options.</param>
    /// <param name="candidates">Channels that may carry the residual current when nothing is chosen. One is used
    /// (with a warning if <paramref name="unnamedReason"/> says why it is only a guess); several are refused.</param>
    /// <param name="noCandidate">The problem when nothing is chosen and <paramref name="candidates"/> is empty, in
    /// the words of the format.</param>
    /// <param name="fail">Builds the exception for a problem (the caller knows the place in the file).</param>
    /// <param name="unnamedReason">Null when the file's own labels make the candidates certain; otherwise why the
    /// only candidate is a guess, which is then warned about.</param>
    /// <param name="writtenNames">Per channel, its name exactly as written in the file (a CSV header cell such as
    /// <c>L1_A</c>), accepted by <c>--channel</c> and <c>--sum</c> beside the parsed name; null where they are the same.</param>
    /// <exception cref="Exception">What <paramref name="fail"/> builds: an unknown channel name or number, a channel
    /// summed twice, no candidate, or several candidates and none chosen.</exception>
    public static ChannelSelection Resolve(IReadOnlyList<ChannelInfo> channels, ImportOptions options,
        IReadOnlyList<int> candidates, string noCandidate, Func<string, Exception> fail, string? unnamedReason = null,
        IReadOnlyList<string>? writtenNames = null)
    {
        if (options.SumChannels is { Count: > 0 } sum)
        {
            var indices = new List<int>(sum.Count);
            foreach (var name in sum)
            {
                var index = Find(channels, writtenNames, name, Setting.Ref(nameof(ImportOptions.SumChannels)), fail);
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
            var index = Find(channels, writtenNames, chosen, Setting.Ref(nameof(ImportOptions.Channel)), fail);
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
                    $"The only current channel, '{first}', is used as the residual current, though {unnamedReason}. Choose another with {Setting.Ref(nameof(ImportOptions.Channel))} or add channels with {Setting.Ref(nameof(ImportOptions.SumChannels))}.");
            return new ChannelSelection([candidates[0]], first, note);
        }

        // Several channels and none named as the residual current: conductor currents (L1, L2, L3, N) are the usual
        // case, and taking one of them would judge a load current of amperes as if it were a residual current.
        var names = candidates.Select(i => channels[i].Name).ToList();
        var why = unnamedReason ?? "none is named as the residual current";
        if (options.DescribeOnly)
        {
            return new ChannelSelection([candidates[0]], first, new CaptureWarning(GuessedCode,
                $"{candidates.Count} channels could carry the residual current ({string.Join(", ", names)}) and {why}: shown here with '{first}', but an analysis needs {Setting.Ref(nameof(ImportOptions.SumChannels))} or {Setting.Ref(nameof(ImportOptions.Channel))}."));
        }

        throw fail($"{candidates.Count} channels could carry the residual current ({string.Join(", ", names)}) and {why}: " +
                   $"give {Setting.Ref(nameof(ImportOptions.SumChannels))} {string.Join(',', names)} to add live conductors' currents, or {Setting.Ref(nameof(ImportOptions.Channel))} {names[0]} if that one is the residual current");
    }

    internal static int Find(IReadOnlyList<ChannelInfo> channels, IReadOnlyList<string>? writtenNames, string wanted, string option,
        Func<string, Exception> fail)
    {
        var text = wanted.Trim();
        for (var i = 0; i < channels.Count; i++)
        {
            if (string.Equals(channels[i].Name, text, StringComparison.OrdinalIgnoreCase))
            {
                return i;
            }
        }

        if (writtenNames is not null)
        {
            for (var i = 0; i < writtenNames.Count; i++)
            {
                if (string.Equals(writtenNames[i].Trim(), text, StringComparison.OrdinalIgnoreCase))
                {
                    return i;
                }
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
