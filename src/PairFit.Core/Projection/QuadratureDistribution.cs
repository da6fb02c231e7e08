using PairFit.Core.Common;
using PairFit.Core.Copulas;
using PairFit.Core.Model;

namespace PairFit.Core.Projection;

/// <summary>
/// The law of Q = g(X, Y) by exact one-dimensional quadrature, for expressions in which y
/// occurs once (see <see cref="InversionChain"/>). Conditioning on X and integrating in
/// u = F_X(x), which maps any support to (0, 1) and turns f_X dx into du:
///   P(Q ∈ I) = ∫₀¹ P(Y ∈ S(x(u), I) | U = u) du,  P(Y ≤ y | U = u) = h(F_Y(y) | u),
///   f_Q(q)   = ∫₀¹ Σ_ends ± c(u, F_Y(y_e)) f_Y(y_e) ∂y_e/∂q du,
/// the delta-function identity f_Q(q) = ∫∫ δ(g(x, y) − q) f(x, y) dx dy written through the
/// copula density and the marginal density, with S(x, I) = {y : g(x, y) ∈ I} a union of intervals.
/// The integrand of a probability lies in [0, 1], so cutting (0, 1) to [1e−300, 1 − 2⁻⁵³] (the
/// largest double below 1) costs at most 1.2e−16. Panels are graded towards both ends and split where the preimage jumps.
/// </summary>
public sealed class QuadratureDistribution
{
    private static readonly double[] GradedBreaks =
    [
        1e-300, 1e-16, 1e-9, 1e-5, 1e-3, 0.02, 0.1, 0.3, 0.5, 0.7, 0.9, 0.98, 0.999,
        1 - 1e-5, 1 - 1e-9, 1 - 1e-13, 1 - 1.0 / (1L << 53),
    ];

    // Absolute tolerance far below any probability of interest, so that small tail probabilities
    // are computed to the relative tolerance; QUADPACK's round-off floor stops needless refinement.
    private const double AbsoluteTolerance = 1e-15;
    private const double RelativeTolerance = 1e-9;

    // For figure grids and integrals over many CDF values, where 1e−7 is far below what shows.
    private const double CoarseAbsoluteTolerance = 1e-12;
    private const double CoarseRelativeTolerance = 1e-7;

    private readonly JointModel _model;
    private readonly InversionChain _chain;
    private readonly PanelSet _panels;
    private readonly int _maxIntervals;
    private readonly ICopula _flippedY;      // copula of (U, 1 − V)

    public QuadratureDistribution(JointModel model, InversionChain chain)
    {
        _model = model;
        _chain = chain;
        _maxIntervals = Math.Max(4, chain.MaxIntervals);
        _flippedY = FlipV(model.Copula);
        var jumps = JumpPoints(model, chain);
        // One panel layout for both tolerances: fewer starting panels for the coarse tolerance were
        // tried and cost more refinements than they saved (ratio on a Clayton model: +20 % integrand calls).
        _panels = new PanelSet(model, chain, GradedBreaks, jumps);
    }

    /// <summary>
    /// Starting panels (graded ends plus the jumps of <see cref="JumpPoints"/>, each with
    /// geometric grading towards it) and x(u) and the sibling values at their 15 nodes, computed
    /// once and reused by every integral, whatever q.
    /// </summary>
    private sealed class PanelSet
    {
        public readonly double[] Breaks;
        public readonly double[] NodeU;        // 15 per panel
        public readonly double[] NodeSiblings; // Width per node
        public readonly int[] NodeOrder;       // node indices sorted by u
        private readonly int _width, _length;

        public PanelSet(JointModel model, InversionChain chain, double[] graded, List<double> jumps)
        {
            var breaks = new List<double>(graded);
            foreach (double root in jumps)
            {
                // Near a zero of a divisor or multiplier the integrand can have a spike as narrow as
                // the tail probability being computed (the ratio's far tail lives within |x| ≲ |y/q|),
                // which a coarse panel would step over; grade the panels geometrically towards it.
                breaks.Add(root);
                for (double d = 1e-2; d > 1e-13; d *= 1e-2)
                {
                    if (root - d > graded[0]) breaks.Add(root - d);
                    if (root + d < graded[^1]) breaks.Add(root + d);
                }
            }
            breaks.Sort();
            var distinct = new List<double> { breaks[0] };
            foreach (double b in breaks.Skip(1))
                if (b - distinct[^1] > 1e-14) distinct.Add(b);
            Breaks = distinct.ToArray();
            _length = chain.Length;
            _width = Math.Max(1, chain.Length);
            int panels = Breaks.Length - 1;
            NodeU = new double[15 * panels];
            NodeSiblings = new double[15 * panels * _width];
            for (int p = 0; p < panels; p++)
                AdaptiveQuadrature.Nodes(Breaks[p], Breaks[p + 1], NodeU.AsSpan(15 * p, 15));
            for (int i = 0; i < NodeU.Length; i++)
                chain.Siblings(model.X.Quantile(NodeU[i]), NodeSiblings.AsSpan(i * _width, _length));
            NodeOrder = Enumerable.Range(0, NodeU.Length).OrderBy(i => NodeU[i]).ToArray();
        }

