using System.CommandLine;
using PairFit.Core.Data;

namespace PairFit.Cli.Commands;

/// <summary>The options that say how to read a CSV file; shared by every command that reads one.</summary>
public sealed class CsvReadingOptions
{
    public readonly Option<string?> Delimiter = new("--delimiter")
    {
        Description = "Field delimiter: comma, semicolon, tab, pipe (or the character itself). Default: detected from the header line (comma, semicolon or tab).",
    };

    public readonly Option<bool> DecimalComma = new("--decimal-comma")
    {
        Description = "Numbers use a decimal comma (1,5 = 1.5). Default: detected for semicolon-delimited files.",
    };

    public readonly Option<string[]> Missing = new("--missing")
    {
        Description = "Extra token that marks a missing value, e.g. -9999 (repeatable). Empty, NA, NaN and null are always missing.",
        AllowMultipleArgumentsPerToken = false,
    };

    /// <summary>Punctuation other than the quote and the decimal point: a letter, digit, blank or '"' would cut numbers or quoted fields apart.</summary>
    private static bool IsUsableDelimiter(char c) => (char.IsPunctuation(c) || char.IsSymbol(c)) && c is not ('"' or '.' or '-' or '+');

    public void AddTo(Command command)
    {
        command.Options.Add(Delimiter);
        command.Options.Add(DecimalComma);
        command.Options.Add(Missing);
    }

    public CsvOptions Read(ParseResult parse)
    {
        string? d = parse.GetValue(Delimiter);
        char? delimiter = d?.ToLowerInvariant() switch
        {
            null => null,
            "comma" or "," => ',',
            "semicolon" or ";" => ';',
            "tab" or "\\t" or "\t" => '\t',
            "pipe" or "|" => '|',
            { Length: 1 } one when IsUsableDelimiter(one[0]) => one[0],
            _ => throw new Core.Common.PairFitInputException(
                $"--delimiter '{d}' is not usable; give comma, semicolon, tab, pipe or one punctuation character."),
        };
        return new CsvOptions
        {
            Delimiter = delimiter,
            DecimalComma = parse.GetValue(DecimalComma) ? true : null,
            MissingTokens = parse.GetValue(Missing) ?? [],
        };
    }
}
