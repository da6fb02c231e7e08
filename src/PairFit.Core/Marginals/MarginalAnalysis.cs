using System.Globalization;
using PairFit.Core.Common;
using PairFit.Core.Marginals.Fitting;
using PairFit.Core.Results;

namespace PairFit.Core.Marginals;

/// <summary>How to fit one variable's marginal.</summary>
public sealed record MarginalOptions
{
    /// <summary>Families to try; null = <see cref="MarginalRegistry.DefaultCandidates"/>. May include "empirical".</summary>
    public IReadOnlyList<string>? Candidates { get; init; }

    /// <summary>Fit only this family and select it (e.g. "gamma" or "empirical").</summary>
    public string? Forced { get; init; }

    /// <summary>
    /// "mle" (default) or "lmoments". L-moment estimates exist for gev, gumbel, pearson3 and
    /// genpareto; every other family stays maximum likelihood (its candidate says so).
    /// </summary>
    public string Method { get; init; } = MethodMle;

    /// <summary>Name used in error messages, e.g. the column name.</summary>
    public string? VariableName { get; init; }

    public const string MethodMle = "mle";
    public const string MethodLMoments = "lmoments";
}

/// <summary>The selected marginal, its results-file section, and every fitted candidate ranked by AIC.</summary>
public sealed record MarginalFitResult
{
    public required IMarginalDistribution Selected { get; init; }
    public required MarginalVariableSection Section { get; init; }

    /// <summary>Fitted parametric candidates with a finite AIC, lowest AIC first (plus the empirical law, last, if asked for).</summary>
    public required IReadOnlyList<IMarginalDistribution> Fitted { get; init; }
}

/// <summary>
/// Fits the candidate families to one variable, ranks them by AIC = 2k − 2 ln L (Akaike 1974) and
/// reports BIC = k ln n − 2 ln L (Schwarz 1978), standard errors and goodness of fit. Families are
/// fitted in parallel; each fit is sequential and deterministic, so results do not depend on the
/// number of threads.
/// </summary>
public static class MarginalAnalysis
{
    public const int MinimumSize = 5;

    public static MarginalFitResult Fit(double[] data, MarginalOptions options) => Fit(data.AsSpan(), options);

