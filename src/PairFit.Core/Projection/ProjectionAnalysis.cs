using System.Globalization;
using PairFit.Core.Common;
using PairFit.Core.Copulas;
using PairFit.Core.Data;
using PairFit.Core.Model;
using PairFit.Core.Results;

namespace PairFit.Core.Projection;

/// <summary>What to compute for an expression and how.</summary>
public sealed record ProjectionOptions
{
    public IReadOnlyList<double> Probabilities { get; init; } = [0.5, 0.9, 0.95, 0.99, 0.995];
    public IReadOnlyList<double> Thresholds { get; init; } = [];
    public IReadOnlyList<double> Levels { get; init; } = [0.99];

    /// <summary>"auto" (quadrature when y occurs once in the expression, else Monte Carlo), "quadrature" or "montecarlo".</summary>
    public string Method { get; init; } = "auto";
    public int MonteCarloDraws { get; init; } = 200_000;
    public int GridPoints { get; init; } = 512;

    /// <summary>Also run the other method and report whether the two agree.</summary>
    public bool Check { get; init; }
    public int Seed { get; init; }
}

/// <summary>
/// The distribution of an expression Q = g(X, Y) under a fitted joint model, under independence
/// and comonotonic coupling of the same marginals, and on the observed pairs.
/// </summary>
public static class ProjectionAnalysis
{
    public const string Quadrature = "quadrature";
    public const string MonteCarlo = "montecarlo";

    /// <summary>Points of the deterministic grid u_i = (i − ½)/N that represents comonotonic coupling.</summary>
    public const int ComonotonicGridSize = 100_000;

    /// <summary>Grid ends: the 0.05 % and 99.95 % quantiles of Q.</summary>
    private const double GridTail = 0.0005;

    // Judging moment existence from the tail index: the mean needs α > 1, the variance α > 2;
    // the margins of 0.5 absorb the bias of a two-quantile estimate (a Cauchy law gives 1.0).
    private const double MeanTailIndex = 1.5;
    private const double VarianceTailIndex = 2.5;

    /// <summary>Draws below which a Monte Carlo tail index is not estimated (its 1e−4 quantile would rest on too few points).</summary>
    private const int TailIndexMinDraws = 20_000;

    public static ProjectionSection Project(JointModel model, string expression, string xName, string yName, PairedSample? data, ProjectionOptions options)
    {
        ArgumentNullException.ThrowIfNull(model);
        Validate(options);
        var node = ExpressionParser.Parse(expression, xName, yName);
        if (node.Occurrences(ExpressionVariable.X) + node.Occurrences(ExpressionVariable.Y) == 0)
            throw new PairFitInputException($"expression \"{expression}\" uses neither x nor y (nor '{xName}', '{yName}'), so it has no distribution.");
        var program = new CompiledExpression(node);
        var chain = InversionChain.TryBuild(node);
        string method = options.Method.ToLowerInvariant() switch
        {
            "auto" => chain is not null ? Quadrature : MonteCarlo,
            Quadrature when chain is null => throw new PairFitInputException(
                $"method 'quadrature' needs y (or '{yName}') to occur exactly once in the expression \"{expression}\"; use method 'montecarlo' or 'auto'."),
            Quadrature => Quadrature,
            MonteCarlo => MonteCarlo,
            _ => throw new PairFitInputException($"unknown projection method '{options.Method}'; use auto, quadrature or montecarlo."),
        };

        var main = method == Quadrature ? ByQuadrature(model, chain!, program, options, withGrid: true) : ByMonteCarlo(model, program, options, withGrid: true);
        var independentModel = model with { Copula = new IndependenceLaw() };
        var independence = method == Quadrature
            ? ByQuadrature(independentModel, chain!, program, options, withGrid: false)
            : ByMonteCarlo(independentModel, program, options, withGrid: false);
        var comonotonic = Comonotonic(model, program, options);
        Summary? empirical = data is { Count: > 0 } ? Empirical(data, program, options) : null;

        ProjectionCheck? check = null;
        var notes = new List<string>(main.Notes);
        if (options.Check)
        {
            if (chain is null) notes.Add("check skipped: the expression cannot be solved for y, so only Monte Carlo applies.");
            else check = Check(model, chain, program, options, method == Quadrature ? main : ByQuadrature(model, chain, program, options, withGrid: true),
                method == MonteCarlo ? main : null);
        }

        return new ProjectionSection
        {
            Expression = expression,
            Method = method,
            MethodDetail = main.Detail,
            Draws = method == MonteCarlo ? options.MonteCarloDraws : null,
            Seed = method == MonteCarlo || options.Check ? options.Seed : null,
            Mean = main.Mean,
            Sd = main.Sd,
            Quantiles = main.Quantiles,
            Exceedance = main.Exceedance,
            ValueAtRisk = main.ValueAtRisk,
            TailValueAtRisk = main.TailValueAtRisk,
            UndefinedProbability = main.Undefined > 0 ? main.Undefined : null,
            TailIndexLower = Finite(main.TailLower),
            TailIndexUpper = Finite(main.TailUpper),
            Grid = main.Grid,
            Independence = independence.ToComparison(),
            Comonotonic = comonotonic.ToComparison(),
            Empirical = empirical?.ToComparison(),
            Check = check,
            Notes = notes.Count > 0 ? notes : null,
        };
    }

