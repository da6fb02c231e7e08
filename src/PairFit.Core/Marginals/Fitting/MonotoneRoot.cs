using MathNet.Numerics.RootFinding;

namespace PairFit.Core.Marginals.Fitting;

/// <summary>Root of a monotone function of one variable: bracket by expanding outward, then Brent.</summary>
internal static class MonotoneRoot
{
    /// <summary>
    /// Finds t in (lower, upper) with f(t) = 0, starting the bracket at [a, b] and doubling its width
    /// (within the limits) until f changes sign. Null when no sign change exists in the limits.
    /// </summary>
    public static double? Find(Func<double, double> f, double a, double b, double lower, double upper, double accuracy = 1e-12)
    {
        double fa = f(a), fb = f(b);
        for (int i = 0; i < 200 && !(double.IsFinite(fa) && double.IsFinite(fb) && Math.Sign(fa) != Math.Sign(fb)); i++)
        {
            double width = b - a;
            double na = Math.Max(lower, a - width), nb = Math.Min(upper, b + width);
            if (na == a && nb == b) return null;
            if (na != a) { a = na; fa = f(a); }
            if (nb != b) { b = nb; fb = f(b); }
        }
        if (fa == 0) return a;
        if (fb == 0) return b;
        if (!(double.IsFinite(fa) && double.IsFinite(fb)) || Math.Sign(fa) == Math.Sign(fb)) return null;
        return Brent.TryFindRoot(f, a, b, accuracy, 200, out double root) ? root : null;
    }
}