    public static MarginalFitResult Fit(ReadOnlySpan<double> data, MarginalOptions options)
    {
        string name = options.VariableName is { } v ? $"variable '{v}'" : "the variable";
        Validate(data, name);
        string method = (options.Method ?? MarginalOptions.MethodMle).ToLowerInvariant();
        if (method is not (MarginalOptions.MethodMle or MarginalOptions.MethodLMoments))
            throw new PairFitInputException($"marginal method '{options.Method}' is not known; use 'mle' or 'lmoments'.");

        var names = options.Forced is { } forced ? [forced] : options.Candidates ?? MarginalRegistry.DefaultCandidates;
        if (names.Count == 0) throw new PairFitInputException($"no marginal candidate families given for {name}; name at least one of: {string.Join(", ", MarginalRegistry.FamilyNames)}.");
        var families = new List<string>();
        foreach (var f in names)
        {
            string key = f.Trim().ToLowerInvariant();
            if (!MarginalRegistry.FamilyNames.Contains(key, StringComparer.OrdinalIgnoreCase))
                throw new PairFitInputException($"unknown marginal family '{f}' for {name}; choose from: {string.Join(", ", MarginalRegistry.FamilyNames)}.");
            if (!families.Contains(key)) families.Add(key);
        }

        var sample = new MarginalSample(data);
        var outcomes = new (MarginalCandidate Candidate, IMarginalDistribution? Distribution)[families.Count];
        Parallel.For(0, families.Count, i => outcomes[i] = FitOne(families[i], sample, method));

        // Ranking: finite AIC ascending (converged first), then the empirical law, failed, skipped.
        var ranked = outcomes
            .Select((o, i) => (o.Candidate, o.Distribution, Index: i))
            .OrderBy(o => Rank(o.Candidate, o.Distribution))
            .ThenBy(o => o.Candidate.Aic ?? double.PositiveInfinity)
            .ThenBy(o => o.Index)
            .ToList();
        double? bestAic = ranked.FirstOrDefault(o => o.Candidate.Aic is not null).Candidate?.Aic;
        var candidates = ranked.Select(o => o.Candidate.Aic is { } a && bestAic is { } b ? o.Candidate with { DeltaAic = a - b } : o.Candidate).ToList();

        (MarginalCandidate Candidate, IMarginalDistribution? Distribution, int Index) chosen;
        string because;
        if (options.Forced is not null)
        {
            chosen = ranked[0];
            if (chosen.Distribution is null)
                throw new PairFitInputException($"marginal family '{options.Forced}' cannot be used for {name}: {chosen.Candidate.SkippedBecause ?? chosen.Candidate.Note ?? "the fit failed"}.");
            because = "forced by the user";
        }
        else
        {
            chosen = ranked.FirstOrDefault(o => o.Distribution is not null);
            if (chosen.Distribution is null)
                throw new PairFitAnalysisException($"no marginal family could be fitted to {name}: " +
                    string.Join("; ", candidates.Select(c => $"{c.Family}: {c.SkippedBecause ?? c.Note ?? "failed"}")));
            because = chosen.Candidate.Aic is null ? "only usable candidate"
                : chosen.Candidate.Converged == true ? "lowest AIC" : "lowest AIC (its optimiser did not converge)";
        }

        return new MarginalFitResult
        {
            Selected = chosen.Distribution,
            Fitted = ranked.Where(o => o.Distribution is not null).Select(o => o.Distribution!).ToList(),
            Section = new MarginalVariableSection
            {
                Selected = chosen.Candidate.Family,
                Method = method,
                SelectedBecause = because,
                N = sample.N,
                Candidates = candidates,
                Warnings = SupportWarnings(chosen.Distribution, sample),
            },
        };
    }

    /// <summary>
    /// A three-parameter law (Pearson III, GEV, ...) fitted to non-negative data may still put
    /// probability below zero; simulations from it then give impossible negative depths or losses.
    /// Say so, with the amount, rather than let it pass unseen.
    /// </summary>
    private static IReadOnlyList<string>? SupportWarnings(IMarginalDistribution selected, MarginalSample sample)
    {
        if (sample.Min < 0) return null;
        double below = selected.Cdf(0.0);
        if (!(below > 1e-6)) return null;
        return [$"the selected {selected.Family} law puts probability {below.ToString("G3", CultureInfo.InvariantCulture)} below 0 although every value is non-negative; " +
                 "simulated or projected values can be negative: consider a family bounded at 0 (force one with --x-marginal / --y-marginal)."];
    }

    private static int Rank(MarginalCandidate c, IMarginalDistribution? d) =>
        d is null ? (c.SkippedBecause is not null ? 4 : 3)
        : c.Aic is null ? 2
        : c.Converged == true ? 0 : 1;

    private static void Validate(ReadOnlySpan<double> data, string name)
    {
        if (data.Length < MinimumSize)
            throw new PairFitInputException($"{name} has {data.Length} values; fitting a marginal distribution needs at least {MinimumSize}.");
        double first = data[0];
        bool allEqual = true;
        for (int i = 0; i < data.Length; i++)
        {
            if (!double.IsFinite(data[i]))
                throw new PairFitInputException($"{name} contains a non-finite value ({data[i].ToString(CultureInfo.InvariantCulture)}) at position {i + 1}; remove or fix it.");
            if (data[i] != first) allEqual = false;
        }
        if (allEqual)
            throw new PairFitInputException($"{name} has all {data.Length} values equal to {first.ToString("G6", CultureInfo.InvariantCulture)}; a constant has no continuous distribution to fit.");
    }

