using PairFit.Core.Common;
using PairFit.Core.Copulas;
using PairFit.Core.Data;
using PairFit.Core.Marginals;
using PairFit.Core.Model;
using PairFit.Core.Projection;
using PairFit.Core.Results;
using PairFit.Figures.Plots;
using PairFit.Figures.Rendering;

namespace PairFit.Figures;

/// <summary>
/// Builds every figure that the available results allow and writes each in the requested formats,
/// with its data as CSV beside it, under outDir/figures. Figures whose inputs are missing (no
/// fitted model, no projection) are skipped, not drawn empty. Fitted objects are rebuilt from the
/// result records through the family registries.
/// </summary>
public static class FigureSet
{
    /// <summary>Return periods drawn when the results name none.</summary>
    public static readonly double[] DefaultReturnPeriods = [10, 50, 100];

    /// <summary>Fitted copula candidates drawn in the tail figure (best AIC first).</summary>
    public const int TailFigureCopulas = 3;

    /// <summary>
    /// Renders every figure the results allow into outDir/figures, in each of <see cref="FigureOptions.Formats"/>
    /// plus a CSV of its data; returns the files written (paths relative to outDir), figure by figure.
    /// An empty format list writes nothing.
    /// </summary>
    public static IReadOnlyList<FigureFile> RenderAll(PairedSample sample, AnalysisResults results, JointModel? model, string outDir, FigureOptions options, IProgress<string>? progress = null)
    {
        ArgumentNullException.ThrowIfNull(sample);
        ArgumentNullException.ThrowIfNull(results);
        ArgumentNullException.ThrowIfNull(options);
        Validate(options);
        if (options.Formats.Count == 0) return []; // "--figures none": no figure files, not even their CSVs
        var figures = BuildAll(sample, results, model, options);
        // figures are independent (own models, own render contexts): export them in parallel,
        // collected by index so the list keeps the figures' order
        var written = new IReadOnlyList<FigureFile>[figures.Count];
        Parallel.For(0, figures.Count, i =>
        {
            progress?.Report($"figure {figures[i].Id}");
            written[i] = FigureExporter.Export(figures[i], options, outDir);
        });
        var files = new List<FigureFile>();
        foreach (var w in written) files.AddRange(w);
        return files;
    }

    /// <summary>The figures as composed models, without writing anything.</summary>
    public static IReadOnlyList<Figure> BuildAll(PairedSample sample, AnalysisResults results, JointModel? model, FigureOptions options)
    {
        model ??= results.Model?.ToJointModel();
        int seed = SeedOf(results, options);
        var list = new List<Figure> { ScatterFigure.Build(sample), CopulaFigure.Build(sample, model?.Copula) };

        var xCandidates = MarginalCandidates(results.Marginals?.X, model?.X);
        var yCandidates = MarginalCandidates(results.Marginals?.Y, model?.Y);
        if (xCandidates.Count > 0) list.Add(MarginalFitFigure.Build("marginal-x", sample.XName, sample.X, xCandidates));
        if (yCandidates.Count > 0) list.Add(MarginalFitFigure.Build("marginal-y", sample.YName, sample.Y, yCandidates));

        if (CandidateFigure.Build(CandidateGroups(results, sample)) is { } candidates) list.Add(candidates);

        list.Add(TailFigure.Build(sample, CopulaCandidates(results.Copula, model?.Copula), seed));

        if (results.Projections is { } projections)
            for (int i = 0; i < projections.Count; i++)
                if (ProjectionFigure.Build($"projection-{i + 1}", projections[i], sample) is { } pf) list.Add(pf);

        if (model is not null)
        {
            var joint = results.Joint;
            double mu = joint is { MeanInterarrivalYears: > 0 } j ? j.MeanInterarrivalYears : 1.0;
            MarkedEvent? pair = joint is null ? null : new MarkedEvent($"the design pair ({Labels.Number(joint.XValue)}, {Labels.Number(joint.YValue)})", joint.XValue, joint.YValue);
            list.Add(ReturnPeriodFigure.Build(sample, model, Designs(joint, model, mu), mu, pair));
            list.Add(SimulationFigure.Build(sample, model, seed));
        }
        return list;
    }

    /// <summary>The run's seed from the results settings, else the options' seed.</summary>
    private static int SeedOf(AnalysisResults results, FigureOptions options)
        => results.Settings is { } s && s.TryGetValue("seed", out var text) && int.TryParse(text, System.Globalization.NumberStyles.Integer, System.Globalization.CultureInfo.InvariantCulture, out int seed)
            ? seed : options.Seed;

    /// <summary>Points per isoline computed for the figure when the results do not hold that return period.</summary>
    public const int IsolinePoints = 120;

