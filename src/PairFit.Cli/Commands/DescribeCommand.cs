using System.CommandLine;
using PairFit.Cli.Printing;
using PairFit.Core.Data;

namespace PairFit.Cli.Commands;

/// <summary>`pairfit describe &lt;csv&gt;`: columns, detected types, counts, missing values, ranges.</summary>
public static class DescribeCommand
{
    public static Command Build()
    {
        var csv = new Argument<string>("csv") { Description = "CSV file with a header row." };
        var csvOptions = new CsvReadingOptions();
        var command = new Command("describe", "Summarise every column of a CSV file: type, counts, missing values, min/median/max, skewness.") { csv };
        csvOptions.AddTo(command);
        command.SetAction(parse => PairFitCli.Guard(parse, (output, _) =>
        {
            var description = CsvDescription.Describe(parse.GetValue(csv)!, csvOptions.Read(parse));
            Write(description, output);
            return PairFitCli.ExitOk;
        }));
        return command;
    }

    public static void Write(CsvDescription d, TextWriter w)
    {
        w.WriteLine($"File: {d.Source}");
        w.WriteLine($"  {d.Rows} data row(s), {d.Columns.Count} column(s); delimiter: {CsvOptions.DelimiterName(d.Delimiter)}; decimal mark: {(d.DecimalComma ? "comma" : "point")}");
        var table = new TextTable(">#", "column", "type", ">rows", ">missing", ">numeric", ">min", ">median", ">max", ">skewness");
        foreach (var c in d.Columns)
            table.Add(c.Index.ToString(), c.Name, c.Type, c.Count.ToString(), c.Missing.ToString(), c.Numeric.ToString(),
                TextTable.Number(c.Min), TextTable.Number(c.Median), TextTable.Number(c.Max), TextTable.Number(c.Skewness, 3));
        table.Write(w);
        w.WriteLine("  missing: empty, NA, NaN, null and --missing tokens; skewness: adjusted Fisher-Pearson G1 of the numbers.");
        foreach (var c in d.Columns.Where(c => c.NonFinite > 0))
            w.WriteLine($"  Note: column '{c.Name}' has {c.NonFinite} infinite value(s); analyze refuses them (mark them with --missing or correct them).");
        // Loggers and agencies often write a missing reading as -999, -9999 or -99999 (common practice);
        // such a minimum, far below the median, is worth a hint before it enters a fit as a real value.
        foreach (var c in d.Columns.Where(c => c.Min is { } m && m is -999 or -9999 or -99999 && c.Median is { } med && med > m / 10))
            w.WriteLine($"  Note: column '{c.Name}' has the minimum {c.Min}; if that marks a missing reading, add --missing {c.Min}.");
        foreach (var c in d.Columns.Where(c => c.Type == "mixed"))
            w.WriteLine($"  Note: column '{c.Name}' mixes numbers and {c.Text} text value(s); analyze drops the text rows as non-numeric.");
    }
}
