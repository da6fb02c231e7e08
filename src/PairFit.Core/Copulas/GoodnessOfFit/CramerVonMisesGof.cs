using System.Diagnostics;
using PairFit.Core.Common;
using PairFit.Core.Copulas.Fitting;
using PairFit.Core.Copulas.Sampling;
using PairFit.Core.Dependence;
using PairFit.Core.Results;

namespace PairFit.Core.Copulas.GoodnessOfFit;

/// <summary>
/// Goodness of fit of a copula family by the Cramér–von Mises statistic
/// S_n = Σ_i (C_n(U_i, V_i) − C_θ̂(U_i, V_i))² (Genest, Rémillard and Beaudoin 2009, section 4, "S_n")
/// with the parametric-bootstrap p-value of their Appendix A: each replicate draws n pairs from
/// C_θ̂, turns them into pseudo-observations, refits θ by maximum pseudo-likelihood and recomputes S_n.
/// </summary>
public static class CramerVonMisesGof
{
    /// <summary>Offset of the bootstrap's random streams, so they never coincide with the sampling streams of the same seed.</summary>
    private const long StreamBase = 0x60F0_0000_0000L;

    /// <summary>S_n of a fitted copula at the pseudo-observations (u, v).</summary>
    public static double Statistic(ICopula copula, ReadOnlySpan<double> u, ReadOnlySpan<double> v)
    {
        var empirical = EmpiricalCopula.AtSamplePoints(u, v);
        double s = 0;
        for (int i = 0; i < empirical.Length; i++)
        {
            double d = empirical[i] - copula.Cdf(u[i], v[i]);
            s += d * d;
        }
        return s;
    }

    /// <summary>
    /// S_n and its bootstrap p-value (1 + #{S*_b ≥ S_n})/(B + 1) (Davison and Hinkley 1997, eq. 4.11).
    /// <paramref name="fitted"/> must be the maximum pseudo-likelihood fit of <paramref name="family"/> to (u, v).
    /// Replicate b uses random stream b of <paramref name="seed"/>, so the answer does not depend on
    /// <paramref name="maxDegreeOfParallelism"/>.
    /// </summary>
    public static CopulaGof Test(ICopulaFamily family, ICopula fitted, double[] u, double[] v, int replicates, int seed,
        int? maxDegreeOfParallelism = null, IProgress<string>? progress = null, double[]? replicateStatistics = null)
    {
        if (replicates < 1) throw new ArgumentOutOfRangeException(nameof(replicates), "at least one replicate is needed.");
        int n = u.Length;
        double observed = Statistic(fitted, u, v);
        var stats = replicateStatistics ?? new double[replicates];
        var failed = new bool[replicates];
        int done = 0;
        var clock = Stopwatch.StartNew();
        long lastReport = 0;
        var reportLock = new object();
        string label = fitted.Rotation == 0 ? fitted.Family : $"{fitted.Family} {fitted.Rotation}°";

        var po = new ParallelOptions { MaxDegreeOfParallelism = maxDegreeOfParallelism ?? -1 };
        Parallel.For(0, replicates, po, () => (new double[n], new double[n]), (b, _, buffers) =>
        {
            var (su, sv) = buffers;
            try
            {
                CopulaSampler.Fill(fitted, RandomStreams.For(seed, StreamBase + b), su, sv);
                var pu = Ranks.PseudoObservations(su);
                var pv = Ranks.PseudoObservations(sv);
                var refit = CopulaMaximumLikelihood.Fit(family, fitted.Rotation, pu, pv, fitted.Parameters,
                    computeStandardErrors: false, maxDegreeOfParallelism: 1);
                stats[b] = Statistic(refit.Copula, pu, pv);
            }
            catch (Exception e) when (e is CopulaFitFailedException or ArgumentException)
            {
                failed[b] = true;
            }
            int finished = Interlocked.Increment(ref done);
            if (progress is not null && clock.ElapsedMilliseconds > 1500)
                lock (reportLock)
                    if (clock.ElapsedMilliseconds - lastReport > 1000 || finished == replicates)
                    {
                        lastReport = clock.ElapsedMilliseconds;
                        progress.Report($"goodness of fit {label}: {finished}/{replicates} bootstrap replicates");
                    }
            return buffers;
        }, _ => { });

        int used = 0, atLeast = 0, failures = 0;
        for (int b = 0; b < replicates; b++)
        {
            if (failed[b]) { failures++; stats[b] = double.NaN; continue; }
            used++;
            if (stats[b] >= observed) atLeast++;
        }
        if (used == 0)
            throw new PairFitAnalysisException($"goodness of fit of {label}: every bootstrap refit failed.");
        return new CopulaGof
        {
            Statistic = observed,
            PValue = (1.0 + atLeast) / (used + 1.0),
            Replicates = used,
            FailedReplicates = failures > 0 ? failures : null,
        };
    }
}
