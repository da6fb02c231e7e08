using PairFit.Core.Common;
using MathNet.Numerics;
using PairFit.Core.Marginals.Fitting;

namespace PairFit.Core.Marginals;

/// <summary>
/// Pearson type III law with mean μ, standard deviation σ and skewness γ (the parametrisation of
/// flood-frequency practice): for γ ≠ 0, X = ξ + sign(γ) β G with G ~ Gamma(α, 1), α = 4/γ²,
/// β = σ|γ|/2, ξ = μ − 2σ/γ (Hosking and Wallis 1997, Appendix A, Pearson type III). γ &gt; 0 is
/// bounded below at ξ, γ &lt; 0 bounded above; |γ| below 1e-6 is evaluated as the normal limit.
/// MLE: profile likelihood over the bound ξ; for each ξ the gamma MLE on |x − ξ| needs only the
/// mean and mean log (see <see cref="GammaDistribution"/>), and the envelope theorem gives the
/// profile's derivative, Σ[1/β̂ − (α̂ − 1)/(x − ξ)], so Brent solves for its zero. When α̂ &lt; 1 the
/// likelihood grows without bound as ξ approaches the extreme observation; that is reported as
/// not converged. L-moments: Hosking and Wallis (1997), rational approximations for α from τ3.
/// </summary>
public sealed class Pearson3Distribution : IMarginalDistribution
{
    public const string FamilyName = "pearson3";
    private static readonly string[] Names = ["mu", "sigma", "skew"];
    public static readonly IMarginalFamily Definition = new Pearson3Family();

    /// <summary>Below this |γ| the law is taken as normal (α = 4/γ² would exceed 4e12).</summary>
    internal const double NormalLimit = 1e-6;

    private readonly double _alpha, _beta, _bound, _logBeta;
    private readonly StandardGamma _gamma;

    public Pearson3Distribution(double mu, double sigma, double skew)
    {
        if (!double.IsFinite(mu) || !(sigma > 0) || !double.IsFinite(sigma) || !double.IsFinite(skew))
            throw new ArgumentOutOfRangeException(nameof(sigma), $"pearson3 needs finite mu, sigma > 0 and finite skew (got {mu}, {sigma}, {skew}).");
        Mu = mu;
        Sigma = sigma;
        Skew = skew;
        if (!IsNormal)
        {
            _alpha = 4 / (skew * skew);
            _beta = sigma * Math.Abs(skew) / 2;
            _bound = mu - 2 * sigma / skew;
            _logBeta = Math.Log(_beta);
            _gamma = new StandardGamma(_alpha);
        }
    }

    public double Mu { get; }
    public double Sigma { get; }
    public double Skew { get; }
    private bool IsNormal => Math.Abs(Skew) < NormalLimit;

    public string Family => FamilyName;
    public IReadOnlyList<string> ParameterNames => Names;
    public IReadOnlyList<double> Parameters => [Mu, Sigma, Skew];
    public double SupportLower => IsNormal || Skew < 0 ? double.NegativeInfinity : _bound;
    public double SupportUpper => IsNormal || Skew > 0 ? double.PositiveInfinity : _bound;
    public double Mean => Mu;
    public double Variance => Sigma * Sigma;

    /// <summary>The gamma variate (x − ξ)/β or (ξ − x)/β.</summary>
    private double Reduced(double x) => Skew > 0 ? (x - _bound) / _beta : (_bound - x) / _beta;

    public double LogDensity(double x)
    {
        if (IsNormal) return new NormalDistribution(Mu, Sigma).LogDensity(x);
        return _gamma.LogDensity(Reduced(x)) - _logBeta;
    }

    public double Cdf(double x)
    {
        if (IsNormal) return new NormalDistribution(Mu, Sigma).Cdf(x);
        double y = Math.Max(Reduced(x), 0);
        return Skew > 0 ? GammaDistribution.LowerRegularized(_alpha, y) : GammaDistribution.UpperRegularized(_alpha, y);
    }

