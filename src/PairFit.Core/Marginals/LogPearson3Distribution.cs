using PairFit.Core.Marginals.Fitting;

namespace PairFit.Core.Marginals;

/// <summary>
/// Log-Pearson type III law: log10 X follows Pearson type III with mean μ, standard deviation σ
/// and skewness γ (base-10 logarithms as in flood-frequency practice, e.g. the US federal
/// guidelines Bulletin 17). f_X(x) = f_Y(log10 x) / (x ln 10) on x &gt; 0. MLE by the Pearson III
/// profile likelihood on log10 values (the likelihood differs only by the Jacobian, which does not
/// depend on the parameters). No L-moment estimate: the lmoments method keeps the MLE for this family.
/// </summary>
public sealed class LogPearson3Distribution : IMarginalDistribution
{
    public const string FamilyName = "logpearson3";
    private static readonly string[] Names = ["mu", "sigma", "skew"];
    public static readonly IMarginalFamily Definition = new LogPearson3Family();

    private readonly Pearson3Distribution _log10;

    public LogPearson3Distribution(double mu, double sigma, double skew)
    {
        _log10 = new Pearson3Distribution(mu, sigma, skew);
    }

    public double Mu => _log10.Mu;
    public double Sigma => _log10.Sigma;
    public double Skew => _log10.Skew;

    public string Family => FamilyName;
    public IReadOnlyList<string> ParameterNames => Names;
    public IReadOnlyList<double> Parameters => [Mu, Sigma, Skew];
    public double SupportLower => Math.Pow(10, _log10.SupportLower);
    public double SupportUpper => Math.Pow(10, _log10.SupportUpper);

    /// <summary>E[X] = E[e^(t Y)] at t = ln 10: the Pearson III moment generating function.</summary>
    public double Mean => Moment(1);
    public double Variance
    {
        get
        {
            double m1 = Moment(1), m2 = Moment(2);
            double v = m2 - m1 * m1;
            return double.IsFinite(v) && v >= 0 ? v : double.NaN;
        }
    }

    /// <summary>
    /// E[X^j] = E[exp(j ln10 Y)]. For γ &gt; 0: e^(tξ)(1 − βt)^(−α), finite only when βt &lt; 1;
    /// for γ &lt; 0: e^(tξ)(1 + βt)^(−α); normal limit e^(tμ + t²σ²/2).
    /// </summary>
    private double Moment(int j)
    {
        double t = j * Math.Log(10);
        if (Math.Abs(Skew) < Pearson3Distribution.NormalLimit) return Math.Exp(t * Mu + 0.5 * t * t * Sigma * Sigma);
        double alpha = 4 / (Skew * Skew), beta = Sigma * Math.Abs(Skew) / 2, bound = Mu - 2 * Sigma / Skew;
        double bt = Skew > 0 ? -beta * t : beta * t;   // (1 + bt)^(−α)
        if (!(1 + bt > 0)) return double.NaN;
        double m = Math.Exp(t * bound - alpha * Math.Log(1 + bt));
        return double.IsFinite(m) ? m : double.NaN;
    }

    public double LogDensity(double x) => x > 0 ? _log10.LogDensity(Math.Log10(x)) - Math.Log(x) - Math.Log(Math.Log(10)) : double.NegativeInfinity;

    public double Cdf(double x) => x > 0 ? _log10.Cdf(Math.Log10(x)) : 0.0;

    public double Survival(double x) => x > 0 ? _log10.Survival(Math.Log10(x)) : 1.0;

    public double Quantile(double p) => Math.Pow(10, _log10.Quantile(p));

    private sealed class LogPearson3Family : IMarginalFamily
    {
        public string Name => FamilyName;
        public IReadOnlyList<string> ParameterNames => Names;
        public string? SupportProblem(MarginalSample s) => SupportChecks.Positive(s, FamilyName);

        public MarginalEstimate FitMaximumLikelihood(MarginalSample s)
        {
            var log10 = s.Log10s;
            return Pearson3Distribution.FitProfile(log10, LMoments.FromSorted(log10));
        }

        public double LogLikelihood(MarginalSample s, ReadOnlySpan<double> p)
            => Pearson3Distribution.LogLikelihood(s.Log10s, p[0], p[1], p[2]) - s.N * (s.MeanLog + Math.Log(Math.Log(10)));

        public IMarginalDistribution Create(IReadOnlyList<double> p) => new LogPearson3Distribution(p[0], p[1], p[2]);
    }
}
