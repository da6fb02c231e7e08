namespace PairFit.Core.Dependence;

/// <summary>Empirical tail dependence λ_L(t), λ_U(t) at a threshold t, computed on pseudo-observations.</summary>
/// <param name="Thresholds">The thresholds t, in (0, 1).</param>
/// <param name="Lower">λ_L(t) = #{u ≤ t, v ≤ t}/(n·t).</param>
/// <param name="Upper">λ_U(t) = #{u &gt; t, v &gt; t}/(n·(1 − t)).</param>
public sealed record TailDependenceCurve(double[] Thresholds, double[] Lower, double[] Upper);

/// <summary>
/// Empirical tail dependence. With the empirical copula C_n of the pseudo-observations
/// u_i = R_i/(n + 1), v_i = S_i/(n + 1): λ_L(t) = C_n(t, t)/t and λ_U(t) = (1 − 2t + C_n(t, t))/(1 − t),
/// the finite-t versions of λ_L = lim_{t→0} C(t, t)/t and λ_U = lim_{t→1} (1 − 2t + C(t, t))/(1 − t)
/// (Joe 1997, sec. 2.1.10; Nelsen 2006, sec. 5.4). Counted directly (joint exceedances), so no
/// cancellation in 1 − 2t + C_n.
/// </summary>
public static class TailDependence
{
    /// <summary>
    /// Number of upper (and lower) order statistics used by the single-number estimates:
    /// k = ⌊√n⌋, a common-practice balance between bias (large k) and variance (small k).
    /// </summary>
    public static int DefaultK(int n) => Math.Max(1, (int)Math.Floor(Math.Sqrt(n)));

    /// <summary>
    /// λ_L(t) and λ_U(t) of the pseudo-observations (u, v) at every threshold of the grid. Sorting
    /// max(u, v) and min(u, v) once makes each threshold a binary search: O((n + g) log n).
    /// </summary>
    public static TailDependenceCurve Curve(ReadOnlySpan<double> u, ReadOnlySpan<double> v, ReadOnlySpan<double> thresholds)
    {
        var (larger, smaller) = SortedMaxMin(u, v);
        int n = larger.Length;
        int g = thresholds.Length;
        var ts = thresholds.ToArray();
        var lower = new double[g];
        var upper = new double[g];
        for (int k = 0; k < g; k++)
        {
            double t = ts[k];
            var (below, above) = JointCounts(larger, smaller, t);
            lower[k] = below / (n * t);
            upper[k] = above / (n * (1 - t));
        }
        return new TailDependenceCurve(ts, lower, upper);
    }

    /// <summary>max(u, v) and min(u, v) of each pair, each sorted ascending.</summary>
    private static (double[] Larger, double[] Smaller) SortedMaxMin(ReadOnlySpan<double> u, ReadOnlySpan<double> v)
    {
        if (u.Length != v.Length) throw new ArgumentException($"u has {u.Length} values and v has {v.Length}; tail dependence needs pairs.");
        int n = u.Length;
        if (n == 0) throw new ArgumentException("tail dependence needs at least one pair.");
        var larger = new double[n];
        var smaller = new double[n];
        for (int i = 0; i < n; i++)
        {
            larger[i] = Math.Max(u[i], v[i]);
            smaller[i] = Math.Min(u[i], v[i]);
        }
        RadixSort.Sort(larger, "pseudo-observation");
        RadixSort.Sort(smaller, "pseudo-observation");
        return (larger, smaller);
    }

    /// <summary>#{u ≤ t, v ≤ t} and #{u &gt; t, v &gt; t}: u ≤ t and v ≤ t ⇔ max(u, v) ≤ t; u &gt; t and v &gt; t ⇔ min(u, v) &gt; t.</summary>
    private static (int Below, int Above) JointCounts(double[] sortedLarger, double[] sortedSmaller, double t)
    {
        if (!(t > 0 && t < 1)) throw new ArgumentOutOfRangeException(nameof(t), $"threshold {t} is not inside (0, 1).");
        return (CountAtMost(sortedLarger, t), sortedSmaller.Length - CountAtMost(sortedSmaller, t));
    }

    /// <summary>The curve of a paired sample on its own pseudo-observations.</summary>
    public static TailDependenceCurve Curve(ReadOnlySpan<double> x, ReadOnlySpan<double> y, int gridPoints)
    {
        if (gridPoints < 1) throw new ArgumentOutOfRangeException(nameof(gridPoints), "need at least one grid point.");
        var grid = new double[gridPoints];
        for (int i = 0; i < gridPoints; i++) grid[i] = (i + 1.0) / (gridPoints + 1);
        return Curve(Ranks.PseudoObservations(x), Ranks.PseudoObservations(y), grid);
    }

    /// <summary>
    /// Single-number estimates: λ_L at t = k/n and λ_U at t = 1 − k/n, k = <see cref="DefaultK"/>(n).
    /// Without ties these equal (number of observations among the k smallest in both variables)/k
    /// and (number among the k largest in both)/k.
    /// </summary>
    public static (double Lower, double Upper, double UpperThreshold, int K) Estimate(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
        => EstimateFromPseudoObservations(Ranks.PseudoObservations(x), Ranks.PseudoObservations(y));

    /// <summary><see cref="Estimate"/> on pseudo-observations already computed (u = rank/(n + 1)).</summary>
    public static (double Lower, double Upper, double UpperThreshold, int K) EstimateFromPseudoObservations(ReadOnlySpan<double> u, ReadOnlySpan<double> v)
    {
        int n = u.Length;
        int k = DefaultK(n);
        if (k >= n) k = n - 1;
        if (k < 1) throw new ArgumentException("tail dependence needs at least two pairs.");
        double tLow = (double)k / n, tHigh = 1 - (double)k / n;
        var (larger, smaller) = SortedMaxMin(u, v);
        // n·t = k exactly in theory; divide by the integer k so that a full count gives exactly 1.
        int below = JointCounts(larger, smaller, tLow).Below;
        int above = JointCounts(larger, smaller, tHigh).Above;
        return ((double)below / k, (double)above / k, tHigh, k);
    }

    /// <summary>Number of entries ≤ t in an ascending array (upper bound by binary search).</summary>
    private static int CountAtMost(double[] sorted, double t)
    {
        int lo = 0, hi = sorted.Length;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (sorted[mid] <= t) lo = mid + 1; else hi = mid;
        }
        return lo;
    }
}
