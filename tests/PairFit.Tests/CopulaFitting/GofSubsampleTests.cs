using PairFit.Core.Copulas;
using PairFit.Core.Copulas.Fitting;
using PairFit.Core.Data;
using PairFit.Core.Model;

namespace PairFit.Tests.CopulaFitting;

public class GofSubsampleTests
{
    private static PairedSample ClaytonSample(int n, int seed)
    {
        var u = new double[n];
        var v = new double[n];
        JointModel.SampleCopula(new ClaytonLaw(2.0), n, seed, u, v);
        return new PairedSample(u, v, "u", "v");
    }

    [Fact]
    public void LargeSamplesAreTestedOnASeededSubsampleAndSaySo()
    {
        // Above CopulaAnalysis.GofMaxPairs the bootstrap runs on a subsample of that size; the
        // result must say so and be reproducible from the seed.
        var sample = ClaytonSample(CopulaAnalysis.GofMaxPairs + 2_000, seed: 11);
        var options = new CopulaOptions { Families = ["clayton"], GofReplicates = 19, Seed = 5 };
        var first = CopulaAnalysis.Fit(sample, null, null, options).Section.Selected.Gof!;
        var second = CopulaAnalysis.Fit(sample, null, null, options).Section.Selected.Gof!;
        Assert.Equal(CopulaAnalysis.GofMaxPairs, first.SubsamplePairs);
        Assert.Contains("subsample", first.Note);
        Assert.Equal(first.Statistic, second.Statistic);
        Assert.Equal(first.PValue, second.PValue);
        // The true family is tested: with 19 replicates the p-value is a multiple of 1/20 in (0, 1].
        Assert.InRange(first.PValue, 0.05, 1.0);
    }

    [Fact]
    public void SamplesAtOrBelowTheCapUseEveryPair()
    {
        var sample = ClaytonSample(500, seed: 3);
        var gof = CopulaAnalysis.Fit(sample, null, null, new CopulaOptions { Families = ["clayton"], GofReplicates = 9, Seed = 1 }).Section.Selected.Gof!;
        Assert.Null(gof.SubsamplePairs);
        Assert.Null(gof.Note);
    }
}
