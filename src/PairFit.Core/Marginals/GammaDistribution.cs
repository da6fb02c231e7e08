using MathNet.Numerics;
using PairFit.Core.Common;
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

    public double Cdf(double x) => x <= 0 ? 0.0 : LowerRegularized(Shape, x / Scale);

    public double Survival(double x) => x <= 0 ? 1.0 : UpperRegularized(Shape, x / Scale);

    public double Quantile(double p) => p <= 0 ? 0.0 : p >= 1 ? double.PositiveInfinity
        : Scale * (p <= 0.5 ? StandardQuantile(Shape, p, upper: false) : StandardQuantile(Shape, 1 - p, upper: true));

    /// <summary>log density of Gamma(k, 1) at y.</summary>
    internal static double StandardLogDensity(double k, double y) => new StandardGamma(k).LogDensity(y);

    /// <summary>
    /// P(k, y), the regularised lower incomplete gamma function. For y &lt; min(1, k) the power series
    /// P = y^k e^(−y)/Γ(k+1) Σ_n y^n/((k+1)…(k+n)) (Abramowitz and Stegun 1964, 6.5.29) is summed
    /// here, because MathNet 5.0.0 returns 0 for very small y (seen at k = 0.4, y = 1e-26);
    /// elsewhere MathNet's GammaLowerRegularized.
    /// </summary>
    internal static double LowerRegularized(double k, double y)
    {
        if (!(y > 0)) return 0.0;
        if (k > LargeShape) return LargeShapeTail(k, y, upper: false);
        if (y >= 1 || y >= k) return SpecialFunctions.GammaLowerRegularized(k, y);
        double sum = 1, term = 1;
        for (int n = 1; n < 1000; n++)
        {
            term *= y / (k + n);
            sum += term;
            if (term < 1e-17 * sum) break;
        }
        return Math.Exp(k * Math.Log(y) - y - SpecialFunctions.GammaLn(k + 1)) * sum;
    }

    /// <summary>Q(k, y) = 1 − P(k, y); from MathNet except where <see cref="LowerRegularized"/> sums the series.</summary>
    internal static double UpperRegularized(double k, double y)
    {
        if (!(y > 0)) return 1.0;
        if (k > LargeShape) return LargeShapeTail(k, y, upper: true);
        if (y >= 1 || y >= k) return SpecialFunctions.GammaUpperRegularized(k, y);
        return 1 - LowerRegularized(k, y);
    }

    /// <summary>Above this shape the incomplete gamma functions are computed here (see <see cref="LargeShapeTail"/>).</summary>
    private const double LargeShape = 1000;

    /// <summary>
    /// P(k, y) or Q(k, y) for large k. MathNet 5.0.0 carries relative errors of several 1e-9 there
    /// (seen at k = 4e6), so the smaller tail is summed directly: below the mean by the power series
    /// (Abramowitz and Stegun 1964, 6.5.29), above it by the continued fraction for Q evaluated with
    /// the modified Lentz method (Press et al. 2007, §6.2). The prefactor y^k e^(−y)/Γ(k) is taken in the
    /// cancellation-free form k(ln(1+t) − t) + ½ ln(k/2π) − S(k), y = k(1 + t), S Stirling's series.
    /// Cost grows like √k terms (about 1e4 at k = 4e6).
    /// </summary>
    private static double LargeShapeTail(double k, double y, bool upper)
    {
        double t = (y - k) / k, k3 = k * k * k;
        double stirling = 1 / (12 * k) - 1 / (360 * k3) + 1 / (1260 * k3 * k * k);
        double logPrefactor = k * (MathExtras.Log1P(t) - t) + 0.5 * Math.Log(k / (2 * Math.PI)) - stirling;   // ln(y^k e^−y / Γ(k))
        double smaller;
        bool lowerIsSmaller = y < k;
        if (lowerIsSmaller)
        {
            double sum = 1, term = 1;
            for (int n = 1; n < 10_000_000; n++)
            {
                term *= y / (k + n);
                sum += term;
                if (term < 1e-17 * sum) break;
            }
            smaller = Math.Exp(logPrefactor - Math.Log(k)) * sum;   // / Γ(k + 1) = / (k Γ(k))
        }
        else
        {
            const double tiny = 1e-300;
            double b = y + 1 - k, c = 1 / tiny, d = 1 / b, h = d;
            for (int i = 1; i < 10_000_000; i++)
            {
                double an = -i * (i - k);
                b += 2;
                d = an * d + b;
                if (Math.Abs(d) < tiny) d = tiny;
                c = b + an / c;
                if (Math.Abs(c) < tiny) c = tiny;
                d = 1 / d;
                double delta = d * c;
                h *= delta;
                if (Math.Abs(delta - 1) < 1e-16) break;
            }
            smaller = Math.Exp(logPrefactor) * h;
        }
        return lowerIsSmaller == upper ? 1 - smaller : smaller;
    }

    /// <summary>
    /// The y with P(k, y) = p (lower tail) or Q(k, y) = p (upper tail, <paramref name="upper"/>) for
    /// Gamma(k, 1). MathNet's GammaLowerRegularizedInv alone was off by up to 1e-3 relative in the far
    /// tails (against SciPy 1.10.1), so its value only starts Newton's method on ln P (or ln Q) as a
    /// function of ln y, whose slope y f(y)/P is taken from the log density.
    /// </summary>
    internal static double StandardQuantile(double k, double p, bool upper)
    {
        if (!(p > 0)) return upper ? double.PositiveInfinity : 0.0;
        if (!(p < 1)) return upper ? 0.0 : double.PositiveInfinity;
        double y = SpecialFunctions.GammaLowerRegularizedInv(k, upper ? 1 - p : p);
        if (!(y > 0) || !double.IsFinite(y)) y = k;   // the mean: a safe start when the inverse fails
        double target = Math.Log(p), t = Math.Log(y);
        var density = new StandardGamma(k);
        double Tail(double yy) => upper ? UpperRegularized(k, yy) : LowerRegularized(k, yy);
        for (int i = 0; i < 100; i++)
        {
            double tail = Tail(y);
            if (!(tail > 0)) { t += upper ? -1 : 1; y = Math.Exp(t); continue; }
            double f = Math.Log(tail) - target;
            // d ln P / d ln y = y f(y) / P; d ln Q / d ln y = −y f(y) / Q.
            double slope = Math.Exp(Math.Log(y) + density.LogDensity(y) - Math.Log(tail)) * (upper ? -1 : 1);
            if (!(Math.Abs(slope) > 0) || !double.IsFinite(slope)) break;
            double step = Math.Clamp(f / slope, -2, 2);
            t -= step;
            y = Math.Exp(t);
            if (Math.Abs(step) < 1e-15 * Math.Max(1, Math.Abs(t))) break;
        }
        return y;
    }

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
        public bool LikelihoodFromSufficientStatistics => true;
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

