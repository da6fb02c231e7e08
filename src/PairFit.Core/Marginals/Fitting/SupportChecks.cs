using System.Globalization;

namespace PairFit.Core.Marginals.Fitting;

/// <summary>The skip reasons shared by families whose support is a half-line.</summary>
internal static class SupportChecks
{
    /// <summary>For families on (0, ∞): null when every value is positive, else why not.</summary>
    public static string? Positive(MarginalSample s, string family) => s.Min > 0 ? null
        : $"{family} needs every value > 0, but the data contain {(s.Min == 0 ? "zeros" : "negative values")} (minimum {s.Min.ToString("G6", CultureInfo.InvariantCulture)})";

    /// <summary>For families on [0, ∞).</summary>
    public static string? NonNegative(MarginalSample s, string family) => s.Min >= 0 ? null
        : $"{family} needs every value ≥ 0, but the data contain negative values (minimum {s.Min.ToString("G6", CultureInfo.InvariantCulture)})";
}
