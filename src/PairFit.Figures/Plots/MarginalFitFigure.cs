using OxyPlot;
using OxyPlot.Axes;
using PairFit.Core.Marginals;
using PairFit.Figures.Rendering;

namespace PairFit.Figures.Plots;

/// <summary>A fitted marginal candidate to draw, with the label shown in the legend.</summary>
public sealed record MarginalCurve(string Label, IMarginalDistribution Distribution);

/// <summary>
/// Figure 3 (one per variable): (a) histogram with the fitted densities of the best candidates;
/// (b) quantile–quantile plot of the data against the selected fit, with a pointwise 95 % band.
/// </summary>
public static class MarginalFitFigure
{
    public const int MaxCandidates = 4;

    /// <param name="candidates">Best first; the first one is the selected fit used in the QQ plot.</param>
    public static Figure Build(string id, string variable, ReadOnlySpan<double> values, IReadOnlyList<MarginalCurve> candidates)
    {
        if (candidates.Count == 0) throw new ArgumentException("at least one fitted candidate is needed.", nameof(candidates));
        int n = values.Length;
        var sorted = values.ToArray();
        Array.Sort(sorted);
        var selected = candidates[0];
        var fig = new Figure(id, $"Marginal fit of {variable}",
            $"(a) Histogram of {variable} (density scale) with the fitted densities of the best candidate(s): {string.Join("; ", candidates.Take(MaxCandidates).Select(c => c.Label))}. " +
            $"(b) Quantile–quantile plot of the {n} sorted values against the quantiles of the selected fit ({selected.Label}) at plotting positions i/(n+1); " +
            "the band holds each order statistic with 95 % probability under the fit (pointwise, from the Beta law of uniform order statistics). Points leaving the band point to a misfit, most often in a tail.",
            aspect: 0.5);

        // (a) histogram + densities
        var (edges, dens) = FigureMath.Histogram(values);
        var a = PlotStyle.NewPanel("(a) histogram and fitted densities");
        double lo = edges[0] - 0.05 * (edges[^1] - edges[0]), hi = edges[^1] + 0.05 * (edges[^1] - edges[0]);
        a.Axes.Add(PlotStyle.Linear(AxisPosition.Bottom, variable, lo, hi));
        a.Axes.Add(PlotStyle.Linear(AxisPosition.Left, "density", 0));
        a.Axes[1].MaximumPadding = 0.08;
        a.Series.Add(Series.Histogram(edges, dens, title: "data"));
        for (int k = 0; k < dens.Length; k++) fig.Data.Add("a", "histogram bin [x, y) density", edges[k], edges[k + 1], dens[k]);
        double[] xs = FigureMath.Grid(lo, hi, 200);
        for (int c = 0; c < Math.Min(candidates.Count, MaxCandidates); c++)
        {
            var d = candidates[c].Distribution;
            var ys = new double[xs.Length];
            for (int i = 0; i < xs.Length; i++) ys[i] = d.Density(xs[i]);
            // legend: family only (parameters are in the caption), so the legend never outgrows the panel
            a.Series.Add(Series.Line(xs, ys, d.Family, c));
            fig.Data.AddSeries("a", candidates[c].Label + " density", xs, ys);
        }
        PlotStyle.LegendBelow(a);

        // (b) QQ plot with the order-statistic band, evaluated at ≤ 230 ranks to keep it cheap.
        var dist = selected.Distribution;
        var theo = new double[n];
        for (int i = 0; i < n; i++) theo[i] = dist.Quantile((i + 1.0) / (n + 1));
        // the band changes fastest in the tails: every rank among the 40 smallest and largest, every step-th between
        int step = Math.Max(1, n / 150);
        var bandX = new List<double>();
        var bandLo = new List<double>();
        var bandHi = new List<double>();
        for (int i = 0; i < n; i++)
            if (i < 40 || i >= n - 40 || i % step == 0) AddBand(i);
        void AddBand(int i)
        {
            var (bl, bh) = FigureMath.OrderStatisticBand(dist, n, i + 1, 0.95);
            bandX.Add(theo[i]);
            bandLo.Add(bl);
            bandHi.Add(bh);
        }

        var b = PlotStyle.NewPanel("(b) quantile–quantile plot");
        b.Axes.Add(PlotStyle.Linear(AxisPosition.Bottom, $"fitted quantile ({selected.Distribution.Family})"));
        b.Axes.Add(PlotStyle.Linear(AxisPosition.Left, $"observed {variable}"));
        var band = new OxyPlot.Series.AreaSeries
        {
            Title = "95 % band",
            Fill = OxyColor.FromArgb(70, 0, 114, 178),
            Color = OxyColors.Transparent,
            Color2 = OxyColors.Transparent,
            StrokeThickness = 0,
        };
        for (int k = 0; k < bandX.Count; k++)
        {
            band.Points.Add(new DataPoint(bandX[k], bandLo[k]));
            band.Points2.Add(new DataPoint(bandX[k], bandHi[k]));
            fig.Data.Add("b", "95% band (y = lower, value = upper)", bandX[k], bandLo[k], bandHi[k]);
        }
        b.Series.Add(band);
        double qlo = Math.Min(theo[0], sorted[0]), qhi = Math.Max(theo[^1], sorted[^1]);
        b.Series.Add(Series.Reference([qlo, qhi], [qlo, qhi], "y = x"));
        b.Series.Add(Series.Points(theo, sorted, "sorted data"));
        fig.Data.AddSeries("b", "sorted data vs fitted quantile", theo, sorted);
        PlotStyle.LegendBelow(b);

        fig.Add(a, 0, 0, 0.5, 1);
        fig.Add(b, 0.5, 0, 0.5, 1);
        return fig;
    }
}
