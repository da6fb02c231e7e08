using System.Globalization;
using System.Text.Json;
using PairFit.Core.Marginals;

namespace PairFit.Tests.Marginals;

/// <summary>Readers for the committed SciPy 1.10.1 reference files (Reference/Marginals/make_reference.py).</summary>
internal static class MarginalReference
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    public static string PathOf(params string[] parts) => Path.Combine([AppContext.BaseDirectory, "Reference", "Marginals", .. parts]);

    public sealed record Point(string Family, double[] Parameters, double X, double LogPdf, double Cdf, double Sf);
    public sealed record QuantilePoint(string Family, double[] Parameters, double P, double Ppf);
    public sealed record Fit(string Dataset, string Family, double[] ScipyParameters, double ScipyLogLikelihood, double[] PolishedParameters, double PolishedLogLikelihood);

    private static double[] Params(string[] f) => f.Skip(1).Take(3).Where(s => s.Length > 0).Select(s => double.Parse(s, Inv)).ToArray();

    public static IReadOnlyList<Point> Points() => File.ReadLines(PathOf("pointwise.csv")).Skip(1)
        .Select(l => l.Split(','))
        .Select(f => new Point(f[0], Params(f), D(f[4]), D(f[5]), D(f[6]), D(f[7]))).ToList();

    public static IReadOnlyList<QuantilePoint> Quantiles() => File.ReadLines(PathOf("quantiles.csv")).Skip(1)
        .Select(l => l.Split(','))
        .Select(f => new QuantilePoint(f[0], Params(f), D(f[4]), D(f[5]))).ToList();

    /// <summary>Distinct (family, parameters) cases of the pointwise file.</summary>
    public static IEnumerable<object[]> Cases() => Points()
        .GroupBy(p => p.Family + string.Join(";", p.Parameters))
        .Select(g => new object[] { g.First().Family, g.First().Parameters });

    public static IReadOnlyList<Fit> Fits()
    {
        using var doc = JsonDocument.Parse(File.ReadAllText(PathOf("fits.json")));
        return doc.RootElement.GetProperty("fits").EnumerateArray().Select(e => new Fit(
            e.GetProperty("dataset").GetString()!, e.GetProperty("family").GetString()!,
            e.GetProperty("scipyParameters").EnumerateArray().Select(v => v.GetDouble()).ToArray(),
            e.GetProperty("scipyLogLikelihood").GetDouble(),
            e.GetProperty("polishedParameters").EnumerateArray().Select(v => v.GetDouble()).ToArray(),
            e.GetProperty("polishedLogLikelihood").GetDouble())).ToList();
    }

    public static double[] Dataset(string name) => File.ReadLines(PathOf("datasets", name + ".csv"))
        .Where(l => l.Length > 0 && l[0] != '#').Select(D).ToArray();

    private static double D(string s) => s switch
    {
        "inf" => double.PositiveInfinity,
        "-inf" => double.NegativeInfinity,
        "nan" => double.NaN,
        _ => double.Parse(s, Inv),
    };

    public static IMarginalDistribution Create(string family, double[] p) => MarginalRegistry.Create(family, p);
}
