using MathNet.Numerics;

namespace PairFit.Core.Common;

/// <summary>Small numerically careful helpers that .NET's Math lacks.</summary>
public static class MathExtras
{
    /// <summary>exp(x) − 1 without cancellation near 0.</summary>
    public static double ExpM1(double x) => SpecialFunctions.Expm1(x);

    /// <summary>log(1 + x) without cancellation near 0.</summary>
    public static double Log1P(double x) => SpecialFunctions.Log1p(x);

    /// <summary>Clamp a probability into the open interval (eps, 1 − eps).</summary>
    public static double ClampOpen(double p, double eps = 1e-15) => p < eps ? eps : (p > 1 - eps ? 1 - eps : p);

    /// <summary>log(1 − exp(−a)) for a &gt; 0, stable for both small and large a (Mächler 2012).</summary>
    public static double Log1MExp(double a) => a <= Math.Log(2) ? Math.Log(-ExpM1(-a)) : Log1P(-Math.Exp(-a));
}
