using System.Globalization;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using PairFit.Core.Results;

namespace PairFit.Figures.Report;

/// <summary>
/// Turns the results record (and the list of written figures) into a <see cref="ReportDocument"/>.
/// Data summary, dependence and model are laid out by hand; the marginal, copula, projection and
/// joint sections are laid out from their JSON form (the same field names as the results file):
/// scalar fields become a two-column table, lists of records become a table with one row per record.
/// That keeps the report complete as those sections gain fields.
/// </summary>
public static class ReportBuilder
{
    public const string Caution =
        "Read these results with care. The fitted laws describe this sample: they assume the pairs are " +
        "independent of each other and drawn from one unchanging joint law (no trend, no season mixing). " +
        "AIC ranks the candidates against each other and says nothing about whether the best one is good; " +
        "the goodness-of-fit tests and the figures do that, and a test that does not reject is not proof of fit. " +
        "Probabilities and return periods beyond the range of the data are extrapolations that rest on the " +
        "chosen families' tails, and their uncertainty grows quickly with the return period. Tail-dependence " +
        "estimates from a few hundred pairs are rough. Where these results feed decisions that can hurt " +
        "people or property (flood design, dam safety, capital, reserving), they support, and do not replace, " +
        "local design codes, agency guidance and licensed professional judgement.";

    public static ReportDocument Build(AnalysisResults results, IReadOnlyList<FigureFile> figures)
    {
        var doc = new ReportDocument();
        var input = results.Input;
        doc.Heading(1, $"PairFit report: {input.XColumn} and {input.YColumn}");
        doc.Paragraph($"Written by {results.Tool ?? "pairfit"}{(results.CreatedUtc is { } t ? $" on {t}" : "")}.");

        // data
        doc.Heading(2, "Data");
        var rows = new List<IReadOnlyList<string>>
        {
            Row("file", input.File ?? "(in memory)"),
            Row("x column", input.XColumn),
            Row("y column", input.YColumn),
            Row("rows read", Int(input.RowsRead)),
            Row("rows used", Int(input.RowsUsed)),
        };
        foreach (var (reason, count) in input.Dropped)
            rows.Add(Row("dropped: " + reason, Int(count)));
        doc.Table(new ReportTable("Row accounting", ["item", "value"], rows));

        // dependence
        var dep = results.Dependence;
        doc.Heading(2, "Dependence");
        doc.Table(new ReportTable($"Correlation of {input.XColumn} and {input.YColumn} (n = {dep.N})",
            ["measure", "estimate", "p-value", "95 % interval", "note"],
            [Corr("Pearson r", dep.Pearson), Corr("Spearman rho", dep.Spearman), Corr("Kendall tau-b", dep.Kendall)], IsFitTable: true));
        doc.Table(new ReportTable("Empirical tail dependence", ["lower", "upper", "estimator", "threshold", "pairs in the tail", "note"],
            [[Num(dep.Tail.Lower), Num(dep.Tail.Upper), dep.Tail.Estimator ?? "–", Num(dep.Tail.Threshold),
              dep.Tail.K is { } tailPairs ? Int(tailPairs) : "–", dep.Tail.Note ?? ""]]));

        var names = new Dictionary<string, string> { ["x"] = $"x: {input.XColumn}", ["y"] = $"y: {input.YColumn}" };
        Section(doc, "Marginal distributions", results.Marginals, fitTables: true, names: names);
        Section(doc, "Copula", results.Copula, fitTables: true);

        if (results.Model is { } model)
        {
            doc.Heading(2, "Selected joint model");
            doc.Table(new ReportTable("Model reused by later commands", ["part", "family", "parameters"],
            [
                [$"x: {model.XColumn}", model.X.Family, Params(model.X.Parameters)],
                [$"y: {model.YColumn}", model.Y.Family, Params(model.Y.Parameters)],
                ["copula", model.Copula.Family + (model.Copula.Rotation != 0 ? $" rotated {model.Copula.Rotation}°" : ""), Params(model.Copula.Parameters)],
            ], IsFitTable: true));
        }

        if (results.Projections is { Count: > 0 } projections)
        {
            doc.Heading(2, "Projections");
            for (int i = 0; i < projections.Count; i++)
                Section(doc, $"Projection {i + 1}", projections[i], fitTables: false, level: 3);
        }
        Section(doc, "Joint probabilities and return periods", results.Joint, fitTables: false);

        // figures: PNG shown when written, else SVG
        var byId = new Dictionary<string, List<FigureFile>>();
        var order = new List<string>();
        foreach (var f in figures)
        {
            if (!byId.TryGetValue(f.Id, out var list)) { byId[f.Id] = list = []; order.Add(f.Id); }
            list.Add(f);
        }
        if (order.Count > 0)
        {
            doc.Heading(2, "Figures");
            foreach (string id in order)
            {
                var list = byId[id];
                // PNG shown where written, else SVG; with PDF only the figure is listed with its links
                var shown = list.Find(f => f.Format == "png") ?? list.Find(f => f.Format == "svg") ?? list[0];
                doc.Figure(shown, list);
            }
        }

        doc.Heading(2, "Reproducibility");
        var settings = new List<IReadOnlyList<string>>();
        if (results.Settings is { } s)
            foreach (var (k, v) in s) settings.Add(Row(k, v));
        settings.Add(Row("tool", results.Tool ?? "pairfit"));
        settings.Add(Row("results format", $"{results.Format} version {results.Version}"));
        doc.Table(new ReportTable("Settings and seed of this run", ["setting", "value"], settings));
        doc.Paragraph("The full results, including everything in this report, are in results.json beside it; every figure's numbers are in the CSV file of the same name.");

        doc.Heading(2, "Caution");
        doc.Paragraph(Caution);
        return doc;
    }

