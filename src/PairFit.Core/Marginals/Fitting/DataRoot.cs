using PairFit.Core.Common;

namespace PairFit.Core.Marginals.Fitting;

/// <summary>Roots of estimating equations that are sums over the data.</summary>
internal static class DataRoot
{
    /// <summary>
    /// Two-stage root: solved first on a stratified subsample (cheap, within a few subsample standard
    /// errors of the answer), then on the full data from a bracket of ±<paramref name="halfWidth"/>
    /// around that root, which Brent closes in a few full passes (<see cref="MonotoneRoot.Find"/>
    /// widens the bracket if needed). <paramref name="equation"/> takes the values to sum over and the unknown.
    /// </summary>
    public static double? Find(Func<double[], double, double> equation, double[] full, double[] subsample,
        double a, double b, double lower, double upper, double halfWidth, double accuracy)
    {
        if (!ReferenceEquals(full, subsample) && full.Length > subsample.Length)
        {
            double? rough = MonotoneRoot.Find(t => equation(subsample, t), a, b, lower, upper, accuracy * 1e3);
            if (rough is { } r) { a = Math.Max(lower, r - halfWidth); b = Math.Min(upper, r + halfWidth); }
        }
        return MonotoneRoot.Find(t => equation(full, t), a, b, lower, upper, accuracy);
    }
}