    private static (MarginalCandidate, IMarginalDistribution?) FitOne(string familyName, MarginalSample sample, string method)
    {
        if (familyName == EmpiricalDistribution.FamilyName)
        {
            var e = new EmpiricalDistribution(sample.Values);
            return (new MarginalCandidate
            {
                Family = familyName,
                Method = "empirical",
                Converged = true,
                Note = "rank-based: linear interpolation through the plotting positions i/(n+1); not ranked by AIC",
            }, e);
        }

        var family = MarginalRegistry.Find(familyName)!;
        if (family.SupportProblem(sample) is { } problem)
            return (new MarginalCandidate { Family = familyName, SkippedBecause = problem }, null);

        try
        {
            var notes = new List<string>();
            MarginalEstimate estimate;
            if (method == MarginalOptions.MethodLMoments)
            {
                var lm = family.FitLMoments(sample);
                if (lm is null) notes.Add("no L-moment estimator for this family; maximum likelihood used");
                estimate = lm ?? family.FitMaximumLikelihood(sample);
            }
            else estimate = family.FitMaximumLikelihood(sample);
            if (estimate.Note is not null) notes.Add(estimate.Note);

            if (!estimate.Parameters.All(double.IsFinite))
                return (new MarginalCandidate
                {
                    Family = familyName, Method = estimate.Method, Converged = false,
                    Note = $"the {(estimate.Method == MarginalOptions.MethodMle ? "maximum-likelihood" : "L-moment")} estimate is undefined for these data"
                        + (estimate.Note is null ? "" : $" ({estimate.Note})"),
                }, null);
            IMarginalDistribution distribution;
            try { distribution = family.Create(estimate.Parameters); }
            catch (ArgumentException e)
            {
                return (new MarginalCandidate { Family = familyName, Method = estimate.Method, Converged = false, Note = $"fit failed: {e.Message}" }, null);
            }

            int k = estimate.Parameters.Length, n = sample.N;
            double ll = family.LogLikelihood(sample, estimate.Parameters);
            bool finite = double.IsFinite(ll);
            if (!finite) notes.Add("some values lie outside the support of this fit, so it has no likelihood, AIC or BIC");
            // Families that need a pass over the data per likelihood evaluation take the curvature
            // from the stratified subsample at large n (StandardErrors explains the scaling).
            var curvatureSample = family.LikelihoodFromSufficientStatistics ? sample : sample.Subsample;
            double?[] se = estimate.Method == MarginalOptions.MethodMle && finite
                ? estimate.StandardErrors ?? StandardErrors.FromObservedInformation(p => family.LogLikelihood(curvatureSample, p), estimate.Parameters, estimate.FixedMask,
                    (double)sample.N / curvatureSample.N)
                : new double?[k];
            if (estimate.Method != MarginalOptions.MethodMle) notes.Add("no standard errors for L-moment estimates");

            bool normalCase = estimate.Method == MarginalOptions.MethodMle && familyName is NormalDistribution.FamilyName or LogNormalDistribution.FamilyName;
            var candidate = new MarginalCandidate
            {
                Family = familyName,
                Method = estimate.Method,
                Parameters = Named(family.ParameterNames, estimate.Parameters),
                StandardErrors = Named(family.ParameterNames, se),
                LogLikelihood = finite ? ll : null,
                Aic = finite ? 2 * k - 2 * ll : null,
                Bic = finite ? k * Math.Log(n) - 2 * ll : null,
                Gof = GoodnessOfFitTests.Compute(distribution, sample.Values, normalCase),
                Converged = estimate.Converged,
                Note = notes.Count > 0 ? string.Join("; ", notes) : null,
            };
            return (candidate, distribution);
        }
        catch (Exception e) when (e is ArithmeticException or ArgumentException or InvalidOperationException or MathNet.Numerics.NonConvergenceException)
        {
            return (new MarginalCandidate { Family = familyName, Converged = false, Note = $"fit failed: {e.Message}" }, null);
        }
    }

    private static Dictionary<string, T> Named<T>(IReadOnlyList<string> names, IReadOnlyList<T> values)
    {
        var d = new Dictionary<string, T>(names.Count);
        for (int i = 0; i < names.Count; i++) d[names[i]] = values[i];
        return d;
    }
}
