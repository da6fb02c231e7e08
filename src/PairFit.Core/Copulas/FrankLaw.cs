using MathNet.Numerics.RootFinding;
using PairFit.Core.Common;

namespace PairFit.Core.Copulas;

/// <summary>
/// Frank copula, θ ≠ 0 of either sign (Nelsen 2006, Table 4.1 family (4.2.5)):
/// C(u, v) = −(1/θ) log(1 + (e^(−θu) − 1)(e^(−θv) − 1)/(e^(−θ) − 1)). Radially symmetric and
/// covers both signs, so it is never rotated; no tail dependence. θ → 0 is independence.
/// <para>
/// Numerics: the formulas are written for a = |θ| &gt; 0 with every term a sum of non-negative
/// parts (log1mexp(x) = log(1 − e^(−x)), expm1), and θ &lt; 0 uses the exact reflection
/// C_θ(u, v) = u − C_|θ|(u, 1 − v) (Nelsen 2006, Theorem 2.4.4 with Frank's radial symmetry) with v and 1 − v
/// both passed in, so neither overflows (|θ| = 80) nor cancels in the corners.
/// </para>
/// </summary>
public sealed class FrankLaw : ICopula
{
    public const string FamilyName = "frank";
    public const double MinTheta = -100.0;
    public const double MaxTheta = 100.0;
    /// <summary>Smallest |θ| used as a starting value; θ = 0 itself is not a Frank parameter.</summary>
    public const double SmallestStart = 1e-4;
    public static readonly ICopulaFamily Family = new FrankFamily();

    private readonly double _a, _logA, _log1mExpA;
    private readonly bool _negative;

    public FrankLaw(double theta)
    {
        if (theta == 0 || !double.IsFinite(theta))
            throw new ArgumentOutOfRangeException(nameof(theta), $"frank needs a finite theta != 0 (got {theta}).");
        Theta = theta;
        _negative = theta < 0;
        _a = Math.Abs(theta);
        _logA = Math.Log(_a);
        _log1mExpA = MathExtras.Log1MExp(_a);
    }

    public double Theta { get; }

    string ICopula.Family => FamilyName;
    public int Rotation => 0;
    public IReadOnlyList<string> ParameterNames => ["theta"];
    public IReadOnlyList<double> Parameters => [Theta];

    /// <summary>log(1 − e^(−x)) for x ≥ 0 (−∞ at 0).</summary>
    private static double L(double x) => x > 0 ? MathExtras.Log1MExp(x) : double.NegativeInfinity;

    private static double LogSumExp(double p, double q)
    {
        double m = Math.Max(p, q);
        return double.IsNegativeInfinity(m) ? m : m + MathExtras.Log1P(Math.Exp(Math.Min(p, q) - m));
    }

    // For a > 0 the density's denominator D = (1 − e^(−a)) − (1 − e^(−au))(1 − e^(−av)) equals
    // e^(−au)(1 − e^(−av)) + e^(−av)(1 − e^(−a(1−v))), a sum of non-negative terms.
    private double LogD(double u, double v, double vBar)
        => LogSumExp(-_a * u + L(_a * v), -_a * v + L(_a * vBar));

    // c(u,v) = a(1 − e^(−a)) e^(−a(u+v)) / D²  (Nelsen 2006, family (4.2.5) differentiated; Joe 2014, ch. 4).
    public double LogDensity(double u, double v)
    {
        double vBar = 1 - v;
        if (_negative) (v, vBar) = (vBar, v);
        if (_a > DirectLimit) return _logA + _log1mExpA - _a * (u + v) - 2 * LogD(u, v, vBar);
        // For a ≤ 300 no exponential here underflows (e^(−300) ≈ 5e−131), so D is formed directly
        // from its two non-negative terms: half the transcendental calls of the log-space form.
        double d = -Math.Exp(-_a * u) * MathExtras.ExpM1(-_a * v) - Math.Exp(-_a * v) * MathExtras.ExpM1(-_a * vBar);
        return _logA + _log1mExpA - _a * (u + v) - 2 * Math.Log(d);
    }

    private const double DirectLimit = 300.0;

    public double Cdf(double u, double v)
    {
        if (u <= 0 || v <= 0) return 0.0;
        if (u >= 1) return Math.Min(v, 1.0);
        if (v >= 1) return u;
        if (_negative)
        {
            // C_θ(u,v) = (1/a) log(1 + (e^(au) − 1)(e^(av) − 1)/(e^a − 1)), all terms positive; log expm1(x) = x + log1mexp(x).
            double logRatio = _a * u + L(_a * u) + _a * v + L(_a * v) - _a - _log1mExpA;
            return Math.Min(Softplus(logRatio) / _a, Math.Min(u, v));
        }
        // a > 0: ratio = −(1 − e^(−au))(1 − e^(−av))/(1 − e^(−a)) in (−1, 0]; near −1 use 1 + ratio = D/(1 − e^(−a)).
        double logMinusRatio = L(_a * u) + L(_a * v) - _log1mExpA;
        double c = logMinusRatio < Math.Log(0.5)
            ? -MathExtras.Log1P(-Math.Exp(logMinusRatio)) / _a
            : -(LogD(u, v, 1 - v) - _log1mExpA) / _a;
        return Math.Clamp(c, Math.Max(u + v - 1, 0.0), Math.Min(u, v));
    }

