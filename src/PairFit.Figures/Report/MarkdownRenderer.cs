using System.Text;

namespace PairFit.Figures.Report;

/// <summary>Writes a <see cref="ReportDocument"/> as CommonMark with GFM tables; figures are linked, not embedded.</summary>
public static class MarkdownRenderer
{
    public static string Render(ReportDocument doc)
    {
        var sb = new StringBuilder();
        foreach (var block in doc.Blocks)
        {
            switch (block)
            {
                case HeadingBlock h:
                    sb.Append('#', h.Level).Append(' ').Append(Escape(h.Text)).Append("\n\n");
                    break;
                case ParagraphBlock p:
                    sb.Append(Escape(p.Text)).Append("\n\n");
                    break;
                case TableBlock t:
                    Table(sb, t.Table);
                    break;
                case FigureBlock f:
                    sb.Append("![").Append(Escape(f.Shown.Title)).Append("](").Append(f.Shown.RelativePath).Append(")\n\n");
                    sb.Append('*').Append(Escape(f.Shown.Title)).Append(".* ").Append(Escape(f.Shown.Caption)).Append(' ');
                    sb.Append(string.Join(" · ", f.Alternatives.Select(a => $"[{a.Format.ToUpperInvariant()}]({a.RelativePath})"))).Append("\n\n");
                    break;
            }
        }
        return sb.ToString();
    }

    private static void Table(StringBuilder sb, ReportTable t)
    {
        sb.Append("**").Append(Escape(t.Caption)).Append("**\n\n");
        sb.Append('|');
        foreach (var h in t.Header) sb.Append(' ').Append(Escape(h)).Append(" |");
        sb.Append("\n|");
        for (int c = 0; c < t.Header.Count; c++) sb.Append(t.IsNumericColumn(c) ? " ---: |" : " --- |");
        sb.Append('\n');
        foreach (var row in t.Rows)
        {
            sb.Append('|');
            for (int c = 0; c < t.Header.Count; c++) sb.Append(' ').Append(Escape(c < row.Count ? row[c] : "")).Append(" |");
            sb.Append('\n');
        }
        sb.Append('\n');
        foreach (var note in t.Notes) sb.Append(Escape(note)).Append("  \n");
        if (t.Notes.Count > 0) sb.Append('\n');
    }

    /// <summary>
    /// Text from the data (column names, file names) must not become markup: backslash-escape
    /// Markdown punctuation (CommonMark 0.31, section 2.4) and write &lt; &gt; &amp; as entities so
    /// that no viewer turns a column name into live HTML. Line breaks become spaces (tables are one line per row).
    /// </summary>
    public static string Escape(string text)
    {
        var sb = new StringBuilder(text.Length + 8);
        foreach (char c in text)
        {
            switch (c)
            {
                case '<': sb.Append("&lt;"); break;
                case '>': sb.Append("&gt;"); break;
                case '&': sb.Append("&amp;"); break;
                case '\r': case '\n': sb.Append(' '); break;
                case '\\': case '`': case '*': case '_': case '[': case ']': case '|': case '#': case '!': case '~':
                    sb.Append('\\').Append(c); break;
                default: sb.Append(c); break;
            }
        }
        return sb.ToString();
    }
}
