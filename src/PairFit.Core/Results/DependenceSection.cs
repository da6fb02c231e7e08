namespace PairFit.Core.Results;

/// <summary>Rank and moment correlations of the pair and the empirical tail dependence.</summary>
public sealed record DependenceSection
{
    public int N { get; init; }
    public required CorrelationEstimate Pearson { get; init; }
    public required CorrelationEstimate Spearman { get; init; }
    public required CorrelationEstimate Kendall { get; init; }
    public required TailDependenceEstimate Tail { get; init; }
}

/// <summary>
/// A correlation coefficient with its two-sided p-value against independence and a 95 % interval.
/// Null fields are undefined (for example every correlation of a constant column); <see cref="Note"/> says why.
/// </summary>
public sealed record CorrelationEstimate
{
    public double? Estimate { get; init; }
    public double? PValue { get; init; }
    public double[]? Ci95 { get; init; }
    /// <summary>How the p-value and interval were obtained, or why they are missing.</summary>
    public string? Note { get; init; }
}

/// <summary>Empirical lower and upper tail dependence coefficients with the estimator and threshold used.</summary>
public sealed record TailDependenceEstimate
{
    public double? Lower { get; init; }
    public double? Upper { get; init; }
    public string? Estimator { get; init; }
    /// <summary>The upper threshold t (λ_U at t, λ_L at 1 − t).</summary>
    public double? Threshold { get; init; }
    /// <summary>Number of extreme order statistics behind each estimate (t = 1 − k/n).</summary>
    public int? K { get; init; }
    /// <summary>Why the estimates are missing, or a caution about them.</summary>
    public string? Note { get; init; }
}
