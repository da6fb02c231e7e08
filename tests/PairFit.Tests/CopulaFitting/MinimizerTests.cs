using PairFit.Core.Copulas.Fitting;

namespace PairFit.Tests.CopulaFitting;

public class MinimizerTests
{
    [Theory]
    [InlineData(0.0, 0.05)]
    [InlineData(9.0, 0.05)]
    [InlineData(-30.0, 1.0)]
    public void ScalarFindsTheClosedFormMinimum(double start, double step)
    {
        // f(x) = x − 2 log x has its minimum at x = 2 (f' = 1 − 2/x); searched on the free coordinate t = log x.
        var m = Minimizers.Scalar(t => Math.Exp(t) - 2 * t, start, step, -40, 40);
        Assert.True(m.Converged);
        Assert.Equal(Math.Log(2), m.Point[0], 7);
    }

    [Fact]
    public void ScalarStopsAtALimitWhenTheMinimumIsBeyondIt()
    {
        var m = Minimizers.Scalar(t => -t, 0, 0.1, -5, 5);
        Assert.Equal(5, m.Point[0], 6);
    }

    [Fact]
    public void NelderMeadFindsTheRosenbrockMinimum()
    {
        // Rosenbrock (1960): minimum 0 at (1, 1).
        var m = Minimizers.NelderMead(p => 100 * Math.Pow(p[1] - p[0] * p[0], 2) + Math.Pow(1 - p[0], 2),
            [-1.2, 1.0], [0.2, 0.2], [-10, -10], [10, 10]);
        Assert.True(m.Converged);
        Assert.Equal(1.0, m.Point[0], 4);
        Assert.Equal(1.0, m.Point[1], 4);
    }

    [Theory]
    [InlineData(-1.0, 1.0, 0.3)]
    [InlineData(1.0, double.PositiveInfinity, 4.0)]
    [InlineData(1e-6, 200.0, 1e-3)]
    public void TransformRoundTripsAndItsDerivativeMatchesADifference(double lo, double hi, double p)
    {
        var tr = new ParameterTransform(lo, hi);
        double t = tr.ToFree(p);
        Assert.Equal(p, tr.FromFree(t), 12);
        double h = 1e-6;
        Assert.Equal((tr.FromFree(t + h) - tr.FromFree(t - h)) / (2 * h), tr.Derivative(t), 6);
        if (lo == -1 && hi == 1) Assert.Equal(2 * Math.Atanh(p), t, 12); // scaled logit on (−1, 1) is 2 atanh ρ
    }
}
