using MathNet.Numerics.Distributions;
using PairFit.Core.Common;
using PairFit.Core.Copulas;
using PairFit.Core.Data;
using PairFit.Core.Marginals;
using PairFit.Core.Model;
using PairFit.Core.Projection;
using PairFit.Core.Results;

namespace PairFit.Tests.Projection;

public class ProjectionAnalysisTests
{
    [Fact]
    public void NormalSumUnderGaussianLawGivesNormalMomentsQuantilesAndRiskMeasures()
    {
        // X + Y ~ N(0.5, 4 + 0.49 + 2·0.6·2·0.7) (standard bivariate-normal result; from memory);
        // TVaR_α of N(μ, σ²) = μ + σ φ(z_α)/(1 − α) (McNeil, Frey and Embrechts 2015, expected shortfall of the normal law; from memory).
        var model = new JointModel(new NormalDistribution(1, 2), new NormalDistribution(-0.5, 0.7), new GaussianLaw(0.6));
        var r = ProjectionAnalysis.Project(model, "x + y", "a", "b", null, new ProjectionOptions
        {
            Thresholds = [3.0], Levels = [0.95, 0.99], Seed = 11, GridPoints = 65,
        });
        double mu = 0.5, sd = Math.Sqrt(4 + 0.49 + 2 * 0.6 * 2 * 0.7);
        Assert.Equal(ProjectionAnalysis.Quadrature, r.Method);
        // Moments come from half-line integrals of the quadrature CDF (tolerance 1e−9 relative each).
        Assert.Equal(mu, r.Mean!.Value, 1e-6);
        Assert.Equal(sd, r.Sd!.Value, 1e-6);
        foreach (var q in r.Quantiles) Assert.Equal(Normal.InvCDF(mu, sd, q.P), q.Value!.Value, 1e-7);
        Assert.Equal(1 - Normal.CDF(mu, sd, 3.0), r.Exceedance[0].Probability!.Value, 1e-9);
        foreach (var v in r.ValueAtRisk) Assert.Equal(Normal.InvCDF(mu, sd, v.Level), v.Value!.Value, 1e-7);
        foreach (var t in r.TailValueAtRisk)
            Assert.Equal(mu + sd * Normal.PDF(0, 1, Normal.InvCDF(0, 1, t.Level)) / (1 - t.Level), t.Value!.Value, 1e-6);
        // Independence: N(0.5, 4.49); comonotonic: N(0.5, (2 + 0.7)²) (sum of comonotonic normals).
        Assert.Equal(Math.Sqrt(4.49), r.Independence!.Sd!.Value, 1e-6);
        Assert.Equal(2.7, r.Comonotonic!.Sd!.Value, 1e-3);     // grid of 1e5 points: O(1/N · log N) error in the sd
        Assert.NotNull(r.Grid);
        Assert.Equal(65, r.Grid!.Values.Count);
        int mid = 32;
        Assert.Equal(Normal.PDF(mu, sd, r.Grid.Values[mid]), r.Grid.Density[mid], 1e-8);
        Assert.Equal(Normal.CDF(mu, sd, r.Grid.Values[mid]), r.Grid.Cdf[mid], 1e-9);
        Assert.Null(r.Notes);
    }

    [Fact]
    public void ComonotonicQuantilesAreSumsOfQuantiles()
    {
        // Comonotonic additivity of quantiles and TVaR (Dhaene, Denuit, Goovaerts, Kaas and Vyncke 2002;
        // Dhaene et al. 2006; from memory). TVaR of Exp(λ): VaR + 1/λ; of LN(μ, σ): e^(μ+σ²/2) Φ(σ − z_α)/(1 − α).
        var model = new JointModel(new ExponentialDistribution(0.5), new LogNormalDistribution(1.0, 0.5), new ClaytonLaw(1.0));
        var r = ProjectionAnalysis.Project(model, "x + y", "a", "b", null, new ProjectionOptions
        {
            Method = "montecarlo", MonteCarloDraws = 2000, Levels = [0.95, 0.99], Seed = 3,
        });
        double Sum(double p) => model.X.Quantile(p) + model.Y.Quantile(p);
        var c = r.Comonotonic!;
        foreach (var q in c.Quantiles)
        {
            // The grid point used is u = p − 1/(2N), N = 1e5, and x + y increases with u: bracketed exactly.
            Assert.InRange(q.Value!.Value, Sum(q.P - 1e-5), Sum(q.P));
        }
        foreach (var t in c.TailValueAtRisk)
        {
            double a = t.Level;
            double exact = model.X.Quantile(a) + 2.0 + Math.Exp(1.0 + 0.125) * Normal.CDF(0, 1, 0.5 - Normal.InvCDF(0, 1, a)) / (1 - a);
            Assert.True(Math.Abs(t.Value!.Value / exact - 1) < 1e-3, $"TVaR {t.Value} vs {exact}"); // grid tail of 500–5000 points
        }
    }

