namespace PairFit.Core.Results;

/// <summary>Distribution of one expression Q(x, y) under the joint model. (Fields are added by the projection work.)</summary>
public sealed record ProjectionSection
{
}

/// <summary>Joint exceedance probabilities and return periods. (Fields are added by the projection work.)</summary>
public sealed record JointSection
{
}
