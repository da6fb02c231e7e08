using System.Globalization;
using PairFit.Core.Common;
using PairFit.Core.Copulas.GoodnessOfFit;
using PairFit.Core.Data;
using PairFit.Core.Dependence;
using PairFit.Core.Marginals;
using PairFit.Core.Results;

namespace PairFit.Core.Copulas.Fitting;

/// <summary>
/// The copula stage of the pipeline: fit every candidate family and rotation, exclude those that
/// cannot represent the sign of the observed dependence, rank by AIC, test the fit.
/// </summary>
public static class CopulaAnalysis
{
    /// <summary>Fewer pairs than this leave the rank-based fit meaningless.</summary>
    public const int MinimumPairs = 10;

    /// <param name="sample">The paired data.</param>
    /// <param name="x">Fitted marginal of X: needed for "ifm" and as the start of "full"; may be null for "pseudo".</param>
    /// <param name="y">Fitted marginal of Y, likewise.</param>
    public static CopulaFitResult Fit(PairedSample sample, IMarginalDistribution? x, IMarginalDistribution? y, CopulaOptions options,
        IProgress<string>? progress = null)
    {
        ArgumentNullException.ThrowIfNull(sample);
        ArgumentNullException.ThrowIfNull(options);
        string method = (options.Method ?? CopulaOptions.PseudoMethod).ToLowerInvariant();
        if (!CopulaOptions.Methods.Contains(method))
            throw new PairFitInputException($"copula method '{options.Method}' is not one of {string.Join(", ", CopulaOptions.Methods)}.");
        if (method != CopulaOptions.PseudoMethod && (x is null || y is null))
            throw new PairFitInputException($"copula method '{method}' needs fitted marginals for both variables; fit them first or use method 'pseudo'.");
        if (options.GofReplicates < 0)
            throw new PairFitInputException($"goodness-of-fit replicates must be 0 (no test) or more (got {options.GofReplicates}).");
        int n = sample.Count;
        if (n < MinimumPairs)
            throw new PairFitInputException($"copula fitting needs at least {MinimumPairs} pairs; the sample has {n}.");

        var families = options.Families is null ? CopulaRegistry.Families : options.Families.Select(CopulaRegistry.Find).Distinct().ToList();
        if (families.Count == 0)
            throw new PairFitInputException("no copula family was asked for; name at least one.");

        double tau = KendallTau.TauB(sample.X, sample.Y);
        if (!double.IsFinite(tau))
            throw new PairFitAnalysisException($"Kendall's tau of {sample.XName} and {sample.YName} is undefined (a column is constant), so no copula can be fitted.");

        double[] pu = Ranks.PseudoObservations(sample.X), pv = Ranks.PseudoObservations(sample.Y);
        double[] u = pu, v = pv;
        if (method != CopulaOptions.PseudoMethod)
        {
            u = new double[n];
            v = new double[n];
            for (int i = 0; i < n; i++)
            {
                u[i] = MathExtras.ClampOpen(x!.Cdf(sample.X[i]));
                v[i] = MathExtras.ClampOpen(y!.Cdf(sample.Y[i]));
            }
        }

        var (plans, excluded) = PlanCandidates(families, tau);
        progress?.Report($"fitting {plans.Count} copula candidates ({method})");

        var fits = new FittedCandidate?[plans.Count];
        var failures = new string?[plans.Count];
        var po = new ParallelOptions { MaxDegreeOfParallelism = options.MaxDegreeOfParallelism ?? -1 };
        Parallel.For(0, plans.Count, po, i =>
        {
            var (family, rotation, start) = plans[i];
            try
            {
                var est = CopulaMaximumLikelihood.Fit(family, rotation, u, v, start, maxDegreeOfParallelism: options.MaxDegreeOfParallelism);
                IMarginalDistribution? fx = x, fy = y;
                int k = family.ParameterNames.Count;
                if (method == CopulaOptions.FullMethod)
                {
                    var joint = FullLikelihoodFit.Fit(sample, x!, y!, family, rotation, est, options.MaxDegreeOfParallelism);
                    est = joint.Copula;
                    fx = joint.X;
                    fy = joint.Y;
                    k = joint.ParameterCount;
                }
                fits[i] = new FittedCandidate(family, est, k, fx, fy);
            }
            catch (CopulaFitFailedException e)
            {
                failures[i] = "fit failed: " + e.Message;
            }
        });

        for (int i = 0; i < plans.Count; i++)
            if (failures[i] is { } reason)
                excluded.Add(new ExcludedCopula { Family = plans[i].Family.Name, Rotation = plans[i].Rotation, Reason = reason });

        var ranked = new List<(FittedCandidate Fit, CopulaCandidate Row)>();
        foreach (var f in fits)
        {
            if (f is null) continue;
            var row = ToCandidate(f, n, out string? problem);
            if (row is null)
                excluded.Add(new ExcludedCopula { Family = f.Family.Name, Rotation = f.Estimate.Copula.Rotation, Reason = problem! });
            else
                ranked.Add((f, row));
        }
        if (ranked.Count == 0)
            throw new PairFitAnalysisException("no copula candidate could be fitted: " + string.Join("; ", excluded.Select(e => $"{e.Family} {e.Rotation}: {e.Reason}")));

        // Converged fits first, each group by AIC; ties (equal AIC) keep registry order.
        ranked = ranked.Select((r, i) => (r, i))
            .OrderBy(t => t.r.Row.Converged ? 0 : 1).ThenBy(t => t.r.Row.Aic).ThenBy(t => t.i)
            .Select(t => t.r).ToList();

        if (options.GofReplicates > 0)
        {
            int testCount = options.GofAllFamilies ? ranked.Count : 1;
            for (int i = 0; i < testCount; i++)
            {
                var (fit, row) = ranked[i];
                var gof = GoodnessOfFit(fit, method, pu, pv, options, progress);
                ranked[i] = (fit, row with { Gof = gof });
            }
        }

        var candidates = ranked.Select(r => r.Row).ToList();
        var selected = ranked[0].Fit;
        var section = new CopulaSection
        {
            Method = method,
            EmpiricalKendallTau = tau,
            Selected = candidates[0],
            Candidates = candidates,
            Excluded = excluded.Count > 0 ? excluded : null,
        };
        return new CopulaFitResult
        {
            Selected = selected.Estimate.Copula,
            Section = section,
            Ranked = ranked.Select(r => r.Fit.Estimate.Copula).ToList(),
            X = selected.X,
            Y = selected.Y,
        };
    }

