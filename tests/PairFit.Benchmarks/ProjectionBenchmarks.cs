using BenchmarkDotNet.Attributes;
using PairFit.Core.Copulas;
using PairFit.Core.Marginals;
using PairFit.Core.Model;
using PairFit.Core.Projection;

namespace PairFit.Benchmarks;

/// <summary>
/// Speed targets of the projection (issue 5): exact quadrature of a sum or a ratio on a 512-point
/// grid (CDF and density at every point) under 100 ms; 1,000,000 Monte Carlo draws plus the
/// evaluation of a 10-node expression under 1 s.
/// Run: dotnet run -c Release --project tests/PairFit.Benchmarks -- --filter '*ProjectionBenchmarks*' --job short
/// </summary>
[MemoryDiagnoser]
public class ProjectionBenchmarks
{
    private const int GridPoints = 512;

    private readonly JointModel _model = new(new LogNormalDistribution(1.0, 0.5), new NormalDistribution(2.0, 1.5),
        RotatedCopula.Rotate(new ClaytonLaw(2.0), 180));

    private QuadratureDistribution _sum = null!;
    private QuadratureDistribution _ratio = null!;
    private CompiledExpression _tenNodes = null!;

    [GlobalSetup]
    public void Setup()
    {
        _sum = new QuadratureDistribution(_model, InversionChain.TryBuild(ExpressionParser.Parse("x + y"))!);
        _ratio = new QuadratureDistribution(_model, InversionChain.TryBuild(ExpressionParser.Parse("y / x"))!);
        // x, y, +, abs, x, *, 2, /, y, + : ten operations.
        _tenNodes = new CompiledExpression(ExpressionParser.Parse("abs(x + y) * x / 2 + y"));
        if (_tenNodes.NodeCount != 10) throw new InvalidOperationException($"expected 10 nodes, got {_tenNodes.NodeCount}");
    }

    /// <summary>The grid as ProjectionAnalysis fills it: CDF and density at 512 points (in parallel).</summary>
    private static double Grid(QuadratureDistribution qd, double lo, double hi)
    {
        var (_, cdf, density) = qd.Grid(lo, hi, GridPoints);
        return cdf[GridPoints / 2] + density[GridPoints / 2];
    }

    [Benchmark]
    public double QuadratureSumGrid512() => Grid(_sum, -1.0, 17.0);

    [Benchmark]
    public double QuadratureRatioGrid512() => Grid(_ratio, -0.6, 1.6);

    [Benchmark]
    public double MonteCarloMillionDrawsTenNodeExpression()
    {
        var (x, y) = _model.Sample(1_000_000, seed: 1);
        var q = new double[x.Length];
        _tenNodes.Evaluate(x, y, q);
        return q[^1];
    }
}
