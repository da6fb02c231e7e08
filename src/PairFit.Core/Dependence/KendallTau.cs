namespace PairFit.Core.Dependence;

/// <summary>Kendall's tau-b (ties corrected), its null variance and a jackknife standard error, all in O(n log n).</summary>
public static class KendallTau
{
    /// <summary>
    /// Kendall's tau-b = (n_c − n_d)/√((n0 − n1)(n0 − n2)) (Kendall 1945), with n0 = n(n − 1)/2
    /// and n1, n2 the pairs tied in x and in y. NaN when either input is constant (undefined).
    /// </summary>
    public static double TauB(ReadOnlySpan<double> x, ReadOnlySpan<double> y) => Count(x, y).TauB;

    /// <summary>
    /// Pair counts by Knight's (1966) merge-sort algorithm: sort the pairs by (x, y), then count
    /// the exchanges a merge sort of y needs, which are exactly the discordant pairs; ties in x,
    /// in y and in both are counted from runs of the sorted sequences. O(n log n) time, O(n) memory.
    /// </summary>
    public static KendallCounts Count(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        if (x.Length != y.Length) throw new ArgumentException($"x has {x.Length} values and y has {y.Length}; Kendall's tau needs pairs.");
        int n = x.Length;
        // Order-preserving integer keys: equal keys ⇔ equal values, and a radix sort instead of a comparison sort.
        var xs = RadixSort.Keys(x, "x value");
        var ys = RadixSort.Keys(y, "y value");
        RadixSort.SortPairs(xs, ys); // lexicographic by (x, y)

        var xTies = new TieSums();
        long jointTiedPairs = 0;
        for (int start = 0; start < n;)
        {
            int end = start + 1;
            while (end < n && xs[end] == xs[start]) end++;
            if (end - start > 1)
            {
                xTies.Add(end - start);
                for (int s = start; s < end;) // y is sorted inside the run: runs of equal y are joint ties
                {
                    int e = s + 1;
                    while (e < end && ys[e] == ys[s]) e++;
                    long u = e - s;
                    jointTiedPairs += u * (u - 1) / 2;
                    s = e;
                }
            }
            start = end;
        }

        long discordant = MergeSortCountingExchanges(ys);

        var yTies = new TieSums();
        for (int start = 0; start < n;)
        {
            int end = start + 1;
            while (end < n && ys[end] == ys[start]) end++;
            if (end - start > 1) yTies.Add(end - start);
            start = end;
        }

        long totalPairs = (long)n * (n - 1) / 2;
        // n_c = n0 − n_d − n1 − n2 + n3 (pairs tied in both are inside n1 and n2), so
        // S = n_c − n_d = n0 − n1 − n2 + n3 − 2 n_d.
        long score = totalPairs - xTies.Pairs - yTies.Pairs + jointTiedPairs - 2 * discordant;
        return new KendallCounts(n, score, totalPairs, xTies, yTies, jointTiedPairs);
    }

    /// <summary>
    /// Bottom-up merge sort of <paramref name="a"/> that returns the number of pairs i &lt; j with
    /// a[i] &gt; a[j] (strict: equal values are not exchanges).
    /// </summary>
    private static long MergeSortCountingExchanges(ulong[] a)
    {
        int n = a.Length;
        long exchanges = 0;
        // Insertion sort on short blocks first: cheaper than merging single elements.
        const int block = 16;
        for (int lo = 0; lo < n; lo += block)
        {
            int hi = Math.Min(lo + block, n);
            for (int i = lo + 1; i < hi; i++)
            {
                ulong v = a[i];
                int j = i - 1;
                while (j >= lo && a[j] > v) { a[j + 1] = a[j]; j--; }
                a[j + 1] = v;
                exchanges += i - 1 - j;
            }
        }

        var src = a;
        var dst = new ulong[n];
        for (int width = block; width < n; width *= 2)
        {
            for (int lo = 0; lo < n; lo += 2 * width)
            {
                int mid = Math.Min(lo + width, n), hi = Math.Min(lo + 2 * width, n);
                int i = lo, j = mid, k = lo;
                while (i < mid && j < hi)
                {
                    if (src[j] < src[i])
                    {
                        exchanges += mid - i; // src[j] jumps over every remaining left element
                        dst[k++] = src[j++];
                    }
                    else dst[k++] = src[i++];
                }
                while (i < mid) dst[k++] = src[i++];
                while (j < hi) dst[k++] = src[j++];
            }
            (src, dst) = (dst, src);
        }
        if (!ReferenceEquals(src, a)) Array.Copy(src, a, n);
        return exchanges;
    }