/// <summary>
/// log density of Gamma(k, 1), with ln Γ(k) computed once. For k &gt; 100 it is written around the
/// mean, y = k(1 + t): ln f = k(ln(1 + t) − t) − ln(1 + t) − ½ ln(2πk) − S(k), with Stirling's
/// series S(k) = 1/(12k) − 1/(360k³) + 1/(1260k⁵) (Abramowitz and Stegun 1964, 6.1.41), because the
/// textbook form (k − 1) ln y − y − ln Γ(k) cancels terms of size k ln k (1e-8 relative error at k = 4e6).
/// </summary>
internal readonly struct StandardGamma
{
    private const double LargeShape = 100;
    private readonly double _k, _constant;

    public StandardGamma(double k)
    {
        _k = k;
        double k3 = k * k * k;
        _constant = k > LargeShape
            ? -0.5 * Math.Log(2 * Math.PI * k) - (1 / (12 * k) - 1 / (360 * k3) + 1 / (1260 * k3 * k * k))
            : -SpecialFunctions.GammaLn(k);
    }

    public double LogDensity(double y)
    {
        if (y < 0 || double.IsNaN(y)) return double.NegativeInfinity;
        if (y == 0) return _k == 1 ? 0.0 : _k < 1 ? double.PositiveInfinity : double.NegativeInfinity;
        if (_k > LargeShape)
        {
            double t = (y - _k) / _k, l = MathExtras.Log1P(t);
            return _k * (l - t) - l + _constant;
        }
        return (_k - 1) * Math.Log(y) - y + _constant;
    }
}
