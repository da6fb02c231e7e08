using System.Globalization;
using PairFit.Core.Copulas;
using PairFit.Core.Marginals;

namespace PairFit.Figures.Plots;

/// <summary>Legend labels for fitted families: "clayton 180° (theta = 2.1)", "lognormal (mu = 3, sigma = 0.5)".</summary>
public static class Labels
{
    public static string Of(ICopula c) => Format(c.Family + (c.Rotation == 0 ? "" : $" {c.Rotation}°"), c.ParameterNames, c.Parameters);

    public static string Of(IMarginalDistribution d) => Format(d.Family, d.ParameterNames, d.Parameters);

    public static string Number(double v) => v.ToString("G3", CultureInfo.InvariantCulture);

    private static string Format(string name, IReadOnlyList<string> names, IReadOnlyList<double> values)
    {
        if (values.Count == 0) return name;
        var parts = new string[values.Count];
        for (int i = 0; i < parts.Length; i++) parts[i] = $"{names[i]} = {Number(values[i])}";
        return $"{name} ({string.Join(", ", parts)})";
    }
}
