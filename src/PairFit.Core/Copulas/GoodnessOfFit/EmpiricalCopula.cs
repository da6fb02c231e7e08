namespace PairFit.Core.Copulas.GoodnessOfFit;

/// <summary>
/// The empirical copula C_n(u, v) = (1/n) Σ_j 1(U_j ≤ u, V_j ≤ v) of pseudo-observations
/// (Deheuvels 1979; Genest, Rémillard and Beaudoin 2009, eq. 2).
/// </summary>
public static class EmpiricalCopula
{
    /// <summary>
    /// C_n at every sample point (U_i, V_i): a two-dimensional dominance count. Points are taken in
    /// increasing U, all points with the same U entered into a Fenwick tree over the ranks of V
    /// before any of them is queried (ties count as ≤), so the whole is O(n log n) instead of O(n²).
    /// </summary>
    public static double[] AtSamplePoints(ReadOnlySpan<double> u, ReadOnlySpan<double> v)
    {
        int n = u.Length;
        if (v.Length != n) throw new ArgumentException("u and v must have the same length.");
        var result = new double[n];
        if (n == 0) return result;

        // Dense 1-based rank of each V value: equal values share a rank.
        var vKeys = v.ToArray();
        var vOrder = new int[n];
        for (int i = 0; i < n; i++) vOrder[i] = i;
        Array.Sort(vKeys, vOrder);
        var vRank = new int[n];
        int dense = 0;
        for (int k = 0; k < n; k++)
        {
            if (k == 0 || vKeys[k] != vKeys[k - 1]) dense++;
            vRank[vOrder[k]] = dense;
        }

        var uKeys = u.ToArray();
        var uOrder = new int[n];
        for (int i = 0; i < n; i++) uOrder[i] = i;
        Array.Sort(uKeys, uOrder);

        var tree = new int[dense + 1];
        int start = 0;
        while (start < n)
        {
            int end = start + 1;
            while (end < n && uKeys[end] == uKeys[start]) end++;
            for (int k = start; k < end; k++)
                for (int r = vRank[uOrder[k]]; r <= dense; r += r & -r) tree[r]++;
            for (int k = start; k < end; k++)
            {
                int count = 0;
                for (int r = vRank[uOrder[k]]; r > 0; r -= r & -r) count += tree[r];
                result[uOrder[k]] = (double)count / n;
            }
            start = end;
        }
        return result;
    }
}
