using PairFit.Cli;

namespace PairFit.Tests.Cli;

public class CliShellTests
{
    internal static (int Code, string Out, string Err) Run(params string[] args)
    {
        var o = new StringWriter();
        var e = new StringWriter();
        int code = PairFitCli.Run(args, o, e);
        return (code, o.ToString(), e.ToString());
    }

    [Fact]
    public void UnknownOptionIsBadUsageWithOneLineAndNoStackTrace()
    {
        var (code, _, err) = Run("analyze", "a.csv", "--x", "a", "--y", "b", "--bogus");
        Assert.Equal(PairFitCli.ExitBadInput, code);
        Assert.Contains("--bogus", err);
        Assert.DoesNotContain("   at ", err);
    }

    [Fact]
    public void HelpExitsZero()
    {
        var (code, output, _) = Run("--help");
        Assert.Equal(0, code);
        Assert.Contains("analyze", output);
    }
}