    public double Survival(double x)
    {
        if (IsNormal) return new NormalDistribution(Mu, Sigma).Survival(x);
        double y = Math.Max(Reduced(x), 0);
        return Skew > 0 ? GammaDistribution.UpperRegularized(_alpha, y) : GammaDistribution.LowerRegularized(_alpha, y);
    }

    public double Quantile(double p)
    {
        if (IsNormal) return new NormalDistribution(Mu, Sigma).Quantile(p);
        if (p <= 0) return SupportLower;
        if (p >= 1) return SupportUpper;
        // For γ < 0, x ≤ x_p exactly when the gamma variate exceeds its upper-tail p quantile.
        return Skew > 0
            ? _bound + _beta * (p <= 0.5 ? GammaDistribution.StandardQuantile(_alpha, p, upper: false) : GammaDistribution.StandardQuantile(_alpha, 1 - p, upper: true))
            : _bound - _beta * (p <= 0.5 ? GammaDistribution.StandardQuantile(_alpha, p, upper: true) : GammaDistribution.StandardQuantile(_alpha, 1 - p, upper: false));
    }

    internal static double LogLikelihood(ReadOnlySpan<double> values, double mu, double sigma, double skew)
    {
        if (!(sigma > 0) || !double.IsFinite(mu) || !double.IsFinite(skew)) return double.NegativeInfinity;
        if (Math.Abs(skew) < NormalLimit)
        {
            double s = 0;
            foreach (double x in values) { double z = (x - mu) / sigma; s -= 0.5 * z * z; }
            return s - values.Length * (Math.Log(sigma) + 0.5 * Math.Log(2 * Math.PI));
        }
        double alpha = 4 / (skew * skew), beta = sigma * Math.Abs(skew) / 2, bound = mu - 2 * sigma / skew;
        double sign = Math.Sign(skew), sum = 0;
        var gamma = new StandardGamma(alpha);
        foreach (double x in values)
        {
            double y = sign * (x - bound) / beta;
            if (!(y > 0)) return double.NegativeInfinity;
            sum += gamma.LogDensity(y);
        }
        return sum - values.Length * Math.Log(beta);
    }

    /// <summary>(μ, σ, γ) from L-moments by the rational approximations for α(τ3) of Hosking and Wallis (1997).</summary>
    internal static double[] FromLMoments(LMoments l)
    {
        double t = Math.Abs(l.T3);
        if (t < 1e-6) return [l.L1, l.L2 * Math.Sqrt(Math.PI), 0.0];
        double alpha;
        if (t < 1.0 / 3)
        {
            double z = 3 * Math.PI * t * t;
            alpha = (1 + 0.2906 * z) / (z + 0.1882 * z * z + 0.0442 * z * z * z);
        }
        else
        {
            double z = 1 - t;
            alpha = (0.36067 * z - 0.59567 * z * z + 0.25361 * z * z * z) / (1 - 2.78861 * z + 2.56096 * z * z - 0.77045 * z * z * z);
        }
        double gamma = 2 / Math.Sqrt(alpha) * Math.Sign(l.T3);
        double sigma = l.L2 * Math.Sqrt(Math.PI) * Math.Sqrt(alpha) * Math.Exp(SpecialFunctions.GammaLn(alpha) - SpecialFunctions.GammaLn(alpha + 0.5));
        return [l.L1, sigma, gamma];
    }

