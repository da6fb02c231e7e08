using PairFit.Core.Common;
using PairFit.Core.Marginals.Fitting;

namespace PairFit.Core.Marginals;

/// <summary>
/// Exponential law with rate lambda on [0, ∞): f(x) = lambda exp(−lambda x).
/// MLE in closed form: rate = 1 / mean.
/// </summary>
public sealed class ExponentialDistribution : IMarginalDistribution
{
    public const string FamilyName = "exponential";
    private static readonly string[] Names = ["rate"];
    public static readonly IMarginalFamily Definition = new ExponentialFamily();

    public ExponentialDistribution(double rate)
    {
        if (!(rate > 0) || !double.IsFinite(rate))
            throw new ArgumentOutOfRangeException(nameof(rate), $"exponential needs a finite rate > 0 (got {rate}).");
        Rate = rate;
    }

    public double Rate { get; }

    public string Family => FamilyName;
    public IReadOnlyList<string> ParameterNames => Names;
    public IReadOnlyList<double> Parameters => [Rate];
    public double SupportLower => 0.0;
    public double SupportUpper => double.PositiveInfinity;
    public double Mean => 1.0 / Rate;
    public double Variance => 1.0 / (Rate * Rate);

    public double LogDensity(double x) => x < 0 ? double.NegativeInfinity : Math.Log(Rate) - Rate * x;

    // −expm1(−λx) avoids cancellation for small x.
    public double Cdf(double x) => x <= 0 ? 0.0 : -MathExtras.ExpM1(-Rate * x);

    public double Survival(double x) => x <= 0 ? 1.0 : Math.Exp(-Rate * x);

    public double Quantile(double p) => p >= 1 ? double.PositiveInfinity : -MathExtras.Log1P(-p) / Rate;

    private sealed class ExponentialFamily : IMarginalFamily
    {
        public string Name => FamilyName;
        public IReadOnlyList<string> ParameterNames => Names;
        public bool LikelihoodFromSufficientStatistics => true;

        public string? SupportProblem(MarginalSample s) => SupportChecks.NonNegative(s, FamilyName)
            ?? (s.Max > 0 ? null : "exponential needs some value > 0");

        public MarginalEstimate FitMaximumLikelihood(MarginalSample s) => new([1.0 / s.Mean], double.IsFinite(1.0 / s.Mean), "mle");

        // n ln λ − λ Σx, written with λ·mean so that 1e300 data do not overflow Σx.
        public double LogLikelihood(MarginalSample s, ReadOnlySpan<double> p)
            => p[0] > 0 ? s.N * (Math.Log(p[0]) - p[0] * s.Mean) : double.NegativeInfinity;

        public IMarginalDistribution Create(IReadOnlyList<double> p) => new ExponentialDistribution(p[0]);
    }
}