    private static double? Finite(double? v) => v is { } d && double.IsFinite(d) ? d : null;

    private static void Validate(ProjectionOptions o)
    {
        foreach (double p in o.Probabilities)
            if (!(p > 0 && p < 1)) throw new PairFitInputException($"quantile probability {Format(p)} is outside (0, 1); give values such as 0.5 or 0.99.");
        foreach (double a in o.Levels)
            if (!(a > 0 && a < 1)) throw new PairFitInputException($"risk level {Format(a)} is outside (0, 1); give values such as 0.95 or 0.99.");
        foreach (double t in o.Thresholds)
            if (!double.IsFinite(t)) throw new PairFitInputException($"threshold {Format(t)} is not a finite number.");
        if (o.MonteCarloDraws < 1000) throw new PairFitInputException($"Monte Carlo draws {o.MonteCarloDraws} is too few; use at least 1000.");
        if (o.GridPoints is < 16 or > 100_000) throw new PairFitInputException($"grid points {o.GridPoints} is outside 16..100000.");
    }

    private static string Format(double v) => v.ToString("R", CultureInfo.InvariantCulture);

    /// <summary>A summary of Q under one method, before it becomes a results record.</summary>
    private sealed record Summary
    {
        public required string Method { get; init; }
        public string? Detail { get; init; }
        public int? Count { get; init; }
        public double? Mean { get; init; }
        public double? Sd { get; init; }
        public required IReadOnlyList<QuantileValue> Quantiles { get; init; }
        public required IReadOnlyList<ExceedanceValue> Exceedance { get; init; }
        public required IReadOnlyList<RiskValue> ValueAtRisk { get; init; }
        public required IReadOnlyList<RiskValue> TailValueAtRisk { get; init; }
        public double Undefined { get; init; }
        public double? TailLower { get; init; }
        public double? TailUpper { get; init; }
        public ProjectionGrid? Grid { get; init; }
        public Func<double, double>? Cdf { get; init; }
        public List<string> Notes { get; init; } = [];

        public ProjectionComparison ToComparison() => new()
        {
            Method = Method,
            Count = Count,
            Mean = Mean,
            Sd = Sd,
            Quantiles = Quantiles,
            Exceedance = Exceedance,
            ValueAtRisk = ValueAtRisk,
            TailValueAtRisk = TailValueAtRisk,
            Note = Notes.Count > 0 ? string.Join(" ", Notes) : null,
        };
    }