    /// <summary>
    /// Every family × rotation with its starting point from the Kendall-tau inversion; a rotation of
    /// a one-sided family whose unrotated version cannot reach the sign of the observed tau is excluded.
    /// </summary>
    public static (List<(ICopulaFamily Family, int Rotation, double[] Start)> Plans, List<ExcludedCopula> Excluded)
        PlanCandidates(IReadOnlyList<ICopulaFamily> families, double tau)
    {
        var plans = new List<(ICopulaFamily, int, double[])>();
        var excluded = new List<ExcludedCopula>();
        string sign = tau > 0 ? "positive" : tau < 0 ? "negative" : "zero";
        foreach (var family in families)
            foreach (int rotation in family.Rotations)
            {
                // 90° and 270° mirror one axis, so the unrotated family must reach −τ̂.
                double target = rotation is 90 or 270 ? -tau : tau;
                var start = family.StartFromTau(target);
                if (start is null)
                    excluded.Add(new ExcludedCopula
                    {
                        Family = family.Name,
                        Rotation = rotation,
                        Reason = string.Create(CultureInfo.InvariantCulture,
                            $"cannot represent {sign} dependence at rotation {rotation} (empirical Kendall's tau = {tau:0.####})"),
                    });
                else
                    plans.Add((family, rotation, start));
            }
        return (plans, excluded);
    }

    private sealed record FittedCandidate(ICopulaFamily Family, CopulaEstimate Estimate, int ParameterCount,
        IMarginalDistribution? X, IMarginalDistribution? Y);

