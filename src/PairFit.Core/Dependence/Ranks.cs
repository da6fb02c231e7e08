namespace PairFit.Core.Dependence;

/// <summary>Ranks with ties averaged, and the pseudo-observations built from them.</summary>
public static class Ranks
{
    /// <summary>1-based ranks; tied values share the average of the ranks they occupy. NaN is refused (ArgumentException).</summary>
    public static double[] Average(ReadOnlySpan<double> values)
    {
        int n = values.Length;
        var order = RadixSort.Order(values, "value", out var keys);
        var ranks = new double[n];
        int start = 0;
        while (start < n)
        {
            int end = start + 1;
            while (end < n && keys[end] == keys[start]) end++;
            double r = 0.5 * (start + 1 + end); // average of ranks start+1 .. end
            for (int k = start; k < end; k++) ranks[order[k]] = r;
            start = end;
        }
        return ranks;
    }

    /// <summary>
    /// Pseudo-observations u_i = R_i/(n + 1) (Genest, Ghoudi and Rivest 1995): rank-based
    /// uniforms strictly inside (0, 1), so copula log densities stay finite at the edges.
    /// </summary>
    public static double[] PseudoObservations(ReadOnlySpan<double> values)
    {
        var r = Average(values);
        double scale = 1.0 / (values.Length + 1);
        for (int i = 0; i < r.Length; i++) r[i] *= scale;
        return r;
    }
}
