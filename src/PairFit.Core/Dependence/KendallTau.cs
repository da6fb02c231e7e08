namespace PairFit.Core.Dependence;

/// <summary>Kendall's tau-b (ties corrected).</summary>
public static class KendallTau
{
    /// <summary>
    /// Kendall's tau-b = (n_c − n_d)/√((n0 − n1)(n0 − n2)). Placeholder O(n²) count; to be replaced
    /// by the O(n log n) merge-sort count with the same signature.
    /// </summary>
    public static double TauB(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        int n = x.Length;
        long s = 0, tx = 0, ty = 0;
        for (int i = 0; i < n; i++)
            for (int j = i + 1; j < n; j++)
            {
                int a = Math.Sign(x[i] - x[j]), b = Math.Sign(y[i] - y[j]);
                s += a * b;
                if (a == 0) tx++;
                if (b == 0) ty++;
            }
        double n0 = (double)n * (n - 1) / 2;
        return s / Math.Sqrt((n0 - tx) * (n0 - ty));
    }
}
