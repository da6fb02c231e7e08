using System.Globalization;
using PairFit.Core.Copulas;

namespace PairFit.Tests.Copulas;

/// <summary>Shared family × rotation × parameter cases and reference-file reading for the copula tests.</summary>
public static class CopulaTestCases
{
    /// <summary>Moderate parameters (|τ| about 0.3–0.6) of every family. Student t uses integer ν here because
    /// the CDF-based checks need the closed-form bivariate t CDF; a non-integer ν has its own checks.</summary>
    private static readonly (string Family, double[] Parameters)[] Moderate =
    [
        ("independence", []),
        ("gaussian", [0.5]),
        ("gaussian", [-0.7]),
        ("student-t", [0.5, 4]),
        ("student-t", [-0.6, 3]),
        ("clayton", [2.0]),
        ("gumbel", [2.0]),
        ("frank", [5.0]),
        ("frank", [-5.0]),
        ("joe", [2.5]),
    ];

    /// <summary>The extreme parameters the numerics must survive (issue 4).</summary>
    private static readonly (string Family, double[] Parameters)[] Extreme =
    [
        ("gaussian", [0.99]),
        ("gaussian", [-0.99]),
        ("student-t", [0.5, 2]),
        ("student-t", [-0.99, 2]),
        ("student-t", [0.9, 2.7]),
        ("clayton", [50.0]),
        ("gumbel", [30.0]),
        ("frank", [80.0]),
        ("frank", [-80.0]),
        ("joe", [30.0]),
    ];

    public static TheoryData<string, int, double[]> ModerateWithRotations() => WithRotations(Moderate);

    public static TheoryData<string, int, double[]> ExtremeWithRotations() => WithRotations(Extreme);

    private static TheoryData<string, int, double[]> WithRotations((string Family, double[] Parameters)[] cases)
    {
        var data = new TheoryData<string, int, double[]>();
        foreach (var (family, parameters) in cases)
        {
            if (!CopulaRegistry.Families.Any(f => f.Name == family)) continue;
            foreach (int rotation in CopulaRegistry.Find(family).Rotations)
                data.Add(family, rotation, parameters);
        }
        return data;
    }

    public static ICopula Create(string family, int rotation, double[] parameters)
        => CopulaRegistry.Create(family, rotation, parameters);

    /// <summary>Rows of a reference CSV (header skipped) as string arrays.</summary>
    public static IEnumerable<string[]> ReadReference(string fileName)
    {
        string path = Path.Combine(AppContext.BaseDirectory, "Reference", "Copulas", fileName);
        return File.ReadLines(path).Skip(1).Where(l => l.Length > 0).Select(l => l.Split(','));
    }

    public static double Parse(string s) => double.Parse(s, NumberStyles.Float, CultureInfo.InvariantCulture);
}

/// <summary>
/// Composite Gauss–Legendre quadrature on [ε, 1 − ε] with panels graded geometrically towards both
/// ends, so that the integrable corner singularities of copula densities are resolved. The strips
/// left out hold exactly ε of probability each (uniform margins), at most 4ε in all.
/// </summary>
public static class UnitSquareQuadrature
{
    public const double Edge = 1e-10;
    private static readonly double[] Breaks =
    [
        Edge, 1e-8, 1e-6, 1e-5, 1e-4, 1e-3, 0.005, 0.02, 0.06, 0.15, 0.3, 0.5,
        0.7, 0.85, 0.94, 0.98, 0.995, 0.999, 1 - 1e-4, 1 - 1e-5, 1 - 1e-6, 1 - 1e-8, 1 - Edge,
    ];

    private static readonly (double[] Nodes, double[] Weights) Grid = BuildGrid(7);

    private static (double[], double[]) BuildGrid(int order)
    {
        var nodes = new List<double>();
        var weights = new List<double>();
        for (int p = 0; p + 1 < Breaks.Length; p++)
        {
            var rule = new MathNet.Numerics.Integration.GaussLegendreRule(Breaks[p], Breaks[p + 1], order);
            nodes.AddRange(rule.Abscissas);
            weights.AddRange(rule.Weights);
        }
        return (nodes.ToArray(), weights.ToArray());
    }

    public static double Integrate(Func<double, double, double> f)
    {
        var (x, w) = Grid;
        double sum = 0;
        for (int i = 0; i < x.Length; i++)
        {
            double row = 0;
            for (int j = 0; j < x.Length; j++) row += w[j] * f(x[i], x[j]);
            sum += w[i] * row;
        }
        return sum;
    }
}
