using OxyPlot;

namespace PairFit.Figures.Rendering;

/// <summary>
/// Colours, marker shapes and dash patterns for up to eight series. The colours are the
/// colour-blind-safe set of Okabe and Ito (2008, "Color Universal Design"); each series also has
/// its own marker shape and line dash, so the figures still read when printed in grey.
/// </summary>
public static class Palette
{
    // Okabe & Ito (2008): black, orange, sky blue, bluish green, yellow, blue, vermillion, reddish purple.
    // Ordered so that neighbouring series differ strongly in lightness too (yellow last: weak on white).
    public static readonly OxyColor Black = OxyColor.FromRgb(0, 0, 0);
    public static readonly OxyColor Orange = OxyColor.FromRgb(230, 159, 0);
    public static readonly OxyColor SkyBlue = OxyColor.FromRgb(86, 180, 233);
    public static readonly OxyColor BluishGreen = OxyColor.FromRgb(0, 158, 115);
    public static readonly OxyColor Yellow = OxyColor.FromRgb(240, 228, 66);
    public static readonly OxyColor Blue = OxyColor.FromRgb(0, 114, 178);
    public static readonly OxyColor Vermillion = OxyColor.FromRgb(213, 94, 0);
    public static readonly OxyColor ReddishPurple = OxyColor.FromRgb(204, 121, 167);

    /// <summary>Data (observations) are drawn in this neutral grey so that fitted curves stand out.</summary>
    public static readonly OxyColor Data = OxyColor.FromRgb(90, 90, 90);
    public static readonly OxyColor DataFill = OxyColor.FromArgb(150, 150, 150, 150);
    public static readonly OxyColor Grid = OxyColor.FromRgb(225, 225, 225);

    private static readonly OxyColor[] SeriesColours = [Blue, Vermillion, BluishGreen, ReddishPurple, Orange, SkyBlue, Black, Yellow];
    private static readonly MarkerType[] Markers = [MarkerType.Circle, MarkerType.Triangle, MarkerType.Square, MarkerType.Diamond, MarkerType.Cross, MarkerType.Plus, MarkerType.Star, MarkerType.Circle];
    private static readonly LineStyle[] Dashes = [LineStyle.Solid, LineStyle.Dash, LineStyle.DashDot, LineStyle.Dot, LineStyle.LongDash, LineStyle.DashDashDot, LineStyle.LongDashDot, LineStyle.DashDotDot];

    public static OxyColor Colour(int i) => SeriesColours[i % SeriesColours.Length];
    public static MarkerType Marker(int i) => Markers[i % Markers.Length];
    public static LineStyle Dash(int i) => Dashes[i % Dashes.Length];
}
