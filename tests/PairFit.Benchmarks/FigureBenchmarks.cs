using BenchmarkDotNet.Attributes;
using PairFit.Core.Copulas;
using PairFit.Core.Copulas.Fitting;
using PairFit.Core.Data;
using PairFit.Core.Dependence;
using PairFit.Core.Marginals;
using PairFit.Core.Model;
using PairFit.Core.Projection;
using PairFit.Core.Results;
using PairFit.Figures;
using PairFit.Figures.Report;

namespace PairFit.Benchmarks;

/// <summary>
/// Issue 6 target: every figure in PNG, SVG and PDF in under 5 s. The analysis (300 synthetic
/// pairs: marginals, copula without bootstrap, one projection) is done once in the setup; the
/// benchmark measures figures and report only.
/// Run: dotnet run -c Release --project tests/PairFit.Benchmarks -- --filter '*FigureBenchmarks*' --job short
/// </summary>
[MemoryDiagnoser]
public class FigureBenchmarks
{
    private PairedSample _sample = null!;
    private AnalysisResults _results = null!;
    private JointModel _model = null!;
    private string _dir = null!;

    [GlobalSetup]
    public void Setup()
    {
        var truth = new JointModel(new LogNormalDistribution(3, 0.5), new NormalDistribution(50, 10), CopulaRegistry.Create("clayton", 180, [2.0]));
        var (x, y) = truth.Sample(300, 7);
        _sample = new PairedSample(x, y, "synthetic_rain_mm", "synthetic_flow_m3s");
        var mx = MarginalAnalysis.Fit(x, new MarginalOptions { VariableName = _sample.XName });
        var my = MarginalAnalysis.Fit(y, new MarginalOptions { VariableName = _sample.YName });
        var cop = CopulaAnalysis.Fit(_sample, mx.Selected, my.Selected, new CopulaOptions { GofReplicates = 0, Seed = 1 });
        _model = new JointModel(mx.Selected, my.Selected, cop.Selected);
        var projection = ProjectionAnalysis.Project(_model, "x + y", _sample.XName, _sample.YName, _sample, new ProjectionOptions { Seed = 1 });
        _results = new AnalysisResults
        {
            Input = new InputSection { XColumn = _sample.XName, YColumn = _sample.YName, RowsRead = 300, RowsUsed = 300 },
            Dependence = DependenceAnalysis.Compute(_sample),
            Marginals = new MarginalsSection { X = mx.Section, Y = my.Section },
            Copula = cop.Section,
            Model = ModelSection.From(_model, _sample.XName, _sample.YName),
            Projections = [projection],
            Settings = new Dictionary<string, string> { ["seed"] = "1" },
        };
        _dir = Path.Combine(Path.GetTempPath(), "pairfit-figbench-" + Environment.ProcessId);
    }

    [GlobalCleanup]
    public void Cleanup()
    {
        if (Directory.Exists(_dir)) Directory.Delete(_dir, recursive: true);
    }

    [Benchmark(Description = "all figures, png+svg+pdf, 160 mm at 200 dpi, and the report")]
    public int AllFiguresThreeFormatsAndReport()
    {
        var files = FigureSet.RenderAll(_sample, _results, _model, _dir, new FigureOptions());
        ReportWriter.Write(_results, files, _dir);
        return files.Count;
    }

    [Benchmark(Description = "all figures, png only")]
    public int AllFiguresPngOnly() => FigureSet.RenderAll(_sample, _results, _model, _dir, new FigureOptions { Formats = ["png"] }).Count;
}
