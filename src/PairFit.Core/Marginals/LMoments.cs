namespace PairFit.Core.Marginals;

/// <summary>
/// Sample L-moments λ1, λ2 and L-moment ratios τ3 (L-skewness), τ4 (L-kurtosis), from the
/// unbiased probability-weighted moments b_r (Hosking 1990, eq. 2.3; Hosking and Wallis 1997,
/// eqs. 2.4 and 2.9): b_r = n⁻¹ Σ_j [(j−1)…(j−r)] / [(n−1)…(n−r)] x_(j), l1 = b0,
/// l2 = 2b1 − b0, l3 = 6b2 − 6b1 + b0, l4 = 20b3 − 30b2 + 12b1 − b0.
/// </summary>
public sealed record LMoments(double L1, double L2, double T3, double T4)
{
    public static LMoments FromSorted(ReadOnlySpan<double> sorted)
    {
        int n = sorted.Length;
        if (n < 4) throw new ArgumentException("L-moments up to order 4 need at least 4 values", nameof(sorted));
        // Centre and scale first so that 1e300 or 1e-300 data neither overflow nor lose precision.
        double shift = sorted[n / 2];
        double scale = Math.Max(Math.Abs(sorted[0] - shift), Math.Abs(sorted[n - 1] - shift));
        if (!(scale > 0)) scale = 1.0;
        double b0 = 0, b1 = 0, b2 = 0, b3 = 0;
        double nm1 = n - 1, nm2 = n - 2, nm3 = n - 3;
        for (int i = 0; i < n; i++)
        {
            double x = (sorted[i] - shift) / scale;
            double j = i;           // j − 1 in the 1-based formula
            double w1 = j / nm1;
            double w2 = w1 * (j - 1) / nm2;
            double w3 = w2 * (j - 2) / nm3;
            b0 += x;
            b1 += w1 * x;
            b2 += w2 * x;
            b3 += w3 * x;
        }
        b0 /= n; b1 /= n; b2 /= n; b3 /= n;
        double l2 = 2 * b1 - b0;
        double l3 = 6 * b2 - 6 * b1 + b0;
        double l4 = 20 * b3 - 30 * b2 + 12 * b1 - b0;
        return new LMoments(shift + b0 * scale, l2 * scale, l2 > 0 ? l3 / l2 : double.NaN, l2 > 0 ? l4 / l2 : double.NaN);
    }
}
