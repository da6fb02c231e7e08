using PairFit.Core.Copulas;
using PairFit.Core.Copulas.Fitting;
using PairFit.Core.Projection;
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

    /// <summary>The same instance for the same arguments, so that analyses of it can be cached.</summary>
    public static PairedSample Sample(int n = 150, string xName = "synthetic_rain_mm", string yName = "synthetic_flow_m3s", string? file = "synthetic.csv")
    {
        lock (Samples)
        {
            if (Samples.TryGetValue((n, xName, yName, file), out var s)) return s;
            var (x, y) = TrueModel.Sample(n, seed: 11);
            return Samples[(n, xName, yName, file)] = new PairedSample(x, y, xName, yName,
                new RowAccounting(file, n + 2, n, new Dictionary<string, int> { ["missing y"] = 2 }));
        }
    }

    private static readonly Dictionary<(int, string, string, string?), PairedSample> Samples = [];

    /// <summary>
    /// The real fitting stages on the sample: dependence measures, marginal candidates by maximum
    /// likelihood ranked by AIC, copula candidates by maximum pseudo-likelihood (a small
    /// goodness-of-fit bootstrap to keep the tests quick) and one projection.
    /// </summary>
    public static (AnalysisResults Results, JointModel Model) Analyse(PairedSample s, bool withModel = true)
    {
        // the fits are deterministic, so each (sample, withModel) is analysed once per test run
        lock (Cache)
        {
            if (!Cache.TryGetValue(s, out var hit))
                Cache[s] = hit = AnalyseOnce(s);
            return withModel ? hit : (hit.Item1 with { Marginals = null, Copula = null, Model = null, Projections = null }, hit.Item2);
        }
    }

    private static readonly Dictionary<PairedSample, (AnalysisResults, JointModel)> Cache = [];

    private static (AnalysisResults Results, JointModel Model) AnalyseOnce(PairedSample s)
    {
        var dependence = DependenceAnalysis.Compute(s);
        var input = new InputSection
        {
            File = s.Rows.Source,
            XColumn = s.XName,
            YColumn = s.YName,
            RowsRead = s.Rows.RowsRead,
            RowsUsed = s.Rows.RowsUsed,
            Dropped = s.Rows.DroppedByReason,
        };
        var mx = MarginalAnalysis.Fit(s.X, new MarginalOptions { Candidates = ["lognormal", "gamma", "weibull", "normal"], VariableName = s.XName });
        var my = MarginalAnalysis.Fit(s.Y, new MarginalOptions { Candidates = ["normal", "gamma", "lognormal"], VariableName = s.YName });
        var cop = CopulaAnalysis.Fit(s, mx.Selected, my.Selected, new CopulaOptions { GofReplicates = 10, Seed = 11 });
        var model = new JointModel(mx.Selected, my.Selected, cop.Selected);
        var projection = ProjectionAnalysis.Project(model, "x + y", s.XName, s.YName, s, new ProjectionOptions { Seed = 11, GridPoints = 128 });
        var results = new AnalysisResults
        {
            Tool = "pairfit test",
            CreatedUtc = "2026-12-02T00:00:00Z",
            Input = input,
            Dependence = dependence,
            Marginals = new MarginalsSection { X = mx.Section, Y = my.Section },
            Copula = cop.Section,
            Model = ModelSection.From(model, s.XName, s.YName),
            Projections = [projection],
            Settings = new Dictionary<string, string> { ["seed"] = "11" },
        };
        return (results, model);
    }
}
