namespace PairFit.Core.Projection;

/// <summary>The two variables an expression can use.</summary>
public enum ExpressionVariable { X = 0, Y = 1 }

/// <summary>
/// A node of a parsed expression. Positions are 1-based character positions in the source
/// text, kept so that later checks (unknown names, argument counts) can point at the culprit.
/// </summary>
public abstract record ExpressionNode(int Position)
{
    /// <summary>How many times <paramref name="variable"/> occurs below this node.</summary>
    public abstract int Occurrences(ExpressionVariable variable);
}

public sealed record NumberNode(int Position, double Value) : ExpressionNode(Position)
{
    public override int Occurrences(ExpressionVariable variable) => 0;
}

public sealed record VariableNode(int Position, ExpressionVariable Variable, string Name) : ExpressionNode(Position)
{
    public override int Occurrences(ExpressionVariable variable) => Variable == variable ? 1 : 0;
}

/// <summary>Unary minus (unary plus is dropped by the parser).</summary>
public sealed record NegateNode(int Position, ExpressionNode Operand) : ExpressionNode(Position)
{
    public override int Occurrences(ExpressionVariable variable) => Operand.Occurrences(variable);
}

/// <summary>One of + − * / ^.</summary>
public sealed record BinaryNode(int Position, char Operator, ExpressionNode Left, ExpressionNode Right) : ExpressionNode(Position)
{
    public override int Occurrences(ExpressionVariable variable) => Left.Occurrences(variable) + Right.Occurrences(variable);
}

/// <summary>A call of one of the built-in functions (min, max, abs, log, exp, sqrt).</summary>
public sealed record CallNode(int Position, string Function, IReadOnlyList<ExpressionNode> Arguments) : ExpressionNode(Position)
{
    public override int Occurrences(ExpressionVariable variable)
    {
        int n = 0;
        foreach (var a in Arguments) n += a.Occurrences(variable);
        return n;
    }
}

/// <summary>
/// A syntax or name error in an expression: what went wrong and at which 1-based character
/// position. <see cref="Message"/> is one line; <see cref="SourceLine"/> and
/// <see cref="CaretLine"/> show the expression with a caret under the position, for callers
/// that can print more than one line.
/// </summary>
public sealed record ExpressionError(string Expression, int Position, string Description)
{
    /// <summary>Longest expression echoed back in a message; longer ones are cut around the position.</summary>
    private const int EchoWidth = 60;

    public string Message => $"expression error at position {Position}: {Description} (in \"{Excerpt().Text}\").";

    /// <summary>The expression (or the part of it around the position) indented by two spaces.</summary>
    public string SourceLine => "  " + Excerpt().Text;

    /// <summary>A caret under <see cref="Position"/>, aligned with <see cref="SourceLine"/>.</summary>
    public string CaretLine => "  " + new string(' ', Math.Max(0, Position - 1 - Excerpt().Start)) + "^";

    private (string Text, int Start) Excerpt()
    {
        string flat = Expression.Replace('\t', ' ').Replace('\r', ' ').Replace('\n', ' ');
        if (flat.Length <= EchoWidth) return (flat, 0);
        int start = Math.Clamp(Position - 1 - EchoWidth / 2, 0, flat.Length - EchoWidth);
        return (flat.Substring(start, EchoWidth), start);
    }
}
