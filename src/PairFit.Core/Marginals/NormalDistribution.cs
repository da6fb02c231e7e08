using MathNet.Numerics;

namespace PairFit.Core.Marginals;

/// <summary>
/// Normal law N(mu, sigma²). f(x) = exp(−(x−mu)²/(2 sigma²)) / (sigma √(2π)).
/// MLE in closed form: mu = mean, sigma = population standard deviation (divisor n).
/// </summary>
public sealed class NormalDistribution : IMarginalDistribution
{
    public const string FamilyName = "normal";
    private static readonly string[] Names = ["mu", "sigma"];
    public static readonly IMarginalFamily Definition = new NormalFamily();

    public NormalDistribution(double mu, double sigma)
    {
        if (!double.IsFinite(mu) || !(sigma > 0) || !double.IsFinite(sigma))
            throw new ArgumentOutOfRangeException(nameof(sigma), $"normal needs finite mu and sigma > 0 (got mu={mu}, sigma={sigma}).");
        Mu = mu;
        Sigma = sigma;
    }

    public double Mu { get; }
    public double Sigma { get; }

    public string Family => FamilyName;
    public IReadOnlyList<string> ParameterNames => Names;
    public IReadOnlyList<double> Parameters => [Mu, Sigma];
    public double SupportLower => double.NegativeInfinity;
    public double SupportUpper => double.PositiveInfinity;
    public double Mean => Mu;
    public double Variance => Sigma * Sigma;

    public double LogDensity(double x)
    {
        double z = (x - Mu) / Sigma;
        return -0.5 * z * z - Math.Log(Sigma) - 0.5 * Math.Log(2 * Math.PI);
    }

    // Φ(z) = erfc(−z/√2)/2 keeps full relative precision in the lower tail.
    public double Cdf(double x) => 0.5 * SpecialFunctions.Erfc(-(x - Mu) / (Sigma * Constants.Sqrt2));

    public double Survival(double x) => 0.5 * SpecialFunctions.Erfc((x - Mu) / (Sigma * Constants.Sqrt2));

    public double Quantile(double p) => Mu - Sigma * Constants.Sqrt2 * SpecialFunctions.ErfcInv(2 * p);

    /// <summary>Σ log f at any (mu, sigma) from the sufficient statistics (mean, population SD):
    /// −n ln σ − n ln√(2π) − n (s² + (m − μ)²)/(2σ²).</summary>
    internal static double LogLikelihood(int n, double mean, double sd, double mu, double sigma)
    {
        if (!(sigma > 0) || !double.IsFinite(mu)) return double.NegativeInfinity;
        double a = sd / sigma, b = (mean - mu) / sigma;
        return -n * (Math.Log(sigma) + 0.5 * Math.Log(2 * Math.PI) + 0.5 * (a * a + b * b));
    }

    private sealed class NormalFamily : IMarginalFamily
    {
        public string Name => FamilyName;
        public IReadOnlyList<string> ParameterNames => Names;
        public bool LikelihoodFromSufficientStatistics => true;
        public string? SupportProblem(MarginalSample sample) => null;

        public MarginalEstimate FitMaximumLikelihood(MarginalSample s) => new([s.Mean, s.StandardDeviation], true, "mle");

        public double LogLikelihood(MarginalSample s, ReadOnlySpan<double> p) => NormalDistribution.LogLikelihood(s.N, s.Mean, s.StandardDeviation, p[0], p[1]);

        public IMarginalDistribution Create(IReadOnlyList<double> p) => new NormalDistribution(p[0], p[1]);
    }
}
