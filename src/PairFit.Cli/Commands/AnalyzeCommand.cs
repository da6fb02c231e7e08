using System.CommandLine;
using System.Globalization;
using PairFit.Core;
using PairFit.Core.Copulas.Fitting;
using PairFit.Core.Data;
using PairFit.Core.Marginals;
using PairFit.Core.Projection;

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
        var dependenceOnly = new Option<bool>("--dependence-only") { Description = "Stop after the dependence measures (no marginal, copula or projection fits)." };
        var model = new ModelOptions();
        var projection = new ProjectionCliOptions();
        var csvOptions = new CsvReadingOptions();
        var command = new Command("analyze", "Fit and test the joint law of two columns and report it.") { csv, x, y, json, outDir, force, seed, dependenceOnly };
        csvOptions.AddTo(command);
        model.AddTo(command);
        projection.AddTo(command);
        command.SetAction(parse => PairFitCli.Guard(parse, (output, error) =>
        {
            var options = model.Apply(parse, new AnalysisOptions
            {
                CsvPath = parse.GetValue(csv)!,
                X = new ColumnSelector(parse.GetValue(x)!),
                Y = new ColumnSelector(parse.GetValue(y)!),
                Csv = csvOptions.Read(parse),
                Seed = parse.GetValue(seed),
                FitModel = !parse.GetValue(dependenceOnly),
            });
            options = projection.Apply(parse, options);
            var outputs = new AnalysisOutputs
            {
                JsonPath = parse.GetValue(json),
                ReportFolder = parse.GetValue(outDir),
                Force = parse.GetValue(force),
                Figures = model.Figures(parse),
            };
            AnalysisRun.Execute(options, outputs, output, error);
            return PairFitCli.ExitOk;
        }));
        return command;
    }
}

/// <summary>Options of the marginal and copula stages and of the figures, shared by analyze and demo.</summary>
public sealed class ModelOptions
{
    public readonly Option<string?> XMarginal = new("--x-marginal") { Description = "Use this marginal family for X instead of choosing by AIC (e.g. gamma, gev, or empirical)." };
    public readonly Option<string?> YMarginal = new("--y-marginal") { Description = "Use this marginal family for Y instead of choosing by AIC." };
    public readonly Option<string[]> Marginals = new("--marginals")
    {
        Description = "Candidate marginal families for both variables, comma-separated (default: all parametric families).",
        AllowMultipleArgumentsPerToken = true,
    };
    public readonly Option<string> MarginalMethod = new("--marginal-method") { Description = "Marginal estimation: mle or lmoments (L-moments for gev, gumbel, pearson3, genpareto).", DefaultValueFactory = _ => "mle" };
    public readonly Option<string> CopulaMethod = new("--copula-method") { Description = "Copula estimation: pseudo (ranks; default), ifm (fitted marginals) or full (joint maximum likelihood).", DefaultValueFactory = _ => "pseudo" };
    public readonly Option<string[]> Copulas = new("--copulas")
    {
        Description = "Candidate copula families, comma-separated (default: all).",
        AllowMultipleArgumentsPerToken = true,
    };
    public readonly Option<int> GofReplicates = new("--gof-replicates") { Description = "Parametric-bootstrap replicates of the copula goodness-of-fit test (0 = no test).", DefaultValueFactory = _ => 500 };
    public readonly Option<bool> GofAll = new("--gof-all") { Description = "Run the goodness-of-fit test for every copula candidate, not only the selected one." };
    public readonly Option<string> FigureFormats = new("--figures") { Description = "Figure formats in the report folder: any of png,svg,pdf, or none.", DefaultValueFactory = _ => "png,svg,pdf" };
    public readonly Option<double> FigureWidth = new("--figure-width") { Description = "Figure width in millimetres (about 85 for one journal column, 170 for two).", DefaultValueFactory = _ => 160 };
    public readonly Option<int> FigureDpi = new("--figure-dpi") { Description = "Resolution of PNG figures in dots per inch.", DefaultValueFactory = _ => 200 };

    public void AddTo(Command c)
    {
        foreach (var o in new Option[] { XMarginal, YMarginal, Marginals, MarginalMethod, CopulaMethod, Copulas, GofReplicates, GofAll, FigureFormats, FigureWidth, FigureDpi })
            c.Options.Add(o);
    }

    public AnalysisOptions Apply(ParseResult parse, AnalysisOptions o)
    {
        var candidates = SplitList(parse.GetValue(Marginals));
        string method = parse.GetValue(MarginalMethod)!;
        int replicates = parse.GetValue(GofReplicates);
        if (replicates < 0) throw new Core.Common.PairFitInputException($"--gof-replicates must be 0 or more (got {replicates}).");
        return o with
        {
            XMarginal = new MarginalOptions { Forced = parse.GetValue(XMarginal), Candidates = candidates, Method = method },
            YMarginal = new MarginalOptions { Forced = parse.GetValue(YMarginal), Candidates = candidates, Method = method },
            Copula = new CopulaOptions
            {
                Method = parse.GetValue(CopulaMethod)!,
                Families = SplitList(parse.GetValue(Copulas)),
                GofReplicates = replicates,
                GofAllFamilies = parse.GetValue(GofAll),
            },
        };
    }

