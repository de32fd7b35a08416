using System.Globalization;

namespace WaveCheck.Core.Capture;

/// <summary>
/// Which channels carry the circuit voltage (<see cref="ImportOptions.VoltageChannels"/>), resolved against a file's
/// channels in the same words as <see cref="ChannelSelection"/> whatever the format, and kept apart from the channels
/// that form the residual current.
/// </summary>
internal static class VoltageSelection
{
    /// <summary>The indices of the voltage channels the user named; empty when none.</summary>
    /// <param name="channels">Channels of the file.</param>
    /// <param name="options">The user's options.</param>
    /// <param name="fail">Builds the exception for a problem.</param>
    /// <exception cref="Exception">What <paramref name="fail"/> builds: two voltages, an unknown or repeated channel.</exception>
    public static IReadOnlyList<int> Indices(IReadOnlyList<ChannelInfo> channels, ImportOptions options, Func<string, Exception> fail)
    {
        if (options.VoltageChannels is not { Count: > 0 } names)
        {
            return [];
        }

        if (names.Count is not (1 or 3))
        {
            throw fail(string.Create(CultureInfo.InvariantCulture,
                $"{Setting.Ref(nameof(ImportOptions.VoltageChannels))} names {names.Count} channels: expected one (single-phase, line to earth or neutral) or three (L1,L2,L3 to earth)"));
        }

        var indices = new List<int>(names.Count);
        foreach (var name in names)
        {
            var index = ChannelSelection.Find(channels, null, name, Setting.Ref(nameof(ImportOptions.VoltageChannels)), fail);
            if (indices.Contains(index))
            {
                throw fail($"{Setting.Ref(nameof(ImportOptions.VoltageChannels))} names channel '{channels[index].Name}' twice");
            }

            indices.Add(index);
        }

        return indices;
    }

    /// <summary>The residual channels left to guess from once the voltage channels are set aside.</summary>
    public static IReadOnlyList<int> Without(IReadOnlyList<int> candidates, IReadOnlyList<int> voltages) =>
        voltages.Count == 0 ? candidates : [.. candidates.Where(c => !voltages.Contains(c))];

    /// <summary>Builds the capture's <see cref="VoltageInput"/>, or null when no voltage channel was named.</summary>
    /// <param name="channels">Channels of the file, the voltage channels among them with quantity voltage.</param>
    /// <param name="indices">What <see cref="Indices"/> returned.</param>
    /// <param name="residual">The channels forming the residual current.</param>
    /// <param name="options">The user's options (<see cref="ImportOptions.VoltageScale"/>).</param>
    /// <param name="blockFactor">Per voltage channel: what a block's value must be multiplied by to give the volts the
    /// file states (1 except for WAV, whose blocks hold every channel in the current's scale).</param>
    /// <param name="unitText">How the file states the channel's unit, for <see cref="VoltageInput.Source"/>.</param>
    /// <param name="fail">Builds the exception for a problem with a channel.</param>
    public static VoltageInput? Build(IReadOnlyList<ChannelInfo> channels, IReadOnlyList<int> indices, IReadOnlyList<int> residual,
        ImportOptions options, Func<int, double> blockFactor, string unitText, Func<int, string, Exception> fail)
    {
        if (indices.Count == 0)
        {
            if (options.VoltageScale is not null)
            {
                throw fail(-1, $"{Setting.Ref(nameof(ImportOptions.VoltageScale))} was given without {Setting.Ref(nameof(ImportOptions.VoltageChannels))}: name the voltage channel(s)");
            }

            return null;
        }

        var ratio = options.VoltageScale ?? 1.0;
        var factors = new double[indices.Count];
        for (var k = 0; k < indices.Count; k++)
        {
            var channel = channels[indices[k]];
            if (channel.Quantity != ChannelQuantity.Voltage)
            {
                throw fail(indices[k],
                    $"{Setting.Ref(nameof(ImportOptions.VoltageChannels))}: channel '{channel.Name}' is in '{channel.SourceUnit}', not a voltage (V, mV or kV)");
            }

            if (residual.Contains(indices[k]))
            {
                throw fail(indices[k], $"channel '{channel.Name}' is named by {Setting.Ref(nameof(ImportOptions.VoltageChannels))} and also forms the residual current");
            }

            factors[k] = blockFactor(indices[k]) * ratio;
        }

        var source = options.VoltageScale is { } scale
            ? string.Create(CultureInfo.InvariantCulture, $"{unitText} × {Setting.Ref(nameof(ImportOptions.VoltageScale))} {scale:G6}")
            : unitText;
        return new VoltageInput(indices, [.. indices.Select(i => channels[i].Name)], factors, source);
    }
}
