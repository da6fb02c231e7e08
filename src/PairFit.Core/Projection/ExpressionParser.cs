using System.Globalization;
using PairFit.Core.Common;

namespace PairFit.Core.Projection;

/// <summary>
/// Parser of PairFit's small expression language: numbers, the two variables (by column name,
/// by <c>[column name]</c> for names with spaces or symbols, or as <c>x</c> and <c>y</c>),
/// + − * / ^, unary minus, parentheses and the functions min, max, abs, log, exp, sqrt.
/// Precedence from loosest to tightest: + −, then * /, then unary minus, then ^ (so −x^2 is
/// −(x^2)); + − * / group to the left, ^ to the right (2^3^2 = 2^9), the usual mathematical
/// conventions. Nothing is ever executed: the text becomes a tree of the nodes above. Input is
/// bounded in length and nesting depth so hostile input is refused before it can exhaust the stack.
/// </summary>
public static class ExpressionParser
{
    public const int MaxLength = 1000;
    public const int MaxDepth = 64;

    /// <summary>Function names and their argument counts.</summary>
    public static readonly IReadOnlyDictionary<string, int> Functions = new Dictionary<string, int>(StringComparer.Ordinal)
    {
        ["min"] = 2, ["max"] = 2, ["abs"] = 1, ["log"] = 1, ["exp"] = 1, ["sqrt"] = 1,
    };

    /// <summary>Parses or throws <see cref="PairFitInputException"/> with a one-line message naming the position.</summary>
    public static ExpressionNode Parse(string expression, string? xName = null, string? yName = null)
    {
        var result = TryParse(expression, xName, yName, out var error);
        if (error is not null) throw new PairFitInputException(error.Message);
        return result!;
    }

    /// <summary>Parses; on failure returns null and the error (position, description, caret line).</summary>
    public static ExpressionNode? TryParse(string expression, string? xName, string? yName, out ExpressionError? error)
    {
        ArgumentNullException.ThrowIfNull(expression);
        error = null;
        if (expression.Length > MaxLength)
        {
            error = new ExpressionError(expression, MaxLength + 1,
                $"the expression is {expression.Length} characters long; the limit is {MaxLength}");
            return null;
        }
        try
        {
            var parser = new Parser(expression, Tokenize(expression), xName, yName);
            return parser.ParseWhole();
        }
        catch (SyntaxError e)
        {
            error = new ExpressionError(expression, e.Position, e.Description);
            return null;
        }
    }

    private sealed class SyntaxError(int position, string description) : Exception(description)
    {
        public int Position { get; } = position;
        public string Description { get; } = description;
    }

    private enum TokenKind { Number, Name, Operator, LeftParen, RightParen, Comma, End }

    private readonly record struct Token(TokenKind Kind, string Text, int Position, double Number = 0);

