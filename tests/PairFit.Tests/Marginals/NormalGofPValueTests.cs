using Gof = PairFit.Core.Marginals.Fitting.GoodnessOfFitTests;

namespace PairFit.Tests.Marginals;

public class NormalGofPValueTests
{
    // D'Agostino and Stephens (1986), Table 4.9: the p-value approximations for the modified
    // statistics of the normal case with estimated mean and variance. A p-value must fall as the
    // misfit grows; the fitted parabolas in the exponent turn upward far out, which must not send
    // the p-value of a gross misfit back towards 1.
    [Fact]
    public void CramerVonMisesPValueFallsMonotonicallyAndStaysTinyForGrossMisfits()
    {
        double previous = 1.0;
        for (double w = 0.01; w <= 20; w += 0.01)
        {
            double p = Gof.CramerVonMisesNormalPValue(w, 1000);
            Assert.True(p <= previous + 1e-12, $"p rose at W² = {w}: {p} after {previous}");
            previous = p;
        }
        Assert.True(Gof.CramerVonMisesNormalPValue(3.65, 2946) < 1e-9);
        // Table 4.9's 5 % point of W* in this case is 0.126 (from memory; consistent with the formula's branch).
        Assert.InRange(Gof.CramerVonMisesNormalPValue(0.126, 100000), 0.04, 0.06);
    }

    [Fact]
    public void AndersonDarlingPValueFallsMonotonically()
    {
        double previous = 1.0;
        for (double a = 0.05; a <= 400; a += 0.05)
        {
            double p = Gof.AndersonDarlingNormalPValue(a, 1000);
            Assert.True(p <= previous + 1e-12, $"p rose at A² = {a}: {p} after {previous}");
            previous = p;
        }
        // Table 4.9's 5 % point of A* in this case is 0.752 (from memory).
        Assert.InRange(Gof.AndersonDarlingNormalPValue(0.752, 100000), 0.04, 0.06);
    }
}
