using BenchmarkDotNet.Attributes;
using PairFit.Core.Common;
using PairFit.Core.Copulas;

namespace PairFit.Benchmarks;

/// <summary>
/// Cost of the per-point verbs the fitting and sampling code calls millions of times, over
/// 100,000 fixed pseudo-random points (divide the mean by 100,000 for the cost per call).
/// Run: dotnet run -c Release --project tests/PairFit.Benchmarks -- --filter '*CopulaFamilyBenchmarks*' --job short
/// </summary>
[MemoryDiagnoser]
public class CopulaFamilyBenchmarks
{
    private const int N = 100_000;
    private readonly double[] _u = new double[N], _v = new double[N], _x = new double[N], _y = new double[N];
    private ICopula _copula = null!;

    [Params("gaussian", "student-t", "clayton", "gumbel", "frank", "joe")]
    public string Family { get; set; } = "";

    [GlobalSetup]
    public void Setup()
    {
        var rng = RandomStreams.For(20261202);
        for (int i = 0; i < N; i++)
        {
            _u[i] = RandomStreams.OpenUniform(rng);
            _v[i] = RandomStreams.OpenUniform(rng);
        }
        double[] parameters = Family switch
        {
            "gaussian" => [0.6],
            "student-t" => [0.6, 4.5],
            "clayton" => [2.0],
            "gumbel" => [2.0],
            "frank" => [6.0],
            _ => [2.5],
        };
        _copula = CopulaRegistry.Create(Family, 0, parameters);
        if (_copula is IEllipticalCopula e)
            for (int i = 0; i < N; i++) { _x[i] = e.MarginQuantile(_u[i]); _y[i] = e.MarginQuantile(_v[i]); }
    }

    [Benchmark]
    public double LogDensity()
    {
        double s = 0;
        for (int i = 0; i < N; i++) s += _copula.LogDensity(_u[i], _v[i]);
        return s;
    }

    /// <summary>What the fitting code pays per likelihood evaluation once the margin quantiles are cached (elliptical only).</summary>
    [Benchmark]
    public double LogDensityAtCachedQuantiles()
    {
        if (_copula is not IEllipticalCopula e) return 0;
        double s = 0;
        for (int i = 0; i < N; i++) s += e.LogDensityAtQuantiles(_x[i], _y[i]);
        return s;
    }

    [Benchmark]
    public double InverseConditionalCdf()
    {
        double s = 0;
        for (int i = 0; i < N; i++) s += _copula.InverseConditionalCdf(_u[i], _v[i]);
        return s;
    }
}
