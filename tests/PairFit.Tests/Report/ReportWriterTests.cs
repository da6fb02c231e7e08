using System.Text.RegularExpressions;
using PairFit.Core.Data;
using PairFit.Core.Results;
using PairFit.Figures;
using PairFit.Figures.Report;
using PairFit.Tests.Figures;

namespace PairFit.Tests.Report;

/// <summary>
/// The report folder: report.md, a self-contained report.html and tables.tex. Checks from issue 6:
/// text from the data is escaped in HTML (a column named like a script, a file name with quotes),
/// and the HTML references no network resource.
/// </summary>
public sealed class ReportWriterTests(HostileReportFixture fixture) : IClassFixture<HostileReportFixture>
{
    private const string QuotedFile = HostileReportFixture.QuotedFile;
    private readonly string _dir = fixture.Dir;

    private (AnalysisResults Results, IReadOnlyList<FigureFile> Figures) Hostile() => (fixture.Results, fixture.Figures);

    [Fact]
    public void Html_escapes_column_and_file_names_from_the_data()
    {
        Hostile();
        string html = File.ReadAllText(Path.Combine(_dir, ReportWriter.HtmlFile));
        Assert.DoesNotContain("<script", html, StringComparison.OrdinalIgnoreCase);
        Assert.Contains("&lt;script&gt;alert(1)&lt;/script&gt;", html);
        Assert.DoesNotContain(QuotedFile, html);
        // WebUtility.HtmlEncode: " → &quot;, ' → &#39;, & → &amp;, < → &lt;
        Assert.Contains("flows &quot;final&quot; &#39;v2&#39; &amp; &lt;draft&gt;.csv", html);
    }

    [Fact]
    public void Html_opens_without_network_and_embeds_every_figure()
    {
        var (_, figures) = Hostile();
        string html = File.ReadAllText(Path.Combine(_dir, ReportWriter.HtmlFile));
        Assert.DoesNotMatch(new Regex("(src|href)\\s*=\\s*\"?\\s*(https?:)?//", RegexOptions.IgnoreCase), html);
        Assert.DoesNotContain("http://", html);
        Assert.DoesNotContain("https://", html);
        Assert.DoesNotContain("@import", html);
        int shown = figures.Select(f => f.Id).Distinct().Count();
        Assert.Equal(shown, Regex.Matches(html, "<img [^>]*src=\"data:image/png;base64,").Count);
    }

    [Fact]
    public void Markdown_does_not_turn_data_text_into_markup()
    {
        Hostile();
        string md = File.ReadAllText(Path.Combine(_dir, ReportWriter.MarkdownFile));
        Assert.DoesNotContain("<script>", md);
        Assert.Contains("&lt;script&gt;alert(1)&lt;/script&gt;", md);
        Assert.Contains("runoff\\_mm \\| \\*bold\\*", md); // CommonMark backslash escapes; a bare | would split a table cell
        Assert.Contains("(figures/scatter.png)", md);
    }

    [Fact]
    public void Latex_tables_use_booktabs_and_escape_specials()
    {
        Hostile();
        string tex = File.ReadAllText(Path.Combine(_dir, ReportWriter.LatexFile));
        Assert.Contains("\\toprule", tex);
        Assert.Contains("\\midrule", tex);
        Assert.Contains("\\bottomrule", tex);
        Assert.DoesNotContain("\\hline", tex);
        Assert.Contains("\\textless{}script\\textgreater{}", tex);
        Assert.Contains("runoff\\_mm", tex);
        // every tabular has as many & per row as columns − 1 (a stray & from the data would break this)
        foreach (Match m in Regex.Matches(tex, @"\\begin\{tabular\}\{([lr]+)\}(.*?)\\end\{tabular\}", RegexOptions.Singleline))
        {
            int cols = m.Groups[1].Value.Length;
            foreach (var line in m.Groups[2].Value.Split('\n').Where(l => l.EndsWith("\\\\")))
                Assert.Equal(cols - 1, Regex.Matches(line, @"(?<!\\)&").Count);
        }
    }

    [Fact]
    public void Report_lists_data_accounting_dependence_model_settings_and_caution()
    {
        var (results, _) = Hostile();
        string md = File.ReadAllText(Path.Combine(_dir, ReportWriter.MarkdownFile));
        Assert.Contains("| rows read | 152 |", md);
        Assert.Contains("| dropped: missing y | 2 |", md);
        Assert.Contains("Kendall tau-b", md);
        Assert.Contains("| seed | 11 |", md);
        Assert.Contains("## Marginal distributions", md);
        Assert.Contains("## Copula", md);
        Assert.Contains("## Projections", md);
        Assert.Contains("pairfit test", md);
        Assert.Contains("## Caution", md);
        // The project's rule for results that feed safety and capital decisions.
        Assert.Contains("do not replace, local design codes, agency guidance and licensed professional judgement", md);
        Assert.Contains($"| copula | {results.Model!.Copula.Family}", md);
        // a missing value is a dash, never NaN
        Assert.DoesNotContain("NaN", md);
    }

