namespace PairFit.Core.Results;

/// <summary>Marginal fits of both variables: for each, the selected family and every candidate tried.</summary>
public sealed record MarginalsSection
{
    public required MarginalVariableSection X { get; init; }
    public required MarginalVariableSection Y { get; init; }
}

/// <summary>The marginal analysis of one variable.</summary>
public sealed record MarginalVariableSection
{
    /// <summary>Family name of the selected marginal ("gamma", "gev", ..., or "empirical").</summary>
    public required string Selected { get; init; }

    /// <summary>Estimation method asked for: "mle" or "lmoments".</summary>
    public required string Method { get; init; }

    /// <summary>How the selection was made, e.g. "lowest AIC" or "forced by the user".</summary>
    public string? SelectedBecause { get; init; }

    /// <summary>Number of values fitted.</summary>
    public int N { get; init; }

    /// <summary>What a user should know about the selected law, e.g. that it puts probability below 0 for non-negative data.</summary>
    public IReadOnlyList<string>? Warnings { get; init; }

    /// <summary>Candidates ranked by AIC (lowest first); skipped and failed ones last.</summary>
    public required IReadOnlyList<MarginalCandidate> Candidates { get; init; }
}

/// <summary>One candidate family fitted (or skipped) for one variable.</summary>
public sealed record MarginalCandidate
{
    public required string Family { get; init; }

    /// <summary>Estimator actually used for this family: "mle", "lmoments" or "empirical".</summary>
    public string? Method { get; init; }

    /// <summary>Named parameters (names as in the family's ParameterNames).</summary>
    public IReadOnlyDictionary<string, double>? Parameters { get; init; }

    /// <summary>Standard errors from the observed information (numerical Hessian); null where undefined.</summary>
    public IReadOnlyDictionary<string, double?>? StandardErrors { get; init; }

    public double? LogLikelihood { get; init; }
    public double? Aic { get; init; }
    public double? Bic { get; init; }

    /// <summary>AIC difference to the best candidate (0 for the best).</summary>
    public double? DeltaAic { get; init; }

    public GoodnessOfFit? Gof { get; init; }
    public bool? Converged { get; init; }

    /// <summary>Why this family was not fitted (support excludes the data, too few values, ...).</summary>
    public string? SkippedBecause { get; init; }

    /// <summary>Anything the reader should know about this fit (boundary estimate, failed optimiser, ...).</summary>
    public string? Note { get; init; }
}

/// <summary>Goodness-of-fit statistics of a fitted marginal against the data.</summary>
public sealed record GoodnessOfFit
{
    public double? KsStatistic { get; init; }
    public double? KsPValue { get; init; }
    public double? AdStatistic { get; init; }
    public double? AdPValue { get; init; }
    public double? CvmStatistic { get; init; }
    public double? CvmPValue { get; init; }

    /// <summary>What the p-values assume (for example that the parameters were known, not estimated).</summary>
    public string? PValueNote { get; init; }
}
