using PairFit.Core.Copulas;
using PairFit.Core.Copulas.Fitting;
using PairFit.Core.Copulas.GoodnessOfFit;
using PairFit.Core.Dependence;

namespace PairFit.Tests.CopulaFitting;

public class GoodnessOfFitTests
{
    private static (double[] U, double[] V) Pseudo(ICopula c, int n, int seed)
    {
        var s = FittingTestData.Simulate(c, n, seed);
        return (Ranks.PseudoObservations(s.X), Ranks.PseudoObservations(s.Y));
    }

    private static ICopula FitPseudo(ICopulaFamily family, int rotation, double[] u, double[] v)
        => CopulaMaximumLikelihood.Fit(family, rotation, u, v, family.StartFromTau(0.4)!).Copula;

    [Fact]
    public void PValueIsIdenticalForOneAndTwoThreads()
    {
        var (u, v) = Pseudo(new ClaytonLaw(2.0), 200, 21);
        var fitted = FitPseudo(ClaytonLaw.Family, 0, u, v);
        var s1 = new double[40];
        var s2 = new double[40];
        var one = CramerVonMisesGof.Test(ClaytonLaw.Family, fitted, u, v, 40, seed: 9, maxDegreeOfParallelism: 1, replicateStatistics: s1);
        var two = CramerVonMisesGof.Test(ClaytonLaw.Family, fitted, u, v, 40, seed: 9, maxDegreeOfParallelism: 2, replicateStatistics: s2);
        Assert.Equal(s1, s2);
        Assert.Equal(one, two);
        Assert.Equal(40, one.Replicates);
        Assert.True(s1.Distinct().Count() > 30); // replicates differ from each other: each has its own stream
    }

    [Fact]
    public void WrongTailIsRejectedAndTrueFamilyIsNot()
    {
        // Clayton θ = 4 has strong lower-tail dependence; its survival (180°) version puts it in the upper tail.
        var (u, v) = Pseudo(new ClaytonLaw(4.0), 300, 31);
        var wrong = FitPseudo(ClaytonLaw.Family, 180, u, v);
        var right = FitPseudo(ClaytonLaw.Family, 0, u, v);
        var gWrong = CramerVonMisesGof.Test(ClaytonLaw.Family, wrong, u, v, 99, seed: 3);
        var gRight = CramerVonMisesGof.Test(ClaytonLaw.Family, right, u, v, 99, seed: 3);
        Assert.Equal(0.01, gWrong.PValue, 12); // no replicate reaches S_n: p = 1/(B+1)
        Assert.True(gWrong.Statistic > 5 * gRight.Statistic);
        Assert.True(gRight.PValue > 0.05, $"p = {gRight.PValue}");
    }

    [Fact]
    public void AnalysisTestsTheSelectedFamilyOrAllOnRequest()
    {
        var s = FittingTestData.Simulate(new ClaytonLaw(2.0), 150, 8);
        // Three families keep the bootstrap of every candidate cheap (the Student t CDF is a quadrature).
        string[] families = ["clayton", "gumbel", "frank"];
        var one = CopulaAnalysis.Fit(s, null, null, new CopulaOptions { Families = families, GofReplicates = 20, Seed = 4 });
        Assert.NotNull(one.Section.Selected.Gof);
        Assert.All(one.Section.Candidates.Skip(1), c => Assert.Null(c.Gof));
        var all = CopulaAnalysis.Fit(s, null, null, new CopulaOptions { Families = families, GofReplicates = 20, Seed = 4, GofAllFamilies = true });
        Assert.All(all.Section.Candidates, c => Assert.NotNull(c.Gof));
        Assert.Equal(one.Section.Selected.Gof, all.Section.Selected.Gof);
    }

    [Fact]
    [Trait("Category", "Slow")]
    public void PValuesAreRoughlyUniformUnderTheTrueFamily()
    {
        // Calibration study: 40 data sets of n = 100 from Clayton θ = 2, B = 40 replicates each.
        // Under H0 the bootstrap p-value is close to uniform (Genest, Rémillard and Beaudoin 2009, section 5).
        // Kolmogorov–Smirnov distance to U(0,1): the 1 % critical value for m = 40 is 1.63/√40 ≈ 0.26 (Massey 1951,
        // Table 1, asymptotic form), widened by 1/(B+1) for the discreteness of the bootstrap p-value.
        const int m = 40, b = 40;
        var p = new double[m];
        for (int k = 0; k < m; k++)
        {
            var (u, v) = Pseudo(new ClaytonLaw(2.0), 100, 70_000 + k);
            var fitted = FitPseudo(ClaytonLaw.Family, 0, u, v);
            p[k] = CramerVonMisesGof.Test(ClaytonLaw.Family, fitted, u, v, b, seed: k).PValue;
        }
        Array.Sort(p);
        double d = 0;
        for (int k = 0; k < m; k++) d = Math.Max(d, Math.Max((k + 1.0) / m - p[k], p[k] - (double)k / m));
        Assert.True(d < 1.63 / Math.Sqrt(m) + 1.0 / (b + 1), $"KS distance {d:F3}; p-values {string.Join(" ", p.Select(x => x.ToString("F2")))}");
        int small = p.Count(x => x <= 0.05);
        Assert.True(small <= 7, $"{small}/{m} p-values ≤ 0.05 (expected about 2)");
    }
}
