using MathNet.Numerics;
using PairFit.Core.Marginals;

namespace PairFit.Tests.Marginals;

/// <summary>Sample L-moments and the L-moment estimators against the published relations.</summary>
public class LMomentTests
{
    /// <summary>
    /// Sample L-moments from probability-weighted moments equal the definition as averages over all
    /// subsets of size r of r⁻¹ Σ_k (−1)^k C(r−1, k) x_(r−k):r (Hosking 1990, eq. 2.1 and §3).
    /// </summary>
    [Fact]
    public void SampleLMomentsMatchSubsetDefinition()
    {
        double[] x = [3.1, 0.4, 7.7, 2.2, 9.9, 5.0, 1.3, 4.4, 12.5];
        Array.Sort(x);
        var l = LMoments.FromSorted(x);
        double[] direct = new double[5];
        int n = x.Length;
        for (int r = 1; r <= 4; r++)
        {
            double total = 0;
            long count = 0;
            foreach (var subset in Subsets(n, r))
            {
                double s = 0;
                for (int k = 0; k < r; k++) s += (k % 2 == 0 ? 1 : -1) * SpecialFunctions.Binomial(r - 1, k) * x[subset[r - 1 - k]];
                total += s / r;
                count++;
            }
            direct[r] = total / count;
        }
        Assert.Equal(direct[1], l.L1, 12);
        Assert.Equal(direct[2], l.L2, 12);
        Assert.Equal(direct[3] / direct[2], l.T3, 12);
        Assert.Equal(direct[4] / direct[2], l.T4, 12);
    }

    private static IEnumerable<int[]> Subsets(int n, int r)
    {
        var idx = Enumerable.Range(0, r).ToArray();
        while (true)
        {
            yield return (int[])idx.Clone();
            int i = r - 1;
            while (i >= 0 && idx[i] == n - r + i) i--;
            if (i < 0) yield break;
            idx[i]++;
            for (int j = i + 1; j < r; j++) idx[j] = idx[j - 1] + 1;
        }
    }

    /// <summary>Population λ1, λ2, τ3 by quadrature of the quantile against shifted Legendre polynomials
    /// (Hosking 1990, eq. 2.3: λ_r = ∫ Q(u) P*_(r−1)(u) du).</summary>
    private static LMoments Population(IMarginalDistribution d)
    {
        double Q(double u) => d.Quantile(u);
        double l1 = Integrate.DoubleExponential(Q, 0, 1, 1e-12);
        double l2 = Integrate.DoubleExponential(u => Q(u) * (2 * u - 1), 0, 1, 1e-12);
        double l3 = Integrate.DoubleExponential(u => Q(u) * (6 * u * u - 6 * u + 1), 0, 1, 1e-12);
        return new LMoments(l1, l2, l3 / l2, double.NaN);
    }

    // Hosking (1990), Table 1 / Hosking and Wallis (1997), Appendix A: GEV with k = −ξ:
    // λ1 = ξ₀ + α(1 − Γ(1+k))/k, λ2 = α(1 − 2^−k)Γ(1+k)/k, τ3 = 2(1 − 3^−k)/(1 − 2^−k) − 3.
    [Theory]
    [InlineData(50, 10, 0.15)]
    [InlineData(50, 10, -0.2)]
    [InlineData(0, 1, 0.4)]
    public void GevLMomentsAndEstimator(double mu, double sigma, double xi)
    {
        double k = -xi, g = SpecialFunctions.Gamma(1 + k);
        var closed = new LMoments(mu + sigma * (1 - g) / k, sigma * (1 - Math.Pow(2, -k)) * g / k,
            2 * (1 - Math.Pow(3, -k)) / (1 - Math.Pow(2, -k)) - 3, double.NaN);
        var quad = Population(new GevDistribution(mu, sigma, xi));
        Assert.Equal(closed.L1, quad.L1, 1e-7 * Math.Max(1, Math.Abs(closed.L1)));
        Assert.Equal(closed.L2, quad.L2, 1e-7 * closed.L2);
        Assert.Equal(closed.T3, quad.T3, 1e-7);
        // Hosking, Wallis and Wood (1985): the approximation k ≈ 7.8590c + 2.9554c² is within 0.0009
        // of the exact k for −0.5 ≤ k ≤ 0.5; the scale and location inherit an error of that order.
        var fit = GevDistribution.FromLMoments(closed);
        Assert.InRange(fit[2] - xi, -9e-4, 9e-4);
        Assert.InRange(fit[1] / sigma - 1, -5e-3, 5e-3);
        Assert.InRange((fit[0] - mu) / sigma, -5e-3, 5e-3);
    }

    // Gumbel: λ1 = μ + γ_E β, λ2 = β ln 2 (Hosking 1990, Table 1): exact inversion.
    [Fact]
    public void GumbelLMomentsAndEstimator()
    {
        var quad = Population(new GumbelDistribution(100, 25));
        Assert.Equal(100 + Constants.EulerMascheroni * 25, quad.L1, 1e-7);
        Assert.Equal(25 * Math.Log(2), quad.L2, 1e-8);
        Assert.Equal(0.1699, quad.T3, 4);   // Gumbel τ3 = 0.1699 (Hosking 1990, Table 1)
        var fit = GumbelDistribution.FromLMoments(new LMoments(100 + Constants.EulerMascheroni * 25, 25 * Math.Log(2), 0.1699, 0.1504));
        Assert.Equal(100, fit[0], 10);
        Assert.Equal(25, fit[1], 10);
    }

    // Generalized Pareto with k = −ξ: λ1 = ξ₀ + α/(1+k), λ2 = α/((1+k)(2+k)), τ3 = (1−k)/(3+k)
    // (Hosking and Wallis 1997, Appendix A): exact inversion.
    [Theory]
    [InlineData(10, 5, 0.2)]
    [InlineData(0, 2, -0.3)]
    public void GeneralizedParetoLMomentsAndEstimator(double loc, double scale, double xi)
    {
        double k = -xi;
        var closed = new LMoments(loc + scale / (1 + k), scale / ((1 + k) * (2 + k)), (1 - k) / (3 + k), double.NaN);
        var quad = Population(new GeneralizedParetoDistribution(loc, scale, xi));
        Assert.Equal(closed.L1, quad.L1, 1e-7 * Math.Max(1, closed.L1));
        Assert.Equal(closed.L2, quad.L2, 1e-7 * closed.L2);
        Assert.Equal(closed.T3, quad.T3, 1e-7);
        var fit = GeneralizedParetoDistribution.FromLMoments(closed);
        Assert.Equal(loc, fit[0], 1e-10);
        Assert.Equal(scale, fit[1], 1e-10);
        Assert.Equal(xi, fit[2], 1e-12);
    }

    // Pearson III: λ1 = μ; τ3 from quadrature; the rational approximations for α(τ3) of Hosking and
    // Wallis (1997, Appendix A) are quoted with relative accuracy better than about 5e-5, which
    // carries into γ = 2/√α and σ (allow 1e-4).
    [Theory]
    [InlineData(100, 30, 0.8)]
    [InlineData(100, 30, -1.2)]
    [InlineData(2, 0.25, 3.0)]
    public void Pearson3LMomentEstimator(double mu, double sigma, double skew)
    {
        var quad = Population(new Pearson3Distribution(mu, sigma, skew));
        var fit = Pearson3Distribution.FromLMoments(quad);
        Assert.Equal(mu, fit[0], 1e-7 * Math.Abs(mu));
        Assert.Equal(sigma, fit[1], 1e-4 * sigma);
        Assert.Equal(skew, fit[2], 1e-4 * Math.Abs(skew));
    }
}
