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

    /// <summary>
    /// Two-stage root for equations that are sums over the data: solved first on a stratified
    /// subsample (cheap, within a few subsample standard errors of the answer), then on the full data
    /// from a bracket of ±<paramref name="halfWidth"/> around that root, which Brent closes in a few
    /// full passes. <paramref name="equation"/> takes the values to sum over and the unknown.
    /// </summary>
    public static double? FindOnData(Func<double[], double, double> equation, double[] full, double[] subsample,
        double a, double b, double lower, double upper, double halfWidth, double accuracy)
    {
        if (!ReferenceEquals(full, subsample) && full.Length > subsample.Length)
        {
            double? rough = Find(t => equation(subsample, t), a, b, lower, upper, accuracy * 1e3);
            if (rough is { } r) { a = Math.Max(lower, r - halfWidth); b = Math.Min(upper, r + halfWidth); }
        }
        return Find(t => equation(full, t), a, b, lower, upper, accuracy);
    }
}
