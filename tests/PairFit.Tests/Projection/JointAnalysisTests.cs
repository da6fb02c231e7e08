using MathNet.Numerics.Distributions;
using PairFit.Core.Common;
using PairFit.Core.Copulas;
using PairFit.Core.Marginals;
using PairFit.Core.Model;
using PairFit.Core.Projection;

namespace PairFit.Tests.Projection;

public class JointAnalysisTests
{
    [Fact]
    public void IndependenceReducesToProductsOfMarginalProbabilities()
    {
        // Under independence P(X > a, Y > b) = S_X(a) S_Y(b), P(X > a or Y > b) = 1 − F_X(a) F_Y(b), and the
        // Kendall distribution of the product copula is K(t) = t − t ln t (Genest and Rivest 1993; Nelsen 2006, §5.1.4, from memory).
        var model = new JointModel(new NormalDistribution(0, 1), new ExponentialDistribution(1), new IndependenceLaw());
        var r = JointAnalysis.Compute(model, new JointOptions { XValue = 1.0, YValue = 2.0, EventsPerYear = 4 });
        double u = Normal.CDF(0, 1, 1.0), v = 1 - Math.Exp(-2.0);
        double both = (1 - u) * Math.Exp(-2.0), either = 1 - u * v;
        double t = u * v, k = t - t * Math.Log(t);
        Assert.Equal(both, r.ProbabilityBothExceed, 14);
        Assert.Equal(either, r.ProbabilityEitherExceeds, 14);
        Assert.Equal(both, r.IndependentBothExceed, 14);
        Assert.Equal(Math.Exp(-2.0), r.ProbabilityYExceedsGivenXExceeds!.Value, 12);
        Assert.Equal(Math.Exp(-2.0), r.ProbabilityYExceedsGivenXEquals, 14);
        Assert.Equal(k, r.KendallProbability, 9);
        Assert.Equal(0.25, r.MeanInterarrivalYears);
        Assert.Equal(0.25 / both, r.ReturnPeriods.And!.Value, 9);
        Assert.Equal(0.25 / either, r.ReturnPeriods.Or!.Value, 9);
        Assert.Equal(0.25 / (1 - k), r.ReturnPeriods.Kendall!.Value, 7);
        Assert.Equal(0.25 / (1 - u), r.ReturnPeriods.XAlone!.Value, 9);
    }

    [Theory]
    [InlineData(0.5, 0.05)]
    [InlineData(0.5, 0.7)]
    [InlineData(2.0, 0.3)]
    [InlineData(2.0, 0.95)]
    [InlineData(8.0, 0.01)]
    [InlineData(8.0, 0.6)]
    public void KendallDistributionMatchesTheArchimedeanClosedForm(double theta, double t)
    {
        // K(t) = t − φ(t)/φ'(t) (Genest and Rivest 1993; Nelsen 2006, Theorem 4.3.4, from memory);
        // Clayton φ(t) = (t^−θ − 1)/θ gives K(t) = t + (t − t^(θ+1))/θ.
        double exact = t + (t - Math.Pow(t, theta + 1)) / theta;
        Assert.Equal(exact, KendallDistribution.Cdf(new ClaytonLaw(theta), t), 8);
    }

    [Theory]
    [InlineData(90)]
    [InlineData(180)]
    [InlineData(270)]
    public void KendallDistributionOfRotationsMatchesSimulation(int rotation)
    {
        var copula = RotatedCopula.Rotate(new ClaytonLaw(3.0), rotation);
        const int n = 40_000;
        var u = new double[n];
        var v = new double[n];
        JointModel.SampleCopula(copula, n, 77, u, v);
        var w = new double[n];
        for (int i = 0; i < n; i++) w[i] = copula.Cdf(u[i], v[i]);
        // 99.9 % DKW band (Massart 1990) for the empirical CDF of W = C(U, V).
        double band = Math.Sqrt(Math.Log(2 / 0.001) / (2.0 * n));
        foreach (double t in new[] { 0.02, 0.1, 0.3, 0.6 })
        {
            double empirical = w.Count(x => x <= t) / (double)n;
            Assert.True(Math.Abs(KendallDistribution.Cdf(copula, t) - empirical) <= band, $"K({t}) = {KendallDistribution.Cdf(copula, t)} vs {empirical}");
        }
    }

    public static IEnumerable<object[]> Families()
    {
        foreach (var f in CopulaRegistry.Families)
            if (f.StartFromTau(0.5) is not null)
                foreach (int r in f.Rotations)
                    yield return [f.Name, r];
    }

