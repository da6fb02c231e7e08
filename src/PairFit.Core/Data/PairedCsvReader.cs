namespace PairFit.Core.Data;

/// <summary>Reads two columns of a CSV file into a <see cref="PairedSample"/>, counting every dropped row by reason.</summary>
public static class PairedCsvReader
{
    public static PairedSample Read(string path, ColumnSelector x, ColumnSelector y, CsvOptions options)
        => throw new NotImplementedException("CSV intake is being written (issue 2).");
}
