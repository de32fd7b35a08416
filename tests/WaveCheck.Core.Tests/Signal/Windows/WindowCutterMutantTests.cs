using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class WindowCutterMutantTests
{
    [Fact]
    public void EachWholeWindowTakesTheNextSlotOfTheBatch()
    {
        // 10 cycles at 50 Hz and 1 kS/s are round(10·1 000/50) = 200 samples (closed form, IEC 61000-4-7 synchronised
        // window); a ramp x[i] = i cut into a batch of three slots: window j holds samples 200j .. 200j + 199 in slot
        // j, the batch counts 1, 2, 3 whole windows and is full after the third (the contract of BatchCount and
        // BatchFull: whole windows waiting in the batch).
        var capacity = WindowCutter.CapacityFor(1_000, 10, 50);
        var batch = new[] { new WindowSlot(capacity, 50, 0), new WindowSlot(capacity, 50, 0), new WindowSlot(capacity, 50, 0) };
        var cutter = new WindowCutter(1_000, 10, 50, 50, batch);
        var ramp = Enumerable.Range(0, 600).Select(i => (double)i).ToArray();
        var block = ramp.AsSpan();
        for (var j = 0; j < 3; j++)
        {
            Assert.Equal(j, cutter.BatchCount);
            Assert.False(cutter.BatchFull);
            Assert.Same(batch[j], cutter.Filling);
            block = block[cutter.Fill(block)..];
            Assert.True(cutter.IsFull);
            var slot = cutter.Seal();
            Assert.Same(batch[j], slot);
            Assert.Equal(200 * j, slot.Start);
            Assert.Equal(200 * j, slot.Window[0]);
            Assert.Equal((200 * j) + 199, slot.Window[^1]);
            cutter.Advance(cutter.LengthFor(50));
        }

        Assert.Equal(3, cutter.BatchCount);
        Assert.True(cutter.BatchFull);
        var (slots, count) = cutter.TakeBatch([new WindowSlot(capacity, 50, 0)]);
        Assert.Same(batch, slots);
        Assert.Equal(3, count);
        Assert.Equal(0, cutter.BatchCount);
        for (var j = 0; j < 3; j++)
        {
            // Each slot still holds its own window: none was overwritten by a later one.
            Assert.Equal(200 * j, batch[j].Window[0]);
        }
    }
}
