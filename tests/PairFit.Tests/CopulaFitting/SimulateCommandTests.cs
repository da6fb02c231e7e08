using System.Globalization;
using PairFit.Cli;
using PairFit.Cli.Printing;
using PairFit.Core.Copulas;
using PairFit.Core.Copulas.Fitting;
using PairFit.Core.Dependence;
using PairFit.Core.Marginals;
using PairFit.Core.Model;
using PairFit.Core.Results;

namespace PairFit.Tests.CopulaFitting;

public sealed class SimulateCommandTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("pairfit-simulate-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static (int Code, string Out, string Err) Run(params string[] args) => PairFit.Tests.Cli.CliShellTests.Run(args);

    private static AnalysisResults Results(ModelSection? model) => new()
    {
        Input = new InputSection { XColumn = "peak flow", YColumn = "volume" },
        Dependence = new DependenceSection
        {
            Pearson = new CorrelationEstimate(), Spearman = new CorrelationEstimate(),
            Kendall = new CorrelationEstimate(), Tail = new TailDependenceEstimate(),
        },
        Model = model,
    };

    private string SavedModel()
    {
        var model = new JointModel(new NormalDistribution(100, 15), new LogNormalDistribution(1, 0.4), new RotatedCopula(new ClaytonLaw(2.0), 180));
        string path = Path.Combine(_dir, "results.json");
        ResultsFile.Write(Results(ModelSection.From(model, "peak flow", "volume")), path);
        return path;
    }

    private static (double[] X, double[] Y, string Header) ReadCsv(string path)
    {
        var lines = File.ReadAllLines(path);
        var x = new double[lines.Length - 1];
        var y = new double[lines.Length - 1];
        for (int i = 1; i < lines.Length; i++)
        {
            var p = lines[i].Split(',');
            x[i - 1] = double.Parse(p[0], CultureInfo.InvariantCulture);
            y[i - 1] = double.Parse(p[1], CultureInfo.InvariantCulture);
        }
        return (x, y, lines[0]);
    }

    [Fact]
    public void WritesPairsFromTheSavedModelReproduciblyFromTheSeed()
    {
        string results = SavedModel(), a = Path.Combine(_dir, "a.csv"), b = Path.Combine(_dir, "b.csv"), c = Path.Combine(_dir, "c.csv");
        Assert.Equal(0, Run("simulate", results, "--n", "2000", "--out", a, "--seed", "5").Code);
        Assert.Equal(0, Run("simulate", results, "--n", "2000", "--out", b, "--seed", "5").Code);
        Assert.Equal(0, Run("simulate", results, "--n", "2000", "--out", c, "--seed", "6").Code);
        Assert.Equal(File.ReadAllBytes(a), File.ReadAllBytes(b));
        Assert.NotEqual(File.ReadAllBytes(a), File.ReadAllBytes(c));

        var (x, y, header) = ReadCsv(a);
        Assert.Equal("peak flow,volume", header);
        Assert.Equal(2000, x.Length);
        // Kendall's tau of the draws against the model's θ/(θ+2) = 0.5 (Nelsen 2006, Example 5.4); the sampling SD of
        // tau-hat at n = 2000 is below 0.015, so 0.05 is more than 3 SD.
        Assert.InRange(KendallTau.TauB(x, y), 0.45, 0.55);
        // Marginal means against the saved laws: normal mean 100 (SD of the mean 15/√2000 ≈ 0.34), lognormal e^(1+0.08) ≈ 2.945.
        Assert.InRange(x.Average(), 100 - 1.5, 100 + 1.5);
        Assert.InRange(y.Average(), Math.Exp(1.08) - 0.1, Math.Exp(1.08) + 0.1);
    }

    [Fact]
    public void RefusesToOverwriteWithoutForce()
    {
        string results = SavedModel(), outPath = Path.Combine(_dir, "pairs.csv");
        File.WriteAllText(outPath, "keep me");
        var (code, _, err) = Run("simulate", results, "--n", "10", "--out", outPath);
        Assert.Equal(PairFitCli.ExitBadInput, code);
        Assert.Contains("--force", err);
        Assert.Equal("keep me", File.ReadAllText(outPath));
        Assert.Equal(0, Run("simulate", results, "--n", "10", "--out", outPath, "--force").Code);
        Assert.Equal(11, File.ReadAllLines(outPath).Length);
        Assert.Empty(Directory.GetFiles(_dir, "*.tmp-*"));
    }

    [Fact]
    public void BadInputsGiveExitCodeTwoAndOneLine()
    {
        string noModel = Path.Combine(_dir, "nomodel.json");
        ResultsFile.Write(Results(null), noModel);
        var outPath = Path.Combine(_dir, "x.csv");
        foreach (var args in new[]
        {
            new[] { "simulate", Path.Combine(_dir, "missing.json"), "--n", "10", "--out", outPath },
            new[] { "simulate", noModel, "--n", "10", "--out", outPath },
            new[] { "simulate", SavedModel(), "--n", "0", "--out", outPath },
        })
        {
            var (code, _, err) = Run(args);
            Assert.Equal(PairFitCli.ExitBadInput, code);
            Assert.DoesNotContain("   at ", err);
        }
        Assert.False(File.Exists(outPath));
    }

    [Fact]
    public void CopulaTableListsCandidatesInAicOrderAndTheExclusions()
    {
        var sample = FittingTestData.Simulate(new ClaytonLaw(2.0), 300, 2);
        var r = CopulaAnalysis.Fit(sample, null, null, new CopulaOptions { GofReplicates = 19, Seed = 3 });
        var w = new StringWriter();
        CopulaTable.Write(r.Section, w);
        string text = w.ToString();
        var lines = text.Split('\n');
        int first = Array.FindIndex(lines, l => l.TrimStart().StartsWith("1 "));
        Assert.Contains(r.Section.Candidates[0].Family, lines[first]);
        Assert.Contains("Selected copula: clayton", text);
        Assert.Contains("Not fitted:", text);
        Assert.Contains("p = ", text);
        Assert.Equal(r.Section.Candidates.Count, lines.Count(l => System.Text.RegularExpressions.Regex.IsMatch(l, @"^\s+\d+\s{2}\S")));
    }
}
