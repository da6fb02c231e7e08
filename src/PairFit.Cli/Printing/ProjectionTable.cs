using System.Globalization;
using PairFit.Core.Results;

namespace PairFit.Cli.Printing;

/// <summary>Readable console tables for a projection and for joint probabilities.</summary>
public static class ProjectionTable
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    private static string N(double? v) => v is { } d ? d.ToString("G6", Inv) : "-";

    public static void Write(ProjectionSection p, TextWriter w)
    {
        w.WriteLine($"Q = {p.Expression}");
        w.WriteLine($"method: {p.Method}{(p.Draws is { } n ? $" ({n} draws, seed {p.Seed})" : "")}");
        if (p.UndefinedProbability is { } u) w.WriteLine($"P(Q undefined) = {N(u)}");
        var columns = new List<(string Name, ProjectionComparison? C)>
        {
            ("model", null), ("independent", p.Independence), ("comonotonic", p.Comonotonic),
        };
        if (p.Empirical is not null) columns.Add(("data", p.Empirical));
        w.WriteLine();
        w.WriteLine(Row("", columns.Select(c => c.Name)));
        w.WriteLine(Row("mean", columns.Select(c => N(c.C is null ? p.Mean : c.C.Mean))));
        w.WriteLine(Row("sd", columns.Select(c => N(c.C is null ? p.Sd : c.C.Sd))));
        for (int i = 0; i < p.Quantiles.Count; i++)
            w.WriteLine(Row($"quantile {p.Quantiles[i].P.ToString("0.####", Inv)}", columns.Select(c => N((c.C?.Quantiles ?? p.Quantiles).ElementAtOrDefault(i)?.Value))));
        for (int i = 0; i < p.Exceedance.Count; i++)
            w.WriteLine(Row($"P(Q > {N(p.Exceedance[i].Threshold)})", columns.Select(c => N((c.C?.Exceedance ?? p.Exceedance).ElementAtOrDefault(i)?.Probability))));
        for (int i = 0; i < p.ValueAtRisk.Count; i++)
            w.WriteLine(Row($"VaR {p.ValueAtRisk[i].Level.ToString("0.####", Inv)}", columns.Select(c => N((c.C?.ValueAtRisk ?? p.ValueAtRisk).ElementAtOrDefault(i)?.Value))));
        for (int i = 0; i < p.TailValueAtRisk.Count; i++)
            w.WriteLine(Row($"TVaR {p.TailValueAtRisk[i].Level.ToString("0.####", Inv)}", columns.Select(c => N((c.C?.TailValueAtRisk ?? p.TailValueAtRisk).ElementAtOrDefault(i)?.Value))));
        if (p.Quantiles.Any(q => q.Lower is not null || q.Upper is not null))
        {
            w.WriteLine();
            w.WriteLine("95 % intervals of the Monte Carlo quantiles:");
            foreach (var q in p.Quantiles)
                w.WriteLine($"  {q.P.ToString("0.####", Inv),-8} [{N(q.Lower)}, {N(q.Upper)}]");
        }
        if (p.Check is { } check)
        {
            w.WriteLine();
            w.WriteLine($"check: largest CDF difference quadrature vs Monte Carlo {N(check.MaxCdfDifference)} "
                + $"(allowed {N(check.AllowedDifference)} for {check.Draws} draws): {(check.Agree ? "agree" : "DISAGREE")}");
        }
        foreach (var note in Notes(p))
            w.WriteLine($"note: {note}");
    }

    private static IEnumerable<string> Notes(ProjectionSection p)
    {
        foreach (var n in p.Notes ?? []) yield return n;
        if (p.Independence?.Note is { } a) yield return "independent: " + a;
        if (p.Comonotonic?.Note is { } b) yield return "comonotonic: " + b;
        if (p.Empirical?.Note is { } c) yield return "data: " + c;
    }

    private static string Row(string label, IEnumerable<string> cells)
        => $"{label,-18}" + string.Concat(cells.Select(c => $"{c,14}"));

    public static void Write(JointSection j, TextWriter w)
    {
        w.WriteLine($"design pair: x = {N(j.XValue)}, y = {N(j.YValue)}; {N(j.EventsPerYear)} events per year (mean interarrival {N(j.MeanInterarrivalYears)} years)");
        w.WriteLine();
        w.WriteLine($"{"",-30}{"model",14}{"independent",14}");
        w.WriteLine($"{"P(X > x)",-30}{N(j.ProbabilityXExceeds),14}");
        w.WriteLine($"{"P(Y > y)",-30}{N(j.ProbabilityYExceeds),14}");
        w.WriteLine($"{"P(X > x and Y > y)",-30}{N(j.ProbabilityBothExceed),14}{N(j.IndependentBothExceed),14}");
        w.WriteLine($"{"P(X > x or Y > y)",-30}{N(j.ProbabilityEitherExceeds),14}{N(j.IndependentEitherExceeds),14}");
        w.WriteLine($"{"P(Y > y | X > x)",-30}{N(j.ProbabilityYExceedsGivenXExceeds),14}{N(j.ProbabilityYExceeds),14}");
        w.WriteLine($"{"P(Y > y | X = x)",-30}{N(j.ProbabilityYExceedsGivenXEquals),14}{N(j.ProbabilityYExceeds),14}");
        w.WriteLine($"{"C(F_X(x), F_Y(y))",-30}{N(j.CopulaLevel),14}");
        w.WriteLine($"{"Kendall K_C(t)",-30}{N(j.KendallProbability),14}");
        w.WriteLine();
        w.WriteLine("return periods (years):");
        w.WriteLine($"  {"AND (both exceed)",-28}{N(j.ReturnPeriods.And),14}");
        w.WriteLine($"  {"Kendall",-28}{N(j.ReturnPeriods.Kendall),14}");
        w.WriteLine($"  {"OR (either exceeds)",-28}{N(j.ReturnPeriods.Or),14}");
        w.WriteLine($"  {"X alone",-28}{N(j.ReturnPeriods.XAlone),14}");
        w.WriteLine($"  {"Y alone",-28}{N(j.ReturnPeriods.YAlone),14}");
        foreach (var d in j.Designs ?? [])
        {
            w.WriteLine();
            w.WriteLine($"design for T = {N(d.ReturnPeriod)} years, {d.Kind} ({d.Note}); level {N(d.Level)}");
            if (d.MostLikely is { } m)
                w.WriteLine($"  most likely design event: x = {N(m.X)}, y = {N(m.Y)} (log density {N(m.LogDensity)})");
            int step = Math.Max(1, d.Isoline.Count / 10);
            w.WriteLine($"  isoline ({d.Isoline.Count} points; every {step}th shown):");
            for (int i = 0; i < d.Isoline.Count; i += step)
                w.WriteLine($"    x = {N(d.Isoline[i].X),12}  y = {N(d.Isoline[i].Y),12}");
        }
        foreach (var note in j.Notes ?? [])
            w.WriteLine($"note: {note}");
    }
}
