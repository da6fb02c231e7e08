using PairFit.Core.Results;

namespace PairFit.Core.Projection;

/// <summary>
/// Summaries of a sorted sample of Q: Monte Carlo draws, the comonotonic grid or the data.
/// Hot loops are plain loops over the sorted array.
/// </summary>
public static class SampleStatistics
{
    /// <summary>z of the two-sided 95 % normal interval.</summary>
    private const double Z95 = 1.959963984540054;

    /// <summary>Sorted finite values and the number of NaN values dropped.</summary>
    public static (double[] Sorted, int Undefined) SortFinite(ReadOnlySpan<double> values)
    {
        var kept = new double[values.Length];
        int n = 0;
        for (int i = 0; i < values.Length; i++)
            if (!double.IsNaN(values[i])) kept[n++] = values[i];
        Array.Resize(ref kept, n);
        Array.Sort(kept);
        return (kept, values.Length - n);
    }

    /// <summary>
    /// Inverse of the empirical CDF, x_(⌈np⌉) (Hyndman and Fan 1996, definition 1), with the
    /// distribution-free 95 % interval [x_(j), x_(k)] for the p-quantile from the binomial law of
    /// the number of draws below it, ranks by the normal approximation j, k = np ∓ 1.96 √(np(1−p))
    /// (Conover 1999, ch. 3; David and Nagaraja 2003, ch. 7; chapter numbers from memory).
    /// </summary>
    public static QuantileValue OrderStatisticQuantile(double[] sorted, double p, bool withInterval)
    {
        int n = sorted.Length;
        if (n == 0) return new QuantileValue { P = p };
        int rank = Math.Clamp((int)Math.Ceiling(n * p - 1e-9), 1, n);
        if (!withInterval) return new QuantileValue { P = p, Value = sorted[rank - 1] };
        double half = Z95 * Math.Sqrt(n * p * (1 - p));
        int j = (int)Math.Floor(n * p - half), k = (int)Math.Ceiling(n * p + half) + 1;
        return new QuantileValue
        {
            P = p,
            Value = sorted[rank - 1],
            Lower = j >= 1 ? sorted[j - 1] : null,
            Upper = k <= n ? sorted[k - 1] : null,
        };
    }

    /// <summary>Linear interpolation between order statistics (Hyndman and Fan 1996, definition 7), for small data samples.</summary>
    public static double InterpolatedQuantile(double[] sorted, double p)
    {
        int n = sorted.Length;
        if (n == 1) return sorted[0];
        double h = (n - 1) * p;
        int lo = (int)Math.Floor(h);
        if (lo >= n - 1) return sorted[n - 1];
        return sorted[lo] + (h - lo) * (sorted[lo + 1] - sorted[lo]);
    }

    /// <summary>Mean and sample standard deviation (n − 1), by Welford's one-pass update (Welford 1962).</summary>
    public static (double Mean, double Sd) MeanAndSd(double[] values)
    {
        double mean = 0, m2 = 0;
        for (int i = 0; i < values.Length; i++)
        {
            double d = values[i] - mean;
            mean += d / (i + 1);
            m2 += d * (values[i] - mean);
        }
        return (mean, values.Length > 1 ? Math.Sqrt(m2 / (values.Length - 1)) : double.NaN);
    }

    /// <summary>Fraction of the sample strictly above t (binary search in the sorted sample).</summary>
    public static double FractionAbove(double[] sorted, double t)
    {
        int lo = 0, hi = sorted.Length;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (sorted[mid] <= t) lo = mid + 1; else hi = mid;
        }
        return (double)(sorted.Length - lo) / sorted.Length;
    }

    /// <summary>
    /// Tail value-at-risk of the sample's own distribution, (1/(1−α)) ∫_α^1 F_n⁻¹(p) dp: the mean
    /// of the top n(1−α) values, the boundary value weighted by its fractional share
    /// (Acerbi and Tasche 2002).
    /// </summary>
    public static double TailMean(double[] sorted, double level)
    {
        int n = sorted.Length;
        double share = n * (1 - level);
        if (share <= 0) return sorted[n - 1];
        int whole = (int)Math.Floor(share);
        double sum = 0;
        for (int i = n - whole; i < n; i++) sum += sorted[i];
        double frac = share - whole;
        if (frac > 0 && n - whole - 1 >= 0) sum += frac * sorted[n - whole - 1];
        return sum / share;
    }

    /// <summary>
    /// Gaussian kernel density on an even grid with Silverman's rule-of-thumb bandwidth
    /// h = 0.9 min(sd, IQR/1.34) n^(−1/5) (Silverman 1986, eq. 3.31), computed by linear binning
    /// onto the grid and a discrete convolution (Wand and Jones 1995, binned kernel estimators; from memory), which costs
    /// O(n + G·K) instead of O(n·G).
    /// </summary>
    public static (double[] Density, double Bandwidth) KernelDensity(double[] sorted, double[] grid, double sd)
    {
        int n = sorted.Length, g = grid.Length;
        double iqr = InterpolatedQuantile(sorted, 0.75) - InterpolatedQuantile(sorted, 0.25);
        double spread = Math.Min(double.IsFinite(sd) && sd > 0 ? sd : double.PositiveInfinity, iqr > 0 ? iqr / 1.34 : double.PositiveInfinity);
        if (!double.IsFinite(spread)) spread = Math.Max(Math.Abs(sorted[n / 2]), 1.0) * 1e-3;
        double h = 0.9 * spread * Math.Pow(n, -0.2);
        double step = (grid[^1] - grid[0]) / (g - 1);
        var counts = new double[g];
        for (int i = 0; i < n; i++)
        {
            double pos = (sorted[i] - grid[0]) / step;
            if (pos < 0 || pos > g - 1) continue;
            int k = Math.Min((int)pos, g - 2);
            double w = pos - k;
            counts[k] += 1 - w;
            counts[k + 1] += w;
        }
        int reach = (int)Math.Ceiling(5 * h / step);
        reach = Math.Min(reach, g - 1);
        var kernel = new double[reach + 1];
        for (int d = 0; d <= reach; d++)
        {
            double z = d * step / h;
            kernel[d] = Math.Exp(-0.5 * z * z) / (h * Math.Sqrt(2 * Math.PI) * n);
        }
        var density = new double[g];
        for (int k = 0; k < g; k++)
        {
            if (counts[k] == 0) continue;
            int from = Math.Max(0, k - reach), to = Math.Min(g - 1, k + reach);
            for (int j = from; j <= to; j++) density[j] += counts[k] * kernel[Math.Abs(j - k)];
        }
        return (density, h);
    }

    /// <summary>
    /// Tail index estimate from two upper (or lower) quantiles at exceedance probabilities
    /// p1 &gt; p2: α ≈ ln(p1/p2) / ln(d2/d1), d the distance from the median. For a law with
    /// P(|Q| &gt; t) ~ t^(−α) this tends to α; light tails give large values. Moments of order
    /// ≥ α do not exist (a regular-variation argument; Embrechts, Klüppelberg and Mikosch 1997; from memory).
    /// </summary>
    public static double TailIndex(double p1, double p2, double d1, double d2)
    {
        if (!(d1 > 0) || !(d2 > d1)) return double.PositiveInfinity;
        return Math.Log(p1 / p2) / Math.Log(d2 / d1);
    }
}
