using OxyPlot;
using OxyPlot.SkiaSharp;
using PairFit.Core.Common;
using SkiaSharp;

namespace PairFit.Figures.Rendering;

/// <summary>
/// Writes a <see cref="Figure"/> as PNG, SVG and PDF through one code path: every panel is
/// rendered by OxyPlot's Skia render context onto a canvas (raster surface, SVG canvas or PDF
/// page), so the three formats show the same drawing. Layout is done in device-independent units
/// (1/96 inch); the canvas scale maps them to pixels (PNG at the chosen DPI) or points (PDF).
/// Every file is written under a temporary name and moved into place.
/// </summary>
public static class FigureExporter
{
    public const double DipPerInch = 96.0;
    private const double MmPerInch = 25.4;

    /// <summary>Page size in device-independent units for these options.</summary>
    public static (double Width, double Height) PageSizeDip(Figure figure, FigureOptions options)
    {
        return (options.WidthMm / MmPerInch * DipPerInch, HeightMm(figure, options) / MmPerInch * DipPerInch);
    }

    /// <summary>PNG size in pixels for these options: the physical size at the chosen DPI.</summary>
    public static (int Width, int Height) PixelSize(Figure figure, FigureOptions options)
    {
        var (w, h) = PageSizeDip(figure, options);
        double s = options.Dpi / DipPerInch;
        return ((int)Math.Round(w * s), (int)Math.Round(h * s));
    }

    /// <summary>Exports to every requested format plus the data CSV; returns paths relative to <paramref name="outDir"/>.</summary>
    public static IReadOnlyList<FigureFile> Export(Figure figure, FigureOptions options, string outDir, string subDir = "figures")
    {
        string dir = Path.Combine(outDir, subDir);
        Directory.CreateDirectory(dir);
        var files = new List<FigureFile>();
        foreach (string format in options.Formats)
        {
            string fmt = format.Trim().ToLowerInvariant();
            string name = figure.Id + "." + fmt;
            WriteAtomically(Path.Combine(dir, name), stream =>
            {
                switch (fmt)
                {
                    case "png": WritePng(figure, options, stream); break;
                    case "svg": WriteSvg(figure, options, stream); break;
                    case "pdf": WritePdf(figure, options, stream); break;
                    default:
                        throw new PairFitInputException($"figure format '{format}' is not supported; use png, svg or pdf (or none).");
                }
            });
            files.Add(new FigureFile(figure.Id, figure.Title, figure.Caption, fmt, subDir + "/" + name));
        }
        string csvName = figure.Id + ".csv";
        WriteAtomically(Path.Combine(dir, csvName), s =>
        {
            using var w = new StreamWriter(s, new System.Text.UTF8Encoding(false));
            w.Write(figure.Data.ToCsv());
        });
        files.Add(new FigureFile(figure.Id, figure.Title, figure.Caption, "csv", subDir + "/" + csvName));
        return files;
    }

    public static void WritePng(Figure figure, FigureOptions options, Stream stream)
    {
        var (pw, ph) = PixelSize(figure, options);
        var info = new SKImageInfo(pw, ph, SKColorType.Rgba8888, SKAlphaType.Premul);
        using var surface = SKSurface.Create(info)
            ?? throw new PairFitAnalysisException($"could not allocate a {pw}x{ph} image for figure '{figure.Id}'; lower --figure-dpi or the width.");
        Draw(figure, options, surface.Canvas, options.Dpi / DipPerInch, RenderTarget.PixelGraphic);
        using var image = surface.Snapshot();
        using var data = image.Encode(SKEncodedImageFormat.Png, 100);
        data.SaveTo(stream);
    }

    public static void WriteSvg(Figure figure, FigureOptions options, Stream stream)
    {
        var (w, h) = PageSizeDip(figure, options);
        using var buffer = new MemoryStream();
        // the SVG canvas writes its document when disposed
        using (var managed = new SKManagedWStream(buffer, disposeManagedStream: false))
        using (var canvas = SKSvgCanvas.Create(new SKRect(0, 0, (float)w, (float)h), managed))
        {
            Draw(figure, options, canvas, 1.0, RenderTarget.VectorGraphic);
        }
        string svg = System.Text.Encoding.UTF8.GetString(buffer.GetBuffer(), 0, (int)buffer.Length);
        var bytes = System.Text.Encoding.UTF8.GetBytes(WithPhysicalSize(svg, options.WidthMm, HeightMm(figure, options), w, h));
        stream.Write(bytes);
    }

