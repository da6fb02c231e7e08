using MathNet.Numerics;
using PairFit.Core.Common;
using PairFit.Core.Marginals.Fitting;

namespace PairFit.Core.Marginals;

/// <summary>
/// Generalized extreme value law with location μ, scale σ and shape ξ (Jenkinson 1955; Coles 2001,
/// eq. 3.2): F(x) = exp(−(1 + ξ (x − μ)/σ)^(−1/ξ)) where 1 + ξ (x − μ)/σ &gt; 0.
/// Sign convention: ξ &gt; 0 is the heavy-tailed Fréchet case (support bounded below),
/// ξ &lt; 0 the Weibull case (bounded above), ξ = 0 the Gumbel limit. Hosking's k and SciPy's
/// genextreme c are both −ξ.
/// MLE: Nelder–Mead then Newton (see <see cref="LikelihoodMaximizer"/>) on standardised data from
/// the L-moment estimate, with ξ kept above −1 where the likelihood is unbounded (Smith 1985).
/// L-moments: Hosking, Wallis and Wood (1985), k ≈ 7.8590 c + 2.9554 c², c = 2/(3 + τ3) − ln 2/ln 3,
/// α = λ2 k / ((1 − 2^(−k)) Γ(1 + k)), location = λ1 − α (1 − Γ(1 + k))/k.
/// </summary>
public sealed class GevDistribution : IMarginalDistribution
{
    public const string FamilyName = "gev";
    private static readonly string[] Names = ["location", "scale", "shape"];
    public static readonly IMarginalFamily Definition = new GevFamily();

    /// <summary>|ξ| below this is evaluated as the Gumbel limit (the two differ by O(ξ z²) there).</summary>
    private const double GumbelLimit = 1e-10;

    public GevDistribution(double location, double scale, double shape)
    {
        if (!double.IsFinite(location) || !(scale > 0) || !double.IsFinite(scale) || !double.IsFinite(shape))
            throw new ArgumentOutOfRangeException(nameof(scale), $"gev needs finite location, scale > 0 and finite shape (got {location}, {scale}, {shape}).");
        Location = location;
        Scale = scale;
        Shape = shape;
    }

    public double Location { get; }
    public double Scale { get; }
    public double Shape { get; }

    public string Family => FamilyName;
    public IReadOnlyList<string> ParameterNames => Names;
    public IReadOnlyList<double> Parameters => [Location, Scale, Shape];
    public double SupportLower => Shape > 0 ? Location - Scale / Shape : double.NegativeInfinity;
    public double SupportUpper => Shape < 0 ? Location - Scale / Shape : double.PositiveInfinity;

    public double Mean => Shape >= 1 ? double.NaN
        : Math.Abs(Shape) < GumbelLimit ? Location + Constants.EulerMascheroni * Scale
        : Location + Scale * (SpecialFunctions.Gamma(1 - Shape) - 1) / Shape;

    public double Variance
    {
        get
        {
            if (Shape >= 0.5) return double.NaN;
            if (Math.Abs(Shape) < GumbelLimit) return Math.PI * Math.PI * Scale * Scale / 6;
            double g1 = SpecialFunctions.Gamma(1 - Shape), g2 = SpecialFunctions.Gamma(1 - 2 * Shape);
            return Scale * Scale * (g2 - g1 * g1) / (Shape * Shape);
        }
    }

    /// <summary>−ln(−ln F(x)) = ln(1 + ξz)/ξ, or NaN outside the support.</summary>
    private double ReducedVariate(double x)
    {
        double z = (x - Location) / Scale;
        if (Math.Abs(Shape) < GumbelLimit) return z;
        double t = Shape * z;
        return t > -1 ? MathExtras.Log1P(t) / Shape : double.NaN;
    }

    public double LogDensity(double x)
    {
        double r = ReducedVariate(x);
        if (double.IsNaN(r)) return double.NegativeInfinity;
        return -Math.Log(Scale) - (1 + Shape) * r - Math.Exp(-r);
    }

    public double Cdf(double x)
    {
        double r = ReducedVariate(x);
        if (double.IsNaN(r)) return Shape > 0 ? 0.0 : 1.0;
        return Math.Exp(-Math.Exp(-r));
    }

    public double Survival(double x)
    {
        double r = ReducedVariate(x);
        if (double.IsNaN(r)) return Shape > 0 ? 1.0 : 0.0;
        return -MathExtras.ExpM1(-Math.Exp(-r));
    }

    public double Quantile(double p)
    {
        if (p <= 0) return SupportLower;
        if (p >= 1) return SupportUpper;
        double ly = Math.Log(-Math.Log(p));
        if (Math.Abs(Shape) < GumbelLimit) return Location - Scale * ly;
        return Location + Scale * MathExtras.ExpM1(-Shape * ly) / Shape;
    }