    /// <summary>Moments and TVaR are withheld where the estimated tail index says they do not exist.</summary>
    private static (bool Mean, bool Variance, bool TailMean) MomentsExist(double lower, double upper, List<string> notes)
    {
        double worst = Math.Min(lower, upper);
        if (worst < MeanTailIndex)
            notes.Add($"the tail of Q is so heavy (estimated tail index {worst:0.##}) that its mean and standard deviation may not exist; they are left out.");
        else if (worst < VarianceTailIndex)
            notes.Add($"the tail of Q is heavy (estimated tail index {worst:0.##}); its variance may not exist, so the standard deviation is left out.");
        if (upper < MeanTailIndex)
            notes.Add("tail value-at-risk is left out: the upper tail is too heavy for it to exist.");
        return (worst >= MeanTailIndex, worst >= VarianceTailIndex, upper >= MeanTailIndex);
    }

    // ---------------------------------------------------------------- quadrature

    private static Summary ByQuadrature(JointModel model, InversionChain chain, CompiledExpression program, ProjectionOptions o, bool withGrid)
    {
        var qd = new QuadratureDistribution(model, chain);
        double mass = qd.DefinedProbability();
        if (!(mass > 1e-12))
            throw new PairFitAnalysisException("the expression is undefined (NaN) almost everywhere under the model, e.g. a log or square root of negative values.");
        var notes = new List<string>();
        double m = mass < 1 - 1e-9 ? mass : 1.0;
        if (m < 1) notes.Add($"Q is undefined with probability {1 - m:G3}; the results describe Q where it is defined.");
        double F(double q) => Math.Min(1.0, qd.Cdf(q) / m);
        double S(double q) => Math.Min(1.0, qd.Survival(q) / m);
        double SCoarse(double q) => Math.Min(1.0, qd.Survival(q, coarse: true) / m);

        var (bracketLo, bracketHi) = PilotBracket(model, program, o.Seed);
        double Quantile(double p) => InvertCdf(F, S, p, bracketLo, bracketHi);
        // The tail index needs its far quantiles to a few digits only.
        double FCoarse(double q) => Math.Min(1.0, qd.Cdf(q, coarse: true) / m);
        double TailQuantile(double p) => InvertCdf(FCoarse, SCoarse, p, bracketLo, bracketHi, relativeTolerance: 1e-6);

        double median = Quantile(0.5);
        double scale = Quantile(0.75) - Quantile(0.25);
        if (!(scale > 0)) scale = Math.Max(Math.Abs(median), 1.0);
        double lowerIndex = SampleStatistics.TailIndex(1e-4, 1e-6, median - TailQuantile(1e-4), median - TailQuantile(1e-6));
        double upperIndex = SampleStatistics.TailIndex(1e-4, 1e-6, TailQuantile(1 - 1e-4) - median, TailQuantile(1 - 1e-6) - median);
        var exist = MomentsExist(lowerIndex, upperIndex, notes);

        double? mean = null, sd = null;
        if (exist.Mean)
        {
            var (m1, s1) = ConditionalMoments.MeanAndSd(model, program, exist.Variance);
            mean = m1;
            sd = exist.Variance ? s1 : null;
        }

        var quantiles = o.Probabilities.Select(p => new QuantileValue { P = p, Value = Quantile(p) }).ToArray();
        var exceed = o.Thresholds.Select(t => new ExceedanceValue { Threshold = t, Probability = S(t) }).ToArray();
        var valueAtRisk = new List<RiskValue>();
        var tail = new List<RiskValue>();
        foreach (double a in o.Levels)
        {
            double v = Quantile(a);
            valueAtRisk.Add(new RiskValue { Level = a, Value = v });
            // TVaR_α = VaR_α + E[(Q − VaR_α)⁺]/(1 − α) for a continuous law (Acerbi and Tasche 2002).
            tail.Add(new RiskValue { Level = a, Value = exist.TailMean ? v + HalfLineIntegral(r => SCoarse(v + r), scale) / (1 - a) : null });
        }

        ProjectionGrid? grid = null;
        if (withGrid)
        {
            double lo = Quantile(GridTail), hi = Quantile(1 - GridTail);
            if (!(hi > lo)) { lo -= 1; hi += 1; }
            var (values, cdf, density) = qd.Grid(lo, hi, o.GridPoints);
            for (int i = 0; i < values.Length; i++)
            {
                cdf[i] = Math.Min(1.0, cdf[i] / m);
                density[i] /= m;
            }
            grid = new ProjectionGrid
            {
                Values = values, Cdf = cdf, Density = density,
                DensityMethod = chain.HasFlatPieces ? "central difference of the quadrature CDF" : "quadrature of the delta-function identity",
            };
        }

        return new Summary
        {
            Method = Quadrature,
            Detail = "exact: y solved from the expression at fixed x; adaptive Gauss-Kronrod (G7/K15) in u = F_X(x) through the copula's conditional CDF and density",
            Mean = mean, Sd = sd,
            Quantiles = quantiles, Exceedance = exceed, ValueAtRisk = valueAtRisk, TailValueAtRisk = tail,
            Undefined = 1 - m,
            TailLower = lowerIndex, TailUpper = upperIndex,
            Grid = grid, Cdf = F, Notes = notes,
        };
    }

