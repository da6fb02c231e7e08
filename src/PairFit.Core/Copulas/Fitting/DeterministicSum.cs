namespace PairFit.Core.Copulas.Fitting;

/// <summary>
/// Sums n terms in fixed chunks, on several threads for large n, adding the chunk sums in chunk
/// order: the result is bit-identical whatever the thread count.
/// </summary>
public static class DeterministicSum
{
    private const int Chunk = 16384;

    /// <param name="sumRange">Sum of the terms [start, end); −Infinity marks an infeasible point and wins.</param>
    public static double Over(int n, Func<int, int, double> sumRange, int? maxDegreeOfParallelism = null)
    {
        if (n <= 2 * Chunk || maxDegreeOfParallelism == 1) return sumRange(0, n);
        int chunks = (n + Chunk - 1) / Chunk;
        var partial = new double[chunks];
        var po = new ParallelOptions { MaxDegreeOfParallelism = maxDegreeOfParallelism ?? -1 };
        Parallel.For(0, chunks, po, k => partial[k] = sumRange(k * Chunk, Math.Min(n, (k + 1) * Chunk)));
        double s = 0;
        for (int k = 0; k < chunks; k++) s += partial[k];
        return s;
    }
}
