using PairFit.Core.Common;

namespace PairFit.Core.Copulas;

/// <summary>
/// Gaussian (normal) copula, −1 &lt; ρ &lt; 1: C(u, v) = Φ2(Φ⁻¹(u), Φ⁻¹(v); ρ) (Joe 2014, ch. 4).
/// Radially symmetric and covers both signs, so it is never rotated; no tail dependence.
/// </summary>
public sealed class GaussianLaw : IEllipticalCopula
{
    public const string FamilyName = "gaussian";
    /// <summary>Fitting range of ρ; the formulas themselves hold for any |ρ| &lt; 1.</summary>
    public const double MinRho = -0.9999;
    public const double MaxRho = 0.9999;
    public static readonly ICopulaFamily Family = new GaussianFamily();

    private readonly double _oneMinusRhoSquared, _sqrtOneMinusRhoSquared, _halfLogOneMinusRhoSquared;

    public GaussianLaw(double rho)
    {
        if (!(rho > -1 && rho < 1))
            throw new ArgumentOutOfRangeException(nameof(rho), $"gaussian needs -1 < rho < 1 (got {rho}).");
        Rho = rho;
        _oneMinusRhoSquared = (1 - rho) * (1 + rho);
        _sqrtOneMinusRhoSquared = Math.Sqrt(_oneMinusRhoSquared);
        _halfLogOneMinusRhoSquared = 0.5 * Math.Log(_oneMinusRhoSquared);
    }

    public double Rho { get; }

    string ICopula.Family => FamilyName;
    public int Rotation => 0;
    public IReadOnlyList<string> ParameterNames => ["rho"];
    public IReadOnlyList<double> Parameters => [Rho];

    public double MarginQuantile(double u) => BivariateNormal.StandardQuantile(u);

    // c = φ2(x, y; ρ)/(φ(x)φ(y)) = (1−ρ²)^(−1/2) exp(−(ρ²(x²+y²) − 2ρxy)/(2(1−ρ²)))  (Joe 2014, ch. 4, differentiated).
    public double LogDensityAtQuantiles(double x, double y)
        => -_halfLogOneMinusRhoSquared - (Rho * Rho * (x * x + y * y) - 2 * Rho * x * y) / (2 * _oneMinusRhoSquared);

    public double LogDensity(double u, double v) => LogDensityAtQuantiles(MarginQuantile(u), MarginQuantile(v));

    public double Cdf(double u, double v)
    {
        if (u <= 0 || v <= 0) return 0.0;
        if (u >= 1) return Math.Min(v, 1.0);
        if (v >= 1) return u;
        return BivariateNormal.Cdf(MarginQuantile(u), MarginQuantile(v), Rho);
    }

    // Y | X = x is normal with mean ρx and variance 1 − ρ², so h(v|u) = Φ((y − ρx)/√(1 − ρ²)).
    public double ConditionalCdf(double u, double v)
    {
        if (v <= 0) return 0.0;
        if (v >= 1) return 1.0;
        double x = MarginQuantile(MathExtras.ClampOpen(u));
        return BivariateNormal.StandardCdf((MarginQuantile(v) - Rho * x) / _sqrtOneMinusRhoSquared);
    }

    public double InverseConditionalCdf(double u, double w)
    {
        if (w <= 0) return 0.0;
        if (w >= 1) return 1.0;
        double x = MarginQuantile(MathExtras.ClampOpen(u));
        return BivariateNormal.StandardCdf(Rho * x + _sqrtOneMinusRhoSquared * MarginQuantile(w));
    }

    /// <summary>τ = (2/π) arcsin ρ (Kruskal 1958; for every elliptical law, Lindskog, McNeil and Schmock 2003).</summary>
    public double KendallTau => 2 / Math.PI * Math.Asin(Rho);

    /// <summary>ρ_S = (6/π) arcsin(ρ/2) (Kruskal 1958; Joe 2014, ch. 4).</summary>
    public double SpearmanRho => 6 / Math.PI * Math.Asin(Rho / 2);

    /// <summary>No tail dependence for |ρ| &lt; 1 (Sibuya 1960; Joe 2014, ch. 4).</summary>
    public double TailLower => 0.0;

    public double TailUpper => 0.0;

    private sealed class GaussianFamily : ICopulaFamily
    {
        public string Name => FamilyName;
        public IReadOnlyList<string> ParameterNames => ["rho"];
        public IReadOnlyList<double> LowerBounds => [MinRho];
        public IReadOnlyList<double> UpperBounds => [MaxRho];
        public IReadOnlyList<int> Rotations => [0];

        // Inverting τ = (2/π) arcsin ρ: ρ = sin(πτ/2).
        public double[]? StartFromTau(double tau) => [Math.Clamp(Math.Sin(Math.PI * tau / 2), MinRho, MaxRho)];

        public ICopula Create(IReadOnlyList<double> parameters) => new GaussianLaw(parameters[0]);
    }
}
