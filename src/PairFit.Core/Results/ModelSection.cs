using PairFit.Core.Copulas;
using PairFit.Core.Marginals;
using PairFit.Core.Model;

namespace PairFit.Core.Results;

/// <summary>The saved joint model: two marginals and a copula, each by trade name and named parameters.</summary>
public sealed record ModelSection
{
    public required string XColumn { get; init; }
    public required string YColumn { get; init; }
    public required MarginalSpec X { get; init; }
    public required MarginalSpec Y { get; init; }
    public required CopulaSpec Copula { get; init; }

    public static ModelSection From(JointModel model, string xColumn, string yColumn) => new()
    {
        XColumn = xColumn,
        YColumn = yColumn,
        X = MarginalSpec.From(model.X),
        Y = MarginalSpec.From(model.Y),
        Copula = CopulaSpec.From(model.Copula),
    };

    public JointModel ToJointModel() => new(X.Build(), Y.Build(), Copula.Build());
}

public sealed record MarginalSpec
{
    public required string Family { get; init; }
    public required IReadOnlyDictionary<string, double> Parameters { get; init; }

    /// <summary>Sorted data of an "empirical" marginal, which has no parameters; null for parametric families.</summary>
    public IReadOnlyList<double>? Values { get; init; }

    public static MarginalSpec From(IMarginalDistribution d) => new()
    {
        Family = d.Family,
        Parameters = Named(d.ParameterNames, d.Parameters),
        Values = d is EmpiricalDistribution e ? e.Values : null,
    };

    public IMarginalDistribution Build() => MarginalRegistry.Create(Family, Values ?? Parameters.Values.ToArray());

    internal static Dictionary<string, double> Named(IReadOnlyList<string> names, IReadOnlyList<double> values)
    {
        var d = new Dictionary<string, double>(names.Count);
        for (int i = 0; i < names.Count; i++) d[names[i]] = values[i];
        return d;
    }
}

public sealed record CopulaSpec
{
    public required string Family { get; init; }
    public int Rotation { get; init; }
    public required IReadOnlyDictionary<string, double> Parameters { get; init; }

    public static CopulaSpec From(ICopula c) => new()
    {
        Family = c.Family,
        Rotation = c.Rotation,
        Parameters = MarginalSpec.Named(c.ParameterNames, c.Parameters),
    };

    public ICopula Build() => CopulaRegistry.Create(Family, Rotation, Parameters.Values.ToArray());
}