    [Fact]
    public void Writing_leaves_no_temporary_files()
    {
        Hostile();
        Assert.Empty(Directory.GetFiles(_dir, "*.tmp-*", SearchOption.AllDirectories));
        Assert.True(File.Exists(Path.Combine(_dir, ReportWriter.MarkdownFile)));
    }

    [Fact]
    public void Html_tags_are_balanced()
    {
        // HTML 5 (WHATWG, section 13.1.2): void elements have no end tag; every other element opened here is closed in order.
        string html = File.ReadAllText(Path.Combine(_dir, ReportWriter.HtmlFile));
        string[] voids = ["meta", "img", "br", "hr", "link", "input"];
        var stack = new Stack<string>();
        foreach (Match m in Regex.Matches(html, "<(/?)([a-zA-Z][a-zA-Z0-9]*)[^>]*>"))
        {
            string name = m.Groups[2].Value.ToLowerInvariant();
            if (voids.Contains(name)) continue;
            if (m.Groups[1].Value == "") stack.Push(name);
            else Assert.Equal(stack.Pop(), name);
        }
        Assert.Empty(stack);
    }

    [Fact]
    public void Pdf_only_figures_are_listed_with_links_and_none_writes_nothing()
    {
        string dir = Path.Combine(_dir, "pdf-only");
        var sample = FigureTestData.Sample();
        var (results, model) = FigureTestData.Analyse(sample);
        var figures = FigureSet.RenderAll(sample, results, model, dir, new FigureOptions { Formats = ["pdf"], WidthMm = 60, Dpi = 72 });
        ReportWriter.Write(results, figures, dir);
        string html = File.ReadAllText(Path.Combine(dir, ReportWriter.HtmlFile));
        Assert.DoesNotContain("<img", html);
        Assert.Contains("href=\"figures/scatter.pdf\"", html);
        Assert.DoesNotContain("![", File.ReadAllText(Path.Combine(dir, ReportWriter.MarkdownFile)));

        string none = Path.Combine(_dir, "none");
        Assert.Empty(FigureSet.RenderAll(sample, results, model, none, new FigureOptions { Formats = [] }));
        Assert.False(Directory.Exists(Path.Combine(none, "figures")));
    }

    [Fact]
    public void Field_names_read_as_words()
    {
        Assert.Equal("log likelihood", ReportBuilder.Words("logLikelihood"));
        Assert.Equal("AIC", ReportBuilder.Words("aic"));
        Assert.Equal("p-value", ReportBuilder.Words("pValue"));
    }
}

/// <summary>One report folder written once for all report tests (rendering figures is the slow part).</summary>
public sealed class HostileReportFixture : IDisposable
{
    public const string ScriptColumn = "<script>alert(1)</script>";
    public const string QuotedFile = "flows \"final\" 'v2' & <draft>.csv";

    public HostileReportFixture()
    {
        // the shared synthetic analysis, with the columns and the file renamed to hostile text
        var plain = FigureTestData.Sample();
        var (results, model) = FigureTestData.Analyse(plain);
        var sample = new PairedSample(plain.X, plain.Y, ScriptColumn, YColumn,
            new RowAccounting(QuotedFile, plain.Rows.RowsRead, plain.Rows.RowsUsed, plain.Rows.DroppedByReason));
        Results = results with
        {
            Input = results.Input with { XColumn = ScriptColumn, YColumn = YColumn, File = QuotedFile },
            Model = ModelSection.From(model, ScriptColumn, YColumn),
        };
        Figures = FigureSet.RenderAll(sample, Results, model, Dir, new FigureOptions { Formats = ["png", "svg"], WidthMm = 90, Dpi = 72 });
        ReportWriter.Write(Results, Figures, Dir);
    }

    public const string YColumn = "runoff_mm | *bold*";

    public string Dir { get; } = Path.Combine(Path.GetTempPath(), "pairfit-reporttests-" + Guid.NewGuid().ToString("N"));
    public AnalysisResults Results { get; }
    public IReadOnlyList<FigureFile> Figures { get; }

    public void Dispose()
    {
        if (Directory.Exists(Dir)) Directory.Delete(Dir, recursive: true);
    }
}
