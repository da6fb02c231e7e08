using PairFit.Core.Common;
using PairFit.Core.Copulas;
using PairFit.Core.Data;
using PairFit.Core.Dependence;

namespace PairFit.Tests.Dependence;

public class TailDependenceTests
{
    [Fact]
    public void ComonotoneDataHaveFullTailDependenceAndCountermonotoneNone()
    {
        var x = Enumerable.Range(1, 400).Select(i => (double)i).ToArray();
        var up = x.Select(v => Math.Exp(v / 100)).ToArray();
        var down = x.Select(v => -v).ToArray();
        // Closed forms: the upper Fréchet bound M has λ_L = λ_U = 1, the lower bound W has 0 (Nelsen 2006, sec. 5.4).
        var m = TailDependence.Estimate(x, up);
        Assert.Equal(1.0, m.Lower, 15);
        Assert.Equal(1.0, m.Upper, 15);
        Assert.Equal(20, m.K);               // k = floor(sqrt(400))
        Assert.Equal(0.95, m.UpperThreshold, 15);
        var w = TailDependence.Estimate(x, down);
        Assert.Equal(0.0, w.Lower);
        Assert.Equal(0.0, w.Upper);
    }

    [Fact]
    public void CurveRecoversClaytonDiagonalBySimulation()
    {
        // Simulation-recovery: Clayton θ = 2 sampled by conditional inversion (seeded), then the
        // empirical λ_L(t) = C_n(t,t)/t against the closed form C(t,t)/t = (2t^-θ − 1)^(-1/θ)/t
        // (Clayton 1978; Nelsen 2006 eq. 4.2.1), and λ_U(t) against (1 − 2t + C(t,t))/(1 − t).
        const int n = 20000;
        var copula = new ClaytonLaw(2.0);
        var rng = RandomStreams.For(42);
        var u = new double[n];
        var v = new double[n];
        for (int i = 0; i < n; i++)
        {
            u[i] = RandomStreams.OpenUniform(rng);
            v[i] = copula.InverseConditionalCdf(u[i], RandomStreams.OpenUniform(rng));
        }
        double[] grid = [0.05, 0.1, 0.2, 0.8, 0.9];
        var curve = TailDependence.Curve(u, v, grid); // true uniforms: the curve is then unbiased
        for (int k = 0; k < grid.Length; k++)
        {
            double t = grid[k], c = copula.Cdf(t, t);
            double pLow = c, pHigh = 1 - 2 * t + c;
            // Each value is a binomial proportion divided by t (or 1 − t): 4 binomial standard errors.
            double seLow = Math.Sqrt(pLow * (1 - pLow) / n) / t, seHigh = Math.Sqrt(pHigh * (1 - pHigh) / n) / (1 - t);
            Assert.InRange(curve.Lower[k], c / t - 4 * seLow, c / t + 4 * seLow);
            Assert.InRange(curve.Upper[k], pHigh / (1 - t) - 4 * seHigh, pHigh / (1 - t) + 4 * seHigh);
        }
    }

    [Fact]
    public void EstimateIsTheCurveAtKOverN()
    {
        var rng = RandomStreams.For(7);
        var x = Enumerable.Range(0, 900).Select(_ => rng.NextDouble()).ToArray();
        var y = x.Select(a => a + 0.3 * rng.NextDouble()).ToArray();
        var e = TailDependence.Estimate(x, y);
        var c = TailDependence.Curve(Ranks.PseudoObservations(x), Ranks.PseudoObservations(y), [30.0 / 900, 1 - 30.0 / 900]);
        Assert.Equal(30, e.K);
        // Same count; the curve divides by n·t, the estimate by the integer k: rounding only.
        Assert.Equal(c.Lower[0], e.Lower, 1e-14);
        Assert.Equal(c.Upper[1], e.Upper, 1e-14);
        // And the rank form (number among the k smallest in both)/k, counted independently here.
        var rx = Ranks.Average(x);
        var ry = Ranks.Average(y);
        int both = Enumerable.Range(0, 900).Count(i => rx[i] <= 30 && ry[i] <= 30);
        Assert.Equal(both / 30.0, e.Lower, 15);
    }

    [Fact]
    public void CurveOnSampleUsesAnEvenGridInsideTheUnitInterval()
    {
        var c = TailDependence.Curve(new double[] { 1, 2, 3, 4 }, new double[] { 1, 3, 2, 4 }, 4);
        Assert.Equal([0.2, 0.4, 0.6, 0.8], c.Thresholds.Select(t => Math.Round(t, 12)).ToArray());
        Assert.Throws<ArgumentOutOfRangeException>(() => TailDependence.Curve(new double[] { 0.5 }, new double[] { 0.5 }, new double[] { 1.0 }));
    }
}
