using PairFit.Cli.Printing;
using PairFit.Core.Data;
using PairFit.Core.Dependence;

namespace PairFit.Tests.Dependence;

public class DependenceTableTests
{
    private static string Print(PairedSample s)
    {
        var w = new StringWriter();
        DependenceTable.Write(DependenceAnalysis.Compute(s), s.XName, s.YName, w);
        return w.ToString();
    }

    [Fact]
    public void PrintsEveryMeasureWithEstimateIntervalAndPValue()
    {
        // Kendall's ten-object example (Kendall 1970, ch. 1; from memory): tau = 5/45 = 0.1111.
        double[] a = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10];
        double[] b = [4, 7, 2, 10, 3, 6, 8, 1, 5, 9];
        string text = Print(new PairedSample(a, b, "judge A", "judge B"));
        Assert.Contains("Dependence between 'judge A' (x) and 'judge B' (y), n = 10", text);
        Assert.Matches(@"Kendall tau-b\s+0\.1111\s+\[-?\d\.\d+, \d\.\d+\]\s+0\.\d{4}", text);
        Assert.Matches(@"Pearson r\s+0\.\d+", text);
        Assert.Matches(@"Spearman rho\s+0\.\d+", text);
        Assert.Contains("Tail dependence (empirical, k = 3", text);
        Assert.Contains("Note: Tail: only k = 3", text); // small-sample caution is shown
        Assert.DoesNotContain("NaN", text);
    }

    [Fact]
    public void ShowsUndefinedMeasuresWithTheReason()
    {
        string text = Print(new PairedSample([1, 2, 3, 4], [2, 2, 2, 2], "a", "flat"));
        Assert.Matches(@"Pearson r\s+undefined\s+-\s+-", text);
        Assert.Contains("Note: Pearson: undefined: 'flat' is constant", text);
        Assert.Contains("Tail dependence: undefined", text);
        Assert.DoesNotContain("NaN", text);
    }

    [Fact]
    public void FormatsTinyPValuesScientifically()
    {
        Assert.Equal("< 1e-300", TextTable.PValue(0));
        Assert.Equal("3.2e-07", TextTable.PValue(3.2e-7));
        Assert.Equal("0.0420", TextTable.PValue(0.042));
        Assert.Equal("-", TextTable.PValue(null));
        Assert.Equal("12.3457", TextTable.Number(12.345678));
        Assert.Equal("1.5e-07", TextTable.Number(1.5e-7));
    }
}
