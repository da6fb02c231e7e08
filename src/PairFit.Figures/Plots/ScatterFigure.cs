using OxyPlot;
using OxyPlot.Axes;
using PairFit.Core.Data;
using PairFit.Figures.Rendering;

namespace PairFit.Figures.Plots;

/// <summary>
/// Figure 1: the data as a scatter, with each variable's histogram along its axis. Three panels
/// share fixed plot margins so the histograms line up exactly with the scatter's axes.
/// </summary>
public static class ScatterFigure
{
    public const string Id = "scatter";

    public static Figure Build(PairedSample sample)
    {
        var (xLo, xHi) = Padded(sample.X);
        var (yLo, yHi) = Padded(sample.Y);
        var (xEdges, xDens) = FigureMath.Histogram(sample.X);
        var (yEdges, yDens) = FigureMath.Histogram(sample.Y);

        // margins in device-independent units, shared so that plot areas align across panels
        const double left = 62, bottom = 44, side = 8, topPad = 8;
        const double mainW = 0.78, mainH = 0.78;

        var main = PlotStyle.NewPanel("");
        main.PlotMargins = new OxyThickness(left, side, side, bottom);
        main.Axes.Add(PlotStyle.Linear(AxisPosition.Bottom, sample.XName, xLo, xHi));
        main.Axes.Add(PlotStyle.Linear(AxisPosition.Left, sample.YName, yLo, yHi));
        main.Series.Add(Series.Points(sample.X, sample.Y, $"observed pairs (n = {sample.Count})"));
        main.IsLegendVisible = false;

        var top = PlotStyle.NewPanel("");
        top.PlotMargins = new OxyThickness(left, topPad, side, 2);
        top.Axes.Add(Hidden(PlotStyle.Linear(AxisPosition.Bottom, "", xLo, xHi)));
        top.Axes.Add(PlotStyle.Linear(AxisPosition.Left, "density", 0));
        top.Axes[1].MajorGridlineStyle = LineStyle.None;
        top.Axes[1].MaximumPadding = 0.08;
        top.Series.Add(Series.Histogram(xEdges, xDens));

        var right = PlotStyle.NewPanel("");
        right.PlotMargins = new OxyThickness(2, side, topPad, bottom);
        right.Axes.Add(Hidden(PlotStyle.Linear(AxisPosition.Left, "", yLo, yHi)));
        right.Axes.Add(PlotStyle.Linear(AxisPosition.Bottom, "density", 0));
        right.Axes[1].MajorGridlineStyle = LineStyle.None;
        right.Axes[1].MaximumPadding = 0.08;
        right.Series.Add(Series.Histogram(yEdges, yDens, sideways: true));

        var fig = new Figure(Id, "Observed pairs",
            $"Scatter of the {sample.Count} observed pairs ({sample.XName}, {sample.YName}) with the histogram of each variable along its axis (density scale, Freedman–Diaconis bins).",
            aspect: 0.85);
        fig.Add(top, 0, 0, mainW, 1 - mainH);
        fig.Add(main, 0, 1 - mainH, mainW, mainH);
        fig.Add(right, mainW, 1 - mainH, 1 - mainW, mainH);

        fig.Data.AddSeries("scatter", "observed", sample.X, sample.Y);
        for (int k = 0; k < xDens.Length; k++) fig.Data.Add("x histogram", "bin [x, y) density", xEdges[k], xEdges[k + 1], xDens[k]);
        for (int k = 0; k < yDens.Length; k++) fig.Data.Add("y histogram", "bin [x, y) density", yEdges[k], yEdges[k + 1], yDens[k]);
        return fig;
    }

    private static Axis Hidden(Axis a)
    {
        a.TextColor = OxyColors.Transparent;
        a.TickStyle = TickStyle.None;
        a.AxislineStyle = LineStyle.None;
        a.MajorGridlineStyle = LineStyle.None;
        return a;
    }

    /// <summary>Data range widened by 4 % on each side so edge points are not cut by the axes.</summary>
    internal static (double Lo, double Hi) Padded(ReadOnlySpan<double> values, double fraction = 0.04)
    {
        double lo = double.PositiveInfinity, hi = double.NegativeInfinity;
        foreach (double v in values)
        {
            if (!double.IsFinite(v)) continue;
            if (v < lo) lo = v;
            if (v > hi) hi = v;
        }
        double pad = hi > lo ? (hi - lo) * fraction : 0.5;
        return (lo - pad, hi + pad);
    }
}
