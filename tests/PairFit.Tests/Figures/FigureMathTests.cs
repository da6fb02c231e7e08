using System.Globalization;
using PairFit.Core.Copulas;
using PairFit.Core.Dependence;
using PairFit.Core.Marginals;
using PairFit.Core.Model;
using PairFit.Figures.Plots;
using PairFit.Figures.Rendering;

namespace PairFit.Tests.Figures;

/// <summary>The computations behind the diagnostic figures, each against an outside source.</summary>
public sealed class FigureMathTests
{
    private static IEnumerable<string[]> ReadCsv(string name)
        => File.ReadLines(Path.Combine(AppContext.BaseDirectory, "Reference", "Figures", name)).Skip(1).Select(l => l.Split(','));

    private static double D(string s) => double.Parse(s, CultureInfo.InvariantCulture);

    [Theory]
    [InlineData(10)]
    [InlineData(50)]
    public void Kendall_plot_W_matches_SciPy_quadrature(int n)
    {
        // SciPy 1.10.1 via Reference/Figures/make_reference.py (Genest and Boies 2003, eq. 1, by quad in w).
        var w = FigureMath.KendallPlotW(n);
        int checkedRows = 0;
        foreach (var r in ReadCsv("kendall_plot_w.csv").Where(r => int.Parse(r[0]) == n))
        {
            int i = int.Parse(r[1]);
            // 128-point Gauss–Legendre in s = −ln w over the Beta mass: well below 1e−6 relative here (a 64-point rule
            // missed by 1e−6, which is why the order is 128); the SciPy values are good to ~1e−12
            Assert.Equal(D(r[2]), w[i - 1], 1e-6 * Math.Max(D(r[2]), 1e-3));
            checkedRows++;
        }
        Assert.Equal(n, checkedRows);
    }

    [Fact]
    public void Kendall_plot_W_averages_to_one_quarter()
    {
        // Averaging the n order-statistic means gives E[H] under independence = ∫ w dK0(w) = ∫ w(−ln w) dw = 1/4
        // (closed form; Genest and Boies 2003, section 2).
        var w = FigureMath.KendallPlotW(200);
        Assert.Equal(0.25, w.Average(), 1e-6);
        for (int i = 1; i < w.Length; i++) Assert.True(w[i] > w[i - 1]);
    }

    [Fact]
    public void Kendall_plot_simulation_under_independence_recovers_W()
    {
        // Simulation-recovery: the mean sorted H of independent samples must approach W_{i:n}.
        // 20 replicates of n = 40: the sd of a mean of 20 H_(i) is below 0.2/√20 ≈ 0.045; 0.05 is > 1 sd of the
        // worst order statistic and the max error is seen at ~0.02.
        int n = 40;
        var expected = PairFit.Figures.Plots.TailFigure.ExpectedKendallCurve(CopulaRegistry.Create("independence", 0, []), n, seed: 3);
        var w = FigureMath.KendallPlotW(n);
        for (int i = 0; i < n; i++) Assert.Equal(w[i], expected[i], 0.05);
        // and its mean is 1/4 up to Monte Carlo error (sd of the mean of 800 H values ≈ 0.2/√800 ≈ 0.007)
        Assert.Equal(0.25, expected.Average(), 0.02);
    }

    [Fact]
    public void K0_inverse_round_trips()
    {
        foreach (double p in new[] { 1e-9, 1e-4, 0.01, 0.3, 0.9, 0.999999 })
        {
            double w = FigureMath.K0Inverse(p);
            Assert.Equal(p, w - w * Math.Log(w), 1e-12 * Math.Max(p, 1e-3));
        }
    }

    [Fact]
    public void QQ_band_matches_SciPy_beta_order_statistics()
    {
        // SciPy 1.10.1 via Reference/Figures/make_reference.py: lognorm.ppf(beta(i, n+1−i).ppf(0.025 / 0.975)).
        var dist = new LogNormalDistribution(1.0, 0.5);
        foreach (var r in ReadCsv("qq_band.csv"))
        {
            int n = int.Parse(r[0]), i = int.Parse(r[1]);
            var (lo, hi) = FigureMath.OrderStatisticBand(dist, n, i, 0.95);
            // MathNet's Beta.InvCDF is iterative; 1e−7 relative is well inside what a plot needs and what it reaches
            Assert.Equal(D(r[2]), lo, 1e-7 * D(r[2]));
            Assert.Equal(D(r[3]), hi, 1e-7 * D(r[3]));
        }
    }

