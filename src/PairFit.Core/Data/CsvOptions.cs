namespace PairFit.Core.Data;

/// <summary>How to read a delimited text file of paired records.</summary>
public sealed record CsvOptions
{
    /// <summary>Field delimiter (',', ';' or '\t'); null = detect from the header line.</summary>
    public char? Delimiter { get; init; }

    /// <summary>Decimal comma ("1,5" = 1.5); null = assume it for semicolon-delimited files whose numbers use commas.</summary>
    public bool? DecimalComma { get; init; }

    /// <summary>Extra missing-value tokens given by the user, e.g. "-9999" (in addition to empty, NA, NaN, null).</summary>
    public IReadOnlyList<string> MissingTokens { get; init; } = [];

    /// <summary>The word for a delimiter in messages: "comma", "semicolon", "tab".</summary>
    public static string DelimiterName(char delimiter)
        => delimiter switch { ',' => "comma", ';' => "semicolon", '\t' => "tab", _ => $"'{delimiter}'" };
}

/// <summary>A column chosen by header name or by 1-based index ("3" or "#3").</summary>
public sealed record ColumnSelector(string Text);
