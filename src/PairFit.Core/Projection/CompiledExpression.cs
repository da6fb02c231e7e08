namespace PairFit.Core.Projection;

/// <summary>
/// An expression turned into a flat postfix program over a value stack: no delegates, no
/// code generation, only a loop over op codes. Constant sub-expressions are folded once.
/// Evaluates one pair, or many pairs at a time (each op sweeps a block of values, which keeps
/// the inner loops tight for Monte Carlo samples).
/// </summary>
public sealed class CompiledExpression
{
    private enum Op : byte { Constant, X, Y, Negate, Add, Subtract, Multiply, Divide, Power, Min, Max, Abs, Log, Exp, Sqrt }

    private const int BlockSize = 1024;

    private readonly Op[] _ops;
    private readonly double[] _constants; // parallel to _ops, used by Op.Constant
    private readonly int _stackDepth;

    public CompiledExpression(ExpressionNode root)
    {
        var ops = new List<Op>();
        var constants = new List<double>();
        int depth = 0, maxDepth = 0;
        Emit(Fold(root), ops, constants, ref depth, ref maxDepth);
        _ops = ops.ToArray();
        _constants = constants.ToArray();
        _stackDepth = Math.Max(1, maxDepth);
        NodeCount = _ops.Length;
    }

    /// <summary>Number of operations after constant folding.</summary>
    public int NodeCount { get; }

    /// <summary>Replaces every sub-tree without variables by its value.</summary>
    public static ExpressionNode Fold(ExpressionNode node)
    {
        if (node.Occurrences(ExpressionVariable.X) + node.Occurrences(ExpressionVariable.Y) == 0 && node is not NumberNode)
            return new NumberNode(node.Position, new CompiledExpression(node, folded: true).Evaluate(0, 0));
        return node switch
        {
            NegateNode n => n with { Operand = Fold(n.Operand) },
            BinaryNode b => b with { Left = Fold(b.Left), Right = Fold(b.Right) },
            CallNode c => c with { Arguments = c.Arguments.Select(Fold).ToArray() },
            _ => node,
        };
    }

    // Used by Fold for variable-free sub-trees (no further folding needed there).
    private CompiledExpression(ExpressionNode root, bool folded)
    {
        _ = folded;
        var ops = new List<Op>();
        var constants = new List<double>();
        int depth = 0, maxDepth = 0;
        Emit(root, ops, constants, ref depth, ref maxDepth);
        _ops = ops.ToArray();
        _constants = constants.ToArray();
        _stackDepth = Math.Max(1, maxDepth);
        NodeCount = _ops.Length;
    }

    private static void Emit(ExpressionNode node, List<Op> ops, List<double> constants, ref int depth, ref int maxDepth)
    {
        switch (node)
        {
            case NumberNode n: Push(Op.Constant, n.Value); break;
            case VariableNode v: Push(v.Variable == ExpressionVariable.X ? Op.X : Op.Y, 0); break;
            case NegateNode n:
                Emit(n.Operand, ops, constants, ref depth, ref maxDepth);
                ops.Add(Op.Negate); constants.Add(0);
                break;
            case BinaryNode b:
                Emit(b.Left, ops, constants, ref depth, ref maxDepth);
                Emit(b.Right, ops, constants, ref depth, ref maxDepth);
                ops.Add(b.Operator switch
                {
                    '+' => Op.Add, '-' => Op.Subtract, '*' => Op.Multiply, '/' => Op.Divide, '^' => Op.Power,
                    _ => throw new InvalidOperationException($"operator '{b.Operator}'"),
                });
                constants.Add(0);
                depth--;
                break;
            case CallNode c:
                foreach (var a in c.Arguments) Emit(a, ops, constants, ref depth, ref maxDepth);
                ops.Add(c.Function switch
                {
                    "min" => Op.Min, "max" => Op.Max, "abs" => Op.Abs, "log" => Op.Log, "exp" => Op.Exp, "sqrt" => Op.Sqrt,
                    _ => throw new InvalidOperationException($"function '{c.Function}'"),
                });
                constants.Add(0);
                depth -= c.Arguments.Count - 1;
                break;
            default:
                throw new InvalidOperationException(node.GetType().Name);
        }

        void Push(Op op, double value)
        {
            ops.Add(op);
            constants.Add(value);
        }
        if (node is NumberNode or VariableNode) { depth++; maxDepth = Math.Max(maxDepth, depth); }
    }

