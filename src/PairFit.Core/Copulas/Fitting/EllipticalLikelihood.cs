namespace PairFit.Core.Copulas.Fitting;

/// <summary>
/// Log-likelihood of an elliptical family (Gaussian, Student t) with the margin quantiles
/// x_i = F⁻¹(u_i), y_i = F⁻¹(v_i) cached per value of the shape parameters (none for Gaussian, ν for t),
/// so that trying another correlation costs only the cheap <see cref="IEllipticalCopula.LogDensityAtQuantiles"/>.
/// The first parameter must be the correlation "rho"; the quantiles depend on the others only.
/// One instance belongs to one fit (not shared between threads).
/// </summary>
internal sealed class EllipticalLikelihood
{
    private const int CacheSize = 4;
    private readonly ICopulaFamily _family;
    private readonly double[] _u, _v;
    private readonly int? _maxDegreeOfParallelism;
    private readonly List<(double[] Shape, double[] X, double[] Y)> _cache = [];

    private EllipticalLikelihood(ICopulaFamily family, double[] u, double[] v, int? maxDegreeOfParallelism)
    {
        _family = family;
        _u = u;
        _v = v;
        _maxDegreeOfParallelism = maxDegreeOfParallelism;
    }

    /// <summary>The cached likelihood when <paramref name="family"/> is elliptical with "rho" first and is not rotated; otherwise null.</summary>
    public static EllipticalLikelihood? TryCreate(ICopulaFamily family, int rotation, IReadOnlyList<double> start, double[] u, double[] v,
        int? maxDegreeOfParallelism)
    {
        if (rotation != 0 || family.ParameterNames.Count == 0 || family.ParameterNames[0] != "rho") return null;
        try
        {
            return family.Create(start) is IEllipticalCopula ? new EllipticalLikelihood(family, u, v, maxDegreeOfParallelism) : null;
        }
        catch (ArgumentException)
        {
            return null;
        }
    }

    /// <summary>Σ log c(u_i, v_i) at natural parameters; −Infinity where the family rejects them or a term is not finite.</summary>
    public double LogLikelihood(double[] parameters)
    {
        IEllipticalCopula copula;
        try
        {
            copula = (IEllipticalCopula)_family.Create(parameters);
        }
        catch (ArgumentException)
        {
            return double.NegativeInfinity;
        }
        var (x, y) = Quantiles(parameters.AsSpan(1).ToArray(), copula);
        return DeterministicSum.Over(x.Length, (start, end) =>
        {
            double s = 0;
            for (int i = start; i < end; i++)
            {
                double l = copula.LogDensityAtQuantiles(x[i], y[i]);
                if (!double.IsFinite(l)) return double.NegativeInfinity;
                s += l;
            }
            return s;
        }, _maxDegreeOfParallelism);
    }

    private (double[] X, double[] Y) Quantiles(double[] shape, IEllipticalCopula copula)
    {
        foreach (var entry in _cache)
            if (entry.Shape.AsSpan().SequenceEqual(shape)) return (entry.X, entry.Y);
        int n = _u.Length;
        var x = new double[n];
        var y = new double[n];
        // Element-wise and independent: the same values whatever the thread count.
        var po = new ParallelOptions { MaxDegreeOfParallelism = _maxDegreeOfParallelism ?? -1 };
        const int chunk = 4096;
        Parallel.For(0, (n + chunk - 1) / chunk, po, b =>
        {
            int end = Math.Min(n, (b + 1) * chunk);
            for (int i = b * chunk; i < end; i++)
            {
                x[i] = copula.MarginQuantile(_u[i]);
                y[i] = copula.MarginQuantile(_v[i]);
            }
        });
        if (_cache.Count == CacheSize) _cache.RemoveAt(0);
        _cache.Add((shape, x, y));
        return (x, y);
    }
}
