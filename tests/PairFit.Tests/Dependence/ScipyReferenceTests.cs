using System.Text.Json;
using PairFit.Core.Data;
using PairFit.Core.Dependence;

namespace PairFit.Tests.Dependence;

/// <summary>
/// Every estimate against SciPy 1.10.1 via Reference/Dependence/make_reference.py, on its committed
/// small datasets (ties, heavy ties, negative dependence, skewed n = 500, tiny n = 5, monotone).
/// The datasets are read through PairedCsvReader, so the reader's number parsing is checked too.
/// </summary>
public class ScipyReferenceTests
{
    private static readonly string Folder = Path.Combine(AppContext.BaseDirectory, "Reference", "Dependence");

    public static IEnumerable<object[]> Datasets()
    {
        using var doc = JsonDocument.Parse(File.ReadAllText(Path.Combine(Folder, "reference.json")));
        foreach (var d in doc.RootElement.GetProperty("datasets").EnumerateObject())
            yield return [d.Name];
    }

    private static (PairedSample Sample, JsonElement Ref) Load(string name)
    {
        var doc = JsonDocument.Parse(File.ReadAllText(Path.Combine(Folder, "reference.json")));
        var sample = PairedCsvReader.Read(Path.Combine(Folder, name + ".csv"), new ColumnSelector("x"), new ColumnSelector("y"), new CsvOptions());
        return (sample, doc.RootElement.GetProperty("datasets").GetProperty(name).Clone());
    }

    private static double D(JsonElement e, string a, string b) => e.GetProperty(a).GetProperty(b).GetDouble();

    [Theory]
    [MemberData(nameof(Datasets))]
    public void EstimatesAgreeWithScipyTo1e12(string name)
    {
        var (sample, r) = Load(name);
        var d = DependenceAnalysis.Compute(sample);
        Assert.Equal(r.GetProperty("n").GetInt32(), d.N);
        // 1e-12 absolute: both sides are a handful of floating-point sums of O(1) terms; the
        // algorithms differ (SciPy normalises vectors before the dot product, merges on dense ranks),
        // so agreement is to rounding, a few ulps times the number of terms.
        Assert.Equal(D(r, "pearson", "estimate"), d.Pearson.Estimate!.Value, 1e-12);
        Assert.Equal(D(r, "spearman", "estimate"), d.Spearman.Estimate!.Value, 1e-12);
        Assert.Equal(D(r, "kendall", "estimate"), d.Kendall.Estimate!.Value, 1e-12);
    }

    [Theory]
    [MemberData(nameof(Datasets))]
    public void PValuesAgreeWithScipy(string name)
    {
        var (sample, r) = Load(name);
        var d = DependenceAnalysis.Compute(sample);
        // Same formulas as SciPy (t on n-2 df through the incomplete beta function; Kendall's
        // tie-corrected normal approximation), but other special-function code (MathNet's
        // continued fraction vs Cephes): relative 1e-9 is far above both codes' stated accuracy
        // and far below anything that changes a conclusion.
        AssertRelative(D(r, "pearson", "pValue"), d.Pearson.PValue!.Value, 1e-9);
        AssertRelative(D(r, "spearman", "pValue"), d.Spearman.PValue!.Value, 1e-9);
        // Kendall: SciPy's default method 'auto' (exact without ties for n <= 33), which PairFit follows.
        AssertRelative(D(r, "kendall", "pValueAuto"), d.Kendall.PValue!.Value, 1e-9);
    }

    [Theory]
    [MemberData(nameof(Datasets))]
    public void KendallNormalApproximationAgreesWithScipyAsymptotic(string name)
    {
        var (sample, r) = Load(name);
        var c = KendallTau.Count(sample.X, sample.Y);
        // Kendall (1970) tie-corrected variance, as SciPy's method='asymptotic'; tolerance as above.
        double p = CorrelationInferenceProbe.NormalPValue(c.S / Math.Sqrt(c.NullVarianceOfS));
        AssertRelative(D(r, "kendall", "pValue"), p, 1e-9);
    }

    [Theory]
    [MemberData(nameof(Datasets))]
    public void PearsonFisherIntervalAgreesWithScipy(string name)
    {
        var (sample, r) = Load(name);
        var d = DependenceAnalysis.Compute(sample);
        var ci = r.GetProperty("pearson").GetProperty("ci95");
        // SciPy 1.10.1 PearsonRResult.confidence_interval uses the same Fisher z interval; SciPy's
        // normal quantile and ours agree to ~1e-15, tanh/atanh to rounding.
        Assert.Equal(ci[0].GetDouble(), d.Pearson.Ci95![0], 1e-12);
        Assert.Equal(ci[1].GetDouble(), d.Pearson.Ci95![1], 1e-12);
    }

    [Theory]
    [MemberData(nameof(Datasets))]
    public void KendallJackknifeAgreesWithLeaveOneOutScipy(string name)
    {
        var (sample, r) = Load(name);
        if (!r.TryGetProperty("kendallJackknifeSe", out var se)) return; // only computed for n <= 100
        var counts = KendallTau.Count(sample.X, sample.Y);
        // SciPy side: n explicit leave-one-out kendalltau calls; ours: the O(n log n) score formula.
        Assert.Equal(se.GetDouble(), KendallTau.JackknifeStandardError(sample.X, sample.Y, counts)!.Value, 1e-12);
        var d = DependenceAnalysis.Compute(sample);
        double tau = d.Kendall.Estimate!.Value, s = se.GetDouble();
        Assert.Equal(Math.Max(-1, tau - 1.959963984540054 * s), d.Kendall.Ci95![0], 1e-12);
        Assert.Equal(Math.Min(1, tau + 1.959963984540054 * s), d.Kendall.Ci95![1], 1e-12);
    }

    [Theory]
    [MemberData(nameof(Datasets))]
    public void TailDependenceAgreesWithDirectCount(string name)
    {
        var (sample, r) = Load(name);
        var d = DependenceAnalysis.Compute(sample);
        var t = r.GetProperty("tail");
        Assert.Equal(t.GetProperty("k").GetInt32(), d.Tail.K);
        // Exact: both are a count divided by k (NumPy with scipy.stats.rankdata ranks).
        Assert.Equal(t.GetProperty("threshold").GetDouble(), d.Tail.Threshold!.Value, 1e-15);
        Assert.Equal(t.GetProperty("lower").GetDouble(), d.Tail.Lower!.Value, 1e-14);
        Assert.Equal(t.GetProperty("upper").GetDouble(), d.Tail.Upper!.Value, 1e-14);
    }

    private static void AssertRelative(double expected, double actual, double rel)
    {
        double tol = rel * Math.Abs(expected) + 1e-300;
        Assert.True(Math.Abs(expected - actual) <= tol, $"expected {expected:R}, got {actual:R} (relative tolerance {rel})");
    }
}
