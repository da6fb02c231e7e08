using PairFit.Core.Common;
using PairFit.Core.Data;
using PairFit.Core.Dependence;

namespace PairFit.Tests.Dependence;

public class DependenceAnalysisTests
{
    [Fact]
    public void ConstantColumnGivesNullEstimatesWithANoteNotNaN()
    {
        var d = DependenceAnalysis.Compute(new PairedSample([1, 2, 3, 4], [5, 5, 5, 5], "a", "b"));
        foreach (var c in new[] { d.Pearson, d.Spearman, d.Kendall })
        {
            Assert.Null(c.Estimate);
            Assert.Null(c.PValue);
            Assert.Null(c.Ci95);
            Assert.Contains("'b' is constant", c.Note);
        }
        Assert.Null(d.Tail.Upper);
        Assert.Contains("constant", d.Tail.Note);
        Assert.DoesNotContain("NaN", PairFit.Core.Results.ResultsFile.ToJson(new PairFit.Core.Results.AnalysisResults
        {
            Input = new PairFit.Core.Results.InputSection { XColumn = "a", YColumn = "b" },
            Dependence = d,
        }));
    }

    [Fact]
    public void SmallSamplesGetNoPValueOrIntervalWhereUndefined()
    {
        var two = DependenceAnalysis.Compute(new PairedSample([1, 2], [2, 1], "a", "b"));
        Assert.Equal(-1.0, two.Pearson.Estimate);
        Assert.Null(two.Pearson.PValue);
        Assert.Null(two.Pearson.Ci95);
        var three = DependenceAnalysis.Compute(new PairedSample([1, 2, 3], [2, 1, 4], "a", "b"));
        Assert.NotNull(three.Kendall.PValue);
        Assert.Null(three.Spearman.Ci95);
        Assert.Contains("no interval", three.Spearman.Note);
    }

    [Fact]
    public void FisherIntervalMatchesClosedForm()
    {
        // r = 0.5, n = 28: atanh(0.5) ± 1.96/5 → tanh of the ends (Fisher 1921), computed here by hand.
        double z = 0.5 * Math.Log(3), h = 1.959963984540054 / 5;
        var ci = CorrelationInferenceProbe.Fisher(0.5, 1 / Math.Sqrt(25));
        Assert.Equal(Math.Tanh(z - h), ci[0], 15);
        Assert.Equal(Math.Tanh(z + h), ci[1], 15);
    }

    [Fact]
    public void SpearmanIntervalUsesBonettWrightStandardError()
    {
        var rng = RandomStreams.For(3);
        var x = Enumerable.Range(0, 80).Select(_ => rng.NextDouble()).ToArray();
        var y = x.Select(a => a * a + 0.2 * rng.NextDouble()).ToArray();
        var d = DependenceAnalysis.Compute(new PairedSample(x, y, "a", "b"));
        double rho = d.Spearman.Estimate!.Value;
        // Bonett and Wright (2000): se(atanh rho) = sqrt((1 + rho²/2)/(n − 3)).
        double se = Math.Sqrt((1 + rho * rho / 2) / 77);
        Assert.Equal(Math.Tanh(Math.Atanh(rho) - 1.959963984540054 * se), d.Spearman.Ci95![0], 14);
        Assert.Equal(Math.Tanh(Math.Atanh(rho) + 1.959963984540054 * se), d.Spearman.Ci95![1], 14);
    }

    [Fact]
    public void IndependentDataGiveUniformPValuesAndCoveringIntervals()
    {
        // Simulation check of calibration: under independence the three p-values fall below 0.05
        // about 5 % of the time, and every 95 % interval covers 0 about 95 % of the time.
        // 400 replicates of n = 60: 5 % ± 4 binomial SEs (SE ≈ 1.1 %) gives the window below.
        int reps = 400, rejectP = 0, rejectS = 0, rejectK = 0, missP = 0, missS = 0, missK = 0;
        for (int r = 0; r < reps; r++)
        {
            var rng = RandomStreams.For(11, r);
            var x = Enumerable.Range(0, 60).Select(_ => rng.NextDouble()).ToArray();
            var y = Enumerable.Range(0, 60).Select(_ => Math.Round(rng.NextDouble() * 10)).ToArray(); // ties in y
            var d = DependenceAnalysis.Compute(new PairedSample(x, y, "a", "b"));
            if (d.Pearson.PValue < 0.05) rejectP++;
            if (d.Spearman.PValue < 0.05) rejectS++;
            if (d.Kendall.PValue < 0.05) rejectK++;
            if (d.Pearson.Ci95![0] > 0 || d.Pearson.Ci95[1] < 0) missP++;
            if (d.Spearman.Ci95![0] > 0 || d.Spearman.Ci95[1] < 0) missS++;
            if (d.Kendall.Ci95![0] > 0 || d.Kendall.Ci95[1] < 0) missK++;
        }
        foreach (int k in new[] { rejectP, rejectS, rejectK, missP, missS, missK })
            Assert.InRange(k, 3, 38); // 20 expected; 4 SEs = 17.4
    }
}

/// <summary>Reaches the internal interval helper (InternalsVisibleTo PairFit.Tests).</summary>
internal static class CorrelationInferenceProbe
{
    public static double[] Fisher(double r, double se) => CorrelationInference.FisherInterval(r, se);
    public static double NormalPValue(double z) => CorrelationInference.NormalPValue(z);
}

public class PearsonScalingTests
{
    [Fact]
    public void ExtremeMagnitudesNeitherOverflowNorUnderflow()
    {
        // r is invariant under x → a·x + b (a > 0); the power-of-two scaling keeps the squares finite.
        double[] x = [1, 2, 3, 4, 6];
        double[] y = [2, 1, 5, 4, 7];
        double r = PearsonCorrelation.Estimate(x, y);
        Assert.Equal(r, PearsonCorrelation.Estimate(x.Select(v => v * 1e300).ToArray(), y), 14);
        Assert.Equal(r, PearsonCorrelation.Estimate(x, y.Select(v => v * 1e-300).ToArray()), 14);
        Assert.True(double.IsNaN(PearsonCorrelation.Estimate([1, double.PositiveInfinity, 3], [1, 2, 3])));
    }

    [Fact]
    public void NonFiniteInMemorySampleIsUndefinedNotNaN()
    {
        var d = DependenceAnalysis.Compute(new PairedSample([1, double.PositiveInfinity, 3], [1, 2, 3], "a", "b"));
        Assert.Null(d.Pearson.Estimate);
        Assert.Contains("infinite", d.Pearson.Note);
    }
}
