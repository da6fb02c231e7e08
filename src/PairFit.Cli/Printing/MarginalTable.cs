using System.Globalization;
using System.Text;
using PairFit.Core.Results;

namespace PairFit.Cli.Printing;

/// <summary>
/// The marginal candidate tables of `analyze`: per variable, one line per fitted family ranked by
/// AIC, then the families left out and why, and what the p-values assume.
/// </summary>
public static class MarginalTable
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    public static void Write(MarginalsSection m, TextWriter w) => Write(m, w, "x", "y");

    /// <param name="xName">Column name of X, shown in the heading.</param>
    /// <param name="yName">Column name of Y.</param>
    public static void Write(MarginalsSection m, TextWriter w, string xName, string yName)
    {
        WriteVariable(m.X, $"x = {xName}", w);
        w.WriteLine();
        WriteVariable(m.Y, $"y = {yName}", w);
    }

    public static void WriteVariable(MarginalVariableSection v, string label, TextWriter w)
    {
        string method = v.Method == "lmoments" ? "L-moments where available, else maximum likelihood" : "maximum likelihood";
        w.WriteLine($"Marginal candidates for {label} (n = {v.N.ToString(Inv)}, {method})");
        var table = new TextTable("#", "family", "parameters (standard error)", ">logLik", ">AIC", ">BIC", ">dAIC", ">KS D", ">KS p", ">AD", ">AD p", ">CvM p", "");
        // Identical notes (e.g. "no L-moment estimator ...") share one footnote listing their families.
        var notes = new List<(string Text, List<string> Families)>();
        var skipped = new List<MarginalCandidate>();
        int rank = 0;
        foreach (var c in v.Candidates)
        {
            if (c.SkippedBecause is not null || c.Parameters is null && c.Family != "empirical") { skipped.Add(c); continue; }
            string mark = c.Family == v.Selected ? "<- selected" : "";
            if (c.Converged == false) mark = ("! " + mark).Trim();
            if (c.Note is not null)
            {
                int k = notes.FindIndex(n => n.Text == c.Note);
                if (k < 0) { notes.Add((c.Note, [])); k = notes.Count - 1; }
                notes[k].Families.Add(c.Family);
                mark = (mark + $" [{k + 1}]").Trim();
            }
            var g = c.Gof;
            table.Add((++rank).ToString(Inv), c.Family + (c.Method == "lmoments" ? " (L-mom.)" : ""), Parameters(c),
                TextTable.Number(c.LogLikelihood, 7), TextTable.Number(c.Aic, 7), TextTable.Number(c.Bic, 7), TextTable.Number(c.DeltaAic, 4),
                TextTable.Number(g?.KsStatistic, 3), TextTable.PValue(g?.KsPValue), TextTable.Number(g?.AdStatistic, 3),
                TextTable.PValue(g?.AdPValue), TextTable.PValue(g?.CvmPValue), mark);
        }
        table.Write(w);
        w.WriteLine($"Selected: {v.Selected}{(v.SelectedBecause is { } b ? $" ({b})" : "")}");
        foreach (var warning in v.Warnings ?? [])
            w.WriteLine($"  warning: {warning}");
        if (v.Candidates.Any(c => c.Converged == false)) w.WriteLine("  ! = optimiser did not meet its tolerance");
        for (int i = 0; i < notes.Count; i++) w.WriteLine($"  [{i + 1}] {string.Join(", ", notes[i].Families)}: {notes[i].Text}");
        foreach (var group in v.Candidates.Where(c => c.Gof?.PValueNote is not null).GroupBy(c => c.Gof!.PValueNote!))
            w.WriteLine($"  p-values ({string.Join(", ", group.Select(c => c.Family))}): {group.Key}");
        if (skipped.Count > 0)
        {
            w.WriteLine("Not fitted:");
            foreach (var c in skipped) w.WriteLine($"  {c.Family}: {c.SkippedBecause ?? c.Note ?? "fit failed"}");
        }
    }

    private static string Parameters(MarginalCandidate c)
    {
        if (c.Parameters is null || c.Parameters.Count == 0) return c.Family == "empirical" ? "(rank-based, no parameters)" : "(none)";
        var sb = new StringBuilder();
        foreach (var (name, value) in c.Parameters)
        {
            if (sb.Length > 0) sb.Append(", ");
            sb.Append(name).Append('=').Append(value.ToString("G5", Inv));
            double? se = c.StandardErrors is not null && c.StandardErrors.TryGetValue(name, out var e) ? e : null;
            sb.Append(se is { } s ? $" ({s.ToString("G2", Inv)})" : " (-)");
        }
        return sb.ToString();
    }
}
