namespace PairFit.Core.Dependence;

/// <summary>Pearson's product-moment correlation r.</summary>
public static class PearsonCorrelation
{
    /// <summary>
    /// r = Σ(x − x̄)(y − ȳ)/√(Σ(x − x̄)² Σ(y − ȳ)²) with means taken first (two passes, no
    /// cancellation from raw sums). NaN when either input is constant (undefined).
    /// </summary>
    public static double Estimate(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        if (x.Length != y.Length) throw new ArgumentException($"x has {x.Length} values and y has {y.Length}; a correlation needs pairs.");
        int n = x.Length;
        if (n < 2) return double.NaN;
        double mx = 0, my = 0;
        for (int i = 0; i < n; i++) { mx += x[i]; my += y[i]; }
        mx /= n;
        my /= n;
        double sxy = 0, sxx = 0, syy = 0;
        for (int i = 0; i < n; i++)
        {
            double dx = x[i] - mx, dy = y[i] - my;
            sxy += dx * dy;
            sxx += dx * dx;
            syy += dy * dy;
        }
        if (sxx <= 0 || syy <= 0) return double.NaN;
        return Math.Clamp(sxy / Math.Sqrt(sxx * syy), -1.0, 1.0);
    }
}
