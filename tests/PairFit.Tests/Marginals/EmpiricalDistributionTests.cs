using System.Text.Json;
using MathNet.Numerics;
using PairFit.Core.Marginals;
using PairFit.Core.Results;

namespace PairFit.Tests.Marginals;

public class EmpiricalDistributionTests
{
    private static readonly double[] Data = [4.2, 1.0, 7.5, 3.3, 3.3, 9.1, 5.6, 2.4];

    // Weibull plotting positions i/(n+1) at the order statistics (ties at their highest position).
    [Fact]
    public void CdfPassesThroughPlottingPositions()
    {
        var d = new EmpiricalDistribution(Data);
        var sorted = Data.OrderBy(v => v).ToArray();
        int n = sorted.Length;
        for (int i = 0; i < n; i++)
            if (i + 1 == n || sorted[i + 1] != sorted[i])
                Assert.Equal((i + 1.0) / (n + 1), d.Cdf(sorted[i]), 14);
        Assert.Equal(0.0, d.Cdf(d.SupportLower));
        Assert.Equal(1.0, d.Cdf(d.SupportUpper));
        // Lower end extends the first segment's slope to F = 0: 1.0 − (2.4 − 1.0) × (1/9)/(1/9) = −0.4, clipped to 0 for positive data.
        Assert.Equal(0.0, d.SupportLower);
    }

    [Fact]
    public void QuantileInvertsCdfAndMomentsMatchQuadrature()
    {
        IMarginalDistribution d = new EmpiricalDistribution(Data);
        foreach (double p in new[] { 0.01, 0.1, 0.3333, 0.5, 0.9, 0.99 })
            Assert.Equal(p, d.Cdf(d.Quantile(p)), 12);
        // Piecewise-linear CDF: its density is piecewise constant; integrate each piece exactly.
        double mass = 0, mean = 0;
        for (int i = 0; i < 200; i++)
        {
            double a = d.SupportLower + (d.SupportUpper - d.SupportLower) * i / 200, b = d.SupportLower + (d.SupportUpper - d.SupportLower) * (i + 1) / 200;
            mass += Integrate.GaussKronrod(d.Density, a, b, 1e-13, 10, 15);
            mean += Integrate.GaussKronrod(x => x * d.Density(x), a, b, 1e-13, 10, 15);
        }
        // Discontinuities of the density inside a piece limit the quadrature to ~1e-6.
        Assert.Equal(1.0, mass, 1e-6);
        Assert.Equal(d.Mean, mean, 1e-5);
    }

    [Fact]
    public void ForcedEmpiricalIsSelectedAndSurvivesTheResultsFile()
    {
        var fit = MarginalAnalysis.Fit(Data, new MarginalOptions { Forced = "empirical" });
        Assert.Equal("empirical", fit.Section.Selected);
        Assert.Equal("forced by the user", fit.Section.SelectedBecause);
        var spec = MarginalSpec.From(fit.Selected);
        var back = JsonSerializer.Deserialize<MarginalSpec>(JsonSerializer.Serialize(spec, ResultsFile.Options), ResultsFile.Options)!.Build();
        foreach (double x in new[] { 0.5, 3.3, 4.0, 9.0 })
            Assert.Equal(fit.Selected.Cdf(x), back.Cdf(x), 15);
    }

    [Fact]
    public void ParametricSpecRoundTrips()
    {
        var gev = new GevDistribution(50, 10, 0.15);
        var back = JsonSerializer.Deserialize<MarginalSpec>(JsonSerializer.Serialize(MarginalSpec.From(gev), ResultsFile.Options), ResultsFile.Options)!.Build();
        Assert.Equal(gev.Parameters, back.Parameters);
        Assert.Equal("gev", back.Family);
    }
}
