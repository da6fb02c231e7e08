using MathNet.Numerics;
using PairFit.Core.Marginals;

namespace PairFit.Tests.Marginals;

/// <summary>
/// Internal consistency of every family at the parameter sets of the SciPy reference file: the
/// density integrates to 1, the CDF is the integral of the density, the quantile inverts the CDF.
/// (Published definitions of a density, CDF and quantile; quadrature by MathNet.)
/// </summary>
public class MarginalIdentityTests
{
    public static IEnumerable<object[]> Cases() => MarginalReference.Cases();

    [Theory]
    [MemberData(nameof(Cases))]
    public void DensityIntegratesToOne(string family, double[] parameters)
    {
        var d = MarginalReference.Create(family, parameters);
        // Split at the median so each half has at most one infinite end and one singular end;
        // double-exponential quadrature handles both. 1e-7: its requested accuracy is 1e-10, but
        // densities with integrable singularities (gamma shape 0.4 at 0) converge more slowly.
        double m = d.Quantile(0.5);
        // Ends: the support bound, or the 1e-17 quantile where the bound is remote (GEV with ξ = 1e-7
        // is bounded at μ − 1e8 σ); the mass left out is then below 1e-16.
        double lower = Math.Max(d.SupportLower, d.Quantile(1e-17)), upper = Math.Min(d.SupportUpper, d.Quantile(1 - 1e-17));
        if (double.IsInfinity(d.SupportLower)) lower = d.SupportLower;
        if (double.IsInfinity(d.SupportUpper)) upper = d.SupportUpper;
        double total = HalfIntegral(d, lower, m) + HalfIntegral(d, upper, m);
        Assert.InRange(total, 1 - 1e-7, 1 + 1e-7);
    }

    /// <summary>
    /// |∫ f| between the median and one end. A finite end is approached through x = end + (m − end) s⁴,
    /// which turns an integrable singularity (x − end)^(k−1), k &gt; 1/4, into a bounded integrand.
    /// </summary>
    private static double HalfIntegral(IMarginalDistribution d, double end, double m)
    {
        if (double.IsInfinity(end)) return Math.Abs(Integrate.DoubleExponential(x => d.Density(x), Math.Min(end, m), Math.Max(end, m), 1e-10));
        return Integrate.DoubleExponential(s => d.Density(end + (m - end) * s * s * s * s) * 4 * s * s * s * Math.Abs(m - end), 0, 1, 1e-10);
    }

    [Theory]
    [MemberData(nameof(Cases))]
    public void CdfIsTheIntegralOfTheDensity(string family, double[] parameters)
    {
        var d = MarginalReference.Create(family, parameters);
        double[] ps = [0.001, 0.05, 0.3, 0.6, 0.9, 0.995];
        for (int i = 0; i + 1 < ps.Length; i++)
        {
            double a = d.Quantile(ps[i]), b = d.Quantile(ps[i + 1]);
            double integral = Integrate.GaussKronrod(x => d.Density(x), a, b, 1e-12, 20, 61);
            // The quadrature is accurate to ~1e-12 on these smooth pieces; 1e-9 absolute covers it.
            Assert.Equal(d.Cdf(b) - d.Cdf(a), integral, CdfAccuracy(d));
        }
    }

    [Theory]
    [MemberData(nameof(Cases))]
    public void QuantileInvertsCdf(string family, double[] parameters)
    {
        var d = MarginalReference.Create(family, parameters);
        foreach (double p in new[] { 1e-10, 1e-4, 0.02, 0.25, 0.5, 0.75, 0.98 })
        {
            double x = d.Quantile(p);
            // 1e-9 relative, plus what rounding x itself costs: F moves by f(x)·|x|·ε when x is rounded
            // (near a support bound such as the GPD threshold, |x| f/F is ~1e10).
            double tol = CdfAccuracy(d) * p + 4 * f(d, x) * Math.Abs(x) * 2.2e-16;
            Assert.True(Math.Abs(d.Cdf(x) - p) <= tol, $"{family}: F(Q({p})) = {d.Cdf(x):R}");
        }
        foreach (double q in new[] { 1e-10, 1e-4, 0.02 })
        {
            double x = d.Quantile(1 - q);
            // Upper tail through the survival function: 1 − q is exact only to 1.1e-16 absolute,
            // i.e. ~1e-6 relative of q = 1e-10.
            double tol = 1e-5 * q + 4 * f(d, x) * Math.Abs(x) * 2.2e-16;
            Assert.True(Math.Abs(d.Survival(x) - q) <= tol, $"{family}: S(Q(1 − {q})) = {d.Survival(x):R}");
        }
    }

    private static double f(IMarginalDistribution d, double x) => d.Density(x);

    /// <summary>F agrees with the integral of f to 1e-9 (the requested quadrature accuracy is far finer).</summary>
    private static double CdfAccuracy(IMarginalDistribution d) => 1e-9;

    /// <summary>
    /// Far lower tail of a near-normal Pearson III (skew 1e-3, gamma shape 4e6) against a direct sum of
    /// the series P(a, x) = x^a e^(−x)/Γ(a + 1) Σ_n x^n/((a + 1)…(a + n)) (Abramowitz and Stegun 1964,
    /// 6.5.29), with ln Γ(a + 1) by Stirling's series: an independent route to the incomplete gamma
    /// function where SciPy 1.10.1 is 0.4 % off (see make_reference.py).
    /// </summary>
    [Fact]
    public void Pearson3FarTailMatchesSeries()
    {
        var d = new Pearson3Distribution(100, 30, 1e-3);
        double x = d.Quantile(1e-6);
        double a = 4 / 1e-6, beta = 30 * 1e-3 / 2, bound = 100 - 2 * 30 / 1e-3;
        double y = (x - bound) / beta;
        double logPrefactor = a * Math.Log(1 + (y - a) / a) + (a - y) - 0.5 * Math.Log(2 * Math.PI * a) - 1 / (12 * a);
        double sum = 1, term = 1;
        for (int n = 1; n < 200_000 && term > 1e-18 * sum; n++) { term *= y / (a + n); sum += term; }
        // a ln(1 + (y − a)/a) is ~1e7 in size, so its rounding limits the check to ~1e-8 relative.
        Assert.Equal(1e-6, Math.Exp(logPrefactor) * sum, 1e-13);
    }
}