    [Fact]
    public void CauchyRatioHasNoMeanAndSaysSo()
    {
        var model = new JointModel(new NormalDistribution(0, 1), new NormalDistribution(0, 1), new IndependenceLaw());
        var r = ProjectionAnalysis.Project(model, "y / x", "a", "b", null, new ProjectionOptions { Probabilities = [0.75, 0.99], Seed = 5, GridPoints = 32 });
        Assert.Null(r.Mean);
        Assert.Null(r.Sd);
        Assert.Null(r.TailValueAtRisk[0].Value);
        Assert.Contains(r.Notes!, n => n.Contains("mean and standard deviation may not exist"));
        // Standard Cauchy quantiles tan(π(p − 1/2)) (Johnson, Kotz and Balakrishnan 1994, ch. 16).
        Assert.Equal(1.0, r.Quantiles[0].Value!.Value, 1e-7);
        Assert.Equal(Math.Tan(Math.PI * 0.49), r.Quantiles[1].Value!.Value, 1e-5);
        Assert.InRange(r.TailIndexUpper!.Value, 0.8, 1.2);
    }

    [Fact]
    public void MonteCarloQuantilesCarryIntervalsThatCoverTheTruth()
    {
        // Hypoexponential sum again (Ross 2014, hypoexponential law), quantiles from the exact CDF by bisection.
        var model = new JointModel(new ExponentialDistribution(1.0), new ExponentialDistribution(2.5), new IndependenceLaw());
        var r = ProjectionAnalysis.Project(model, "x * 1 + max(y, 0) * 1 + 0 * x * y", "a", "b", null, new ProjectionOptions { Seed = 9, MonteCarloDraws = 50_000 });
        Assert.Equal(ProjectionAnalysis.MonteCarlo, r.Method); // y occurs twice: Monte Carlo
        double Exact(double p)
        {
            double lo = 0, hi = 50;
            for (int i = 0; i < 200; i++)
            {
                double m = 0.5 * (lo + hi);
                double cdf = 1 - (2.5 * Math.Exp(-m) - Math.Exp(-2.5 * m)) / 1.5;
                if (cdf < p) lo = m; else hi = m;
            }
            return lo;
        }
        // Five 95 % intervals: all cover with probability ≥ 0.77 in general; with this seed they do (deterministic).
        foreach (var q in r.Quantiles) Assert.InRange(Exact(q.P), q.Lower!.Value, q.Upper!.Value);
        Assert.Equal(1.0 + 0.4, r.Mean!.Value, 0.02);  // mean 1/k1 + 1/k2, MC standard error sd/√n ≈ 0.0048
        Assert.Equal(50_000, r.Draws);
    }

    [Fact]
    public void CheckReportsAgreementOfTheTwoMethods()
    {
        var model = new JointModel(new LogNormalDistribution(0, 0.5), new ExponentialDistribution(1), RotatedCopula.Rotate(new ClaytonLaw(2), 180));
        var r = ProjectionAnalysis.Project(model, "y / x", "a", "b", null, new ProjectionOptions
        {
            Check = true, Seed = 1, MonteCarloDraws = 20_000, GridPoints = 64, Probabilities = [0.5], Levels = [0.9],
        });
        Assert.NotNull(r.Check);
        Assert.True(r.Check!.Agree, $"max difference {r.Check.MaxCdfDifference} > {r.Check.AllowedDifference}");
        Assert.Equal(Math.Sqrt(Math.Log(200) / 40_000.0), r.Check.AllowedDifference, 12);
    }

