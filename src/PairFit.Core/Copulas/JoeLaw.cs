using MathNet.Numerics.RootFinding;
using PairFit.Core.Common;

namespace PairFit.Core.Copulas;

/// <summary>
/// Joe copula, θ ≥ 1 (Joe 1993; Nelsen 2006, Table 4.1 family (4.2.6)):
/// C(u, v) = 1 − (ū^θ + v̄^θ − ū^θ v̄^θ)^(1/θ) with ū = 1 − u, v̄ = 1 − v. Upper-tail dependent;
/// θ = 1 is independence; rotate for the other corners. With a = ū^θ, b = v̄^θ the sum
/// S = a + b − ab = a + b(1 − a) has no cancellation, and is kept in logs (log a = θ log ū) so
/// that ū^θ does not underflow (θ = 30, u = 1 − 1e−12).
/// </summary>
public sealed class JoeLaw : ICopula
{
    public const string FamilyName = "joe";
    public const double MinTheta = 1.0;
    public const double MaxTheta = 100.0;
    public static readonly ICopulaFamily Family = new JoeFamily();

    private const int TauSeriesTerms = 5000;
    private readonly double _thetaMinusOne, _inverseTheta;

    public JoeLaw(double theta)
    {
        if (!(theta >= 1) || !double.IsFinite(theta))
            throw new ArgumentOutOfRangeException(nameof(theta), $"joe needs theta >= 1 (got {theta}).");
        Theta = theta;
        _thetaMinusOne = theta - 1;
        _inverseTheta = 1 / theta;
    }

    public double Theta { get; }

    string ICopula.Family => FamilyName;
    public int Rotation => 0;
    public IReadOnlyList<string> ParameterNames => ["theta"];
    public IReadOnlyList<double> Parameters => [Theta];

    /// <summary>log S = log(a + b − ab) from log a, log b ≤ 0, as log(big) + log1p(small/big · (1 − big)).</summary>
    private static double LogS(double logA, double logB)
    {
        double hi = Math.Max(logA, logB), lo = Math.Min(logA, logB);
        return hi + MathExtras.Log1P(Math.Exp(lo - hi) * -MathExtras.ExpM1(hi));
    }

    /// <summary>log(1 − p) for p in [0, 1), accurate for small p.</summary>
    private static double LogComplement(double p) => MathExtras.Log1P(-p);

    // c(u,v) = S^(1/θ − 2) ū^(θ−1) v̄^(θ−1) (θ − 1 + S)  (Nelsen 2006, family (4.2.6) differentiated; Joe 2014, ch. 4).
    public double LogDensity(double u, double v)
    {
        double logUBar = LogComplement(u), logVBar = LogComplement(v);
        double logS = LogS(Theta * logUBar, Theta * logVBar);
        return (_inverseTheta - 2) * logS + _thetaMinusOne * (logUBar + logVBar) + Math.Log(_thetaMinusOne + Math.Exp(logS));
    }

    public double Cdf(double u, double v)
    {
        if (u <= 0 || v <= 0) return 0.0;
        if (u >= 1) return Math.Min(v, 1.0);
        if (v >= 1) return u;
        double logS = LogS(Theta * LogComplement(u), Theta * LogComplement(v));
        double c = -MathExtras.ExpM1(logS * _inverseTheta);
        return Math.Clamp(c, Math.Max(u + v - 1, 0.0), Math.Min(u, v));
    }

    // h(v|u) = S^(1/θ − 1) ū^(θ−1) (1 − v̄^θ)  (family (4.2.6) differentiated in u).
    public double ConditionalCdf(double u, double v)
    {
        if (v <= 0) return 0.0;
        if (v >= 1 || u >= 1) return 1.0;
        double logUBar = LogComplement(u), logB = Theta * LogComplement(v);
        return Math.Min(1.0, Math.Exp(LogConditional(Theta * logUBar, logUBar, logB)));
    }

    private double LogConditional(double logA, double logUBar, double logB)
        => (_inverseTheta - 1) * LogS(logA, logB) + _thetaMinusOne * logUBar + MathExtras.Log1MExp(-logB);

