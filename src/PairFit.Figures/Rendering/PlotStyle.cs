using OxyPlot;
using OxyPlot.Axes;
using OxyPlot.Legends;

namespace PairFit.Figures.Rendering;

/// <summary>
/// PairFit's own plot look: open axes (left and bottom lines only, no box), ticks pointing out,
/// faint major grid, 9 pt DejaVu Sans text (available headless; see stack notes section 3), panel
/// headings at the top left, legends outside the plot area so they never hide data.
/// </summary>
public static class PlotStyle
{
    public const string Font = "DejaVu Sans";

    /// <summary>Body text size: 9 pt expressed in device-independent units (1/96 inch).</summary>
    public const double FontSize = 9.0 * 96 / 72;

    public static PlotModel NewPanel(string heading)
    {
        var m = new PlotModel
        {
            DefaultFont = Font,
            DefaultFontSize = FontSize,
            Title = heading,
            TitleFont = Font,
            TitleFontSize = FontSize,
            TitleFontWeight = FontWeights.Normal, // one font face only: PDFs embed whole font files (no subsetting in this Skia build)
            TitleHorizontalAlignment = TitleHorizontalAlignment.CenteredWithinPlotArea,
            TitlePadding = 4,
            PlotAreaBorderThickness = new OxyThickness(0),
            Padding = new OxyThickness(4, 4, 10, 4),
            Background = OxyColors.White,
            TextColor = OxyColors.Black,
            IsLegendVisible = true,
        };
        return m;
    }

    public static LinearAxis Linear(AxisPosition position, string title, double? min = null, double? max = null)
    {
        var a = new LinearAxis { Position = position, Title = title };
        Dress(a);
        if (min is { } lo) a.Minimum = lo;
        if (max is { } hi) a.Maximum = hi;
        return a;
    }

    public static LogarithmicAxis Log(AxisPosition position, string title)
    {
        var a = new LogarithmicAxis { Position = position, Title = title };
        Dress(a);
        return a;
    }

    public static CategoryAxis Category(AxisPosition position, string title, IEnumerable<string> labels)
    {
        var a = new CategoryAxis { Position = position, Title = title };
        a.Labels.AddRange(labels);
        Dress(a);
        a.MajorGridlineStyle = LineStyle.None;
        a.GapWidth = 0.4;
        return a;
    }

    private static void Dress(Axis a)
    {
        a.AxislineStyle = LineStyle.Solid;
        a.AxislineColor = OxyColors.Black;
        a.AxislineThickness = 1;
        a.TickStyle = TickStyle.Outside;
        a.MajorGridlineStyle = LineStyle.Solid;
        a.MajorGridlineColor = Palette.Grid;
        a.MinorGridlineStyle = LineStyle.None;
        a.MinorTickSize = 0;
        a.TitleFontSize = FontSize;
        a.FontSize = FontSize * 0.9;
        a.AxisTitleDistance = 4;
        a.TitleFormatString = "{0}";
        a.IsZoomEnabled = false;
        a.IsPanEnabled = false;
    }

    /// <summary>A legend below the plot area, entries in a row: it never covers data.</summary>
    public static void LegendBelow(PlotModel m)
        => m.Legends.Add(new Legend
        {
            LegendPlacement = LegendPlacement.Outside,
            LegendPosition = LegendPosition.BottomCenter,
            LegendOrientation = LegendOrientation.Horizontal,
            LegendFont = Font,
            LegendFontSize = FontSize * 0.9,
            LegendBorderThickness = 0,
            LegendBackground = OxyColors.Undefined,
            LegendPadding = 2,
            LegendItemSpacing = 10,
            LegendSymbolLength = 30, // long enough to show each dash pattern (grey-scale prints)
            LegendMargin = 4,
        });
}
