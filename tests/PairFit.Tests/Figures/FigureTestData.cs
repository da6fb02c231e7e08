using PairFit.Core.Copulas;
using PairFit.Core.Data;
using PairFit.Core.Dependence;
using PairFit.Core.Marginals;
using PairFit.Core.Model;
using PairFit.Core.Results;

namespace PairFit.Tests.Figures;

/// <summary>
/// A small synthetic sample (labelled synthetic; invented column names) and a joint model fitted
/// to it with closed-form estimators: lognormal and normal maximum likelihood (mean and population
/// SD, of the logs for the lognormal) and Clayton by inversion of Kendall's tau, θ = 2τ/(1 − τ)
/// (Nelsen 2006, Example 5.4). Results records are filled from these fits.
/// </summary>
internal static class FigureTestData
{
    public static readonly JointModel TrueModel = new(
        new LogNormalDistribution(3, 0.5), new NormalDistribution(50, 10), CopulaRegistry.Create("clayton", 180, [2.0]));

    public static PairedSample Sample(int n = 150, string xName = "synthetic_rain_mm", string yName = "synthetic_flow_m3s", string? file = "synthetic.csv")
    {
        var (x, y) = TrueModel.Sample(n, seed: 11);
        return new PairedSample(x, y, xName, yName, new RowAccounting(file, n + 2, n, new Dictionary<string, int> { ["missing y"] = 2 }));
    }

    public static JointModel Fit(PairedSample s)
    {
        int n = s.Count;
        double ml = 0, mx = 0;
        for (int i = 0; i < n; i++) { ml += Math.Log(s.X[i]); mx += s.Y[i]; }
        ml /= n; mx /= n;
        double vl = 0, vx = 0;
        for (int i = 0; i < n; i++) { vl += Math.Pow(Math.Log(s.X[i]) - ml, 2); vx += Math.Pow(s.Y[i] - mx, 2); }
        var fx = new LogNormalDistribution(ml, Math.Sqrt(vl / n));
        var fy = new NormalDistribution(mx, Math.Sqrt(vx / n));
        double tau = KendallTau.TauB(s.X, s.Y);
        var c = CopulaRegistry.Create("clayton", 180, [2 * tau / (1 - tau)]);
        return new JointModel(fx, fy, c);
    }

    public static AnalysisResults Results(PairedSample s, JointModel? model) => new()
    {
        Tool = "pairfit test",
        CreatedUtc = "2026-12-02T00:00:00Z",
        Input = new InputSection
        {
            File = s.Rows.Source,
            XColumn = s.XName,
            YColumn = s.YName,
            RowsRead = s.Rows.RowsRead,
            RowsUsed = s.Rows.RowsUsed,
            Dropped = s.Rows.DroppedByReason,
        },
        Dependence = new DependenceSection
        {
            N = s.Count,
            Pearson = new CorrelationEstimate { Estimate = 0.61, PValue = 1e-9, Ci95 = [0.5, 0.7], Note = "Fisher z" },
            Spearman = new CorrelationEstimate { Estimate = 0.58 },
            Kendall = new CorrelationEstimate { Estimate = KendallTau.TauB(s.X, s.Y) },
            Tail = new TailDependenceEstimate { Lower = null, Upper = 0.4, Estimator = "test", Threshold = 0.9 },
        },
        Model = model is null ? null : ModelSection.From(model, s.XName, s.YName),
        Settings = new Dictionary<string, string> { ["seed"] = "11" },
    };
}
