using System.Globalization;
using PairFit.Core.Copulas;
using PairFit.Core.Marginals;
using PairFit.Core.Model;
using PairFit.Core.Projection;

namespace PairFit.Tests.Projection;

/// <summary>
/// The quadrature against an independent computation: SciPy 1.10.1 via
/// Reference/Projection/make_reference.py (its own Clayton formulas, integration in x-space with
/// scipy.integrate.quad), for every rotation, on a sum and a ratio.
/// </summary>
public class QuadratureReferenceTests
{
    public static IEnumerable<object[]> Rows()
    {
        string path = Path.Combine(AppContext.BaseDirectory, "Reference", "Projection", "clayton_projection.csv");
        foreach (string line in File.ReadLines(path).Skip(1))
        {
            var f = line.Split(',');
            yield return [int.Parse(f[0], CultureInfo.InvariantCulture), f[2], double.Parse(f[3], CultureInfo.InvariantCulture),
                double.Parse(f[4], CultureInfo.InvariantCulture), double.Parse(f[5], CultureInfo.InvariantCulture)];
        }
    }

    private static readonly Dictionary<(int, string), QuadratureDistribution> Cache = new();

    private static QuadratureDistribution For(int rotation, string expression)
    {
        lock (Cache)
        {
            if (!Cache.TryGetValue((rotation, expression), out var qd))
            {
                // Same model as make_reference.py: X lognormal(1, 0.5), Y normal(2, 1.5), Clayton θ = 2 rotated.
                var model = new JointModel(new LogNormalDistribution(1.0, 0.5), new NormalDistribution(2.0, 1.5),
                    RotatedCopula.Rotate(new ClaytonLaw(2.0), rotation));
                Cache[(rotation, expression)] = qd = QuadratureClosedFormTests.Quadrature(model, expression);
            }
            return qd;
        }
    }

    [Theory]
    [MemberData(nameof(Rows))]
    public void MatchesScipyIntegration(int rotation, string expression, double q, double cdf, double pdf)
    {
        var qd = For(rotation, expression);
        // Both sides integrate to ~1e−10; 1e−8 absolute on the CDF and 1e−6 relative on the density leave margin for both error estimates.
        Assert.Equal(cdf, qd.Cdf(q), 1e-8);
        Assert.True(Math.Abs(qd.Density(q, 1e-4) - pdf) <= 1e-6 * pdf + 1e-10, $"density {qd.Density(q, 1e-4)} vs SciPy {pdf}");
    }
}
