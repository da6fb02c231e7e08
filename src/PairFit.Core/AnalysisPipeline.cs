using System.Globalization;
using PairFit.Core.Copulas.Fitting;
using PairFit.Core.Data;
using PairFit.Core.Dependence;
using PairFit.Core.Marginals;
using PairFit.Core.Model;
using PairFit.Core.Projection;
using PairFit.Core.Results;

namespace PairFit.Core;

/// <summary>Everything `analyze` needs to know, gathered from the command line (or a test).</summary>
public sealed record AnalysisOptions
{
    public required string CsvPath { get; init; }
    public required ColumnSelector X { get; init; }
    public required ColumnSelector Y { get; init; }
    public CsvOptions Csv { get; init; } = new();

    /// <summary>How to name the input file in the results (default: the path as given).</summary>
    public string? SourceLabel { get; init; }
    public int Seed { get; init; } = 20261202;

    /// <summary>Marginal options of X and Y (VariableName is filled in from the column names).</summary>
    public MarginalOptions XMarginal { get; init; } = new();
    public MarginalOptions YMarginal { get; init; } = new();

    /// <summary>Copula options (Seed is taken from <see cref="Seed"/>).</summary>
    public CopulaOptions Copula { get; init; } = new();

    /// <summary>Expressions Q(x, y) to project the fitted joint law onto.</summary>
    public IReadOnlyList<string> Projections { get; init; } = [];

    /// <summary>Projection options (Seed is taken from <see cref="Seed"/>).</summary>
    public ProjectionOptions Projection { get; init; } = new();

    /// <summary>Design pair for joint exceedance probabilities and return periods; null = none.</summary>
    public JointOptions? Joint { get; init; }

    /// <summary>False stops after the dependence measures (no marginals, copulas or projections).</summary>
    public bool FitModel { get; init; } = true;
}

/// <summary>
/// The whole analysis as one composition of stages: data → dependence → marginals → copulas →
/// projection. Each stage is a function of the previous stages' records plus options; the command
/// line only gathers options, calls this and prints.
/// </summary>
public static class AnalysisPipeline
{
    public static AnalysisResults Run(AnalysisOptions options, IProgress<string>? progress = null)
        => Run(ReadSample(options, progress), options, progress).Results;

    public static PairedSample ReadSample(AnalysisOptions options, IProgress<string>? progress = null)
    {
        progress?.Report($"reading {options.CsvPath}");
        return PairedCsvReader.Read(options.CsvPath, options.X, options.Y, options.Csv);
    }

    /// <summary>Runs every stage on a sample; also returns the fitted joint model (null when not fitted).</summary>
    public static (AnalysisResults Results, JointModel? Model) Run(PairedSample sample, AnalysisOptions options, IProgress<string>? progress = null)
    {
        ValidateBeforeFitting(sample, options);
        progress?.Report($"dependence measures on {sample.Count} pairs");
        var dependence = DependenceAnalysis.Compute(sample);

        MarginalsSection? marginals = null;
        CopulaSection? copula = null;
        ModelSection? modelSection = null;
        JointModel? model = null;
        List<ProjectionSection>? projections = null;
        JointSection? joint = null;
        if (options.FitModel)
        {
            progress?.Report($"marginal fits of {sample.XName} and {sample.YName}");
            var mx = MarginalAnalysis.Fit(sample.X, options.XMarginal with { VariableName = options.XMarginal.VariableName ?? sample.XName });
            var my = MarginalAnalysis.Fit(sample.Y, options.YMarginal with { VariableName = options.YMarginal.VariableName ?? sample.YName });
            marginals = new MarginalsSection { X = mx.Section, Y = my.Section };

            progress?.Report("copula fits");
            var cf = CopulaAnalysis.Fit(sample, mx.Selected, my.Selected, options.Copula with { Seed = options.Seed }, progress);
            copula = cf.Section;
            model = new JointModel(cf.X ?? mx.Selected, cf.Y ?? my.Selected, cf.Selected);
            modelSection = ModelSection.From(model, sample.XName, sample.YName);

            if (options.Projections.Count > 0)
            {
                projections = [];
                foreach (var expression in options.Projections)
                {
                    progress?.Report($"projection of {expression}");
                    projections.Add(ProjectionAnalysis.Project(model, expression, sample.XName, sample.YName, sample,
                        options.Projection with { Seed = options.Seed }));
                }
            }

            if (options.Joint is { } jointOptions)
            {
                progress?.Report("joint exceedance and return periods");
                joint = JointAnalysis.Compute(model, jointOptions);
            }
        }

        var results = new AnalysisResults
        {
            Tool = ToolInfo.NameAndVersion,
            CreatedUtc = DateTime.UtcNow.ToString("yyyy-MM-ddTHH:mm:ssZ", CultureInfo.InvariantCulture),
            Input = new InputSection
            {
                File = options.SourceLabel ?? sample.Rows.Source,
                XColumn = sample.XName,
                YColumn = sample.YName,
                RowsRead = sample.Rows.RowsRead,
                RowsUsed = sample.Rows.RowsUsed,
                Dropped = sample.Rows.DroppedByReason,
            },
            Dependence = dependence,
            Marginals = marginals,
            Copula = copula,
            Model = modelSection,
            Projections = projections,
            Joint = joint,
            Settings = Settings(options),
        };
        return (results, model);
    }

