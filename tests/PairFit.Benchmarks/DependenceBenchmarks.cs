using BenchmarkDotNet.Attributes;
using PairFit.Core.Common;
using PairFit.Core.Data;
using PairFit.Core.Dependence;

namespace PairFit.Benchmarks;

/// <summary>
/// Kendall's tau-b on 1,000,000 pairs (target: under 0.5 s) and the whole dependence section
/// (Pearson, Spearman, Kendall with jackknife interval, tail dependence) on the same pairs.
/// Run: dotnet run -c Release --project tests/PairFit.Benchmarks -- --filter '*DependenceBenchmarks*' --job short
/// </summary>
[MemoryDiagnoser, MedianColumn]
public class DependenceBenchmarks
{
    private double[] _x = [], _y = [];

    [Params(1_000_000)]
    public int N { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        var rng = RandomStreams.For(2);
        _x = new double[N];
        _y = new double[N];
        for (int i = 0; i < N; i++)
        {
            _x[i] = Math.Round(rng.NextDouble() * 1e4, 1); // some ties, as measured data have
            _y[i] = _x[i] + rng.NextDouble() * 5e3;
        }
    }

    [Benchmark]
    public double KendallTauB() => KendallTau.TauB(_x, _y);

    [Benchmark]
    public double WholeDependenceSection()
        => DependenceAnalysis.Compute(new PairedSample(_x, _y, "x", "y")).Kendall.Estimate ?? 0;
}
