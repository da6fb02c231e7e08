using System.Text.Json;
using MathNet.Numerics;
using PairFit.Core.Marginals;
using GofTests = PairFit.Core.Marginals.Fitting.GoodnessOfFitTests;

namespace PairFit.Tests.Marginals;

public class GoodnessOfFitTests
{
    public static IEnumerable<object[]> ScipyCases()
    {
        using var doc = JsonDocument.Parse(File.ReadAllText(MarginalReference.PathOf("gof.json")));
        return doc.RootElement.GetProperty("cases").EnumerateArray().Select(e => new object[]
        {
            e.GetProperty("dataset").GetString()!, e.GetProperty("family").GetString()!,
            e.GetProperty("parameters").EnumerateArray().Select(v => v.GetDouble()).ToArray(),
            e.GetProperty("ksStatistic").GetDouble(), e.GetProperty("ksPValue").GetDouble(),
            e.GetProperty("cvmStatistic").GetDouble(),
        }).ToList();
    }

    // Statistics vs scipy.stats.kstest / cramervonmises (SciPy 1.10.1 via Reference/Marginals/make_reference.py).
    [Theory]
    [MemberData(nameof(ScipyCases))]
    public void StatisticsMatchScipy(string dataset, string family, double[] p, double ks, double ksP, double cvm)
    {
        var data = MarginalReference.Dataset(dataset);
        Array.Sort(data);
        var d = MarginalRegistry.Create(family, p);
        var g = GofTests.Compute(d, data, normalWithEstimatedParameters: false);
        Assert.Equal(ks, g.KsStatistic!.Value, 1e-12);
        Assert.Equal(cvm, g.CvmStatistic!.Value, 1e-10);
        // SciPy's p-value is exact for n = 400; ours is the limiting law with Stephens' (1970)
        // correction, accurate to about 0.01 at these sample sizes (D'Agostino and Stephens 1986, §4.4).
        Assert.Equal(ksP, g.KsPValue!.Value, 0.01);
        // Anderson–Darling against its integral definition A² = n ∫ (F_n(u) − u)² / (u(1 − u)) du
        // (Anderson and Darling 1952), by Gauss–Legendre on each interval between the F(x_i).
        var u = data.Select(d.Cdf).ToArray();
        double a2 = 0;
        int n = u.Length;
        for (int i = 0; i <= n; i++)
        {
            double lo = i == 0 ? 0 : u[i - 1], hi = i == n ? 1 : u[i], level = (double)i / n;
            a2 += Integrate.GaussLegendre(v => (level - v) * (level - v) / (v * (1 - v)), lo, hi, 32);
        }
        a2 *= n;
        // Order-32 Gauss–Legendre per interval: the integrand is smooth inside each, except the end
        // intervals touching 0 and 1 where it behaves like v or 1 − v: 1e-6 relative is ample.
        Assert.Equal(a2, g.AdStatistic!.Value, 1e-6 * a2);
    }

    // Asymptotic 5 % point of the Kolmogorov distribution is 1.3581 (Smirnov 1948; D'Agostino and Stephens 1986, Table 4.2).
    [Fact]
    public void KolmogorovPValueAtCriticalValue()
    {
        int n = 1_000_000;
        double d = 1.3581 / (Math.Sqrt(n) + 0.12 + 0.11 / Math.Sqrt(n));
        Assert.Equal(0.05, GofTests.KolmogorovPValue(d, n), 1e-4);
    }

    // Anderson–Darling, parameters known (case 0): upper 10 %, 5 %, 1 % points 1.933, 2.492, 3.857
    // (Stephens 1974, Table 1; D'Agostino and Stephens 1986, Table 4.2).
    [Theory]
    [InlineData(1.933, 0.10)]
    [InlineData(2.492, 0.05)]
    [InlineData(3.857, 0.01)]
    public void AndersonDarlingKnownParametersPValue(double a, double p) => Assert.Equal(p, GofTests.AndersonDarlingKnownPValue(a), 1e-3);

    // Normal with estimated mean and variance (case 3): modified-statistic points A* = 0.631, 0.752, 1.035
    // and W* = 0.104, 0.126, 0.178 for 10 %, 5 %, 1 % (Stephens 1974, Table 1A; D'Agostino and Stephens 1986, Table 4.7).
    [Theory]
    [InlineData(0.631, 0.104, 0.10)]
    [InlineData(0.752, 0.126, 0.05)]
    [InlineData(1.035, 0.178, 0.01)]
    public void NormalEstimatedParametersPValues(double aStar, double wStar, double p)
    {
        const int n = 1_000_000;   // modification factors → 1
        // The exponential approximations reproduce the table to ~5 % of p.
        Assert.Equal(p, GofTests.AndersonDarlingNormalPValue(aStar, n), 0.05 * p + 1e-3);
        Assert.Equal(p, GofTests.CramerVonMisesNormalPValue(wStar, n), 0.05 * p + 1e-3);
    }

    [Fact]
    public void FittedCandidatesCarryStatisticsAndANote()
    {
        var fit = MarginalAnalysis.Fit(MarginalReference.Dataset("normal_101"), new MarginalOptions { Candidates = ["normal", "gumbel"] });
        var normal = fit.Section.Candidates.Single(c => c.Family == "normal");
        Assert.NotNull(normal.Gof!.AdPValue);
        Assert.NotNull(normal.Gof.CvmPValue);
        Assert.Contains("estimated mean and variance", normal.Gof.PValueNote);
        // Normal data: the normal fit is not rejected at 1 %, the AD p-value of the Gumbel is far smaller.
        Assert.True(normal.Gof.AdPValue > 0.01);
        var gumbel = fit.Section.Candidates.Single(c => c.Family == "gumbel");
        Assert.Null(gumbel.Gof!.CvmPValue);
        Assert.Contains("treat the fitted parameters as known", gumbel.Gof.PValueNote);
        Assert.True(gumbel.Gof.AdStatistic > normal.Gof.AdStatistic);
    }
}
