using PairFit.Core.Common;

namespace PairFit.Core.Copulas;

/// <summary>
/// Gumbel (Gumbel–Hougaard) copula, θ ≥ 1 (Nelsen 2006, Table 4.1 family (4.2.4)):
/// C(u, v) = exp(−(x^θ + y^θ)^(1/θ)) with x = −log u, y = −log v. Upper-tail dependent; θ = 1 is
/// independence; rotate for the other corners. Everything goes through log A, A = x^θ + y^θ,
/// computed as a log-sum-exp so that x^θ neither overflows nor underflows (θ = 30, u = 1e−12).
/// </summary>
public sealed class GumbelLaw : ICopula
{
    public const string FamilyName = "gumbel";
    public const double MinTheta = 1.0;
    public const double MaxTheta = 100.0;
    public static readonly ICopulaFamily Family = new GumbelFamily();

    private readonly double _thetaMinusOne, _inverseTheta;

    public GumbelLaw(double theta)
    {
        if (!(theta >= 1) || !double.IsFinite(theta))
            throw new ArgumentOutOfRangeException(nameof(theta), $"gumbel needs theta >= 1 (got {theta}).");
        Theta = theta;
        _thetaMinusOne = theta - 1;
        _inverseTheta = 1 / theta;
    }

    public double Theta { get; }

    string ICopula.Family => FamilyName;
    public int Rotation => 0;
    public IReadOnlyList<string> ParameterNames => ["theta"];
    public IReadOnlyList<double> Parameters => [Theta];

    /// <summary>log(e^(θa) + e^(θb)) for a = log x, b = log y.</summary>
    private double LogA(double logX, double logY)
    {
        double hi = Math.Max(logX, logY), lo = Math.Min(logX, logY);
        return Theta * hi + MathExtras.Log1P(Math.Exp(Theta * (lo - hi)));
    }

    // c(u,v) = C(u,v)/(uv) · (xy)^(θ−1) · A^(2/θ−2) · (A^(1/θ) + θ − 1)/A^(1/θ)
    // (Nelsen 2006, family (4.2.4) differentiated twice; Joe 2014, ch. 4). With w = A^(1/θ):
    // log c = −w + x + y + (θ−1)(log x + log y) + (2/θ − 2) log A + log(w + θ − 1) − log w.
    public double LogDensity(double u, double v)
    {
        double x = -Math.Log(u), y = -Math.Log(v);
        double logX = Math.Log(x), logY = Math.Log(y);
        double logA = LogA(logX, logY);
        double logW = logA * _inverseTheta, w = Math.Exp(logW);
        return -w + x + y + _thetaMinusOne * (logX + logY) + (2 * _inverseTheta - 2) * logA
               + Math.Log(w + _thetaMinusOne) - logW;
    }

    public double Cdf(double u, double v)
    {
        if (u <= 0 || v <= 0) return 0.0;
        if (u >= 1) return Math.Min(v, 1.0);
        if (v >= 1) return u;
        double logA = LogA(Math.Log(-Math.Log(u)), Math.Log(-Math.Log(v)));
        return Math.Exp(-Math.Exp(logA * _inverseTheta));
    }

    // h(v|u) = C(u,v) · x^(θ−1) · A^(1/θ−1) / u; in logs: −w + x + (θ−1) log x + (1/θ − 1) log A.
    public double ConditionalCdf(double u, double v)
    {
        if (v <= 0 || u >= 1) return 0.0;
        if (v >= 1 || u <= 0) return 1.0;
        double x = -Math.Log(u), logX = Math.Log(x);
        double logA = LogA(logX, Math.Log(-Math.Log(v)));
        double logH = -Math.Exp(logA * _inverseTheta) + x + _thetaMinusOne * logX + (_inverseTheta - 1) * logA;
        return Math.Min(1.0, Math.Exp(logH));
    }

    /// <summary>
    /// No closed form. With z = A^(1/θ) ≥ x, log h = −z + x + (θ−1)(log x − log z), so h(v|u) = w
    /// is the root of g(s) = e^s + (θ−1)s − (x + (θ−1) log x − log w) in s = log z. g is increasing
    /// and convex, so Newton's method never overshoots to the left after its first step and
    /// converges monotonically (a bracketed search is kept as a fallback). Then
    /// y = z (1 − (x/z)^θ)^(1/θ) and v = e^(−y).
    /// </summary>
    public double InverseConditionalCdf(double u, double w)
    {
        if (w <= 0) return 0.0;
        if (w >= 1) return 1.0;
        double x = -Math.Log(MathExtras.ClampOpen(u)), logX = Math.Log(x);
        var g = new LogZEquation(_thetaMinusOne, x + _thetaMinusOne * logX - Math.Log(w));
        // The root of e^s = target is a good start when the exponential dominates; never below log x.
        double s = Math.Max(logX, Math.Log(Math.Max(g.Target, 1e-300)));
        bool converged = false;
        for (int i = 0; i < 60 && !converged; i++)
        {
            double step = g.Evaluate(s, out double slope) / slope;
            if (!double.IsFinite(step)) break;
            s = Math.Max(s - step, logX);
            // Quadratic convergence: a step below 1e−9 leaves an error of order 1e−18.
            converged = Math.Abs(step) <= 1e-9 * (1 + Math.Abs(s));
        }
        if (!converged)
        {
            double lo = logX, hi = logX + 1;
            while (g.Evaluate(hi, out _) < 0) hi = lo + 2 * (hi - lo);
            s = MonotoneRoot.Solve(ref g, lo, hi, 0.5 * (lo + hi));
        }
        double logY = s + MathExtras.Log1MExp(Theta * (s - logX)) * _inverseTheta;
        return Math.Exp(-Math.Exp(logY));
    }

    private readonly struct LogZEquation(double thetaMinusOne, double target) : IMonotoneFunction
    {
        public double Target => target;

        public double Evaluate(double s, out double slope)
        {
            double z = Math.Exp(s);
            slope = z + thetaMinusOne;
            return z + thetaMinusOne * s - target;
        }
    }

    /// <summary>τ = 1 − 1/θ (Nelsen 2006, Example 5.5; numbering from memory).</summary>
    public double KendallTau => 1 - _inverseTheta;

    /// <summary>No closed form; 12∫∫C − 3 by quadrature.</summary>
    public double SpearmanRho => CopulaMeasures.SpearmanRhoByQuadrature(this);

    public double TailLower => 0.0;

    /// <summary>λ_U = 2 − 2^(1/θ) (Nelsen 2006, Example 5.22; numbering from memory).</summary>
    public double TailUpper => 2 - Math.Pow(2, _inverseTheta);

    private sealed class GumbelFamily : ICopulaFamily
    {
        public string Name => FamilyName;
        public IReadOnlyList<string> ParameterNames => ["theta"];
        public IReadOnlyList<double> LowerBounds => [MinTheta];
        public IReadOnlyList<double> UpperBounds => [MaxTheta];
        public IReadOnlyList<int> Rotations => [0, 90, 180, 270];

        // Inverting τ = 1 − 1/θ: θ = 1/(1 − τ).
        public double[]? StartFromTau(double tau)
            => tau < 0 ? null : [Math.Clamp(1 / (1 - tau), MinTheta, MaxTheta)];

        public ICopula Create(IReadOnlyList<double> parameters) => new GumbelLaw(parameters[0]);
    }
}