    private static List<Token> Tokenize(string s)
    {
        var tokens = new List<Token>();
        int i = 0;
        while (i < s.Length)
        {
            char c = s[i];
            int pos = i + 1;
            if (char.IsWhiteSpace(c)) { i++; continue; }
            if (char.IsAsciiDigit(c) || (c == '.' && i + 1 < s.Length && char.IsAsciiDigit(s[i + 1])))
            {
                int start = i;
                while (i < s.Length && char.IsAsciiDigit(s[i])) i++;
                if (i < s.Length && s[i] == '.') { i++; while (i < s.Length && char.IsAsciiDigit(s[i])) i++; }
                if (i < s.Length && (s[i] == 'e' || s[i] == 'E'))
                {
                    int mark = i;
                    i++;
                    if (i < s.Length && (s[i] == '+' || s[i] == '-')) i++;
                    if (i >= s.Length || !char.IsAsciiDigit(s[i]))
                        throw new SyntaxError(mark + 1, $"malformed number '{s[start..i]}': an exponent needs digits, e.g. 1e3");
                    while (i < s.Length && char.IsAsciiDigit(s[i])) i++;
                }
                string text = s[start..i];
                if (i < s.Length && (char.IsLetter(s[i]) || s[i] == '_'))
                    throw new SyntaxError(i + 1, $"a number runs into a name at '{text}{s[i]}'; write an explicit '*' between them");
                double value = double.Parse(text, NumberStyles.Float, CultureInfo.InvariantCulture);
                if (!double.IsFinite(value))
                    throw new SyntaxError(pos, $"number '{text}' is too large");
                tokens.Add(new Token(TokenKind.Number, text, pos, value));
                continue;
            }
            if (char.IsLetter(c) || c == '_')
            {
                int start = i;
                while (i < s.Length && (char.IsLetterOrDigit(s[i]) || s[i] == '_' || s[i] == '.')) i++;
                tokens.Add(new Token(TokenKind.Name, s[start..i], pos));
                continue;
            }
            if (c == '[')
            {
                int close = s.IndexOf(']', i + 1);
                if (close < 0) throw new SyntaxError(pos, "'[' opens a column name that is never closed with ']'");
                string name = s[(i + 1)..close];
                if (name.Trim().Length == 0) throw new SyntaxError(pos, "empty column name '[]'");
                tokens.Add(new Token(TokenKind.Name, name, pos));
                i = close + 1;
                continue;
            }
            switch (c)
            {
                case '*' when i + 1 < s.Length && s[i + 1] == '*':
                    throw new SyntaxError(pos, "'**' is not an operator; write powers with '^', e.g. x^2");
                case '+' or '-' or '*' or '/' or '^':
                    tokens.Add(new Token(TokenKind.Operator, c.ToString(), pos)); i++; continue;
                case '(':
                    tokens.Add(new Token(TokenKind.LeftParen, "(", pos)); i++; continue;
                case ')':
                    tokens.Add(new Token(TokenKind.RightParen, ")", pos)); i++; continue;
                case ',':
                    tokens.Add(new Token(TokenKind.Comma, ",", pos)); i++; continue;
                case ']':
                    throw new SyntaxError(pos, "']' without a matching '['");
                default:
                    throw new SyntaxError(pos, $"unexpected character '{c}'; allowed are numbers, names, + - * / ^, parentheses and commas");
            }
        }
        tokens.Add(new Token(TokenKind.End, "end of expression", s.Length + 1));
        return tokens;
    }

    private sealed class Parser(string source, List<Token> tokens, string? xName, string? yName)
    {
        private int _next;
        private int _depth;

        private Token Peek => tokens[_next];

        private Token Take() => tokens[_next++];

        public ExpressionNode ParseWhole()
        {
            if (Peek.Kind == TokenKind.End)
                throw new SyntaxError(1, "the expression is empty; write something like 'x + y'");
            var node = ParseSum();
            var t = Peek;
            if (t.Kind == TokenKind.RightParen)
                throw new SyntaxError(t.Position, "')' has no matching '('");
            if (t.Kind != TokenKind.End)
                throw new SyntaxError(t.Position, $"unexpected {Describe(t)} after a complete expression; expected an operator such as + or *");
            return node;
        }

        // Every recursive rule passes through here, so the depth bound covers parentheses,
        // function arguments, unary-minus chains and power chains alike.
        private void Enter(Token at)
        {
            if (++_depth > MaxDepth)
                throw new SyntaxError(at.Position, $"the expression is nested more than {MaxDepth} levels deep");
        }

        private void Leave() => _depth--;

        private ExpressionNode ParseSum()
        {
            var left = ParseProduct();
            while (Peek.Kind == TokenKind.Operator && Peek.Text is "+" or "-")
            {
                var op = Take();
                left = new BinaryNode(op.Position, op.Text[0], left, ParseProduct());
            }
            return left;
        }

        private ExpressionNode ParseProduct()
        {
            var left = ParseUnary();
            while (Peek.Kind == TokenKind.Operator && Peek.Text is "*" or "/")
            {
                var op = Take();
                left = new BinaryNode(op.Position, op.Text[0], left, ParseUnary());
            }
            return left;
        }

        private ExpressionNode ParseUnary()
        {
            var t = Peek;
            if (t.Kind == TokenKind.Operator && t.Text is "-" or "+")
            {
                Take();
                Enter(t);
                var operand = ParseUnary();
                Leave();
                return t.Text == "-" ? new NegateNode(t.Position, operand) : operand;
            }
            return ParsePower();
        }

