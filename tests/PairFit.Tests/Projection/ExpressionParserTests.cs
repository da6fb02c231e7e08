using PairFit.Core.Common;
using PairFit.Core.Projection;

namespace PairFit.Tests.Projection;

public class ExpressionParserTests
{
    private static double Eval(string expr, double x, double y, string? xName = null, string? yName = null)
        => new CompiledExpression(ExpressionParser.Parse(expr, xName, yName)).Evaluate(x, y);

    // Precedence and associativity: the conventions of ISO 80000-2 (2019) and ordinary algebra,
    // expected values written out by hand with the grouping spelled as explicit parentheses.
    [Theory]
    [InlineData("1 + 2 * 3", 1 + 2 * 3)]          // * before +
    [InlineData("(1 + 2) * 3", 9)]
    [InlineData("8 - 4 - 2", (8 - 4) - 2)]        // left-associative −
    [InlineData("8 / 4 / 2", (8.0 / 4) / 2)]      // left-associative /
    [InlineData("2 ^ 3 ^ 2", 512)]                // right-associative ^: 2^(3^2)
    [InlineData("-2 ^ 2", -4)]                    // ^ binds tighter than unary minus
    [InlineData("(-2) ^ 2", 4)]
    [InlineData("2 ^ -1", 0.5)]                   // unary minus in an exponent
    [InlineData("2 * -x", -6)]
    [InlineData("x - -y", 3 + 5)]
    [InlineData("--x", 3)]
    [InlineData("+x", 3)]
    [InlineData("x * y ^ 2", 3 * 25)]             // ^ before *
    [InlineData("x / y * 2", (3.0 / 5) * 2)]      // * and / at the same level, left to right
    [InlineData("min(x, y) + max(x, y)", 8)]
    [InlineData("abs(x - y)", 2)]
    [InlineData("log(exp(x))", 3)]
    [InlineData("sqrt(x * 12)", 6)]
    [InlineData("1e3 + .5 + 2. + 1E-1", 1000 + 0.5 + 2 + 0.1)]
    [InlineData("exp(0) * (x + (y - (1)))", 7)]
    public void PrecedenceAndAssociativity(string expr, double expected)
        => Assert.Equal(expected, Eval(expr, 3, 5), 12);

    [Fact]
    public void ColumnNamesBindAndWinOverTheLetters()
    {
        Assert.Equal(3.0 / 5, Eval("rain / runoff", 3, 5, "rain", "runoff"));
        Assert.Equal(3.0 - 5, Eval("[peak flow] - [volume (m3)]", 3, 5, "peak flow", "volume (m3)"));
        // A column called "y" that is the X variable stays X.
        Assert.Equal(3.0 / 5, Eval("y / x", 3, 5, "y", "x"));
    }

    [Fact]
    public void BlockEvaluationMatchesScalarEvaluation()
    {
        var program = new CompiledExpression(ExpressionParser.Parse("max(x, y) * 2 - log(abs(x) + 1) / (y ^ 2 + 1) + sqrt(abs(y)) - exp(-x)"));
        int n = 3000; // more than one block of 1024
        var x = new double[n];
        var y = new double[n];
        var rng = new Random(7);
        for (int i = 0; i < n; i++) { x[i] = rng.NextDouble() * 10 - 5; y[i] = rng.NextDouble() * 10 - 5; }
        var q = new double[n];
        program.Evaluate(x, y, q);
        for (int i = 0; i < n; i++) Assert.Equal(program.Evaluate(x[i], y[i]), q[i]);
    }

    [Fact]
    public void UndefinedValuesAreNaNNotErrors()
    {
        Assert.True(double.IsNaN(Eval("log(x - 10)", 3, 5)));
        Assert.True(double.IsNaN(Eval("(x - 3) / (y - 5)", 3, 5)));
        Assert.True(double.IsNaN(Eval("min(log(x - 10), y)", 3, 5)));
    }

    [Fact]
    public void ConstantSubExpressionsAreFolded()
    {
        var folded = new CompiledExpression(ExpressionParser.Parse("x + (2 * 3 ^ 2 - sqrt(16))"));
        Assert.Equal(3, folded.NodeCount); // x, 14, +
        Assert.Equal(17, folded.Evaluate(3, 0));
    }

