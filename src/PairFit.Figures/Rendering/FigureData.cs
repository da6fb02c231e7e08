using System.Globalization;
using System.Text;

namespace PairFit.Figures.Rendering;

/// <summary>
/// The numbers behind a figure in long form (panel, series, x, y, value), written as CSV beside
/// the figure so a reader can redraw it in another tool. One row per plotted point.
/// </summary>
public sealed class FigureData
{
    private readonly StringBuilder _csv = new("panel,series,x,y,value\n");

    public int RowCount { get; private set; }

    public void Add(string panel, string series, double x, double y, double? value = null)
    {
        _csv.Append(Quote(panel)).Append(',').Append(Quote(series)).Append(',')
            .Append(Number(x)).Append(',').Append(Number(y)).Append(',')
            .Append(value is { } v ? Number(v) : "").Append('\n');
        RowCount++;
    }

    public void AddSeries(string panel, string series, ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        for (int i = 0; i < x.Length; i++) Add(panel, series, x[i], y[i]);
    }

    public string ToCsv() => _csv.ToString();

    private static string Number(double d) => double.IsFinite(d) ? d.ToString("R", CultureInfo.InvariantCulture) : "";

    /// <summary>RFC 4180 quoting: fields with comma, quote or line break are wrapped in quotes, inner quotes doubled.</summary>
    internal static string Quote(string s)
        => s.AsSpan().IndexOfAny(",\"\r\n") < 0 ? s : "\"" + s.Replace("\"", "\"\"") + "\"";
}
