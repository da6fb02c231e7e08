namespace PairFit.Core.Projection;

/// <summary>A value with its derivative with respect to q (forward-mode automatic differentiation).</summary>
public readonly record struct Dual(double Value, double Derivative)
{
    public static Dual Constant(double v) => new(v, 0.0);
}

/// <summary>An interval [Lo, Hi] of y whose end points move with q at the rates held in their derivatives.</summary>
public readonly record struct DualInterval(Dual Lo, Dual Hi);

/// <summary>
/// Solves g(x, y) ∈ I for y at fixed x, exactly, when y occurs once in g. The path from the root
/// to y is a chain of steps t = φ(b; s) where b is the child holding y and s the sibling value
/// (a function of x only). Each φ is split into monotone branches; the preimage of an interval
/// under a monotone branch is an interval, found by the branch's inverse, so the set
/// {y : g(x, y) ∈ I} is a finite union of intervals. Carrying the derivative with respect to q
/// along gives ∂y/∂q at the end points, i.e. the Jacobian of the delta-function identity
/// f_Q(q) = ∫ f(x, y(x, q)) |∂y/∂q| dx. Flat pieces (min, max, multiplication by 0) give atoms
/// at fixed x; they are handled exactly in the probabilities but have no point density.
/// </summary>
public sealed class InversionChain
{
    internal enum StepKind { Negate, AddSibling, SiblingMinus, MinusSibling, TimesSibling, OverSibling, SiblingOver, PowerOfSibling, SiblingToPower, Exp, Log, Sqrt, Abs, Min, Max }

    internal readonly record struct Step(StepKind Kind, CompiledExpression? Sibling);

    private readonly Step[] _steps;

    private InversionChain(Step[] steps, bool hasFlatPieces)
    {
        _steps = steps;
        HasFlatPieces = hasFlatPieces;
    }

    /// <summary>Number of steps; sibling values are passed as an array of this length.</summary>
    public int Length => _steps.Length;

    /// <summary>True when some step can be constant in y (min, max, power with a varying sign of the base): the density then needs the CDF's derivative.</summary>
    public bool HasFlatPieces { get; }

    /// <summary>The chain, or null when y does not occur exactly once.</summary>
    public static InversionChain? TryBuild(ExpressionNode root)
    {
        root = CompiledExpression.Fold(root);
        if (root.Occurrences(ExpressionVariable.Y) != 1) return null;
        var steps = new List<Step>();
        bool flat = false;
        var node = root;
        while (node is not VariableNode)
        {
            switch (node)
            {
                case NegateNode n:
                    steps.Add(new Step(StepKind.Negate, null));
                    node = n.Operand;
                    break;
                case BinaryNode b:
                {
                    bool yLeft = b.Left.Occurrences(ExpressionVariable.Y) == 1;
                    var sibling = new CompiledExpression(yLeft ? b.Right : b.Left);
                    var kind = (b.Operator, yLeft) switch
                    {
                        ('+', _) => StepKind.AddSibling,
                        ('-', true) => StepKind.MinusSibling,
                        ('-', false) => StepKind.SiblingMinus,
                        ('*', _) => StepKind.TimesSibling,
                        ('/', true) => StepKind.OverSibling,
                        ('/', false) => StepKind.SiblingOver,
                        ('^', true) => StepKind.PowerOfSibling,
                        _ => StepKind.SiblingToPower,
                    };
                    flat |= kind is StepKind.TimesSibling or StepKind.PowerOfSibling or StepKind.SiblingToPower && IsConstant(yLeft ? b.Right : b.Left, out double c) && (c == 0 || (kind == StepKind.SiblingToPower && c == 1));
                    steps.Add(new Step(kind, sibling));
                    node = yLeft ? b.Left : b.Right;
                    break;
                }
                case CallNode c when c.Arguments.Count == 1:
                    steps.Add(new Step(c.Function switch
                    {
                        "exp" => StepKind.Exp, "log" => StepKind.Log, "sqrt" => StepKind.Sqrt, _ => StepKind.Abs,
                    }, null));
                    node = c.Arguments[0];
                    break;
                case CallNode c:
                {
                    bool yFirst = c.Arguments[0].Occurrences(ExpressionVariable.Y) == 1;
                    steps.Add(new Step(c.Function == "min" ? StepKind.Min : StepKind.Max, new CompiledExpression(c.Arguments[yFirst ? 1 : 0])));
                    flat = true;
                    node = c.Arguments[yFirst ? 0 : 1];
                    break;
                }
                default:
                    return null;
            }
        }
        var chain = new InversionChain(steps.ToArray(), flat);
        // Each two-branch step may double the number of intervals; beyond this the stack buffers
        // would grow too large, and Monte Carlo is the better tool anyway.
        return chain.DoublingSteps > MaxDoublingSteps ? null : chain;
    }

    private static bool IsConstant(ExpressionNode n, out double value)
    {
        value = n is NumberNode k ? k.Value : double.NaN;
        return n is NumberNode;
    }

