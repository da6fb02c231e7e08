using OxyPlot.Axes;
using PairFit.Core.Data;
using PairFit.Core.Model;
using PairFit.Figures.Rendering;

namespace PairFit.Figures.Plots;

/// <summary>
/// Figure 8: the observed pairs beside as many pairs simulated from the fitted joint model, on the
/// same axes, so that shape, spread and tail clustering can be compared by eye.
/// </summary>
public static class SimulationFigure
{
    public const string Id = "simulated";

    public static Figure Build(PairedSample sample, JointModel model, int seed)
    {
        int n = sample.Count;
        var (sx, sy) = model.Sample(n, seed);
        // common axes: the data range, widened to the simulated points but not beyond 3× the data span
        var (xLo, xHi) = ScatterFigure.Padded(sample.X);
        var (yLo, yHi) = ScatterFigure.Padded(sample.Y);
        var (sxLo, sxHi) = ScatterFigure.Padded(sx);
        var (syLo, syHi) = ScatterFigure.Padded(sy);
        double xSpan = xHi - xLo, ySpan = yHi - yLo;
        xLo = Math.Max(Math.Min(xLo, sxLo), xLo - xSpan); xHi = Math.Min(Math.Max(xHi, sxHi), xHi + xSpan);
        yLo = Math.Max(Math.Min(yLo, syLo), yLo - ySpan); yHi = Math.Min(Math.Max(yHi, syHi), yHi + ySpan);

        var fig = new Figure(Id, "Observed and simulated pairs",
            $"(a) The {n} observed pairs. (b) {n} pairs simulated from the fitted joint model ({Labels.Of(model.X)}; {Labels.Of(model.Y)}; copula {Labels.Of(model.Copula)}), seed {seed}. Both panels share their axes.",
            aspect: 0.5);
        var a = PlotStyle.NewPanel("(a) observed");
        a.Axes.Add(PlotStyle.Linear(AxisPosition.Bottom, sample.XName, xLo, xHi));
        a.Axes.Add(PlotStyle.Linear(AxisPosition.Left, sample.YName, yLo, yHi));
        a.Series.Add(Series.Points(sample.X, sample.Y, "observed"));
        a.IsLegendVisible = false;
        var b = PlotStyle.NewPanel("(b) simulated from the fitted model");
        b.Axes.Add(PlotStyle.Linear(AxisPosition.Bottom, sample.XName, xLo, xHi));
        b.Axes.Add(PlotStyle.Linear(AxisPosition.Left, sample.YName, yLo, yHi));
        b.Series.Add(Series.Points(sx, sy, "simulated", Palette.Blue, OxyPlot.MarkerType.Triangle));
        b.IsLegendVisible = false;
        fig.Data.AddSeries("a", "observed", sample.X, sample.Y);
        fig.Data.AddSeries("b", "simulated", sx, sy);
        fig.Add(a, 0, 0, 0.5, 1);
        fig.Add(b, 0.5, 0, 0.5, 1);
        return fig;
    }
}