    /// <summary>
    /// The design isolines of the results, topped up with the default return periods (computed by
    /// the joint analysis) to at most four periods.
    /// </summary>
    private static List<DesignEvent> Designs(JointSection? joint, JointModel model, double mu)
    {
        var designs = new List<DesignEvent>();
        var periods = new SortedSet<double>();
        if (joint?.Designs is { } reported)
            foreach (var d in reported)
                if (d.ReturnPeriod > 0) { designs.Add(d); periods.Add(d.ReturnPeriod); }
        foreach (double t in DefaultReturnPeriods)
            if (periods.Count < 4 && periods.Add(t))
                designs.AddRange(JointAnalysis.Designs(model, mu, t, IsolinePoints));
        return designs;
    }

    /// <summary>The selected marginal first, then the next best fitted candidates (rebuilt from their records).</summary>
    private static List<MarginalCurve> MarginalCandidates(MarginalVariableSection? section, IMarginalDistribution? selected)
    {
        var list = new List<MarginalCurve>();
        if (selected is not null) list.Add(new MarginalCurve(Labels.Of(selected), selected));
        if (section is null) return list;
        foreach (var c in section.Candidates)
        {
            if (list.Count >= MarginalFitFigure.MaxCandidates) break;
            if (c.Parameters is null || c.Aic is null || c.SkippedBecause is not null) continue;
            if (selected is not null && c.Family == selected.Family) continue;
            try
            {
                var d = MarginalRegistry.Create(c.Family, [.. c.Parameters.Values]);
                list.Add(new MarginalCurve(Labels.Of(d), d));
            }
            catch (PairFitInputException)
            {
                // a family this build cannot rebuild (e.g. the empirical one): not drawn
            }
        }
        return list;
    }

    private static List<CopulaCurve> CopulaCandidates(CopulaSection? section, ICopula? selected)
    {
        var list = new List<CopulaCurve>();
        if (selected is not null) list.Add(new CopulaCurve(Labels.Of(selected), selected));
        if (section is null) return list;
        foreach (var c in section.Candidates)
        {
            if (list.Count >= TailFigureCopulas) break;
            if (!c.Converged || c.Family == IndependenceLaw.FamilyName) continue;
            if (selected is not null && c.Family == selected.Family && c.Rotation == selected.Rotation) continue;
            try
            {
                var copula = CopulaRegistry.Create(c.Family, c.Rotation, [.. c.Parameters.Values]);
                list.Add(new CopulaCurve(Labels.Of(copula), copula));
            }
            catch (PairFitInputException)
            {
                // unknown to this build: not drawn
            }
        }
        return list;
    }

    private static List<CandidateGroup> CandidateGroups(AnalysisResults results, PairedSample sample)
    {
        var groups = new List<CandidateGroup>();
        if (results.Copula is { } cs)
        {
            var scores = new List<CandidateScore>();
            foreach (var c in cs.Candidates)
                scores.Add(new CandidateScore(c.Family + (c.Rotation != 0 ? $" {c.Rotation}°" : ""), c.Converged ? c.Aic : null));
            groups.Add(new CandidateGroup("copulas", scores));
        }
        if (results.Marginals is { } ms)
        {
            groups.Add(new CandidateGroup($"marginals of {sample.XName}", MarginalScores(ms.X)));
            groups.Add(new CandidateGroup($"marginals of {sample.YName}", MarginalScores(ms.Y)));
        }
        return groups;
    }

    private static List<CandidateScore> MarginalScores(MarginalVariableSection v)
    {
        var scores = new List<CandidateScore>();
        foreach (var c in v.Candidates)
            if (c.SkippedBecause is null) scores.Add(new CandidateScore(c.Family, c.Converged == false ? null : c.Aic));
        return scores;
    }

    private static void Validate(FigureOptions o)
    {
        if (!(o.WidthMm >= 20 && o.WidthMm <= 1000))
            throw new PairFitInputException($"figure width {o.WidthMm} mm is out of range; give 20 to 1000 mm (one column ≈ 85, two columns ≈ 170).");
        if (o.HeightMm != 0 && !(o.HeightMm >= 20 && o.HeightMm <= 1000))
            throw new PairFitInputException($"figure height {o.HeightMm} mm is out of range; give 20 to 1000 mm, or 0 for the figure's own aspect.");
        if (o.Dpi < 50 || o.Dpi > 1200)
            throw new PairFitInputException($"figure DPI {o.Dpi} is out of range; give 50 to 1200.");
        foreach (var f in o.Formats)
            if (Array.IndexOf(FigureOptions.KnownFormats, f.Trim().ToLowerInvariant()) < 0)
                throw new PairFitInputException($"figure format '{f}' is not supported; use png, svg or pdf (or none).");
    }
}
