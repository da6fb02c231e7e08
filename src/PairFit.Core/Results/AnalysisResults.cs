namespace PairFit.Core.Results;

/// <summary>
/// The results file: everything an analysis found, in a stable, versioned, camelCase JSON form
/// (documented in the README). Sections that a run did not compute are null and left out.
/// </summary>
public sealed record AnalysisResults
{
    public const string FormatName = "pairfit-results";
    public const int CurrentVersion = 1;

    public string Format { get; init; } = FormatName;
    public int Version { get; init; } = CurrentVersion;

    /// <summary>"pairfit X.Y.Z" of the program that wrote the file.</summary>
    public string? Tool { get; init; }

    /// <summary>UTC time the analysis finished, ISO 8601.</summary>
    public string? CreatedUtc { get; init; }

    public required InputSection Input { get; init; }
    public required DependenceSection Dependence { get; init; }
    public MarginalsSection? Marginals { get; init; }
    public CopulaSection? Copula { get; init; }

    /// <summary>The selected joint model (marginals + copula) that later commands reuse.</summary>
    public ModelSection? Model { get; init; }

    public IReadOnlyList<ProjectionSection>? Projections { get; init; }
    public JointSection? Joint { get; init; }

    /// <summary>Options and seed of the run, for reproducibility.</summary>
    public IReadOnlyDictionary<string, string>? Settings { get; init; }
}

/// <summary>Where the data came from and what happened to each row.</summary>
public sealed record InputSection
{
    public string? File { get; init; }
    public required string XColumn { get; init; }
    public required string YColumn { get; init; }
    public int RowsRead { get; init; }
    public int RowsUsed { get; init; }

    /// <summary>Dropped row counts by reason, e.g. {"missing x": 3, "non-numeric y": 1}.</summary>
    public IReadOnlyDictionary<string, int> Dropped { get; init; } = new Dictionary<string, int>();
}