    /// <summary>
    /// Profile-likelihood MLE of (μ, σ, γ) on ascending values (used for Pearson III and, on log10
    /// values, for log-Pearson III). The skew's sign follows the sample L-skewness; for a negative
    /// skew the data are mirrored.
    /// </summary>
    internal static MarginalEstimate FitProfile(double[] sorted, LMoments l)
    {
        int n = sorted.Length;
        bool mirrored = l.T3 < 0;
        double c = l.L1, d = l.L2;
        // y: standardised, and mirrored for negative skew, so the bound is always below the data.
        var y = new double[n];
        for (int i = 0; i < n; i++) y[i] = mirrored ? (c - sorted[n - 1 - i]) / d : (sorted[i] - c) / d;
        double yMin = y[0];
        double[] sub = MarginalSample.Stratified(y, LikelihoodMaximizer.SubsampleSize);

        // Threshold a = yMin − e^r. Profile (value, derivative in r) on a given set of values.
        (double Value, double Slope, double K, double Theta) Profile(double[] v, double r)
        {
            double gap = Math.Exp(r), a = yMin - gap;
            double sumLog = 0, sumInv = 0, sumV = 0;
            foreach (double x in v)
            {
                double e = x - a;
                sumLog += Math.Log(e);
                sumInv += 1 / e;
                sumV += x;
            }
            int m = v.Length;
            double m1 = sumV / m - a, mLog = sumLog / m;
            double? k = GammaDistribution.SolveShape(Math.Log(m1) - mLog);
            if (k is null) return (double.NegativeInfinity, double.NaN, double.NaN, double.NaN);
            double theta = m1 / k.Value;
            double value = GammaDistribution.LogLikelihood(m, m1, mLog, k.Value, theta);
            // dℓ/da = Σ[(1 − α)/(x − a) + 1/θ] (envelope theorem), and da/dr = −e^r.
            double slope = ((1 - k.Value) * sumInv + m / theta) * -gap;
            return (value, slope, k.Value, theta);
        }

        // Coarse grid on the subsample locates the maximum; Brent on the full-data slope refines it.
        const double rLow = -14, rHigh = 8;   // gap from 8e-7 to 3e3 standardised units
        const int gridSize = 23;
        int best = -1;
        double bestValue = double.NegativeInfinity;
        for (int i = 0; i < gridSize; i++)
        {
            double r = rLow + (rHigh - rLow) * i / (gridSize - 1);
            double v = Profile(sub, r).Value;
            if (v > bestValue) { bestValue = v; best = i; }
        }
        if (best < 0) return new([c, d * Math.Sqrt(Math.PI), 0], false, "mle", "profile likelihood undefined");
        double step = (rHigh - rLow) / (gridSize - 1);
        double lo = rLow + step * Math.Max(best - 1, 0), hi = rLow + step * Math.Min(best + 1, gridSize - 1);
        double? root = DataRoot.Find((v, r) => Profile(v, r).Slope, y, sub, lo, hi, rLow - 20, rHigh + 6, 0.1, 1e-10);
        string? note = null;
        bool converged = true;
        double rStar;
        if (root is null)
        {
            // No interior maximum: at the low end the likelihood is unbounded (shape < 1); at the
            // high end the fit tends to the normal law (skew → 0).
            rStar = best == 0 ? rLow : rLow + step * best;
            converged = best != 0;
            note = best == 0 ? "likelihood unbounded as the bound approaches the extreme value (shape α < 1); estimate is not a maximum"
                : "profile likelihood has no interior maximum; skew is close to 0";
        }
        else rStar = root.Value;
        var (_, _, kHat, thetaHat) = Profile(y, rStar);
        if (!double.IsFinite(kHat)) return new([c, d * Math.Sqrt(Math.PI), 0], false, "mle", "profile likelihood undefined at its maximum");
        double aHat = yMin - Math.Exp(rStar);
        double meanY = aHat + kHat * thetaHat, sdY = thetaHat * Math.Sqrt(kHat), skew = 2 / Math.Sqrt(kHat);
        double mu = mirrored ? c - d * meanY : c + d * meanY;
        return new([mu, d * sdY, mirrored ? -skew : skew], converged, "mle", note);
    }

    private sealed class Pearson3Family : IMarginalFamily
    {
        public string Name => FamilyName;
        public IReadOnlyList<string> ParameterNames => Names;
        public string? SupportProblem(MarginalSample s) => null;

        public MarginalEstimate FitMaximumLikelihood(MarginalSample s) => FitProfile(s.Values, s.LMoments);

        public MarginalEstimate? FitLMoments(MarginalSample s) => new(FromLMoments(s.LMoments), true, "lmoments");

        public double LogLikelihood(MarginalSample s, ReadOnlySpan<double> p) => Pearson3Distribution.LogLikelihood(s.Values, p[0], p[1], p[2]);

        public IMarginalDistribution Create(IReadOnlyList<double> p) => new Pearson3Distribution(p[0], p[1], p[2]);
    }
}