    /// <summary>Range of g on a small pilot sample, the starting bracket for quantile searches.</summary>
    private static (double Lo, double Hi) PilotBracket(JointModel model, CompiledExpression program, int seed)
    {
        var (x, y) = model.Sample(2048, seed);
        var q = new double[x.Length];
        program.Evaluate(x, y, q);
        double lo = double.PositiveInfinity, hi = double.NegativeInfinity;
        foreach (double v in q)
            if (double.IsFinite(v)) { lo = Math.Min(lo, v); hi = Math.Max(hi, v); }
        if (!(hi >= lo)) return (-1.0, 1.0);
        if (hi == lo) { lo -= 1; hi += 1; }
        return (lo, hi);
    }

    /// <summary>
    /// The p-quantile inf{q : F(q) ≥ p}: the root of F(q) − p (of 1 − p − S(q) above the median,
    /// where the survival function keeps the relative accuracy of small tail probabilities), after
    /// widening the bracket geometrically until it holds the root, by the Illinois variant of
    /// regula falsi (Dowell and Jarratt 1971), which keeps the bracket, converges superlinearly and
    /// stops on the width of the bracket only (a CDF jump at an atom is found as the jump's location).
    /// </summary>
    internal static double InvertCdf(Func<double, double> cdf, Func<double, double> survival, double p, double lo, double hi,
        double relativeTolerance = 1e-12)
    {
        double G(double q) => p <= 0.5 ? cdf(q) - p : (1 - p) - survival(q);
        double width = Math.Max(hi - lo, 1e-9 * Math.Max(1.0, Math.Abs(hi)));
        double fa = G(lo);
        for (int i = 0; i < 200 && fa > 0; i++) { hi = lo; lo -= width; width *= 2; fa = G(lo); }
        width = Math.Max(hi - lo, 1e-9);
        double fb = G(hi);
        for (int i = 0; i < 200 && fb < 0; i++) { lo = hi; fa = fb; hi += width; width *= 2; fb = G(hi); }
        if (fa == 0) return lo;
        if (fb == 0) return hi;
        double a = lo, b = hi;
        // Relative to the root, but never below 1e−12 of the starting bracket (a median of exactly 0).
        double floor = relativeTolerance * (hi - lo);
        for (int it = 0; it < 200; it++)
        {
            double tolerance = Math.Max(relativeTolerance * Math.Max(Math.Abs(a), Math.Abs(b)), floor);
            if (Math.Abs(b - a) <= tolerance) break;
            double c = (a * fb - b * fa) / (fb - fa);
            // Fall back to bisection when the secant leaves the bracket or every third step, which bounds the worst case.
            if (!(c > Math.Min(a, b) && c < Math.Max(a, b)) || it % 3 == 2) c = 0.5 * (a + b);
            double fc = G(c);
            if (fc == 0) return c;
            if (Math.Sign(fc) != Math.Sign(fb)) { a = b; fa = fb; }
            else fa *= 0.5;
            b = c;
            fb = fc;
        }
        return fb <= 0 ? Math.Max(a, b) : 0.5 * (a + b);
    }