    [Fact]
    public void EmpiricalComparisonUsesTheDataAndColumnNames()
    {
        var data = new PairedSample([1, 2, 3, 4, 5], [2, 2, 2, 2, 12], "rain", "runoff");
        var model = new JointModel(new LogNormalDistribution(1, 0.5), new LogNormalDistribution(1, 0.5), new IndependenceLaw());
        var r = ProjectionAnalysis.Project(model, "runoff - rain", "rain", "runoff", data, new ProjectionOptions
        {
            Probabilities = [0.5], Thresholds = [0.5], Levels = [0.8], Method = "montecarlo", MonteCarloDraws = 1000,
        });
        var e = r.Empirical!;
        Assert.Equal(5, e.Count);
        Assert.Equal(1.0, e.Mean!.Value, 12);                 // (1 + 0 − 1 − 2 + 7)/5
        Assert.Equal(0.0, e.Quantiles[0].Value!.Value, 12);   // median of {1, 0, −1, −2, 7}
        Assert.Equal(0.4, e.Exceedance[0].Probability!.Value, 12);
        Assert.Equal(7.0, e.TailValueAtRisk[0].Value!.Value, 12); // top 20 % of five values = the largest
    }

    [Theory]
    [InlineData("x + y", "quadrature", 0)]
    [InlineData("x * x + y", "quadrature", 0)]
    [InlineData("x + y * y", "montecarlo", 0)]
    [InlineData("2 + 3", null, 1)]
    public void MethodFollowsTheExpression(string expression, string? method, int throws)
    {
        var model = new JointModel(new NormalDistribution(0, 1), new NormalDistribution(0, 1), new IndependenceLaw());
        var o = new ProjectionOptions { Probabilities = [0.5], MonteCarloDraws = 1000 };
        if (throws == 1)
        {
            var ex = Assert.Throws<PairFitInputException>(() => ProjectionAnalysis.Project(model, expression, "a", "b", null, o));
            Assert.Contains("uses neither x nor y", ex.Message);
            return;
        }
        Assert.Equal(method, InversionChain.TryBuild(ExpressionParser.Parse(expression)) is null ? "montecarlo" : "quadrature");
    }

    [Fact]
    public void BadOptionsAreInputErrors()
    {
        var model = new JointModel(new NormalDistribution(0, 1), new NormalDistribution(0, 1), new IndependenceLaw());
        Assert.Contains("outside (0, 1)", Assert.Throws<PairFitInputException>(() =>
            ProjectionAnalysis.Project(model, "x + y", "a", "b", null, new ProjectionOptions { Probabilities = [1.5] })).Message);
        Assert.Contains("risk level", Assert.Throws<PairFitInputException>(() =>
            ProjectionAnalysis.Project(model, "x + y", "a", "b", null, new ProjectionOptions { Levels = [0] })).Message);
        Assert.Contains("needs y", Assert.Throws<PairFitInputException>(() =>
            ProjectionAnalysis.Project(model, "x + y * y", "a", "b", null, new ProjectionOptions { Method = "quadrature" })).Message);
        Assert.Contains("unknown projection method", Assert.Throws<PairFitInputException>(() =>
            ProjectionAnalysis.Project(model, "x + y", "a", "b", null, new ProjectionOptions { Method = "magic" })).Message);
    }

    [Fact]
    public void ResultsFileUsesTheAgreedFieldNames()
    {
        var model = new JointModel(new NormalDistribution(0, 1), new NormalDistribution(0, 1), new IndependenceLaw());
        var r = ProjectionAnalysis.Project(model, "x - y", "a", "b", null, new ProjectionOptions
        {
            Probabilities = [0.5], Thresholds = [1], Method = "montecarlo", MonteCarloDraws = 1000, GridPoints = 32,
        });
        string json = System.Text.Json.JsonSerializer.Serialize(r, ResultsFile.Options);
        using var doc = System.Text.Json.JsonDocument.Parse(json);
        var root = doc.RootElement;
        foreach (string name in new[] { "expression", "method", "mean", "sd", "quantiles", "exceedance", "valueAtRisk", "tailValueAtRisk", "independence", "comonotonic", "grid" })
            Assert.True(root.TryGetProperty(name, out _), name);
        Assert.True(root.GetProperty("quantiles")[0].TryGetProperty("p", out _));
        Assert.True(root.GetProperty("quantiles")[0].TryGetProperty("value", out _));
        Assert.True(root.GetProperty("exceedance")[0].TryGetProperty("threshold", out _));
        Assert.True(root.GetProperty("exceedance")[0].TryGetProperty("probability", out _));
        Assert.False(root.TryGetProperty("undefinedProbability", out _)); // nulls are left out
    }
}