    private static IReadOnlyList<string> Row(params string[] cells) => cells;

    private static IReadOnlyList<string> Corr(string name, CorrelationEstimate c)
        => [name, Num(c.Estimate), P(c.PValue), c.Ci95 is { Length: 2 } ci ? $"[{Num(ci[0])}, {Num(ci[1])}]" : "–", c.Note ?? ""];

    private static string Params(IReadOnlyDictionary<string, double> p)
    {
        var parts = new List<string>(p.Count);
        foreach (var (k, v) in p) parts.Add($"{k} = {Num(v)}");
        return parts.Count == 0 ? "–" : string.Join(", ", parts);
    }

    internal static string Int(int v) => v.ToString(CultureInfo.InvariantCulture);

    /// <summary>
    /// Four significant digits, except that values from 1,000 to 1e9 (log-likelihoods, AIC) keep one
    /// decimal, so that candidates a few AIC units apart stay distinguishable; "–" for a missing value
    /// (never "NaN").
    /// </summary>
    internal static string Num(double? v)
        => v is not { } d || !double.IsFinite(d) ? "–"
            : Math.Abs(d) >= 1e3 && Math.Abs(d) < 1e9 ? d.ToString("F1", CultureInfo.InvariantCulture)
            : d.ToString("G4", CultureInfo.InvariantCulture);

    /// <summary>p-values: three significant digits, and "&lt; 1e-16" below double resolution.</summary>
    internal static string P(double? v)
        => v is { } d && double.IsFinite(d) ? (d < 1e-16 ? "< 1e-16" : d.ToString("G3", CultureInfo.InvariantCulture)) : "–";

    /// <summary>Lays out any results section from its JSON form.</summary>
    private static void Section(ReportDocument doc, string heading, object? section, bool fitTables, int level = 2,
        IReadOnlyDictionary<string, string>? names = null)
    {
        if (section is null) return;
        var node = JsonSerializer.SerializeToNode(section, section.GetType(), ResultsFile.Options);
        if (node is not JsonObject obj || obj.Count == 0) return;
        doc.Heading(level, heading);
        Object(doc, heading, obj, fitTables, level, names);
    }

