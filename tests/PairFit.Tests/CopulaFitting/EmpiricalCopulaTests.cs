using PairFit.Core.Common;
using PairFit.Core.Copulas;
using PairFit.Core.Copulas.GoodnessOfFit;
using PairFit.Core.Dependence;

namespace PairFit.Tests.CopulaFitting;

public class EmpiricalCopulaTests
{
    /// <summary>The definition C_n(u, v) = (1/n) Σ_j 1(U_j ≤ u, V_j ≤ v) (Deheuvels 1979), counted directly in O(n²).</summary>
    private static double[] BruteForce(double[] u, double[] v)
    {
        var r = new double[u.Length];
        for (int i = 0; i < u.Length; i++)
        {
            int c = 0;
            for (int j = 0; j < u.Length; j++)
                if (u[j] <= u[i] && v[j] <= v[i]) c++;
            r[i] = (double)c / u.Length;
        }
        return r;
    }

    [Fact]
    public void HandWorkedExample()
    {
        // Points (1,3), (2,1), (3,2): dominated counts 1, 1, 2 (worked by hand from the definition).
        var c = EmpiricalCopula.AtSamplePoints([1, 2, 3], [3, 1, 2]);
        Assert.Equal(new[] { 1 / 3.0, 1 / 3.0, 2 / 3.0 }, c);
    }

    [Theory]
    [InlineData(1, 500, false)]
    [InlineData(2, 500, true)]   // heavy ties in both coordinates (values rounded to 10 levels)
    [InlineData(3, 2, false)]
    public void FenwickCountEqualsTheDefinition(int seed, int n, bool ties)
    {
        var rng = RandomStreams.For(seed);
        var u = new double[n];
        var v = new double[n];
        for (int i = 0; i < n; i++)
        {
            u[i] = rng.NextDouble();
            v[i] = 0.5 * u[i] + 0.5 * rng.NextDouble();
            if (ties) { u[i] = Math.Round(u[i] * 10); v[i] = Math.Round(v[i] * 10); }
        }
        Assert.Equal(BruteForce(u, v), EmpiricalCopula.AtSamplePoints(u, v));
    }

    [Fact]
    public void StatisticEqualsTheDirectSum()
    {
        // S_n = Σ (C_n − C_θ)² (Genest, Rémillard and Beaudoin 2009), here with the O(n²) C_n and the Clayton CDF.
        var sample = FittingTestData.Simulate(new ClaytonLaw(1.5), 300, 7);
        double[] u = Ranks.PseudoObservations(sample.X), v = Ranks.PseudoObservations(sample.Y);
        var copula = new ClaytonLaw(1.4);
        var cn = BruteForce(u, v);
        double direct = 0;
        for (int i = 0; i < u.Length; i++) direct += Math.Pow(cn[i] - copula.Cdf(u[i], v[i]), 2);
        Assert.Equal(direct, CramerVonMisesGof.Statistic(copula, u, v), 12);
    }
}