    [Fact]
    public void Empirical_copula_matches_direct_count()
    {
        // Independent computation: the definition C_n(a, b) = (1/n) #{u_i ≤ a, v_i ≤ b} counted pair by pair.
        var (x, y) = FigureTestData.TrueModel.Sample(97, 5);
        double[] u = Ranks.PseudoObservations(x), v = Ranks.PseudoObservations(y);
        double[] grid = FigureMath.Grid(0, 1, 13);
        var c = FigureMath.EmpiricalCopula(u, v, grid);
        for (int i = 0; i < grid.Length; i++)
            for (int j = 0; j < grid.Length; j++)
            {
                int count = 0;
                for (int k = 0; k < u.Length; k++) if (u[k] <= grid[i] && v[k] <= grid[j]) count++;
                Assert.Equal(count / 97.0, c[i, j], 1e-15);
            }
    }

    [Fact]
    public void Tail_function_of_Clayton_tends_to_its_coefficient_and_empirical_follows()
    {
        // λ_L = 2^(−1/θ) for Clayton (Nelsen 2006, Example 5.22); λ(t) = C(t,t)/t → λ_L as t → 0.
        var clayton = CopulaRegistry.Create("clayton", 0, [3.0]);
        double[] t = [1e-6];
        Assert.Equal(Math.Pow(2, -1 / 3.0), FigureMath.CopulaTailFunction(clayton, t)[0], 1e-4);
        // independence: C = uv gives λ(t) = t below ½ and 1 − t above
        var indep = CopulaRegistry.Create("independence", 0, []);
        var li = FigureMath.CopulaTailFunction(indep, new[] { 0.2, 0.8 });
        Assert.Equal(0.2, li[0], 1e-12);
        Assert.Equal(0.2, li[1], 1e-12);
        // simulation-recovery: with 4000 Clayton draws the empirical λ(0.3) is within MC error of the copula's
        // (C_n(t,t) has sd ≤ √(0.25/4000) ≈ 0.008, so λ(0.3) has sd ≤ 0.027; tolerance 0.08 ≈ 3 sd)
        var u = new double[4000]; var v = new double[4000];
        JointModel.SampleCopula(clayton, 4000, 9, u, v);
        double[] t3 = [0.3];
        Assert.Equal(FigureMath.CopulaTailFunction(clayton, t3)[0], FigureMath.EmpiricalTailFunction(u, v, t3)[0], 0.08);
    }

    [Fact]
    public void Histogram_is_a_density()
    {
        var (x, _) = FigureTestData.TrueModel.Sample(500, 2);
        var (edges, dens) = FigureMath.Histogram(x);
        double area = 0;
        for (int k = 0; k < dens.Length; k++) area += dens[k] * (edges[k + 1] - edges[k]);
        Assert.Equal(1.0, area, 1e-12);
        Assert.InRange(dens.Length, 8, 40);
    }

    [Theory]
    [InlineData(0)]
    [InlineData(1)]
    [InlineData(2)]
    public void Return_period_isolines_have_the_stated_exceedance_probability(int kind)
    {
        // With independent normal margins the exceedance probabilities have closed forms:
        // AND (1 − u)(1 − v), OR 1 − uv; Kendall: K(t) = t − t ln t for the independence copula
        // (Genest and Rivest 1993), so the isoline is uv = t* with t* − t* ln t* = 1 − p.
        var model = new JointModel(new NormalDistribution(0, 1), new NormalDistribution(10, 2), CopulaRegistry.Create("independence", 0, []));
        double p = 0.02;
        var k = (ReturnPeriodFigure.Kind)kind;
        var levels = ReturnPeriodFigure.KendallDistribution(model.Copula, 4);
        var (xs, ys) = ReturnPeriodFigure.Isoline(model, k, p, levels, -4, 6);
        Assert.True(xs.Length > 50);
        double tStar = FigureMath.K0Inverse(1 - p);
        for (int i = 0; i < xs.Length; i++)
        {
            double u = model.X.Cdf(xs[i]), v = model.Y.Cdf(ys[i]);
            switch (k)
            {
                // roots to 1e−12 in v; the error in probability is at most that times ∂P/∂v ≤ 1
                case ReturnPeriodFigure.Kind.And: Assert.Equal(p, (1 - u) * (1 - v), 1e-9); break;
                case ReturnPeriodFigure.Kind.Or: Assert.Equal(p, 1 - u * v, 1e-9); break;
                // t* comes from 20000 draws of C(U, V): its sd is about √(p(1 − p)/N)/k_C(t*) = 1e−3/0.2 = 5e−3
                // (k_C(t) = −ln t ≈ 0.2 at t* ≈ 0.82); 0.025 in uv is 5 sd and still tight for a plotted line
                default: Assert.Equal(tStar, u * v, 0.025); break;
            }
        }
    }
}