    private static void Object(ReportDocument doc, string caption, JsonObject obj, bool fitTables, int level,
        IReadOnlyDictionary<string, string>? names = null)
    {
        var scalars = new List<IReadOnlyList<string>>();
        var nested = new List<(string Name, JsonNode Node)>();
        foreach (var (key, value) in obj)
        {
            if (value is null) continue;
            if (IsScalarLike(value)) scalars.Add(Row(Words(key), Cell(value)));
            else nested.Add((key, value));
        }
        if (scalars.Count > 0) doc.Table(new ReportTable(caption, ["item", "value"], scalars));
        foreach (var (key, node) in nested)
        {
            string name = names is not null && names.TryGetValue(key, out var shown) ? shown : Words(key);
            string sub = $"{caption}: {name}";
            if (node is JsonArray arr && arr.Count > 0 && arr[0] is JsonObject)
                RecordTable(doc, sub, arr, fitTables);
            else if (node is JsonObject o && level < 4)
            {
                doc.Heading(Math.Min(level + 1, 4), name);
                Object(doc, sub, o, fitTables, level + 1);
            }
            else if (node is JsonObject o2)
                doc.Table(new ReportTable(sub, ["item", "value"], [Row("value", o2.ToJsonString())]));
        }
    }

    /// <summary>Lists longer than this are not spelled out in a cell.</summary>
    private const int MaxListInCell = 12;

    /// <summary>Text values longer than this go to the table's numbered notes instead of a cell.</summary>
    private const int LongText = 48;

    /// <summary>
    /// One row per record. Columns are the union of the records' scalar fields in first-seen order;
    /// a nested flat record (such as a goodness-of-fit block) is spread into its own columns; long
    /// texts become numbered notes under the table.
    /// </summary>
    private static void RecordTable(ReportDocument doc, string caption, JsonArray arr, bool fitTables)
    {
        var columns = new List<(string Key, string? Inner)>();
        foreach (var item in arr)
            if (item is JsonObject o)
                foreach (var (k, v) in o)
                {
                    if (v is JsonObject inner && inner.All(kv => kv.Value is JsonValue) && !IsNameToNumberMap(inner))
                    {
                        foreach (var (ik, _) in inner)
                            if (!columns.Contains((k, ik)))
                            {
                                // keep the columns of one nested record together
                                int last = columns.FindLastIndex(c => c.Key == k);
                                columns.Insert(last < 0 ? columns.Count : last + 1, (k, ik));
                            }
                    }
                    else if (v is not null && IsScalarLike(v) && !columns.Contains((k, null))) columns.Add((k, null));
                }
        var notes = new List<string>();
        var rows = new List<IReadOnlyList<string>>();
        foreach (var item in arr)
        {
            if (item is not JsonObject o) continue;
            var cells = new string[columns.Count];
            for (int c = 0; c < columns.Count; c++)
            {
                var (key, inner) = columns[c];
                JsonNode? v = o.TryGetPropertyValue(key, out var outer) ? outer : null;
                if (inner is not null) v = v is JsonObject io && io.TryGetPropertyValue(inner, out var iv) ? iv : null;
                string text = v is null ? "–" : Cell(v);
                if (text.Length > LongText && v is JsonValue)
                {
                    int k = notes.IndexOf(text);
                    if (k < 0) { notes.Add(text); k = notes.Count - 1; }
                    text = $"[{k + 1}]";
                }
                cells[c] = text;
            }
            rows.Add(cells);
        }
        // a nested column keeps its record's name unless its own name is specific (KS, AD p, ...)
        var header = columns.ConvertAll(c => c.Inner is null ? Words(c.Key) : SelfExplaining.Contains(c.Inner) ? Words(c.Inner) : $"{Words(c.Key)} {Words(c.Inner)}");
        doc.Table(new ReportTable(caption, header, rows, IsFitTable: fitTables)
        {
            Notes = notes.ConvertAll(n => $"[{notes.IndexOf(n) + 1}] {n}"),
        });
    }

