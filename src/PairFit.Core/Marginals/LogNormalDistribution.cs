using MathNet.Numerics;
using PairFit.Core.Common;
using PairFit.Core.Marginals.Fitting;

namespace PairFit.Core.Marginals;

/// <summary>
/// Two-parameter lognormal law: log X ~ N(mu, sigma²), support (0, ∞).
/// MLE in closed form: mu, sigma = mean and population SD of ln x.
/// </summary>
public sealed class LogNormalDistribution : IMarginalDistribution
{
    public const string FamilyName = "lognormal";
    private static readonly string[] Names = ["mu", "sigma"];
    public static readonly IMarginalFamily Definition = new LogNormalFamily();

    public LogNormalDistribution(double mu, double sigma)
    {
        if (!double.IsFinite(mu) || !(sigma > 0) || !double.IsFinite(sigma))
            throw new ArgumentOutOfRangeException(nameof(sigma), $"lognormal needs finite mu and sigma > 0 (got mu={mu}, sigma={sigma}).");
        Mu = mu;
        Sigma = sigma;
    }

    public double Mu { get; }
    public double Sigma { get; }

    public string Family => FamilyName;
    public IReadOnlyList<string> ParameterNames => Names;
    public IReadOnlyList<double> Parameters => [Mu, Sigma];
    public double SupportLower => 0.0;
    public double SupportUpper => double.PositiveInfinity;
    public double Mean => Math.Exp(Mu + 0.5 * Sigma * Sigma);
    public double Variance => MathExtras.ExpM1(Sigma * Sigma) * Math.Exp(2 * Mu + Sigma * Sigma);

    public double LogDensity(double x)
    {
        if (x <= 0) return double.NegativeInfinity;
        double lx = Math.Log(x);
        double z = (lx - Mu) / Sigma;
        return -0.5 * z * z - lx - Math.Log(Sigma) - 0.5 * Math.Log(2 * Math.PI);
    }

    public double Cdf(double x) => x <= 0 ? 0.0 : 0.5 * SpecialFunctions.Erfc(-(Math.Log(x) - Mu) / (Sigma * Constants.Sqrt2));

    public double Survival(double x) => x <= 0 ? 1.0 : 0.5 * SpecialFunctions.Erfc((Math.Log(x) - Mu) / (Sigma * Constants.Sqrt2));

    public double Quantile(double p) => Math.Exp(Mu - Sigma * Constants.Sqrt2 * SpecialFunctions.ErfcInv(2 * p));

    private sealed class LogNormalFamily : IMarginalFamily
    {
        public string Name => FamilyName;
        public IReadOnlyList<string> ParameterNames => Names;
        public bool LikelihoodFromSufficientStatistics => true;
        public string? SupportProblem(MarginalSample s) => SupportChecks.Positive(s, FamilyName);

        public MarginalEstimate FitMaximumLikelihood(MarginalSample s) => new([s.MeanLog, s.StandardDeviationLog], true, "mle");

        // Normal log-likelihood of ln x plus the Jacobian −Σ ln x.
        public double LogLikelihood(MarginalSample s, ReadOnlySpan<double> p)
            => NormalDistribution.LogLikelihood(s.N, s.MeanLog, s.StandardDeviationLog, p[0], p[1]) - s.N * s.MeanLog;

        public IMarginalDistribution Create(IReadOnlyList<double> p) => new LogNormalDistribution(p[0], p[1]);
    }
}
