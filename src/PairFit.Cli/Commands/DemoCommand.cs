using System.CommandLine;
using PairFit.Cli.Demo;
using PairFit.Core;
using PairFit.Core.Data;
using PairFit.Core.Projection;

namespace PairFit.Cli.Commands;

/// <summary>
/// `pairfit demo`: the whole analysis of the built-in synthetic demo data (storm rainfall and
/// runoff; two loss lines), written as report folders. Works from any directory: the data are
/// embedded in the program and copied beside the reports.
/// </summary>
public static class DemoCommand
{
    public static Command Build()
    {
        var outDir = new Option<string>("--out") { Description = "Folder for the demo reports.", DefaultValueFactory = _ => "pairfit-demo" };
        var force = new Option<bool>("--force") { Description = "Replace an existing demo folder." };
        var seed = new Option<int>("--seed") { Description = "Seed for every random draw.", DefaultValueFactory = _ => 20261202 };
        var command = new Command("demo", "Analyse the built-in synthetic demo data and write complete report folders.") { outDir, force, seed };
        command.SetAction(parse => PairFitCli.Guard(parse, (output, error) =>
        {
            string root = parse.GetValue(outDir)!;
            var folder = OutputFolder.Begin(root, parse.GetValue(force));
            try
            {
                string data = Path.Combine(folder.Staging, "data");
                Directory.CreateDirectory(data);
                foreach (var s in Scenarios)
                {
                    string csv = Path.Combine(data, s.File);
                    File.WriteAllText(csv, DemoData.ReadText(s.File));
                    output.WriteLine($"== {s.Title} (synthetic) ==");
                    var options = s.Options(csv, parse.GetValue(seed)) with { SourceLabel = $"data/{s.File} (synthetic demo data)" };
                    AnalysisRun.Execute(options, new AnalysisOutputs
                    {
                        ReportFolder = Path.Combine(folder.Staging, s.Folder),
                        ReportFolderLabel = Path.Combine(root, s.Folder),
                    }, output, error);
                    output.WriteLine();
                }
                folder.Commit();
            }
            catch
            {
                folder.Abandon();
                throw;
            }
            error.WriteLine($"pairfit: demo reports written to {root}/");
            return PairFitCli.ExitOk;
        }));
        return command;
    }

    private sealed record Scenario(string Title, string File, string Folder, Func<string, int, AnalysisOptions> Options);

    private static readonly Scenario[] Scenarios =
    [
        new("Storm rainfall and runoff at a fictional catchment", DemoDataGenerator.StormFile, "storm-events",
            (csv, seed) => new AnalysisOptions
            {
                CsvPath = csv,
                X = new ColumnSelector("rainfall_mm"),
                Y = new ColumnSelector("runoff_mm"),
                Csv = new CsvOptions { MissingTokens = ["-9999"] },
                Seed = seed,
                // The event runoff coefficient: the share of the storm's rain that ran off.
                Projections = ["runoff_mm / rainfall_mm"],
                Projection = new ProjectionOptions { Thresholds = [0.5, 1.0], Levels = [0.99] },
                // A storm of 85 mm giving 40 mm of runoff; 3,000 events in 25 years = 120 a year.
                Joint = new JointOptions { XValue = 85, YValue = 40, EventsPerYear = 120, ReturnPeriod = 10 },
            }),
        new("Yearly losses of two fictional business lines", DemoDataGenerator.LossFile, "loss-lines",
            (csv, seed) => new AnalysisOptions
            {
                CsvPath = csv,
                X = new ColumnSelector("line_a_loss_millions"),
                Y = new ColumnSelector("line_b_loss_millions"),
                Seed = seed,
                // The total yearly loss of the two lines.
                Projections = ["line_a_loss_millions + line_b_loss_millions"],
                Projection = new ProjectionOptions { Thresholds = [150, 200], Levels = [0.99, 0.995] },
                // A year with 130 million on line A and 80 million on line B; one record per year.
                Joint = new JointOptions { XValue = 130, YValue = 80, EventsPerYear = 1, ReturnPeriod = 100 },
            }),
    ];
}
