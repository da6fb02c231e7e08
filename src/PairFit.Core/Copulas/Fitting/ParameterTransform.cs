namespace PairFit.Core.Copulas.Fitting;

/// <summary>
/// Maps one bounded parameter to an unbounded "free" coordinate so optimisers never step outside
/// the family's range: a scaled logit for (lo, hi) (for a correlation on (−1, 1) this is 2 atanh ρ),
/// log(p − lo) for (lo, ∞) (log θ for positive, log(θ − 1) for θ ≥ 1 families), the identity otherwise.
/// The free coordinate is kept inside [FreeMin, FreeMax], a hair away from the bounds, where
/// log densities of the families are still finite.
/// </summary>
public readonly struct ParameterTransform
{
    private const double FreeLimitUnbounded = 50.0;
    private readonly double _lo, _hi;

    public ParameterTransform(double lower, double upper)
    {
        if (!(upper > lower)) throw new ArgumentException($"parameter range [{lower}, {upper}] is empty.");
        _lo = lower;
        _hi = upper;
        // A hair inside each finite bound; an open end of a half-line stops at e^±50 from the other bound.
        double margin = 1e-9 * (double.IsFinite(upper - lower) ? Math.Max(1.0, upper - lower) : Math.Max(1.0, Math.Abs(lower)));
        bool identity = !double.IsFinite(lower) && !double.IsFinite(upper);
        FreeMin = double.IsFinite(lower) ? ToFreeUnclamped(lower + margin) : identity ? -1e12 : -FreeLimitUnbounded;
        FreeMax = double.IsFinite(upper) ? ToFreeUnclamped(upper - margin) : identity ? 1e12 : FreeLimitUnbounded;
    }

    public double FreeMin { get; }
    public double FreeMax { get; }

    private bool LowerOnly => double.IsFinite(_lo) && !double.IsFinite(_hi);
    private bool UpperOnly => !double.IsFinite(_lo) && double.IsFinite(_hi);
    private bool Both => double.IsFinite(_lo) && double.IsFinite(_hi);

    private double ToFreeUnclamped(double p)
    {
        if (Both) { double s = (p - _lo) / (_hi - _lo); return Math.Log(s) - Common.MathExtras.Log1P(-s); }
        if (LowerOnly) return Math.Log(p - _lo);
        if (UpperOnly) return -Math.Log(_hi - p);
        return p;
    }

    /// <summary>The free coordinate of <paramref name="p"/>, clamped into [FreeMin, FreeMax].</summary>
    public double ToFree(double p) => Math.Clamp(ToFreeUnclamped(Math.Clamp(p, _lo, _hi)), FreeMin, FreeMax);

    public double FromFree(double t)
    {
        if (Both) return _lo + (_hi - _lo) * Logistic(t);
        if (LowerOnly) return _lo + Math.Exp(t);
        if (UpperOnly) return _hi - Math.Exp(-t);
        return t;
    }

    /// <summary>dp/dt at free coordinate t, for the delta method.</summary>
    public double Derivative(double t)
    {
        if (Both) { double s = Logistic(t); return (_hi - _lo) * s * (1 - s); }
        if (LowerOnly) return Math.Exp(t);
        if (UpperOnly) return Math.Exp(-t);
        return 1.0;
    }

    /// <summary>True when t sits on (or within 1e-6 of) an end of the allowed free interval.</summary>
    public bool AtLimit(double t) => t <= FreeMin + 1e-6 * Math.Max(1, Math.Abs(FreeMin)) || t >= FreeMax - 1e-6 * Math.Max(1, Math.Abs(FreeMax));

    private static double Logistic(double t) => t >= 0 ? 1 / (1 + Math.Exp(-t)) : Math.Exp(t) / (1 + Math.Exp(t));
}
