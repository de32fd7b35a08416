using System.Buffers.Binary;
using System.Xml.Linq;
using WaveCheck.Rendering.Plots;

namespace WaveCheck.Rendering.Tests.Plots;

public sealed class PlotRendererTests : IDisposable
{
    private readonly OutputFolder output = new("plots");

    public void Dispose() => output.Dispose();

    [Fact]
    public void Png_files_have_the_png_signature_and_the_stated_size()
    {
        var written = PlotRenderer.WriteAll(ResultBuilder.Typical(), ResultBuilder.Assessment(), output.Path, PlotFormat.Png);

        // A minute-long capture gets all four plots.
        Assert.Equal(["overview.png", "cycles.png", "spectrum.png", "trend.png"], written.Select(Path.GetFileName));
        foreach (var path in written)
        {
            var bytes = File.ReadAllBytes(path);

            // PNG specification (ISO/IEC 15948) §5.2: the 8-byte signature, then IHDR with width and height big-endian.
            Assert.Equal(new byte[] { 0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A }, bytes[..8]);
            Assert.Equal("IHDR", System.Text.Encoding.ASCII.GetString(bytes, 12, 4));
            Assert.Equal(PlotStyle.WidthPx, BinaryPrimitives.ReadInt32BigEndian(bytes.AsSpan(16, 4)));
            Assert.Equal(PlotStyle.HeightPx, BinaryPrimitives.ReadInt32BigEndian(bytes.AsSpan(20, 4)));
        }
    }

    [Fact]
    public void Probe_svg()
    {
        var a = ResultBuilder.Typical();
        a = a with { WorstWindow = a.WorstWindow with { Reason = "<script>alert(1)</script> & \"q\" 'a'" } };
        var svg = PlotRenderer.RenderSvg(PlotKind.Cycles, a, ResultBuilder.Assessment());
        File.WriteAllText(System.IO.Path.Combine(output.Path, "probe.svg"), svg);
    }
}