        public ReadOnlySpan<double> Siblings(int node) => NodeSiblings.AsSpan(node * _width, _length);
    }

    /// <summary>P(Q ≤ q).</summary>
    public double Cdf(double q, bool coarse = false) => Probability(new DualInterval(Dual.Constant(double.NegativeInfinity), new Dual(q, 1.0)), coarse);

    /// <summary>P(Q &gt; q), integrated directly so that small tail probabilities keep their relative accuracy.</summary>
    public double Survival(double q, bool coarse = false) => Probability(new DualInterval(new Dual(q, 1.0), Dual.Constant(double.PositiveInfinity)), coarse);

    /// <summary>P(Q is defined), below 1 when g is undefined on part of the support (log of a negative, 0/0).</summary>
    public double DefinedProbability() => Probability(new DualInterval(Dual.Constant(double.NegativeInfinity), Dual.Constant(double.PositiveInfinity)));

    /// <summary>f_Q(q) by the delta-function identity, or by differentiating the CDF where g has flat pieces in y.</summary>
    public double Density(double q, double step, bool coarse = false)
    {
        if (_chain.HasFlatPieces)
            return Math.Max(0.0, (Cdf(q + step) - Cdf(q - step)) / (2 * step));
        var target = new DualInterval(Dual.Constant(double.NegativeInfinity), new Dual(q, 1.0));
        var set = _panels;
        return Math.Max(0.0, Integrate(target, set, u => DensityIntegrand(u, target),
            i => ConditionalDensity(set.NodeU[i], set.Siblings(i), target), coarse));
    }

    /// <summary>
    /// CDF and density at <paramref name="points"/> even steps from <paramref name="lo"/> to
    /// <paramref name="hi"/> (coarse tolerance, for figures). Points are independent, so they run
    /// in parallel; each result depends only on its q, never on the thread that computed it.
    /// </summary>
    public (double[] Values, double[] Cdf, double[] Density) Grid(double lo, double hi, int points)
    {
        var values = new double[points];
        var cdf = new double[points];
        var density = new double[points];
        double step = (hi - lo) / (points - 1);
        Parallel.For(0, points, i =>
        {
            double q = lo + i * step;
            values[i] = q;
            if (_chain.HasFlatPieces)
            {
                cdf[i] = Cdf(q, coarse: true);
                density[i] = Density(q, 0.5 * step, coarse: true);
                return;
            }
            var target = new DualInterval(Dual.Constant(double.NegativeInfinity), new Dual(q, 1.0));
            var set = _panels;
            var initialP = new double[set.NodeU.Length];
            var initialF = new double[set.NodeU.Length];
            for (int k = 0; k < initialP.Length; k++)
                Conditional(set.NodeU[k], set.Siblings(k), target, wantDensity: true, out initialP[k], out initialF[k]);
            cdf[i] = Math.Clamp(AdaptiveQuadrature.Integrate(u => ProbabilityIntegrand(u, target), set.Breaks,
                CoarseAbsoluteTolerance, CoarseRelativeTolerance, initial: initialP), 0.0, 1.0);
            density[i] = Math.Max(0.0, AdaptiveQuadrature.Integrate(u => DensityIntegrand(u, target), set.Breaks,
                CoarseAbsoluteTolerance, CoarseRelativeTolerance, initial: initialF));
        });
        return (values, cdf, density);
    }

    private double Probability(DualInterval target, bool coarse = false)
    {
        var set = _panels;
        return Math.Clamp(Integrate(target, set, u => ProbabilityIntegrand(u, target),
            i => ConditionalProbability(set.NodeU[i], set.Siblings(i), target), coarse), 0.0, 1.0);
    }

