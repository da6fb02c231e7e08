using System.Globalization;
using PairFit.Core.Common;

namespace PairFit.Core.Data;

/// <summary>What one column of a CSV file holds.</summary>
/// <param name="Index">1-based column number.</param>
/// <param name="Name">Header name ("column N" when the header cell is empty).</param>
/// <param name="Type">Detected type: "number", "integer", "date", "text", "mixed" (numbers and text) or "empty".</param>
/// <param name="Count">Data rows (cells in this column).</param>
/// <param name="Missing">Cells that are empty, NA, NaN, null or a user missing token.</param>
/// <param name="Numeric">Cells that are finite numbers.</param>
/// <param name="NonFinite">Cells that are infinite or overflow (inf, 1e999); analyze refuses these.</param>
/// <param name="Skewness">Adjusted Fisher–Pearson skewness G1 of the numbers (Joanes and Gill 1998); null below 3 numbers or when constant.</param>
public sealed record ColumnDescription(int Index, string Name, string Type, int Count, int Missing, int Numeric, int NonFinite,
    double? Min, double? Median, double? Max, double? Skewness)
{
    /// <summary>Cells that are neither missing nor numbers.</summary>
    public int Text => Count - Missing - Numeric - NonFinite;
}

/// <summary>The columns of a CSV file, as `pairfit describe` shows them.</summary>
public sealed record CsvDescription(string Source, char Delimiter, bool DecimalComma, int Rows, IReadOnlyList<ColumnDescription> Columns)
{
    /// <summary>Reads every column of <paramref name="path"/> with the same rules as <see cref="PairedCsvReader"/>.</summary>
    public static CsvDescription Describe(string path, CsvOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        var layout = CsvLayout.Detect(path, options);
        var parser = new CellParser(layout.DecimalComma, options.MissingTokens);
        int columns = layout.Header.Length;
        var tallies = new ColumnValues[columns];
        for (int c = 0; c < columns; c++) tallies[c] = new ColumnValues();
        int rows = 0;
        using (var reader = DelimitedRecordReader.Open(path, layout.Delimiter))
        {
            reader.ReadRecord(); // header
            while (reader.ReadRecord())
            {
                rows++;
                layout.RequireFullRow(reader, path);
                for (int c = 0; c < columns; c++) tallies[c].Add(parser, reader.Field(c));
            }
        }
        if (rows == 0)
            throw new PairFitInputException($"file '{path}' has a header ({columns} column(s)) but no data rows.");
        var described = new ColumnDescription[columns];
        for (int c = 0; c < columns; c++) described[c] = tallies[c].Describe(c + 1, layout.ColumnLabel(c), rows);
        return new CsvDescription(path, layout.Delimiter, layout.DecimalComma, rows, described);
    }

    /// <summary>Adjusted Fisher–Pearson G1 = √(n(n − 1))/(n − 2) · m3/m2^{3/2} (Joanes and Gill 1998, eq. 2); null when undefined.</summary>
    public static double? Skewness(ReadOnlySpan<double> values)
    {
        int n = values.Length;
        if (n < 3) return null;
        double mean = 0;
        foreach (double v in values) mean += v;
        mean /= n;
        double m2 = 0, m3 = 0;
        foreach (double v in values) { double d = v - mean; m2 += d * d; m3 += d * d * d; }
        m2 /= n;
        m3 /= n;
        if (m2 <= 0) return null;
        return Math.Sqrt((double)n * (n - 1)) / (n - 2) * m3 / Math.Pow(m2, 1.5);
    }

    /// <summary>Counts and numbers of one column while the file streams past.</summary>
    private sealed class ColumnValues
    {
        private double[] _numbers = new double[256];
        private int _numeric, _missing, _nonFinite, _text, _dates;
        private bool _allIntegers = true;

        public void Add(CellParser parser, ReadOnlySpan<char> cell)
        {
            switch (parser.Classify(cell, out double v))
            {
                case CellKind.Number:
                    if (_numeric == _numbers.Length) Array.Resize(ref _numbers, _numeric * 2);
                    _numbers[_numeric++] = v;
                    if (_allIntegers && (v != Math.Floor(v) || cell.Contains('.') || cell.Contains(','))) _allIntegers = false;
                    break;
                case CellKind.Missing: _missing++; break;
                case CellKind.NonFinite: _nonFinite++; break;
                default:
                    _text++;
                    if (DateTime.TryParse(cell, CultureInfo.InvariantCulture, DateTimeStyles.AllowWhiteSpaces, out _)) _dates++;
                    break;
            }
        }

        public ColumnDescription Describe(int index, string name, int rows)
        {
            var numbers = _numbers.AsSpan(0, _numeric);
            string type = (_numeric + _nonFinite, _text) switch
            {
                (0, 0) => "empty",
                (0, _) => _dates == _text ? "date" : "text",
                (_, 0) => _allIntegers && _nonFinite == 0 ? "integer" : "number",
                _ => "mixed",
            };
            double? min = null, median = null, max = null;
            if (_numeric > 0)
            {
                var sorted = numbers.ToArray();
                Array.Sort(sorted);
                min = sorted[0];
                max = sorted[^1];
                int h = sorted.Length / 2;
                median = sorted.Length % 2 == 1 ? sorted[h] : 0.5 * (sorted[h - 1] + sorted[h]);
            }
            return new ColumnDescription(index, name, type, rows, _missing, _numeric, _nonFinite, min, median, max, Skewness(numbers));
        }
    }
}
