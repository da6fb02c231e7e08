using PairFit.Core.Common;

namespace PairFit.Core.Data;

/// <summary>
/// The shape of a CSV file as PairFit reads it: delimiter, decimal mark and header names,
/// either given in <see cref="CsvOptions"/> or detected from the start of the file.
/// </summary>
internal sealed record CsvLayout(char Delimiter, bool DecimalComma, string[] Header)
{
    /// <summary>Records looked at to decide between decimal point and decimal comma.</summary>
    private const int DecimalDetectionRecords = 1000;

    private static readonly char[] CandidateDelimiters = [',', ';', '\t'];

    public static CsvLayout Detect(string path, CsvOptions options)
    {
        char delimiter = options.Delimiter ?? DetectDelimiter(path);
        string[] header = ReadHeader(path, delimiter);
        bool decimalComma = options.DecimalComma ?? (delimiter != ',' && DetectDecimalComma(path, delimiter));
        return new CsvLayout(delimiter, decimalComma, header);
    }

    /// <summary>
    /// The candidate (comma, semicolon, tab) that occurs most often outside quotes on the header
    /// line. A header with two candidates equally often is ambiguous and must be settled by
    /// --delimiter; a header with none is a one-column file (comma is assumed).
    /// </summary>
    private static char DetectDelimiter(string path)
    {
        string header = FirstNonBlankLine(path);
        Span<int> counts = stackalloc int[CandidateDelimiters.Length];
        bool inQuotes = false;
        foreach (char c in header)
        {
            if (c == '"') inQuotes = !inQuotes;
            else if (!inQuotes)
                for (int k = 0; k < CandidateDelimiters.Length; k++)
                    if (c == CandidateDelimiters[k]) counts[k]++;
        }
        int best = 0;
        for (int k = 1; k < counts.Length; k++) if (counts[k] > counts[best]) best = k;
        if (counts[best] == 0) return ',';
        for (int k = 0; k < counts.Length; k++)
            if (k != best && counts[k] == counts[best])
                throw new PairFitInputException(
                    $"{path}: the header line mixes delimiters ({CsvOptions.DelimiterName(CandidateDelimiters[best])} and {CsvOptions.DelimiterName(CandidateDelimiters[k])} "
                    + $"{counts[best]} times each); say which one separates the columns with --delimiter.");
        return CandidateDelimiters[best];
    }

    private static string FirstNonBlankLine(string path)
    {
        using var reader = DelimitedRecordReader.OpenText(path);
        string? line;
        while ((line = reader.ReadLine()) is not null)
            if (!string.IsNullOrWhiteSpace(line)) return line;
        throw new PairFitInputException($"file '{path}' holds only blank lines; it needs a header row and at least two data rows.");
    }

    private static string[] ReadHeader(string path, char delimiter)
    {
        using var reader = DelimitedRecordReader.Open(path, delimiter);
        if (!reader.ReadRecord())
            throw new PairFitInputException($"file '{path}' holds only blank lines; it needs a header row and at least two data rows.");
        var names = new string[reader.FieldCount];
        for (int i = 0; i < names.Length; i++) names[i] = reader.Field(i).ToString();
        return names;
    }

    /// <summary>
    /// Decimal comma when, among the first records, more cells read as "1,5"-style numbers than
    /// as "1.5"-style numbers. Files of integers only read the same either way.
    /// </summary>
    private static bool DetectDecimalComma(string path, char delimiter)
    {
        using var reader = DelimitedRecordReader.Open(path, delimiter);
        reader.ReadRecord(); // header
        int comma = 0, point = 0;
        for (int r = 0; r < DecimalDetectionRecords && reader.ReadRecord(); r++)
            for (int i = 0; i < reader.FieldCount; i++)
            {
                var cell = reader.Field(i);
                if (CellParser.IsDecimalCommaNumber(cell)) comma++;
                else if (CellParser.IsDecimalPointNumber(cell)) point++;
            }
        return comma > point;
    }

    /// <summary>
    /// Resolves a column selector against the header: an exact header name first, then a
    /// 1-based index ("3" or "#3"), then a unique name that differs only in letter case.
    /// </summary>
    public int ResolveColumn(ColumnSelector selector, string optionName, string path)
    {
        string text = selector.Text.Trim();
        int found = -1;
        for (int i = 0; i < Header.Length; i++)
        {
            if (Header[i] != text) continue;
            if (found >= 0)
                throw new PairFitInputException(
                    $"{optionName} '{text}': the header of '{path}' has that name twice (columns {found + 1} and {i + 1}); select the column by its number instead.");
            found = i;
        }
        if (found >= 0) return found;

        string digits = text.StartsWith('#') ? text[1..] : text;
        if (digits.Length > 0 && digits.All(char.IsAsciiDigit))
        {
            if (int.TryParse(digits, out int index) && index >= 1 && index <= Header.Length) return index - 1;
            throw new PairFitInputException(
                $"{optionName} {text}: '{path}' has {Header.Length} column(s), numbered 1 to {Header.Length}.");
        }

        for (int i = 0; i < Header.Length; i++)
        {
            if (!string.Equals(Header[i], text, StringComparison.OrdinalIgnoreCase)) continue;
            if (found >= 0) { found = -2; break; }
            found = i;
        }
        if (found >= 0) return found;

        const int listed = 20;
        string available = string.Join(", ", Enumerable.Range(0, Math.Min(listed, Header.Length)).Select(ColumnLabel))
            + (Header.Length > listed ? $", ... ({Header.Length - listed} more)" : "");
        string hint = Header.Length == 1
            ? $" Only one column was found with the {CsvOptions.DelimiterName(Delimiter)} delimiter: if the columns are separated by something else, set --delimiter."
            : "";
        throw new PairFitInputException($"{optionName} '{text}' is not a column of '{path}'; the columns are: {available}.{hint}");
    }

    /// <summary>
    /// Every data row must have as many fields as the header; a ragged row usually means mixed
    /// delimiters or an unquoted delimiter inside a value, so the error names the line and the delimiter.
    /// </summary>
    public void RequireFullRow(DelimitedRecordReader reader, string path)
    {
        if (reader.FieldCount == Header.Length) return;
        throw new PairFitInputException(
            $"{path}: line {reader.LineNumber} has {reader.FieldCount} field(s) but the header has {Header.Length} "
            + $"(delimiter: {CsvOptions.DelimiterName(Delimiter)}); mixed delimiters or an unquoted delimiter inside a value? "
            + "Fix that line, quote the value, or set --delimiter.");
    }

    /// <summary>The header name of column <paramref name="index"/>, or "column N" when the header cell is empty.</summary>
    public string ColumnLabel(int index) => Header[index].Length > 0 ? Header[index] : $"column {index + 1}";
}
