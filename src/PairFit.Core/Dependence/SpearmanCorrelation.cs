namespace PairFit.Core.Dependence;

/// <summary>Spearman's rank correlation rho.</summary>
public static class SpearmanCorrelation
{
    /// <summary>
    /// rho = Pearson's r of the ranks, ties given their average rank (Spearman 1904; with ties this is
    /// the tie-corrected coefficient, not the 1 − 6Σd²/(n(n² − 1)) shortcut). NaN for a constant input.
    /// </summary>
    public static double Estimate(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
        => PearsonCorrelation.Estimate(Ranks.Average(x), Ranks.Average(y));
}
