using OxyPlot.Axes;
using PairFit.Core.Common;
using PairFit.Core.Copulas;
using PairFit.Core.Data;
using PairFit.Core.Dependence;
using PairFit.Core.Model;
using PairFit.Figures.Rendering;

namespace PairFit.Figures.Plots;

/// <summary>A fitted copula to draw, with its legend label.</summary>
public sealed record CopulaCurve(string Label, ICopula Copula);

/// <summary>
/// Figure 5: (a) the empirical tail-dependence function λ(t) against the fitted copulas' curves;
/// (b) the Kendall plot of Genest and Boies (2003) with the fitted copula's expected curve.
/// </summary>
public static class TailFigure
{
    public const string Id = "tails";

    /// <summary>Kendall plot statistics are O(n²); larger samples are thinned to this many pairs (seeded).</summary>
    public const int MaxKendallPlotPairs = 1000;

    /// <summary>Simulated samples averaged for a fitted copula's expected Kendall-plot curve.</summary>
    public const int KendallPlotReplicates = 20;

    public static Figure Build(PairedSample sample, IReadOnlyList<CopulaCurve> copulas, int seed)
    {
        double[] u = Ranks.PseudoObservations(sample.X), v = Ranks.PseudoObservations(sample.Y);
        var fig = new Figure(Id, "Tail dependence and Kendall plot",
            "(a) Tail-dependence function λ(t) = C(t,t)/t for t ≤ ½ and (1 − 2t + C(t,t))/(1 − t) for t > ½, of the empirical copula (points) and of the fitted copula(s) (lines); " +
            "its values near t = 0 and t = 1 approach the lower and upper tail-dependence coefficients. The dotted line is independence. Near the ends few pairs carry the estimate, so scatter there is expected. " +
            "(b) Kendall plot (Genest and Boies 2003): sorted H_i = share of pairs below-left of pair i, against their expectation W_{i:n} under independence. " +
            "Points on the diagonal mean independence, above it positive dependence; the fitted copula's expected curve (mean of simulated samples of the same size) should follow the points.",
            aspect: 0.5);

        // (a) λ(t)
        double[] t = FigureMath.Grid(0.02, 0.98, 97);
        var a = PlotStyle.NewPanel("(a) tail-dependence function");
        a.Axes.Add(PlotStyle.Linear(AxisPosition.Bottom, "t", 0, 1));
        a.Axes.Add(PlotStyle.Linear(AxisPosition.Left, "λ(t)", 0, 1));
        var indep = new double[t.Length];
        for (int j = 0; j < t.Length; j++) indep[j] = FigureMath.TailFunction(t[j], t[j] * t[j]);
        a.Series.Add(Series.Reference(t, indep, "independence"));
        var emp = FigureMath.EmpiricalTailFunction(u, v, t);
        a.Series.Add(Series.Points(t, emp, "empirical"));
        fig.Data.AddSeries("a", "empirical", t, emp);
        fig.Data.AddSeries("a", "independence", t, indep);
        for (int c = 0; c < copulas.Count; c++)
        {
            var curve = FigureMath.CopulaTailFunction(copulas[c].Copula, t);
            a.Series.Add(Series.Line(t, curve, copulas[c].Label, c));
            fig.Data.AddSeries("a", copulas[c].Label, t, curve);
        }
        PlotStyle.LegendBelow(a);

        // (b) Kendall plot
        var (kx, ky) = Thin(sample.X, sample.Y, MaxKendallPlotPairs, seed);
        int n = kx.Length;
        double[] h = FigureMath.KendallPlotH(kx, ky);
        double[] w = FigureMath.KendallPlotW(n);
        var b = PlotStyle.NewPanel("(b) Kendall plot");
        b.Axes.Add(PlotStyle.Linear(AxisPosition.Bottom, "W(i:n), expected under independence", 0, 1));
        b.Axes.Add(PlotStyle.Linear(AxisPosition.Left, "H(i), sorted", 0, 1));
        b.Series.Add(Series.Reference([0, 1], [0, 1], "independence"));
        b.Series.Add(Series.Points(w, h, n == sample.Count ? "data" : $"data ({n} of {sample.Count} pairs)"));
        fig.Data.AddSeries("b", "data", w, h);
        for (int c = 0; c < copulas.Count; c++)
        {
            var expected = ExpectedKendallCurve(copulas[c].Copula, n, seed + 1 + c);
            b.Series.Add(Series.Line(w, expected, copulas[c].Label, c));
            fig.Data.AddSeries("b", copulas[c].Label, w, expected);
        }
        PlotStyle.LegendBelow(b);

        fig.Add(a, 0, 0, 0.5, 1);
        fig.Add(b, 0.5, 0, 0.5, 1);
        return fig;
    }

    /// <summary>
    /// Mean sorted H of <see cref="KendallPlotReplicates"/> samples of size n from the copula.
    /// H depends only on ranks, so copula draws stand in for data. Replicate r uses seed stream r,
    /// so the curve is the same whatever the thread count.
    /// </summary>
    public static double[] ExpectedKendallCurve(ICopula copula, int n, int seed)
    {
        var sums = new double[KendallPlotReplicates][];
        Parallel.For(0, KendallPlotReplicates, r =>
        {
            double[] uu = new double[n], vv = new double[n];
            var rng = RandomStreams.For(seed, r);
            for (int i = 0; i < n; i++)
            {
                uu[i] = RandomStreams.OpenUniform(rng);
                vv[i] = copula.InverseConditionalCdf(uu[i], RandomStreams.OpenUniform(rng));
            }
            sums[r] = FigureMath.KendallPlotH(uu, vv);
        });
        var mean = new double[n];
        foreach (var s in sums)
            for (int i = 0; i < n; i++) mean[i] += s[i] / KendallPlotReplicates;
        return mean;
    }

    /// <summary>A seeded random subset of at most <paramref name="max"/> pairs (all of them when fewer).</summary>
    private static (double[] X, double[] Y) Thin(double[] x, double[] y, int max, int seed)
    {
        if (x.Length <= max) return (x, y);
        int[] idx = new int[x.Length];
        for (int i = 0; i < idx.Length; i++) idx[i] = i;
        var rng = RandomStreams.For(seed, 0);
        // partial Fisher–Yates: the first max entries become a uniform random subset
        for (int i = 0; i < max; i++)
        {
            int j = i + rng.Next(idx.Length - i);
            (idx[i], idx[j]) = (idx[j], idx[i]);
        }
        double[] tx = new double[max], ty = new double[max];
        for (int i = 0; i < max; i++) { tx[i] = x[idx[i]]; ty[i] = y[idx[i]]; }
        return (tx, ty);
    }
}
