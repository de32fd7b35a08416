using System.Buffers.Binary;
using System.Xml.Linq;
using WaveCheck.Core.Text;
using WaveCheck.Rendering.Plots;

namespace WaveCheck.Rendering.Tests.Plots;

public sealed class PlotRendererTests : IDisposable
{
    private readonly OutputFolder output = new("plots");

    public void Dispose() => output.Dispose();

    [Fact]
    public void Png_files_have_the_png_signature_and_the_stated_size()
    {
        var written = PlotRenderer.WriteAll(ResultBuilder.Typical(), ResultBuilder.TypicalAssessment(), output.Path, PlotFormat.Png);

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

    [Theory]
    [InlineData(PlotKind.Overview, new[] { "residual current [mA]", "time [s]", "0.5 IΔn = 15.0 mA", "0.3 IΔn = 9.00 mA", "DC level 5.10 mA", "alarm", "transient" })]
    [InlineData(PlotKind.Cycles, new[] { "phase within the mains period [°]", "residual current [mA]", "0.5 IΔn = 15.0 mA", "smooth DC floor 2.30 mA", "phase-controlled half-wave: current-delay angle α = 90°", "cycle 4" })]
    [InlineData(PlotKind.Spectrum, new[] { "frequency [Hz]", "RMS [mA]", "H1", "H2", "4.2 kHz: 0.560 mA", "8.4 kHz: 0.090 mA", "AC, A: mains only", "B+ only: 1–20 kHz" })]
    [InlineData(PlotKind.Trend, new[] { "time [s]", "residual current [mA]", "0.5 IΔn = 15.0 mA", "residual RMS", "smooth DC", "above 1 kHz (RMS)" })]
    public void Svg_is_xml_of_the_stated_size_with_the_annotation_texts(PlotKind kind, string[] texts)
    {
        var svg = PlotRenderer.RenderSvg(kind, ResultBuilder.Typical(), ResultBuilder.TypicalAssessment());

        var root = XDocument.Parse(svg).Root!;
        Assert.Equal("svg", root.Name.LocalName);
        Assert.Equal(PlotStyle.WidthPx.ToString(System.Globalization.CultureInfo.InvariantCulture), root.Attribute("width")?.Value);
        Assert.Equal(PlotStyle.HeightPx.ToString(System.Globalization.CultureInfo.InvariantCulture), root.Attribute("height")?.Value);
        var drawn = SvgTexts(root);
        Assert.All(texts, t => Assert.Contains(t, drawn));
    }

    [Fact]
    public void Without_an_assessment_no_device_lines_are_drawn()
    {
        var drawn = SvgTexts(XDocument.Parse(PlotRenderer.RenderSvg(PlotKind.Overview, ResultBuilder.Typical(), null)).Root!);

        Assert.DoesNotContain(drawn, t => t.Contains("IΔn", StringComparison.Ordinal));
        Assert.Contains("time [s]", drawn);
    }

    [Fact]
    public void The_cycles_plot_draws_the_peaks_of_the_window_it_shows()
    {
        var analysis = ResultBuilder.Typical();
        var window = analysis.WorstWindow.Figures!;
        // A decimated trend row covering the same time holds a merged window's peaks, not this one's: never drawn.
        analysis = analysis with { Trend = [.. analysis.Trend.Select(r => r with { PeakPositiveA = 0.5, PeakNegativeA = -0.5 })] };
        var drawn = SvgTexts(XDocument.Parse(PlotRenderer.RenderSvg(PlotKind.Cycles, analysis, null)).Root!);
        Assert.Contains($"peaks: highest {CurrentText.WithUnit(window.PeakPositiveA)}, lowest {CurrentText.WithUnit(window.PeakNegativeA)} (this window)", drawn);

        // An excerpt without figures: the whole capture's peaks, said so.
        var bare = analysis with { WorstWindow = analysis.WorstWindow with { Figures = null } };
        drawn = SvgTexts(XDocument.Parse(PlotRenderer.RenderSvg(PlotKind.Cycles, bare, null)).Root!);
        Assert.Contains($"peaks: highest {CurrentText.WithUnit(bare.Summary.PeakPositiveA)}, lowest {CurrentText.WithUnit(bare.Summary.PeakNegativeA)} (whole capture)", drawn);
    }

    [Fact]
    public void File_derived_text_is_escaped_inside_svg()
    {
        var analysis = ResultBuilder.Typical();
        const string hostile = "<script>alert(1)</script> & \"q\"";
        analysis = analysis with { WorstWindow = analysis.WorstWindow with { Reason = hostile } };

        var svg = PlotRenderer.RenderSvg(PlotKind.Cycles, analysis, null);

        // Parsing succeeds only if the markup characters were escaped; the text reads back as written.
        var root = XDocument.Parse(svg).Root!;
        Assert.Contains(SvgTexts(root), t => t.StartsWith(hostile, StringComparison.Ordinal));
        Assert.DoesNotContain(root.Descendants(), e => e.Name.LocalName == "script");
    }

    [Theory]
    [InlineData(PlotFormat.Png)]
    [InlineData(PlotFormat.Svg)]
    public void Flat_zero_capture_renders_every_plot(PlotFormat format)
    {
        var analysis = ResultBuilder.FlatZero();

        // One second of zeros: no trend; the other plots must still draw. Trend is drawn directly to cover it too.
        var folder = System.IO.Path.Combine(output.Path, "flat");
        var written = PlotRenderer.WriteAll(analysis, ResultBuilder.TypicalAssessment(), folder, format);
        PlotRenderer.Write(PlotKind.Trend, analysis, null, System.IO.Path.Combine(folder, "trend" + format.Extension()));

        Assert.Equal(3, written.Count);
        Assert.All(written, p => Assert.True(new FileInfo(p).Length > 1000, p));
    }

    [Fact]
    public void Non_finite_values_leave_gaps_and_do_not_break_a_plot()
    {
        var analysis = ResultBuilder.Typical();
        var rms = analysis.Spectrum.RmsA.ToArray();
        rms[11] = double.NaN; // 55 Hz and 65 Hz: between harmonics
        rms[13] = double.PositiveInfinity;
        var samples = analysis.WorstWindow.SamplesA.ToArray();
        samples[100] = double.NaN;
        analysis = analysis with
        {
            Spectrum = analysis.Spectrum with { RmsA = rms },
            WorstWindow = analysis.WorstWindow with { SamplesA = samples },
        };

        foreach (var kind in PlotRenderer.Applicable(analysis))
        {
            var root = XDocument.Parse(PlotRenderer.RenderSvg(kind, analysis, ResultBuilder.TypicalAssessment())).Root!;
            Assert.DoesNotContain("NaN", root.ToString(), StringComparison.Ordinal);
        }

        // The y range still comes from the finite bins: the 5 mA fundamental bin, times the headroom of SpectrumPlot.
        var y = PlotRenderer.Build(PlotKind.Spectrum, analysis, null).Axes[1];
        Assert.Equal(5 * SpectrumPlot.HeadroomFactor, y.Maximum, 9);
    }

    [Fact]
    public void Format_follows_the_file_extension()
    {
        var path = System.IO.Path.Combine(output.Path, "Spectrum.SVG");

        PlotRenderer.Write(PlotKind.Spectrum, ResultBuilder.Typical(), null, path);

        Assert.Equal("svg", XDocument.Load(path).Root!.Name.LocalName);
        var error = Assert.Throws<ArgumentException>(() => PlotFormats.FromPath("plot.jpg"));
        Assert.Contains("must end in .png or .svg (got 'plot.jpg')", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Trend_only_for_captures_longer_than_a_few_seconds()
    {
        Assert.Contains(PlotKind.Trend, PlotRenderer.Applicable(ResultBuilder.Typical()));
        Assert.DoesNotContain(PlotKind.Trend, PlotRenderer.Applicable(ResultBuilder.FlatZero()));
    }

    [Fact]
    public void Overview_band_keeps_every_bucket_extreme()
    {
        // No decimation: each bucket's min and max appear as the band's edges (two points per bucket).
        var analysis = ResultBuilder.Typical();
        var band = PlotRenderer.Build(PlotKind.Overview, analysis, null).Series.OfType<OxyPlot.Series.AreaSeries>().Single();

        Assert.Equal(2 * analysis.Envelope.MaxA.Count, band.Points.Count);
        Assert.Equal(analysis.Envelope.MaxA.Max() * 1000, band.Points.Max(p => p.Y), 9);
        Assert.Equal(analysis.Envelope.MinA.Min() * 1000, band.Points2.Min(p => p.Y), 9);
    }

    [Fact]
    public void High_rate_capture_keeps_the_svg_small()
    {
        // 1 MHz sampling: 200 000 samples in the worst window, 100 001 spectrum bins. Thinning keeps the drawn points near
        // two per pixel column, so each plot stays a size a report can embed (limit: engineering choice, 400 kB).
        var analysis = ResultBuilder.Typical();
        const double rateHz = 1_000_000;
        var samples = Enumerable.Range(0, 200_000).Select(i => 0.01 * Math.Sin(2 * Math.PI * 50 * i / rateHz)).ToArray();
        var freqs = Enumerable.Range(0, 100_001).Select(b => b * 5.0).ToArray();
        var rms = freqs.Select(f => f % 50 == 0 ? 1e-3 : 1e-6).ToArray();
        analysis = analysis with
        {
            Capture = analysis.Capture with { SampleRateHz = rateHz, SampleCount = 60_000_000 },
            WorstWindow = analysis.WorstWindow with { SampleRateHz = rateHz, SamplesA = samples },
            Spectrum = new WaveCheck.Core.Model.SpectrumResult(5, freqs, rms),
        };

        foreach (var kind in new[] { PlotKind.Cycles, PlotKind.Spectrum })
        {
            var svg = PlotRenderer.RenderSvg(kind, analysis, ResultBuilder.TypicalAssessment());
            Assert.True(svg.Length < 400_000, $"{kind}: {svg.Length} characters");
        }

        // Nyquist 500 kHz lies beyond B+'s 20 kHz (DIN VDE 0664-400): the stretch no type covers is named.
        var spectrum = SvgTexts(XDocument.Parse(PlotRenderer.RenderSvg(PlotKind.Spectrum, analysis, null)).Root!);
        Assert.Contains("no type: above 20 kHz", spectrum);
        var png = System.IO.Path.Combine(output.Path, "high-rate-spectrum.png");
        PlotRenderer.Write(PlotKind.Spectrum, analysis, ResultBuilder.TypicalAssessment(), png);
        Assert.True(new FileInfo(png).Length > 1000);
    }

    private static List<string> SvgTexts(XElement root) =>
        root.Descendants().Where(e => e.Name.LocalName == "text").Select(e => e.Value.Trim()).ToList();
}
