using System.Globalization;

namespace PairFit.Core.Data;

/// <summary>What one CSV cell holds, as far as a numeric analysis is concerned.</summary>
public enum CellKind
{
    /// <summary>A finite number.</summary>
    Number,
    /// <summary>Empty, NA, NaN, null (any letter case) or one of the user's missing tokens.</summary>
    Missing,
    /// <summary>Anything that is not a number and not a missing token.</summary>
    Text,
    /// <summary>A number that overflows double or is written as infinity (inf, Infinity, 1e999).</summary>
    NonFinite,
}

/// <summary>
/// Classifies and parses CSV cells: missing tokens first, then a number in the invariant
/// format (decimal point) or with a decimal comma. No thousands separators are accepted, so
/// "1,234" in a decimal-point file is text, never 1234.
/// </summary>
internal sealed class CellParser
{
    private static readonly string[] BuiltInMissing = ["NA", "NaN", "null"];
    private static readonly NumberFormatInfo DecimalCommaFormat = new() { NumberDecimalSeparator = ",", NumberGroupSeparator = "\u00A0" };

    private readonly string[] _userTokens;
    private readonly double[] _userNumbers;
    private readonly NumberFormatInfo _format;

    public CellParser(bool decimalComma, IReadOnlyList<string> userMissingTokens)
    {
        DecimalComma = decimalComma;
        _format = decimalComma ? DecimalCommaFormat : NumberFormatInfo.InvariantInfo;
        var tokens = new List<string>();
        var numbers = new List<double>();
        foreach (var raw in userMissingTokens)
        {
            string t = raw.Trim();
            if (t.Length == 0) continue;
            tokens.Add(t);
            // A numeric sentinel also matches other spellings of the same number (-9999 = -9999.0).
            if (double.TryParse(t, NumberStyles.Float, _format, out double v) && double.IsFinite(v)) numbers.Add(v);
        }
        _userTokens = tokens.ToArray();
        _userNumbers = numbers.ToArray();
    }

    public bool DecimalComma { get; }

    /// <summary>Classifies a trimmed cell; <paramref name="value"/> is set when the cell is a finite number.</summary>
    public CellKind Classify(ReadOnlySpan<char> cell, out double value)
    {
        value = 0;
        if (cell.IsEmpty) return CellKind.Missing;
        foreach (var t in BuiltInMissing)
            if (cell.Equals(t, StringComparison.OrdinalIgnoreCase)) return CellKind.Missing;
        foreach (var t in _userTokens)
            if (cell.Equals(t, StringComparison.OrdinalIgnoreCase)) return CellKind.Missing;

        if (double.TryParse(cell, NumberStyles.Float, _format, out double v))
        {
            // "-nan" and the like parse to NaN: a missing marker in another spelling.
            if (double.IsNaN(v)) return CellKind.Missing;
            if (double.IsInfinity(v)) return CellKind.NonFinite;
            foreach (double s in _userNumbers)
                if (v == s) return CellKind.Missing;
            value = v;
            return CellKind.Number;
        }
        return LooksInfinite(cell) ? CellKind.NonFinite : CellKind.Text;
    }

    /// <summary>inf, +inf, -inf, infinity, ∞ in any letter case (spellings that .NET does not parse).</summary>
    private static bool LooksInfinite(ReadOnlySpan<char> cell)
    {
        if (cell.Length > 0 && (cell[0] == '+' || cell[0] == '-')) cell = cell[1..];
        return cell.Equals("inf", StringComparison.OrdinalIgnoreCase)
            || cell.Equals("infinity", StringComparison.OrdinalIgnoreCase)
            || cell.Equals("\u221E", StringComparison.Ordinal);
    }

    /// <summary>True when the cell reads as a number only with a decimal comma ("1,5").</summary>
    internal static bool IsDecimalCommaNumber(ReadOnlySpan<char> cell)
        => cell.Contains(',') && double.TryParse(cell, NumberStyles.Float, DecimalCommaFormat, out _);

    /// <summary>True when the cell reads as a number with a decimal point ("1.5").</summary>
    internal static bool IsDecimalPointNumber(ReadOnlySpan<char> cell)
        => cell.Contains('.') && double.TryParse(cell, NumberStyles.Float, NumberFormatInfo.InvariantInfo, out _);
}
