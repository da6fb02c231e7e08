using System.CommandLine;

namespace PairFit.Cli.Commands;

/// <summary>`pairfit describe &lt;csv&gt;`: columns, detected types, counts, missing values, ranges.</summary>
public static class DescribeCommand
{
    public static Command Build()
    {
        var csv = new Argument<string>("csv") { Description = "CSV file with a header row." };
        var csvOptions = new CsvReadingOptions();
        var command = new Command("describe", "Summarise every column of a CSV file: type, counts, missing values, min/median/max, skewness.") { csv };
        csvOptions.AddTo(command);
        command.SetAction(parse => PairFitCli.Guard(parse, (output, error) =>
            throw new Core.Common.PairFitAnalysisException("describe is being written (issue 2).")));
        return command;
    }
}