    private double Integrate(DualInterval target, PanelSet set, Func<double, double> atU, Func<int, double> atNode, bool coarse)
    {
        double absolute = coarse ? CoarseAbsoluteTolerance : AbsoluteTolerance;
        double relative = coarse ? CoarseRelativeTolerance : RelativeTolerance;
        var jumps = _chain.HasFlatPieces ? FlatPieceJumps(target, set) : null;
        if (jumps is { Count: > 0 })
        {
            var breaks = new List<double>(set.Breaks);
            breaks.AddRange(jumps);
            breaks.Sort();
            return AdaptiveQuadrature.Integrate(atU, breaks.ToArray(), absolute, relative);
        }
        var initial = new double[set.NodeU.Length];
        for (int i = 0; i < initial.Length; i++) initial[i] = atNode(i);
        return AdaptiveQuadrature.Integrate(atU, set.Breaks, absolute, relative, initial: initial);
    }

    /// <summary>
    /// Where a flat piece (min, max, ...) switches on or off as x moves, the conditional
    /// probability jumps at a place that depends on q. Such places show up as a change of the
    /// preimage's layout (which flat pieces took part, how many intervals) between neighbouring
    /// precomputed nodes; each is then located by bisection in u and made a panel end, so no
    /// panel straddles a jump.
    /// </summary>
    private List<double> FlatPieceJumps(DualInterval target, PanelSet set)
    {
        var jumps = new List<double>();
        Span<DualInterval> a = stackalloc DualInterval[_maxIntervals];
        Span<DualInterval> b = stackalloc DualInterval[_maxIntervals];
        Span<double> siblings = stackalloc double[Math.Max(1, _chain.Length)];
        (ulong, int) Layout(ReadOnlySpan<double> s, Span<DualInterval> r, Span<DualInterval> t)
        {
            int n = _chain.Preimage(target, s, r, t, out ulong mask);
            return (mask, n);
        }
        var previous = Layout(set.Siblings(set.NodeOrder[0]), a, b);
        for (int k = 1; k < set.NodeOrder.Length; k++)
        {
            var current = Layout(set.Siblings(set.NodeOrder[k]), a, b);
            if (current != previous)
            {
                double lo = set.NodeU[set.NodeOrder[k - 1]], hi = set.NodeU[set.NodeOrder[k]];
                for (int it = 0; it < 64 && hi - lo > 1e-15 * Math.Max(1.0, hi); it++)
                {
                    double mid = 0.5 * (lo + hi);
                    _chain.Siblings(_model.X.Quantile(mid), siblings);
                    if (Layout(siblings, a, b) == previous) lo = mid; else hi = mid;
                }
                jumps.Add(0.5 * (lo + hi));
            }
            previous = current;
        }
        return jumps;
    }

    private double ProbabilityIntegrand(double u, DualInterval target)
    {
        Span<double> siblings = stackalloc double[Math.Max(1, _chain.Length)];
        _chain.Siblings(_model.X.Quantile(u), siblings);
        return ConditionalProbability(u, siblings, target);
    }

    private double DensityIntegrand(double u, DualInterval target)
    {
        Span<double> siblings = stackalloc double[Math.Max(1, _chain.Length)];
        _chain.Siblings(_model.X.Quantile(u), siblings);
        return ConditionalDensity(u, siblings, target);
    }

    /// <summary>
    /// The copula of (U, 1 − V), a rotation of the same family: flipping V composes with the
    /// model's rotation as 0 → 270, 90 → 180, 180 → 90, 270 → 0 (Joe 2014, section 1.7). Its
    /// conditional CDF at the marginal survival S_Y(y) gives P(Y &gt; y | U = u) without the
    /// cancellation of 1 − h(F_Y(y) | u), which matters for small exceedance probabilities.
    /// </summary>
    private static ICopula FlipV(ICopula copula) => copula switch
    {
        IndependenceLaw => copula,
        RotatedCopula r => RotatedCopula.Rotate(r.Inner, r.Rotation switch { 90 => 180, 180 => 90, _ => 0 }),
        _ when copula.Rotation == 0 => RotatedCopula.Rotate(copula, 270),
        _ => throw new ArgumentException($"copula rotation {copula.Rotation} without a RotatedCopula wrapper."),
    };

    /// <summary>
    /// P(g(x, Y) ∈ target | U = u) = Σ over preimage intervals of P(lo &lt; Y ≤ hi | U = u), from the
    /// conditional CDF h(F_Y(·) | u) in the lower half of Y and from the conditional survival in the upper half.
    /// </summary>
    private double ConditionalProbability(double u, ReadOnlySpan<double> siblings, DualInterval target)
    {
        Conditional(u, siblings, target, wantDensity: false, out double p, out _);
        return p;
    }

    /// <summary>Σ over preimage end points of ± f_{Y|U}(y_e | u) ∂y_e/∂q: the inner integrand of the density.</summary>
    private double ConditionalDensity(double u, ReadOnlySpan<double> siblings, DualInterval target)
    {
        Conditional(u, siblings, target, wantDensity: true, out _, out double f);
        return f;
    }

