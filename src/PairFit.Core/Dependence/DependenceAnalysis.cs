using PairFit.Core.Data;
using PairFit.Core.Results;

namespace PairFit.Core.Dependence;

/// <summary>Pearson, Spearman, Kendall tau-b and empirical tail dependence of a paired sample.</summary>
public static class DependenceAnalysis
{
    public static DependenceSection Compute(PairedSample sample)
        => throw new NotImplementedException("dependence measures are being written (issue 2).");
}