    /// <summary>∫₀^∞ f(r) dr by the map r = s w/(1 − w), w ∈ (0, 1), and adaptive Gauss–Kronrod.</summary>
    private static double HalfLineIntegral(Func<double, double> f, double scale)
    {
        double[] breaks = [0.0, 0.25, 0.5, 0.75, 0.9, 0.97, 0.995, 1.0];
        double Mapped(double w)
        {
            double one = 1 - w;
            double v = f(scale * w / one) * scale / (one * one);
            return double.IsFinite(v) ? v : 0.0;
        }
        return AdaptiveQuadrature.Integrate(Mapped, breaks, 1e-10 * scale, 1e-7, maxPanels: 60);
    }

    // ---------------------------------------------------------------- samples

    private static Summary ByMonteCarlo(JointModel model, CompiledExpression program, ProjectionOptions o, bool withGrid)
    {
        var (x, y) = model.Sample(o.MonteCarloDraws, o.Seed);
        var q = new double[x.Length];
        program.Evaluate(x, y, q);
        return FromSample(q, MonteCarlo, $"{o.MonteCarloDraws} draws from the joint model (seed {o.Seed}); quantiles are order statistics with 95 % binomial intervals",
            o, SampleKind.MonteCarlo, withGrid);
    }

    /// <summary>
    /// Comonotonic coupling X = F_X⁻¹(U), Y = F_Y⁻¹(U) on the deterministic grid u_i = (i − ½)/N:
    /// the grid's distribution of g differs from the exact one by at most 1/N in probability.
    /// </summary>
    private static Summary Comonotonic(JointModel model, CompiledExpression program, ProjectionOptions o)
    {
        const int n = ComonotonicGridSize;
        var x = new double[n];
        var y = new double[n];
        for (int i = 0; i < n; i++)
        {
            double u = (i + 0.5) / n;
            x[i] = model.X.Quantile(u);
            y[i] = model.Y.Quantile(u);
        }
        var q = new double[n];
        program.Evaluate(x, y, q);
        return FromSample(q, "comonotonic-grid", null, o, SampleKind.Grid, withGrid: false);
    }

    private static Summary Empirical(PairedSample data, CompiledExpression program, ProjectionOptions o)
    {
        var q = new double[data.Count];
        program.Evaluate(data.X, data.Y, q);
        return FromSample(q, "data", null, o, SampleKind.Data, withGrid: false);
    }

    private enum SampleKind { MonteCarlo, Grid, Data }

