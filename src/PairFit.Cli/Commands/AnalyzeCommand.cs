using System.CommandLine;
using PairFit.Core;
using PairFit.Core.Data;

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
        var outDir = new Option<string?>("--out") { Description = "Write the report folder (report, figures, tables, results file) here." };
        var force = new Option<bool>("--force") { Description = "Replace an existing --out folder or --json file." };
        var seed = new Option<int>("--seed") { Description = "Seed for every random draw (bootstrap, Monte Carlo).", DefaultValueFactory = _ => 20261202 };
        var csvOptions = new CsvReadingOptions();
        var command = new Command("analyze", "Fit and test the joint law of two columns and report it.") { csv, x, y, json, outDir, force, seed };
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
            var outputs = new AnalysisOutputs { JsonPath = parse.GetValue(json), ReportFolder = parse.GetValue(outDir), Force = parse.GetValue(force) };
            AnalysisRun.Execute(options, outputs, output, error);
            return PairFitCli.ExitOk;
        }));
        return command;
    }
}
