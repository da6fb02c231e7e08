using System.Globalization;
using PairFit.Core.Common;

namespace PairFit.Core.Data;

/// <summary>
/// Reads two columns of a CSV file into a <see cref="PairedSample"/>, counting every dropped row by reason.
/// </summary>
/// <remarks>
/// Rules (each broken rule is a one-line <see cref="PairFitInputException"/>):
/// <list type="bullet">
/// <item>The first non-blank line is the header. Delimiter and decimal mark come from
/// <see cref="CsvOptions"/> or are detected (<see cref="CsvLayout"/>).</item>
/// <item>Every data row must have as many fields as the header (<see cref="CsvLayout.RequireFullRow"/>).</item>
/// <item>A row whose x or y is missing (empty, NA, NaN, null, a user token) or not a number is
/// dropped and counted under a reason such as "missing x" or "non-numeric y"; the first
/// <see cref="ExampleRowsPerReason"/> data row numbers of each reason are kept.</item>
/// <item>Infinite values (inf, Infinity, 1e999) are rejected, naming file, line and column.</item>
/// <item>At least two usable rows are needed, and each column must vary over them: a constant
/// column leaves every correlation and every fit undefined, so it is refused here with a clear
/// message rather than carried on as NaN. (In-memory samples given straight to
/// <see cref="Dependence.DependenceAnalysis"/> get null estimates with a note instead.)</item>
/// </list>
/// </remarks>
public static class PairedCsvReader
{
    /// <summary>How many dropped row numbers are kept per reason for the report.</summary>
    public const int ExampleRowsPerReason = 5;

    public static PairedSample Read(string path, ColumnSelector x, ColumnSelector y, CsvOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        var layout = CsvLayout.Detect(path, options);
        int xi = layout.ResolveColumn(x, "--x", path);
        int yi = layout.ResolveColumn(y, "--y", path);
        string xName = layout.ColumnLabel(xi), yName = layout.ColumnLabel(yi);
        if (xi == yi)
            throw new PairFitInputException($"--x and --y both select column '{xName}' of '{path}'; choose two different columns.");

        var parser = new CellParser(layout.DecimalComma, options.MissingTokens);
        var xs = new double[4096];
        var ys = new double[4096];
        int used = 0, rowsRead = 0;
        var drops = new DropCounter();
        var xStats = new ColumnTally();
        var yStats = new ColumnTally();

        using (var reader = DelimitedRecordReader.Open(path, layout.Delimiter))
        {
            reader.ReadRecord(); // header, already parsed by the layout
            while (reader.ReadRecord())
            {
                rowsRead++;
                layout.RequireFullRow(reader, path);

                var kx = Classify(parser, reader, xi, xName, path, out double vx, ref xStats);
                var ky = Classify(parser, reader, yi, yName, path, out double vy, ref yStats);
                if (kx == CellKind.Number && ky == CellKind.Number)
                {
                    if (used == xs.Length)
                    {
                        Array.Resize(ref xs, used * 2);
                        Array.Resize(ref ys, used * 2);
                    }
                    xs[used] = vx;
                    ys[used] = vy;
                    used++;
                }
                else
                {
                    drops.Add(DropReason(kx, ky), rowsRead);
                }
            }
        }

        if (rowsRead == 0)
            throw new PairFitInputException($"file '{path}' has a header but no data rows; it needs at least two rows of paired values.");
        xStats.RequireNumbers(xName, "--x", path, rowsRead);
        yStats.RequireNumbers(yName, "--y", path, rowsRead);
        if (used < 2)
            throw new PairFitInputException(
                $"'{path}' has {(used == 0 ? "no usable row" : "only one usable row")} of {rowsRead} for '{xName}' and '{yName}' "
                + $"({drops.Summary()}); at least two rows with numbers in both columns are needed.");

        Array.Resize(ref xs, used);
        Array.Resize(ref ys, used);
        RequireVarying(xs, xName, "--x", path);
        RequireVarying(ys, yName, "--y", path);

        var accounting = new RowAccounting(path, rowsRead, used, drops.Counts, drops.Examples);
        return new PairedSample(xs, ys, xName, yName, accounting);
    }

    private static CellKind Classify(CellParser parser, DelimitedRecordReader reader, int column, string name, string path,
        out double value, ref ColumnTally tally)
    {
        var cell = reader.Field(column);
        var kind = parser.Classify(cell, out value);
        if (kind == CellKind.NonFinite)
            throw new PairFitInputException(
                $"{path}: line {reader.LineNumber}, column '{name}' holds '{cell}', which is infinite or too large for a double; "
                + "correct it or list it as a missing token with --missing.");
        tally.Count(kind, cell);
        return kind;
    }

    /// <summary>"missing x", "non-numeric y", "missing x and y", "missing x, non-numeric y", ...</summary>
    private static string DropReason(CellKind kx, CellKind ky)
    {
        static string Word(CellKind k) => k == CellKind.Missing ? "missing" : "non-numeric";
        if (kx == CellKind.Number) return Word(ky) + " y";
        if (ky == CellKind.Number) return Word(kx) + " x";
        return kx == ky ? Word(kx) + " x and y" : $"{Word(kx)} x, {Word(ky)} y";
    }

    private static void RequireVarying(double[] values, string name, string option, string path)
    {
        double first = values[0];
        foreach (double v in values)
            if (v != first) return;
        throw new PairFitInputException(
            $"{option} column '{name}' of '{path}' is constant ({first.ToString("R", CultureInfo.InvariantCulture)} in all {values.Length} usable rows); "
            + "correlations and fits are undefined for a constant column; choose a column that varies.");
    }

    /// <summary>Counts of dropped rows by reason, with the first few data row numbers of each.</summary>
    private sealed class DropCounter
    {
        public Dictionary<string, int> Counts { get; } = new();
        private readonly Dictionary<string, List<int>> _examples = new();

        public IReadOnlyDictionary<string, IReadOnlyList<int>> Examples
            => _examples.ToDictionary(kv => kv.Key, kv => (IReadOnlyList<int>)kv.Value);

        public void Add(string reason, int dataRow)
        {
            Counts[reason] = Counts.GetValueOrDefault(reason) + 1;
            if (!_examples.TryGetValue(reason, out var list)) _examples[reason] = list = new List<int>();
            if (list.Count < ExampleRowsPerReason) list.Add(dataRow);
        }

        public string Summary() => Counts.Count == 0
            ? "no row was dropped"
            : string.Join(", ", Counts.Select(kv => $"{kv.Value} {kv.Key}"));
    }

    /// <summary>What one selected column held, to tell "a text column" from "some bad cells".</summary>
    private struct ColumnTally
    {
        private int _numbers, _texts;
        private string? _firstText;

        public void Count(CellKind kind, ReadOnlySpan<char> cell)
        {
            if (kind == CellKind.Number) _numbers++;
            else if (kind == CellKind.Text) { _texts++; _firstText ??= cell.ToString(); }
        }

        public readonly void RequireNumbers(string name, string option, string path, int rows)
        {
            if (_numbers > 0) return;
            if (_texts > 0)
                throw new PairFitInputException(
                    $"{option} column '{name}' of '{path}' holds no numbers ({_texts} text value(s) such as '{_firstText}'); choose a numeric column"
                    + " (or set --decimal-comma / --delimiter if the numbers are written differently).");
            throw new PairFitInputException(
                $"{option} column '{name}' of '{path}' is missing in all {rows} data rows; choose a column with values.");
        }
    }
}