    public FigureRequest Figures(ParseResult parse)
    {
        string formats = parse.GetValue(FigureFormats)!.Trim().ToLowerInvariant();
        var list = formats == "none" ? [] : SplitList([formats]) ?? [];
        foreach (var f in list)
            if (f is not ("png" or "svg" or "pdf"))
                throw new Core.Common.PairFitInputException($"--figures '{f}' is not one of png, svg, pdf, none.");
        double width = parse.GetValue(FigureWidth);
        if (!(width >= 30 && width <= 500)) throw new Core.Common.PairFitInputException($"--figure-width must be between 30 and 500 mm (got {width.ToString(CultureInfo.InvariantCulture)}).");
        int dpi = parse.GetValue(FigureDpi);
        if (dpi < 50 || dpi > 1200) throw new Core.Common.PairFitInputException($"--figure-dpi must be between 50 and 1200 (got {dpi}).");
        return new FigureRequest(list, width, dpi);
    }

    internal static IReadOnlyList<string>? SplitList(string[]? values)
    {
        if (values is null || values.Length == 0) return null;
        var list = new List<string>();
        foreach (var v in values)
            foreach (var part in v.Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries))
                list.Add(part);
        return list.Count == 0 ? null : list;
    }
}

/// <summary>Which figure formats to render, at what width (mm) and PNG resolution.</summary>
public sealed record FigureRequest(IReadOnlyList<string> Formats, double WidthMm, int Dpi);

/// <summary>The projection options of analyze.</summary>
public sealed class ProjectionCliOptions
{
    public readonly Option<string[]> Project = new("--project") { Description = "Expression Q(x, y) to project the fitted joint law onto, e.g. \"x + y\" or \"runoff_mm / rainfall_mm\" (repeatable)." };
    public readonly Option<double[]> Threshold = new("--threshold") { Description = "Report P(Q > t) for this threshold t (repeatable)." };
    public readonly Option<double[]> Level = new("--level") { Description = "Value-at-risk and tail value-at-risk level, e.g. 0.99 (repeatable; default 0.99)." };

    public readonly Option<double?> DesignX = new("--design-x") { Description = "X value of a design pair: adds joint exceedance probabilities and return periods (needs --design-y)." };
    public readonly Option<double?> DesignY = new("--design-y") { Description = "Y value of the design pair." };
    public readonly Option<double?> EventsPerYear = new("--events-per-year") { Description = "Mean number of records per year (1 for annual maxima); turns probabilities into return periods in years." };
    public readonly Option<double?> ReturnPeriod = new("--return-period") { Description = "Target return period in years for the design isolines." };

    public void AddTo(Command c)
    {
        foreach (var o in new Option[] { Project, Threshold, Level, DesignX, DesignY, EventsPerYear, ReturnPeriod })
            c.Options.Add(o);
    }

    public AnalysisOptions Apply(ParseResult parse, AnalysisOptions o)
    {
        var levels = parse.GetValue(Level) is { Length: > 0 } l ? l : [0.99];
        foreach (var level in levels)
            if (!(level > 0 && level < 1)) throw new Core.Common.PairFitInputException($"--level must be strictly between 0 and 1 (got {level.ToString(CultureInfo.InvariantCulture)}).");
        double? dx = parse.GetValue(DesignX), dy = parse.GetValue(DesignY);
        if (dx.HasValue != dy.HasValue)
            throw new Core.Common.PairFitInputException("--design-x and --design-y go together: give both values of the design pair.");
        if (parse.GetValue(EventsPerYear) is { } epy && !(epy > 0 && double.IsFinite(epy)))
            throw new Core.Common.PairFitInputException($"--events-per-year must be a positive number (got {epy.ToString(CultureInfo.InvariantCulture)}).");
        if (parse.GetValue(ReturnPeriod) is { } rp && !(rp > 0 && double.IsFinite(rp)))
            throw new Core.Common.PairFitInputException($"--return-period must be a positive number of years (got {rp.ToString(CultureInfo.InvariantCulture)}).");
        return o with
        {
            Joint = dx is { } a && dy is { } b
                ? new JointOptions { XValue = a, YValue = b, EventsPerYear = parse.GetValue(EventsPerYear), ReturnPeriod = parse.GetValue(ReturnPeriod) }
                : null,
            Projections = parse.GetValue(Project) ?? [],
            Projection = o.Projection with { Thresholds = parse.GetValue(Threshold) ?? [], Levels = levels },
        };
    }
}
