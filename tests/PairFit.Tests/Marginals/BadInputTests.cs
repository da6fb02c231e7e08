using System.Text.Json;
using PairFit.Core.Common;
using PairFit.Core.Marginals;
using PairFit.Core.Results;

namespace PairFit.Tests.Marginals;

/// <summary>Bad input (issue 3): a clear one-line message or a skipped family, never a crash or a NaN.</summary>
public class BadInputTests
{
    [Fact]
    public void FewerThanFiveValuesIsAnInputError()
    {
        var e = Assert.Throws<PairFitInputException>(() => MarginalAnalysis.Fit([1.0, 2.0, 3.0, 4.0], new MarginalOptions { VariableName = "peak" }));
        Assert.Contains("'peak' has 4 values", e.Message);
        Assert.Contains("at least 5", e.Message);
        Assert.DoesNotContain('\n', e.Message);
    }

    [Fact]
    public void AllEqualValuesIsAnInputError()
    {
        var e = Assert.Throws<PairFitInputException>(() => MarginalAnalysis.Fit([2.5, 2.5, 2.5, 2.5, 2.5, 2.5], new MarginalOptions { VariableName = "volume" }));
        Assert.Contains("all 6 values equal to 2.5", e.Message);
    }

    [Fact]
    public void NonFiniteValueIsAnInputError()
    {
        var e = Assert.Throws<PairFitInputException>(() => MarginalAnalysis.Fit([1.0, 2.0, double.NaN, 4.0, 5.0, 6.0], new MarginalOptions()));
        Assert.Contains("position 3", e.Message);
    }

    [Fact]
    public void UnknownFamilyAndMethodAreInputErrors()
    {
        double[] data = [1, 2, 3, 4, 5, 6.5];
        Assert.Contains("unknown marginal family 'gama'", Assert.Throws<PairFitInputException>(() => MarginalAnalysis.Fit(data, new MarginalOptions { Forced = "gama" })).Message);
        Assert.Contains("'moments'", Assert.Throws<PairFitInputException>(() => MarginalAnalysis.Fit(data, new MarginalOptions { Method = "moments" })).Message);
    }

    [Fact]
    public void ZerosSkipPositiveFamiliesWithAReason()
    {
        var data = SimulationRecoveryTests.Draw(new GammaDistribution(2, 3), 300, 11);
        data[0] = 0;
        data[1] = 0;
        var fit = MarginalAnalysis.Fit(data, new MarginalOptions());
        foreach (var family in new[] { "lognormal", "gamma", "weibull", "loglogistic", "logpearson3" })
        {
            var c = fit.Section.Candidates.Single(c => c.Family == family);
            Assert.Contains("zeros", c.SkippedBecause);
            Assert.Null(c.Parameters);
        }
        // Exponential allows 0; the real-line families are fitted.
        Assert.Null(fit.Section.Candidates.Single(c => c.Family == "exponential").SkippedBecause);
        Assert.NotNull(fit.Section.Candidates.Single(c => c.Family == "normal").Aic);
        // Skipped candidates are listed last.
        Assert.True(fit.Section.Candidates.SkipWhile(c => c.SkippedBecause is null).All(c => c.SkippedBecause is not null));

        var e = Assert.Throws<PairFitInputException>(() => MarginalAnalysis.Fit(data, new MarginalOptions { Forced = "gamma", VariableName = "rain" }));
        Assert.Contains("'gamma' cannot be used for variable 'rain'", e.Message);
        Assert.Contains("zeros", e.Message);
    }

    [Fact]
    public void NegativeValuesAreNamedInTheReason()
    {
        var data = SimulationRecoveryTests.Draw(new NormalDistribution(1, 2), 200, 12);
        var c = MarginalAnalysis.Fit(data, new MarginalOptions()).Section.Candidates.Single(c => c.Family == "exponential");
        Assert.Contains("negative values", c.SkippedBecause);
    }

    /// <summary>
    /// Scale equivariance at extreme magnitudes: multiplying the data by c = 1e-300 or 1e300 leaves
    /// every shape parameter and every AIC difference unchanged (ln L shifts by −n ln c for all
    /// families), multiplies scale parameters by c, and leaves no NaN or infinity anywhere.
    /// </summary>
    [Theory]
    [InlineData(1e-300)]
    [InlineData(1e300)]
    public void ExtremeMagnitudesGiveTheSameFitsScaled(double c)
    {
        var baseData = SimulationRecoveryTests.Draw(new GammaDistribution(2.5, 3), 400, 13);
        var scaled = baseData.Select(v => v * c).ToArray();
        var a = MarginalAnalysis.Fit(baseData, new MarginalOptions());
        var b = MarginalAnalysis.Fit(scaled, new MarginalOptions());
        Assert.Equal(a.Section.Selected, b.Section.Selected);
        string json = JsonSerializer.Serialize(b.Section, ResultsFile.Options);   // throws on NaN/Infinity
        Assert.DoesNotContain("NaN", json);
        foreach (var ca in a.Section.Candidates.Where(x => x.Aic is not null))
        {
            var cb = b.Section.Candidates.Single(x => x.Family == ca.Family);
            Assert.NotNull(cb.DeltaAic);
            // AIC differences are O(10-100); optimiser tolerances leave ~1e-6 of noise.
            Assert.Equal(ca.DeltaAic!.Value, cb.DeltaAic!.Value, 1e-5);
            foreach (var (name, va) in ca.Parameters!)
            {
                double vb = cb.Parameters![name];
                Assert.True(double.IsFinite(vb), $"{ca.Family} {name} = {vb}");
                bool isShape = name is "shape" or "skew" || ca.Family is "lognormal" && name == "sigma"
                    || ca.Family == "logpearson3" && name != "mu";
                if (isShape) Assert.Equal(va, vb, 1e-5 * Math.Max(1, Math.Abs(va)));
            }
        }
    }

    [Fact]
    public void HugeRangeDoesNotProduceNaN()
    {
        double[] data = [-1e300, -3e299, 1.0, 2e299, 5e299, 1e300, 7e299];
        var fit = MarginalAnalysis.Fit(data, new MarginalOptions());
        string json = JsonSerializer.Serialize(fit.Section, ResultsFile.Options);
        Assert.DoesNotContain("NaN", json);
        Assert.Equal("normal", fit.Section.Candidates.Single(c => c.Family == "normal").Family);
    }
}
