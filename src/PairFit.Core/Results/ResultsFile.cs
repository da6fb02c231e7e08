using System.Text.Json;
using System.Text.Json.Serialization;
using PairFit.Core.Common;

namespace PairFit.Core.Results;

/// <summary>Reads and writes the results file (JSON, camelCase, indented, nulls left out).</summary>
public static class ResultsFile
{
    public static readonly JsonSerializerOptions Options = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.CamelCase,
        DictionaryKeyPolicy = null,
        WriteIndented = true,
        // Keep notes readable ("+", "<", "θ" as written); the file is data, never embedded in HTML as is.
        Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
        DefaultIgnoreCondition = JsonIgnoreCondition.WhenWritingNull,
        Converters = { new JsonStringEnumConverter(JsonNamingPolicy.CamelCase) },
    };

    public static string ToJson(AnalysisResults results) => JsonSerializer.Serialize(results, Options);

    /// <summary>Writes to a temporary file beside the target and moves it into place, so a crash never leaves half a file.</summary>
    public static void Write(AnalysisResults results, string path)
    {
        string full = Path.GetFullPath(path);
        string? dir = Path.GetDirectoryName(full);
        if (!string.IsNullOrEmpty(dir)) Directory.CreateDirectory(dir);
        string tmp = full + ".tmp-" + Environment.ProcessId;
        File.WriteAllText(tmp, ToJson(results));
        File.Move(tmp, full, overwrite: true);
    }

    public static AnalysisResults Read(string path)
    {
        if (!File.Exists(path))
            throw new PairFitInputException($"results file '{path}' does not exist; write one with 'pairfit analyze <csv> --x <col> --y <col> --json {path}'.");
        AnalysisResults? r;
        try
        {
            r = JsonSerializer.Deserialize<AnalysisResults>(File.ReadAllText(path), Options);
        }
        catch (JsonException e)
        {
            throw new PairFitInputException($"results file '{path}' is not valid PairFit JSON ({e.Message.Split('\n')[0]}).");
        }
        if (r is null || r.Format != AnalysisResults.FormatName)
            throw new PairFitInputException($"'{path}' is not a PairFit results file (expected \"format\": \"{AnalysisResults.FormatName}\").");
        if (r.Version > AnalysisResults.CurrentVersion)
            throw new PairFitInputException($"results file '{path}' has version {r.Version}; this pairfit reads version {AnalysisResults.CurrentVersion} or older. Update pairfit.");
        return r;
    }

    /// <summary>The saved joint model of a results file, or a clear error if the file has none.</summary>
    public static Model.JointModel ReadModel(string path, out AnalysisResults results)
    {
        results = Read(path);
        if (results.Model is null)
            throw new PairFitInputException($"results file '{path}' holds no fitted joint model; rerun 'pairfit analyze' with marginal and copula fitting.");
        return results.Model.ToJointModel();
    }
}
