using PairFit.Cli.Printing;
using PairFit.Core.Results;

namespace PairFit.Cli;

/// <summary>The readable console summary of an analysis.</summary>
public static class ConsoleSummary
{
    public static void Write(AnalysisResults r, TextWriter w)
    {
        w.WriteLine($"Data: {r.Input.File ?? "(in memory)"}  x = {r.Input.XColumn}, y = {r.Input.YColumn}");
        w.WriteLine($"Rows: {r.Input.RowsRead} read, {r.Input.RowsUsed} used, {r.Input.RowsRead - r.Input.RowsUsed} dropped");
        foreach (var (reason, count) in r.Input.Dropped)
            w.WriteLine($"  dropped {count,8}  {reason}");
        w.WriteLine();
        DependenceTable.Write(r.Dependence, r.Input.XColumn, r.Input.YColumn, w);
        if (r.Marginals is { } m)
        {
            w.WriteLine();
            MarginalTable.Write(m, w, r.Input.XColumn, r.Input.YColumn);
        }
        if (r.Copula is { } c)
        {
            w.WriteLine();
            CopulaTable.Write(c, w);
        }
        foreach (var p in r.Projections ?? [])
        {
            w.WriteLine();
            ProjectionTable.Write(p, w);
        }
        if (r.Joint is { } j)
        {
            w.WriteLine();
            ProjectionTable.Write(j, w);
        }
        if (r.Model is not null)
        {
            w.WriteLine();
            w.WriteLine("Caution: these results support, and do not replace, local design codes, agency guidance and");
            w.WriteLine("licensed professional judgement; check the goodness of fit and figures before relying on the model.");
        }
    }
}
