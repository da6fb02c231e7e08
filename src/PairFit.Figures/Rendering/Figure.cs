using OxyPlot;

namespace PairFit.Figures.Rendering;

/// <summary>
/// A figure of one or more OxyPlot panels placed on one page. OxyPlot draws one plot area per
/// model, so multi-panel figures are composed here: each panel takes a rectangle given as a
/// fraction of the page and is rendered onto the same Skia canvas (see <see cref="FigureExporter"/>).
/// </summary>
public sealed class Figure
{
    private readonly List<(PlotModel Model, OxyRect Area)> _panels = [];

    public Figure(string id, string title, string caption, double aspect)
    {
        Id = id;
        Title = title;
        Caption = caption;
        Aspect = aspect;
    }

    /// <summary>File stem and stable name, e.g. "scatter".</summary>
    public string Id { get; }
    public string Title { get; }
    public string Caption { get; }

    /// <summary>Height / width used when the caller gives no height.</summary>
    public double Aspect { get; }

    public FigureData Data { get; } = new();

    public IReadOnlyList<(PlotModel Model, OxyRect Area)> Panels => _panels;

    /// <summary>Adds a panel occupying the fractional rectangle (left, top, width, height) of the page.</summary>
    public Figure Add(PlotModel model, double left, double top, double width, double height)
    {
        _panels.Add((model, new OxyRect(left, top, width, height)));
        return this;
    }

    /// <summary>Places panels side by side in one row, equal widths.</summary>
    public static Figure Row(string id, string title, string caption, double aspect, params PlotModel[] panels)
    {
        var f = new Figure(id, title, caption, aspect);
        double w = 1.0 / panels.Length;
        for (int i = 0; i < panels.Length; i++) f.Add(panels[i], i * w, 0, w, 1);
        return f;
    }
}
