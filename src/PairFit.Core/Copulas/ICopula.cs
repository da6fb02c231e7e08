namespace PairFit.Core.Copulas;

/// <summary>
/// A bivariate copula with fixed parameters, on the unit square. Every family (and every
/// rotation of one) answers the same verbs, so fitting, goodness of fit, sampling, projection
/// and figures never special-case a family.
/// </summary>
public interface ICopula
{
    /// <summary>Trade name in lower case: "gaussian", "student-t", "clayton", ...</summary>
    string Family { get; }

    /// <summary>Rotation in degrees counter-clockwise: 0, 90, 180 (survival) or 270.</summary>
    int Rotation { get; }

    /// <summary>Parameter names in the order of <see cref="Parameters"/>: "rho", "nu", "theta".</summary>
    IReadOnlyList<string> ParameterNames { get; }

    IReadOnlyList<double> Parameters { get; }

    /// <summary>log c(u, v) for u, v in (0, 1).</summary>
    double LogDensity(double u, double v);

    /// <summary>C(u, v) = P(U ≤ u, V ≤ v).</summary>
    double Cdf(double u, double v);

    /// <summary>h(v | u) = ∂C(u, v)/∂u = P(V ≤ v | U = u).</summary>
    double ConditionalCdf(double u, double v);

    /// <summary>The v with h(v | u) = w; used for sampling by conditional inversion.</summary>
    double InverseConditionalCdf(double u, double w);

    /// <summary>Kendall's tau implied by the parameters.</summary>
    double KendallTau { get; }

    /// <summary>Spearman's rho implied by the parameters (closed form or quadrature).</summary>
    double SpearmanRho { get; }

    /// <summary>Lower tail dependence λ_L = lim_{t→0} C(t, t)/t.</summary>
    double TailLower { get; }

    /// <summary>Upper tail dependence λ_U = lim_{t→1} (1 − 2t + C(t, t))/(1 − t).</summary>
    double TailUpper { get; }

    double Density(double u, double v) => Math.Exp(LogDensity(u, v));
}

/// <summary>
/// What the fitting code needs to know about a family before it has parameters: names,
/// bounds, a starting value from Kendall's tau, the rotations worth trying, and a factory.
/// </summary>
public interface ICopulaFamily
{
    string Name { get; }
    IReadOnlyList<string> ParameterNames { get; }

    /// <summary>Lower bounds of the unrotated family's parameters (open or closed as documented by the family).</summary>
    IReadOnlyList<double> LowerBounds { get; }

    /// <summary>Upper bounds of the unrotated family's parameters.</summary>
    IReadOnlyList<double> UpperBounds { get; }

    /// <summary>
    /// Rotations that give distinct models: {0, 90, 180, 270} for one-sided families such as
    /// Clayton, {0} for families that already cover both signs and are radially symmetric.
    /// </summary>
    IReadOnlyList<int> Rotations { get; }

    /// <summary>
    /// Starting parameters of the unrotated family for a target Kendall's tau (inversion of the
    /// closed form), or null when the unrotated family cannot reach that tau.
    /// </summary>
    double[]? StartFromTau(double tau);

    /// <summary>The unrotated copula with these parameters.</summary>
    ICopula Create(IReadOnlyList<double> parameters);
}
