namespace PairFit.Core.Results;

/// <summary>
/// Distribution of one expression Q = g(x, y) under the joint model: moments, quantiles,
/// exceedance probabilities, value-at-risk and tail value-at-risk, the density and CDF on a
/// grid, the same quantities under independence and comonotonic coupling of the same
/// marginals, and the distribution of g on the observed pairs.
/// </summary>
public sealed record ProjectionSection
{
    public required string Expression { get; init; }

    /// <summary>"quadrature" (exact one-dimensional integration) or "montecarlo".</summary>
    public required string Method { get; init; }

    /// <summary>How the method was applied, in words (for the report).</summary>
    public string? MethodDetail { get; init; }

    /// <summary>Monte Carlo draws and seed, when Monte Carlo was used.</summary>
    public int? Draws { get; init; }
    public int? Seed { get; init; }

    /// <summary>Null when the mean is judged not to exist (heavy tail); see <see cref="Notes"/>.</summary>
    public double? Mean { get; init; }
    public double? Sd { get; init; }

    public required IReadOnlyList<QuantileValue> Quantiles { get; init; }
    public required IReadOnlyList<ExceedanceValue> Exceedance { get; init; }
    public required IReadOnlyList<RiskValue> ValueAtRisk { get; init; }
    public required IReadOnlyList<RiskValue> TailValueAtRisk { get; init; }

    /// <summary>P(Q undefined), e.g. the log of a negative value; left out when 0.</summary>
    public double? UndefinedProbability { get; init; }

    /// <summary>Estimated tail indices (lower, upper) used to judge whether the moments exist.</summary>
    public double? TailIndexLower { get; init; }
    public double? TailIndexUpper { get; init; }

    /// <summary>Density and CDF of Q on an even grid (for figures).</summary>
    public ProjectionGrid? Grid { get; init; }

    /// <summary>The same quantities under the independence copula.</summary>
    public ProjectionComparison? Independence { get; init; }

    /// <summary>The same quantities under comonotonic coupling X = F_X⁻¹(U), Y = F_Y⁻¹(U).</summary>
    public ProjectionComparison? Comonotonic { get; init; }

    /// <summary>The distribution of g on the observed pairs.</summary>
    public ProjectionComparison? Empirical { get; init; }

    /// <summary>Quadrature against Monte Carlo, when asked for.</summary>
    public ProjectionCheck? Check { get; init; }

    public IReadOnlyList<string>? Notes { get; init; }
}

/// <summary>A quantile of Q at probability p; Monte Carlo quantiles carry a 95 % order-statistic interval.</summary>
public sealed record QuantileValue
{
    public double P { get; init; }
    public double? Value { get; init; }
    public double? Lower { get; init; }
    public double? Upper { get; init; }
}

/// <summary>P(Q &gt; threshold), with its Monte Carlo standard error where sampled.</summary>
public sealed record ExceedanceValue
{
    public double Threshold { get; init; }
    public double? Probability { get; init; }
    public double? StandardError { get; init; }
}

/// <summary>A risk measure at a level (VaR_α or TVaR_α); null with a note when it does not exist.</summary>
public sealed record RiskValue
{
    public double Level { get; init; }
    public double? Value { get; init; }
}

public sealed record ProjectionGrid
{
    public required IReadOnlyList<double> Values { get; init; }
    public required IReadOnlyList<double> Density { get; init; }
    public required IReadOnlyList<double> Cdf { get; init; }

    /// <summary>How the density was obtained (quadrature, or a Gaussian kernel with this bandwidth).</summary>
    public string? DensityMethod { get; init; }
}

/// <summary>The summary of Q under another coupling, or on the data.</summary>
public sealed record ProjectionComparison
{
    public required string Method { get; init; }
    public int? Count { get; init; }
    public double? Mean { get; init; }
    public double? Sd { get; init; }
    public required IReadOnlyList<QuantileValue> Quantiles { get; init; }
    public required IReadOnlyList<ExceedanceValue> Exceedance { get; init; }
    public required IReadOnlyList<RiskValue> ValueAtRisk { get; init; }
    public required IReadOnlyList<RiskValue> TailValueAtRisk { get; init; }
    public string? Note { get; init; }
}

/// <summary>Agreement of quadrature and Monte Carlo: largest CDF difference on the grid against the DKW bound.</summary>
public sealed record ProjectionCheck
{
    public int Draws { get; init; }
    public double MaxCdfDifference { get; init; }
    /// <summary>The 99 % Dvoretzky–Kiefer–Wolfowitz band half-width for this many draws.</summary>
    public double AllowedDifference { get; init; }
    public bool Agree { get; init; }
    public double? MonteCarloMean { get; init; }
    public string? Note { get; init; }
}

/// <summary>
/// Joint exceedance probabilities and return periods at a design pair (a, b) (Salvadori,
/// De Michele and Durante 2011), with the mean interarrival time μ = 1/eventsPerYear.
/// </summary>
public sealed record JointSection
{
    public double XValue { get; init; }
    public double YValue { get; init; }
    public double EventsPerYear { get; init; }
    public double MeanInterarrivalYears { get; init; }

    public double ProbabilityXExceeds { get; init; }
    public double ProbabilityYExceeds { get; init; }
    /// <summary>P(X &gt; a and Y &gt; b).</summary>
    public double ProbabilityBothExceed { get; init; }
    /// <summary>P(X &gt; a or Y &gt; b).</summary>
    public double ProbabilityEitherExceeds { get; init; }
    /// <summary>P(Y &gt; b | X &gt; a); null when P(X &gt; a) = 0.</summary>
    public double? ProbabilityYExceedsGivenXExceeds { get; init; }
    /// <summary>P(Y &gt; b | X = a) = 1 − h(F_Y(b) | F_X(a)).</summary>
    public double ProbabilityYExceedsGivenXEquals { get; init; }

    /// <summary>t = C(F_X(a), F_Y(b)) and the Kendall distribution K_C(t) = P(C(U, V) ≤ t).</summary>
    public double CopulaLevel { get; init; }
    public double KendallProbability { get; init; }

    /// <summary>Return periods in years (null where the probability is 0).</summary>
    public required JointReturnPeriods ReturnPeriods { get; init; }

    /// <summary>The same two probabilities if X and Y were independent.</summary>
    public double IndependentBothExceed { get; init; }
    public double IndependentEitherExceeds { get; init; }

    /// <summary>Design events for a target return period, when one was given.</summary>
    public IReadOnlyList<DesignEvent>? Designs { get; init; }

    public IReadOnlyList<string>? Notes { get; init; }
}

public sealed record JointReturnPeriods
{
    public double? And { get; init; }
    public double? Or { get; init; }
    public double? Kendall { get; init; }
    public double? XAlone { get; init; }
    public double? YAlone { get; init; }
}

/// <summary>
/// For a target return period T and one definition ("kendall", "or", "and"): the critical level,
/// the isoline of design pairs (x, y) with that return period, and the most likely design event
/// on it (the point of largest joint density).
/// </summary>
public sealed record DesignEvent
{
    public required string Kind { get; init; }
    public double ReturnPeriod { get; init; }
    public double Level { get; init; }
    public required IReadOnlyList<DesignPoint> Isoline { get; init; }
    public DesignPoint? MostLikely { get; init; }
    public string? Note { get; init; }
}

public sealed record DesignPoint
{
    public double X { get; init; }
    public double Y { get; init; }
    /// <summary>log f(x, y) of the joint model at the point.</summary>
    public double? LogDensity { get; init; }
}
