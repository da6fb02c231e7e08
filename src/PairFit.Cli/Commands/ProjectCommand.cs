using System.CommandLine;
using PairFit.Cli.Printing;
using PairFit.Core.Data;
using PairFit.Core.Projection;
using PairFit.Core.Results;

namespace PairFit.Cli.Commands;

/// <summary>`pairfit project &lt;results.json&gt; --expr "&lt;expr&gt;"`: the distribution of an expression under a saved model.</summary>
public static class ProjectCommand
{
    public static Command Build()
    {
        var results = new Argument<string>("results") { Description = "Results file written by 'pairfit analyze --json'." };
        var expr = new Option<string>("--expr") { Description = "Expression in x and y (or the column names), e.g. \"x + y\", \"y / x\", \"max(x, y)\".", Required = true };
        var threshold = new Option<double[]>("--threshold") { Description = "Report P(Q > t) for this t (repeatable).", DefaultValueFactory = _ => [] };
        var level = new Option<double[]>("--level") { Description = "Value-at-risk and tail value-at-risk level (repeatable).", DefaultValueFactory = _ => [0.99] };
        var probability = new Option<double[]>("--quantile") { Description = "Quantile probability (repeatable).", DefaultValueFactory = _ => [0.5, 0.9, 0.95, 0.99, 0.995] };
        var method = new Option<string>("--method") { Description = "auto (exact quadrature where y can be solved for, else Monte Carlo), quadrature or montecarlo.", DefaultValueFactory = _ => "auto" };
        method.AcceptOnlyFromAmong("auto", "quadrature", "montecarlo");
        var draws = new Option<int>("--draws") { Description = "Monte Carlo draws.", DefaultValueFactory = _ => 200_000 };
        var check = new Option<bool>("--check") { Description = "Also run Monte Carlo and report whether it agrees with quadrature." };
        var seed = new Option<int>("--seed") { Description = "Seed for every random draw.", DefaultValueFactory = _ => 20261202 };
        var data = new Option<string?>("--data") { Description = "CSV with the observed pairs (same column names as the model) for the empirical comparison." };
        var json = new Option<string?>("--json") { Description = "Write the results file with this projection added." };
        var csvOptions = new CsvReadingOptions();
        var command = new Command("project", "Distribution of an expression Q(x, y) under a saved joint model.")
        {
            results, expr, threshold, level, probability, method, draws, check, seed, data, json,
        };
        csvOptions.AddTo(command);
        command.SetAction(parse => PairFitCli.Guard(parse, (output, error) =>
        {
            string path = parse.GetValue(results)!;
            var model = ResultsFile.ReadModel(path, out var saved);
            string xName = saved.Model!.XColumn, yName = saved.Model.YColumn;
            string expression = parse.GetValue(expr)!;
            if (ExpressionParser.TryParse(expression, xName, yName, out var syntax) is null && syntax is not null)
            {
                error.WriteLine($"pairfit: error: {syntax.Message}");
                error.WriteLine(syntax.SourceLine);
                error.WriteLine(syntax.CaretLine);
                return PairFitCli.ExitBadInput;
            }
            PairedSample? sample = parse.GetValue(data) is { } csv
                ? PairedCsvReader.Read(csv, new ColumnSelector(xName), new ColumnSelector(yName), csvOptions.Read(parse))
                : null;
            var options = new ProjectionOptions
            {
                Probabilities = parse.GetValue(probability)!,
                Thresholds = parse.GetValue(threshold)!,
                Levels = parse.GetValue(level)!,
                Method = parse.GetValue(method)!,
                MonteCarloDraws = parse.GetValue(draws),
                Check = parse.GetValue(check),
                Seed = parse.GetValue(seed),
            };
            var section = ProjectionAnalysis.Project(model, expression, xName, yName, sample, options);
            ProjectionTable.Write(section, output);
            if (parse.GetValue(json) is { } jsonPath)
            {
                ResultsFile.Write(saved with { Projections = [.. saved.Projections ?? [], section] }, jsonPath);
                error.WriteLine($"pairfit: results written to {jsonPath}");
            }
            return section.Check is { Agree: false } ? PairFitCli.ExitAnalysisFailed : PairFitCli.ExitOk;
        }));
        return command;
    }
}