    /// <summary>
    /// Per-observation concordance scores C_i = Σ_j sign(x_i − x_j)·sign(y_i − y_j), and for each
    /// i the sizes of its tie groups in x and in y. Computed with a Fenwick tree over y ranks in
    /// two sweeps over x (below and above), O(n log n). Σ C_i = 2S.
    /// </summary>
    internal static (long[] Score, int[] XGroup, int[] YGroup) ConcordanceScores(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        int n = x.Length;
        var yRank = DenseRanks(y, out int levels, out var yGroup);
        var order = RadixSort.Order(x, "x value", out var xKeys);
        var xGroup = new int[n];
        var score = new long[n];
        var tree = new int[levels + 1];

        // Sweep up in x: points already inserted have strictly smaller x.
        int inserted = 0;
        for (int start = 0; start < n;)
        {
            int end = start + 1;
            while (end < n && xKeys[end] == xKeys[start]) end++;
            for (int k = start; k < end; k++)
            {
                int i = order[k];
                xGroup[i] = end - start;
                int below = Prefix(tree, yRank[i] - 1), notAbove = Prefix(tree, yRank[i]);
                score[i] += below - (inserted - notAbove);
            }
            for (int k = start; k < end; k++) Add(tree, yRank[order[k]]);
            inserted += end - start;
            start = end;
        }

        // Sweep down in x: points already inserted have strictly larger x.
        Array.Clear(tree);
        inserted = 0;
        for (int end = n; end > 0;)
        {
            int start = end - 1;
            while (start > 0 && xKeys[start - 1] == xKeys[end - 1]) start--;
            for (int k = start; k < end; k++)
            {
                int i = order[k];
                int below = Prefix(tree, yRank[i] - 1), notAbove = Prefix(tree, yRank[i]);
                score[i] += (inserted - notAbove) - below;
            }
            for (int k = start; k < end; k++) Add(tree, yRank[order[k]]);
            inserted += end - start;
            end = start;
        }
        return (score, xGroup, yGroup);

        static int Prefix(int[] t, int r) { int s = 0; for (; r > 0; r -= r & -r) s += t[r]; return s; }
        static void Add(int[] t, int r) { for (; r < t.Length; r += r & -r) t[r]++; }
    }

    /// <summary>1-based dense ranks (tied values share a rank) and each value's tie-group size.</summary>
    private static int[] DenseRanks(ReadOnlySpan<double> values, out int levels, out int[] groupSize)
    {
        int n = values.Length;
        var order = RadixSort.Order(values, "y value", out var keys);
        var rank = new int[n];
        groupSize = new int[n];
        levels = 0;
        for (int start = 0; start < n;)
        {
            int end = start + 1;
            while (end < n && keys[end] == keys[start]) end++;
            levels++;
            for (int k = start; k < end; k++) { rank[order[k]] = levels; groupSize[order[k]] = end - start; }
            start = end;
        }
        return rank;
    }

    /// <summary>
    /// Jackknife (Quenouille 1956; Tukey 1958) standard error of tau-b: the n leave-one-out
    /// estimates follow exactly from the concordance scores, τ_(−i) = (S − C_i)/√((n0' − n1 + g_x,i − 1)(n0' − n2 + g_y,i − 1))
    /// with n0' = (n − 1)(n − 2)/2 and g the tie-group sizes of observation i, so the whole
    /// jackknife costs O(n log n). SE² = (n − 1)/n · Σ (τ_(−i) − τ̄)². Null when some
    /// leave-one-out sample is constant (the jackknife is then undefined).
    /// </summary>
    public static double? JackknifeStandardError(ReadOnlySpan<double> x, ReadOnlySpan<double> y, KendallCounts counts)
    {
        int n = counts.N;
        if (n < 3) return null;
        var (score, xGroup, yGroup) = ConcordanceScores(x, y);
        double pairsWithout = (double)(n - 1) * (n - 2) / 2;
        double mean = 0;
        for (int i = 0; i < n; i++)
        {
            double t = LeaveOut(i);
            if (double.IsNaN(t)) return null;
            mean += t;
        }
        mean /= n;
        double ss = 0;
        for (int i = 0; i < n; i++) { double d = LeaveOut(i) - mean; ss += d * d; }
        return Math.Sqrt((n - 1.0) / n * ss);

        // τ_(−i), recomputed rather than stored (saves n doubles at n = 10^6); NaN when undefined.
        double LeaveOut(int i)
        {
            double dx = pairsWithout - counts.XTies.Pairs + (xGroup[i] - 1);
            double dy = pairsWithout - counts.YTies.Pairs + (yGroup[i] - 1);
            return dx > 0 && dy > 0 ? (counts.S - score[i]) / Math.Sqrt(dx * dy) : double.NaN;
        }
    }
    /// <summary>Largest n for which the exact null distribution is used whenever there are no ties.</summary>
    public const int ExactPValueMaxN = 33;

