using PairFit.Core;
using PairFit.Core.Results;

namespace PairFit.Cli;

/// <summary>Where an analysis writes: an optional results file and an optional report folder.</summary>
public sealed record AnalysisOutputs
{
    public string? JsonPath { get; init; }
    public string? ReportFolder { get; init; }
    public bool Force { get; init; }
}

/// <summary>Runs one analysis and writes its console summary, results file and report folder.</summary>
public static class AnalysisRun
{
    public static AnalysisResults Execute(AnalysisOptions options, AnalysisOutputs outputs, TextWriter output, TextWriter error)
    {
        // Refuse an existing report folder before spending time on the fit.
        var folder = outputs.ReportFolder is { } dir ? OutputFolder.Begin(dir, outputs.Force) : null;
        if (outputs.JsonPath is { } jp && File.Exists(jp) && !outputs.Force)
            throw new Core.Common.PairFitInputException($"results file '{jp}' already exists; choose another with --json or add --force to replace it.");
        try
        {
            var progress = new Progress<string>(s => error.WriteLine($"pairfit: {s}..."));
            var results = AnalysisPipeline.Run(options, progress);
            ConsoleSummary.Write(results, output);
            if (outputs.JsonPath is { } jsonPath)
            {
                ResultsFile.Write(results, jsonPath);
                error.WriteLine($"pairfit: results written to {jsonPath}");
            }
            if (folder is not null)
            {
                ResultsFile.Write(results, Path.Combine(folder.Staging, "results.json"));
                folder.Commit();
                error.WriteLine($"pairfit: report written to {outputs.ReportFolder}");
            }
            return results;
        }
        catch
        {
            folder?.Abandon();
            throw;
        }
    }
}
