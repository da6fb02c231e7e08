using System.Globalization;
using PairFit.Core.Data;
using PairFit.Core.Results;

namespace PairFit.Core.Dependence;

/// <summary>Pearson, Spearman, Kendall tau-b and empirical tail dependence of a paired sample.</summary>
/// <remarks>
/// Undefined quantities are null with a note, never NaN: every coefficient of a constant column,
/// p-values below n = 3, intervals below n = 4 (Fisher z needs n − 3 &gt; 0).
/// </remarks>
public static class DependenceAnalysis
{
    public const string PearsonMethod = "p-value: t test on n-2 df (exact under bivariate normality); 95% interval: Fisher z, se = 1/sqrt(n-3)";
    public const string SpearmanMethod = "average ranks for ties; p-value: t approximation on n-2 df; 95% interval: Fisher z with the Bonett-Wright (2000) se = sqrt((1+rho^2/2)/(n-3))";
    public const string KendallMethod = "tau-b with tie corrections; p-value: normal approximation with the tie-corrected null variance (Kendall 1970), exact for n <= 33 without ties; 95% interval: tau-b +/- 1.96 jackknife se, clipped to [-1, 1]";
    public const string TailEstimator = "empirical on pseudo-observations u = rank/(n+1): upper = #{u>t, v>t}/(n(1-t)), lower = #{u<=1-t, v<=1-t}/(n(1-t)), t = 1 - k/n, k = floor(sqrt(n))";

    public static DependenceSection Compute(PairedSample sample)
    {
        ArgumentNullException.ThrowIfNull(sample);
        int n = sample.Count;
        string? undefined = UndefinedReason(sample);
        if (undefined is not null)
        {
            var none = new CorrelationEstimate { Note = undefined };
            return new DependenceSection
            {
                N = n, Pearson = none, Spearman = none, Kendall = none,
                Tail = new TailDependenceEstimate { Estimator = TailEstimator, Note = undefined },
            };
        }

        CorrelationEstimate pearson = null!, spearman = null!, kendall = null!;
        TailDependenceEstimate tail = null!;
        // The three pieces are independent and deterministic; on large samples running them side by side pays.
        Parallel.Invoke(
            () => pearson = PearsonEstimate(sample.X, sample.Y),
            () => (spearman, tail) = RankEstimates(sample.X, sample.Y),
            () => kendall = KendallEstimate(sample.X, sample.Y));
        return new DependenceSection { N = n, Pearson = pearson, Spearman = spearman, Kendall = kendall, Tail = tail };
    }

    private static string? UndefinedReason(PairedSample s)
    {
        if (s.Count < 2) return $"undefined: {s.Count} pair(s); at least two are needed";
        if (!AllFinite(s.X) || !AllFinite(s.Y)) return "undefined: the sample holds infinite or NaN values (the CSV reader never produces them)";
        bool xConstant = IsConstant(s.X), yConstant = IsConstant(s.Y);
        if (xConstant || yConstant)
        {
            string which = xConstant && yConstant ? $"'{s.XName}' and '{s.YName}' are" : $"'{(xConstant ? s.XName : s.YName)}' is";
            return $"undefined: {which} constant";
        }
        return null;
    }

    private static bool AllFinite(double[] v)
    {
        foreach (double a in v) if (!double.IsFinite(a)) return false;
        return true;
    }

    private static bool IsConstant(double[] v)
    {
        for (int i = 1; i < v.Length; i++) if (v[i] != v[0]) return false;
        return true;
    }

    private static CorrelationEstimate PearsonEstimate(double[] x, double[] y)
    {
        double r = PearsonCorrelation.Estimate(x, y);
        int n = x.Length;
        return new CorrelationEstimate
        {
            Estimate = r,
            PValue = n >= 3 ? CorrelationInference.TTestPValue(r, n) : null,
            Ci95 = n >= 4 ? CorrelationInference.FisherInterval(r, 1 / Math.Sqrt(n - 3)) : null,
            Note = WithSmallSampleCaution(PearsonMethod, n),
        };
    }

    private static (CorrelationEstimate, TailDependenceEstimate) RankEstimates(double[] x, double[] y)
    {
        int n = x.Length;
        var rx = Ranks.Average(x);
        var ry = Ranks.Average(y);
        double rho = PearsonCorrelation.Estimate(rx, ry);
        var spearman = new CorrelationEstimate
        {
            Estimate = rho,
            PValue = n >= 3 ? CorrelationInference.TTestPValue(rho, n) : null,
            Ci95 = n >= 4 ? CorrelationInference.FisherInterval(rho, Math.Sqrt((1 + rho * rho / 2) / (n - 3))) : null,
            Note = WithSmallSampleCaution(SpearmanMethod, n),
        };

        // Pseudo-observations from the ranks already at hand (Ranks.PseudoObservations does the same).
        double scale = 1.0 / (n + 1);
        for (int i = 0; i < n; i++) { rx[i] *= scale; ry[i] *= scale; }
        var (lower, upper, threshold, k) = TailDependence.EstimateFromPseudoObservations(rx, ry);
        var tail = new TailDependenceEstimate
        {
            Lower = lower,
            Upper = upper,
            Estimator = TailEstimator,
            Threshold = threshold,
            K = k,
            Note = k < 10 ? $"only k = {k} extreme pairs per tail: a rough indication, not an estimate to rely on" : null,
        };
        return (spearman, tail);
    }

    private static CorrelationEstimate KendallEstimate(double[] x, double[] y)
    {
        int n = x.Length;
        var counts = KendallTau.Count(x, y);
        double tau = counts.TauB;
        double pValue = KendallTau.PValue(counts, out bool exact);
        double? p = double.IsNaN(pValue) ? null : pValue;
        double[]? ci = null;
        if (n >= 4 && KendallTau.JackknifeStandardError(x, y, counts) is { } se)
            ci = [Math.Max(-1, tau - CorrelationInference.Z975 * se), Math.Min(1, tau + CorrelationInference.Z975 * se)];
        string note = WithSmallSampleCaution(KendallMethod, n);
        if (exact) note += "; this p-value is exact (no ties)";
        if (n >= 4 && ci is null) note += "; no interval: leaving one pair out makes a column constant";
        return new CorrelationEstimate { Estimate = tau, PValue = p, Ci95 = ci, Note = note };
    }

    private static string WithSmallSampleCaution(string method, int n) => n switch
    {
        < 3 => method + "; no p-value or interval with n = " + n.ToString(CultureInfo.InvariantCulture),
        < 4 => method + "; no interval with n = 3",
        < 10 => method + "; n < 10: the approximations are rough",
        _ => method,
    };
}
