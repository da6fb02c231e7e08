using MathNet.Numerics;
using PairFit.Core.Common;
using PairFit.Core.Marginals.Fitting;

namespace PairFit.Core.Marginals;

/// <summary>
/// Gumbel law for maxima with location μ and scale β: F(x) = exp(−exp(−(x − μ)/β)), x real.
/// MLE: β solves β = x̄ − Σ xᵢ e^(−xᵢ/β) / Σ e^(−xᵢ/β) (the right side minus β decreases in β, so the
/// root is unique), then μ = −β ln(mean e^(−x/β)) (Johnson, Kotz and Balakrishnan 1995, ch. 22,
/// eqs. 22.55–22.56). Solved on standardised data with weights shifted by the minimum, so no exp overflows.
/// L-moments: β = λ2 / ln 2, μ = λ1 − γ_E β (Hosking and Wallis 1997, Appendix A).
/// </summary>
public sealed class GumbelDistribution : IMarginalDistribution
{
    public const string FamilyName = "gumbel";
    private static readonly string[] Names = ["location", "scale"];
    public static readonly IMarginalFamily Definition = new GumbelFamily();

    public GumbelDistribution(double location, double scale)
    {
        if (!double.IsFinite(location) || !(scale > 0) || !double.IsFinite(scale))
            throw new ArgumentOutOfRangeException(nameof(scale), $"gumbel needs finite location and scale > 0 (got location={location}, scale={scale}).");
        Location = location;
        Scale = scale;
    }

    public double Location { get; }
    public double Scale { get; }

    public string Family => FamilyName;
    public IReadOnlyList<string> ParameterNames => Names;
    public IReadOnlyList<double> Parameters => [Location, Scale];
    public double SupportLower => double.NegativeInfinity;
    public double SupportUpper => double.PositiveInfinity;
    public double Mean => Location + Constants.EulerMascheroni * Scale;
    public double Variance => Math.PI * Math.PI * Scale * Scale / 6;

    public double LogDensity(double x)
    {
        double z = (x - Location) / Scale;
        return -Math.Log(Scale) - z - Math.Exp(-z);
    }

    public double Cdf(double x) => Math.Exp(-Math.Exp(-(x - Location) / Scale));

    public double Survival(double x) => -MathExtras.ExpM1(-Math.Exp(-(x - Location) / Scale));

    public double Quantile(double p) => p <= 0 ? double.NegativeInfinity : p >= 1 ? double.PositiveInfinity : Location - Scale * Math.Log(-Math.Log(p));

    /// <summary>(μ, β) by the L-moment relations λ1 = μ + γ_E β, λ2 = β ln 2 (Hosking 1990, Table 1).</summary>
    internal static double[] FromLMoments(LMoments l)
    {
        double beta = l.L2 / Constants.Ln2;
        return [l.L1 - Constants.EulerMascheroni * beta, beta];
    }

    private sealed class GumbelFamily : IMarginalFamily
    {
        public string Name => FamilyName;
        public IReadOnlyList<string> ParameterNames => Names;
        public string? SupportProblem(MarginalSample s) => null;

        public MarginalEstimate FitMaximumLikelihood(MarginalSample s)
        {
            double c = s.Mean, d = s.StandardDeviation;
            double[] x = s.Values;
            int n = x.Length;
            double yMin = (x[0] - c) / d;
            // h(β) = ȳ − β − Σ y w / Σ w with w = exp(−(y − y_min)/β), over a set of data values.
            double Equation(double[] v, double logBeta)
            {
                double beta = Math.Exp(logBeta), sw = 0, swy = 0, sy = 0;
                foreach (double xi in v)
                {
                    double y = (xi - c) / d;
                    double w = Math.Exp(-(y - yMin) / beta);
                    sw += w;
                    swy += w * y;
                    sy += y;
                }
                return sy / v.Length - beta - swy / sw;
            }
            double b0 = Math.Sqrt(6) / Math.PI;   // moment estimate: sd = π β / √6
            double? logBeta = DataRoot.Find(Equation, x, MarginalSample.Stratified(x, LikelihoodMaximizer.SubsampleSize),
                Math.Log(b0) - 0.2, Math.Log(b0) + 0.2, -40, 10, 0.02, 1e-13);
            if (logBeta is null) return new(FromLMoments(s.LMoments), false, "mle", "scale equation has no root; L-moment estimate kept");
            double b = Math.Exp(logBeta.Value), sum = 0;
            for (int i = 0; i < n; i++) sum += Math.Exp(-((x[i] - c) / d - yMin) / b);
            double mu = yMin - b * Math.Log(sum / n);
            return new([c + d * mu, d * b], true, "mle");
        }

        public MarginalEstimate? FitLMoments(MarginalSample s) => new(FromLMoments(s.LMoments), true, "lmoments");

        public IMarginalDistribution Create(IReadOnlyList<double> p) => new GumbelDistribution(p[0], p[1]);
    }
}
