namespace PairFit.Core.Copulas.Fitting;

/// <summary>Σ log c(u_i, v_i), bit-identical whatever the thread count (see <see cref="DeterministicSum"/>).</summary>
public static class CopulaLogLikelihood
{
    /// <summary>The copula log-likelihood; −Infinity if any term is not finite (a parameter the data rule out).</summary>
    public static double Sum(ICopula copula, double[] u, double[] v, int? maxDegreeOfParallelism = null)
        => DeterministicSum.Over(u.Length, (start, end) =>
        {
            double s = 0;
            for (int i = start; i < end; i++)
            {
                double l = copula.LogDensity(u[i], v[i]);
                if (!double.IsFinite(l)) return double.NegativeInfinity;
                s += l;
            }
            return s;
        }, maxDegreeOfParallelism);
}
