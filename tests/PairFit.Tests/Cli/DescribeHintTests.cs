using PairFit.Cli.Demo;

namespace PairFit.Tests.Cli;

public class DescribeHintTests : IDisposable
{
    private readonly string _csv = Path.Combine(Path.GetTempPath(), "pairfit-describe-" + Guid.NewGuid().ToString("N") + ".csv");

    public DescribeHintTests() => File.WriteAllText(_csv, DemoDataGenerator.StormCsv());

    public void Dispose() => File.Delete(_csv);

    [Fact]
    public void ASentinelMinimumGetsAHintThatGoesAwayOnceDeclaredMissing()
    {
        // The synthetic storm file marks about 0.5 % of runoff readings with the logger sentinel -9999.
        var plain = CliShellTests.Run("describe", _csv);
        Assert.Equal(0, plain.Code);
        Assert.Contains("add --missing -9999", plain.Out);
        var declared = CliShellTests.Run("describe", _csv, "--missing", "-9999");
        Assert.Equal(0, declared.Code);
        Assert.DoesNotContain("add --missing", declared.Out);
    }
}