    [Theory]
    [MemberData(nameof(Families))]
    public void AndKendallOrReturnPeriodsAreOrdered(string family, int rotation)
    {
        // P(AND) ≤ 1 − K_C(t) ≤ P(OR), so T_AND ≥ T_Kendall ≥ T_OR (Salvadori, De Michele and Durante 2011).
        var f = CopulaRegistry.Find(family);
        var model = new JointModel(new LogNormalDistribution(1, 0.5), new ExponentialDistribution(0.2), RotatedCopula.Rotate(f.Create(f.StartFromTau(0.5)!), rotation));
        foreach (var (pu, pv) in new[] { (0.9, 0.9), (0.99, 0.5), (0.5, 0.995), (0.3, 0.4) })
        {
            var r = JointAnalysis.Compute(model, new JointOptions { XValue = model.X.Quantile(pu), YValue = model.Y.Quantile(pv) });
            var p = r.ReturnPeriods;
            Assert.True(p.And >= p.Kendall * (1 - 1e-9), $"{family} {rotation}: AND {p.And} < Kendall {p.Kendall}");
            Assert.True(p.Kendall >= p.Or * (1 - 1e-9), $"{family} {rotation}: Kendall {p.Kendall} < OR {p.Or}");
            Assert.True(p.Or <= Math.Min(p.XAlone!.Value, p.YAlone!.Value) * (1 + 1e-12));
        }
    }

    [Fact]
    public void DesignIsolinesHaveTheTargetReturnPeriod()
    {
        var copula = RotatedCopula.Rotate(new ClaytonLaw(2.0), 180);
        var model = new JointModel(new LogNormalDistribution(3, 0.5), new ExponentialDistribution(0.1), copula);
        var r = JointAnalysis.Compute(model, new JointOptions { XValue = 30, YValue = 20, EventsPerYear = 2, ReturnPeriod = 50 });
        double p = 0.5 / 50; // μ / T
        var designs = r.Designs!.ToDictionary(d => d.Kind);
        Assert.Equal(1 - p, KendallDistribution.Cdf(copula, designs["kendall"].Level), 7);
        foreach (var pt in designs["kendall"].Isoline)
            Assert.Equal(designs["kendall"].Level, copula.Cdf(model.X.Cdf(pt.X), model.Y.Cdf(pt.Y)), 8);
        foreach (var pt in designs["or"].Isoline)
            Assert.Equal(p, 1 - copula.Cdf(model.X.Cdf(pt.X), model.Y.Cdf(pt.Y)), 8);
        foreach (var pt in designs["and"].Isoline)
        {
            double u = model.X.Cdf(pt.X), v = model.Y.Cdf(pt.Y);
            Assert.Equal(p, 1 - u - v + copula.Cdf(u, v), 8);
        }
        foreach (var d in designs.Values)
        {
            Assert.True(d.Isoline.Count > 50);
            double best = d.Isoline.Max(pt => pt.LogDensity ?? double.NegativeInfinity);
            Assert.True(d.MostLikely!.LogDensity >= best - 1e-12, $"{d.Kind}: most likely {d.MostLikely.LogDensity} < isoline max {best}");
        }
        // Kendall's design is less extreme than OR's for the same T (t_K ≤ 1 − μ/T since K_C(t) ≥ t).
        Assert.True(designs["kendall"].Level <= designs["or"].Level);
    }

    [Fact]
    public void MostLikelyEventOfASymmetricModelLiesOnTheDiagonal()
    {
        // Exchangeable copula and equal marginals: the joint density and each level curve are symmetric about
        // y = x, and the density along the curve peaks on it (symmetry argument; checked here, not cited).
        var model = new JointModel(new NormalDistribution(0, 1), new NormalDistribution(0, 1), new ClaytonLaw(2.0));
        var r = JointAnalysis.Compute(model, new JointOptions { XValue = 1, YValue = 1, ReturnPeriod = 100 });
        foreach (var d in r.Designs!)
            Assert.True(Math.Abs(d.MostLikely!.X - d.MostLikely.Y) < 1e-4, $"{d.Kind}: ({d.MostLikely.X}, {d.MostLikely.Y})");
    }

    [Fact]
    public void BadOptionsAreInputErrors()
    {
        var model = new JointModel(new NormalDistribution(0, 1), new NormalDistribution(0, 1), new IndependenceLaw());
        Assert.Contains("must exceed the mean interarrival time", Assert.Throws<PairFitInputException>(() =>
            JointAnalysis.Compute(model, new JointOptions { XValue = 1, YValue = 1, EventsPerYear = 0.5, ReturnPeriod = 1.5 })).Message);
        Assert.Contains("--events-per-year", Assert.Throws<PairFitInputException>(() =>
            JointAnalysis.Compute(model, new JointOptions { XValue = 1, YValue = 1, EventsPerYear = -1 })).Message);
        Assert.Contains("finite", Assert.Throws<PairFitInputException>(() =>
            JointAnalysis.Compute(model, new JointOptions { XValue = double.NaN, YValue = 1 })).Message);
    }
}
