using PairFit.Core.Copulas;

namespace PairFit.Tests.Copulas;

/// <summary>The family metadata the fitting code relies on: registry order, rotations, bounds, starting values.</summary>
public class FamilyContractTests
{
    [Fact]
    public void RegistryListsTheFamiliesInTheAgreedOrder()
    {
        Assert.Equal(["independence", "gaussian", "student-t", "clayton", "gumbel", "frank", "joe"],
            CopulaRegistry.Families.Select(f => f.Name).ToArray());
    }

    // One-sided families need the four rotations to reach every corner; radially symmetric families
    // that already cover both signs (Gaussian, t, Frank) gain nothing from rotation (Joe 2014, section 1.7; numbering from memory).
    [Theory]
    [InlineData("independence", new[] { 0 })]
    [InlineData("gaussian", new[] { 0 })]
    [InlineData("student-t", new[] { 0 })]
    [InlineData("frank", new[] { 0 })]
    [InlineData("clayton", new[] { 0, 90, 180, 270 })]
    [InlineData("gumbel", new[] { 0, 90, 180, 270 })]
    [InlineData("joe", new[] { 0, 90, 180, 270 })]
    public void RotationsAreAsDocumented(string family, int[] rotations)
        => Assert.Equal(rotations, CopulaRegistry.Find(family).Rotations.ToArray());

    [Fact]
    public void EveryFamilyNamesItsParametersConsistently()
    {
        foreach (var family in CopulaRegistry.Families)
        {
            int k = family.ParameterNames.Count;
            Assert.Equal(k, family.LowerBounds.Count);
            Assert.Equal(k, family.UpperBounds.Count);
            var start = family.StartFromTau(0.3);
            Assert.NotNull(start);
            var copula = family.Create(start!);
            Assert.Equal(family.Name, copula.Family);
            Assert.Equal(family.ParameterNames, copula.ParameterNames);
            for (int i = 0; i < k; i++)
            {
                Assert.InRange(start![i], family.LowerBounds[i], family.UpperBounds[i]);
                Assert.Equal(start[i], copula.Parameters[i]);
            }
        }
    }

    // StartFromTau inverts the closed-form τ: the copula it starts from has the requested τ (Brent to
    // 1e−10 in θ for Frank and Joe, so τ to ~1e−10 times dτ/dθ < 1).
    [Theory]
    [InlineData("gaussian", 0.4)]
    [InlineData("gaussian", -0.55)]
    [InlineData("student-t", 0.25)]
    [InlineData("student-t", -0.7)]
    [InlineData("clayton", 0.45)]
    [InlineData("gumbel", 0.6)]
    [InlineData("frank", 0.35)]
    [InlineData("frank", -0.8)]
    [InlineData("frank", 0.001)]
    [InlineData("joe", 0.5)]
    [InlineData("joe", 0.02)]
    public void StartFromTauReproducesTau(string name, double tau)
    {
        var family = CopulaRegistry.Find(name);
        var copula = family.Create(family.StartFromTau(tau)!);
        Assert.Equal(tau, copula.KendallTau, 1e-9);
    }

    [Theory]
    [InlineData("clayton")]
    [InlineData("gumbel")]
    [InlineData("joe")]
    public void OneSidedFamiliesDeclineNegativeTau(string name)
        => Assert.Null(CopulaRegistry.Find(name).StartFromTau(-0.3));

    [Fact]
    public void InvalidParametersAreRejected()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new GaussianLaw(1.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => new StudentTLaw(0.5, 0));
        Assert.Throws<ArgumentOutOfRangeException>(() => new GumbelLaw(0.99));
        Assert.Throws<ArgumentOutOfRangeException>(() => new FrankLaw(0));
        Assert.Throws<ArgumentOutOfRangeException>(() => new JoeLaw(double.NaN));
    }

    // Joe (2014, ch. 4) / Nelsen (2006, section 5.4; from memory): Joe λ_U = 2 − 2^(1/θ), λ_L = 0. Independent check
    // from the diagonal: (1 − 2t + C(t,t))/(1 − t) → λ_U with an error O(1 − t) (the diagonal is smooth at 1).
    [Theory]
    [InlineData(1.5)]
    [InlineData(6.0)]
    public void JoeTailDependenceMatchesPublishedForm(double theta)
    {
        ICopula c = new JoeLaw(theta);
        Assert.Equal(2 - Math.Pow(2, 1 / theta), c.TailUpper, 15);
        Assert.Equal(0.0, c.TailLower);
        double t = 1 - 1e-7;
        Assert.Equal(c.TailUpper, (1 - 2 * t + c.Cdf(t, t)) / (1 - t), 1e-5);
    }

    // Student t: λ = 2 t_{ν+1}(−√((ν+1)(1−ρ)/(1+ρ))) (Embrechts, McNeil and Straumann 2002). Independent
    // check from the diagonal C(t,t)/t at t = 1e−9: the approach is slow, relative error ~ t^(2/ν) (seen:
    // 1e−5, 1e−7 at ν = 2 and 4e−3, 4e−4 at ν = 4 for t = 1e−5, 1e−7), so 1e−5 for ν = 2 and 2e−4 for ν = 4.
    [Theory]
    [InlineData(2.0, 1e-5)]
    [InlineData(4.0, 2e-4)]
    public void StudentTTailDependenceIsTheDiagonalLimit(double nu, double relativeTolerance)
    {
        ICopula c = new StudentTLaw(0.5, nu);
        double t = 1e-9;
        Assert.Equal(c.TailLower, c.Cdf(t, t) / t, relativeTolerance * c.TailLower);
    }
}