    /// <summary>
    /// No closed form. log h is decreasing in ℓ = log b = θ log v̄ ∈ (−∞, 0), from 0 at ℓ → −∞ to
    /// −∞ at ℓ = 0, so h(v|u) = w has one root in ℓ. Newton's method on log h − log w, with
    /// ∂ log h/∂ℓ = (1/θ − 1) b(1 − a)/S − b/(1 − b), from the independence value ℓ = θ log(1 − w),
    /// usually converges in 4–6 steps; a bracketed safeguarded Newton search is the fallback.
    /// Then v = −expm1(ℓ/θ).
    /// </summary>
    public double InverseConditionalCdf(double u, double w)
    {
        if (w <= 0) return 0.0;
        if (w >= 1) return 1.0;
        double logUBar = LogComplement(MathExtras.ClampOpen(u));
        var g = new LogBEquation(this, Theta * logUBar, logUBar, Math.Log(w));
        double logB = Math.Min(Theta * LogComplement(w), -1e-300);
        bool converged = false;
        for (int i = 0; i < 40 && !converged; i++)
        {
            double step = g.Evaluate(logB, out double slope) / slope;
            if (!double.IsFinite(step)) break;
            double next = logB - step;
            if (next >= 0) next = 0.5 * logB; // stay inside ℓ < 0
            // Quadratic convergence: a step below 1e−9 leaves an error of order 1e−18.
            converged = Math.Abs(next - logB) <= 1e-9 * (1 + Math.Abs(logB));
            logB = next;
        }
        if (!converged) logB = BracketedLogB(ref g, logUBar);
        return Math.Clamp(-MathExtras.ExpM1(logB * _inverseTheta), 0.0, 1.0);
    }

    private double BracketedLogB(ref LogBEquation g, double logUBar)
    {
        // At ℓ = hi < 0 close to 0, log h is very negative; walk lo down until log h > log w.
        double hi = -1e-300, lo = Math.Min(Theta * logUBar, 0.0) - 1;
        while (g.Evaluate(lo, out _) < 0) lo *= 2;
        return MonotoneRoot.Solve(ref g, lo, hi, 0.5 * (lo + hi));
    }

    private readonly struct LogBEquation(JoeLaw copula, double logA, double logUBar, double logW) : IMonotoneFunction
    {
        public double Evaluate(double logB, out double slope)
        {
            double a = Math.Exp(logA), b = Math.Exp(logB), logS = LogS(logA, logB);
            double logOneMinusB = MathExtras.Log1MExp(-logB);
            slope = (copula._inverseTheta - 1) * b * (1 - a) * Math.Exp(-logS) - Math.Exp(logB - logOneMinusB);
            return (copula._inverseTheta - 1) * logS + copula._thetaMinusOne * logUBar + logOneMinusB - logW;
        }
    }

    /// <summary>
    /// τ = 1 − 4 Σ_{k≥1} 1/(k(θk + 2)(θ(k − 1) + 2)) (Joe 2014, ch. 4; from memory). Summed to
    /// K = 5000 terms; the tail, (1/θ²)[1/(2K²) − 1/(2K³) − (4/θ − 1)/(3K³)] + O(K⁻⁴) by
    /// Euler–Maclaurin on the expansion in 1/k, leaves an error below 1e−15.
    /// </summary>
    public double KendallTau => TauOf(Theta);

    internal static double TauOf(double theta)
    {
        double sum = 0;
        for (int k = TauSeriesTerms; k >= 1; k--) // smallest terms first
            sum += 1.0 / (k * (theta * k + 2) * (theta * (k - 1) + 2));
        double kk = TauSeriesTerms, a = 2 / theta;
        double tail = (1 / (2 * kk * kk) - 1 / (2 * kk * kk * kk) - (2 * a - 1) / (3 * kk * kk * kk)) / (theta * theta);
        return 1 - 4 * (sum + tail);
    }

    /// <summary>No closed form; 12∫∫C − 3 by quadrature.</summary>
    public double SpearmanRho => CopulaMeasures.SpearmanRhoByQuadrature(this);

    public double TailLower => 0.0;

    /// <summary>λ_U = 2 − 2^(1/θ) (Joe 2014, ch. 4; Nelsen 2006, section 5.4; from memory).</summary>
    public double TailUpper => 2 - Math.Pow(2, _inverseTheta);

    private sealed class JoeFamily : ICopulaFamily
    {
        public string Name => FamilyName;
        public IReadOnlyList<string> ParameterNames => ["theta"];
        public IReadOnlyList<double> LowerBounds => [MinTheta];
        public IReadOnlyList<double> UpperBounds => [MaxTheta];
        public IReadOnlyList<int> Rotations => [0, 90, 180, 270];

        // τ(θ) is increasing from 0 at θ = 1; solve by Brent (the Gumbel inversion 1/(1 − τ) is a
        // lower bound, since Joe's τ is below Gumbel's at equal θ).
        public double[]? StartFromTau(double tau)
        {
            if (tau < 0) return null;
            if (tau == 0) return [MinTheta];
            double tauMax = TauOf(MaxTheta);
            if (tau >= tauMax) return [MaxTheta];
            return [Brent.FindRoot(t => TauOf(t) - tau, MinTheta, MaxTheta, 1e-10)];
        }

        public ICopula Create(IReadOnlyList<double> parameters) => new JoeLaw(parameters[0]);
    }
}
