namespace PairFit.Core.Results;

/// <summary>Copula candidates, ranking and goodness of fit. (Fields are added by the copula-fitting work.)</summary>
public sealed record CopulaSection
{
}
