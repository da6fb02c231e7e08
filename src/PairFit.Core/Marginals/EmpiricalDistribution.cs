using System.Globalization;

namespace PairFit.Core.Marginals;

/// <summary>
/// Rank-based (empirical) marginal: a continuous, piecewise-linear CDF through the Weibull
/// plotting positions (x_(i), i/(n+1)) (Weibull 1939; common practice in hydrology). Tied values
/// form one knot at their highest position. Beyond the extreme observations the first and last
/// segments are extended with their own slopes until F reaches 0 and 1 (the lower end is not
/// taken below 0 for non-negative data), so the law has a density, a finite support and an exact
/// quantile function. It has no parameters: the saved model stores the sorted data instead.
/// </summary>
public sealed class EmpiricalDistribution : IMarginalDistribution
{
    public const string FamilyName = "empirical";
    private readonly double[] _x;   // knots, strictly increasing
    private readonly double[] _p;   // F at the knots, from 0 to 1

    public EmpiricalDistribution(IReadOnlyList<double> values)
    {
        var sorted = values.ToArray();
        if (sorted.Length < 2 || sorted.Any(v => !double.IsFinite(v)))
            throw new ArgumentException("the empirical marginal needs at least two finite values", nameof(values));
        Array.Sort(sorted);
        if (sorted[0] == sorted[^1])
            throw new ArgumentException("the empirical marginal needs at least two distinct values", nameof(values));
        Values = sorted;
        int n = sorted.Length;
        var xs = new List<double>(n + 2) { 0 };
        var ps = new List<double>(n + 2) { 0 };
        for (int i = 0; i < n; i++)
        {
            if (i + 1 < n && sorted[i + 1] == sorted[i]) continue;   // keep the last of a tie
            xs.Add(sorted[i]);
            ps.Add((i + 1.0) / (n + 1));
        }
        // Extend the first and last segments with their own slopes to F = 0 and F = 1.
        double lower = xs[1] - (xs[2] - xs[1]) * ps[1] / (ps[2] - ps[1]);
        if (sorted[0] > 0 && lower < 0) lower = 0;
        int m = xs.Count;
        double upper = xs[m - 1] + (xs[m - 1] - xs[m - 2]) * (1 - ps[m - 1]) / (ps[m - 1] - ps[m - 2]);
        xs[0] = lower;
        ps[0] = 0;
        xs.Add(upper);
        ps.Add(1);
        _x = [.. xs];
        _p = [.. ps];

        double mean = 0, second = 0;
        for (int j = 0; j + 1 < _x.Length; j++)
        {
            double w = _p[j + 1] - _p[j], a = _x[j], b = _x[j + 1];
            mean += w * (a + b) / 2;
            second += w * (a * a + a * b + b * b) / 3;   // uniform on [a, b]
        }
        Mean = mean;
        Variance = Math.Max(second - mean * mean, 0);
    }

    /// <summary>The data the law was built from, ascending.</summary>
    public IReadOnlyList<double> Values { get; }

    public string Family => FamilyName;
    public IReadOnlyList<string> ParameterNames => [];
    public IReadOnlyList<double> Parameters => [];
    public double SupportLower => _x[0];
    public double SupportUpper => _x[^1];
    public double Mean { get; }
    public double Variance { get; }

    /// <summary>Index j of the segment [x_j, x_(j+1)) holding x; x must be inside the support.</summary>
    private int Segment(double x)
    {
        int j = Array.BinarySearch(_x, x);
        if (j < 0) j = ~j - 1;
        return Math.Min(j, _x.Length - 2);
    }

    public double LogDensity(double x)
    {
        if (!(x >= _x[0] && x <= _x[^1])) return double.NegativeInfinity;
        int j = Segment(x);
        return Math.Log((_p[j + 1] - _p[j]) / (_x[j + 1] - _x[j]));
    }

    public double Cdf(double x)
    {
        if (x <= _x[0]) return 0.0;
        if (x >= _x[^1]) return 1.0;
        int j = Segment(x);
        return _p[j] + (_p[j + 1] - _p[j]) * (x - _x[j]) / (_x[j + 1] - _x[j]);
    }

    public double Quantile(double p)
    {
        if (p <= 0) return _x[0];
        if (p >= 1) return _x[^1];
        int j = Array.BinarySearch(_p, p);
        if (j >= 0) return _x[j];
        j = ~j - 1;
        return _x[j] + (_x[j + 1] - _x[j]) * (p - _p[j]) / (_p[j + 1] - _p[j]);
    }

    public override string ToString() => $"empirical (n = {Values.Count.ToString(CultureInfo.InvariantCulture)})";
}
