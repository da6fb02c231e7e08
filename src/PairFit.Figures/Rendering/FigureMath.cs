using MathNet.Numerics;
using MathNet.Numerics.Integration;
using PairFit.Core.Common;
using MathNet.Numerics.Distributions;
using PairFit.Core.Copulas;
using PairFit.Core.Marginals;
using PairFit.Core.Projection;

namespace PairFit.Figures.Rendering;

/// <summary>
/// The small computations behind the diagnostic figures: histogram bins, the empirical copula,
/// the tail-dependence function and the Kendall plot. Plain arrays, no LINQ, O(n log n) where it
/// is cheap to be.
/// </summary>
public static class FigureMath
{
    /// <summary>
    /// Histogram on a density scale with the Freedman–Diaconis bin width 2·IQR·n^(−1/3)
    /// (Freedman and Diaconis 1981), kept between 8 and 40 bins so small and heavy-tailed samples
    /// still give a readable picture. Returns the bin edges (count + 1) and the densities.
    /// </summary>
    public static (double[] Edges, double[] Density) Histogram(ReadOnlySpan<double> values)
    {
        int n = values.Length;
        double[] s = values.ToArray();
        Array.Sort(s);
        double lo = s[0], hi = s[^1];
        if (!(hi > lo)) { lo -= 0.5; hi += 0.5; }
        double iqr = SampleStatistics.InterpolatedQuantile(s, 0.75) - SampleStatistics.InterpolatedQuantile(s, 0.25);
        int bins = iqr > 0 ? (int)Math.Ceiling((hi - lo) / (2 * iqr * Math.Pow(n, -1.0 / 3))) : 10;
        bins = Math.Clamp(bins, 8, 40);
        double width = (hi - lo) / bins;
        var edges = new double[bins + 1];
        for (int k = 0; k <= bins; k++) edges[k] = lo + k * width;
        var density = new double[bins];
        for (int i = 0; i < n; i++)
        {
            int k = (int)((s[i] - lo) / width);
            density[Math.Clamp(k, 0, bins - 1)] += 1;
        }
        for (int k = 0; k < bins; k++) density[k] /= n * width;
        return (edges, density);
    }

    /// <summary>
    /// Empirical copula C_n(a, b) = (1/n) #{i : u_i ≤ a, v_i ≤ b} (Deheuvels 1979) on a square grid,
    /// result[i, j] = C_n(grid[i], grid[j]). Points are sorted by u once, so each grid row costs O(n).
    /// </summary>
    public static double[,] EmpiricalCopula(ReadOnlySpan<double> u, ReadOnlySpan<double> v, ReadOnlySpan<double> grid)
    {
        int n = u.Length, g = grid.Length;
        double[] us = u.ToArray(), vs = v.ToArray();
        Array.Sort(us, vs);
        var result = new double[g, g];
        var counts = new int[g];
        int next = 0;
        for (int i = 0; i < g; i++)
        {
            // add the points with u ≤ grid[i] to the per-b counts
            while (next < n && us[next] <= grid[i])
            {
                double vv = vs[next++];
                for (int j = 0; j < g; j++) if (vv <= grid[j]) counts[j]++;
            }
            for (int j = 0; j < g; j++) result[i, j] = counts[j] / (double)n;
        }
        return result;
    }

    /// <summary>
    /// The tail-dependence function of a copula C: λ(t) = C(t, t)/t for t ≤ ½ and
    /// (1 − 2t + C(t, t))/(1 − t) for t &gt; ½; its limits at 0 and 1 are the lower and upper tail
    /// dependence coefficients (Joe 1997, section 2.1.10; Nelsen 2006, Definition 5.4.1).
    /// </summary>
    public static double TailFunction(double t, double diagonal)
        => t <= 0.5 ? diagonal / t : (1 - 2 * t + diagonal) / (1 - t);

    /// <summary>λ(t) of the empirical copula at each t, with C_n(t, t) = (1/n) #{max(u_i, v_i) ≤ t}.</summary>
    public static double[] EmpiricalTailFunction(ReadOnlySpan<double> u, ReadOnlySpan<double> v, ReadOnlySpan<double> t)
    {
        int n = u.Length;
        var m = new double[n];
        for (int i = 0; i < n; i++) m[i] = Math.Max(u[i], v[i]);
        Array.Sort(m);
        var result = new double[t.Length];
        int k = 0;
        for (int j = 0; j < t.Length; j++) // t ascending
        {
            while (k < n && m[k] <= t[j]) k++;
            result[j] = TailFunction(t[j], k / (double)n);
        }
        return result;
    }

    public static double[] CopulaTailFunction(ICopula copula, ReadOnlySpan<double> t)
    {
        var result = new double[t.Length];
        for (int j = 0; j < t.Length; j++) result[j] = TailFunction(t[j], copula.Cdf(t[j], t[j]));
        return result;
    }