    /// <summary>g(x, y); NaN where the expression is undefined (log of a negative, 0/0, ...).</summary>
    public double Evaluate(double x, double y)
    {
        Span<double> stack = _stackDepth <= 64 ? stackalloc double[_stackDepth] : new double[_stackDepth];
        int top = -1;
        for (int i = 0; i < _ops.Length; i++)
        {
            switch (_ops[i])
            {
                case Op.Constant: stack[++top] = _constants[i]; break;
                case Op.X: stack[++top] = x; break;
                case Op.Y: stack[++top] = y; break;
                case Op.Negate: stack[top] = -stack[top]; break;
                case Op.Abs: stack[top] = Math.Abs(stack[top]); break;
                case Op.Log: stack[top] = Math.Log(stack[top]); break;
                case Op.Exp: stack[top] = Math.Exp(stack[top]); break;
                case Op.Sqrt: stack[top] = Math.Sqrt(stack[top]); break;
                default:
                    double b = stack[top--];
                    stack[top] = Binary(_ops[i], stack[top], b);
                    break;
            }
        }
        return stack[0];
    }

    private static double Binary(Op op, double a, double b) => op switch
    {
        Op.Add => a + b,
        Op.Subtract => a - b,
        Op.Multiply => a * b,
        Op.Divide => a / b,
        Op.Power => Math.Pow(a, b),
        Op.Min => double.IsNaN(a) || double.IsNaN(b) ? double.NaN : Math.Min(a, b),
        _ => double.IsNaN(a) || double.IsNaN(b) ? double.NaN : Math.Max(a, b),
    };

    /// <summary>result[i] = g(x[i], y[i]) for every i, block by block.</summary>
    public void Evaluate(ReadOnlySpan<double> x, ReadOnlySpan<double> y, Span<double> result)
    {
        if (x.Length != y.Length || result.Length < x.Length)
            throw new ArgumentException("x, y and result must have the same length.");
        var stack = new double[_stackDepth * BlockSize];
        for (int start = 0; start < x.Length; start += BlockSize)
        {
            int n = Math.Min(BlockSize, x.Length - start);
            EvaluateBlock(x.Slice(start, n), y.Slice(start, n), stack, n);
            stack.AsSpan(0, n).CopyTo(result.Slice(start, n));
        }
    }

    private void EvaluateBlock(ReadOnlySpan<double> x, ReadOnlySpan<double> y, double[] stack, int n)
    {
        int top = -1;
        for (int i = 0; i < _ops.Length; i++)
        {
            var op = _ops[i];
            switch (op)
            {
                case Op.Constant: stack.AsSpan(++top * BlockSize, n).Fill(_constants[i]); continue;
                case Op.X: x.CopyTo(stack.AsSpan(++top * BlockSize, n)); continue;
                case Op.Y: y.CopyTo(stack.AsSpan(++top * BlockSize, n)); continue;
            }
            if (op is Op.Negate or Op.Abs or Op.Log or Op.Exp or Op.Sqrt)
            {
                var s = stack.AsSpan(top * BlockSize, n);
                switch (op)
                {
                    case Op.Negate: for (int k = 0; k < n; k++) s[k] = -s[k]; break;
                    case Op.Abs: for (int k = 0; k < n; k++) s[k] = Math.Abs(s[k]); break;
                    case Op.Log: for (int k = 0; k < n; k++) s[k] = Math.Log(s[k]); break;
                    case Op.Exp: for (int k = 0; k < n; k++) s[k] = Math.Exp(s[k]); break;
                    default: for (int k = 0; k < n; k++) s[k] = Math.Sqrt(s[k]); break;
                }
                continue;
            }
            var b = stack.AsSpan(top * BlockSize, n);
            top--;
            var a = stack.AsSpan(top * BlockSize, n);
            switch (op)
            {
                case Op.Add: for (int k = 0; k < n; k++) a[k] += b[k]; break;
                case Op.Subtract: for (int k = 0; k < n; k++) a[k] -= b[k]; break;
                case Op.Multiply: for (int k = 0; k < n; k++) a[k] *= b[k]; break;
                case Op.Divide: for (int k = 0; k < n; k++) a[k] /= b[k]; break;
                default: for (int k = 0; k < n; k++) a[k] = Binary(op, a[k], b[k]); break;
            }
        }
    }
}
