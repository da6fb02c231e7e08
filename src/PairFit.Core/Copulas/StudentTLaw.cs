using MathNet.Numerics;
using MathNet.Numerics.Integration;
using PairFit.Core.Common;

namespace PairFit.Core.Copulas;

/// <summary>
/// Student t copula, −1 &lt; ρ &lt; 1, ν &gt; 0 (fitted within [2, 60]): C(u, v) = T2(T_ν⁻¹(u), T_ν⁻¹(v); ρ, ν)
/// (Demarta and McNeil 2005; Joe 2014, ch. 4). Radially symmetric and covers both signs, so it is
/// never rotated; equal lower and upper tail dependence. ν above 60 is indistinguishable from the
/// Gaussian copula at practical sample sizes, and below 2 the law has no variance.
/// </summary>
public sealed class StudentTLaw : IEllipticalCopula
{
    public const string FamilyName = "student-t";
    public const double MinRho = GaussianLaw.MinRho;
    public const double MaxRho = GaussianLaw.MaxRho;
    public const double MinNu = 2.0;
    public const double MaxNu = 60.0;
    /// <summary>ν used to start a fit; the likelihood is flat in ν, so a middle value is as good as any.</summary>
    public const double StartNu = 8.0;
    public static readonly ICopulaFamily Family = new StudentTFamily();

    private readonly StudentTFunctions _margin, _conditional;
    private readonly double _logConstant, _oneMinusRhoSquared, _halfNuPlusTwo, _halfNuPlusOne;

    public StudentTLaw(double rho, double nu)
    {
        if (!(rho > -1 && rho < 1))
            throw new ArgumentOutOfRangeException(nameof(rho), $"student-t needs -1 < rho < 1 (got {rho}).");
        if (!(nu > 0) || !double.IsFinite(nu))
            throw new ArgumentOutOfRangeException(nameof(nu), $"student-t needs nu > 0 (got {nu}).");
        Rho = rho;
        Nu = nu;
        _margin = new StudentTFunctions(nu);
        _conditional = new StudentTFunctions(nu + 1);
        _oneMinusRhoSquared = (1 - rho) * (1 + rho);
        _halfNuPlusTwo = (nu + 2) / 2;
        _halfNuPlusOne = (nu + 1) / 2;
        _logConstant = SpecialFunctions.GammaLn(_halfNuPlusTwo) + SpecialFunctions.GammaLn(nu / 2)
                       - 2 * SpecialFunctions.GammaLn(_halfNuPlusOne) - 0.5 * Math.Log(_oneMinusRhoSquared);
    }

    public double Rho { get; }
    public double Nu { get; }

    string ICopula.Family => FamilyName;
    public int Rotation => 0;
    public IReadOnlyList<string> ParameterNames => ["rho", "nu"];
    public IReadOnlyList<double> Parameters => [Rho, Nu];

    public double MarginQuantile(double u) => _margin.Quantile(u);

    // c = t2(x, y; ρ, ν)/(t_ν(x) t_ν(y))
    //   = Γ((ν+2)/2) Γ(ν/2) / Γ((ν+1)/2)² · (1−ρ²)^(−1/2) · (1 + (x²−2ρxy+y²)/(ν(1−ρ²)))^(−(ν+2)/2)
    //     · ((1 + x²/ν)(1 + y²/ν))^((ν+1)/2)      (Demarta and McNeil 2005; Joe 2014, ch. 4).
    // Plain logs of 1 + (…) rather than log1p: the log-likelihood needs absolute, not relative,
    // accuracy of each term (1e−16 either way), and two logs cost a third of three log1p calls.
    public double LogDensityAtQuantiles(double x, double y)
    {
        double q = (x * x - 2 * Rho * x * y + y * y) / (Nu * _oneMinusRhoSquared);
        return _logConstant - _halfNuPlusTwo * Math.Log(1 + q)
               + _halfNuPlusOne * Math.Log((1 + x * x / Nu) * (1 + y * y / Nu));
    }

    public double LogDensity(double u, double v) => LogDensityAtQuantiles(MarginQuantile(u), MarginQuantile(v));

