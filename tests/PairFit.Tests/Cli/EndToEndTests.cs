using System.Text.Json;
using PairFit.Cli;
using PairFit.Cli.Demo;

namespace PairFit.Tests.Cli;

/// <summary>
/// The whole pipeline through the command line, on the loss-lines demo file (synthetic: survival
/// Clayton theta = 1.2, lognormal and gamma marginals; see data-demo/README.md), with a small
/// bootstrap and PNG figures only to keep the run short.
/// </summary>
public class EndToEndTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), "pairfit-e2e-" + Guid.NewGuid().ToString("N"));

    public EndToEndTests() => Directory.CreateDirectory(_dir);

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static (int Code, string Out, string Err) Run(params string[] args) => CliShellTests.Run(args);

    [Fact]
    public void AnalyzeWritesACompleteReportFolderThatLaterCommandsReuse()
    {
        string csv = Path.Combine(_dir, DemoDataGenerator.LossFile);
        File.WriteAllText(csv, DemoDataGenerator.LossCsv());
        string report = Path.Combine(_dir, "report");

        var (code, output, error) = Run("analyze", csv, "--x", "line_a_loss_millions", "--y", "line_b_loss_millions",
            "--gof-replicates", "20", "--figures", "png", "--out", report,
            "--project", "line_a_loss_millions + line_b_loss_millions", "--threshold", "150", "--level", "0.99",
            "--design-x", "130", "--design-y", "80", "--events-per-year", "1", "--return-period", "100");
        Assert.True(code == 0, error);
        Assert.Contains("clayton", output);

        foreach (var f in new[] { "report.md", "report.html", "tables.tex", "results.json", "figures/scatter.png", "figures/copula.png" })
            Assert.True(File.Exists(Path.Combine(report, f)), $"missing {f}");
        Assert.Empty(Directory.GetFiles(report, "*.svg", SearchOption.AllDirectories)); // only PNG was asked for

        string json = Path.Combine(report, "results.json");
        using (var doc = JsonDocument.Parse(File.ReadAllText(json)))
        {
            var root = doc.RootElement;
            Assert.Equal("pairfit-results", root.GetProperty("format").GetString());
            Assert.Equal(1, root.GetProperty("version").GetInt32());
            Assert.Equal(2000, root.GetProperty("input").GetProperty("rowsUsed").GetInt32());
            // The generator's truth is a survival Clayton (180°) with theta = 1.2; n = 2000 gives a
            // standard error near 0.05, so the selected family and rotation must be recovered and
            // theta within 4 standard errors.
            var sel = root.GetProperty("copula").GetProperty("selected");
            Assert.Equal("clayton", sel.GetProperty("family").GetString());
            Assert.Equal(180, sel.GetProperty("rotation").GetInt32());
            double theta = sel.GetProperty("parameters").GetProperty("theta").GetDouble();
            double se = sel.GetProperty("standardErrors").GetProperty("theta").GetDouble();
            Assert.InRange(theta, DemoDataGenerator.LossTheta - 4 * se, DemoDataGenerator.LossTheta + 4 * se);
            Assert.Equal("lognormal", root.GetProperty("marginals").GetProperty("x").GetProperty("selected").GetString());
            // Pearson type III is the gamma law with a free location, so AIC may prefer either.
            Assert.Contains(root.GetProperty("marginals").GetProperty("y").GetProperty("selected").GetString(), new[] { "gamma", "pearson3" });
            Assert.Single(root.GetProperty("projections").EnumerateArray());
            Assert.True(root.TryGetProperty("joint", out _));
            Assert.True(root.TryGetProperty("model", out _));
        }

        // A second analyze into the same folder is refused, and the folder is left as it was.
        var again = Run("analyze", csv, "--x", "line_a_loss_millions", "--y", "line_b_loss_millions", "--out", report);
        Assert.Equal(PairFitCli.ExitBadInput, again.Code);
        Assert.Contains("--force", again.Err);
        Assert.True(File.Exists(json));

        // Later commands reuse the saved model without refitting.
        var project = Run("project", json, "--expr", "x + y");
        Assert.True(project.Code == 0, project.Err);
        var joint = Run("joint", json, "--x-value", "130", "--y-value", "80", "--events-per-year", "1");
        Assert.True(joint.Code == 0, joint.Err);
        string pairs = Path.Combine(_dir, "pairs.csv");
        var simulate = Run("simulate", json, "--n", "500", "--out", pairs);
        Assert.True(simulate.Code == 0, simulate.Err);
        Assert.Equal(501, File.ReadAllLines(pairs).Length); // header + 500 pairs
    }

    [Theory]
    [InlineData("--project", "x + * y", "position 5")]
    [InlineData("--copula-method", "maximum", "copula method")]
    [InlineData("--copulas", "clayton,bogus", "bogus")]
    [InlineData("--x-marginal", "nosuch", "nosuch")]
    public void OptionMistakesAreReportedBeforeAnyFitting(string option, string value, string expected)
    {
        string csv = Path.Combine(_dir, DemoDataGenerator.LossFile);
        File.WriteAllText(csv, DemoDataGenerator.LossCsv());
        var (code, _, error) = Run("analyze", csv, "--x", "2", "--y", "3", option, value);
        Assert.Equal(PairFitCli.ExitBadInput, code);
        Assert.Contains(expected, error);
        Assert.DoesNotContain("marginal fits", error); // stopped before the first fitting stage
    }

    [Fact]
    public void DemoDataFilesMatchTheirGenerator()
    {
        // The committed demo files must be exactly what the documented generator writes, so the
        // README's claim that they can be regenerated byte for byte stays true. If a numerical change
        // moves a rounded digit, regenerate: dotnet run --project src/PairFit.Cli -- generate-demo-data --out data-demo
        Assert.Equal(DemoDataGenerator.StormCsv(), DemoData.ReadText(DemoDataGenerator.StormFile));
        Assert.Equal(DemoDataGenerator.LossCsv(), DemoData.ReadText(DemoDataGenerator.LossFile));
    }
}
