namespace PairFit.Core.Copulas.Fitting;

/// <summary>Where a minimiser stopped.</summary>
public readonly record struct MinimumFound(double[] Point, double Value, bool Converged, int Evaluations);

/// <summary>
/// Derivative-free minimisers used on negative log-likelihoods in free coordinates. The objective
/// may return +Infinity for a point the data rule out; both methods treat that as "uphill".
/// </summary>
public static class Minimizers
{
    private const double Golden = 1.618033988749895;
    private const double CGold = 0.3819660112501051;

    /// <summary>
    /// One-dimensional minimum: downhill bracketing from <paramref name="x0"/> with first step
    /// <paramref name="step"/> inside [lo, hi], then Brent's parabolic/golden-section search
    /// (Brent 1973, ch. 5; as laid out in Press et al. 2007, section 10.3).
    /// </summary>
    public static MinimumFound Scalar(Func<double, double> f, double x0, double step, double lo, double hi,
        double tolerance = 1e-9, int maxEvaluations = 200)
    {
        int evals = 0;
        double F(double x) { evals++; double y = f(x); return double.IsNaN(y) ? double.PositiveInfinity : y; }

        x0 = Math.Clamp(x0, lo, hi);
        double a = x0, fa = F(a);
        double b = Math.Clamp(x0 + step, lo, hi);
        if (b == a) b = Math.Clamp(x0 - step, lo, hi);
        double fb = F(b);
        if (fb > fa) { (a, b) = (b, a); (fa, fb) = (fb, fa); }
        // Now going from a to b is downhill (or flat); walk on with growing steps until uphill or at a limit.
        double c = Math.Clamp(b + Golden * (b - a), lo, hi), fc = F(c);
        while (fc < fb && c != b && evals < maxEvaluations)
        {
            double next = Math.Clamp(c + Golden * (c - b), lo, hi);
            a = b; fa = fb; b = c; fb = fc;
            if (next == c) break; // at a limit: minimum lies in [a, limit]
            c = next; fc = F(c);
        }
        if (fc < fb) { b = c; fb = fc; } // minimum at the limit; Brent below converges onto it
        double left = Math.Min(a, c), right = Math.Max(a, c);
        if (!(right > left)) return new MinimumFound([b], fb, true, evals);
        return Brent(F, left, right, b, fb, tolerance, maxEvaluations, ref evals);
    }

    private static MinimumFound Brent(Func<double, double> f, double left, double right, double xStart, double fStart,
        double tolerance, int maxEvaluations, ref int evals)
    {
        double x = xStart, w = xStart, v = xStart, fx = fStart, fw = fStart, fv = fStart;
        double d = 0, e = 0;
        while (evals < maxEvaluations)
        {
            double mid = 0.5 * (left + right);
            double tol1 = 1.4901161193847656e-8 * Math.Abs(x) + tolerance, tol2 = 2 * tol1;
            if (Math.Abs(x - mid) <= tol2 - 0.5 * (right - left))
                return new MinimumFound([x], fx, true, evals);
            bool golden = true;
            if (Math.Abs(e) > tol1)
            {
                double r = (x - w) * (fx - fv), q = (x - v) * (fx - fw), p = (x - v) * q - (x - w) * r;
                q = 2 * (q - r);
                if (q > 0) p = -p; else q = -q;
                double eOld = e;
                e = d;
                if (Math.Abs(p) < Math.Abs(0.5 * q * eOld) && p > q * (left - x) && p < q * (right - x) && double.IsFinite(p / q))
                {
                    d = p / q;
                    double uTry = x + d;
                    if (uTry - left < tol2 || right - uTry < tol2) d = mid >= x ? tol1 : -tol1;
                    golden = false;
                }
            }
            if (golden)
            {
                e = x >= mid ? left - x : right - x;
                d = CGold * e;
            }
            double u = Math.Abs(d) >= tol1 ? x + d : x + (d >= 0 ? tol1 : -tol1);
            double fu = f(u);
            if (fu <= fx)
            {
                if (u >= x) left = x; else right = x;
                v = w; fv = fw; w = x; fw = fx; x = u; fx = fu;
            }
            else
            {
                if (u < x) left = u; else right = u;
                if (fu <= fw || w == x) { v = w; fv = fw; w = u; fw = fu; }
                else if (fu <= fv || v == x || v == w) { v = u; fv = fu; }
            }
        }
        return new MinimumFound([x], fx, false, evals);
    }

