namespace WaveCheck.Rendering.Plots;

/// <summary>File format of a written plot.</summary>
public enum PlotFormat
{
    /// <summary>Raster image, <c>.png</c>.</summary>
    Png,

    /// <summary>Vector image, <c>.svg</c>.</summary>
    Svg,
}

/// <summary>File extensions of <see cref="PlotFormat"/>.</summary>
public static class PlotFormats
{
    /// <summary>The extension with its dot: <c>.png</c> or <c>.svg</c>.</summary>
    public static string Extension(this PlotFormat format) => format switch
    {
        PlotFormat.Png => ".png",
        PlotFormat.Svg => ".svg",
        _ => throw new ArgumentOutOfRangeException(nameof(format), format, "unknown plot format"),
    };

    /// <summary>The format a file name asks for by its extension (case-insensitive).</summary>
    /// <param name="path">File name or path ending in <c>.png</c> or <c>.svg</c>.</param>
    /// <exception cref="ArgumentException">Any other extension.</exception>
    public static PlotFormat FromPath(string path)
    {
        var extension = Path.GetExtension(path);
        if (extension.Equals(".png", StringComparison.OrdinalIgnoreCase))
        {
            return PlotFormat.Png;
        }

        if (extension.Equals(".svg", StringComparison.OrdinalIgnoreCase))
        {
            return PlotFormat.Svg;
        }

        throw new ArgumentException($"plot file must end in .png or .svg (got '{path}')", nameof(path));
    }
}