    /// <summary>Parameter and standard-error maps stay in one cell ("theta = 1.87"); other flat records are spread out.</summary>
    private static bool IsNameToNumberMap(JsonObject o)
    {
        foreach (var (_, v) in o)
            if (v is not null && !(v is JsonValue jv && jv.TryGetValue(out double _))) return false;
        return o.Count <= 6 && o.Count > 0 && !o.ContainsKey("statistic") && !o.ContainsKey("pValue") && !o.ContainsKey("ksStatistic");
    }

    /// <summary>Values that fit in one cell: numbers, strings, booleans, flat number/string lists and flat name→number maps.</summary>
    private static bool IsScalarLike(JsonNode node) => node switch
    {
        JsonValue => true,
        JsonArray a => a.All(x => x is JsonValue),
        JsonObject o => o.Count <= 6 && o.All(kv => kv.Value is JsonValue),
        _ => false,
    };

    private static string Cell(JsonNode node)
    {
        switch (node)
        {
            case JsonValue v when v.TryGetValue(out double d): return Num(d);
            case JsonValue v when v.TryGetValue(out bool b): return b ? "yes" : "no";
            case JsonValue v when v.TryGetValue(out string? s): return s ?? "";
            // long numeric series (density grids) belong to the results file and the figure CSVs, not to a table cell
            case JsonArray a when a.Count > MaxListInCell: return $"({a.Count} values; see results.json)";
            case JsonArray a when a.All(x => x is JsonValue v && v.TryGetValue(out string? _)): return string.Join(" ", a.Select(x => Cell(x!)));
            case JsonArray a: return "[" + string.Join(", ", a.Select(x => x is null ? "–" : Cell(x))) + "]";
            case JsonObject o when IsNameToNumberMap(o): return string.Join(", ", o.Select(kv => $"{kv.Key} = {(kv.Value is null ? "–" : Cell(kv.Value))}"));
            case JsonObject o: return string.Join(", ", o.Select(kv => $"{Words(kv.Key)} = {(kv.Value is null ? "–" : Cell(kv.Value))}"));
            default: return node.ToJsonString();
        }
    }

    private static readonly HashSet<string> SelfExplaining = ["ksStatistic", "ksPValue", "adStatistic", "adPValue", "cvmStatistic", "cvmPValue", "pValueNote"];

    private static readonly Dictionary<string, string> KnownWords = new(StringComparer.OrdinalIgnoreCase)
    {
        ["aic"] = "AIC", ["bic"] = "BIC", ["deltaAic"] = "ΔAIC", ["pValue"] = "p-value", ["ci95"] = "95 % interval", ["gof"] = "GoF",
        ["ksStatistic"] = "KS", ["ksPValue"] = "KS p", ["adStatistic"] = "AD", ["adPValue"] = "AD p",
        ["cvmStatistic"] = "CvM", ["cvmPValue"] = "CvM p", ["pValueNote"] = "p-value note",
    };

    /// <summary>"logLikelihood" → "log likelihood", "aic" → "AIC".</summary>
    internal static string Words(string camel)
    {
        if (KnownWords.TryGetValue(camel, out var k)) return k;
        var sb = new StringBuilder(camel.Length + 4);
        for (int i = 0; i < camel.Length; i++)
        {
            char c = camel[i];
            if (char.IsUpper(c) && i > 0 && !char.IsUpper(camel[i - 1])) sb.Append(' ');
            sb.Append(i > 0 && char.IsUpper(c) && (i + 1 >= camel.Length || !char.IsUpper(camel[i + 1])) ? char.ToLowerInvariant(c) : c);
        }
        return sb.ToString();
    }
}
