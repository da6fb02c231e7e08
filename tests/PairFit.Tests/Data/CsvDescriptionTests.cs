using System.Text.Json;
using PairFit.Core.Data;

namespace PairFit.Tests.Data;

public class CsvDescriptionTests : CsvFileTests
{
    [Fact]
    public void MatchesScipyOnTheSampleFile()
    {
        // Reference: SciPy 1.10.1 via Reference/Data/make_reference.py (numpy.median, scipy.stats.skew(bias=False)).
        string folder = Path.Combine(AppContext.BaseDirectory, "Reference", "Data");
        using var doc = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, "reference.json")));
        var d = CsvDescription.Describe(Path.Combine(folder, "intake_sample.csv"), new CsvOptions { MissingTokens = ["-9999"] });
        Assert.Equal(doc.RootElement.GetProperty("rows").GetInt32(), d.Rows);
        foreach (var col in doc.RootElement.GetProperty("columns").EnumerateObject())
        {
            var c = d.Columns.Single(k => k.Name == col.Name);
            Assert.Equal(col.Value.GetProperty("missing").GetInt32(), c.Missing);
            Assert.Equal(col.Value.GetProperty("numeric").GetInt32(), c.Numeric);
            if (c.Numeric == 0) continue;
            Assert.Equal(col.Value.GetProperty("min").GetDouble(), c.Min);
            Assert.Equal(col.Value.GetProperty("max").GetDouble(), c.Max);
            Assert.Equal(col.Value.GetProperty("median").GetDouble(), c.Median!.Value, 1e-12);
            // Two-pass central moments on a few hundred values of size ~10: agreement to ~1e-13.
            Assert.Equal(col.Value.GetProperty("skewness").GetDouble(), c.Skewness!.Value, 1e-12);
        }
        Assert.Equal("integer", d.Columns[0].Type);
        Assert.Equal("mixed", d.Columns.Single(c => c.Name == "rain_mm").Type);
        Assert.Equal("text", d.Columns.Single(c => c.Name == "label").Type);
        Assert.Equal("date", d.Columns.Single(c => c.Name == "date").Type);
    }

    [Fact]
    public void SkewnessOfASmallSampleMatchesTheFormulaByHand()
    {
        // x = 1, 2, 3, 10: mean 4, m2 = (9+4+1+36)/4 = 12.5, m3 = (-27-8-1+216)/4 = 45,
        // g1 = 45/12.5^1.5, G1 = g1·sqrt(4·3)/2 (Joanes and Gill 1998, eq. 2; computed by hand).
        double g1 = 45 / Math.Pow(12.5, 1.5);
        Assert.Equal(g1 * Math.Sqrt(12) / 2, CsvDescription.Skewness([1, 2, 3, 10])!.Value, 14);
        Assert.Null(CsvDescription.Skewness([1, 2]));
        Assert.Null(CsvDescription.Skewness([4, 4, 4]));
    }

    [Fact]
    public void CountsEmptyAndNonFiniteColumns()
    {
        var d = CsvDescription.Describe(Files.Write("d.csv", "a,b,c\n1,,inf\n2,NA,3\n"), new CsvOptions());
        Assert.Equal("empty", d.Columns[1].Type);
        Assert.Equal(2, d.Columns[1].Missing);
        Assert.Equal(1, d.Columns[2].NonFinite);
        Assert.Equal("number", d.Columns[2].Type);
        Assert.Equal(1.5, d.Columns[0].Median);
    }
}