    private static double Softplus(double t) => t > 0 ? t + MathExtras.Log1P(Math.Exp(-t)) : MathExtras.Log1P(Math.Exp(t));

    /// <summary>h for a &gt; 0 as a logistic: h = 1/(1 + e^r), r = a(u − v) + log1mexp(a v̄) − log1mexp(a v).</summary>
    private double PositiveConditionalR(double u, double v, double vBar) => _a * (u - v) + L(_a * vBar) - L(_a * v);

    // h(v|u) = e^(−au)(1 − e^(−av))/D  (Nelsen 2006, family (4.2.5) differentiated in u).
    // θ < 0: h_θ(v|u) = 1 − h_a(1 − v | u) = 1/(1 + e^(−r(u, v̄, v))).
    public double ConditionalCdf(double u, double v)
    {
        if (v <= 0) return 0.0;
        if (v >= 1) return 1.0;
        double vBar = 1 - v;
        return _negative
            ? Logistic(PositiveConditionalR(u, vBar, v))
            : Logistic(-PositiveConditionalR(u, v, vBar));
    }

    private static double Logistic(double t) => t >= 0 ? 1 / (1 + Math.Exp(-t)) : Math.Exp(t) / (1 + Math.Exp(t));

    // Closed form by solving h(v|u) = w for e^(−av) (algebra on the h above), for a > 0:
    //   v = (1/a) log1p( w(1 − e^(−a)) / ((1 − w)e^(−au) + w e^(−a)) )
    //   1 − v = (1/a) log1p( (1 − w) e^(−au)(e^a − 1) / (w + (1 − w)e^(−au)) ),
    // both as softplus of a log, so that whichever of v and 1 − v is small is computed directly.
    // θ < 0: h_θ(v|u) = w ⇔ h_a(1 − v | u) = 1 − w, so v is the "1 − v" of the a-solution at 1 − w.
    public double InverseConditionalCdf(double u, double w)
    {
        if (w <= 0) return 0.0;
        if (w >= 1) return 1.0;
        double wBar = 1 - w;
        if (_negative) (w, wBar) = (wBar, w);
        double logW = Math.Log(w), logWBar = Math.Log(wBar);
        if (!_negative)
        {
            double t = logW + _log1mExpA - LogSumExp(logWBar - _a * u, logW - _a);
            return Math.Min(Softplus(t) / _a, 1.0);
        }
        double tBar = logWBar - _a * u + _a + _log1mExpA - LogSumExp(logW, logWBar - _a * u);
        return Math.Min(Softplus(tBar) / _a, 1.0);
    }

    /// <summary>τ = 1 − 4/θ + 4 D1(θ)/θ (Genest 1987; Nelsen 2006, ch. 5 exercises), odd in θ.</summary>
    public double KendallTau => TauOf(Theta);

    internal static double TauOf(double theta) => 1 - 4 / theta + 4 * Debye.D1(theta) / theta;

    /// <summary>ρ_S = 1 − 12 (D1(θ) − D2(θ))/θ (Genest 1987; Nelsen 2006, ch. 5 exercises).</summary>
    public double SpearmanRho => 1 - 12 * (Debye.D1(Theta) - Debye.D2(Theta)) / Theta;

    /// <summary>No tail dependence (Nelsen 2006, section 5.4; from memory).</summary>
    public double TailLower => 0.0;

    public double TailUpper => 0.0;

    private sealed class FrankFamily : ICopulaFamily
    {
        public string Name => FamilyName;
        public IReadOnlyList<string> ParameterNames => ["theta"];
        public IReadOnlyList<double> LowerBounds => [MinTheta];
        public IReadOnlyList<double> UpperBounds => [MaxTheta];
        public IReadOnlyList<int> Rotations => [0];

        // τ(θ) is odd and increasing; solve τ(θ) = |τ| on (0, MaxTheta] by Brent and restore the sign.
        public double[]? StartFromTau(double tau)
        {
            double target = Math.Abs(tau);
            double tauMax = TauOf(MaxTheta);
            double theta = target >= tauMax ? MaxTheta
                : target <= TauOf(SmallestStart) ? SmallestStart
                : Brent.FindRoot(t => TauOf(t) - target, SmallestStart, MaxTheta, 1e-10);
            return [tau < 0 ? -theta : theta];
        }

        public ICopula Create(IReadOnlyList<double> parameters) => new FrankLaw(parameters[0]);
    }
}
