using System.CommandLine;
using System.Globalization;
using System.Text;
using PairFit.Core.Common;
using PairFit.Core.Results;

namespace PairFit.Cli.Commands;

/// <summary>
/// `pairfit simulate &lt;results.json&gt; --n N --out pairs.csv [--seed s] [--force]`: draws synthetic pairs
/// from the joint model saved in a results file (copula by conditional inversion, then the marginal quantiles).
/// </summary>
public static class SimulateCommand
{
    public const int MaxPairs = 50_000_000;

    public static Command Build()
    {
        var results = new Argument<string>("results") { Description = "Results file (JSON) written by 'pairfit analyze --json'." };
        var count = new Option<int>("--n") { Description = "Number of pairs to draw.", Required = true };
        count.Validators.Add(r =>
        {
            if (r.Tokens.Count != 1 || !int.TryParse(r.Tokens[0].Value, NumberStyles.Integer, CultureInfo.InvariantCulture, out int v)) return;
            if (v < 1 || v > MaxPairs) r.AddError($"--n must be between 1 and {MaxPairs} (got {v}).");
        });
        var output = new Option<string>("--out") { Description = "CSV file to write the pairs to.", Required = true };
        var seed = new Option<int>("--seed") { Description = "Seed of the random draws (same seed, same pairs).", DefaultValueFactory = _ => 20261202 };
        var force = new Option<bool>("--force") { Description = "Overwrite --out if it exists." };
        var command = new Command("simulate", "Draw synthetic pairs from the joint model saved in a results file.") { results, count, output, seed, force };
        command.SetAction(parse => PairFitCli.Guard(parse, (_, error) =>
        {
            string path = parse.GetValue(results)!, outPath = parse.GetValue(output)!;
            int n = parse.GetValue(count), s = parse.GetValue(seed);
            if (File.Exists(outPath) && !parse.GetValue(force))
                throw new PairFitInputException($"--out '{outPath}' already exists; pass --force to overwrite it or choose another name.");
            var model = ResultsFile.ReadModel(path, out var saved);
            var (x, y) = model.Sample(n, s);
            WriteCsv(outPath, saved.Model!.XColumn, saved.Model.YColumn, x, y);
            string rotation = model.Copula.Rotation == 0 ? "" : $" rotated {model.Copula.Rotation}°";
            error.WriteLine($"pairfit: wrote {n} synthetic pairs ({model.Copula.Family}{rotation} copula, {model.X.Family} and {model.Y.Family} marginals, seed {s}) to {outPath}");
            return PairFitCli.ExitOk;
        }));
        return command;
    }

    /// <summary>Writes to a temporary file beside the target and moves it into place, so a failure never leaves half a file.</summary>
    private static void WriteCsv(string path, string xName, string yName, double[] x, double[] y)
    {
        string full = Path.GetFullPath(path);
        string? dir = Path.GetDirectoryName(full);
        if (!string.IsNullOrEmpty(dir)) Directory.CreateDirectory(dir);
        string tmp = full + ".tmp-" + Environment.ProcessId;
        try
        {
            using (var w = new StreamWriter(tmp, false, new UTF8Encoding(false)))
            {
                w.Write(Quote(xName)); w.Write(','); w.WriteLine(Quote(yName));
                for (int i = 0; i < x.Length; i++)
                {
                    w.Write(x[i].ToString("R", CultureInfo.InvariantCulture));
                    w.Write(',');
                    w.WriteLine(y[i].ToString("R", CultureInfo.InvariantCulture));
                }
            }
            File.Move(tmp, full, overwrite: true);
        }
        finally
        {
            if (File.Exists(tmp)) File.Delete(tmp);
        }
    }

    // RFC 4180: quote a field holding a comma, quote or line break; double inner quotes.
    private static string Quote(string s) => s.IndexOfAny([',', '"', '\n', '\r']) < 0 ? s : "\"" + s.Replace("\"", "\"\"") + "\"";
}
