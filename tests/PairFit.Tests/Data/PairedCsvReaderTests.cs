using System.Text.Json;
using PairFit.Core.Common;
using PairFit.Core.Data;

namespace PairFit.Tests.Data;

public class PairedCsvReaderTests : CsvFileTests
{
    private PairedSample Read(string text, string x = "a", string y = "b", CsvOptions? options = null, bool bom = false)
        => PairedCsvReader.Read(Files.Write("data.csv", text, bom), new ColumnSelector(x), new ColumnSelector(y), options ?? new CsvOptions());

    private string ReadError(string text, string x = "a", string y = "b", CsvOptions? options = null)
        => Assert.Throws<PairFitInputException>(() => Read(text, x, y, options)).Message;

    [Fact]
    public void ReadsColumnsByNameAndByOneBasedIndex()
    {
        const string text = "id,a,b\n1,1.5,10\n2,2.5,20\n3,-3e-2,30\n";
        var byName = Read(text);
        Assert.Equal([1.5, 2.5, -0.03], byName.X);
        Assert.Equal([10.0, 20, 30], byName.Y);
        var byIndex = Read(text, "2", "#3");
        Assert.Equal(byName.X, byIndex.X);
        Assert.Equal("a", byIndex.XName);
        Assert.Equal("b", byIndex.YName);
        var caseless = Read(text, "A", "B");
        Assert.Equal(byName.Y, caseless.Y);
    }

    [Fact]
    public void KeepsFullDoublePrecision()
    {
        // Round-trip strings ("R") of doubles must come back bit for bit (float loading would lose them).
        var s = Read("a,b\n0.1234567891234567,1e300\n2.2250738585072014E-308,-1.7976931348623157E+308\n");
        Assert.Equal(0.1234567891234567, s.X[0]);
        Assert.Equal(1e300, s.Y[0]);
        Assert.Equal(2.2250738585072014E-308, s.X[1]);
        Assert.Equal(double.MinValue, s.Y[1]);
    }

    [Fact]
    public void HandlesQuotesWithDelimitersDoubledQuotesAndLineBreaks()
    {
        const string text = "\"a\",\"b, with comma\",note\n\"1\",2,\"he said \"\"hi\"\", then left\"\n3, 4 ,\"two\nlines\"\n5,6,plain\n";
        var s = Read(text, "a", "b, with comma");
        Assert.Equal([1.0, 3, 5], s.X);
        Assert.Equal([2.0, 4, 6], s.Y);
        Assert.Equal(3, s.Rows.RowsRead);
    }

    [Fact]
    public void HandlesByteOrderMarkCrLfAndBlankLines()
    {
        var s = Read("a,b\r\n1,2\r\n\r\n3,5\r\n\r\n", bom: true);
        Assert.Equal([1.0, 3], s.X);
        Assert.Equal(2, s.Rows.RowsRead);
    }

    [Fact]
    public void DetectsSemicolonAndDecimalComma()
    {
        var s = Read("a;b\n1,5;2,25\n3,75;4\n5;6,5\n");
        Assert.Equal([1.5, 3.75, 5], s.X);
        Assert.Equal([2.25, 4, 6.5], s.Y);
    }

    [Fact]
    public void SemicolonFileWithDecimalPointStaysDecimalPoint()
    {
        var s = Read("a;b\n1.5;2.25\n3.75;4\n");
        Assert.Equal([1.5, 3.75], s.X);
    }

    [Fact]
    public void DetectsTabAndHonoursGivenDelimiterAndDecimalComma()
    {
        Assert.Equal([1.0, 3], Read("a\tb\n1\t2\n3\t4\n").X);
        // Given: '|' is no candidate for detection, but can be set; decimal comma set explicitly.
        var s = Read("a|b\n1,5|2\n3|4,5\n", options: new CsvOptions { Delimiter = '|', DecimalComma = true });
        Assert.Equal([1.5, 3], s.X);
        Assert.Equal([2.0, 4.5], s.Y);
    }

    [Fact]
    public void DropsMissingAndNonNumericRowsByReasonWithExampleRows()
    {
        const string text = "a,b\n1,2\n,3\nNA,4\n5,nan\n6,NULL\n7,-9999\n8,-9999.0\nx?,9\n10,11\n,\n12,oops\n13,14\n";
        var s = Read(text, options: new CsvOptions { MissingTokens = ["-9999"] });
        Assert.Equal([1.0, 10, 13], s.X);
        var rows = s.Rows;
        Assert.Equal(12, rows.RowsRead);
        Assert.Equal(3, rows.RowsUsed);
        Assert.Equal(2, rows.DroppedByReason["missing x"]);
        Assert.Equal(4, rows.DroppedByReason["missing y"]);     // nan, NULL, -9999, -9999.0 (numeric sentinel match)
        Assert.Equal(1, rows.DroppedByReason["non-numeric x"]);
        Assert.Equal(1, rows.DroppedByReason["non-numeric y"]);
        Assert.Equal(1, rows.DroppedByReason["missing x and y"]);
        Assert.Equal([2, 3], rows.ExampleRows["missing x"]);     // 1-based data rows
        Assert.Equal([4, 5, 6, 7], rows.ExampleRows["missing y"]);
        Assert.Equal(rows.RowsRead - rows.RowsUsed, rows.DroppedByReason.Values.Sum());
        Assert.EndsWith("data.csv", rows.Source);
    }

