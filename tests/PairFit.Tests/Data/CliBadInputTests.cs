using PairFit.Cli;

namespace PairFit.Tests.Data;

/// <summary>Bad input through the command line: exit code 2, one line naming the problem, no stack trace.</summary>
public class CliBadInputTests : CsvFileTests
{
    private static (int Code, string Out, string Err) Run(params string[] args) => PairFit.Tests.Cli.CliShellTests.Run(args);

    public static TheoryData<string, string?, string, string> AnalyzeCases() => new()
    {
        // name, file content (null = no file), --y column, expected words
        { "missing file", null, "b", "does not exist" },
        { "empty file", "", "b", "is empty" },
        { "header only", "a,b\n", "b", "no data rows" },
        { "unknown column", "a,b\n1,2\n3,4\n", "flow", "the columns are: a, b" },
        { "non-numeric column", "a,b\n1,low\n2,high\n3,low\n", "b", "holds no numbers" },
        { "one usable row", "a,b\n1,2\n3,NA\n,5\n", "b", "only one usable row" },
        { "constant column", "a,b\n1,7\n2,7\n3,7\n", "b", "is constant" },
        { "mixed delimiters", "a,b\n1,2\n3;4\n5,6\n", "b", "line 3 has 1 field(s) but the header has 2" },
        { "non-finite value", "a,b\n1,2\n3,inf\n5,6\n", "b", "infinite" },
    };

    private static void AssertOneLineBadInput((int Code, string Out, string Err) r, string expected)
    {
        Assert.Equal(PairFitCli.ExitBadInput, r.Code);
        var lines = r.Err.Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries);
        // Exactly one error line that names the problem; anything else on stderr is a progress
        // line of the form "pairfit: <stage>..." written before the problem was found.
        var errors = lines.Where(l => l.StartsWith("pairfit: error: ", StringComparison.Ordinal)).ToArray();
        Assert.Single(errors);
        Assert.Contains(expected, errors[0]);
        Assert.All(lines.Except(errors), l => Assert.Matches(@"^pairfit: [^\n]*\.\.\.$", l));
        Assert.DoesNotContain("   at ", r.Err + r.Out);
        Assert.DoesNotContain("Exception", r.Err);
    }

    [Theory]
    [MemberData(nameof(AnalyzeCases))]
    public void AnalyzeRefusesBadInputWithOneLine(string name, string? content, string yColumn, string expected)
    {
        string path = content is null ? Files.PathOf("absent.csv") : Files.Write(name.Replace(' ', '-') + ".csv", content);
        var r = Run("analyze", path, "--x", "a", "--y", yColumn);
        AssertOneLineBadInput(r, expected);
    }

    [Theory]
    [InlineData("missing file", null, "does not exist")]
    [InlineData("empty file", "", "is empty")]
    [InlineData("header only", "a,b\n", "no data rows")]
    [InlineData("mixed delimiters", "a,b\n1,2\n3;4\n", "line 3 has 1 field(s)")]
    [InlineData("ambiguous header", "a;b,c\n1;2,3\n", "mixes delimiters")]
    public void DescribeRefusesBadInputWithOneLine(string name, string? content, string expected)
    {
        string path = content is null ? Files.PathOf("absent.csv") : Files.Write(name.Replace(' ', '-') + ".csv", content);
        AssertOneLineBadInput(Run("describe", path), expected);
    }

    [Fact]
    public void BadDelimiterOptionIsOneLine()
    {
        string path = Files.Write("ok.csv", "a,b\n1,2\n3,4\n");
        AssertOneLineBadInput(Run("describe", path, "--delimiter", "pipe-ish"), "--delimiter");
    }

    [Fact]
    public void NamedAndSingleCharacterDelimitersAreAccepted()
    {
        string path = Files.Write("pipe.csv", "a|b\n1|2\n3|4\n");
        Assert.Contains("delimiter: '|'", Run("describe", path, "--delimiter", "pipe").Out);
        Assert.Contains("delimiter: '|'", Run("describe", path, "--delimiter", "|").Out);
        AssertOneLineBadInput(Run("describe", path, "--delimiter", "x"), "--delimiter 'x' is not usable");
    }

    [Fact]
    public void DescribePrintsEveryColumnWithItsType()
    {
        string path = Files.Write("ok.csv", "site,rain,flow\nA,1.5,2\nB,NA,3\nC,4.5,-9999\n");
        var (code, output, _) = Run("describe", path, "--missing", "-9999");
        Assert.Equal(0, code);
        Assert.Contains("3 data row(s), 3 column(s); delimiter: comma", output);
        Assert.Matches(@"1\s+site\s+text\s+3\s+0\s+0", output);
        Assert.Matches(@"2\s+rain\s+number\s+3\s+1\s+2\s+1\.5\s+3\s+4\.5", output);
        Assert.Matches(@"3\s+flow\s+integer\s+3\s+1\s+2\s+2\s+2\.5\s+3", output);
    }
}