    /// <summary>Sibling values at x (they depend on x only); NaN for steps without a sibling.</summary>
    public void Siblings(double x, Span<double> values)
    {
        for (int i = 0; i < _steps.Length; i++)
            values[i] = _steps[i].Sibling?.Evaluate(x, 0.0) ?? double.NaN;
    }

    /// <summary>
    /// Sibling functions whose sign changes make the preimage jump as x varies (multiplier,
    /// divisor, power base or exponent): the quadrature puts a break point where they cross 0
    /// (and 1 for a base).
    /// </summary>
    public IEnumerable<(int Step, double Level)> JumpLevels()
    {
        for (int i = 0; i < _steps.Length; i++)
        {
            switch (_steps[i].Kind)
            {
                case StepKind.TimesSibling or StepKind.OverSibling or StepKind.SiblingOver or StepKind.PowerOfSibling:
                    yield return (i, 0.0);
                    break;
                case StepKind.SiblingToPower:
                    yield return (i, 0.0);
                    yield return (i, 1.0);
                    break;
            }
        }
    }

    /// <summary>
    /// Writes into <paramref name="result"/> the y-intervals whose union is {y : g(x, y) ∈ target}
    /// and returns how many. <paramref name="scratch"/> must be as long as <paramref name="result"/>.
    /// </summary>
    public int Preimage(DualInterval target, ReadOnlySpan<double> siblings, Span<DualInterval> result, Span<DualInterval> scratch)
        => Preimage(target, siblings, result, scratch, out _);

    /// <summary>
    /// As above; <paramref name="flatMask"/> has bit k set when a flat piece of step k took part.
    /// Where the mask changes as x moves, the probability jumps, so the quadrature cuts there.
    /// </summary>
    public int Preimage(DualInterval target, ReadOnlySpan<double> siblings, Span<DualInterval> result, Span<DualInterval> scratch, out ulong flatMask)
    {
        flatMask = 0;
        var current = result;
        var next = scratch;
        current[0] = target;
        int count = 1;
        for (int i = 0; i < _steps.Length && count > 0; i++)
        {
            int produced = 0;
            bool fired = false;
            for (int k = 0; k < count; k++)
                produced = StepPreimage(_steps[i].Kind, siblings[i], current[k], next, produced, ref fired);
            if (fired) flatMask |= 1UL << Math.Min(i, 63);
            var swap = current;
            current = next;
            next = swap;
            count = produced;
        }
        if (_steps.Length % 2 == 1) current[..count].CopyTo(result);
        return count;
    }

    /// <summary>Largest number of intervals a preimage can have: each step with two branches (or a branch and a flat piece) may double it.</summary>
    public int MaxIntervals => 1 << Math.Min(DoublingSteps, MaxDoublingSteps);

    private const int MaxDoublingSteps = 8;

    private int DoublingSteps
    {
        get
        {
            int doubling = 0;
            foreach (var s in _steps)
                if (s.Kind is StepKind.SiblingOver or StepKind.Abs or StepKind.Min or StepKind.Max or StepKind.PowerOfSibling) doubling++;
            return doubling;
        }
    }

    private static int StepPreimage(StepKind kind, double s, DualInterval t, Span<DualInterval> output, int n, ref bool fired)
    {
        const double Inf = double.PositiveInfinity;
        switch (kind)
        {
            case StepKind.Negate: return Branch(t, -Inf, Inf, InverseKind.Negate, 0, output, n);
            case StepKind.AddSibling: return Branch(t, -Inf, Inf, InverseKind.Shift, -s, output, n);
            case StepKind.MinusSibling: return Branch(t, -Inf, Inf, InverseKind.Shift, s, output, n);
            case StepKind.SiblingMinus: return Branch(t, -Inf, Inf, InverseKind.Reflect, s, output, n);
            case StepKind.TimesSibling:
                if (double.IsNaN(s) || double.IsInfinity(s)) return n;
                if (s == 0) return AllOrNothing(t, 0.0, -Inf, Inf, output, n, ref fired);
                return Branch(t, -Inf, Inf, InverseKind.Scale, 1 / s, output, n);
            case StepKind.OverSibling:
                if (double.IsNaN(s) || s == 0 || double.IsInfinity(s)) return n;
                return Branch(t, -Inf, Inf, InverseKind.Scale, s, output, n);
            case StepKind.SiblingOver:
                if (double.IsNaN(s) || double.IsInfinity(s)) return n;
                if (s == 0) return AllOrNothing(t, 0.0, -Inf, Inf, output, n, ref fired);
                // b > 0 gives t of the sign of s, b < 0 the other sign; b = s/t on both.
                n = Branch(t, s > 0 ? 0.0 : -Inf, s > 0 ? Inf : -0.0, InverseKind.Reciprocal, s, output, n);
                return Branch(t, s > 0 ? -Inf : 0.0, s > 0 ? -0.0 : Inf, InverseKind.Reciprocal, s, output, n);
            case StepKind.PowerOfSibling:
                if (double.IsNaN(s) || double.IsInfinity(s)) return n;
                if (s == 0) return AllOrNothing(t, 1.0, -Inf, Inf, output, n, ref fired);
                n = Branch(t, 0.0, Inf, InverseKind.Root, s, output, n);
                if (Math.Floor(s) == s && Math.Abs(s) < 1e15)
                {
                    bool even = Math.Abs(s % 2) == 0;
                    n = even
                        ? Branch(t, 0.0, Inf, InverseKind.NegativeRoot, s, output, n)
                        : Branch(t, -Inf, -0.0, InverseKind.NegativeOddRoot, s, output, n);
                }
                return n;
            case StepKind.SiblingToPower:
                if (!(s > 0) || double.IsInfinity(s)) return n;
                if (s == 1) return AllOrNothing(t, 1.0, -Inf, Inf, output, n, ref fired);
                return Branch(t, 0.0, Inf, InverseKind.LogBase, Math.Log(s), output, n);
            case StepKind.Exp: return Branch(t, 0.0, Inf, InverseKind.Log, 0, output, n);
            case StepKind.Log: return Branch(t, -Inf, Inf, InverseKind.Exp, 0, output, n);
            case StepKind.Sqrt: return Branch(t, 0.0, Inf, InverseKind.Square, 0, output, n);
            case StepKind.Abs:
                n = Branch(t, 0.0, Inf, InverseKind.Identity, 0, output, n);
                return Branch(t, 0.0, Inf, InverseKind.Negate, 0, output, n);
            case StepKind.Min:
                if (double.IsNaN(s)) return n;
                // b < s: t = b; b ≥ s: t = s whatever b is.
                n = Branch(t, -Inf, s, InverseKind.Identity, 0, output, n);
                return AllOrNothing(t, s, s, Inf, output, n, ref fired);
            default: // Max
                if (double.IsNaN(s)) return n;
                n = AllOrNothing(t, s, -Inf, s, output, n, ref fired);
                return Branch(t, s, Inf, InverseKind.Identity, 0, output, n);
        }
    }

