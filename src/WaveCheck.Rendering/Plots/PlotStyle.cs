using OxyPlot;
using OxyPlot.Axes;
using OxyPlot.Legends;

namespace WaveCheck.Rendering.Plots;

/// <summary>
/// Shared look of every plot: the Okabe-Ito colour-blind-safe palette, line styles that separate series in greyscale,
/// fonts, and the one conversion of amperes to milliamperes for axis values.
/// </summary>
/// <remarks>Palette: Okabe and Ito, "Color Universal Design" (2002/2008), eight colours distinguishable by the
/// common forms of colour-vision deficiency. Every series also differs by line style or marker so greyscale prints work.</remarks>
public static class PlotStyle
{
    /// <summary>Okabe-Ito black.</summary>
    public static readonly OxyColor Black = OxyColor.FromRgb(0x00, 0x00, 0x00);

    /// <summary>Okabe-Ito orange.</summary>
    public static readonly OxyColor Orange = OxyColor.FromRgb(0xE6, 0x9F, 0x00);

    /// <summary>Okabe-Ito sky blue.</summary>
    public static readonly OxyColor SkyBlue = OxyColor.FromRgb(0x56, 0xB4, 0xE9);

    /// <summary>Okabe-Ito bluish green.</summary>
    public static readonly OxyColor BluishGreen = OxyColor.FromRgb(0x00, 0x9E, 0x73);

    /// <summary>Okabe-Ito blue.</summary>
    public static readonly OxyColor Blue = OxyColor.FromRgb(0x00, 0x72, 0xB2);

    /// <summary>Okabe-Ito vermillion.</summary>
    public static readonly OxyColor Vermillion = OxyColor.FromRgb(0xD5, 0x5E, 0x00);

    /// <summary>Okabe-Ito reddish purple.</summary>
    public static readonly OxyColor ReddishPurple = OxyColor.FromRgb(0xCC, 0x79, 0xA7);

    /// <summary>Font family used in every plot (installed with the DejaVu fonts; Skia falls back to its default otherwise).</summary>
    public const string FontFamily = "DejaVu Sans";

    /// <summary>Width of a plot, pixels at 96 dpi: fits the text width of A4 and Letter portrait when printed at ~26 cm.</summary>
    public const int WidthPx = 1000;

    /// <summary>Height of a plot, pixels at 96 dpi.</summary>
    public const int HeightPx = 450;

    /// <summary>Milliamperes for an axis value. Plots only: text for a person goes through <see cref="WaveCheck.Core.Text.CurrentText"/>.</summary>
    /// <param name="amperes">Current, amperes.</param>
    public static double AxisMilliamps(double amperes) => amperes * 1000.0;

    /// <summary>A new model with the house fonts, a title and a legend placed outside the plot area, below it.</summary>
    public static PlotModel NewModel(string title, string? subtitle = null)
    {
        var model = new PlotModel
        {
            Title = title,
            Subtitle = subtitle,
            DefaultFont = FontFamily,
            DefaultFontSize = 13,
            TitleFontSize = 16,
            SubtitleFontSize = 12,
            Background = OxyColors.White,
            PlotAreaBorderColor = OxyColor.FromRgb(0x60, 0x60, 0x60),
            TextColor = Black,
            PlotMargins = new OxyThickness(double.NaN),
        };
        model.Legends.Add(new Legend
        {
            LegendPlacement = LegendPlacement.Outside,
            LegendPosition = LegendPosition.BottomCenter,
            LegendOrientation = LegendOrientation.Horizontal,
            LegendBorderThickness = 0,
            LegendFontSize = 12,
            LegendItemSpacing = 18,
        });
        return model;
    }

    /// <summary>A linear axis with the house grid.</summary>
    public static LinearAxis Linear(AxisPosition position, string title, string? unit) => Grid(new LinearAxis
    {
        Position = position,
        Title = title,
        Unit = unit,
    });

    /// <summary>A logarithmic axis with the house grid.</summary>
    public static LogarithmicAxis Log(AxisPosition position, string title, string? unit) => Grid(new LogarithmicAxis
    {
        Position = position,
        Title = title,
        Unit = unit,
    });

    private static T Grid<T>(T axis)
        where T : Axis
    {
        axis.MajorGridlineStyle = LineStyle.Solid;
        axis.MajorGridlineColor = OxyColor.FromRgb(0xDD, 0xDD, 0xDD);
        // Solid, not dotted: the Skia SVG canvas writes every dash as its own shape, and a dotted grid on a log axis
        // makes a megabyte of squares.
        axis.MinorGridlineStyle = LineStyle.Solid;
        axis.MinorGridlineColor = OxyColor.FromRgb(0xF2, 0xF2, 0xF2);
        axis.MinorGridlineThickness = 0.6;
        axis.TitleFontSize = 13;
        axis.AxisTitleDistance = 6;
        return axis;
    }
}