    /// <summary>
    /// Two-sided p-value of tau against independence. Exact when neither variable has ties and
    /// n ≤ <see cref="ExactPValueMaxN"/> (or the sample is within one exchange of perfect
    /// (dis)agreement, where the tail holds only a handful of permutations): the permutation
    /// distribution of the number of discordant pairs (Kendall 1970, ch. 5), by the recursion
    /// P_j(k) = (1/j) Σ_{i=0}^{j−1} P_{j−1}(k − i). Otherwise the normal approximation with the
    /// tie-corrected variance <see cref="KendallCounts.NullVarianceOfS"/>. (The same rule as
    /// SciPy's kendalltau with method 'auto'.) NaN when undefined (n &lt; 3 or a constant variable).
    /// </summary>
    public static double PValue(KendallCounts counts, out bool exact)
    {
        exact = false;
        int n = counts.N;
        if (n < 3 || counts.XTies.Pairs == counts.TotalPairs || counts.YTies.Pairs == counts.TotalPairs) return double.NaN;
        long fewer = (counts.TotalPairs - Math.Abs(counts.S)) / 2; // min(n_c, n_d) when there are no ties
        if (counts.XTies.Pairs == 0 && counts.YTies.Pairs == 0 && (n <= ExactPValueMaxN || fewer <= 1))
        {
            exact = true;
            return Math.Min(1.0, 2 * ExactLowerTail(n, fewer));
        }
        double variance = counts.NullVarianceOfS;
        return variance > 0 ? CorrelationInference.NormalPValue(counts.S / Math.Sqrt(variance)) : double.NaN;
    }

    /// <summary>P(D ≤ c) for the number D of inversions of a uniformly random permutation of n items.</summary>
    private static double ExactLowerTail(int n, long c)
    {
        // p[k] = P_j(k) for k ≤ c; built up from j = 1 (p = [1]); the j-th step is a moving sum of width j.
        var p = new double[c + 1];
        var cumulative = new double[c + 1];
        p[0] = 1;
        for (int j = 2; j <= n; j++)
        {
            double sum = 0;
            for (long k = 0; k <= c; k++) { sum += p[k]; cumulative[k] = sum; }
            for (long k = 0; k <= c; k++)
                p[k] = (cumulative[k] - (k - j >= 0 ? cumulative[k - j] : 0)) / j;
        }
        double tail = 0;
        foreach (double v in p) tail += v;
        return tail;
    }
}

/// <summary>Sums over the tie groups of one variable, as Kendall's (1970) tie corrections need them.</summary>
public struct TieSums
{
    /// <summary>Σ t(t − 1)/2: pairs tied in this variable.</summary>
    public long Pairs { get; private set; }
    /// <summary>Σ t(t − 1)(t − 2).</summary>
    public double Cubic { get; private set; }
    /// <summary>Σ t(t − 1)(2t + 5).</summary>
    public double VarianceTerm { get; private set; }

    public void Add(long t)
    {
        Pairs += t * (t - 1) / 2;
        Cubic += (double)t * (t - 1) * (t - 2);
        VarianceTerm += (double)t * (t - 1) * (2 * t + 5);
    }
}

/// <summary>The pair counts behind Kendall's tau for n observations.</summary>
public readonly record struct KendallCounts(int N, long S, long TotalPairs, TieSums XTies, TieSums YTies, long JointTiedPairs)
{
    /// <summary>tau-b; NaN when all pairs are tied in x or in y (a constant variable).</summary>
    public double TauB
    {
        get
        {
            double dx = TotalPairs - XTies.Pairs, dy = TotalPairs - YTies.Pairs;
            if (dx <= 0 || dy <= 0) return double.NaN;
            return Math.Clamp(S / Math.Sqrt(dx * dy), -1.0, 1.0);
        }
    }

    /// <summary>
    /// Variance of S = n_c − n_d under independence with ties in both variables (Kendall 1970,
    /// Rank Correlation Methods, eq. 4.3): [n(n−1)(2n+5) − Σt(t−1)(2t+5) − Σu(u−1)(2u+5)]/18
    /// + Σt(t−1)(t−2)·Σu(u−1)(u−2)/(9n(n−1)(n−2)) + Σt(t−1)·Σu(u−1)/(2n(n−1)).
    /// </summary>
    public double NullVarianceOfS
    {
        get
        {
            double n = N, m = n * (n - 1);
            double xt = 2.0 * XTies.Pairs, yt = 2.0 * YTies.Pairs; // Σ t(t − 1)
            return (m * (2 * n + 5) - XTies.VarianceTerm - YTies.VarianceTerm) / 18
                + XTies.Cubic * YTies.Cubic / (9 * m * (n - 2))
                + xt * yt / (2 * m);
        }
    }
}