    /// <summary>Σ log f over values, with (1 + ξ) ln t/ξ written as (1 + ξ) r and r = log1p(ξz)/ξ.</summary>
    internal static double LogLikelihood(ReadOnlySpan<double> values, double mu, double sigma, double xi)
    {
        if (!(sigma > 0) || !(xi > -1) || !double.IsFinite(mu) || !double.IsFinite(xi)) return double.NegativeInfinity;
        double sum = 0, inv = 1 / sigma;
        bool gumbel = Math.Abs(xi) < GumbelLimit;
        foreach (double x in values)
        {
            double z = (x - mu) * inv, r;
            if (gumbel) r = z;
            else
            {
                double t = xi * z;
                if (!(t > -1)) return double.NegativeInfinity;
                r = MathExtras.Log1P(t) / xi;
            }
            sum -= (1 + xi) * r + Math.Exp(-r);
        }
        return sum - values.Length * Math.Log(sigma);
    }

    /// <summary>
    /// Σ log f and its gradient in (μ, σ, ξ). With z = (x − μ)/σ, t = 1 + ξz, r = ln t/ξ, u = e^(−r):
    /// ℓ = −ln σ − (1 + ξ) r − u, ∂ℓ/∂μ = (1 + ξ − u)/(σt), ∂ℓ/∂σ = −1/σ + (1 + ξ − u) z/(σt),
    /// ∂ℓ/∂ξ = −r + (u − 1 − ξ)(z/t − r)/ξ (differentiating Coles 2001, eq. 3.7). (z/t − r)/ξ cancels
    /// for small ξz and is then taken from its series −z²/2 + 2ξz³/3 − 3ξ²z⁴/4.
    /// </summary>
    internal static double LogLikelihoodWithGradient(ReadOnlySpan<double> values, double[] p, double[]? gradient)
    {
        double mu = p[0], sigma = p[1], xi = p[2];
        if (gradient is null) return LogLikelihood(values, mu, sigma, xi);
        if (!(sigma > 0) || !(xi > -1) || !double.IsFinite(mu) || !double.IsFinite(xi)) return double.NegativeInfinity;
        double sum = 0, gMu = 0, gSigma = 0, gXi = 0, inv = 1 / sigma;
        foreach (double x in values)
        {
            double z = (x - mu) * inv, a = xi * z;
            if (!(a > -1)) return double.NegativeInfinity;
            double t = 1 + a;
            double r = Math.Abs(a) < 1e-3 ? z * (1 - a * (0.5 - a * (1.0 / 3 - 0.25 * a))) : MathExtras.Log1P(a) / xi;
            double u = Math.Exp(-r);
            double dr = Math.Abs(a) < 1e-3 ? z * z * (-0.5 + a * (2.0 / 3 - 0.75 * a)) : (z / t - r) / xi;
            double c = (1 + xi - u) / t;
            sum -= (1 + xi) * r + u;
            gMu += c;
            gSigma += c * z;
            gXi += -r - (1 + xi - u) * dr;
        }
        int n = values.Length;
        gradient[0] = gMu * inv;
        gradient[1] = (gSigma - n) * inv;
        gradient[2] = gXi;
        return sum - n * Math.Log(sigma);
    }

    /// <summary>(location, scale, shape ξ = −k) from L-moments (Hosking, Wallis and Wood 1985).</summary>
    internal static double[] FromLMoments(LMoments l)
    {
        double c = 2 / (3 + l.T3) - Constants.Ln2 / Math.Log(3);
        double k = 7.8590 * c + 2.9554 * c * c;
        if (Math.Abs(k) < 1e-8) return [.. GumbelDistribution.FromLMoments(l), 0.0];
        double g = SpecialFunctions.Gamma(1 + k);
        double alpha = l.L2 * k / (-MathExtras.ExpM1(-k * Constants.Ln2) * g);
        return [l.L1 - alpha * (1 - g) / k, alpha, -k];
    }

    private sealed class GevFamily : IMarginalFamily
    {
        public string Name => FamilyName;
        public IReadOnlyList<string> ParameterNames => Names;
        public string? SupportProblem(MarginalSample s) => null;

        public MarginalEstimate FitMaximumLikelihood(MarginalSample s)
        {
            var frame = StandardFrame.Of(s);
            var l = frame.Standardise(FromLMoments(s.LMoments));
            double[][] starts =
            [
                [l[0], l[1], Math.Clamp(l[2], -0.9, 2.0)],
                [l[0], 1.5 * l[1], Math.Clamp(l[2], -0.5, 1.0)],
                frame.Standardise([.. GumbelDistribution.FromLMoments(s.LMoments), 0.0]),
            ];
            var outcome = LikelihoodMaximizer.Maximize(LogLikelihoodWithGradient, frame.Values, starts, [0.1, 0.1, 0.05]);
            return new(frame.Unstandardise(outcome.Parameters), outcome.Converged, "mle", outcome.Note);
        }

        public MarginalEstimate? FitLMoments(MarginalSample s) => new(FromLMoments(s.LMoments), true, "lmoments");

        public double LogLikelihood(MarginalSample s, ReadOnlySpan<double> p) => GevDistribution.LogLikelihood(s.Values, p[0], p[1], p[2]);

        public IMarginalDistribution Create(IReadOnlyList<double> p) => new GevDistribution(p[0], p[1], p[2]);
    }
}
