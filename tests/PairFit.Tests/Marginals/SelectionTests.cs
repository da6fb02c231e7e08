using System.Text.Json;
using PairFit.Core.Marginals;
using PairFit.Core.Results;

namespace PairFit.Tests.Marginals;

public class SelectionTests
{
    [Fact]
    public void CandidatesAreRankedByAicAndBicIsConsistent()
    {
        var data = MarginalReference.Dataset("gev_107");
        var fit = MarginalAnalysis.Fit(data, new MarginalOptions());
        var ranked = fit.Section.Candidates.Where(c => c.Aic is not null).ToList();
        Assert.Equal(ranked.OrderBy(c => c.Aic).Select(c => c.Family), ranked.Select(c => c.Family));
        Assert.Equal(ranked[0].Family, fit.Section.Selected);
        Assert.Equal(0.0, ranked[0].DeltaAic);
        Assert.Equal(fit.Section.Selected, fit.Selected.Family);
        Assert.Equal(ranked.Select(c => c.Family), fit.Fitted.Select(d => d.Family));
        foreach (var c in ranked)
        {
            int k = c.Parameters!.Count;
            // Akaike (1974): AIC = 2k − 2 ln L; Schwarz (1978): BIC = k ln n − 2 ln L.
            Assert.Equal(2 * k - 2 * c.LogLikelihood!.Value, c.Aic!.Value, 1e-9);
            Assert.Equal(k * Math.Log(data.Length) - 2 * c.LogLikelihood!.Value, c.Bic!.Value, 1e-9);
        }
        // The generating family (GEV) is within 4 AIC units of the best: here the best is the
        // log-Pearson III (also 3 parameters), whose SciPy optimum on this sample is 1.45
        // log-likelihood units higher (fits.json), i.e. ΔAIC = 2.9.
        Assert.Equal("logpearson3", ranked[0].Family);
        Assert.Equal(2 * (-1989.299128 - -1990.752173), ranked.Single(c => c.Family == "gev").DeltaAic!.Value, 1e-5);
    }

    [Fact]
    public void LargeSampleSelectsTheGeneratingFamily()
    {
        var data = SimulationRecoveryTests.Draw(new WeibullDistribution(0.8, 4), 5000, 21);
        var fit = MarginalAnalysis.Fit(data, new MarginalOptions { Candidates = ["gamma", "lognormal", "weibull", "loglogistic", "gumbel", "normal"] });
        Assert.Equal("weibull", fit.Section.Selected);
        Assert.Equal("lowest AIC", fit.Section.SelectedBecause);
    }

    [Fact]
    public void LMomentMethodIsRecordedPerCandidate()
    {
        var fit = MarginalAnalysis.Fit(MarginalReference.Dataset("gumbel_106"), new MarginalOptions { Candidates = ["gumbel", "gamma"], Method = "lmoments" });
        Assert.Equal("lmoments", fit.Section.Method);
        var g = fit.Section.Candidates.Single(c => c.Family == "gumbel");
        Assert.Equal("lmoments", g.Method);
        Assert.All(g.StandardErrors!.Values, Assert.Null);
        var gamma = fit.Section.Candidates.Single(c => c.Family == "gamma");
        Assert.Equal("mle", gamma.Method);
        Assert.Contains("no L-moment estimator", gamma.Note);
    }

    [Fact]
    public void ResultsJsonUsesTheAgreedFieldNames()
    {
        var data = SimulationRecoveryTests.Draw(new GammaDistribution(2, 1), 200, 5);
        data[0] = 0;
        var x = MarginalAnalysis.Fit(data, new MarginalOptions { Candidates = ["gamma", "normal"] }).Section;
        var section = new MarginalsSection { X = x, Y = x };
        using var doc = JsonDocument.Parse(JsonSerializer.Serialize(section, ResultsFile.Options));
        var vx = doc.RootElement.GetProperty("x");
        Assert.Equal("normal", vx.GetProperty("selected").GetString());
        Assert.Equal("mle", vx.GetProperty("method").GetString());
        var normal = vx.GetProperty("candidates")[0];
        foreach (var name in new[] { "family", "parameters", "standardErrors", "logLikelihood", "aic", "bic", "gof", "converged" })
            Assert.True(normal.TryGetProperty(name, out _), name);
        Assert.True(normal.GetProperty("parameters").GetProperty("sigma").GetDouble() > 0);
        foreach (var name in new[] { "ksStatistic", "ksPValue", "adStatistic", "adPValue", "cvmStatistic", "cvmPValue", "pValueNote" })
            Assert.True(normal.GetProperty("gof").TryGetProperty(name, out _), name);
        var gamma = vx.GetProperty("candidates")[1];
        Assert.Equal("gamma", gamma.GetProperty("family").GetString());
        Assert.Contains("zeros", gamma.GetProperty("skippedBecause").GetString());
        Assert.False(gamma.TryGetProperty("aic", out _));   // nulls omitted
    }
}
