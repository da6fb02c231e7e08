using MathNet.Numerics.RootFinding;

namespace PairFit.Core.Common;

/// <summary>A monotone function of one variable that returns its value and its slope.</summary>
public interface IMonotoneFunction
{
    double Evaluate(double x, out double slope);
}

/// <summary>
/// Safeguarded Newton iteration for the root of a monotone function on a bracket [lo, hi] whose
/// end values have opposite signs (common practice, e.g. the "rtsafe" scheme of Press et al. 2007,
/// section 9.4): a Newton step is taken when it stays inside the current bracket, a bisection step
/// otherwise, so it always converges. Generic over a struct so that callers pay no allocation.
/// </summary>
public static class MonotoneRoot
{
    public static double Solve<TFunction>(ref TFunction f, double lo, double hi, double x0, double tolerance = 1e-14, int maxIterations = 200)
        where TFunction : struct, IMonotoneFunction
    {
        double fLo = f.Evaluate(lo, out _);
        bool increasing = fLo < 0;
        double x = x0 > lo && x0 < hi ? x0 : 0.5 * (lo + hi);
        for (int i = 0; i < maxIterations; i++)
        {
            double fx = f.Evaluate(x, out double slope);
            if (fx == 0) return x;
            if ((fx < 0) == increasing) lo = x; else hi = x;
            double next = x - fx / slope;
            if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
            if (Math.Abs(next - x) <= tolerance * (1 + Math.Abs(x)) || hi - lo <= tolerance * (1 + Math.Abs(x)))
                return next;
            x = next;
        }
        return x;
    }

    /// <summary>
    /// Finds t in (lower, upper) with f(t) = 0, starting the bracket at [a, b] and doubling its width
    /// (within the limits) until f changes sign, then Brent's method. Null when no sign change exists
    /// within the limits. For functions without a cheap slope (marginal profile-likelihood equations).
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
