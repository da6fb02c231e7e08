using PairFit.Core.Common;

namespace PairFit.Core.Copulas;

/// <summary>
/// The copula families PairFit knows, in the order they are tried and reported. Adding a family
/// means adding its file and one line here.
/// </summary>
public static class CopulaRegistry
{
    public static readonly IReadOnlyList<ICopulaFamily> Families =
    [
        IndependenceLaw.Family,
        GaussianLaw.Family,
        StudentTLaw.Family,
        ClaytonLaw.Family,
        GumbelLaw.Family,
        FrankLaw.Family,
        JoeLaw.Family,
    ];

    public static ICopulaFamily Find(string name)
    {
        foreach (var f in Families)
            if (string.Equals(f.Name, name, StringComparison.OrdinalIgnoreCase))
                return f;
        throw new PairFitInputException($"unknown copula family '{name}'; known: {string.Join(", ", Families.Select(f => f.Name))}.");
    }

    /// <summary>The copula of <paramref name="family"/> with these parameters, rotated by <paramref name="rotation"/> degrees.</summary>
    public static ICopula Create(string family, int rotation, IReadOnlyList<double> parameters)
    {
        var f = Find(family);
        if (!f.Rotations.Contains(rotation))
            throw new PairFitInputException($"copula family '{family}' has no rotation {rotation}; allowed: {string.Join(", ", f.Rotations)}.");
        if (parameters.Count != f.ParameterNames.Count)
            throw new PairFitInputException($"copula family '{family}' takes {f.ParameterNames.Count} parameter(s) ({string.Join(", ", f.ParameterNames)}), got {parameters.Count}.");
        try
        {
            return RotatedCopula.Rotate(f.Create(parameters), rotation);
        }
        catch (ArgumentException e)
        {
            throw new PairFitInputException($"copula family '{family}': invalid parameters [{string.Join(", ", parameters)}]: {e.Message}");
        }
    }
}