    /// <summary>
    /// Both inner integrands from one preimage and one evaluation of F_Y per end point (the grid
    /// needs both at every node; the marginal CDF is the costly part).
    /// </summary>
    private void Conditional(double u, ReadOnlySpan<double> siblings, DualInterval target, bool wantDensity, out double probability, out double density)
    {
        Span<DualInterval> intervals = stackalloc DualInterval[_maxIntervals];
        Span<DualInterval> scratch = stackalloc DualInterval[_maxIntervals];
        int n = _chain.Preimage(target, siblings, intervals, scratch);
        double p = 0, f = 0;
        for (int k = 0; k < n; k++)
        {
            var lo = intervals[k].Lo;
            var hi = intervals[k].Hi;
            double vLo = MarginalCdfY(lo.Value), vHi = MarginalCdfY(hi.Value);
            p += vLo > 0.5
                ? ConditionalSurvival(u, lo.Value) - ConditionalSurvival(u, hi.Value)
                : ConditionalCdfAt(u, vHi) - ConditionalCdfAt(u, vLo);
            if (wantDensity) f += PointDensity(u, hi, vHi) - PointDensity(u, lo, vLo);
        }
        probability = p;
        density = f;
    }

    private double MarginalCdfY(double y) => double.IsFinite(y) ? _model.Y.Cdf(y) : (y < 0 ? 0.0 : 1.0);

    private double ConditionalSurvival(double u, double y)
    {
        if (double.IsPositiveInfinity(y)) return 0.0;
        double vBar = _model.Y.Survival(y);
        if (vBar <= 0) return 0.0;
        if (vBar >= 1) return 1.0;
        return Math.Clamp(_flippedY.ConditionalCdf(u, vBar), 0.0, 1.0);
    }

    private double ConditionalCdfAt(double u, double v)
    {
        if (v <= 0) return 0.0;
        if (v >= 1) return 1.0;
        return Math.Clamp(_model.Copula.ConditionalCdf(u, v), 0.0, 1.0);
    }

    /// <summary>f_{Y|U}(y | u) ∂y/∂q = c(u, F_Y(y)) f_Y(y) ∂y/∂q; zero at fixed or infinite end points.</summary>
    private double PointDensity(double u, Dual end, double v)
    {
        if (end.Derivative == 0 || !double.IsFinite(end.Value)) return 0.0;
        double ly = _model.Y.LogDensity(end.Value);
        if (double.IsNegativeInfinity(ly)) return 0.0;
        double f = Math.Exp(_model.Copula.LogDensity(u, MathExtras.ClampOpen(v)) + ly) * end.Derivative;
        return double.IsFinite(f) ? f : 0.0;
    }

    /// <summary>
    /// Every u where a sibling that decides the branch layout (multiplier, divisor, base,
    /// exponent) crosses its critical level, so that the preimage jumps: found by a scan in the
    /// normal-score scale and bisection.
    /// </summary>
    private static List<double> JumpPoints(JointModel model, InversionChain chain)
    {
        var breaks = new List<double>();
        var levels = chain.JumpLevels().ToArray();
        if (levels.Length == 0) return breaks;
        const int scan = 400;
        var us = new double[scan + 1];
        for (int i = 0; i <= scan; i++)
        {
            // Scan evenly in the normal-score scale so both tails are visited.
            double z = -7.0 + 14.0 * i / scan;
            us[i] = 0.5 * MathNet.Numerics.SpecialFunctions.Erfc(-z / Math.Sqrt(2));
        }
        foreach (var (step, level) in levels)
        {
            double Sibling(double u)
            {
                Span<double> tmp = stackalloc double[chain.Length];
                chain.Siblings(model.X.Quantile(u), tmp);
                return tmp[step] - level;
            }
            double prev = Sibling(us[0]);
            for (int i = 1; i <= scan; i++)
            {
                double cur = Sibling(us[i]);
                if (double.IsFinite(prev) && double.IsFinite(cur) && Math.Sign(prev) != Math.Sign(cur))
                {
                    double a = us[i - 1], b = us[i], fa = prev;
                    for (int it = 0; it < 100 && b - a > 1e-15; it++)
                    {
                        double m = 0.5 * (a + b), fm = Sibling(m);
                        if (Math.Sign(fm) == Math.Sign(fa)) { a = m; fa = fm; } else b = m;
                    }
                    double root = 0.5 * (a + b);
                    if (root > GradedBreaks[0] && root < GradedBreaks[^1]) breaks.Add(root);
                }
                prev = cur;
            }
        }
        return breaks;
    }
}
