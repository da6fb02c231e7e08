using System.Xml.Linq;
using PairFit.Core.Copulas;
using PairFit.Core.Common;
using PairFit.Figures;
using PairFit.Figures.Plots;
using PairFit.Figures.Rendering;
using SkiaSharp;

namespace PairFit.Tests.Figures;

/// <summary>
/// Every figure renders from fitted results to PNG, SVG and PDF: the PNG decodes, has the
/// requested pixel size and is not blank; the SVG is well-formed XML; the PDF has its header;
/// the data CSV is there. (Checks named in issue 6; the file formats' own specifications:
/// PNG signature via SkiaSharp decode, W3C XML, ISO 32000 "%PDF-" header.)
/// </summary>
public sealed class FigureRenderingTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), "pairfit-figtests-" + Guid.NewGuid().ToString("N"));

    public void Dispose()
    {
        if (Directory.Exists(_dir)) Directory.Delete(_dir, recursive: true);
    }

    private static readonly FigureOptions SmallOptions = new() { WidthMm = 120, Dpi = 96 };

    public static IEnumerable<object[]> AllFigures()
    {
        var sample = FigureTestData.Sample();
        var (results, model) = FigureTestData.Analyse(sample);
        foreach (var f in FigureSet.BuildAll(sample, results, model, SmallOptions))
            yield return [f.Id, f];
        // the candidate comparison from log-likelihoods of real fits on the same data: AIC = 2k − 2 log L (Akaike 1974)
        var u = PairFit.Core.Dependence.Ranks.PseudoObservations(sample.X);
        var v = PairFit.Core.Dependence.Ranks.PseudoObservations(sample.Y);
        var scores = new List<CandidateScore>();
        foreach (var c in new[] { model.Copula, CopulaRegistry.Create("clayton", 0, [model.Copula.Parameters[0]]), CopulaRegistry.Create("independence", 0, []) })
        {
            double ll = 0;
            for (int i = 0; i < u.Length; i++) ll += c.LogDensity(u[i], v[i]);
            scores.Add(new CandidateScore(Labels.Of(c), 2 * c.Parameters.Count - 2 * ll));
        }
        scores.Add(new CandidateScore("gumbel", null));
        var cand = CandidateFigure.Build([new CandidateGroup("copulas", scores), new CandidateGroup("marginals of x", [new CandidateScore("lognormal", 100), new CandidateScore("normal", 112.5)])])!;
        yield return [cand.Id, cand];
    }

    [Theory]
    [MemberData(nameof(AllFigures))]
    public void Figure_renders_to_png_svg_pdf_and_csv(string id, Figure figure)
    {
        var files = FigureExporter.Export(figure, SmallOptions, _dir);
        Assert.Equal(["png", "svg", "pdf", "csv"], files.Select(f => f.Format));
        Assert.All(files, f => Assert.Equal(id, f.Id));

        string png = Path.Combine(_dir, files[0].RelativePath);
        using (var bmp = SKBitmap.Decode(png))
        {
            Assert.NotNull(bmp);
            var (w, h) = FigureExporter.PixelSize(figure, SmallOptions);
            // 120 mm at 96 dpi = 453.5 px → 454 (rounded); the exporter must honour the physical size
            Assert.Equal(454, w);
            Assert.Equal(w, bmp.Width);
            Assert.Equal(h, bmp.Height);
            Assert.True(LuminanceVariance(bmp) > 100, "PNG looks blank");
        }

        var svg = XDocument.Load(Path.Combine(_dir, files[1].RelativePath));
        Assert.Equal("svg", svg.Root!.Name.LocalName);
        // physical size for print: 120 mm wide, drawing units kept by the viewBox (120 mm = 453.5 CSS px)
        Assert.Equal("120mm", svg.Root.Attribute("width")!.Value);
        Assert.StartsWith("0 0 453.5", svg.Root.Attribute("viewBox")!.Value);

        using (var fs = File.OpenRead(Path.Combine(_dir, files[2].RelativePath)))
        {
            var head = new byte[5];
            Assert.Equal(5, fs.Read(head));
            Assert.Equal("%PDF-", System.Text.Encoding.ASCII.GetString(head));
        }

        var csv = File.ReadAllLines(Path.Combine(_dir, files[3].RelativePath));
        Assert.Equal("panel,series,x,y,value", csv[0]);
        Assert.True(figure.Data.RowCount > 0);
        Assert.Equal(figure.Data.RowCount + 1, csv.Length);
        Assert.Empty(Directory.GetFiles(Path.Combine(_dir, "figures"), "*.tmp-*"));
    }

    /// <summary>
    /// Variance of the grey level over all pixels. A white page gives 0; a figure with axes,
    /// text and points gives thousands (a single 1-px line across a 454-px page already ~100).
    /// </summary>
    private static double LuminanceVariance(SKBitmap bmp)
    {
        double sum = 0, sum2 = 0;
        long n = 0;
        for (int y = 0; y < bmp.Height; y++)
            for (int x = 0; x < bmp.Width; x++)
            {
                var c = bmp.GetPixel(x, y);
                double l = 0.299 * c.Red + 0.587 * c.Green + 0.114 * c.Blue;
                sum += l; sum2 += l * l; n++;
            }
        double mean = sum / n;
        return sum2 / n - mean * mean;
    }

    [Fact]
    public void RenderAll_writes_every_figure_and_honours_width_and_dpi()
    {
        var sample = FigureTestData.Sample();
        var (results, model) = FigureTestData.Analyse(sample);
        var files = FigureSet.RenderAll(sample, results, model, _dir, new FigureOptions { Formats = ["png"], WidthMm = 85, Dpi = 150 });
        string[] expected = ["scatter", "copula", "marginal-x", "marginal-y", "candidates", "tails", "projection-1", "return-periods", "simulated"];
        Assert.Equal(expected, files.Where(f => f.Format == "png").Select(f => f.Id));
        using var bmp = SKBitmap.Decode(Path.Combine(_dir, "figures", "scatter.png"));
        Assert.Equal(502, bmp.Width); // one column: 85 mm at 150 dpi = 85/25.4·150 = 501.97 → 502 px
    }

    [Fact]
    public void Without_a_model_only_the_data_figures_are_drawn()
    {
        var sample = FigureTestData.Sample();
        var (results, _) = FigureTestData.Analyse(sample, withModel: false);
        var ids = FigureSet.BuildAll(sample, results, null, SmallOptions).Select(f => f.Id).ToArray();
        Assert.Equal(["scatter", "copula", "tails"], ids);
    }

    [Theory]
    [InlineData("gif", 160, 200)]
    [InlineData("png", 5, 200)]
    [InlineData("png", 160, 10)]
    public void Bad_figure_options_are_input_errors(string format, double width, int dpi)
    {
        var sample = FigureTestData.Sample();
        var ex = Assert.Throws<PairFitInputException>(() =>
            FigureSet.RenderAll(sample, FigureTestData.Analyse(sample, withModel: false).Results, null, _dir, new FigureOptions { Formats = [format], WidthMm = width, Dpi = dpi }));
        Assert.DoesNotContain('\n', ex.Message);
    }

    [Fact]
    public void Explicit_height_overrides_the_aspect()
    {
        var sample = FigureTestData.Sample();
        var fig = ScatterFigure.Build(sample);
        var o = new FigureOptions { WidthMm = 85, HeightMm = 60, Dpi = 300 };
        // 85 mm × 60 mm at 300 dpi = 1003.9 × 708.7 px → 1004 × 709
        Assert.Equal((1004, 709), FigureExporter.PixelSize(fig, o));
        using var pdf = new MemoryStream();
        FigureExporter.WritePdf(fig, o, pdf);
        // the PDF page is the physical size in points: 85 mm = 240.94 pt, 60 mm = 170.08 pt (ISO 32000 MediaBox).
        // Skia writes the page size with float rounding of its own (seen: 453.6 for 453.54); 0.5 pt = 0.18 mm is ample.
        string text = System.Text.Encoding.Latin1.GetString(pdf.ToArray());
        var box = System.Text.RegularExpressions.Regex.Match(text, @"/MediaBox \[0 0 ([0-9.]+) ([0-9.]+)\]");
        Assert.True(box.Success);
        Assert.Equal(240.94, double.Parse(box.Groups[1].Value, System.Globalization.CultureInfo.InvariantCulture), 0.5);
        Assert.Equal(170.08, double.Parse(box.Groups[2].Value, System.Globalization.CultureInfo.InvariantCulture), 0.5);
    }

    [Fact]
    public void Same_seed_gives_byte_identical_png()
    {
        // PNG output is deterministic on this image (stack notes section 3); the simulated panel must be too.
        var sample = FigureTestData.Sample();
        var (_, model) = FigureTestData.Analyse(sample);
        var f1 = SimulationFigure.Build(sample, model, 5);
        var f2 = SimulationFigure.Build(sample, model, 5);
        using var a = new MemoryStream();
        using var b = new MemoryStream();
        FigureExporter.WritePng(f1, SmallOptions, a);
        FigureExporter.WritePng(f2, SmallOptions, b);
        Assert.Equal(a.ToArray(), b.ToArray());
    }
}
