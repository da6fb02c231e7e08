using MathNet.Numerics;

namespace PairFit.Core.Common;

/// <summary>
/// The standard Student t law with ν &gt; 0 degrees of freedom: log density, CDF accurate in both
/// tails, and a quantile accurate to a few ulps for any p in (0, 1). MathNet's StudentT.InvCDF is
/// a bracketing root search that fails below p ≈ 1e−12 for ν = 2 and costs ~10 µs a call.
/// </summary>
public readonly struct StudentTFunctions
{
    private readonly double _logNormaliser, _halfNuPlusOne, _tailConstant;

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
    }

    public double Nu { get; }

    /// <summary>log f(x) = log Γ((ν+1)/2) − log Γ(ν/2) − ½ log(νπ) − ((ν+1)/2) log(1 + x²/ν).</summary>
    public double LogPdf(double x) => _logNormaliser - _halfNuPlusOne * MathExtras.Log1P(x * x / Nu);

    /// <summary>
    /// F(x) through the regularized incomplete beta function (Abramowitz and Stegun 1964, 26.7.1 and
    /// 26.5.27): for x &lt; 0, F = ½ I_{ν/(ν+x²)}(ν/2, ½), and where F ≥ 0.1 the complementary form
    /// ½ − ½ I_{x²/(ν+x²)}(½, ν/2), so that neither tail nor centre cancels.
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
        double x2 = x * x;
        // Near the centre the complementary form keeps the information in small x; once F is below
        // 0.1 it would cancel (0.5 − 0.49…), so the tail form is used there.
        if (x2 < Nu)
        {
            double centre = 0.5 - 0.5 * SpecialFunctions.BetaRegularized(0.5, Nu / 2, x2 / (Nu + x2));
            if (centre >= 0.1) return centre;
        }
        return 0.5 * SpecialFunctions.BetaRegularized(Nu / 2, 0.5, Nu / (Nu + x2));
    }

    /// <summary>
    /// F⁻¹(p). By symmetry only p &lt; ½ is solved (x &lt; 0). In s = log(−x) the function
    /// G(s) = log F(−e^s) falls from log ½ to a straight line of slope −ν, so Newton's method on
    /// G(s) = log p converges in a few steps from the tail approximation, and a bracket keeps it safe.
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
        double logP = Math.Log(p);
        var g = new LogTailEquation(this, logP);
        // Start: the larger of the power-tail solution and the normal-scale guess.
        double sTail = (_tailConstant - logP) / Nu;
        double z = -BivariateNormal.StandardQuantile(p);
        double s0 = Math.Max(sTail, Math.Log(Math.Max(z, 1e-300)));
        double lo = s0 - 1, hi = s0 + 1;
        while (g.Evaluate(lo, out _) < 0) lo -= 2 * (hi - lo);
        while (g.Evaluate(hi, out _) > 0) hi += 2 * (hi - lo);
        double s = MonotoneRoot.Solve(ref g, lo, hi, s0, 1e-15);
        return -Math.Exp(s);
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