    /// <summary>
    /// Checks every option that a later stage would reject, so a typo in an expression or a family
    /// name is reported at once rather than after minutes of fitting.
    /// </summary>
    private static void ValidateBeforeFitting(PairedSample sample, AnalysisOptions o)
    {
        if (!o.FitModel) return;
        foreach (var expression in o.Projections)
            if (ExpressionParser.TryParse(expression, sample.XName, sample.YName, out var error) is null)
                throw new Common.PairFitInputException(error!.Message);
        string method = (o.Copula.Method ?? "").ToLowerInvariant();
        if (!CopulaOptions.Methods.Contains(method))
            throw new Common.PairFitInputException($"copula method '{o.Copula.Method}' is not one of {string.Join(", ", CopulaOptions.Methods)}.");
        foreach (var family in o.Copula.Families ?? [])
            Copulas.CopulaRegistry.Find(family);
        foreach (var m in new[] { o.XMarginal, o.YMarginal })
            foreach (var family in m.Forced is { } f ? [f] : m.Candidates ?? [])
                if (!MarginalRegistry.FamilyNames.Contains(family.Trim(), StringComparer.OrdinalIgnoreCase))
                    throw new Common.PairFitInputException($"unknown marginal family '{family}'; choose from: {string.Join(", ", MarginalRegistry.FamilyNames)}.");
    }

    private static Dictionary<string, string> Settings(AnalysisOptions o)
    {
        var inv = CultureInfo.InvariantCulture;
        var s = new Dictionary<string, string>
        {
            ["seed"] = o.Seed.ToString(inv),
            ["xMarginal"] = o.XMarginal.Forced ?? (o.XMarginal.Candidates is { } cx ? string.Join(",", cx) : "default candidates"),
            ["yMarginal"] = o.YMarginal.Forced ?? (o.YMarginal.Candidates is { } cy ? string.Join(",", cy) : "default candidates"),
            ["marginalMethod"] = o.XMarginal.Method,
            ["copulaMethod"] = o.Copula.Method,
            ["copulaFamilies"] = o.Copula.Families is { } f ? string.Join(",", f) : "all",
            ["gofReplicates"] = o.Copula.GofReplicates.ToString(inv),
            ["gofAllFamilies"] = o.Copula.GofAllFamilies ? "true" : "false",
        };
        if (o.Csv.MissingTokens.Count > 0) s["missingTokens"] = string.Join(",", o.Csv.MissingTokens);
        if (o.Csv.Delimiter is { } d) s["delimiter"] = d == '\t' ? "tab" : d.ToString();
        return s;
    }
}

public static class ToolInfo
{
    public static string Version =>
        typeof(ToolInfo).Assembly.GetName().Version is { } v ? $"{v.Major}.{v.Minor}.{v.Build}" : "0.0.0";

    public static string NameAndVersion => "pairfit " + Version;
}
