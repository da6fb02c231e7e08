using PairFit.Core.Copulas;
using PairFit.Core.Marginals;
using PairFit.Core.Results;

namespace PairFit.Core.Copulas.Fitting;

/// <summary>How to fit, rank and test the copula candidates.</summary>
public sealed record CopulaOptions
{
    public const string PseudoMethod = "pseudo";
    public const string IfmMethod = "ifm";
    public const string FullMethod = "full";
    public static readonly IReadOnlyList<string> Methods = [PseudoMethod, IfmMethod, FullMethod];

    /// <summary>
    /// "pseudo": maximum pseudo-likelihood on rank-based pseudo-observations (Genest, Ghoudi and Rivest 1995);
    /// "ifm": u = F_X(x), v = F_Y(y) from the fitted marginals (inference functions for margins, Joe and Xu 1996);
    /// "full": marginal and copula parameters maximised together, started from the IFM fit.
    /// </summary>
    public string Method { get; init; } = PseudoMethod;

    /// <summary>Family names to try; null means every family in <see cref="CopulaRegistry.Families"/>.</summary>
    public IReadOnlyList<string>? Families { get; init; }

    /// <summary>Parametric-bootstrap replicates of the goodness-of-fit test; 0 skips the test.</summary>
    public int GofReplicates { get; init; } = 500;

    /// <summary>Test every candidate rather than only the selected one.</summary>
    public bool GofAllFamilies { get; init; }

    public int Seed { get; init; }

    /// <summary>Upper bound on worker threads (null = all cores). Results do not depend on it.</summary>
    public int? MaxDegreeOfParallelism { get; init; }
}

/// <summary>The outcome of <see cref="CopulaAnalysis.Fit"/>.</summary>
public sealed record CopulaFitResult
{
    /// <summary>The copula with the lowest AIC among the converged fits.</summary>
    public required ICopula Selected { get; init; }

    public required CopulaSection Section { get; init; }

    /// <summary>The fitted copulas in the order of <see cref="CopulaSection.Candidates"/>.</summary>
    public required IReadOnlyList<ICopula> Ranked { get; init; }

    /// <summary>The marginals that go with <see cref="Selected"/>: refitted jointly for "full", otherwise those passed in (may be null for "pseudo").</summary>
    public IMarginalDistribution? X { get; init; }

    public IMarginalDistribution? Y { get; init; }
}
