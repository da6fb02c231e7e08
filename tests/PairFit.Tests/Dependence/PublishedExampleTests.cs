using PairFit.Core.Dependence;

namespace PairFit.Tests.Dependence;

/// <summary>Worked examples from the literature (values confirmed with SciPy 1.10.1 by hand as well).</summary>
public class PublishedExampleTests
{
    [Fact]
    public void KendallTenObjectRankingExample()
    {
        // Kendall, Rank Correlation Methods (1970), ch. 1: two rankings of ten objects,
        // (1..10) and (4, 7, 2, 10, 3, 6, 8, 1, 5, 9): S = 5 of 45 pairs, tau = 0.111 (from memory).
        double[] a = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10];
        double[] b = [4, 7, 2, 10, 3, 6, 8, 1, 5, 9];
        var c = KendallTau.Count(a, b);
        Assert.Equal(5, c.S);
        Assert.Equal(45, c.TotalPairs);
        Assert.Equal(5.0 / 45.0, KendallTau.TauB(a, b), 1e-15);
    }

    [Fact]
    public void SpearmanIqAgainstTelevisionHoursExample()
    {
        // The ten-person IQ vs weekly television hours example of the Wikipedia article
        // "Spearman's rank correlation coefficient" (from memory): Σd² = 194, rho = 1 − 6·194/(10·99) = −29/165,
        // p = 0.627188 (t distribution).
        double[] iq = [106, 86, 100, 101, 99, 103, 97, 113, 112, 110];
        double[] tv = [7, 0, 27, 50, 28, 29, 20, 12, 6, 17];
        Assert.Equal(-29.0 / 165.0, SpearmanCorrelation.Estimate(iq, tv), 1e-15);
        var d = DependenceAnalysis.Compute(new PairFit.Core.Data.PairedSample(iq, tv, "iq", "tv"));
        Assert.Equal(0.627188, d.Spearman.PValue!.Value, 6); // six decimals as printed
    }
}
