namespace PairFit.Core.Data;

/// <summary>
/// Two equally long arrays of finite paired values, their names, and the account of every row
/// of the source that was read, used or dropped. The first stage of the pipeline; every later
/// stage takes it (or what was computed from it) as input.
/// </summary>
public sealed class PairedSample
{
    public PairedSample(double[] x, double[] y, string xName, string yName, RowAccounting? rows = null)
    {
        ArgumentNullException.ThrowIfNull(x);
        ArgumentNullException.ThrowIfNull(y);
        if (x.Length != y.Length)
            throw new ArgumentException($"x has {x.Length} values and y has {y.Length}; a paired sample needs equal lengths.");
        X = x;
        Y = y;
        XName = xName;
        YName = yName;
        Rows = rows ?? RowAccounting.AllUsed(x.Length);
    }

    public double[] X { get; }
    public double[] Y { get; }
    public string XName { get; }
    public string YName { get; }
    public int Count => X.Length;
    public RowAccounting Rows { get; }
}

/// <summary>How many data rows were read, how many were used, and why the others were dropped.</summary>
public sealed class RowAccounting
{
    public RowAccounting(string? source, int rowsRead, int rowsUsed, IReadOnlyDictionary<string, int> droppedByReason,
        IReadOnlyDictionary<string, IReadOnlyList<int>>? exampleRows = null)
    {
        Source = source;
        RowsRead = rowsRead;
        RowsUsed = rowsUsed;
        DroppedByReason = droppedByReason;
        ExampleRows = exampleRows ?? new Dictionary<string, IReadOnlyList<int>>();
    }

    public static RowAccounting AllUsed(int n) => new(null, n, n, new Dictionary<string, int>());

    /// <summary>The file the rows came from, or null for data built in memory.</summary>
    public string? Source { get; }
    public int RowsRead { get; }
    public int RowsUsed { get; }
    public IReadOnlyDictionary<string, int> DroppedByReason { get; }
    /// <summary>For each reason, the first few 1-based data row numbers that were dropped for it.</summary>
    public IReadOnlyDictionary<string, IReadOnlyList<int>> ExampleRows { get; }
    public int RowsDropped => RowsRead - RowsUsed;
}