    // Every error message: the position (1-based) and a fragment of the description.
    [Theory]
    [InlineData("", 1, "empty")]
    [InlineData("   ", 1, "empty")]
    [InlineData("x + * y", 5, "unexpected '*'")]
    [InlineData("x +", 4, "unexpected end of expression")]
    [InlineData("(x + y", 7, "missing ')' to close the '(' at position 1")]
    [InlineData("x + y)", 6, "')' has no matching '('")]
    [InlineData("x y", 3, "after a complete expression")]
    [InlineData("x ** 2", 3, "'**' is not an operator")]
    [InlineData("x # y", 3, "unexpected character '#'")]
    [InlineData("x + 1e", 6, "malformed number")]
    [InlineData("2x", 2, "write an explicit '*'")]
    [InlineData("z + 1", 1, "unknown name 'z'")]
    [InlineData("sin(x)", 1, "unknown function 'sin'")]
    [InlineData("x(2)", 1, "'x' is a variable, not a function")]
    [InlineData("log + x", 1, "needs its arguments in parentheses")]
    [InlineData("min(x)", 1, "takes 2 arguments, got 1")]
    [InlineData("abs(x, y)", 1, "takes 1 argument, got 2")]
    [InlineData("max(x, y", 9, "missing ')' to close the call of 'max'")]
    [InlineData("[rain + y", 1, "never closed")]
    [InlineData("[] + y", 1, "empty column name")]
    [InlineData("x ] y", 3, "']' without a matching '['")]
    [InlineData("x + ()", 6, "unexpected ')'")]
    [InlineData("1e999 * x", 1, "too large")]
    public void ErrorsNameThePositionAndTheProblem(string expr, int position, string fragment)
    {
        var node = ExpressionParser.TryParse(expr, null, null, out var error);
        Assert.Null(node);
        Assert.NotNull(error);
        Assert.Equal(position, error!.Position);
        Assert.Contains(fragment, error.Description);
        Assert.Contains($"position {position}", error.Message);
        Assert.DoesNotContain('\n', error.Message);
        // The caret sits under the character at the position.
        Assert.Equal(position - 1, error.CaretLine.Length - 1 - 2);
        var thrown = Assert.Throws<PairFitInputException>(() => ExpressionParser.Parse(expr));
        Assert.Equal(error.Message, thrown.Message);
    }

    [Fact]
    public void HundredThousandCharacterInputIsRejectedByLength()
    {
        string huge = string.Concat(Enumerable.Repeat("x+", 50_000)); // 100,000 characters
        var ex = Assert.Throws<PairFitInputException>(() => ExpressionParser.Parse(huge));
        Assert.Contains("100000 characters long; the limit is 1000", ex.Message);
        Assert.True(ex.Message.Length < 300, "the message must not echo the whole input");
    }

    [Fact]
    public void TenThousandDeepParenthesesAreRejectedWithoutStackOverflow()
    {
        string deep = new string('(', 10_000) + "x" + new string(')', 10_000);
        Assert.Throws<PairFitInputException>(() => ExpressionParser.Parse(deep));
        // Within the length limit the depth bound is what stops it.
        string nested = new string('(', 400) + "x" + new string(')', 400);
        var ex = Assert.Throws<PairFitInputException>(() => ExpressionParser.Parse(nested));
        Assert.Contains($"nested more than {ExpressionParser.MaxDepth} levels", ex.Message);
        Assert.Contains($"position {ExpressionParser.MaxDepth + 1}", ex.Message);
    }

    [Theory]
    [InlineData(500, "-")]      // a chain of unary minus signs
    [InlineData(300, "2^")]     // a right-associative power chain
    [InlineData(150, "abs(")]   // nested calls
    public void OtherDeepChainsHitTheDepthBound(int count, string piece)
    {
        string expr = string.Concat(Enumerable.Repeat(piece, count)) + "x" + (piece == "abs(" ? new string(')', count) : "");
        var ex = Assert.Throws<PairFitInputException>(() => ExpressionParser.Parse(expr));
        Assert.Contains("nested more than", ex.Message);
    }

    [Fact]
    public void NestingAtTheLimitIsAccepted()
    {
        string ok = new string('(', ExpressionParser.MaxDepth) + "x" + new string(')', ExpressionParser.MaxDepth);
        Assert.Equal(4, Eval(ok, 4, 0));
    }
}
