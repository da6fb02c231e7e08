namespace PairFit.Core.Results;

/// <summary>Marginal fits of both variables. (Fields are added by the marginal-fitting work.)</summary>
public sealed record MarginalsSection
{
}
