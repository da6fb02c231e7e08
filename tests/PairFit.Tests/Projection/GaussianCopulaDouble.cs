using MathNet.Numerics;
using MathNet.Numerics.Distributions;
using PairFit.Core.Copulas;

namespace PairFit.Tests.Projection;

/// <summary>
/// TEST DOUBLE, to be deleted once the real GaussianCopula lands on main (then the Gaussian
/// tests switch to CopulaRegistry.Create("gaussian", 0, [rho])). Textbook formulas
/// (Joe 2014, section 4.3): c(u, v) = φ₂(a, b; ρ)/(φ(a)φ(b)), h(v | u) = Φ((b − ρa)/√(1 − ρ²)),
/// a = Φ⁻¹(u), b = Φ⁻¹(v). Cdf by Φ₂(a, b; ρ) = ∫_{−∞}^a φ(t) Φ((b − ρt)/√(1 − ρ²)) dt.
/// </summary>
internal sealed class GaussianCopulaDouble(double rho) : ICopula
{
    private readonly double _s = Math.Sqrt(1 - rho * rho);
    public string Family => "gaussian";
    public int Rotation => 0;
    public IReadOnlyList<string> ParameterNames => ["rho"];
    public IReadOnlyList<double> Parameters => [rho];

    public double LogDensity(double u, double v)
    {
        double a = Normal.InvCDF(0, 1, u), b = Normal.InvCDF(0, 1, v);
        return -Math.Log(_s) - (rho * rho * (a * a + b * b) - 2 * rho * a * b) / (2 * _s * _s);
    }

    public double Cdf(double u, double v)
    {
        if (u <= 0 || v <= 0) return 0;
        double a = Normal.InvCDF(0, 1, Math.Min(u, 1 - 1e-16)), b = Normal.InvCDF(0, 1, Math.Min(v, 1 - 1e-16));
        return Integrate.DoubleExponential(t => Normal.PDF(0, 1, t) * Normal.CDF(0, 1, (b - rho * t) / _s), -40, a, 1e-13);
    }

    public double ConditionalCdf(double u, double v) => Normal.CDF(0, 1, (Normal.InvCDF(0, 1, v) - rho * Normal.InvCDF(0, 1, u)) / _s);
    public double InverseConditionalCdf(double u, double w) => Normal.CDF(0, 1, rho * Normal.InvCDF(0, 1, u) + _s * Normal.InvCDF(0, 1, w));
    public double KendallTau => 2 / Math.PI * Math.Asin(rho);
    public double SpearmanRho => 6 / Math.PI * Math.Asin(rho / 2);
    public double TailLower => 0;
    public double TailUpper => 0;
}