    [Fact]
    public void KeepsOnlyTheFirstFewExampleRowsPerReason()
    {
        var text = "a,b\n" + string.Concat(Enumerable.Range(0, 20).Select(i => $"{i},\n")) + "1,2\n2,3\n";
        var s = Read(text);
        Assert.Equal(20, s.Rows.DroppedByReason["missing y"]);
        Assert.Equal([1, 2, 3, 4, 5], s.Rows.ExampleRows["missing y"]);
    }

    [Theory]
    [InlineData("inf")]
    [InlineData("-Infinity")]
    [InlineData("1e999")]
    [InlineData("\u221E")]
    public void RejectsNonFiniteValuesNamingFileLineAndColumn(string value)
    {
        string msg = ReadError($"a,b\n1,2\n3,{value}\n4,5\n");
        Assert.Contains("data.csv", msg);
        Assert.Contains("line 3", msg);
        Assert.Contains("'b'", msg);
        Assert.Contains(value, msg);
        Assert.DoesNotContain('\n', msg);
    }

    [Fact]
    public void ExplainsEveryKindOfBadFile()
    {
        Assert.Contains("does not exist", Assert.Throws<PairFitInputException>(() =>
            PairedCsvReader.Read(Files.PathOf("nope.csv"), new("a"), new("b"), new())).Message);
        Assert.Contains("is empty", ReadError(""));
        Assert.Contains("only blank lines", ReadError("\n\n  \n"));
        Assert.Contains("no data rows", ReadError("a,b\n"));
        Assert.Contains("the columns are: a, b, c", ReadError("a,b,c\n1,2,3\n", "a", "rain"));
        Assert.Contains("has 3 column(s)", ReadError("a,b,c\n1,2,3\n", "a", "4"));
        Assert.Contains("Only one column was found with the comma delimiter", ReadError("a b\n1 2\n3 4\n"));
        Assert.Contains("holds no numbers", ReadError("a,b\n1,x\n2,y\n3,z\n"));
        Assert.Contains("missing in all 2 data rows", ReadError("a,b\n1,\n2,NA\n"));
        Assert.Contains("only one usable row", ReadError("a,b\n1,2\n3,\n"));
        Assert.Contains("no usable row", ReadError("a,b\n1,\n,2\n"));
        Assert.Contains("is constant", ReadError("a,b\n1,5\n2,5\n3,5\n"));
        Assert.Contains("line 3 has 1 field(s) but the header has 2", ReadError("a,b\n1,2\n3;4\n5,6\n"));
        Assert.Contains("mixes delimiters", ReadError("a,b;c\n1,2;3\n"));
        Assert.Contains("never closed", ReadError("a,b\n1,\"2\n3,4\n"));
        Assert.Contains("both select column 'a'", ReadError("a,b\n1,2\n3,4\n", "a", "1"));
        Assert.Contains("has that name twice", ReadError("a,a\n1,2\n3,4\n", "a", "2"));
    }

    [Fact]
    public void MatchesTheIndependentPythonReadingOfTheSampleFile()
    {
        // Reference: Reference/Data/make_reference.py (plain-Python re-implementation of the rules; SciPy 1.10.1, NumPy 1.24.2).
        string folder = Path.Combine(AppContext.BaseDirectory, "Reference", "Data");
        using var doc = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, "reference.json")));
        var pair = doc.RootElement.GetProperty("pair");
        var s = PairedCsvReader.Read(Path.Combine(folder, "intake_sample.csv"), new("rain_mm"), new("runoff_mm"),
            new CsvOptions { MissingTokens = ["-9999"] });
        Assert.Equal(doc.RootElement.GetProperty("rows").GetInt32(), s.Rows.RowsRead);
        Assert.Equal(pair.GetProperty("rowsUsed").GetInt32(), s.Rows.RowsUsed);
        var dropped = pair.GetProperty("dropped").EnumerateObject().ToDictionary(p => p.Name, p => p.Value.GetInt32());
        Assert.Equal(dropped.OrderBy(k => k.Key), s.Rows.DroppedByReason.OrderBy(k => k.Key));
        // Sums of a few hundred 3-5 digit numbers: both sides add the same doubles; 1e-9 relative covers summation order.
        Assert.Equal(pair.GetProperty("sumX").GetDouble(), s.X.Sum(), 1e-9 * 4000);
        Assert.Equal(pair.GetProperty("sumY").GetDouble(), s.Y.Sum(), 1e-9 * 1000);
    }
}
