using System.Globalization;
using BenchmarkDotNet.Attributes;
using Microsoft.Data.Analysis;
using PairFit.Core.Common;
using PairFit.Core.Data;

namespace PairFit.Benchmarks;

/// <summary>
/// Reading a 1,000,000-row two-column CSV (target: under 1 s). Compares PairFit's streaming reader
/// with Microsoft.Data.Analysis LoadCsv (all columns as string, then parsed, the recipe that keeps
/// control of missing tokens and precision).
/// Run: dotnet run -c Release --project tests/PairFit.Benchmarks -- --filter '*DataBenchmarks*' --job short
/// </summary>
[MemoryDiagnoser, MedianColumn]
public class DataBenchmarks
{
    private const int Rows = 1_000_000;
    private string _path = "";

    [GlobalSetup]
    public void WriteFile()
    {
        _path = Path.Combine(Path.GetTempPath(), $"pairfit-bench-{Environment.ProcessId}.csv");
        var rng = RandomStreams.For(1);
        using var w = new StreamWriter(_path);
        w.WriteLine("rain_mm,runoff_mm");
        for (int i = 0; i < Rows; i++)
        {
            double a = Math.Exp(2 + rng.NextDouble()), b = a * (0.2 + 0.3 * rng.NextDouble());
            // Every 1000th row carries a missing value, as real records do.
            string bs = i % 1000 == 0 ? "NA" : b.ToString("0.#####", CultureInfo.InvariantCulture);
            w.Write(a.ToString("0.###", CultureInfo.InvariantCulture));
            w.Write(',');
            w.WriteLine(bs);
        }
    }

    [GlobalCleanup]
    public void DeleteFile() => File.Delete(_path);

    [Benchmark(Baseline = true)]
    public int PairFitReader()
        => PairedCsvReader.Read(_path, new ColumnSelector("rain_mm"), new ColumnSelector("runoff_mm"), new CsvOptions()).Count;

    [Benchmark]
    public int DataFrameLoadCsvAsStrings()
    {
        var df = DataFrame.LoadCsv(_path, dataTypes: [typeof(string), typeof(string)], cultureInfo: CultureInfo.InvariantCulture);
        var a = df.Columns[0];
        var b = df.Columns[1];
        int used = 0;
        for (long i = 0; i < a.Length; i++)
            if (double.TryParse(a[i] as string, NumberStyles.Float, CultureInfo.InvariantCulture, out _)
                && double.TryParse(b[i] as string, NumberStyles.Float, CultureInfo.InvariantCulture, out _))
                used++;
        return used;
    }
}
