using PairFit.Core.Dependence;
using PairFit.Core.Results;

namespace PairFit.Cli.Printing;

/// <summary>The readable dependence table of an analysis.</summary>
public static class DependenceTable
{
    public static void Write(DependenceSection d, string xName, string yName, TextWriter w)
    {
        ArgumentNullException.ThrowIfNull(d);
        w.WriteLine($"Dependence between '{xName}' (x) and '{yName}' (y), n = {d.N}");
        var table = new TextTable("measure", ">estimate", ">95% interval", ">p-value");
        Row(table, "Pearson r", d.Pearson);
        Row(table, "Spearman rho", d.Spearman);
        Row(table, "Kendall tau-b", d.Kendall);
        table.Write(w);

        var t = d.Tail;
        if (t.Lower is not null || t.Upper is not null)
            w.WriteLine($"  Tail dependence (empirical, k = {t.K}, upper threshold t = {TextTable.Number(t.Threshold, 4)}): "
                + $"lower {TextTable.Number(t.Lower, 3)}, upper {TextTable.Number(t.Upper, 3)}");
        else
            w.WriteLine("  Tail dependence: undefined");

        w.WriteLine("  Methods: p-values from t tests on n-2 df (Pearson; Spearman as an approximation) and the normal");
        w.WriteLine("  approximation with tie-corrected variance (Kendall; exact without ties for n <= 33); intervals by");
        w.WriteLine("  Fisher z (Pearson), Fisher z with the Bonett-Wright se (Spearman), jackknife (Kendall).");
        w.WriteLine("  Tail: upper = (pairs among the k largest of both variables)/k, lower likewise with the k smallest.");

        // Anything beyond the standard method text (undefined values, small-sample cautions) is printed.
        var notes = new List<string>();
        AddNote(notes, "Pearson", d.Pearson.Note, DependenceAnalysis.PearsonMethod);
        AddNote(notes, "Spearman", d.Spearman.Note, DependenceAnalysis.SpearmanMethod);
        AddNote(notes, "Kendall", d.Kendall.Note, DependenceAnalysis.KendallMethod);
        if (t.Note is not null) notes.Add($"Tail: {t.Note}");
        foreach (var n in notes.Distinct()) w.WriteLine($"  Note: {n}");
    }

    private static void Row(TextTable table, string name, CorrelationEstimate c)
    {
        string ci = c.Ci95 is { Length: 2 } i ? $"[{TextTable.Number(i[0], 4)}, {TextTable.Number(i[1], 4)}]" : "-";
        table.Add(name, c.Estimate is null ? "undefined" : TextTable.Number(c.Estimate, 4), ci, TextTable.PValue(c.PValue));
    }

    private static void AddNote(List<string> notes, string measure, string? note, string method)
    {
        if (string.IsNullOrEmpty(note) || note == method) return;
        notes.Add(note.StartsWith(method, StringComparison.Ordinal) ? $"{measure}: {note[method.Length..].TrimStart(';', ' ')}" : $"{measure}: {note}");
    }
}
