using PairFit.Core.Copulas;

namespace PairFit.Tests.Copulas;

/// <summary>
/// Properties every copula must have, run over every family × allowed rotation (so that the
/// rotation wrapper is checked with each family). Sources: the definition of a copula and its
/// density, c = ∂²C/∂u∂v, h(v|u) = ∂C/∂u (Nelsen 2006, sections 2.2 and 2.9; numbering from memory).
/// </summary>
public class CopulaPropertyTests
{
    private static readonly double[] Interior = [0.1, 0.3, 0.5, 0.7, 0.9];
    private static readonly double[] WithCorners = [1e-12, 1e-6, 0.01, 0.3, 0.5, 0.7, 0.99, 1 - 1e-6, 1 - 1e-12];

    [Theory]
    [MemberData(nameof(CopulaTestCases.ModerateWithRotations), MemberType = typeof(CopulaTestCases))]
    public void DensityIntegratesToOne(string family, int rotation, double[] parameters)
    {
        var c = CopulaTestCases.Create(family, rotation, parameters);
        double mass = UnitSquareQuadrature.Integrate((u, v) => c.Density(u, v));
        // Left-out edge strips hold ≤ 4e−10; 7-node Gauss–Legendre per graded panel integrates the
        // smooth part to ~1e−12, and the r^(−α) corner singularities of the tail-dependent families
        // leave errors of order 1e−7 on the innermost panels; 1e−6 covers both with margin.
        Assert.InRange(mass, 1 - 1e-6, 1 + 1e-6);
    }

    [Theory]
    [MemberData(nameof(CopulaTestCases.ModerateWithRotations), MemberType = typeof(CopulaTestCases))]
    public void MixedDerivativeOfCdfIsDensity(string family, int rotation, double[] parameters)
    {
        var c = CopulaTestCases.Create(family, rotation, parameters);
        const double d = 1e-4;
        foreach (double u in Interior)
        foreach (double v in Interior)
        {
            double fd = (c.Cdf(u + d, v + d) - c.Cdf(u + d, v - d) - c.Cdf(u - d, v + d) + c.Cdf(u - d, v - d)) / (4 * d * d);
            double density = c.Density(u, v);
            // Central difference: truncation d²·∂⁴C/6 ~ 1e−8 × O(10); rounding 4·1e−15/(4d²) = 1e−7 for a CDF
            // accurate to 1e−15; relative 1e−5 leaves room for both.
            Assert.True(Math.Abs(fd - density) <= 1e-5 * Math.Max(1, density), $"u={u} v={v}: fd {fd} vs density {density}");
        }
    }

    [Theory]
    [MemberData(nameof(CopulaTestCases.ModerateWithRotations), MemberType = typeof(CopulaTestCases))]
    public void ConditionalCdfIsPartialDerivativeOfCdf(string family, int rotation, double[] parameters)
    {
        var c = CopulaTestCases.Create(family, rotation, parameters);
        const double d = 1e-5;
        foreach (double u in Interior)
        foreach (double v in Interior)
        {
            double fd = (c.Cdf(u + d, v) - c.Cdf(u - d, v)) / (2 * d);
            // Truncation d²·C_uuu/6 ~ 1e−10 × O(10); rounding 1e−15/d = 1e−10.
            Assert.True(Math.Abs(fd - c.ConditionalCdf(u, v)) < 1e-7, $"u={u} v={v}: fd {fd} vs h {c.ConditionalCdf(u, v)}");
        }
    }

    [Theory]
    [MemberData(nameof(CopulaTestCases.ModerateWithRotations), MemberType = typeof(CopulaTestCases))]
    [MemberData(nameof(CopulaTestCases.ExtremeWithRotations), MemberType = typeof(CopulaTestCases))]
    public void InverseConditionalCdfInvertsConditionalCdf(string family, int rotation, double[] parameters)
    {
        var c = CopulaTestCases.Create(family, rotation, parameters);
        foreach (double u in WithCorners)
        foreach (double w in WithCorners)
        {
            double v = c.InverseConditionalCdf(u, w);
            Assert.InRange(v, 0.0, 1.0);
            double back = c.ConditionalCdf(u, v);
            // h is evaluated at the double nearest the root; where h is steep (density up to ~1e12 in
            // extreme corners) one ulp of v moves h by up to ~1e−4·w... so compare on the v side too.
            bool closeInW = Math.Abs(back - w) <= 1e-9;
            bool closeInV = Math.Abs(c.InverseConditionalCdf(u, back) - v) <= 1e-12 + 1e-9 * v;
            Assert.True(closeInW || closeInV, $"u={u} w={w}: v={v}, h(v)={back}");
        }
    }

    [Theory]
    [MemberData(nameof(CopulaTestCases.ModerateWithRotations), MemberType = typeof(CopulaTestCases))]
    [MemberData(nameof(CopulaTestCases.ExtremeWithRotations), MemberType = typeof(CopulaTestCases))]
    public void ConditionalCdfRoundTripsThroughItsInverse(string family, int rotation, double[] parameters)
    {
        var c = CopulaTestCases.Create(family, rotation, parameters);
        foreach (double u in WithCorners)
        foreach (double v in Interior)
        {
            double w = c.ConditionalCdf(u, v);
            // Only where h is not saturated at 0 or 1 is v identifiable from w.
            if (w < 1e-10 || w > 1 - 1e-10) continue;
            double back = c.InverseConditionalCdf(u, w);
            // w carries a rounding error of ~1e−16, which moves the root by 1e−16/c(u, v) (dh/dv = c);
            // where the density is tiny v is ill-determined by w, whatever the method.
            double tolerance = 1e-8 + 4e-16 / c.Density(u, v);
            Assert.True(Math.Abs(back - v) < tolerance, $"u={u} v={v}: w={w}, back {back}, tolerance {tolerance}");
        }
    }

    [Theory]
    [MemberData(nameof(CopulaTestCases.ModerateWithRotations), MemberType = typeof(CopulaTestCases))]
    [MemberData(nameof(CopulaTestCases.ExtremeWithRotations), MemberType = typeof(CopulaTestCases))]
    public void FiniteAndBoundedInTheCorners(string family, int rotation, double[] parameters)
    {
        var c = CopulaTestCases.Create(family, rotation, parameters);
        foreach (double u in WithCorners)
        foreach (double v in WithCorners)
        {
            double logC = c.LogDensity(u, v);
            Assert.True(double.IsFinite(logC), $"log c({u},{v}) = {logC}");
            double h = c.ConditionalCdf(u, v);
            Assert.InRange(h, 0.0, 1.0);
            double cdf = c.Cdf(u, v);
            // Fréchet–Hoeffding bounds (Nelsen 2006, Theorem 2.2.3; numbering from memory), with rounding slack.
            Assert.InRange(cdf, Math.Max(u + v - 1, 0) - 1e-15, Math.Min(u, v) + 1e-15);
        }
    }
}
