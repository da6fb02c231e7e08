using System.CommandLine;
using PairFit.Cli.Printing;
using PairFit.Core.Projection;
using PairFit.Core.Results;

namespace PairFit.Cli.Commands;

/// <summary>`pairfit joint &lt;results.json&gt; --x-value a --y-value b`: joint exceedance probabilities and return periods.</summary>
public static class JointCommand
{
    public static Command Build()
    {
        var results = new Argument<string>("results") { Description = "Results file written by 'pairfit analyze --json'." };
        var xValue = new Option<double>("--x-value") { Description = "Design value a of X.", Required = true };
        var yValue = new Option<double>("--y-value") { Description = "Design value b of Y.", Required = true };
        var rate = new Option<double?>("--events-per-year") { Description = "Mean number of events per year (default 1, as for annual maxima)." };
        var period = new Option<double?>("--return-period") { Description = "Target return period in years: print the design isolines and most likely design events." };
        var json = new Option<string?>("--json") { Description = "Write the results file with these joint results added." };
        var command = new Command("joint", "Joint exceedance probabilities and AND / OR / Kendall return periods of a design pair.")
        {
            results, xValue, yValue, rate, period, json,
        };
        command.SetAction(parse => PairFitCli.Guard(parse, (output, error) =>
        {
            string path = parse.GetValue(results)!;
            var model = ResultsFile.ReadModel(path, out var saved);
            var section = JointAnalysis.Compute(model, new JointOptions
            {
                XValue = parse.GetValue(xValue),
                YValue = parse.GetValue(yValue),
                EventsPerYear = parse.GetValue(rate),
                ReturnPeriod = parse.GetValue(period),
            });
            ProjectionTable.Write(section, output);
            if (parse.GetValue(json) is { } jsonPath)
            {
                ResultsFile.Write(saved with { Joint = section }, jsonPath);
                error.WriteLine($"pairfit: results written to {jsonPath}");
            }
            return PairFitCli.ExitOk;
        }));
        return command;
    }
}
