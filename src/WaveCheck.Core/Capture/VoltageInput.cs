namespace WaveCheck.Core.Capture;

/// <summary>
/// The channels that carry the circuit's voltage to earth beside the residual current: one (single-phase) or three
/// (the phase-to-earth voltages of L1, L2, L3, in that order). Serialised under <c>capture.voltage</c>, and only when a
/// capture has one, so a capture without a voltage channel reads as before.
/// </summary>
/// <param name="Channels">Indices into <see cref="CaptureInfo.Channels"/>, L1 first.</param>
/// <param name="Names">The channels' names, in the same order.</param>
/// <param name="VoltsPerSiUnit">Per channel, the factor from the value a block holds for it (<see cref="CaptureBlock.Channel"/>)
/// to circuit volts.</param>
/// <param name="Source">How the volts were obtained, for the user to check (e.g. <c>column unit mV × 100</c>).</param>
public sealed record VoltageInput(IReadOnlyList<int> Channels, IReadOnlyList<string> Names, IReadOnlyList<double> VoltsPerSiUnit,
    string Source)
{
    /// <summary>True for three phase-to-earth voltages, false for one.</summary>
    public bool ThreePhase => Channels.Count == 3;

    /// <summary>Writes the circuit voltage of one phase of a block into <paramref name="destinationV"/>.</summary>
    /// <param name="block">A block filled by the reader.</param>
    /// <param name="phase">0 for the single voltage or L1, 1 for L2, 2 for L3.</param>
    /// <param name="destinationV">At least <c>block.Length</c> values, volts.</param>
    public void Form(CaptureBlock block, int phase, Span<double> destinationV)
    {
        ArgumentNullException.ThrowIfNull(block);
        var source = block.Channel(Channels[phase]);
        var k = VoltsPerSiUnit[phase];
        for (var i = 0; i < source.Length; i++)
        {
            destinationV[i] = source[i] * k;
        }
    }
}
