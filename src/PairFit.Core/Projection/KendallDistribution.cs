using MathNet.Numerics.RootFinding;
using PairFit.Core.Copulas;

namespace PairFit.Core.Projection;

/// <summary>
/// The Kendall distribution function K_C(t) = P(C(U, V) ≤ t) of a copula (Genest and Rivest
/// 1993; Nelsen 2006, section 5.1.4) and the copula's level curves, for any family, by quadrature:
/// for U ≤ t, C(U, V) ≤ U ≤ t always; for U &gt; t, C(U, V) ≤ t exactly when V ≤ v_t(U), the root
/// of C(U, v) = t, so K_C(t) = t + ∫_t^1 h(v_t(u) | u) du. For Archimedean copulas this equals
/// the closed form t − φ(t)/φ'(t), which the tests use as a check.
/// </summary>
public static class KendallDistribution
{
    public static double Cdf(ICopula copula, double t)
    {
        if (t <= 0) return 0.0;
        if (t >= 1) return 1.0;
        double[] breaks = Panels(t);
        double integral = AdaptiveQuadrature.Integrate(u =>
        {
            double v = LevelCurve(copula, u, t);
            return Math.Clamp(copula.ConditionalCdf(u, v), 0.0, 1.0);
        }, breaks, 1e-10, 1e-8, maxPanels: 200);
        return Math.Clamp(t + integral, t, 1.0);
    }

    /// <summary>The t with K_C(t) = p, by bisection on the increasing function K_C.</summary>
    public static double Quantile(ICopula copula, double p)
    {
        double lo = 0, hi = 1;
        for (int i = 0; i < 60; i++)
        {
            double mid = 0.5 * (lo + hi);
            if (Cdf(copula, mid) < p) lo = mid; else hi = mid;
        }
        return 0.5 * (lo + hi);
    }

    /// <summary>The v in (t, 1] with C(u, v) = t for u in (t, 1) (C(u, ·) rises from 0 to u).</summary>
    public static double LevelCurve(ICopula copula, double u, double t)
    {
        if (u <= t) return 1.0;
        double F(double v) => copula.Cdf(u, v) - t;
        if (F(1.0) <= 0) return 1.0;
        double lo = Math.Max(t, 1e-300);
        if (F(lo) >= 0) return lo;
        return Brent.TryFindRoot(F, lo, 1.0, 1e-14, 200, out double root) ? root : Bisect(F, lo, 1.0);
    }

    /// <summary>Root of an increasing function with F(lo) &lt; 0 ≤ F(hi).</summary>
    internal static double Bisect(Func<double, double> f, double lo, double hi)
    {
        for (int i = 0; i < 200 && hi - lo > 1e-15; i++)
        {
            double mid = 0.5 * (lo + hi);
            if (f(mid) < 0) lo = mid; else hi = mid;
        }
        return 0.5 * (lo + hi);
    }

    // Graded towards both ends of (t, 1), where the level curve turns towards the edges of the square.
    private static double[] Panels(double t)
    {
        double w = 1 - t;
        double[] fractions = [0, 1e-8, 1e-5, 1e-3, 0.02, 0.1, 0.3, 0.6, 0.9, 0.98, 0.999, 1 - 1e-5, 1 - 1e-8, 1];
        var b = new double[fractions.Length];
        for (int i = 0; i < b.Length; i++) b[i] = t + w * fractions[i];
        b[^1] = 1.0;
        return b;
    }
}
