using OxyPlot;
using OxyPlot.Axes;
using PairFit.Core.Data;
using PairFit.Core.Projection;
using PairFit.Core.Results;
using PairFit.Figures.Rendering;

namespace PairFit.Figures.Plots;

/// <summary>
/// Figure 6 (one per projected expression Q = g(x, y)): (a) the density of Q under the fitted
/// model with the histogram of g on the observed pairs; (b) the exceedance curve P(Q &gt; q) on a
/// log scale under the fitted model, under independence and comonotonic coupling of the same
/// marginals (their reported quantiles), and on the observed pairs.
/// </summary>
public static class ProjectionFigure
{
    public static Figure? Build(string id, ProjectionSection projection, PairedSample? sample)
    {
        if (projection.Grid is not { Values.Count: > 1 } grid) return null;
        double[] q = [.. grid.Values], dens = [.. grid.Density], cdf = [.. grid.Cdf];
        double[]? observed = sample is null ? null : Observed(projection.Expression, sample);

        var fig = new Figure(id, $"Distribution of {projection.Expression}",
            $"Q = {projection.Expression}. (a) Density of Q under the fitted joint model ({projection.Method}), up to its {DensityPanelQuantile:0.0%} quantile," +
            (observed is null ? "." : $" and the histogram of Q on the {observed.Length} observed pairs.") +
            " (b) Exceedance probability P(Q > q), log scale: fitted model (solid), independence and comonotonic coupling of the same marginals (at their reported quantiles), and the observed pairs (plotting positions i/(n+1)). " +
            "The gap between the independence and comonotonic curves shows how much the dependence matters for Q.",
            aspect: 0.5);

        var a = PlotStyle.NewPanel("(a) density");
        // a long expression would be cut at the panel edge; it is spelled out in the caption anyway
        string qTitle = projection.Expression.Length <= 28 ? "Q = " + projection.Expression : "Q";
        a.Axes.Add(PlotStyle.Linear(AxisPosition.Bottom, qTitle));
        a.Axes.Add(PlotStyle.Linear(AxisPosition.Left, "density", 0));
        a.Axes[1].MaximumPadding = 0.08;
        // A heavy-tailed Q (a ratio, say) would squeeze the body of the density into a sliver, so
        // panel (a) stops at the model's 99.5 % quantile; panel (b) shows the whole tail.
        double shownUpTo = DisplayLimit(q, cdf, DensityPanelQuantile);
        if (observed is { Length: > 1 })
        {
            var inRange = observed.Where(o => o <= shownUpTo).ToArray();
            if (inRange.Length > 1)
            {
                var (edges, h) = FigureMath.Histogram(inRange);
                // keep the density scale of the whole sample: the bins hold only the values shown
                double share = (double)inRange.Length / observed.Length;
                for (int k = 0; k < h.Length; k++) h[k] *= share;
                a.Series.Add(Series.Histogram(edges, h, title: "observed pairs"));
                for (int k = 0; k < h.Length; k++) fig.Data.Add("a", "observed histogram bin [x, y) density", edges[k], edges[k + 1], h[k]);
            }
        }
        int last = q.Length;
        while (last > 2 && q[last - 1] > shownUpTo) last--;
        a.Series.Add(Series.Line(q[..last], dens[..last], "fitted model", 0));
        fig.Data.AddSeries("a", "fitted density", q, dens);
        PlotStyle.LegendBelow(a);

        var b = PlotStyle.NewPanel("(b) exceedance probability");
        b.Axes.Add(PlotStyle.Linear(AxisPosition.Bottom, "q"));
        var logAxis = PlotStyle.Log(AxisPosition.Left, "P(Q > q)");
        logAxis.Minimum = 1e-4;
        logAxis.Maximum = 1;
        b.Axes.Add(logAxis);
        var exceed = new double[q.Length];
        for (int i = 0; i < q.Length; i++) exceed[i] = 1 - cdf[i] > 0 ? 1 - cdf[i] : double.NaN;
        b.Series.Add(Series.Line(q, exceed, "fitted model", 0));
        fig.Data.AddSeries("b", "fitted model", q, exceed);
        AddComparison(b, fig, projection.Independence, "independence", 1);
        AddComparison(b, fig, projection.Comonotonic, "comonotonic", 2);
        if (observed is { Length: > 0 })
        {
            var s = (double[])observed.Clone();
            Array.Sort(s);
            var p = new double[s.Length];
            for (int i = 0; i < s.Length; i++) p[i] = 1 - (i + 1.0) / (s.Length + 1);
            b.Series.Add(Series.Points(s, p, "observed pairs"));
            fig.Data.AddSeries("b", "observed pairs", s, p);
        }
        PlotStyle.LegendBelow(b);

        fig.Add(a, 0, 0, 0.5, 1);
        fig.Add(b, 0.5, 0, 0.5, 1);
        return fig;
    }

    /// <summary>Probability level at which panel (a) stops.</summary>
    private const double DensityPanelQuantile = 0.995;

    /// <summary>The first grid value whose CDF reaches <paramref name="p"/> (the last grid value if none does).</summary>
    private static double DisplayLimit(double[] q, double[] cdf, double p)
    {
        for (int i = 0; i < q.Length; i++)
            if (cdf[i] >= p) return q[i];
        return q[^1];
    }

    private static void AddComparison(PlotModel m, Figure fig, ProjectionComparison? c, string name, int style)
    {
        if (c is null) return;
        var xs = new List<double>();
        var ps = new List<double>();
        foreach (var qv in c.Quantiles)
            if (qv.Value is { } v && double.IsFinite(v)) { xs.Add(v); ps.Add(1 - qv.P); }
        if (xs.Count == 0) return;
        var line = Series.Line(xs.ToArray(), ps.ToArray(), name, style);
        line.MarkerType = Palette.Marker(style);
        line.MarkerSize = 3;
        line.MarkerFill = OxyColors.White;
        line.MarkerStroke = line.Color;
        m.Series.Add(line);
        fig.Data.AddSeries("b", name, xs.ToArray(), ps.ToArray());
    }

    /// <summary>g evaluated on the observed pairs (undefined and infinite values dropped), or null if the expression does not parse.</summary>
    private static double[]? Observed(string expression, PairedSample sample)
    {
        var node = ExpressionParser.TryParse(expression, sample.XName, sample.YName, out _);
        if (node is null) return null;
        var values = new double[sample.Count];
        new CompiledExpression(node).Evaluate(sample.X, sample.Y, values);
        var finite = new List<double>(values.Length);
        foreach (double v in values) if (double.IsFinite(v)) finite.Add(v);
        return finite.ToArray();
    }
}
