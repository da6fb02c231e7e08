using MathNet.Numerics.Distributions;
using PairFit.Core.Marginals;

namespace PairFit.Tests.Marginals;

public class SupportWarningTests
{
    // Non-negative data: normal quantiles 3 + 1.5 z at plotting positions, the few negative ones left out.
    private static double[] PositiveData()
    {
        var list = new List<double>();
        for (int i = 1; i <= 400; i++)
        {
            double v = 3 + 1.5 * Normal.InvCDF(0, 1, (i - 0.5) / 400);
            if (v > 0) list.Add(v);
        }
        return [.. list];
    }

    [Fact]
    public void ALawWithMassBelowZeroForNonNegativeDataIsFlagged()
    {
        // A normal law fitted to these values has P(X < 0) ≈ Φ(−2) ≈ 0.02: far from negligible.
        var fit = MarginalAnalysis.Fit(PositiveData(), new MarginalOptions { Forced = "normal" });
        var warning = Assert.Single(fit.Section.Warnings!);
        Assert.Contains("below 0", warning);
        Assert.InRange(fit.Selected.Cdf(0), 0.01, 0.05);
    }

    [Fact]
    public void ALawBoundedAtZeroIsNotFlagged()
    {
        var fit = MarginalAnalysis.Fit(PositiveData(), new MarginalOptions { Forced = "gamma" });
        Assert.Null(fit.Section.Warnings);
    }
}