    /// <summary>
    /// Sorted Kendall-plot statistics H_(1) ≤ … ≤ H_(n) with H_i = #{j ≠ i : x_j &lt; x_i, y_j &lt; y_i}/(n − 1)
    /// (Genest and Boies 2003, section 2). O(n²): callers subsample large data.
    /// </summary>
    public static double[] KendallPlotH(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        int n = x.Length;
        var h = new double[n];
        for (int i = 0; i < n; i++)
        {
            int c = 0;
            double xi = x[i], yi = y[i];
            for (int j = 0; j < n; j++)
                if (x[j] < xi && y[j] < yi) c++;
            h[i] = c / (double)(n - 1);
        }
        Array.Sort(h);
        return h;
    }

    /// <summary>
    /// W_{i:n}, the expected i-th order statistic of H under independence (Genest and Boies 2003,
    /// eq. 1): W = ∫ w k0(w) b(K0(w)) dw with K0(w) = w − w ln w the law of H for independent pairs,
    /// k0 = −ln w its density and b the Beta(i, n − i + 1) density. With w = e^(−s) the integrand
    /// s e^(−2s) b(K0(e^(−s))) is smooth (in w it has a log singularity at 0, in p = K0(w) a
    /// square-root end point at 1), so a 128-point Gauss–Legendre rule over the Beta's mass
    /// (mean ± (12 sd + 30/(n + 1)), the lower end kept above 1e−8·mean) is accurate; dividing by the same rule's
    /// total mass cancels most of the remaining error.
    /// </summary>
    public static double[] KendallPlotW(int n)
    {
        var w = new double[n];
        const int order = 128;
        var rule = new GaussLegendreRule(-1, 1, order);
        for (int i = 1; i <= n; i++)
        {
            double a = i, b = n - i + 1;
            double mean = a / (a + b), sd = Math.Sqrt(a * b / ((a + b) * (a + b) * (a + b + 1)));
            // ±12 sd holds the mass of the central Betas; the extreme ones (i near 1 or n) have an
            // exponential tail, (1 − p)^n < 1e−12 needs p > 28/n, hence the extra 30/(n + 1)
            double reach = 12 * sd + 30.0 / (a + b);
            double pLo = Math.Max(mean - reach, 1e-8 * mean), pHi = Math.Min(1, mean + reach);
            double sLo = -Math.Log(K0Inverse(pHi)), sHi = -Math.Log(K0Inverse(pLo));
            double logNorm = -SpecialFunctions.BetaLn(a, b);
            double half = 0.5 * (sHi - sLo), mid = 0.5 * (sHi + sLo), sum = 0, mass = 0;
            for (int k = 0; k < order; k++)
            {
                double sk = mid + half * rule.Abscissas[k];
                double x = Math.Exp(-sk), p = x + x * sk; // K0(e^(−s)) = e^(−s)(1 + s)
                // b(p) k0(w) |dw/ds| = b(p) s e^(−s)
                double dens = Math.Exp(logNorm + (a - 1) * Math.Log(p) + (b - 1) * MathExtras.Log1P(-p) - sk) * sk;
                sum += rule.Weights[k] * dens * x;
                mass += rule.Weights[k] * dens;
            }
            w[i - 1] = sum / mass;
        }
        return w;
    }

    /// <summary>Solves w − w ln w = p for w in [0, 1] (K0 is increasing there) by bisection-safeguarded Newton.</summary>
    public static double K0Inverse(double p)
    {
        if (p <= 0) return 0;
        if (p >= 1) return 1;
        double lo = 0, hi = 1, w = p / 2;
        for (int it = 0; it < 100; it++)
        {
            double f = w - w * Math.Log(w) - p;
            if (f > 0) hi = w; else lo = w;
            double step = f / -Math.Log(w); // K0'(w) = −ln w
            double next = w - step;
            if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
            if (Math.Abs(next - w) < 1e-15 * Math.Max(w, 1e-300)) return next;
            w = next;
        }
        return w;
    }

    /// <summary>
    /// Pointwise band for the i-th smallest of n draws from <paramref name="dist"/>: F(X_(i)) = U_(i)
    /// follows Beta(i, n + 1 − i) (David and Nagaraja 2003, section 2.2), so its central
    /// <paramref name="level"/> interval mapped through the quantile function F⁻¹ bounds X_(i).
    /// </summary>
    public static (double Lower, double Upper) OrderStatisticBand(IMarginalDistribution dist, int n, int i, double level)
    {
        double tail = 0.5 * (1 - level);
        return (dist.Quantile(Beta.InvCDF(i, n + 1 - i, tail)), dist.Quantile(Beta.InvCDF(i, n + 1 - i, 1 - tail)));
    }

    /// <summary>n points evenly spread on (lo, hi) inclusive.</summary>
    public static double[] Grid(double lo, double hi, int n)
    {
        var g = new double[n];
        for (int i = 0; i < n; i++) g[i] = lo + (hi - lo) * i / (n - 1);
        return g;
    }
}
