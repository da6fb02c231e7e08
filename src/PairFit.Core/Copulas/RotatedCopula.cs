namespace PairFit.Core.Copulas;

/// <summary>
/// Rotation of any copula by 90°, 180° (the survival copula) or 270° counter-clockwise, as one
/// wrapper instead of a copy of each family. With (U, V) ~ C:
/// 90°: (1−U, V), C90(u,v) = v − C(1−u, v);  180°: (1−U, 1−V), C180(u,v) = u + v − 1 + C(1−u, 1−v);
/// 270°: (U, 1−V), C270(u,v) = u − C(u, 1−v)  (Joe 2014, section 1.7; Nelsen 2006, Theorem 2.4.4).
/// Rotating by 90° or 270° turns positive into negative dependence; 180° swaps the tails.
/// </summary>
public sealed class RotatedCopula : ICopula
{
    public RotatedCopula(ICopula inner, int rotation)
    {
        if (rotation is not (90 or 180 or 270))
            throw new ArgumentOutOfRangeException(nameof(rotation), $"rotation must be 90, 180 or 270 degrees (got {rotation}).");
        if (inner.Rotation != 0)
            throw new ArgumentException("rotate an unrotated copula only.", nameof(inner));
        Inner = inner;
        Rotation = rotation;
    }

    /// <summary>Wraps <paramref name="inner"/> when <paramref name="rotation"/> is not 0.</summary>
    public static ICopula Rotate(ICopula inner, int rotation) => rotation == 0 ? inner : new RotatedCopula(inner, rotation);

    public ICopula Inner { get; }
    public string Family => Inner.Family;
    public int Rotation { get; }
    public IReadOnlyList<string> ParameterNames => Inner.ParameterNames;
    public IReadOnlyList<double> Parameters => Inner.Parameters;

    public double LogDensity(double u, double v) => Rotation switch
    {
        90 => Inner.LogDensity(1 - u, v),
        180 => Inner.LogDensity(1 - u, 1 - v),
        _ => Inner.LogDensity(u, 1 - v),
    };

    public double Cdf(double u, double v)
    {
        double c = Rotation switch
        {
            90 => v - Inner.Cdf(1 - u, v),
            180 => u + v - 1 + Inner.Cdf(1 - u, 1 - v),
            _ => u - Inner.Cdf(u, 1 - v),
        };
        return Math.Clamp(c, 0.0, Math.Min(u, v));
    }

    // Differentiating the definitions above in u; h_inner(a, b) = ∂C(a, b)/∂a.
    public double ConditionalCdf(double u, double v) => Rotation switch
    {
        90 => Inner.ConditionalCdf(1 - u, v),
        180 => 1 - Inner.ConditionalCdf(1 - u, 1 - v),
        _ => 1 - Inner.ConditionalCdf(u, 1 - v),
    };

    public double InverseConditionalCdf(double u, double w) => Rotation switch
    {
        90 => Inner.InverseConditionalCdf(1 - u, w),
        180 => 1 - Inner.InverseConditionalCdf(1 - u, 1 - w),
        _ => 1 - Inner.InverseConditionalCdf(u, 1 - w),
    };

    public double KendallTau => Rotation == 180 ? Inner.KendallTau : -Inner.KendallTau;
    public double SpearmanRho => Rotation == 180 ? Inner.SpearmanRho : -Inner.SpearmanRho;

    // 90° and 270° put the tail dependence in the off-diagonal corners, where λ_L and λ_U (defined on the diagonal) are 0.
    public double TailLower => Rotation == 180 ? Inner.TailUpper : 0.0;
    public double TailUpper => Rotation == 180 ? Inner.TailLower : 0.0;
}