    private static Summary FromSample(double[] values, string method, string? detail, ProjectionOptions o, SampleKind kind, bool withGrid)
    {
        var (sorted, undefined) = SampleStatistics.SortFinite(values);
        var notes = new List<string>();
        if (sorted.Length == 0)
        {
            notes.Add("the expression is undefined on every pair.");
            return new Summary
            {
                Method = method, Detail = detail, Count = values.Length, Quantiles = [], Exceedance = [], ValueAtRisk = [], TailValueAtRisk = [],
                Undefined = 1.0, Notes = notes,
            };
        }
        double undefinedShare = (double)undefined / values.Length;
        if (undefined > 0) notes.Add($"the expression is undefined on {undefined} of {values.Length} {(kind == SampleKind.Data ? "pairs" : "points")}; they are left out.");
        int n = sorted.Length;
        double Q(double p) => kind == SampleKind.Data
            ? SampleStatistics.InterpolatedQuantile(sorted, p)
            : SampleStatistics.OrderStatisticQuantile(sorted, p, withInterval: false).Value!.Value;

        double lowerIndex = double.PositiveInfinity, upperIndex = double.PositiveInfinity;
        if (kind != SampleKind.Data && n >= TailIndexMinDraws)
        {
            double med = Q(0.5);
            lowerIndex = SampleStatistics.TailIndex(1e-3, 1e-4, med - Q(1e-3), med - Q(1e-4));
            upperIndex = SampleStatistics.TailIndex(1e-3, 1e-4, Q(1 - 1e-3) - med, Q(1 - 1e-4) - med);
        }
        var exist = kind == SampleKind.Data ? (Mean: true, Variance: true, TailMean: true) : MomentsExist(lowerIndex, upperIndex, notes);
        var (mean, sd) = SampleStatistics.MeanAndSd(sorted);

        var quantiles = o.Probabilities.Select(p => kind switch
        {
            SampleKind.Data => new QuantileValue { P = p, Value = SampleStatistics.InterpolatedQuantile(sorted, p) },
            _ => SampleStatistics.OrderStatisticQuantile(sorted, p, withInterval: kind == SampleKind.MonteCarlo),
        }).ToArray();
        var exceed = o.Thresholds.Select(t =>
        {
            double p = SampleStatistics.FractionAbove(sorted, t);
            return new ExceedanceValue
            {
                Threshold = t, Probability = p,
                StandardError = kind == SampleKind.MonteCarlo ? Math.Sqrt(Math.Max(p * (1 - p), 1.0 / n) / n) : null,
            };
        }).ToArray();
        var valueAtRisk = o.Levels.Select(a => new RiskValue { Level = a, Value = Q(a) }).ToArray();
        var tail = o.Levels.Select(a => new RiskValue { Level = a, Value = exist.TailMean ? SampleStatistics.TailMean(sorted, a) : null }).ToArray();

        ProjectionGrid? grid = null;
        if (withGrid)
        {
            double lo = Q(GridTail), hi = Q(1 - GridTail);
            if (!(hi > lo)) { lo -= 1; hi += 1; }
            int g = o.GridPoints;
            var gv = new double[g];
            var cdf = new double[g];
            for (int i = 0; i < g; i++)
            {
                gv[i] = lo + i * (hi - lo) / (g - 1);
                cdf[i] = 1 - SampleStatistics.FractionAbove(sorted, gv[i]);
            }
            var (density, bandwidth) = SampleStatistics.KernelDensity(sorted, gv, sd);
            grid = new ProjectionGrid
            {
                Values = gv, Cdf = cdf, Density = density,
                DensityMethod = $"Gaussian kernel, Silverman bandwidth {bandwidth.ToString("G4", CultureInfo.InvariantCulture)}",
            };
        }

        return new Summary
        {
            Method = method, Detail = detail, Count = kind == SampleKind.Data ? values.Length : null,
            Mean = exist.Mean ? mean : null, Sd = exist.Variance ? sd : null,
            Quantiles = quantiles, Exceedance = exceed, ValueAtRisk = valueAtRisk, TailValueAtRisk = tail,
            Undefined = undefinedShare, TailLower = lowerIndex, TailUpper = upperIndex, Grid = grid,
            Cdf = t => 1 - SampleStatistics.FractionAbove(sorted, t),
            Notes = notes,
        };
    }

    // ---------------------------------------------------------------- check

    /// <summary>
    /// Quadrature against Monte Carlo on the quadrature grid: the largest CDF difference must lie
    /// within the 99 % Dvoretzky–Kiefer–Wolfowitz band √(ln(2/0.01)/(2n)) (Massart 1990's tight constant).
    /// </summary>
    private static ProjectionCheck Check(JointModel model, InversionChain chain, CompiledExpression program, ProjectionOptions o, Summary quadrature, Summary? monteCarlo)
    {
        monteCarlo ??= ByMonteCarlo(model, program, o, withGrid: false);
        var grid = quadrature.Grid!;
        double worst = 0;
        for (int i = 0; i < grid.Values.Count; i++)
            worst = Math.Max(worst, Math.Abs(grid.Cdf[i] - monteCarlo.Cdf!(grid.Values[i])));
        double allowed = Math.Sqrt(Math.Log(2 / 0.01) / (2.0 * o.MonteCarloDraws));
        return new ProjectionCheck
        {
            Draws = o.MonteCarloDraws,
            MaxCdfDifference = worst,
            AllowedDifference = allowed,
            Agree = worst <= allowed,
            MonteCarloMean = monteCarlo.Mean,
            Note = worst <= allowed ? null : "quadrature and Monte Carlo disagree by more than the Monte Carlo error; please report this expression and model.",
        };
    }
}
