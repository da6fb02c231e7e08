namespace PairFit.Figures.Report;

/// <summary>
/// The report as a list of neutral blocks, built once from the results and then written as
/// Markdown and as HTML by two small renderers, so the two reports never drift apart.
/// All strings here are plain text; each renderer escapes them for its own format.
/// </summary>
public sealed class ReportDocument
{
    public List<ReportBlock> Blocks { get; } = [];

    public ReportDocument Heading(int level, string text) { Blocks.Add(new HeadingBlock(level, text)); return this; }
    public ReportDocument Paragraph(string text) { Blocks.Add(new ParagraphBlock(text)); return this; }
    public ReportDocument Table(ReportTable table) { Blocks.Add(new TableBlock(table)); return this; }
    public ReportDocument Figure(FigureFile shown, IReadOnlyList<FigureFile> alternatives) { Blocks.Add(new FigureBlock(shown, alternatives)); return this; }
}

public abstract record ReportBlock;
public sealed record HeadingBlock(int Level, string Text) : ReportBlock;
public sealed record ParagraphBlock(string Text) : ReportBlock;
public sealed record TableBlock(ReportTable Table) : ReportBlock;

/// <summary>A figure shown in the report (<paramref name="Shown"/>), with links to its other formats and its data.</summary>
public sealed record FigureBlock(FigureFile Shown, IReadOnlyList<FigureFile> Alternatives) : ReportBlock;

/// <summary>
/// A plain table: caption, header and rows of text cells, and numbered notes that cells refer to
/// as "[k]" (long texts are kept out of the cells). <see cref="IsFitTable"/> tables also go to tables.tex.
/// </summary>
public sealed record ReportTable(string Caption, IReadOnlyList<string> Header, IReadOnlyList<IReadOnlyList<string>> Rows, bool IsFitTable = false)
{
    public IReadOnlyList<string> Notes { get; init; } = [];

    /// <summary>Columns holding numbers are right-aligned.</summary>
    public bool IsNumericColumn(int column)
    {
        bool any = false;
        foreach (var row in Rows)
        {
            if (column >= row.Count || row[column].Length == 0 || row[column] == "–") continue;
            if (!double.TryParse(row[column], System.Globalization.NumberStyles.Float, System.Globalization.CultureInfo.InvariantCulture, out _)) return false;
            any = true;
        }
        return any;
    }
}