    /// <summary>
    /// Nelder–Mead simplex minimum with the standard coefficients (reflection 1, expansion 2,
    /// contraction 1/2, shrink 1/2; Lagarias, Reeds, Wright and Wright 1998), clamped to the box
    /// [lo, hi], restarted once from its own answer to guard against a collapsed simplex (common practice).
    /// </summary>
    public static MinimumFound NelderMead(Func<double[], double> f, double[] x0, double[] initialStep, double[] lo, double[] hi,
        double fTolerance = 1e-10, double xTolerance = 1e-7, int maxEvaluations = 4000)
    {
        var first = NelderMeadOnce(f, x0, initialStep, lo, hi, fTolerance, xTolerance, maxEvaluations);
        var smallStep = new double[x0.Length];
        for (int i = 0; i < smallStep.Length; i++) smallStep[i] = 0.1 * initialStep[i];
        var second = NelderMeadOnce(f, first.Point, smallStep, lo, hi, fTolerance, xTolerance, Math.Max(100, maxEvaluations - first.Evaluations));
        var best = second.Value <= first.Value ? second : first;
        return best with { Converged = first.Converged && second.Converged, Evaluations = first.Evaluations + second.Evaluations };
    }

    private static MinimumFound NelderMeadOnce(Func<double[], double> f, double[] x0, double[] step, double[] lo, double[] hi,
        double fTolerance, double xTolerance, int maxEvaluations)
    {
        int k = x0.Length, evals = 0;
        double F(double[] x) { evals++; double y = f(x); return double.IsNaN(y) ? double.PositiveInfinity : y; }
        double[] Clamp(double[] x) { for (int i = 0; i < k; i++) x[i] = Math.Clamp(x[i], lo[i], hi[i]); return x; }

        var pts = new double[k + 1][];
        var val = new double[k + 1];
        pts[0] = Clamp((double[])x0.Clone());
        val[0] = F(pts[0]);
        for (int j = 0; j < k; j++)
        {
            var p = (double[])pts[0].Clone();
            p[j] += step[j];
            if (p[j] > hi[j]) p[j] = pts[0][j] - step[j];
            pts[j + 1] = Clamp(p);
            val[j + 1] = F(pts[j + 1]);
        }
        var order = new int[k + 1];
        var centroid = new double[k];
        while (true)
        {
            for (int i = 0; i <= k; i++) order[i] = i;
            Array.Sort(order, (p, q) => val[p].CompareTo(val[q]));
            int best = order[0], worst = order[k], second = order[k - 1];
            double spread = Math.Abs(val[worst] - val[best]);
            double diameter = 0;
            for (int i = 1; i <= k; i++)
                for (int j = 0; j < k; j++)
                    diameter = Math.Max(diameter, Math.Abs(pts[order[i]][j] - pts[best][j]));
            if (double.IsFinite(val[best]) && spread <= fTolerance * (1 + Math.Abs(val[best])) && diameter <= xTolerance * (1 + MaxAbs(pts[best])))
                return new MinimumFound((double[])pts[best].Clone(), val[best], true, evals);
            if (evals >= maxEvaluations)
                return new MinimumFound((double[])pts[best].Clone(), val[best], false, evals);

            Array.Clear(centroid);
            for (int i = 0; i < k; i++)
                for (int j = 0; j < k; j++) centroid[j] += pts[order[i]][j] / k;
            double[] Along(double t) { var p = new double[k]; for (int j = 0; j < k; j++) p[j] = centroid[j] + t * (pts[worst][j] - centroid[j]); return Clamp(p); }

            var r = Along(-1); double fr = F(r);
            if (fr < val[best])
            {
                var e = Along(-2); double fe = F(e);
                if (fe < fr) { pts[worst] = e; val[worst] = fe; } else { pts[worst] = r; val[worst] = fr; }
            }
            else if (fr < val[second]) { pts[worst] = r; val[worst] = fr; }
            else
            {
                var c = fr < val[worst] ? Along(-0.5) : Along(0.5);
                double fc = F(c);
                if (fc < Math.Min(fr, val[worst])) { pts[worst] = c; val[worst] = fc; }
                else
                {
                    for (int i = 1; i <= k; i++)
                    {
                        int idx = order[i];
                        for (int j = 0; j < k; j++) pts[idx][j] = pts[best][j] + 0.5 * (pts[idx][j] - pts[best][j]);
                        val[idx] = F(pts[idx]);
                    }
                }
            }
        }
    }

    private static double MaxAbs(double[] x) { double m = 0; foreach (double v in x) m = Math.Max(m, Math.Abs(v)); return m; }
}
