using System.Text;

namespace PairFit.Figures.Report;

/// <summary>
/// The fit tables as LaTeX for papers, in the booktabs style (\toprule, \midrule, \bottomrule;
/// no vertical rules). Needs \usepackage{booktabs} in the preamble. Every text is escaped.
/// </summary>
public static class LatexTables
{
    public static string Render(ReportDocument doc, string sourceNote)
    {
        var sb = new StringBuilder();
        sb.Append("% Fit tables written by ").Append(sourceNote).Append(". Requires \\usepackage{booktabs}.\n");
        int n = 0;
        foreach (var t in doc.Blocks.OfType<TableBlock>().Select(b => b.Table).Where(t => t.IsFitTable))
        {
            n++;
            sb.Append("\n\\begin{table}[htbp]\n\\centering\n\\caption{").Append(Escape(t.Caption)).Append("}\n");
            sb.Append("\\label{tab:pairfit-").Append(n).Append("}\n\\begin{tabular}{");
            for (int c = 0; c < t.Header.Count; c++) sb.Append(t.IsNumericColumn(c) ? 'r' : 'l');
            sb.Append("}\n\\toprule\n");
            sb.Append(string.Join(" & ", t.Header.Select(Escape))).Append(" \\\\\n\\midrule\n");
            foreach (var row in t.Rows)
            {
                var cells = new string[t.Header.Count];
                for (int c = 0; c < cells.Length; c++) cells[c] = Escape(c < row.Count ? row[c] : "");
                sb.Append(string.Join(" & ", cells)).Append(" \\\\\n");
            }
            sb.Append("\\bottomrule\n\\end{tabular}\n");
            if (t.Notes.Count > 0)
            {
                sb.Append("\\par\\smallskip\n{\\footnotesize\n");
                foreach (var note in t.Notes) sb.Append(Escape(note)).Append("\\\\\n");
                sb.Append("}\n");
            }
            sb.Append("\\end{table}\n");
        }
        return sb.ToString();
    }

    /// <summary>Escapes the ten LaTeX special characters; maps a few Unicode signs to math mode.</summary>
    public static string Escape(string text)
    {
        var sb = new StringBuilder(text.Length + 8);
        foreach (char c in text)
        {
            sb.Append(c switch
            {
                '\\' => "\\textbackslash{}",
                '&' => "\\&",
                '%' => "\\%",
                '$' => "\\$",
                '#' => "\\#",
                '_' => "\\_",
                '{' => "\\{",
                '}' => "\\}",
                '~' => "\\textasciitilde{}",
                '^' => "\\textasciicircum{}",
                '<' => "\\textless{}",
                '>' => "\\textgreater{}",
                '°' => "\\ensuremath{^\\circ}",
                'Δ' => "\\ensuremath{\\Delta}",
                '–' => "--",
                '−' => "\\ensuremath{-}",
                _ => c.ToString(),
            });
        }
        return sb.ToString();
    }
}
