using System.Globalization;
using System.Text;
using PairFit.Core.Results;

namespace PairFit.Cli.Printing;

/// <summary>The ranked copula table of `analyze`: one line per candidate, best AIC first, then what was left out and why.</summary>
public static class CopulaTable
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    public static void Write(CopulaSection c, TextWriter w)
    {
        string how = c.Method switch
        {
            "pseudo" => "maximum pseudo-likelihood on ranks",
            "ifm" => "inference functions for margins",
            "full" => "joint maximum likelihood with the marginals",
            _ => c.Method,
        };
        w.WriteLine(string.Create(Inv, $"Copula candidates ({how}); empirical Kendall's tau = {c.EmpiricalKendallTau:0.000}"));
        w.WriteLine($"{"#",3}  {"family",-13}{"rot",4}  {"parameters (standard error)",-40}{"logLik",11}{"AIC",11}{"BIC",11}{"tau",8}{"tailL",7}{"tailU",7}{"GOF p",8}");
        var notes = new List<string>();
        for (int i = 0; i < c.Candidates.Count; i++)
        {
            var k = c.Candidates[i];
            string mark = k.Converged ? "" : "!";
            if (k.Note is not null) { notes.Add($"{k.Family} {k.Rotation}: {k.Note}"); mark += $"[{notes.Count}]"; }
            string gof = k.Gof is null ? "-" : k.Gof.PValue.ToString("0.000", Inv);
            w.WriteLine(string.Create(Inv,
                $"{i + 1,3}  {k.Family,-13}{k.Rotation,4}  {Parameters(k),-40}{k.LogLikelihood,11:0.00}{k.Aic,11:0.00}{k.Bic,11:0.00}{k.KendallTau,8:0.000}{k.TailLower,7:0.00}{k.TailUpper,7:0.00}{gof,8} {mark}").TrimEnd());
        }
        var s = c.Selected;
        string test = s.Gof is null ? "" : string.Create(Inv, $"; Cramér–von Mises S_n = {s.Gof.Statistic:0.0000}, p = {s.Gof.PValue:0.000} ({s.Gof.Replicates} bootstrap replicates)");
        w.WriteLine($"Selected copula: {s.Family}{(s.Rotation == 0 ? "" : $" rotated {s.Rotation}°")} (lowest AIC){test}");
        if (c.Candidates.Any(k => !k.Converged)) w.WriteLine("  ! = optimiser did not meet its tolerance; ranked after the converged fits.");
        for (int i = 0; i < notes.Count; i++) w.WriteLine($"  [{i + 1}] {notes[i]}");
        if (c.Excluded is { Count: > 0 } ex)
        {
            w.WriteLine("Not fitted:");
            foreach (var e in ex) w.WriteLine($"  {e.Family} {e.Rotation}: {e.Reason}");
        }
    }

    private static string Parameters(CopulaCandidate k)
    {
        if (k.Parameters.Count == 0) return "(none)";
        var sb = new StringBuilder();
        foreach (var (name, value) in k.Parameters)
        {
            if (sb.Length > 0) sb.Append(", ");
            sb.Append(name).Append('=').Append(value.ToString("G4", Inv));
            k.StandardErrors.TryGetValue(name, out var se);
            sb.Append(se is { } e ? $" ({e.ToString("G2", Inv)})" : " (-)");
        }
        return sb.ToString();
    }
}
