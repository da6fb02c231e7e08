using PairFit.Core.Copulas;

namespace PairFit.Tests.Copulas;

/// <summary>
/// Kendall's tau, Spearman's rho and tail dependence: each closed form against its published
/// relation, and every family's tau against an independent numerical computation.
/// </summary>
public class DependenceMeasureTests
{
    public static TheoryData<string, double[]> UnrotatedCases()
    {
        var data = new TheoryData<string, double[]>();
        foreach (var row in CopulaTestCases.ModerateWithRotations())
            if ((int)row[1] == 0) data.Add((string)row[0], (double[])row[2]);
        return data;
    }

    // τ = 1 − 4 ∫∫ (∂C/∂u)(∂C/∂v) du dv (Nelsen 2006, Theorem 5.1.5; numbering from memory). Every unrotated family here is
    // exchangeable, so ∂C/∂v(u, v) = h(u|v). The integrand lies in [0, 1] and is smooth inside the
    // square, so the graded Gauss–Legendre rule is accurate to ~1e−9; 1e−7 is a safe bound.
    [Theory]
    [MemberData(nameof(UnrotatedCases))]
    public void KendallTauMatchesQuadratureOfConditionalCdfs(string family, double[] parameters)
    {
        var c = CopulaTestCases.Create(family, 0, parameters);
        double integral = UnitSquareQuadrature.Integrate((u, v) => c.ConditionalCdf(u, v) * c.ConditionalCdf(v, u));
        Assert.Equal(1 - 4 * integral, c.KendallTau, 1e-7);
    }

    // τ = 4 E[C(U, V)] − 1 (Nelsen 2006, section 5.1.1; numbering from memory), for every rotation: checks the wrapper's sign rules.
    // The integrand C·c has the density's integrable corner singularities; 1e−5 as for the density mass.
    [Theory]
    [MemberData(nameof(CopulaTestCases.ModerateWithRotations), MemberType = typeof(CopulaTestCases))]
    public void KendallTauMatchesExpectationOfCdf(string family, int rotation, double[] parameters)
    {
        var c = CopulaTestCases.Create(family, rotation, parameters);
        double e = UnitSquareQuadrature.Integrate((u, v) => c.Cdf(u, v) * c.Density(u, v));
        Assert.Equal(4 * e - 1, c.KendallTau, 1e-5);
    }

    // ρ_S = 12 ∫∫ uv c(u,v) du dv − 3 (Nelsen 2006, section 5.1.2; numbering from memory), a second route besides the CDF quadrature.
    [Theory]
    [MemberData(nameof(CopulaTestCases.ModerateWithRotations), MemberType = typeof(CopulaTestCases))]
    public void SpearmanRhoMatchesMomentOfDensity(string family, int rotation, double[] parameters)
    {
        var c = CopulaTestCases.Create(family, rotation, parameters);
        double e = UnitSquareQuadrature.Integrate((u, v) => u * v * c.Density(u, v));
        Assert.Equal(12 * e - 3, c.SpearmanRho, 1e-5);
    }

    // Kruskal (1958): for the normal law τ = (2/π) arcsin ρ and ρ_S = (6/π) arcsin(ρ/2).
    [Theory]
    [InlineData(-0.9)]
    [InlineData(0.2)]
    [InlineData(0.75)]
    public void GaussianClosedFormsMatchKruskal(double rho)
    {
        ICopula c = new GaussianLaw(rho);
        Assert.Equal(2 / Math.PI * Math.Asin(rho), c.KendallTau, 15);
        Assert.Equal(6 / Math.PI * Math.Asin(rho / 2), c.SpearmanRho, 15);
        // Independent: Spearman by quadrature of 12∫∫C − 3 (CDF by Genz's bivariate normal), ~1e−7 accurate.
        Assert.Equal(c.SpearmanRho, CopulaMeasures.SpearmanRhoByQuadrature(c), 1e-6);
        Assert.Equal(0.0, c.TailLower);
        Assert.Equal(0.0, c.TailUpper);
    }

    // Nelsen (2006), Examples 5.5 and 5.22 (numbering from memory; also Joe 2014, ch. 4): λ_U = 2 − 2^(1/θ), λ_L = 0.
    [Theory]
    [InlineData(1.0)]
    [InlineData(1.5)]
    [InlineData(4.0)]
    [InlineData(30.0)]
    public void GumbelClosedFormsMatchNelsen(double theta)
    {
        ICopula c = new GumbelLaw(theta);
        Assert.Equal(1 - 1 / theta, c.KendallTau, 15);
        Assert.Equal(2 - Math.Pow(2, 1 / theta), c.TailUpper, 15);
        Assert.Equal(0.0, c.TailLower);
        // Independent: the diagonal C(t,t) = t^(2^(1/θ)) gives (1 − 2t + C(t,t))/(1 − t) → λ_U with error O(1 − t).
        double t = 1 - 1e-7;
        Assert.Equal(c.TailUpper, (1 - 2 * t + c.Cdf(t, t)) / (1 - t), 1e-6);
    }

    // Nelsen (2006), Example 5.22 (numbering from memory): λ_L = 2^(−1/θ) for Clayton; C(t,t)/t = (2 − t^θ)^(−1/θ) → λ_L with error O(t^θ).
    [Theory]
    [InlineData(0.5)]
    [InlineData(3.0)]
    public void ClaytonTailDependenceMatchesNelsen(double theta)
    {
        ICopula c = new ClaytonLaw(theta);
        Assert.Equal(Math.Pow(2, -1 / theta), c.TailLower, 15);
        double t = 1e-12;
        Assert.Equal(c.TailLower, c.Cdf(t, t) / t, 1e-5);
    }

    [Theory]
    [MemberData(nameof(CopulaTestCases.ModerateWithRotations), MemberType = typeof(CopulaTestCases))]
    public void RotationsMoveTheTails(string family, int rotation, double[] parameters)
    {
        var rotated = CopulaTestCases.Create(family, rotation, parameters);
        var inner = CopulaTestCases.Create(family, 0, parameters);
        // (U,V) → (1−U,1−V) swaps the diagonal corners; 90° and 270° move them off the diagonal
        // (Joe 2014, section 1.7; numbering from memory); Kendall's tau keeps or flips sign accordingly.
        switch (rotation)
        {
            case 0:
                Assert.Equal(inner.TailLower, rotated.TailLower);
                break;
            case 180:
                Assert.Equal(inner.TailUpper, rotated.TailLower);
                Assert.Equal(inner.TailLower, rotated.TailUpper);
                Assert.Equal(inner.KendallTau, rotated.KendallTau);
                break;
            default:
                Assert.Equal(0.0, rotated.TailLower);
                Assert.Equal(0.0, rotated.TailUpper);
                Assert.Equal(-inner.KendallTau, rotated.KendallTau);
                break;
        }
    }
}
