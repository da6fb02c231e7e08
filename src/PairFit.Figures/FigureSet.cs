using PairFit.Core.Data;
using PairFit.Core.Model;
using PairFit.Core.Results;
using PairFit.Figures.Plots;
using PairFit.Figures.Rendering;

namespace PairFit.Figures;

/// <summary>
/// Builds every figure that the available results allow and writes each in the requested formats,
/// with its data as CSV beside it, under outDir/figures. Figures whose inputs are missing (no
/// fitted model yet, no projection) are skipped, not drawn empty.
/// </summary>
public static class FigureSet
{
    public static IReadOnlyList<FigureFile> RenderAll(PairedSample sample, AnalysisResults results, JointModel? model, string outDir, FigureOptions options, IProgress<string>? progress = null)
    {
        ArgumentNullException.ThrowIfNull(sample);
        ArgumentNullException.ThrowIfNull(results);
        ArgumentNullException.ThrowIfNull(options);
        Validate(options);
        var files = new List<FigureFile>();
        foreach (var figure in BuildAll(sample, results, model, options))
        {
            progress?.Report($"figure {figure.Id}");
            files.AddRange(FigureExporter.Export(figure, options, outDir));
        }
        return files;
    }

    /// <summary>The figures as models, without writing anything (for tests and for callers that export themselves).</summary>
    public static IReadOnlyList<Figure> BuildAll(PairedSample sample, AnalysisResults results, JointModel? model, FigureOptions options)
    {
        model ??= results.Model?.ToJointModel();
        var list = new List<Figure> { ScatterFigure.Build(sample) };
        list.Add(CopulaFigure.Build(sample, model?.Copula));
        if (model is not null)
        {
            list.Add(MarginalFitFigure.Build("marginal-x", sample.XName, sample.X, [new MarginalCandidate(Labels.Of(model.X), model.X)]));
            list.Add(MarginalFitFigure.Build("marginal-y", sample.YName, sample.Y, [new MarginalCandidate(Labels.Of(model.Y), model.Y)]));
        }
        var copulaGroups = new List<CandidateGroup>();
        if (CandidateFigure.Build(copulaGroups) is { } candidates) list.Add(candidates);
        var copulas = new List<CopulaCandidate>();
        if (model is not null) copulas.Add(new CopulaCandidate(Labels.Of(model.Copula), model.Copula));
        list.Add(TailFigure.Build(sample, copulas, options.Seed));
        if (model is not null)
        {
            list.Add(ReturnPeriodFigure.Build(sample, model, DefaultReturnPeriods, 1.0, options.Seed));
            list.Add(SimulationFigure.Build(sample, model, options.Seed));
        }
        return list;
    }

    /// <summary>Return periods drawn when the results name none.</summary>
    public static readonly double[] DefaultReturnPeriods = [10, 50, 100];

    private static void Validate(FigureOptions o)
    {
        if (!(o.WidthMm >= 20 && o.WidthMm <= 1000))
            throw new PairFit.Core.Common.PairFitInputException($"figure width {o.WidthMm} mm is out of range; give 20 to 1000 mm (one column ≈ 85, two columns ≈ 170).");
        if (o.HeightMm != 0 && !(o.HeightMm >= 20 && o.HeightMm <= 1000))
            throw new PairFit.Core.Common.PairFitInputException($"figure height {o.HeightMm} mm is out of range; give 20 to 1000 mm, or 0 for the figure's own aspect.");
        if (o.Dpi < 50 || o.Dpi > 1200)
            throw new PairFit.Core.Common.PairFitInputException($"figure DPI {o.Dpi} is out of range; give 50 to 1200.");
        foreach (var f in o.Formats)
            if (Array.IndexOf(FigureOptions.KnownFormats, f.Trim().ToLowerInvariant()) < 0)
                throw new PairFit.Core.Common.PairFitInputException($"figure format '{f}' is not supported; use png, svg or pdf (or none).");
    }
}
