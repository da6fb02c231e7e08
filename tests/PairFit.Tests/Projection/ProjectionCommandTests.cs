using PairFit.Cli;

namespace PairFit.Tests.Projection;

public class ProjectionCommandTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), "pairfit-projection-" + Guid.NewGuid().ToString("N"));
    private readonly string _model;

    public ProjectionCommandTests()
    {
        Directory.CreateDirectory(_dir);
        _model = Path.Combine(_dir, "model.json");
        // A synthetic saved model (invented numbers).
        File.WriteAllText(_model, """
        {
          "format": "pairfit-results", "version": 1,
          "input": { "xColumn": "rain", "yColumn": "runoff", "rowsRead": 10, "rowsUsed": 10 },
          "dependence": { "n": 10, "pearson": {}, "spearman": {}, "kendall": {}, "tail": {} },
          "model": { "xColumn": "rain", "yColumn": "runoff",
            "x": { "family": "lognormal", "parameters": { "mu": 3, "sigma": 0.5 } },
            "y": { "family": "exponential", "parameters": { "rate": 0.1 } },
            "copula": { "family": "clayton", "rotation": 180, "parameters": { "theta": 2 } } }
        }
        """);
    }

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static (int Code, string Out, string Err) Run(params string[] args)
    {
        var o = new StringWriter();
        var e = new StringWriter();
        int code = PairFitCli.Run(args, o, e);
        return (code, o.ToString(), e.ToString());
    }

    [Fact]
    public void ProjectPrintsTheTableAndWritesTheResultsFile()
    {
        string output = Path.Combine(_dir, "out.json");
        var (code, stdout, stderr) = Run("project", _model, "--expr", "runoff / rain", "--threshold", "1", "--method", "montecarlo",
            "--draws", "2000", "--quantile", "0.5", "--json", output);
        Assert.True(code == 0, stderr);
        Assert.Contains("Q = runoff / rain", stdout);
        Assert.Contains("P(Q > 1)", stdout);
        Assert.Contains("comonotonic", stdout);
        var saved = PairFit.Core.Results.ResultsFile.Read(output);
        Assert.Single(saved.Projections!);
        Assert.Equal("montecarlo", saved.Projections![0].Method);
    }

    [Fact]
    public void BadExpressionShowsACaretAndExitsTwo()
    {
        var (code, _, stderr) = Run("project", _model, "--expr", "runoff / (rain + * 2)");
        Assert.Equal(PairFitCli.ExitBadInput, code);
        var lines = stderr.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Contains("position 18", lines[0]);
        Assert.Equal("  runoff / (rain + * 2)", lines[1]);
        Assert.Equal(2 + 17, lines[2].IndexOf('^'));
    }

    [Fact]
    public void MissingResultsFileIsBadInput()
    {
        var (code, _, stderr) = Run("joint", Path.Combine(_dir, "none.json"), "--x-value", "1", "--y-value", "2");
        Assert.Equal(PairFitCli.ExitBadInput, code);
        Assert.Contains("does not exist", stderr);
    }

    [Fact]
    public void JointPrintsReturnPeriodsAndDesigns()
    {
        var (code, stdout, stderr) = Run("joint", _model, "--x-value", "40", "--y-value", "30", "--events-per-year", "2", "--return-period", "50");
        Assert.True(code == 0, stderr);
        Assert.Contains("AND (both exceed)", stdout);
        Assert.Contains("most likely design event", stdout);
        Assert.Contains("design for T = 50 years, kendall", stdout);
    }
}
