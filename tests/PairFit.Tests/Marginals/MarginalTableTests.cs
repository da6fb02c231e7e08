using PairFit.Cli.Printing;
using PairFit.Core.Marginals;
using PairFit.Core.Results;

namespace PairFit.Tests.Marginals;

public class MarginalTableTests
{
    [Fact]
    public void TablesListRankedCandidatesSkippedFamiliesAndNotes()
    {
        var x = MarginalReference.Dataset("gamma_103");
        var y = SimulationRecoveryTests.Draw(new NormalDistribution(0, 1), 300, 3);   // has negative values
        var m = new MarginalsSection
        {
            X = MarginalAnalysis.Fit(x, new MarginalOptions()).Section,
            Y = MarginalAnalysis.Fit(y, new MarginalOptions { Candidates = ["normal", "gamma", "gumbel"] }).Section,
        };
        var w = new StringWriter();
        MarginalTable.Write(m, w, "rain", "surge");
        string text = w.ToString();
        Assert.Contains("Marginal candidates for x = rain (n = 400, maximum likelihood)", text);
        Assert.Contains("Marginal candidates for y = surge (n = 300", text);
        Assert.Contains("<- selected", text);
        Assert.Contains($"Selected: {m.X.Selected} (lowest AIC)", text);
        Assert.Contains("gamma: gamma needs every value > 0, but the data contain negative values", text);
        Assert.Contains("p-values:", text);
        // The selected row of x is rank 1 and shows its parameters with standard errors.
        var firstRow = text.Split('\n').First(l => l.TrimStart().StartsWith("1 "));
        Assert.Contains(m.X.Selected, firstRow);
        Assert.Matches(@"=\S+ \(\S+\)", firstRow);
        Assert.DoesNotContain("NaN", text);
    }
}