    private static CopulaCandidate? ToCandidate(FittedCandidate f, int n, out string? problem)
    {
        var c = f.Estimate.Copula;
        double tau = c.KendallTau, lower = c.TailLower, upper = c.TailUpper, ll = f.Estimate.LogLikelihood;
        problem = null;
        if (!double.IsFinite(tau) || !double.IsFinite(lower) || !double.IsFinite(upper) || !double.IsFinite(ll))
        {
            problem = string.Create(CultureInfo.InvariantCulture,
                $"fitted at [{string.Join(", ", f.Estimate.Parameters)}] but its log-likelihood, Kendall's tau or tail dependence is not finite there");
            return null;
        }
        var names = f.Family.ParameterNames;
        var parameters = new Dictionary<string, double>(names.Count);
        var se = new Dictionary<string, double?>(names.Count);
        for (int i = 0; i < names.Count; i++)
        {
            parameters[names[i]] = f.Estimate.Parameters[i];
            se[names[i]] = f.Estimate.StandardErrors[i];
        }
        int k = f.ParameterCount;
        return new CopulaCandidate
        {
            Family = f.Family.Name,
            Rotation = c.Rotation,
            Parameters = parameters,
            StandardErrors = se,
            LogLikelihood = ll,
            Aic = 2 * k - 2 * ll,
            Bic = k * Math.Log(n) - 2 * ll,
            KendallTau = tau,
            TailLower = lower,
            TailUpper = upper,
            Converged = f.Estimate.Converged,
            Note = f.Estimate.Note,
        };
    }

    /// <summary>
    /// Above this many pairs the goodness-of-fit bootstrap runs on a random subsample: every
    /// replicate refits the family, so its cost grows with n × replicates, while the test's power
    /// at 10,000 pairs already detects misfits far smaller than the fit's own sampling error.
    /// </summary>
    public const int GofMaxPairs = 10_000;

    /// <summary>
    /// The bootstrap of Genest, Rémillard and Beaudoin (2009) is built on pseudo-observations and the
    /// rank-based estimator, so for "ifm" and "full" the family is first refitted by maximum
    /// pseudo-likelihood (from the candidate's estimate) and that fit is what S_n measures. The same
    /// refit is made on a subsample when the sample is larger than <see cref="GofMaxPairs"/>.
    /// </summary>
    private static CopulaGof GoodnessOfFit(FittedCandidate f, string method, double[] pu, double[] pv, CopulaOptions options,
        IProgress<string>? progress)
    {
        int n = pu.Length;
        bool subsample = n > GofMaxPairs;
        if (subsample)
            (pu, pv) = Subsample(pu, pv, GofMaxPairs, options.Seed);
        var fitted = method == CopulaOptions.PseudoMethod && !subsample
            ? f.Estimate.Copula
            : CopulaMaximumLikelihood.Fit(f.Family, f.Estimate.Copula.Rotation, pu, pv, f.Estimate.Parameters, computeStandardErrors: false,
                maxDegreeOfParallelism: options.MaxDegreeOfParallelism).Copula;
        var gof = CramerVonMisesGof.Test(f.Family, fitted, pu, pv, options.GofReplicates, options.Seed, options.MaxDegreeOfParallelism, progress);
        return subsample
            ? gof with
            {
                SubsamplePairs = GofMaxPairs,
                Note = $"tested on a random subsample of {GofMaxPairs:N0} of the {n:N0} pairs (seeded), refitted there by pseudo-likelihood",
            }
            : gof;
    }

    /// <summary>A seeded random subsample of m pairs (partial Fisher–Yates), turned into fresh pseudo-observations.</summary>
    private static (double[] U, double[] V) Subsample(double[] u, double[] v, int m, int seed)
    {
        int n = u.Length;
        var index = new int[n];
        for (int i = 0; i < n; i++) index[i] = i;
        var rng = RandomStreams.For(seed, -1);
        double[] su = new double[m], sv = new double[m];
        for (int i = 0; i < m; i++)
        {
            int j = i + rng.Next(n - i);
            (index[i], index[j]) = (index[j], index[i]);
            su[i] = u[index[i]];
            sv[i] = v[index[i]];
        }
        return (Ranks.PseudoObservations(su), Ranks.PseudoObservations(sv));
    }
}