    public double Cdf(double u, double v)
    {
        if (u <= 0 || v <= 0) return 0.0;
        if (u >= 1) return Math.Min(v, 1.0);
        if (v >= 1) return u;
        double c = BivariateStudentT.Cdf(MarginQuantile(u), MarginQuantile(v), Rho, Nu);
        return Math.Clamp(c, Math.Max(u + v - 1, 0.0), Math.Min(u, v));
    }

    /// <summary>Scale of Y given X = x: √((ν + x²)(1 − ρ²)/(ν + 1)).</summary>
    private double ConditionalScale(double x) => Math.Sqrt((Nu + x * x) * _oneMinusRhoSquared / (Nu + 1));

    // Y | X = x is t with ν + 1 degrees of freedom, location ρx and the scale above, so
    // h(v|u) = T_{ν+1}((y − ρx)/scale(x))  (Joe 2014, ch. 4; Demarta and McNeil 2005).
    public double ConditionalCdf(double u, double v)
    {
        if (v <= 0) return 0.0;
        if (v >= 1) return 1.0;
        double x = MarginQuantile(MathExtras.ClampOpen(u));
        return _conditional.Cdf((MarginQuantile(v) - Rho * x) / ConditionalScale(x));
    }

    public double InverseConditionalCdf(double u, double w)
    {
        if (w <= 0) return 0.0;
        if (w >= 1) return 1.0;
        double x = MarginQuantile(MathExtras.ClampOpen(u));
        return _margin.Cdf(Rho * x + ConditionalScale(x) * _conditional.Quantile(w));
    }

    /// <summary>τ = (2/π) arcsin ρ, as for every elliptical law (Lindskog, McNeil and Schmock 2003).</summary>
    public double KendallTau => 2 / Math.PI * Math.Asin(Rho);

    /// <summary>
    /// No closed form. ρ_S = 12 ∫∫ C − 3 with C(u, v) = ∫_0^u h(v|s) ds gives, after changing the
    /// order of integration, ρ_S = 12 ∫∫ (1 − u) h(v|u) du dv − 3: an integrand in [0, 1] that needs
    /// only the margin quantiles at the quadrature nodes (computed once) and the closed-form h.
    /// </summary>
    public double SpearmanRho
    {
        get
        {
            var rule = new GaussLegendreRule(0.0, 1.0, SpearmanNodes);
            double[] nodes = rule.Abscissas, weights = rule.Weights;
            var quantiles = new double[nodes.Length];
            for (int i = 0; i < nodes.Length; i++) quantiles[i] = MarginQuantile(nodes[i]);
            double sum = 0;
            for (int i = 0; i < nodes.Length; i++)
            {
                double x = quantiles[i], scale = ConditionalScale(x), inner = 0;
                for (int j = 0; j < nodes.Length; j++)
                    inner += weights[j] * _conditional.Cdf((quantiles[j] - Rho * x) / scale);
                sum += weights[i] * (1 - nodes[i]) * inner;
            }
            return 12 * sum - 3;
        }
    }

    private const int SpearmanNodes = 160;

    /// <summary>λ_L = λ_U = 2 t_{ν+1}(−√((ν + 1)(1 − ρ)/(1 + ρ))) (Embrechts, McNeil and Straumann 2002; Demarta and McNeil 2005).</summary>
    public double TailLower => 2 * _conditional.Cdf(-Math.Sqrt((Nu + 1) * (1 - Rho) / (1 + Rho)));

    public double TailUpper => TailLower;

    private sealed class StudentTFamily : ICopulaFamily
    {
        public string Name => FamilyName;
        public IReadOnlyList<string> ParameterNames => ["rho", "nu"];
        public IReadOnlyList<double> LowerBounds => [MinRho, MinNu];
        public IReadOnlyList<double> UpperBounds => [MaxRho, MaxNu];
        public IReadOnlyList<int> Rotations => [0];

        // ρ from τ = (2/π) arcsin ρ; ν is not identified by τ, start in the middle of its range.
        public double[]? StartFromTau(double tau) => [Math.Clamp(Math.Sin(Math.PI * tau / 2), MinRho, MaxRho), StartNu];

        public ICopula Create(IReadOnlyList<double> parameters) => new StudentTLaw(parameters[0], parameters[1]);
    }
}