    /// <summary>
    /// Skia writes width/height in CSS pixels; a figure for print should carry its size in
    /// millimetres, with the drawing units kept through a viewBox (SVG 1.1, section 7.7).
    /// </summary>
    internal static string WithPhysicalSize(string svg, double widthMm, double heightMm, double widthUnits, double heightUnits)
    {
        int start = svg.IndexOf("<svg", StringComparison.Ordinal);
        int end = start < 0 ? -1 : svg.IndexOf('>', start);
        if (end < 0) return svg;
        string tag = svg[start..end];
        var width = System.Text.RegularExpressions.Regex.Match(tag, "width=\"[0-9.]+\"");
        var height = System.Text.RegularExpressions.Regex.Match(tag, "height=\"[0-9.]+\"");
        if (!width.Success || !height.Success) return svg;
        var inv = System.Globalization.CultureInfo.InvariantCulture;
        string fixedTag = tag
            .Replace(width.Value, $"width=\"{widthMm.ToString("0.##", inv)}mm\"")
            .Replace(height.Value, $"height=\"{heightMm.ToString("0.##", inv)}mm\" viewBox=\"0 0 {widthUnits.ToString("0.###", inv)} {heightUnits.ToString("0.###", inv)}\"");
        return svg[..start] + fixedTag + svg[end..];
    }

    private static double HeightMm(Figure figure, FigureOptions options)
        => options.HeightMm > 0 ? options.HeightMm : options.WidthMm * figure.Aspect;

    public static void WritePdf(Figure figure, FigureOptions options, Stream stream)
    {
        var (w, h) = PageSizeDip(figure, options);
        double toPoints = 72.0 / DipPerInch;
        var meta = new SKDocumentPdfMetadata
        {
            Title = figure.Title,
            Creator = PairFit.Core.ToolInfo.NameAndVersion,
            Producer = PairFit.Core.ToolInfo.NameAndVersion,
            RasterDpi = options.Dpi,
            EncodingQuality = 100,
        };
        using var managed = new SKManagedWStream(stream, disposeManagedStream: false);
        using var doc = SKDocument.CreatePdf(managed, meta);
        var canvas = doc.BeginPage((float)(w * toPoints), (float)(h * toPoints));
        Draw(figure, options, canvas, toPoints, RenderTarget.VectorGraphic);
        doc.EndPage();
        doc.Close();
    }

    /// <summary>White page, then each panel in its rectangle. Throws if OxyPlot swallowed a render error.</summary>
    private static void Draw(Figure figure, FigureOptions options, SKCanvas canvas, double scale, RenderTarget target)
    {
        var (w, h) = PageSizeDip(figure, options);
        canvas.Clear(SKColors.White);
        using var rc = new SkiaRenderContext { RenderTarget = target, SkCanvas = canvas, DpiScale = (float)scale, UseTextShaping = true };
        foreach (var (model, area) in figure.Panels)
        {
            double x = area.Left * w, y = area.Top * h, pw = area.Width * w, ph = area.Height * h;
            canvas.Save();
            canvas.Translate((float)(x * scale), (float)(y * scale));
            IPlotModel m = model;
            m.Update(true);
            m.Render(rc, new OxyRect(0, 0, pw, ph));
            canvas.Restore();
            if (model.GetLastPlotException() is { } e)
                throw new PairFitAnalysisException($"figure '{figure.Id}' failed to render: {e.GetType().Name}: {e.Message}");
        }
        canvas.Flush();
    }

    /// <summary>Writes through a temporary file in the same folder, then moves it over the target.</summary>
    internal static void WriteAtomically(string path, Action<Stream> write)
    {
        string tmp = path + ".tmp-" + Environment.ProcessId;
        try
        {
            using (var fs = new FileStream(tmp, FileMode.Create, FileAccess.Write))
                write(fs);
            File.Move(tmp, path, overwrite: true);
        }
        finally
        {
            if (File.Exists(tmp)) File.Delete(tmp);
        }
    }
}
