namespace PairFit.Core.Dependence;

/// <summary>Pearson's product-moment correlation r.</summary>
public static class PearsonCorrelation
{
    /// <summary>
    /// r = Σ(x − x̄)(y − ȳ)/√(Σ(x − x̄)² Σ(y − ȳ)²) with means taken first (two passes, no
    /// cancellation from raw sums). Each variable is first multiplied by a power of two that
    /// brings its largest magnitude near 1: exact in floating point, and r does not change with
    /// scale, so values near 1e300 or 1e-300 neither overflow nor underflow in the squares.
    /// NaN when either input is constant (undefined) or not finite.
    /// </summary>
    public static double Estimate(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        if (x.Length != y.Length) throw new ArgumentException($"x has {x.Length} values and y has {y.Length}; a correlation needs pairs.");
        int n = x.Length;
        if (n < 2) return double.NaN;
        double fx = PowerOfTwoScale(x), fy = PowerOfTwoScale(y);
        if (double.IsNaN(fx) || double.IsNaN(fy)) return double.NaN;
        double mx = 0, my = 0;
        for (int i = 0; i < n; i++) { mx += x[i] * fx; my += y[i] * fy; }
        mx /= n;
        my /= n;
        double sxy = 0, sxx = 0, syy = 0;
        for (int i = 0; i < n; i++)
        {
            double dx = x[i] * fx - mx, dy = y[i] * fy - my;
            sxy += dx * dy;
            sxx += dx * dx;
            syy += dy * dy;
        }
        if (sxx <= 0 || syy <= 0) return double.NaN;
        return Math.Clamp(sxy / Math.Sqrt(sxx * syy), -1.0, 1.0);
    }

    /// <summary>2^−e with e the binary exponent of max |v| (1 for all zeros); NaN when some value is not finite.</summary>
    private static double PowerOfTwoScale(ReadOnlySpan<double> v)
    {
        double largest = 0;
        foreach (double a in v)
        {
            if (!double.IsFinite(a)) return double.NaN;
            largest = Math.Max(largest, Math.Abs(a));
        }
        return largest == 0 ? 1.0 : Math.ScaleB(1.0, -Math.ILogB(largest));
    }
}
