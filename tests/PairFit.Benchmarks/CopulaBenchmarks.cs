using BenchmarkDotNet.Attributes;
using PairFit.Core.Common;
using PairFit.Core.Copulas;
using PairFit.Core.Copulas.Fitting;
using PairFit.Core.Copulas.GoodnessOfFit;
using PairFit.Core.Copulas.Sampling;
using PairFit.Core.Data;
using PairFit.Core.Dependence;
using PairFit.Core.Results;

namespace PairFit.Benchmarks;

/// <summary>
/// Issue 4 targets: every default family with its rotations fitted to 100,000 pairs in under 1 s and to
/// 1,000,000 pairs in under 8 s (Kendall's tau, pseudo-observations, fits and standard errors included).
/// Run: dotnet run -c Release --project tests/PairFit.Benchmarks -- --filter '*CopulaFitBench*' --job short
/// </summary>
public class CopulaFitBench
{
    [Params(100_000, 1_000_000)]
    public int N;

    private PairedSample _sample = null!;

    [GlobalSetup]
    public void Setup()
    {
        var u = new double[N];
        var v = new double[N];
        CopulaSampler.Fill(new ClaytonLaw(2.0), RandomStreams.For(1), u, v);
        _sample = new PairedSample(u, v, "u", "v");
    }

    [Benchmark]
    public CopulaSection FitAllFamilies() => CopulaAnalysis.Fit(_sample, null, null, new CopulaOptions { GofReplicates = 0 }).Section;
}

/// <summary>
/// Issue 4 targets: the goodness-of-fit bootstrap with 500 replicates for one family in under 10 s at n = 1,000
/// and under 60 s at n = 10,000 on 2 cores.
/// Run: dotnet run -c Release --project tests/PairFit.Benchmarks -- --filter '*CopulaGofBench*' --job short
/// </summary>
public class CopulaGofBench
{
    [Params(1_000, 10_000)]
    public int N;

    [Params("clayton", "gumbel")]
    public string Family = "clayton";

    private double[] _u = null!, _v = null!;
    private ICopula _fitted = null!;
    private ICopulaFamily _family = null!;

    [GlobalSetup]
    public void Setup()
    {
        _family = CopulaRegistry.Families.FirstOrDefault(f => f.Name == Family) ?? ClaytonLaw.Family;
        var truth = _family.Create(_family.StartFromTau(0.5)!);
        var x = new double[N];
        var y = new double[N];
        CopulaSampler.Fill(truth, RandomStreams.For(2), x, y);
        _u = Ranks.PseudoObservations(x);
        _v = Ranks.PseudoObservations(y);
        _fitted = CopulaMaximumLikelihood.Fit(_family, 0, _u, _v, _family.StartFromTau(0.5)!, computeStandardErrors: false).Copula;
    }

    [Benchmark]
    public CopulaGof Bootstrap500() => CramerVonMisesGof.Test(_family, _fitted, _u, _v, 500, seed: 3);
}
