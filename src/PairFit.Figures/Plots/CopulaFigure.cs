using OxyPlot;
using OxyPlot.Axes;
using OxyPlot.Series;
using PairFit.Core.Copulas;
using PairFit.Core.Data;
using PairFit.Core.Dependence;
using PairFit.Figures.Rendering;

namespace PairFit.Figures.Plots;

/// <summary>
/// Figure 2: (a) pseudo-observations with the fitted copula's density contours; (b) level curves
/// of the empirical copula against those of the fitted copula. Without a fitted copula the
/// figure shows the data side only.
/// </summary>
public static class CopulaFigure
{
    public const string Id = "copula";

    /// <summary>Density levels drawn in panel (a); c = 1 everywhere is independence.</summary>
    public static readonly double[] DensityLevels = [0.5, 1, 1.5, 2, 3, 5, 8];

    /// <summary>Levels of C(u, v) drawn in panel (b).</summary>
    public static readonly double[] CdfLevels = [0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9];

    public static Figure Build(PairedSample sample, ICopula? copula)
    {
        double[] u = Ranks.PseudoObservations(sample.X), v = Ranks.PseudoObservations(sample.Y);
        string uName = $"u = rank({sample.XName})/(n+1)", vName = $"v = rank({sample.YName})/(n+1)";
        string label = copula is null ? "" : Labels.Of(copula);

        var a = PlotStyle.NewPanel(copula is null ? "(a) pseudo-observations" : "(a) data and fitted density");
        a.Axes.Add(PlotStyle.Linear(AxisPosition.Bottom, uName, 0, 1));
        a.Axes.Add(PlotStyle.Linear(AxisPosition.Left, vName, 0, 1));
        a.Series.Add(Series.Points(u, v, "pseudo-observations"));
        var fig = new Figure(Id, "Copula scale",
            copula is null
                ? "Pseudo-observations (rank/(n+1)) of the pairs (a) and the level curves of the empirical copula at 0.1, 0.2, ..., 0.9 (b)."
                : $"(a) Pseudo-observations (rank/(n+1)) with contours of the fitted {label} copula density at c = {string.Join(", ", DensityLevels)}. " +
                  $"(b) Level curves C(u, v) = 0.1, 0.2, ..., 0.9 of the empirical copula (grey, solid) and of the fitted copula (coloured, dashed); close curves mean a good fit.",
            aspect: 0.52);
        fig.Data.AddSeries("a", "pseudo-observations", u, v);

        double[] grid = FigureMath.Grid(0.01, 0.99, 61);
        if (copula is not null)
        {
            var dens = new double[grid.Length, grid.Length];
            for (int i = 0; i < grid.Length; i++)
                for (int j = 0; j < grid.Length; j++)
                {
                    dens[i, j] = copula.Density(grid[i], grid[j]);
                    fig.Data.Add("a", "fitted density", grid[i], grid[j], dens[i, j]);
                }
            AddContours(a, grid, dens, DensityLevels, $"{label} density", Palette.Blue, LineStyle.Solid);
        }
        PlotStyle.LegendBelow(a);

        var b = PlotStyle.NewPanel("(b) empirical vs fitted copula");
        b.Axes.Add(PlotStyle.Linear(AxisPosition.Bottom, uName, 0, 1));
        b.Axes.Add(PlotStyle.Linear(AxisPosition.Left, vName, 0, 1));
        double[] cgrid = FigureMath.Grid(0, 1, 51);
        var empirical = FigureMath.EmpiricalCopula(u, v, cgrid);
        AddContours(b, cgrid, empirical, CdfLevels, "empirical", Palette.Data, LineStyle.Solid);
        for (int i = 0; i < cgrid.Length; i++)
            for (int j = 0; j < cgrid.Length; j++)
                fig.Data.Add("b", "empirical copula", cgrid[i], cgrid[j], empirical[i, j]);
        if (copula is not null)
        {
            var fitted = new double[cgrid.Length, cgrid.Length];
            for (int i = 0; i < cgrid.Length; i++)
                for (int j = 0; j < cgrid.Length; j++)
                {
                    fitted[i, j] = copula.Cdf(cgrid[i], cgrid[j]);
                    fig.Data.Add("b", "fitted copula", cgrid[i], cgrid[j], fitted[i, j]);
                }
            AddContours(b, cgrid, fitted, CdfLevels, label, Palette.Vermillion, LineStyle.Dash);
        }
        PlotStyle.LegendBelow(b);

        fig.Add(a, 0, 0, 0.5, 1);
        fig.Add(b, 0.5, 0, 0.5, 1);
        return fig;
    }

    /// <summary>
    /// Contour lines, plus an empty line series that carries the legend entry: a contour series
    /// draws no line sample in the legend, so its colour and dash would go unexplained.
    /// </summary>
    private static void AddContours(PlotModel m, double[] grid, double[,] values, double[] levels, string title, OxyColor colour, LineStyle style)
    {
        m.Series.Add(new LineSeries { Title = title, Color = colour, LineStyle = style, StrokeThickness = 1.2 });
        m.Series.Add(Contours(grid, values, levels, colour, style));
    }

    private static ContourSeries Contours(double[] grid, double[,] values, double[] levels, OxyColor colour, LineStyle style)
        => new()
        {
            ColumnCoordinates = grid,
            RowCoordinates = grid,
            Data = values,
            ContourLevels = levels,
            Color = colour,
            LineStyle = style,
            StrokeThickness = 1.2,
            LabelFormatString = null,
            RenderInLegend = false,
        };
}
