using System.Globalization;
using System.Text.Json;
using PairFit.Core.Copulas;
using PairFit.Core.Copulas.Sampling;
using PairFit.Core.Common;
using PairFit.Core.Data;

namespace PairFit.Tests.CopulaFitting;

/// <summary>Shared helpers: reading the committed reference files and simulating samples from a copula.</summary>
internal static class FittingTestData
{
    public static string ReferencePath(string file) => Path.Combine(AppContext.BaseDirectory, "Reference", "CopulaFitting", file);

    public static PairedSample ReadCsv(string file)
    {
        var lines = File.ReadAllLines(ReferencePath(file));
        var x = new double[lines.Length - 1];
        var y = new double[lines.Length - 1];
        for (int i = 1; i < lines.Length; i++)
        {
            var parts = lines[i].Split(',');
            x[i - 1] = double.Parse(parts[0], CultureInfo.InvariantCulture);
            y[i - 1] = double.Parse(parts[1], CultureInfo.InvariantCulture);
        }
        return new PairedSample(x, y, "x", "y");
    }

    public sealed record ReferenceOptimum(string Dataset, string Family, int Rotation, string[] ParameterNames,
        double[] Parameters, double LogLikelihood, double[] StandardErrors);

    public static IReadOnlyList<ReferenceOptimum> ReadOptima()
    {
        using var doc = JsonDocument.Parse(File.ReadAllText(ReferencePath("optima.json")));
        var list = new List<ReferenceOptimum>();
        foreach (var r in doc.RootElement.GetProperty("optima").EnumerateArray())
            list.Add(new ReferenceOptimum(
                r.GetProperty("dataset").GetString()!,
                r.GetProperty("family").GetString()!,
                r.GetProperty("rotation").GetInt32(),
                r.GetProperty("parameterNames").EnumerateArray().Select(e => e.GetString()!).ToArray(),
                r.GetProperty("parameters").EnumerateArray().Select(e => e.GetDouble()).ToArray(),
                r.GetProperty("logLikelihood").GetDouble(),
                r.GetProperty("standardErrors").EnumerateArray().Select(e => e.GetDouble()).ToArray()));
        return list;
    }

    public static ICopulaFamily? TryFamily(string name)
        => CopulaRegistry.Families.FirstOrDefault(f => string.Equals(f.Name, name, StringComparison.OrdinalIgnoreCase));

    /// <summary>n pairs from <paramref name="copula"/> on stream <paramref name="seed"/>, as a sample with uniform marginals.</summary>
    public static PairedSample Simulate(ICopula copula, int n, int seed)
    {
        var u = new double[n];
        var v = new double[n];
        CopulaSampler.Fill(copula, RandomStreams.For(seed), u, v);
        return new PairedSample(u, v, "u", "v");
    }
}
