using System.Globalization;
using MathNet.Numerics.RootFinding;
using PairFit.Core.Common;
using PairFit.Core.Copulas;
using PairFit.Core.Model;
using PairFit.Core.Results;

namespace PairFit.Core.Projection;

/// <summary>The design pair (a, b), the event rate and an optional target return period.</summary>
public sealed record JointOptions
{
    public double XValue { get; init; }
    public double YValue { get; init; }

    /// <summary>Events per year (1 for annual maxima); μ = 1/eventsPerYear is the mean interarrival time.</summary>
    public double? EventsPerYear { get; init; }

    /// <summary>Target return period in years for the design isolines.</summary>
    public double? ReturnPeriod { get; init; }

    /// <summary>Points on each design isoline.</summary>
    public int IsolinePoints { get; init; } = 101;
}

/// <summary>
/// Joint exceedance probabilities and return periods of a design pair (a, b) under the joint
/// model, following Salvadori, De Michele and Durante (2011, "On the return period and design in
/// a multivariate framework", HESS 15): with μ the mean interarrival time in years,
/// T_AND = μ / P(X &gt; a, Y &gt; b), T_OR = μ / P(X &gt; a or Y &gt; b) = μ / (1 − C(u, v)),
/// T_Kendall = μ / (1 − K_C(t)) with t = C(u, v). Since P(AND) ≤ 1 − K_C(t) ≤ P(OR), T_AND ≥ T_K ≥ T_OR.
/// For a target T, the design isoline is the level curve of the chosen definition, and the most
/// likely design event is its point of largest joint density (ibid.).
/// </summary>
public static class JointAnalysis
{
    public static JointSection Compute(JointModel model, JointOptions options)
    {
        ArgumentNullException.ThrowIfNull(model);
        double a = options.XValue, b = options.YValue;
        if (!double.IsFinite(a) || !double.IsFinite(b))
            throw new PairFitInputException($"the design pair must be finite numbers (got x = {F(a)}, y = {F(b)}).");
        double rate = options.EventsPerYear ?? 1.0;
        if (!(rate > 0) || !double.IsFinite(rate))
            throw new PairFitInputException($"--events-per-year must be a positive number (got {F(rate)}).");
        double mu = 1.0 / rate;
        if (options.ReturnPeriod is { } target && !(target > mu && double.IsFinite(target)))
            throw new PairFitInputException($"--return-period {F(target)} must exceed the mean interarrival time {F(mu)} years (1 / events per year).");
        if (options.IsolinePoints is < 3 or > 100_000)
            throw new PairFitInputException($"isoline points {options.IsolinePoints} is outside 3..100000.");

        var notes = new List<string>();
        if (options.EventsPerYear is null)
            notes.Add("no --events-per-year given: one event per year assumed (annual maxima), so return periods are in years = events.");

        var c = model.Copula;
        double u = model.X.Cdf(a), v = model.Y.Cdf(b);
        double sx = model.X.Survival(a), sy = model.Y.Survival(b);
        double t = Math.Clamp(c.Cdf(u, v), 0.0, Math.Min(u, v));
        // P(X > a, Y > b) = P(Y > b) − P(X ≤ a, Y > b) = S_Y(b) − (u − C(u, v)); avoids 1 − u − v + C.
        double both = Math.Clamp(sy - (u - t), 0.0, Math.Min(sx, sy));
        double either = Math.Clamp(1 - t, Math.Max(sx, sy), 1.0);
        double givenEquals = u is > 0 and < 1 ? 1 - Math.Clamp(c.ConditionalCdf(u, v), 0.0, 1.0) : (u >= 1 ? 1 - v : 1 - v);
        if (u is <= 0 or >= 1) notes.Add("x-value lies outside the support of X; P(Y > b | X = a) is shown as the marginal P(Y > b).");
        double kendall = KendallDistribution.Cdf(c, t);

        var designs = options.ReturnPeriod is { } period ? Designs(model, mu, period, options.IsolinePoints) : null;

        return new JointSection
        {
            XValue = a,
            YValue = b,
            EventsPerYear = rate,
            MeanInterarrivalYears = mu,
            ProbabilityXExceeds = sx,
            ProbabilityYExceeds = sy,
            ProbabilityBothExceed = both,
            ProbabilityEitherExceeds = either,
            ProbabilityYExceedsGivenXExceeds = sx > 0 ? both / sx : null,
            ProbabilityYExceedsGivenXEquals = givenEquals,
            CopulaLevel = t,
            KendallProbability = kendall,
            ReturnPeriods = new JointReturnPeriods
            {
                And = Period(mu, both),
                Or = Period(mu, either),
                Kendall = Period(mu, 1 - kendall),
                XAlone = Period(mu, sx),
                YAlone = Period(mu, sy),
            },
            IndependentBothExceed = sx * sy,
            IndependentEitherExceeds = 1 - u * v,
            Designs = designs,
            Notes = notes.Count > 0 ? notes : null,
        };
    }

