using PairFit.Core.Common;

namespace PairFit.Core.Copulas;

/// <summary>
/// Clayton copula, θ &gt; 0 (Nelsen 2006, Table 4.1 family (4.2.1)):
/// C(u, v) = (u^−θ + v^−θ − 1)^(−1/θ). Lower-tail dependent; rotate for the other corners.
/// All formulas are evaluated through L = log(u^−θ + v^−θ − 1), computed with a log-sum-exp,
/// so that u^−θ never overflows (θ = 50 at u = 1e−10 would be 1e500).
/// </summary>
public sealed class ClaytonLaw : ICopula
{
    public const string FamilyName = "clayton";
    public const double MinTheta = 1e-6;
    public const double MaxTheta = 200.0;
    public static readonly ICopulaFamily Family = new ClaytonFamily();

    public ClaytonLaw(double theta)
    {
        if (!(theta > 0) || !double.IsFinite(theta))
            throw new ArgumentOutOfRangeException(nameof(theta), $"clayton needs theta > 0 (got {theta}).");
        Theta = theta;
    }

    public double Theta { get; }

    string ICopula.Family => FamilyName;
    public int Rotation => 0;
    public IReadOnlyList<string> ParameterNames => ["theta"];
    public IReadOnlyList<double> Parameters => [Theta];

    /// <summary>log(u^−θ + v^−θ − 1), stable for large θ and small u, v.</summary>
    private double LogGeneratorSum(double u, double v)
    {
        double a = -Theta * Math.Log(u), b = -Theta * Math.Log(v);
        double m = Math.Max(a, b);
        // e^a + e^b − 1 = e^m (e^(a−m) + e^(b−m) − e^(−m)); both a, b ≥ 0 so the bracket is ≥ 1 − e^(−m) + e^(min−m) > 0.
        return m + Math.Log(Math.Exp(a - m) + Math.Exp(b - m) - Math.Exp(-m));
    }

    // c(u,v) = (1+θ)(uv)^(−1−θ)(u^−θ + v^−θ − 1)^(−2−1/θ)  (Nelsen 2006, Example 4.14 differentiated).
    public double LogDensity(double u, double v)
        => MathExtras.Log1P(Theta) - (1 + Theta) * (Math.Log(u) + Math.Log(v)) - (2 + 1 / Theta) * LogGeneratorSum(u, v);

    public double Cdf(double u, double v)
    {
        if (u <= 0 || v <= 0) return 0.0;
        return Math.Exp(-LogGeneratorSum(u, v) / Theta);
    }

    // h(v|u) = u^(−θ−1) (u^−θ + v^−θ − 1)^(−1/θ−1) = (1 + (v^−θ − 1) u^θ)^(−1/θ−1). The second form has
    // no cancellation: with t = log((v^−θ − 1) u^θ) = θ log u + log expm1(−θ log v), log h = −(1 + 1/θ) softplus(t).
    // (The first, as a difference of two large logs, lost ~1e−14 absolute near u → 0.)
    public double ConditionalCdf(double u, double v)
    {
        if (v <= 0) return 0.0;
        if (v >= 1) return 1.0;
        double x = -Theta * Math.Log(v); // > 0
        double t = Theta * Math.Log(u) + x + MathExtras.Log1MExp(x);
        double softplus = t > 0 ? t + MathExtras.Log1P(Math.Exp(-t)) : MathExtras.Log1P(Math.Exp(t));
        return Math.Exp(-(1 + 1 / Theta) * softplus);
    }

    // Solving h(v|u) = w: v = ((w^(−θ/(1+θ)) − 1) u^−θ + 1)^(−1/θ), in logs so it neither overflows nor cancels.
    public double InverseConditionalCdf(double u, double w)
    {
        if (w <= 0) return 0.0;
        if (w >= 1) return 1.0;
        double t = Math.Log(MathExtras.ExpM1(-Theta / (1 + Theta) * Math.Log(w))) - Theta * Math.Log(u);
        double softplus = t > 0 ? t + MathExtras.Log1P(Math.Exp(-t)) : MathExtras.Log1P(Math.Exp(t));
        return Math.Exp(-softplus / Theta);
    }

    /// <summary>τ = θ/(θ + 2) (Nelsen 2006, Example 5.4).</summary>
    public double KendallTau => Theta / (Theta + 2);

    /// <summary>No closed form; 12∫∫C − 3 by quadrature.</summary>
    public double SpearmanRho => CopulaMeasures.SpearmanRhoByQuadrature(this);

    /// <summary>λ_L = 2^(−1/θ) (Nelsen 2006, Example 5.22).</summary>
    public double TailLower => Math.Pow(2, -1 / Theta);

    public double TailUpper => 0.0;

    private sealed class ClaytonFamily : ICopulaFamily
    {
        public string Name => FamilyName;
        public IReadOnlyList<string> ParameterNames => ["theta"];
        public IReadOnlyList<double> LowerBounds => [MinTheta];
        public IReadOnlyList<double> UpperBounds => [MaxTheta];
        public IReadOnlyList<int> Rotations => [0, 90, 180, 270];

        // Inverting τ = θ/(θ+2): θ = 2τ/(1 − τ).
        public double[]? StartFromTau(double tau)
            => tau <= 0 ? null : [Math.Clamp(2 * tau / (1 - tau), MinTheta, MaxTheta)];

        public ICopula Create(IReadOnlyList<double> parameters) => new ClaytonLaw(parameters[0]);
    }
}
