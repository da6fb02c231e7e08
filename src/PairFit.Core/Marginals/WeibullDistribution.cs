using MathNet.Numerics;
using PairFit.Core.Common;
using PairFit.Core.Marginals.Fitting;

namespace PairFit.Core.Marginals;

/// <summary>
/// Two-parameter Weibull law with shape k and scale λ on (0, ∞): F(x) = 1 − exp(−(x/λ)^k).
/// MLE: the shape solves the profile equation Σ xᵢ^k ln xᵢ / Σ xᵢ^k − 1/k − mean(ln x) = 0, whose
/// left side increases in k, and then λ = (mean x^k)^(1/k) (Johnson, Kotz and Balakrishnan 1994,
/// ch. 21, eqs. 21.101–21.102). Powers are taken as exp(k (ln x − ln x_max)) so 1e300 data do not overflow.
/// </summary>
public sealed class WeibullDistribution : IMarginalDistribution
{
    public const string FamilyName = "weibull";
    private static readonly string[] Names = ["shape", "scale"];
    public static readonly IMarginalFamily Definition = new WeibullFamily();

    public WeibullDistribution(double shape, double scale)
    {
        if (!(shape > 0) || !double.IsFinite(shape) || !(scale > 0) || !double.IsFinite(scale))
            throw new ArgumentOutOfRangeException(nameof(shape), $"weibull needs finite shape > 0 and scale > 0 (got shape={shape}, scale={scale}).");
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
    public double Mean => Scale * Math.Exp(SpecialFunctions.GammaLn(1 + 1 / Shape));

    public double Variance
    {
        get
        {
            double g1 = Math.Exp(SpecialFunctions.GammaLn(1 + 1 / Shape)), g2 = Math.Exp(SpecialFunctions.GammaLn(1 + 2 / Shape));
            return Scale * Scale * (g2 - g1 * g1);
        }
    }

    public double LogDensity(double x)
    {
        if (x < 0 || double.IsNaN(x)) return double.NegativeInfinity;
        if (x == 0) return Shape == 1 ? -Math.Log(Scale) : Shape < 1 ? double.PositiveInfinity : double.NegativeInfinity;
        double lz = Math.Log(x / Scale);
        return Math.Log(Shape / Scale) + (Shape - 1) * lz - Math.Exp(Shape * lz);
    }

    public double Cdf(double x) => x <= 0 ? 0.0 : -MathExtras.ExpM1(-Math.Pow(x / Scale, Shape));

    public double Survival(double x) => x <= 0 ? 1.0 : Math.Exp(-Math.Pow(x / Scale, Shape));

    public double Quantile(double p) => p <= 0 ? 0.0 : p >= 1 ? double.PositiveInfinity : Scale * Math.Pow(-MathExtras.Log1P(-p), 1 / Shape);

    private sealed class WeibullFamily : IMarginalFamily
    {
        public string Name => FamilyName;
        public IReadOnlyList<string> ParameterNames => Names;
        public string? SupportProblem(MarginalSample s) => SupportChecks.Positive(s, FamilyName);

        public MarginalEstimate FitMaximumLikelihood(MarginalSample s)
        {
            double[] lx = s.Logs;
            double top = lx[^1];
            // Profile equation in ln k over a set of log-values (all of them, or a subsample).
            double ProfileEquation(double[] v, double logK)
            {
                double k = Math.Exp(logK), sw = 0, swd = 0, sl = 0;
                foreach (double l in v)
                {
                    double d = l - top;
                    double w = Math.Exp(k * d);
                    sw += w;
                    swd += w * d;
                    sl += l;
                }
                return swd / sw + top - 1 / k - sl / v.Length;
            }
            // Start from the log-moment relation sd(ln X) = π / (k √6) of the Weibull law.
            double k0 = Math.PI / (Math.Sqrt(6) * s.StandardDeviationLog);
            double? logK = DataRoot.Find(ProfileEquation, lx, MarginalSample.Stratified(lx, LikelihoodMaximizer.SubsampleSize),
                Math.Log(k0) - 0.2, Math.Log(k0) + 0.2, -30, 30, 0.02, 1e-13);
            if (logK is null) return new([1.0, s.Mean], false, "mle", "shape equation has no root");
            double k = Math.Exp(logK.Value);
            double sum = 0;
            for (int i = 0; i < lx.Length; i++) sum += Math.Exp(k * (lx[i] - top));
            double logScale = top + Math.Log(sum / lx.Length) / k;
            return new([k, Math.Exp(logScale)], true, "mle");
        }

        // n ln k − n k ln λ + (k − 1) Σ ln x − Σ (x/λ)^k, from the stored logarithms.
        public double LogLikelihood(MarginalSample s, ReadOnlySpan<double> p)
        {
            double k = p[0], lambda = p[1];
            if (!(k > 0) || !(lambda > 0)) return double.NegativeInfinity;
            double logLambda = Math.Log(lambda), sumPow = 0;
            double[] lx = s.Logs;
            for (int i = 0; i < lx.Length; i++) sumPow += Math.Exp(k * (lx[i] - logLambda));
            int n = s.N;
            return n * (Math.Log(k) - k * logLambda + (k - 1) * s.MeanLog) - sumPow;
        }

        public IMarginalDistribution Create(IReadOnlyList<double> p) => new WeibullDistribution(p[0], p[1]);
    }
}
