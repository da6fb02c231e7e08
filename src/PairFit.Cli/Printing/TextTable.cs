using System.Globalization;

namespace PairFit.Cli.Printing;

/// <summary>A plain text table with aligned columns: text left-aligned, numbers right-aligned.</summary>
public sealed class TextTable
{
    private readonly string[] _headings;
    private readonly bool[] _rightAligned;
    private readonly List<string[]> _rows = new();

    /// <param name="headings">Column headings; a heading starting with '>' marks a right-aligned column (the '>' is not printed).</param>
    public TextTable(params string[] headings)
    {
        _rightAligned = headings.Select(h => h.StartsWith('>')).ToArray();
        _headings = headings.Select(h => h.TrimStart('>')).ToArray();
    }

    public void Add(params string[] cells)
    {
        if (cells.Length != _headings.Length) throw new ArgumentException($"row has {cells.Length} cells, table has {_headings.Length} columns.");
        _rows.Add(cells);
    }

    public void Write(TextWriter w, string indent = "  ")
    {
        var widths = new int[_headings.Length];
        for (int c = 0; c < widths.Length; c++)
            widths[c] = Math.Max(_headings[c].Length, _rows.Count == 0 ? 0 : _rows.Max(r => r[c].Length));
        WriteRow(w, indent, _headings, widths);
        foreach (var r in _rows) WriteRow(w, indent, r, widths);
    }

    private void WriteRow(TextWriter w, string indent, string[] cells, int[] widths)
    {
        var parts = new string[cells.Length];
        for (int c = 0; c < cells.Length; c++)
            parts[c] = _rightAligned[c] ? cells[c].PadLeft(widths[c]) : cells[c].PadRight(widths[c]);
        w.WriteLine((indent + string.Join("  ", parts)).TrimEnd());
    }

    /// <summary>A number with up to <paramref name="digits"/> significant digits, invariant culture; "-" for null.</summary>
    public static string Number(double? v, int digits = 6)
    {
        if (v is not { } x) return "-";
        if (x == 0) return "0";
        double a = Math.Abs(x);
        return a >= 1e-4 && a < 1e9
            ? Math.Round(x, Math.Max(0, digits - 1 - (int)Math.Floor(Math.Log10(a)))).ToString("0.##########", CultureInfo.InvariantCulture)
            : x.ToString("0.#####e+00", CultureInfo.InvariantCulture);
    }

    /// <summary>A p-value: four decimals down to 1e-4, then scientific; "< 1e-300" when it underflowed to 0.</summary>
    public static string PValue(double? p)
    {
        if (p is not { } x) return "-";
        if (x == 0) return "< 1e-300";
        return x >= 1e-4 ? x.ToString("0.0000", CultureInfo.InvariantCulture) : x.ToString("0.0e+00", CultureInfo.InvariantCulture);
    }
}
