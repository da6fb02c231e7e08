using PairFit.Core.Common;

namespace PairFit.Tests.Copulas;

/// <summary>The univariate t helpers behind the Student t copula.</summary>
public class StudentTFunctionTests
{
    // Every path of the quantile (centre, tails, either half) must invert the CDF; the CDF itself is
    // checked against SciPy in ReferenceValueTests. The CDF is accurate to a few ulps relative in the
    // lower tail, so 1e−13 relative (of min(p, 1 − p)) bounds the round trip.
    [Theory]
    [InlineData(2.0)]
    [InlineData(2.5)]
    [InlineData(5.0)]
    [InlineData(17.3)]
    [InlineData(60.0)]
    public void QuantileInvertsCdfOnAFineGrid(double nu)
    {
        var t = new StudentTFunctions(nu);
        for (int i = -14; i <= 2000; i++)
        {
            double p = i <= 0 ? Math.Pow(10, i - 1) : i / 2001.0;
            double x = t.Quantile(p);
            // By symmetry the upper half is checked as F(−x) = 1 − p (1 − p is exact for p ≥ ½).
            double q = Math.Min(p, 1 - p);
            double back = p < 0.5 ? t.Cdf(x) : t.Cdf(-x);
            Assert.True(Math.Abs(back - q) <= 1e-13 * q, $"nu={nu} p={p}: x={x}, F={back} vs {q}");
        }
    }

    // ν = 2 has the closed form x = (2p − 1)/√(2p(1 − p)) (Jones 2002, "Student's simplest distribution").
    [Theory]
    [InlineData(1e-12)]
    [InlineData(0.003)]
    [InlineData(0.3)]
    [InlineData(0.77)]
    public void QuantileMatchesClosedFormAtTwoDegrees(double p)
    {
        double exact = (2 * p - 1) / Math.Sqrt(2 * p * (1 - p));
        Assert.Equal(exact, new StudentTFunctions(2).Quantile(p), 1e-13 * Math.Abs(exact));
    }
}
