using PairFit.Core;
using PairFit.Core.Results;
using PairFit.Figures;
using PairFit.Figures.Report;

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
    private readonly System.Diagnostics.Stopwatch _clock = System.Diagnostics.Stopwatch.StartNew();

    public void Report(string value)
    {
        lock (_gate) error.WriteLine($"pairfit: [{_clock.Elapsed.TotalSeconds,6:0.0} s] {value}...");
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
            var sample = AnalysisPipeline.ReadSample(options, progress);
            var (results, model) = AnalysisPipeline.Run(sample, options, progress);
            ConsoleSummary.Write(results, output);
            if (outputs.JsonPath is { } jsonPath)
            {
                ResultsFile.Write(results, jsonPath);
                error.WriteLine($"pairfit: results written to {jsonPath}");
            }
            if (folder is not null)
            {
                ResultsFile.Write(results, Path.Combine(folder.Staging, "results.json"));
                var request = outputs.Figures ?? new Commands.FigureRequest(["png", "svg", "pdf"], 160, 200);
                IReadOnlyList<FigureFile> figures = [];
                if (request.Formats.Count > 0)
                {
                    progress.Report("figures");
                    var figureOptions = new FigureOptions { Formats = request.Formats, WidthMm = request.WidthMm, Dpi = request.Dpi, Seed = options.Seed };
                    figures = FigureSet.RenderAll(sample, results, model, folder.Staging, figureOptions);
                }
                progress.Report("report");
                ReportWriter.Write(results, figures, folder.Staging);
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
