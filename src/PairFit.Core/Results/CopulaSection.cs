namespace PairFit.Core.Results;

/// <summary>
/// Copula candidates ranked by AIC, the selected one, the families left out and why, and the
/// goodness of fit where it was run. JSON: <c>copula.method</c>, <c>copula.selected</c>, <c>copula.candidates</c>, ...
/// </summary>
public sealed record CopulaSection
{
    /// <summary>"pseudo" (maximum pseudo-likelihood on ranks), "ifm" (inference functions for margins) or "full" (joint maximum likelihood).</summary>
    public required string Method { get; init; }

    /// <summary>Kendall's tau-b of the data, to compare with each candidate's implied tau.</summary>
    public double EmpiricalKendallTau { get; init; }

    /// <summary>The candidate with the lowest AIC among those whose fit converged.</summary>
    public required CopulaCandidate Selected { get; init; }

    /// <summary>Every candidate that was fitted, best AIC first (fits that did not converge last).</summary>
    public required IReadOnlyList<CopulaCandidate> Candidates { get; init; }

    /// <summary>Families and rotations not fitted, with the reason (e.g. they cannot represent the sign of the observed dependence).</summary>
    public IReadOnlyList<ExcludedCopula>? Excluded { get; init; }
}

/// <summary>One fitted copula family and rotation.</summary>
public sealed record CopulaCandidate
{
    public required string Family { get; init; }

    /// <summary>Rotation in degrees counter-clockwise: 0, 90, 180 or 270.</summary>
    public int Rotation { get; init; }

    /// <summary>Parameters of the unrotated family by name: theta, rho, nu.</summary>
    public required IReadOnlyDictionary<string, double> Parameters { get; init; }

    /// <summary>Standard errors from the observed information; null where the information matrix was not positive definite.</summary>
    public required IReadOnlyDictionary<string, double?> StandardErrors { get; init; }

    /// <summary>
    /// Maximised log-likelihood: of the copula density at the pseudo-observations ("pseudo") or at
    /// the marginal probability transforms ("ifm"); of the whole joint density ("full").
    /// </summary>
    public double LogLikelihood { get; init; }

    /// <summary>AIC = 2k − 2ℓ (Akaike 1974); k counts the copula parameters, plus the marginal ones for "full".</summary>
    public double Aic { get; init; }

    /// <summary>BIC = k log n − 2ℓ (Schwarz 1978).</summary>
    public double Bic { get; init; }

    /// <summary>Kendall's tau implied by the fitted parameters.</summary>
    public double KendallTau { get; init; }

    public double TailLower { get; init; }
    public double TailUpper { get; init; }

    /// <summary>False when the optimiser stopped without meeting its tolerance; <see cref="Note"/> says what happened.</summary>
    public bool Converged { get; init; }

    public string? Note { get; init; }

    /// <summary>Cramér–von Mises goodness of fit, where it was run.</summary>
    public CopulaGof? Gof { get; init; }
}

/// <summary>A family and rotation that was not fitted, and why.</summary>
public sealed record ExcludedCopula
{
    public required string Family { get; init; }
    public int Rotation { get; init; }
    public required string Reason { get; init; }
}

/// <summary>
/// Goodness of fit by the Cramér–von Mises statistic S_n between the empirical and the fitted
/// copula, with a parametric-bootstrap p-value (Genest, Rémillard and Beaudoin 2009).
/// </summary>
public sealed record CopulaGof
{
    public double Statistic { get; init; }
    public double PValue { get; init; }

    /// <summary>Bootstrap replicates that entered the p-value.</summary>
    public int Replicates { get; init; }

    /// <summary>Replicates whose refit failed and were left out, if any.</summary>
    public int? FailedReplicates { get; init; }

    /// <summary>Pairs the test used, when it ran on a random subsample of a large sample (null = all pairs).</summary>
    public int? SubsamplePairs { get; init; }

    /// <summary>How the test was run, when it differs from the plain bootstrap on all pairs.</summary>
    public string? Note { get; init; }
}
