using WaveCheck.Core.Capture;

namespace WaveCheck.Core.Tests.Capture;

/// <summary>The one channel choice every reader uses: by name or number, sums, refusals and the guessed default.</summary>
public sealed class ChannelSelectionTests
{
    private static readonly ChannelInfo[] Channels =
    [
        new(0, "L1", "A", ChannelQuantity.Current, 1, null),
        new(1, "L2", "A", ChannelQuantity.Current, 1, null),
        new(2, "N", "A", ChannelQuantity.Current, 1, null),
        new(3, "clamp", "mV", ChannelQuantity.Voltage, 1e-3, null),
        new(4, "freq", "Hz", ChannelQuantity.Unscaled, 1, null),
    ];

    private static readonly int[] Currents = [0, 1, 2];

    private static Exception Fail(string problem) => new InvalidDataException(problem);

    private static ChannelSelection Resolve(ImportOptions options, IReadOnlyList<int>? candidates = null, string? unnamed = null) =>
        ChannelSelection.Resolve(Channels, options, candidates ?? Currents, "nothing to choose", Fail, unnamed);

    [Fact]
    public void A_channel_is_found_by_name_in_any_case_or_by_its_number()
    {
        Assert.Equal([2], Resolve(new ImportOptions { Channel = " n " }).Indices);
        Assert.Equal([1], Resolve(new ImportOptions { Channel = "2" }).Indices);
        var sum = Resolve(new ImportOptions { SumChannels = ["l1", "2", "N"] });
        Assert.Equal([0, 1, 2], sum.Indices);
        Assert.Equal("L1+L2+N", sum.Source);
        Assert.Null(sum.Warning);
    }

    [Theory]
    [InlineData(null, new[] { "L1", "l1" }, "⟦SumChannels⟧ names channel 'L1' twice")]
    [InlineData(null, new[] { "L1", "1" }, "⟦SumChannels⟧ names channel 'L1' twice")]
    [InlineData("L9", null, "⟦Channel⟧: no channel named 'L9' (channels: L1, L2, N, clamp, freq)")]
    [InlineData("6", null, "⟦Channel⟧ 6: channel number out of range 1..5")]
    [InlineData(null, new[] { "L1", "0" }, "⟦SumChannels⟧ 0: channel number out of range 1..5")]
    public void Unknown_channels_and_a_channel_summed_twice_are_refused(string? channel, string[]? sum, string problem)
    {
        // The problem names the setting marked (Setting.Ref), for the caller's exception to write in its user's words.
        var error = Assert.Throws<InvalidDataException>(() => Resolve(new ImportOptions { Channel = channel, SumChannels = sum }));
        Assert.Equal(problem, error.Message);
        Assert.Equal(problem.Replace("⟦", "", StringComparison.Ordinal).Replace("⟧", "", StringComparison.Ordinal),
            new UserInputException(problem).Message);
    }

    [Fact]
    public void With_nothing_chosen_the_only_candidate_is_used_and_several_are_refused_with_the_choices()
    {
        var one = Resolve(new ImportOptions(), [2]);
        Assert.Equal([2], one.Indices);
        Assert.Null(one.Warning);

        // Several channels and none named as the residual current: conductor currents are the usual case (issue 14),
        // and taking the first would judge a load current as a residual current. Refused, naming both ways out.
        var several = Assert.Throws<InvalidDataException>(() => Resolve(new ImportOptions()));
        Assert.Equal("3 channels could carry the residual current (L1, L2, N) and none is named as the residual current: " +
                     "give ⟦SumChannels⟧ L1,L2,N to add live conductors' currents, or ⟦Channel⟧ L1 if that one is the residual current", several.Message);
        var reason = Assert.Throws<InvalidDataException>(() => Resolve(new ImportOptions(), [0, 1], "2 channels are named as the earth current, not one"));
        Assert.Contains("(L1, L2) and 2 channels are named as the earth current, not one:", reason.Message, StringComparison.Ordinal);

        // A format whose labels say nothing about the residual current warns even about its only candidate.
        var unnamed = Resolve(new ImportOptions(), [1], "no channel is named as the residual current");
        Assert.Equal("The only current channel, 'L2', is used as the residual current, though no channel is named as the residual current. Choose another with ⟦Channel⟧ or add channels with ⟦SumChannels⟧.", unnamed.Warning!.Message);

        Assert.Equal("nothing to choose", Assert.Throws<InvalidDataException>(() => Resolve(new ImportOptions(), [])).Message);
    }

    [Fact]
    public void A_channel_is_also_found_by_its_name_as_written_in_the_file()
    {
        string[] written = ["L1_A", "L2 [A]", "N_A", "clamp (mV)", "freq_Hz"];
        var sum = ChannelSelection.Resolve(Channels, new ImportOptions { SumChannels = ["L1_A", "l2 [a]", "N"] }, Currents,
            "nothing to choose", Fail, writtenNames: written);
        Assert.Equal([0, 1, 2], sum.Indices);
        Assert.Equal("L1+L2+N", sum.Source);
        var one = ChannelSelection.Resolve(Channels, new ImportOptions { Channel = "N_A" }, Currents, "nothing to choose", Fail,
            writtenNames: written);
        Assert.Equal([2], one.Indices);
        Assert.Equal("⟦Channel⟧: no channel named 'N_B' (channels: L1, L2, N, clamp, freq)",
            Assert.Throws<InvalidDataException>(() => ChannelSelection.Resolve(Channels, new ImportOptions { Channel = "N_B" },
                Currents, "nothing to choose", Fail, writtenNames: written)).Message);
    }

    [Fact]
    public void A_voltage_becomes_amperes_through_the_sensitivity_and_the_sum_follows_Kirchhoff()
    {
        var selection = Resolve(new ImportOptions { SumChannels = ["L1", "L2", "N", "clamp"] });
        var refused = Assert.Throws<InvalidDataException>(() => selection.AmperesPerSiUnit(Channels, new ImportOptions(), (_, p) => Fail(p)));
        Assert.Equal("channel 'clamp' is a voltage (mV): give ⟦SensitivityVPerA⟧ (e.g. \"10 mV/mA\") to turn it into a current", refused.Message);
        var unscaled = Resolve(new ImportOptions { Channel = "freq" });
        Assert.Contains("neither a current nor a voltage",
            Assert.Throws<InvalidDataException>(() => unscaled.AmperesPerSiUnit(Channels, new ImportOptions(), (_, p) => Fail(p))).Message);

        // 10 V/A: the clamp's volts / 10 are amperes (closed form).
        var factors = selection.AmperesPerSiUnit(Channels, new ImportOptions { SensitivityVPerA = 10 }, (_, p) => Fail(p));
        Assert.Equal([1, 1, 1, 0.1], factors);

        // Kirchhoff's current law: L1 + L2 + N is what leaks; here 2 A + (-1.5 A) + (-0.49 A) = 10 mA, plus a clamp
        // reading of 0.05 V through 10 V/A = 5 mA: 15 mA.
        var block = new CaptureBlock(5, 1, 1000);
        double[] values = [2, -1.5, -0.49, 0.05, 50];
        for (var c = 0; c < values.Length; c++)
        {
            block.ChannelBuffer(c)[0] = values[c];
        }

        selection.FormResidual(block, 1, factors);
        Assert.Equal(0.015, block.ResidualBuffer[0], 1e-15);
    }
}
