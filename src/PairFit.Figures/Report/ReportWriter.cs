using PairFit.Core.Results;

namespace PairFit.Figures.Report;

/// <summary>
/// Writes report.md, report.html (self-contained) and tables.tex into the report folder, each
/// through a temporary file moved into place, so an interrupted run never leaves half a report.
/// Figures must already be in outDir (as listed in <c>figures</c>); the HTML embeds them.
/// </summary>
public static class ReportWriter
{
    public const string MarkdownFile = "report.md";
    public const string HtmlFile = "report.html";
    public const string LatexFile = "tables.tex";

    public static void Write(AnalysisResults results, IReadOnlyList<FigureFile> figures, string outDir)
    {
        ArgumentNullException.ThrowIfNull(results);
        ArgumentNullException.ThrowIfNull(figures);
        Directory.CreateDirectory(outDir);
        var doc = ReportBuilder.Build(results, figures);
        string full = Path.GetFullPath(outDir);
        WriteText(Path.Combine(outDir, MarkdownFile), MarkdownRenderer.Render(doc));
        WriteText(Path.Combine(outDir, HtmlFile), HtmlRenderer.Render(doc, f => ReadInside(full, f.RelativePath)));
        WriteText(Path.Combine(outDir, LatexFile), LatexTables.Render(doc, results.Tool ?? "pairfit"));
    }

    /// <summary>Reads a figure file only if it lies inside the report folder (the list is ours, but be strict).</summary>
    private static byte[]? ReadInside(string folder, string relative)
    {
        string path = Path.GetFullPath(Path.Combine(folder, relative));
        if (!path.StartsWith(folder + Path.DirectorySeparatorChar, StringComparison.Ordinal) || !File.Exists(path)) return null;
        return File.ReadAllBytes(path);
    }

    private static void WriteText(string path, string text)
        => Rendering.FigureExporter.WriteAtomically(path, s =>
        {
            using var w = new StreamWriter(s, new System.Text.UTF8Encoding(false));
            w.Write(text);
        });
}
