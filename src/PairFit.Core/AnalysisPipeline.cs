using PairFit.Core.Data;
using PairFit.Core.Dependence;
using PairFit.Core.Results;

namespace PairFit.Core;

/// <summary>Everything `analyze` needs to know, gathered from the command line (or a test).</summary>
public sealed record AnalysisOptions
{
    public required string CsvPath { get; init; }
    public required ColumnSelector X { get; init; }
    public required ColumnSelector Y { get; init; }
    public CsvOptions Csv { get; init; } = new();
    public int Seed { get; init; } = 20261202;
}

/// <summary>
/// The whole analysis as one pure composition of stages: data → dependence → marginals →
/// copulas → projection. The command line only gathers options, calls this and prints.
/// </summary>
public static class AnalysisPipeline
{
    public static AnalysisResults Run(AnalysisOptions options, IProgress<string>? progress = null)
    {
        var sample = PairedCsvReader.Read(options.CsvPath, options.X, options.Y, options.Csv);
        return Run(sample, options, progress);
    }

    public static AnalysisResults Run(PairedSample sample, AnalysisOptions options, IProgress<string>? progress = null)
    {
        progress?.Report("dependence measures");
        var dependence = DependenceAnalysis.Compute(sample);
        return new AnalysisResults
        {
            Tool = ToolInfo.NameAndVersion,
            CreatedUtc = DateTime.UtcNow.ToString("yyyy-MM-ddTHH:mm:ssZ"),
            Input = new InputSection
            {
                File = sample.Rows.Source,
                XColumn = sample.XName,
                YColumn = sample.YName,
                RowsRead = sample.Rows.RowsRead,
                RowsUsed = sample.Rows.RowsUsed,
                Dropped = sample.Rows.DroppedByReason,
            },
            Dependence = dependence,
            Settings = new Dictionary<string, string> { ["seed"] = options.Seed.ToString(System.Globalization.CultureInfo.InvariantCulture) },
        };
    }
}

public static class ToolInfo
{
    public static string Version =>
        typeof(ToolInfo).Assembly.GetName().Version is { } v ? $"{v.Major}.{v.Minor}.{v.Build}" : "0.0.0";

    public static string NameAndVersion => "pairfit " + Version;
}
