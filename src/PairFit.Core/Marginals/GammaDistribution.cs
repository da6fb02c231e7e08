using PairFit.Core.Common;
using MathNet.Numerics;
using PairFit.Core.Marginals.Fitting;

namespace PairFit.Core.Marginals;

/// <summary>
/// Gamma law with shape k and scale θ on (0, ∞): f(x) = x^(k−1) e^(−x/θ) / (Γ(k) θ^k).
/// MLE: for fixed k the scale is mean/k, and the shape solves ln k − ψ(k) = ln(mean) − mean(ln x)
/// (Johnson, Kotz and Balakrishnan 1994, ch. 17, eq. 17.41); both need only the sufficient
/// statistics mean and mean(ln x), so the fit costs nothing per observation.
/// </summary>
public sealed class GammaDistribution : IMarginalDistribution
{
    public const string FamilyName = "gamma";
    private static readonly string[] Names = ["shape", "scale"];
    public static readonly IMarginalFamily Definition = new GammaFamily();

    public GammaDistribution(double shape, double scale)
    {
        if (!(shape > 0) || !double.IsFinite(shape) || !(scale > 0) || !double.IsFinite(scale))
            throw new ArgumentOutOfRangeException(nameof(shape), $"gamma needs finite shape > 0 and scale > 0 (got shape={shape}, scale={scale}).");
        Shape = shape;
        Scale = scale;
    }

    public double Shape { get; }
    public double Scale { get; }

    public string Family => FamilyName;
    public IReadOnlyList<string> ParameterNames => Names;
    public IReadOnlyList<double> Parameters => [Shape, Scale];
    public double SupportLower => 0.0;
    public double SupportUpper => double.PositiveInfinity;
    public double Mean => Shape * Scale;
    public double Variance => Shape * Scale * Scale;

    public double LogDensity(double x) => StandardLogDensity(Shape, x / Scale) - Math.Log(Scale);

    public double Cdf(double x) => x <= 0 ? 0.0 : SpecialFunctions.GammaLowerRegularized(Shape, x / Scale);

    public double Survival(double x) => x <= 0 ? 1.0 : SpecialFunctions.GammaUpperRegularized(Shape, x / Scale);

    public double Quantile(double p) => p <= 0 ? 0.0 : p >= 1 ? double.PositiveInfinity : Scale * StandardQuantile(Shape, p);

    /// <summary>log density of Gamma(k, 1) at y.</summary>
    internal static double StandardLogDensity(double k, double y)
    {
        if (y < 0 || double.IsNaN(y)) return double.NegativeInfinity;
        if (y == 0) return k == 1 ? 0.0 : k < 1 ? double.PositiveInfinity : double.NegativeInfinity;
        return (k - 1) * Math.Log(y) - y - SpecialFunctions.GammaLn(k);
    }

    /// <summary>Quantile of Gamma(k, 1).</summary>
    internal static double StandardQuantile(double k, double p) => SpecialFunctions.GammaLowerRegularizedInv(k, p);

    /// <summary>
    /// Shape k̂ solving ln k − ψ(k) = s for s = ln(mean) − mean(ln x) &gt; 0, started from Minka's (2002)
    /// approximation k ≈ (3 − s + √((s − 3)² + 24 s)) / (12 s). Null when s ≤ 0 (all values equal).
    /// </summary>
    internal static double? SolveShape(double s)
    {
        if (!(s > 0) || !double.IsFinite(s)) return null;
        double k0 = (3 - s + Math.Sqrt((s - 3) * (s - 3) + 24 * s)) / (12 * s);
        // ln k − ψ(k) is decreasing in k; solve in t = ln k for a well-scaled bracket.
        double? t = MonotoneRoot.Find(t => t - SpecialFunctions.DiGamma(Math.Exp(t)) - s,
            Math.Log(k0) - 0.1, Math.Log(k0) + 0.1, -40, 40, 1e-14);
        return t is null ? null : Math.Exp(t.Value);
    }

    /// <summary>Σ log f from n, mean and mean(ln x): n[(k−1) m_ln − mean/θ − k ln θ − ln Γ(k)].</summary>
    internal static double LogLikelihood(int n, double mean, double meanLog, double k, double theta)
    {
        if (!(k > 0) || !(theta > 0) || !double.IsFinite(k) || !double.IsFinite(theta)) return double.NegativeInfinity;
        return n * ((k - 1) * meanLog - mean / theta - k * Math.Log(theta) - SpecialFunctions.GammaLn(k));
    }

    private sealed class GammaFamily : IMarginalFamily
    {
        public string Name => FamilyName;
        public IReadOnlyList<string> ParameterNames => Names;
        public string? SupportProblem(MarginalSample s) => SupportChecks.Positive(s, FamilyName);

        public MarginalEstimate FitMaximumLikelihood(MarginalSample s)
        {
            double? k = SolveShape(Math.Log(s.Mean) - s.MeanLog);
            if (k is null) return new([1.0, s.Mean], false, "mle", "shape equation has no root (values nearly equal)");
            return new([k.Value, s.Mean / k.Value], true, "mle");
        }

        public double LogLikelihood(MarginalSample s, ReadOnlySpan<double> p) => GammaDistribution.LogLikelihood(s.N, s.Mean, s.MeanLog, p[0], p[1]);

        public IMarginalDistribution Create(IReadOnlyList<double> p) => new GammaDistribution(p[0], p[1]);
    }
}
