using System.Net;
using System.Text;

namespace PairFit.Figures.Report;

/// <summary>
/// Writes a <see cref="ReportDocument"/> as one self-contained HTML file: the style sheet is
/// inline and the figures are embedded as data: URIs, so the file opens anywhere with no network
/// and no side files. Every text is HTML-encoded.
/// </summary>
public static class HtmlRenderer
{
    private const string Style = """
        body { font-family: "DejaVu Sans", Verdana, sans-serif; font-size: 15px; line-height: 1.5; color: #111; max-width: 60rem; margin: 2rem auto; padding: 0 1rem; }
        h1 { font-size: 1.5rem; border-bottom: 2px solid #0072b2; padding-bottom: .3rem; }
        h2 { font-size: 1.2rem; margin-top: 2rem; color: #0a3d62; }
        h3, h4 { font-size: 1rem; }
        table { border-collapse: collapse; margin: .5rem 0 1.2rem; font-size: .9rem; }
        caption { text-align: left; font-weight: bold; padding-bottom: .3rem; }
        th, td { padding: .2rem .7rem; text-align: left; vertical-align: top; }
        thead th { border-top: 2px solid #111; border-bottom: 1px solid #111; }
        tbody tr:last-child td { border-bottom: 2px solid #111; }
        td.num { text-align: right; font-variant-numeric: tabular-nums; }
        figure { margin: 1.5rem 0; }
        figure img { max-width: 100%; height: auto; border: 1px solid #ddd; }
        figcaption { font-size: .9rem; color: #333; }
        .links { font-size: .85rem; }
        ol.notes { list-style: none; padding-left: 0; margin-top: -.8rem; font-size: .8rem; color: #333; }
        """;

    public static string Render(ReportDocument doc, Func<FigureFile, byte[]?> readFigure)
    {
        var sb = new StringBuilder();
        string title = doc.Blocks.OfType<HeadingBlock>().FirstOrDefault()?.Text ?? "PairFit report";
        sb.Append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n");
        sb.Append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n");
        sb.Append("<title>").Append(E(title)).Append("</title>\n<style>\n").Append(Style).Append("\n</style>\n</head>\n<body>\n");
        foreach (var block in doc.Blocks)
        {
            switch (block)
            {
                case HeadingBlock h:
                    sb.Append($"<h{h.Level}>").Append(E(h.Text)).Append($"</h{h.Level}>\n");
                    break;
                case ParagraphBlock p:
                    sb.Append("<p>").Append(E(p.Text)).Append("</p>\n");
                    break;
                case TableBlock t:
                    Table(sb, t.Table);
                    break;
                case FigureBlock f:
                    Figure(sb, f, readFigure);
                    break;
            }
        }
        sb.Append("</body>\n</html>\n");
        return sb.ToString();
    }

    private static void Table(StringBuilder sb, ReportTable t)
    {
        sb.Append("<table>\n<caption>").Append(E(t.Caption)).Append("</caption>\n<thead><tr>");
        foreach (var h in t.Header) sb.Append("<th>").Append(E(h)).Append("</th>");
        sb.Append("</tr></thead>\n<tbody>\n");
        var numeric = new bool[t.Header.Count];
        for (int c = 0; c < numeric.Length; c++) numeric[c] = t.IsNumericColumn(c);
        foreach (var row in t.Rows)
        {
            sb.Append("<tr>");
            for (int c = 0; c < t.Header.Count; c++)
                sb.Append(numeric[c] ? "<td class=\"num\">" : "<td>").Append(E(c < row.Count ? row[c] : "")).Append("</td>");
            sb.Append("</tr>\n");
        }
        sb.Append("</tbody>\n</table>\n");
        if (t.Notes.Count > 0)
        {
            sb.Append("<ol class=\"notes\">");
            foreach (var note in t.Notes) sb.Append("<li>").Append(E(note)).Append("</li>");
            sb.Append("</ol>\n");
        }
    }

    private static void Figure(StringBuilder sb, FigureBlock f, Func<FigureFile, byte[]?> readFigure)
    {
        byte[]? bytes = readFigure(f.Shown);
        sb.Append("<figure id=\"fig-").Append(E(f.Shown.Id)).Append("\">\n");
        if (bytes is not null)
        {
            string mime = f.Shown.Format == "svg" ? "image/svg+xml" : "image/png";
            sb.Append("<img alt=\"").Append(E(f.Shown.Title)).Append("\" src=\"data:").Append(mime).Append(";base64,")
              .Append(Convert.ToBase64String(bytes)).Append("\">\n");
        }
        sb.Append("<figcaption><strong>").Append(E(f.Shown.Title)).Append(".</strong> ").Append(E(f.Shown.Caption));
        // relative links to the files beside the report (they work when the folder is kept together)
        sb.Append(" <span class=\"links\">");
        sb.Append(string.Join(" · ", f.Alternatives.Select(a => $"<a href=\"{E(a.RelativePath)}\">{E(a.Format.ToUpperInvariant())}</a>")));
        sb.Append("</span></figcaption>\n</figure>\n");
    }

    /// <summary>HTML-encodes &lt; &gt; &amp; " and ' (WebUtility.HtmlEncode), safe in text and in quoted attributes.</summary>
    public static string E(string text) => WebUtility.HtmlEncode(text);
}