        private ExpressionNode ParsePower()
        {
            var basis = ParsePrimary();
            if (Peek.Kind == TokenKind.Operator && Peek.Text == "^")
            {
                var op = Take();
                Enter(op);
                var exponent = ParseUnary(); // right-associative; allows 2^-x
                Leave();
                return new BinaryNode(op.Position, '^', basis, exponent);
            }
            return basis;
        }

        private ExpressionNode ParsePrimary()
        {
            var t = Take();
            switch (t.Kind)
            {
                case TokenKind.Number:
                    return new NumberNode(t.Position, t.Number);
                case TokenKind.LeftParen:
                {
                    Enter(t);
                    var inner = ParseSum();
                    Leave();
                    Expect(TokenKind.RightParen, $"missing ')' to close the '(' at position {t.Position}");
                    return inner;
                }
                case TokenKind.Name:
                    return Peek.Kind == TokenKind.LeftParen ? ParseCall(t) : ResolveName(t);
                case TokenKind.RightParen:
                    throw new SyntaxError(t.Position, _depth > 0 || _next > 1
                        ? "unexpected ')'; expected a number, a name or '(' before it"
                        : "')' has no matching '('");
                default:
                    throw new SyntaxError(t.Position, $"unexpected {Describe(t)}; expected a number, a name or '('");
            }
        }

        private ExpressionNode ParseCall(Token name)
        {
            if (!Functions.TryGetValue(name.Text, out int arity))
            {
                if (Bind(name.Text) is not null)
                    throw new SyntaxError(name.Position, $"'{name.Text}' is a variable, not a function; put an operator between it and '('");
                throw new SyntaxError(name.Position, $"unknown function '{name.Text}'; known: {string.Join(", ", Functions.Keys)}");
            }
            var open = Take();
            Enter(open);
            var args = new List<ExpressionNode>();
            if (Peek.Kind != TokenKind.RightParen)
            {
                args.Add(ParseSum());
                while (Peek.Kind == TokenKind.Comma)
                {
                    Take();
                    args.Add(ParseSum());
                }
            }
            Leave();
            Expect(TokenKind.RightParen, $"missing ')' to close the call of '{name.Text}' at position {name.Position}");
            if (args.Count != arity)
                throw new SyntaxError(name.Position, $"function '{name.Text}' takes {arity} argument{(arity == 1 ? "" : "s")}, got {args.Count}");
            return new CallNode(name.Position, name.Text, args);
        }

        private ExpressionNode ResolveName(Token t)
        {
            if (Bind(t.Text) is { } v) return new VariableNode(t.Position, v, t.Text);
            if (Functions.ContainsKey(t.Text))
                throw new SyntaxError(t.Position, $"function '{t.Text}' needs its arguments in parentheses, e.g. {t.Text}(x)");
            string names = string.Join(", ", new[] { "x", "y", xName, yName }.Where(n => !string.IsNullOrEmpty(n)).Distinct().Select(n => $"'{n}'"));
            throw new SyntaxError(t.Position, $"unknown name '{t.Text}'; the variables are {names}");
        }

        // Column names win over the letters x and y, so a column called "y" used as X stays X.
        private ExpressionVariable? Bind(string name)
        {
            if (xName is not null && name == xName) return ExpressionVariable.X;
            if (yName is not null && name == yName) return ExpressionVariable.Y;
            if (name == "x") return ExpressionVariable.X;
            if (name == "y") return ExpressionVariable.Y;
            return null;
        }

        private void Expect(TokenKind kind, string message)
        {
            var t = Peek;
            if (t.Kind != kind) throw new SyntaxError(t.Position, t.Kind == TokenKind.End ? message : $"{message}; found {Describe(t)}");
            Take();
        }

        private static string Describe(Token t) => t.Kind switch
        {
            TokenKind.End => "end of expression",
            TokenKind.Number => $"number '{t.Text}'",
            TokenKind.Name => $"name '{t.Text}'",
            _ => $"'{t.Text}'",
        };

        public override string ToString() => source;
    }
}
