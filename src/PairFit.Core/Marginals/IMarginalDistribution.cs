namespace PairFit.Core.Marginals;

/// <summary>
/// A fitted (or given) univariate distribution with fixed parameters. Every marginal family
/// answers the same verbs, so the copula, projection and figure code never special-cases one.
/// </summary>
public interface IMarginalDistribution
{
    /// <summary>Trade name in lower case, e.g. "normal", "gev". Used in the results file.</summary>
    string Family { get; }

    /// <summary>Parameter names in the order of <see cref="Parameters"/>, e.g. ["mu", "sigma"].</summary>
    IReadOnlyList<string> ParameterNames { get; }

    IReadOnlyList<double> Parameters { get; }

    /// <summary>Lower end of the support (may be -Infinity).</summary>
    double SupportLower { get; }

    /// <summary>Upper end of the support (may be +Infinity).</summary>
    double SupportUpper { get; }

    /// <summary>log f(x); -Infinity outside the support.</summary>
    double LogDensity(double x);

    /// <summary>F(x) = P(X ≤ x).</summary>
    double Cdf(double x);

    /// <summary>1 − F(x), computed without cancellation where the family allows.</summary>
    double Survival(double x) => 1.0 - Cdf(x);

    /// <summary>F⁻¹(p) for p in [0, 1]; the support ends at p = 0 and p = 1.</summary>
    double Quantile(double p);

    /// <summary>Mean, or NaN where it is not finite.</summary>
    double Mean { get; }

    /// <summary>Variance, or NaN where it is not finite.</summary>
    double Variance { get; }

    double Density(double x) => Math.Exp(LogDensity(x));
}