    private static double? Period(double mu, double p) => p > 0 ? mu / p : null;

    private static string F(double v) => v.ToString("G6", CultureInfo.InvariantCulture);

    /// <summary>Kendall, OR and AND design isolines and their most likely design events for return period T.</summary>
    public static IReadOnlyList<DesignEvent> Designs(JointModel model, double mu, double period, int points)
    {
        var c = model.Copula;
        double p = mu / period; // exceedance probability per event that gives return period T
        double kendallLevel = KendallDistribution.Quantile(c, 1 - p);
        double orLevel = 1 - p;
        return
        [
            Design(model, "kendall", period, kendallLevel, points, (uu) => KendallDistribution.LevelCurve(c, uu, kendallLevel), kendallLevel),
            Design(model, "or", period, orLevel, points, (uu) => KendallDistribution.LevelCurve(c, uu, orLevel), orLevel),
            Design(model, "and", period, p, points, (uu) => AndCurve(c, uu, p), 0.0, upperU: 1 - p),
        ];
    }

    /// <summary>The v with P(U &gt; u, V &gt; v) = 1 − u − v + C(u, v) = p (decreasing in v), for u &lt; 1 − p.</summary>
    private static double AndCurve(ICopula c, double u, double p)
    {
        double G(double v) => p - (1 - u - v + c.Cdf(u, v));
        if (G(0.0) >= 0) return 0.0;
        return Brent.TryFindRoot(G, 0.0, 1.0, 1e-14, 200, out double root) ? root : KendallDistribution.Bisect(G, 0.0, 1.0);
    }

    /// <summary>
    /// Points of a level curve v(u) for u between <paramref name="lowerU"/> and <paramref name="upperU"/>,
    /// spaced evenly in the normal-score scale of the fraction travelled so that both arms of the
    /// curve are drawn out to 1e−4 of their length, then the point of largest log f(x, y), refined
    /// by golden-section search between the neighbours of the best grid point.
    /// </summary>
    private static DesignEvent Design(JointModel model, string kind, double period, double level, int points,
        Func<double, double> curve, double lowerU, double upperU = 1.0)
    {
        double width = upperU - lowerU;
        double U(double w) => lowerU + width * w;
        double Fraction(int i) => 0.5 * MathNet.Numerics.SpecialFunctions.Erfc(-(-3.719 + 7.438 * i / (points - 1)) / Math.Sqrt(2));
        DesignPoint At(double w)
        {
            double uu = U(w), vv = curve(uu);
            double x = model.X.Quantile(uu), y = model.Y.Quantile(vv);
            double lf = model.LogDensity(x, y);
            return new DesignPoint { X = x, Y = y, LogDensity = double.IsFinite(lf) ? lf : null };
        }
        var line = new DesignPoint[points];
        int best = -1;
        for (int i = 0; i < points; i++)
        {
            line[i] = At(Fraction(i));
            if (line[i].LogDensity is { } lf && (best < 0 || lf > line[best].LogDensity!.Value)) best = i;
        }
        DesignPoint? mostLikely = null;
        if (best >= 0)
        {
            double lo = Fraction(Math.Max(0, best - 1)), hi = Fraction(Math.Min(points - 1, best + 1));
            const double golden = 0.6180339887498949;
            double Score(double w) => At(w).LogDensity ?? double.NegativeInfinity;
            double x1 = hi - golden * (hi - lo), x2 = lo + golden * (hi - lo);
            double f1 = Score(x1), f2 = Score(x2);
            for (int it = 0; it < 60 && hi - lo > 1e-13; it++)
            {
                if (f1 < f2) { lo = x1; x1 = x2; f1 = f2; x2 = lo + golden * (hi - lo); f2 = Score(x2); }
                else { hi = x2; x2 = x1; f2 = f1; x1 = hi - golden * (hi - lo); f1 = Score(x1); }
            }
            var refined = At(0.5 * (lo + hi));
            mostLikely = refined.LogDensity >= line[best].LogDensity ? refined : line[best];
        }
        var keep = line.Where(pt => double.IsFinite(pt.X) && double.IsFinite(pt.Y)).ToArray();
        return new DesignEvent
        {
            Kind = kind,
            ReturnPeriod = period,
            Level = level,
            Isoline = keep,
            MostLikely = mostLikely,
            Note = kind switch
            {
                "kendall" => "level t with K_C(t) = 1 − μ/T on C(u, v) = t",
                "or" => "C(u, v) = 1 − μ/T",
                _ => "P(X > x, Y > y) = μ/T",
            },
        };
    }
}
