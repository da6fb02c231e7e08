namespace PairFit.Core.Marginals;

/// <summary>
/// What the fitting code needs to know about a marginal family before it has parameters: its
/// name and parameter names, whether its support can hold the data, a maximum-likelihood fit,
/// the log-likelihood at given parameters, and a factory. Each family file carries one of these
/// next to its distribution class, so adding a family touches one file and one registry line.
/// </summary>
public interface IMarginalFamily
{
    string Name { get; }
    IReadOnlyList<string> ParameterNames { get; }

    /// <summary>Why this family cannot describe these data (e.g. "data contain zeros"), or null if it can.</summary>
    string? SupportProblem(MarginalSample sample);

    /// <summary>Maximum-likelihood estimate on the data.</summary>
    MarginalEstimate FitMaximumLikelihood(MarginalSample sample);

    /// <summary>L-moment estimate (Hosking 1990), or null if the family offers none.</summary>
    MarginalEstimate? FitLMoments(MarginalSample sample) => null;

    /// <summary>Σ log f(xᵢ; θ) over the sample, −Infinity for infeasible θ. Families override
    /// this with sufficient statistics where they have them.</summary>
    double LogLikelihood(MarginalSample sample, ReadOnlySpan<double> parameters)
    {
        IMarginalDistribution d;
        try { d = Create(parameters.ToArray()); }
        catch (ArgumentException) { return double.NegativeInfinity; }
        return MarginalSample.SumLogDensity(d, sample.Values);
    }

    IMarginalDistribution Create(IReadOnlyList<double> parameters);

    /// <summary>True when <see cref="LogLikelihood"/> works from sufficient statistics (no pass over the data).</summary>
    bool LikelihoodFromSufficientStatistics => false;
}

/// <summary>
/// Parameters found by a fitting method. <paramref name="FixedMask"/> marks parameters that are
/// not smooth likelihood maxima (e.g. a location put at the sample minimum), which get no standard error.
/// </summary>
public sealed record MarginalEstimate(double[] Parameters, bool Converged, string Method, string? Note = null, bool[]? FixedMask = null);
