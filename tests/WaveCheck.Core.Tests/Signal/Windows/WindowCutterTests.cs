using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class WindowCutterTests
{
    private const double Fs = 50_000;

    private static WindowSlot[] Batch(int capacity, int count = 8)
    {
        var slots = new WindowSlot[count];
        for (var i = 0; i < count; i++)
        {
            slots[i] = new WindowSlot(capacity, 50, 0);
        }

        return slots;
    }

    [Theory]
    [InlineData(50.0, 10, 10_000)]
    [InlineData(49.97, 10, 10_006)]
    [InlineData(50.4, 10, 9_921)]
    [InlineData(60.0, 12, 10_000)]
    [InlineData(47.5, 10, 10_526)]
    public void LengthIsTheTrackedCyclesRoundedToWholeSamples(double frequencyHz, int cycles, int expected)
    {
        // Closed form: round(N·fs/f) (IEC 61000-4-7 synchronised window): 10·50 000/49.97 = 10 006.004,
        // 10·50 000/50.4 = 9 920.6, 10·50 000/47.5 (5 % below nominal) = 10 526.3.
        var cutter = new WindowCutter(Fs, cycles, cycles == 10 ? 50 : 60, 50, Batch(11_000));
        Assert.Equal(expected, cutter.LengthFor(frequencyHz));
        Assert.True(expected <= cutter.MaxLength);
    }

    [Fact]
    public void SlotsHoldTheLongestWindowOfTheTrackingRange()
    {
        // Closed form: ⌈10·50 000/(50·0.95)⌉ + 2 = ⌈10 526.3⌉ + 2 = 10 529 samples.
        Assert.Equal(10_529, WindowCutter.CapacityFor(Fs, 10, 50));
    }

    [Fact]
    public void AFrequencyStepChangesTheNextWindowOnlyAndWindowsStayContiguous()
    {
        // A ramp x[i] = i cut at 50 Hz, then at 50.4 Hz from the fourth window on (a frequency step), in blocks of a
        // prime size: every window must hold exactly the samples Start .. Start + Length − 1, the first three
        // 10 000 long and the rest 9 921 (round(10·fs/f)), across the batch exchanges.
        var capacity = WindowCutter.CapacityFor(Fs, 10, 50);
        var cutter = new WindowCutter(Fs, 10, 50, 50, Batch(capacity, 2));
        var spare = Batch(capacity, 2);
        var ramp = new double[120_000];
        for (var i = 0; i < ramp.Length; i++)
        {
            ramp[i] = i;
        }

        var windows = new List<(long Start, int Length)>();
        for (var at = 0; at < ramp.Length; at += 7_919)
        {
            var block = ramp.AsSpan(at, Math.Min(7_919, ramp.Length - at));
            while (!block.IsEmpty)
            {
                block = block[cutter.Fill(block)..];
                if (!cutter.IsFull)
                {
                    continue;
                }

                var slot = cutter.Seal();
                for (var i = 0; i < slot.Length; i++)
                {
                    Assert.Equal(slot.Start + i, slot.Window[i]);
                }

                windows.Add((slot.Start, slot.Length));
                cutter.Advance(cutter.LengthFor(windows.Count < 3 ? 50 : 50.4));
                if (cutter.BatchFull)
                {
                    var (slots, count) = cutter.TakeBatch(spare);
                    Assert.Equal(2, count);
                    spare = slots;
                }
            }
        }

        Assert.Equal([10_000, 10_000, 10_000], windows.Take(3).Select(w => w.Length));
        Assert.All(windows.Skip(3), w => Assert.Equal(9_921, w.Length));
        for (var i = 1; i < windows.Count; i++)
        {
            Assert.Equal(windows[i - 1].Start + windows[i - 1].Length, windows[i].Start);
        }

        // The tail after the last whole window: its samples, where it starts.
        var end = windows[^1].Start + windows[^1].Length;
        Assert.Equal(end, cutter.Start);
        Assert.Equal(ramp.Length - end, cutter.Filled);
        Assert.Equal(ramp.AsSpan((int)end).ToArray(), cutter.Partial.ToArray());
    }
}
