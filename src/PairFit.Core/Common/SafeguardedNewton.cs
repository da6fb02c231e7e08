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
public static class SafeguardedNewton
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
}
