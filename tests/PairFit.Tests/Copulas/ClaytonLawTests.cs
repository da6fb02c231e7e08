using MathNet.Numerics;
using PairFit.Core.Copulas;

namespace PairFit.Tests.Copulas;

public class ClaytonLawTests
{
    // Nelsen (2006), Example 5.4: Kendall's tau of the Clayton family is θ/(θ + 2).
    [Theory]
    [InlineData(0.5)]
    [InlineData(2.0)]
    [InlineData(10.0)]
    public void KendallTauMatchesPublishedRelation(double theta)
    {
        ICopula c = new ClaytonLaw(theta);
        Assert.Equal(theta / (theta + 2), c.KendallTau, 14);
        // Independent check: τ = 4 ∫∫ C dC − 1 = 1 − 4 ∫∫ h(v|u) h(u|v) du dv would need h(u|v); use
        // instead τ = 4 E[C(U,V)] − 1 by quadrature of C·c over the unit square.
        double e = Integrate.OnRectangle((u, v) => c.Cdf(u, v) * c.Density(u, v), 0, 1, 0, 1, 128);
        Assert.InRange(4 * e - 1 - c.KendallTau, -2e-3, 2e-3);
    }

    [Theory]
    [InlineData(1.0, 0.3, 0.7)]
    [InlineData(50.0, 1e-8, 0.5)]
    [InlineData(50.0, 0.999999, 1e-6)]
    public void InverseConditionalCdfInvertsConditionalCdf(double theta, double u, double w)
    {
        ICopula c = new ClaytonLaw(theta);
        double v = c.InverseConditionalCdf(u, w);
        Assert.InRange(v, 0.0, 1.0);
        Assert.Equal(w, c.ConditionalCdf(u, v), 9);
    }
}
