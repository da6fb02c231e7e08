using MathNet.Numerics.Distributions;
using PairFit.Core.Marginals;

namespace PairFit.Tests.Marginals;

/// <summary>Standard errors and estimators against closed forms and an outside estimator.</summary>
public class StandardErrorTests
{
    // Normal MLE: observed information at the optimum is diag(n/σ², 2n/σ²), so
    // se(μ) = σ̂/√n and se(σ) = σ̂/√(2n) (e.g. Casella and Berger 2002, Example 7.2.12 with the
    // second derivatives). Exponential: se(λ) = λ̂/√n.
    [Fact]
    public void NormalAndExponentialStandardErrorsMatchClosedForm()
    {
        var data = MarginalReference.Dataset("normal_101");
        var c = MarginalAnalysis.Fit(data, new MarginalOptions { Forced = "normal" }).Section.Candidates.Single();
        double n = data.Length, sigma = c.Parameters!["sigma"];
        // Central-difference Hessian: relative accuracy ~1e-6 on these quadratics-in-disguise; 1e-4 is safe.
        Assert.Equal(sigma / Math.Sqrt(n), c.StandardErrors!["mu"]!.Value, 1e-4 * sigma / Math.Sqrt(n));
        Assert.Equal(sigma / Math.Sqrt(2 * n), c.StandardErrors!["sigma"]!.Value, 1e-4 * sigma / Math.Sqrt(2 * n));

        var e = MarginalAnalysis.Fit(MarginalReference.Dataset("exponential_105"), new MarginalOptions { Forced = "exponential" }).Section.Candidates.Single();
        double rate = e.Parameters!["rate"];
        Assert.Equal(rate / Math.Sqrt(400), e.StandardErrors!["rate"]!.Value, 1e-4 * rate / 20);
    }

    // MathNet's Weibull.Estimate is an independent MLE implementation; ours solves the profile
    // equation. On this sample MathNet stops 5e-6 (relative) short of the optimum, which SciPy's
    // polished fit confirms to 1e-9 (MarginalScipyTests), so: agreement to 1e-5 and our likelihood
    // at least as high as at MathNet's estimate.
    [Fact]
    public void WeibullAgreesWithMathNetEstimate()
    {
        var data = MarginalReference.Dataset("weibull_104");
        var ours = MarginalAnalysis.Fit(data, new MarginalOptions { Forced = "weibull" }).Selected.Parameters;
        var theirs = Weibull.Estimate(data);
        Assert.Equal(theirs.Shape, ours[0], 1e-5 * theirs.Shape);
        Assert.Equal(theirs.Scale, ours[1], 1e-5 * theirs.Scale);
        var sample = new MarginalSample(data);
        var def = MarginalRegistry.Find("weibull")!;
        Assert.True(def.LogLikelihood(sample, [ours[0], ours[1]]) >= def.LogLikelihood(sample, [theirs.Shape, theirs.Scale]));
    }

    // MathNet's Normal.Estimate uses the n − 1 standard deviation (stack notes §6), not the MLE.
    [Fact]
    public void NormalMleUsesDivisorN()
    {
        var data = MarginalReference.Dataset("normal_101");
        var ours = MarginalAnalysis.Fit(data, new MarginalOptions { Forced = "normal" }).Selected.Parameters;
        var theirs = Normal.Estimate(data);
        double n = data.Length;
        Assert.Equal(theirs.Mean, ours[0], 1e-12 * Math.Abs(theirs.Mean));
        Assert.Equal(theirs.StdDev * Math.Sqrt((n - 1) / n), ours[1], 1e-12 * theirs.StdDev);
    }
}
