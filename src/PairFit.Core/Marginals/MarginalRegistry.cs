using PairFit.Core.Common;

namespace PairFit.Core.Marginals;

/// <summary>
/// Builds a marginal distribution from its trade name and parameters (as stored in the results
/// file), and lists the families that can be fitted. Adding a family means adding its file and one
/// line here.
/// </summary>
public static class MarginalRegistry
{
    private static readonly Dictionary<string, IMarginalFamily> FittedFamilies = new(StringComparer.OrdinalIgnoreCase)
    {
        [NormalDistribution.FamilyName] = NormalDistribution.Definition,
        [LogNormalDistribution.FamilyName] = LogNormalDistribution.Definition,
        [GammaDistribution.FamilyName] = GammaDistribution.Definition,
        [WeibullDistribution.FamilyName] = WeibullDistribution.Definition,
        [ExponentialDistribution.FamilyName] = ExponentialDistribution.Definition,
        [GumbelDistribution.FamilyName] = GumbelDistribution.Definition,
        [GevDistribution.FamilyName] = GevDistribution.Definition,
        [LogLogisticDistribution.FamilyName] = LogLogisticDistribution.Definition,
        [Pearson3Distribution.FamilyName] = Pearson3Distribution.Definition,
        [LogPearson3Distribution.FamilyName] = LogPearson3Distribution.Definition,
        [GeneralizedParetoDistribution.FamilyName] = GeneralizedParetoDistribution.Definition,
    };

    /// <summary>Every parametric family, in the order they are tried and listed by default.</summary>
    public static IReadOnlyList<string> DefaultCandidates { get; } = [.. FittedFamilies.Keys];

    /// <summary>All family names, including the rank-based "empirical".</summary>
    public static IReadOnlyCollection<string> FamilyNames { get; } = [.. FittedFamilies.Keys, EmpiricalDistribution.FamilyName];

    /// <summary>The fitting definition of a parametric family, or null for unknown names and "empirical".</summary>
    public static IMarginalFamily? Find(string family) => FittedFamilies.GetValueOrDefault(family);

    /// <summary>
    /// The distribution of a family with the given parameters. For "empirical" the parameters are the
    /// data values the law interpolates.
    /// </summary>
    public static IMarginalDistribution Create(string family, IReadOnlyList<double> parameters)
    {
        bool empirical = string.Equals(family, EmpiricalDistribution.FamilyName, StringComparison.OrdinalIgnoreCase);
        if (!empirical && !FittedFamilies.ContainsKey(family))
            throw new PairFitInputException($"unknown marginal family '{family}'; known: {string.Join(", ", FamilyNames)}.");
        try
        {
            if (empirical) return new EmpiricalDistribution(parameters);
            var definition = FittedFamilies[family];
            if (parameters.Count != definition.ParameterNames.Count)
                throw new ArgumentException($"expected {definition.ParameterNames.Count} parameters ({string.Join(", ", definition.ParameterNames)}), got {parameters.Count}");
            return definition.Create(parameters);
        }
        catch (Exception e) when (e is ArgumentException or IndexOutOfRangeException)
        {
            throw new PairFitInputException($"marginal family '{family}': invalid parameters [{string.Join(", ", parameters)}]: {e.Message}");
        }
    }
}