    private enum InverseKind { Identity, Negate, Shift, Reflect, Scale, Reciprocal, Root, NegativeRoot, NegativeOddRoot, LogBase, Log, Exp, Square }

    /// <summary>Adds [lo, hi] (b values) when the step's value is the constant c on that range of b and c lies in t.</summary>
    private static int AllOrNothing(DualInterval t, double c, double lo, double hi, Span<DualInterval> output, int n, ref bool fired)
    {
        if (t.Lo.Value <= c && c <= t.Hi.Value && lo < hi)
        {
            output[n++] = new DualInterval(Dual.Constant(lo), Dual.Constant(hi));
            fired = true;
        }
        return n;
    }

    /// <summary>
    /// Preimage of t under one monotone branch whose values fill (rangeLo, rangeHi): clip t to the
    /// range (clipped ends do not move with q), map both ends through the inverse, order them.
    /// </summary>
    private static int Branch(DualInterval t, double rangeLo, double rangeHi, InverseKind inverse, double p, Span<DualInterval> output, int n)
    {
        var lo = t.Lo.Value > rangeLo ? t.Lo : Dual.Constant(rangeLo);
        var hi = t.Hi.Value < rangeHi ? t.Hi : Dual.Constant(rangeHi);
        if (!(lo.Value < hi.Value)) return n;
        var a = Invert(inverse, p, lo);
        var b = Invert(inverse, p, hi);
        if (double.IsNaN(a.Value) || double.IsNaN(b.Value)) return n;
        output[n++] = a.Value <= b.Value ? new DualInterval(a, b) : new DualInterval(b, a);
        return n;
    }

    private static Dual Invert(InverseKind kind, double p, Dual t)
    {
        double v = t.Value;
        double value = kind switch
        {
            InverseKind.Identity => v,
            InverseKind.Negate => -v,
            InverseKind.Shift => v + p,
            InverseKind.Reflect => p - v,
            InverseKind.Scale => v * p,
            InverseKind.Reciprocal => p / v,
            InverseKind.Root => Math.Pow(v, 1 / p),
            InverseKind.NegativeRoot => -Math.Pow(v, 1 / p),
            InverseKind.NegativeOddRoot => -Math.Pow(-v, 1 / p),
            InverseKind.LogBase => Math.Log(v) / p,
            InverseKind.Log => Math.Log(v),
            InverseKind.Exp => Math.Exp(v),
            _ => v * v,
        };
        if (t.Derivative == 0 || !double.IsFinite(v) || !double.IsFinite(value)) return Dual.Constant(value);
        double slope = kind switch
        {
            InverseKind.Identity => 1,
            InverseKind.Negate => -1,
            InverseKind.Shift => 1,
            InverseKind.Reflect => -1,
            InverseKind.Scale => p,
            InverseKind.Reciprocal => -p / (v * v),
            InverseKind.Root => value / (p * v),
            InverseKind.NegativeRoot => value / (p * v),
            InverseKind.NegativeOddRoot => value / (p * v),
            InverseKind.LogBase => 1 / (v * p),
            InverseKind.Log => 1 / v,
            InverseKind.Exp => value,
            _ => 2 * v,
        };
        return new Dual(value, double.IsFinite(slope) ? slope * t.Derivative : 0.0);
    }
}
