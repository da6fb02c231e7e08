using MathNet.Numerics;

namespace PairFit.Core.Dependence;

/// <summary>Tests and intervals shared by the correlation coefficients.</summary>
internal static class CorrelationInference
{
    /// <summary>z_{0.975}, the two-sided 95 % standard normal quantile.</summary>
    public const double Z975 = 1.959963984540054;

    /// <summary>
    /// Two-sided p-value of t = r√((n − 2)/(1 − r²)) on n − 2 degrees of freedom, written as the
    /// regularized incomplete beta function: P(|T| ≥ |t|) = I_{df/(df+t²)}(df/2, 1/2) and
    /// df/(df + t²) = 1 − r² (Student's t for the correlation of a bivariate normal sample;
    /// Fisher 1915). Exact for Pearson's r under bivariate normal independence. Needs n ≥ 3.
    /// </summary>
    public static double TTestPValue(double r, int n)
    {
        double df = n - 2;
        double oneMinusR2 = (1 - r) * (1 + r); // no cancellation near |r| = 1
        if (oneMinusR2 <= 0) return 0.0;
        return Math.Clamp(SpecialFunctions.BetaRegularized(df / 2, 0.5, oneMinusR2), 0.0, 1.0);
    }

    /// <summary>
    /// 95 % interval tanh(atanh(r) ± z_{0.975}·se) on Fisher's (1921) z scale, with the standard
    /// error of atanh(r) given by the caller. |r| = 1 gives the degenerate interval [r, r].
    /// </summary>
    public static double[] FisherInterval(double r, double standardErrorOfZ)
    {
        if (Math.Abs(r) >= 1) return [r, r];
        double z = Math.Atanh(r);
        return [Math.Tanh(z - Z975 * standardErrorOfZ), Math.Tanh(z + Z975 * standardErrorOfZ)];
    }

    /// <summary>Two-sided normal p-value 2(1 − Φ(|z|)) = erfc(|z|/√2), accurate in the far tail.</summary>
    public static double NormalPValue(double z) => SpecialFunctions.Erfc(Math.Abs(z) / Math.Sqrt(2));
}
