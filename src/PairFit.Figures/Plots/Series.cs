using OxyPlot;
using OxyPlot.Series;
using PairFit.Figures.Rendering;

namespace PairFit.Figures.Plots;

/// <summary>Series builders in PairFit's look, shared by every figure.</summary>
internal static class Series
{
    /// <summary>
    /// A regular 12-gon standing in for a circle marker: at 2–3 px it looks round, but the vector
    /// formats store it as one short polygon instead of a chain of curve segments (a data set of
    /// 3000 pairs made a 6 MB SVG with true circles).
    /// </summary>
    private static readonly ScreenPoint[] RoundOutline = MakeRound(12);

    private static ScreenPoint[] MakeRound(int sides)
    {
        var p = new ScreenPoint[sides];
        for (int i = 0; i < sides; i++)
            p[i] = new ScreenPoint(Math.Cos(2 * Math.PI * i / sides), Math.Sin(2 * Math.PI * i / sides));
        return p;
    }

    /// <summary>Observed points: small open grey circles, so overplotting stays visible.</summary>
    public static ScatterSeries Points(ReadOnlySpan<double> x, ReadOnlySpan<double> y, string title, OxyColor? colour = null, MarkerType marker = MarkerType.Circle, double size = 2.2)
    {
        var s = new ScatterSeries
        {
            Title = title,
            MarkerType = marker == MarkerType.Circle ? MarkerType.Custom : marker,
            MarkerOutline = marker == MarkerType.Circle ? RoundOutline : null,
            MarkerSize = x.Length > 1000 ? 0.75 * size : size, // big samples: smaller marks, less overplotting
            MarkerFill = OxyColors.Transparent,
            MarkerStroke = colour ?? Palette.Data,
            MarkerStrokeThickness = 0.8,
        };
        for (int i = 0; i < x.Length; i++)
            if (double.IsFinite(x[i]) && double.IsFinite(y[i])) s.Points.Add(new ScatterPoint(x[i], y[i]));
        return s;
    }

    /// <summary>A fitted or reference curve in series style <paramref name="index"/> (colour and dash).</summary>
    public static LineSeries Line(ReadOnlySpan<double> x, ReadOnlySpan<double> y, string? title, int index, double thickness = 1.6)
    {
        var s = new LineSeries
        {
            Title = title,
            Color = Palette.Colour(index),
            LineStyle = Palette.Dash(index),
            StrokeThickness = thickness,
            MarkerType = MarkerType.None,
        };
        for (int i = 0; i < x.Length; i++)
            if (double.IsFinite(x[i]) && double.IsFinite(y[i])) s.Points.Add(new DataPoint(x[i], y[i]));
            else if (s.Points.Count > 0 && s.Points[^1].IsDefined()) s.Points.Add(DataPoint.Undefined); // break the line
        return s;
    }

    /// <summary>A thin reference line (independence, diagonal) in light grey dots.</summary>
    public static LineSeries Reference(ReadOnlySpan<double> x, ReadOnlySpan<double> y, string? title)
    {
        var s = Line(x, y, title, 0, 1.0);
        s.Color = OxyColor.FromRgb(150, 150, 150);
        s.LineStyle = LineStyle.Dot;
        return s;
    }

    /// <summary>Histogram bars on a density scale; horizontal bars when <paramref name="sideways"/>.</summary>
    public static RectangleBarSeries Histogram(double[] edges, double[] density, bool sideways = false, string? title = null)
    {
        var s = new RectangleBarSeries
        {
            Title = title,
            FillColor = OxyColor.FromRgb(215, 215, 215),
            StrokeColor = OxyColor.FromRgb(120, 120, 120),
            StrokeThickness = 0.6,
        };
        for (int k = 0; k < density.Length; k++)
            s.Items.Add(sideways
                ? new RectangleBarItem(0, edges[k], density[k], edges[k + 1])
                : new RectangleBarItem(edges[k], 0, edges[k + 1], density[k]));
        return s;
    }
}
