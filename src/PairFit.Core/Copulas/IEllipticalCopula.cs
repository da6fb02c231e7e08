namespace PairFit.Core.Copulas;

/// <summary>
/// A copula built from an elliptical law (Gaussian, Student t), whose density is cheap once the
/// margins are mapped to the law's own scale (x = F⁻¹(u)) and whose cost is almost all in that
/// quantile transform. Fitting code can map the pseudo-observations once per value of the shape
/// parameters (none for Gaussian, ν for t) and then evaluate <see cref="LogDensityAtQuantiles"/>
/// for every correlation it tries.
/// </summary>
public interface IEllipticalCopula : ICopula
{
    /// <summary>F⁻¹(u) of the univariate margin of the underlying law (Φ⁻¹, or T_ν⁻¹).</summary>
    double MarginQuantile(double u);

    /// <summary>log c(u, v) given x = <see cref="MarginQuantile"/>(u) and y = MarginQuantile(v).</summary>
    double LogDensityAtQuantiles(double x, double y);
}
