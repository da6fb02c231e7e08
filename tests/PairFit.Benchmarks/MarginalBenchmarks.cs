using BenchmarkDotNet.Attributes;
using PairFit.Core.Common;
using PairFit.Core.Marginals;

namespace PairFit.Benchmarks;

/// <summary>
/// All default marginal candidates (11 families: fit, standard errors, goodness of fit, ranking)
/// on one variable of 10,000 and 1,000,000 values (issue 3 targets: under 50 ms and under 2 s).
/// Data: a gamma(2.5, 3) sample (positive, so every family is fitted, none skipped), fixed seed.
/// Also the most expensive single family (GEV) and the closed-form normal alone.
/// Run: dotnet run -c Release --project tests/PairFit.Benchmarks -- --filter '*MarginalBenchmarks*' --job short
/// </summary>
[MemoryDiagnoser]
public class MarginalBenchmarks
{
    [Params(10_000, 1_000_000)]
    public int N { get; set; }

    private double[] _data = [];

    [GlobalSetup]
    public void Draw()
    {
        var gamma = new GammaDistribution(2.5, 3.0);
        var rng = RandomStreams.For(20261202);
        _data = new double[N];
        for (int i = 0; i < N; i++) _data[i] = gamma.Quantile(RandomStreams.OpenUniform(rng));
    }

    [Benchmark(Baseline = true)]
    public string AllDefaultCandidates() => MarginalAnalysis.Fit(_data, new MarginalOptions()).Section.Selected;

    [Benchmark]
    public string GevOnly() => MarginalAnalysis.Fit(_data, new MarginalOptions { Forced = "gev" }).Section.Selected;

    [Benchmark]
    public string NormalOnly() => MarginalAnalysis.Fit(_data, new MarginalOptions { Forced = "normal" }).Section.Selected;
}
