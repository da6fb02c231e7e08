using System.CommandLine;
using System.Globalization;
using PairFit.Core;
using PairFit.Core.Data;
using PairFit.Core.Results;

namespace PairFit.Cli.Commands;

/// <summary>`pairfit analyze &lt;csv&gt; --x &lt;col&gt; --y &lt;col&gt;`: the whole pipeline on one pair of columns.</summary>
public static class AnalyzeCommand
{
    public static Command Build()
    {
        var csv = new Argument<string>("csv") { Description = "CSV file with a header row." };
        var x = new Option<string>("--x") { Description = "Column for X: header name or 1-based index.", Required = true };
        var y = new Option<string>("--y") { Description = "Column for Y: header name or 1-based index.", Required = true };
        var json = new Option<string?>("--json") { Description = "Write the results file (JSON) here." };
        var seed = new Option<int>("--seed") { Description = "Seed for every random draw (bootstrap, Monte Carlo).", DefaultValueFactory = _ => 20261202 };
        var csvOptions = new CsvReadingOptions();
        var command = new Command("analyze", "Fit and test the joint law of two columns and report it.") { csv, x, y, json, seed };
        csvOptions.AddTo(command);
        command.SetAction(parse => PairFitCli.Guard(parse, (output, error) =>
        {
            var options = new AnalysisOptions
            {
                CsvPath = parse.GetValue(csv)!,
                X = new ColumnSelector(parse.GetValue(x)!),
                Y = new ColumnSelector(parse.GetValue(y)!),
                Csv = csvOptions.Read(parse),
                Seed = parse.GetValue(seed),
            };
            var results = AnalysisPipeline.Run(options, new Progress<string>(s => error.WriteLine($"pairfit: {s}...")));
            ConsoleSummary.Write(results, output);
            if (parse.GetValue(json) is { } jsonPath)
            {
                ResultsFile.Write(results, jsonPath);
                error.WriteLine($"pairfit: results written to {jsonPath}");
            }
            return PairFitCli.ExitOk;
        }));
        return command;
    }
}
