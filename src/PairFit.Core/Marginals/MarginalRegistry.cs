using PairFit.Core.Common;

namespace PairFit.Core.Marginals;

/// <summary>
/// Builds a marginal distribution from its trade name and parameters (as stored in the results
/// file). Adding a family means adding its file and one line here.
/// </summary>
public static class MarginalRegistry
{
    private static readonly Dictionary<string, Func<IReadOnlyList<double>, IMarginalDistribution>> Factories =
        new(StringComparer.OrdinalIgnoreCase)
        {
            [NormalDistribution.FamilyName] = p => new NormalDistribution(p[0], p[1]),
            [LogNormalDistribution.FamilyName] = p => new LogNormalDistribution(p[0], p[1]),
            [ExponentialDistribution.FamilyName] = p => new ExponentialDistribution(p[0]),
        };

    public static IReadOnlyCollection<string> FamilyNames => Factories.Keys;

    public static IMarginalDistribution Create(string family, IReadOnlyList<double> parameters)
    {
        if (!Factories.TryGetValue(family, out var make))
            throw new PairFitInputException($"unknown marginal family '{family}'; known: {string.Join(", ", Factories.Keys)}.");
        try
        {
            return make(parameters);
        }
        catch (Exception e) when (e is ArgumentException or IndexOutOfRangeException)
        {
            throw new PairFitInputException($"marginal family '{family}': invalid parameters [{string.Join(", ", parameters)}]: {e.Message}");
        }
    }
}
