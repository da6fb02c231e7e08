using OxyPlot;
using OxyPlot.Axes;
using OxyPlot.Series;
using PairFit.Core.Data;
using PairFit.Core.Model;
using PairFit.Core.Projection;
using PairFit.Core.Results;
using PairFit.Figures.Rendering;

namespace PairFit.Figures.Plots;

/// <summary>A point in data space to mark on the return-period panels, e.g. the design event.</summary>
public sealed record MarkedEvent(string Label, double X, double Y);

/// <summary>
/// Figure 7: return-period isolines of the fitted joint model in data space, over the data, one
/// panel per kind of joint exceedance (Salvadori, De Michele and Durante 2011):
/// AND, P(X &gt; x and Y &gt; y) = μ/T; OR, P(X &gt; x or Y &gt; y) = μ/T; Kendall, 1 − K_C(C(u, v)) = μ/T,
/// with μ the mean time between events. The isolines and their most likely design events come from
/// the joint analysis (<see cref="JointAnalysis.Designs"/>); this figure only draws them.
/// </summary>
public static class ReturnPeriodFigure
{
    public const string Id = "return-periods";

    private static readonly string[] Kinds = ["and", "or", "kendall"];
    private static readonly string[] Headings = ["(a) AND", "(b) OR", "(c) Kendall"];

    /// <param name="designs">Isolines with their kind ("and", "or", "kendall") and return period.</param>
    /// <param name="yearsPerEvent">μ, mean time between observed pairs (1 for annual maxima).</param>
    /// <param name="designPair">A pair to mark with a star (the design pair of the joint analysis), if any.</param>
    public static Figure Build(PairedSample sample, JointModel model, IReadOnlyList<DesignEvent> designs, double yearsPerEvent,
        MarkedEvent? designPair = null)
    {
        var periods = new SortedSet<double>();
        foreach (var d in designs) periods.Add(d.ReturnPeriod);
        double[] ts = [.. periods];
        double pMin = yearsPerEvent / ts[^1];
        var (xLo, xHi) = ScatterFigure.Padded(sample.X);
        var (yLo, yHi) = ScatterFigure.Padded(sample.Y);
        // reach past the longest-period isolines' corners so the curves are seen turning
        xHi = Math.Max(xHi, model.X.Quantile(1 - pMin / 20));
        yHi = Math.Max(yHi, model.Y.Quantile(1 - pMin / 20));

        string unit = yearsPerEvent == 1 ? "" : $" years (mean time between pairs μ = {Labels.Number(yearsPerEvent)} years)";
        var fig = new Figure(Id, "Joint return periods",
            $"Return-period isolines of the fitted model over the observed pairs (grey), T = {string.Join(", ", Array.ConvertAll(ts, Labels.Number))}{unit}. " +
            "AND: both variables exceed (x, y); OR: at least one does; Kendall: the pair is more extreme than (x, y) in the sense of the copula's Kendall distribution (Salvadori, De Michele and Durante 2011). " +
            "Diamonds mark the most likely design event on each isoline (largest joint density)" +
            (designPair is null ? "." : $"; the star marks {designPair.Label}."),
            aspect: 0.5);

        for (int k = 0; k < Kinds.Length; k++)
        {
            var m = PlotStyle.NewPanel(Headings[k]);
            m.Axes.Add(PlotStyle.Linear(AxisPosition.Bottom, sample.XName, xLo, xHi));
            m.Axes.Add(PlotStyle.Linear(AxisPosition.Left, k == 0 ? sample.YName : "", yLo, yHi));
            var pts = Series.Points(sample.X, sample.Y, "data");
            pts.RenderInLegend = false;
            m.Series.Add(pts);
            var likely = new ScatterSeries { RenderInLegend = false, MarkerType = MarkerType.Diamond, MarkerSize = 4.5, MarkerFill = OxyColors.White, MarkerStroke = Palette.Black, MarkerStrokeThickness = 1 };
            foreach (var d in designs)
            {
                if (!string.Equals(d.Kind, Kinds[k], StringComparison.OrdinalIgnoreCase)) continue;
                int style = ts.Length - 1 - Array.IndexOf(ts, d.ReturnPeriod);
                double[] cx = new double[d.Isoline.Count], cy = new double[d.Isoline.Count];
                for (int i = 0; i < cx.Length; i++) { cx[i] = d.Isoline[i].X; cy[i] = d.Isoline[i].Y; }
                string label = $"T = {Labels.Number(d.ReturnPeriod)}";
                m.Series.Add(Series.Line(cx, cy, label, style, 1.5));
                fig.Data.AddSeries(Headings[k], label, cx, cy);
                if (d.MostLikely is { } ml)
                {
                    likely.Points.Add(new ScatterPoint(ml.X, ml.Y));
                    fig.Data.Add(Headings[k], $"most likely design event, {label}", ml.X, ml.Y, ml.LogDensity);
                }
            }
            m.Series.Add(likely);
            if (designPair is not null)
            {
                var s = new ScatterSeries { RenderInLegend = false, MarkerType = MarkerType.Star, MarkerSize = 7, MarkerStroke = Palette.Black, MarkerStrokeThickness = 1.6 };
                s.Points.Add(new ScatterPoint(designPair.X, designPair.Y));
                m.Series.Add(s);
                fig.Data.Add(Headings[k], designPair.Label, designPair.X, designPair.Y);
            }
            PlotStyle.LegendBelow(m);
            fig.Add(m, k / 3.0, 0, 1 / 3.0, 1);
        }
        fig.Data.AddSeries("data", "observed", sample.X, sample.Y);
        return fig;
    }
}
