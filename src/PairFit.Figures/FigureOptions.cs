namespace PairFit.Figures;

/// <summary>
/// How figures are written: formats, physical size and raster resolution. Sizes are in
/// millimetres so that a figure drops into a journal column at its natural size
/// (one column ≈ 85 mm, two columns ≈ 170 mm); text keeps its point size whatever the width.
/// </summary>
public sealed record FigureOptions
{
    /// <summary>Any of "png", "svg", "pdf".</summary>
    public IReadOnlyList<string> Formats { get; init; } = ["png", "svg", "pdf"];

    /// <summary>Figure width in millimetres.</summary>
    public double WidthMm { get; init; } = 160;

    /// <summary>Figure height in millimetres; 0 takes it from the figure's own aspect ratio.</summary>
    public double HeightMm { get; init; }

    /// <summary>Resolution of the PNG files, dots per inch.</summary>
    public int Dpi { get; init; } = 200;

    /// <summary>Seed for the figures that draw random samples (simulated pairs, Kendall-plot reference).</summary>
    public int Seed { get; init; } = 20261202;

    internal static readonly string[] KnownFormats = ["png", "svg", "pdf"];
}

/// <summary>One file written by <see cref="FigureSet.RenderAll"/>.</summary>
/// <param name="Id">Stable short name of the figure, e.g. "scatter"; also the file stem.</param>
/// <param name="Title">Human title of the figure.</param>
/// <param name="Caption">What the figure shows and how to read it.</param>
/// <param name="Format">"png", "svg", "pdf" or "csv" (the figure's data).</param>
/// <param name="RelativePath">Path relative to the output folder, with '/' separators, e.g. "figures/scatter.png".</param>
public sealed record FigureFile(string Id, string Title, string Caption, string Format, string RelativePath);
