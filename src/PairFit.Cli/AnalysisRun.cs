using PairFit.Core;
using PairFit.Core.Results;

namespace PairFit.Cli;

/// <summary>Where an analysis writes: an optional results file and an optional report folder.</summary>
public sealed record AnalysisOutputs
{
    public string? JsonPath { get; init; }
    public string? ReportFolder { get; init; }
    public bool Force { get; init; }
    public Commands.FigureRequest? Figures { get; init; }

    /// <summary>How to name the report folder in messages, when it is written somewhere temporary first.</summary>
    public string? ReportFolderLabel { get; init; }
}

/// <summary>
/// Progress lines on stderr, written at once and in order. (System.Progress posts each report to the
/// thread pool, so lines from parallel work arrive late and shuffled.)
/// </summary>
public sealed class ConsoleProgress(TextWriter error) : IProgress<string>
{
    private readonly object _gate = new();

    public void Report(string value)
    {
        lock (_gate) error.WriteLine($"pairfit: {value}...");
    }
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
            var progress = new ConsoleProgress(error);
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
                error.WriteLine($"pairfit: report written to {outputs.ReportFolderLabel ?? outputs.ReportFolder}");
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
