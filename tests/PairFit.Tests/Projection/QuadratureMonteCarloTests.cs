using PairFit.Core.Copulas;
using PairFit.Core.Marginals;
using PairFit.Core.Model;
using PairFit.Core.Projection;

namespace PairFit.Tests.Projection;

/// <summary>
/// Quadrature against simulation for every copula family in the registry and every rotation,
/// on a sum and a ratio. Sampling goes through the copula's inverse conditional CDF, the
/// quadrature through its conditional CDF, so the two share no code beyond the marginals.
/// </summary>
public class QuadratureMonteCarloTests
{
    private const int Draws = 40_000;

    // 99.9 % Dvoretzky–Kiefer–Wolfowitz band with Massart's (1990) constant: P(sup|F_n − F| > ε) ≤ 2e^(−2nε²).
    private static readonly double Band = Math.Sqrt(Math.Log(2 / 0.001) / (2.0 * Draws));

    public static IEnumerable<object[]> Cases()
    {
        foreach (var family in CopulaRegistry.Families)
        {
            var parameters = family.StartFromTau(0.5);
            if (parameters is null) continue;
            foreach (int rotation in family.Rotations)
                foreach (string expression in new[] { "x + y", "y / x" })
                    yield return [family.Name, rotation, expression];
        }
    }

    [Fact]
    public void CasesCoverAtLeastClaytonInAllRotations()
        => Assert.Equal(8, Cases().Count(c => (string)c[0] == "clayton"));

    [Theory]
    [MemberData(nameof(Cases))]
    public void QuadratureAgreesWithMonteCarloWithinItsError(string family, int rotation, string expression)
    {
        var f = CopulaRegistry.Find(family);
        var copula = RotatedCopula.Rotate(f.Create(f.StartFromTau(0.5)!), rotation);
        // Y normal crosses 0 so the ratio changes sign; X lognormal keeps the ratio finite.
        var model = new JointModel(new LogNormalDistribution(0.0, 0.4), new NormalDistribution(1.0, 1.0), copula);
        var program = new CompiledExpression(ExpressionParser.Parse(expression));
        var (x, y) = model.Sample(Draws, seed: 4242 + rotation);
        var q = new double[Draws];
        program.Evaluate(x, y, q);
        Array.Sort(q);
        var qd = QuadratureClosedFormTests.Quadrature(model, expression);
        foreach (double p in new[] { 0.02, 0.1, 0.25, 0.5, 0.75, 0.9, 0.98 })
        {
            double t = q[(int)(p * Draws)];
            double empirical = SampleFraction(q, t);
            Assert.True(Math.Abs(qd.Cdf(t) - empirical) <= Band, $"{family} {rotation}° {expression}: F({t}) = {qd.Cdf(t)} vs Monte Carlo {empirical} (band {Band})");
        }
    }

    private static double SampleFraction(double[] sorted, double t)
    {
        int k = 0;
        while (k < sorted.Length && sorted[k] <= t) k++;
        return (double)k / sorted.Length;
    }
}
