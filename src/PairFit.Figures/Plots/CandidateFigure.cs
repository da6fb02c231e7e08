using OxyPlot;
using OxyPlot.Axes;
using OxyPlot.Series;
using PairFit.Figures.Rendering;

namespace PairFit.Figures.Plots;

/// <summary>One fitted candidate for the AIC comparison; <paramref name="Aic"/> null when the fit failed.</summary>
public sealed record CandidateScore(string Label, double? Aic);

/// <summary>A group of candidates compared with each other (the copulas, or one variable's marginals).</summary>
public sealed record CandidateGroup(string Heading, IReadOnlyList<CandidateScore> Candidates);

/// <summary>
/// Figure 4: ΔAIC = AIC − min AIC of every candidate, one panel per group, best at the top.
/// Guides drawn at ΔAIC = 2 and 10: below 2 the candidates have about equal support, above 10
/// essentially none (Burnham and Anderson 2002, section 2.6).
/// </summary>
public static class CandidateFigure
{
    public const string Id = "candidates";

    public static Figure? Build(IReadOnlyList<CandidateGroup> groups)
    {
        var usable = new List<CandidateGroup>();
        foreach (var g in groups)
            if (g.Candidates.Count > 0) usable.Add(g);
        if (usable.Count == 0) return null;

        var fig = new Figure(Id, "Candidate comparison",
            "AIC difference of each fitted candidate to the best one in its group (best at the top; bars are longer for worse fits; the value follows each name, and bars beyond the axis end are cut). " +
            "Dotted guides at ΔAIC = 2 and 10: candidates below 2 are about as well supported as the best, above 10 they have essentially no support (Burnham and Anderson 2002). Failed fits are listed without a bar.",
            aspect: Math.Min(1.4, 0.06 * TotalRows(usable)));
        // panels stacked, each as tall as its number of candidates (plus room for heading and axis)
        double totalRows = TotalRows(usable), top = 0;
        for (int gi = 0; gi < usable.Count; gi++)
        {
            var g = usable[gi];
            double best = double.PositiveInfinity;
            foreach (var c in g.Candidates) if (c.Aic is { } a && a < best) best = a;
            // sort: successful fits by AIC, failed ones last; categories are drawn bottom-up, so reverse
            var ordered = new List<CandidateScore>(g.Candidates);
            ordered.Sort((p, q) => (p.Aic ?? double.PositiveInfinity).CompareTo(q.Aic ?? double.PositiveInfinity));
            ordered.Reverse();
            var labels = new List<string>(ordered.Count);
            var bars = new BarSeries { FillColor = Palette.Blue, StrokeColor = OxyColors.Black, StrokeThickness = 0.5, BarWidth = 0.6 };
            // long bars are cut at the axis end (their value is in the label): one very poor
            // candidate must not squash the differences that matter, those below ~10
            const double axisCap = 40;
            double maxDelta = 12;
            foreach (var c in ordered)
            {
                double? delta = c.Aic is { } a ? a - best : null;
                labels.Add(delta is { } dl ? $"{c.Label}   {dl:0.0}" : c.Label + "   failed");
                bars.Items.Add(new BarItem(delta ?? 0));
                if (delta is { } d) maxDelta = Math.Max(maxDelta, d);
                fig.Data.Add(g.Heading, c.Label, delta ?? double.NaN, c.Aic ?? double.NaN);
            }
            var m = PlotStyle.NewPanel(usable.Count > 1 ? $"({(char)('a' + gi)}) {g.Heading}" : g.Heading);
            m.Axes.Add(PlotStyle.Category(AxisPosition.Left, "", labels));
            var x = PlotStyle.Linear(AxisPosition.Bottom, "ΔAIC = AIC − smallest AIC", 0, Math.Min(maxDelta, axisCap) * 1.05);
            m.Axes.Add(x);
            m.Series.Add(bars);
            m.Series.Add(Guide(2, labels.Count));
            m.Series.Add(Guide(10, labels.Count));
            m.IsLegendVisible = false;
            m.TitleHorizontalAlignment = TitleHorizontalAlignment.CenteredWithinView;
            ((CategoryAxis)m.Axes[0]).TickStyle = TickStyle.None;
            double h = Rows(g) / totalRows;
            fig.Add(m, 0, top, 1, h);
            top += h;
        }
        return fig;
    }

    private static LineSeries Guide(double at, int categories)
        => Series.Reference([at, at], [-0.5, categories - 0.5], null);

    private static double Rows(CandidateGroup g) => g.Candidates.Count + 3.0;

    private static double TotalRows(List<CandidateGroup> groups)
    {
        double r = 0;
        foreach (var g in groups) r += Rows(g);
        return r;
    }
}
