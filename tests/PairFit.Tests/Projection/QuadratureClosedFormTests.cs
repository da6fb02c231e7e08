using MathNet.Numerics.Distributions;
using PairFit.Core.Copulas;
using PairFit.Core.Marginals;
using PairFit.Core.Model;
using PairFit.Core.Projection;

namespace PairFit.Tests.Projection;

/// <summary>The exact quadrature against laws of sums, products and ratios known in closed form.</summary>
public class QuadratureClosedFormTests
{
    internal static QuadratureDistribution Quadrature(JointModel model, string expression)
        => new(model, InversionChain.TryBuild(ExpressionParser.Parse(expression))
                      ?? throw new InvalidOperationException("expected y to occur once"));

    // The quadrature aims at 1e−11 absolute / 1e−9 relative error per integral; 1e−9 absolute on
    // a probability leaves room for the error estimate's own slack.
    private const double ProbabilityTolerance = 1e-9;

    [Theory]
    [InlineData(0.05)]
    [InlineData(0.3)]
    [InlineData(1.0)]
    [InlineData(2.0)]
    [InlineData(4.0)]
    [InlineData(8.0)]
    public void SumOfIndependentExponentialsIsHypoexponential(double q)
    {
        // Hypoexponential law (Ross 2014, Introduction to Probability Models, 11th ed., section on the hypoexponential law; from memory):
        // f(q) = k1 k2/(k1 − k2) (e^(−k2 q) − e^(−k1 q)), F(q) = 1 − (k2 e^(−k1 q) − k1 e^(−k2 q))/(k2 − k1).
        const double k1 = 1.0, k2 = 2.5;
        var model = new JointModel(new ExponentialDistribution(k1), new ExponentialDistribution(k2), new IndependenceLaw());
        var qd = Quadrature(model, "x + y");
        double density = k1 * k2 / (k1 - k2) * (Math.Exp(-k2 * q) - Math.Exp(-k1 * q));
        double cdf = 1 - (k2 * Math.Exp(-k1 * q) - k1 * Math.Exp(-k2 * q)) / (k2 - k1);
        Assert.Equal(cdf, qd.Cdf(q), ProbabilityTolerance);
        Assert.Equal(1 - cdf, qd.Survival(q), ProbabilityTolerance);
        Assert.True(Math.Abs(qd.Density(q, 1e-3) / density - 1) < 1e-7, $"density {qd.Density(q, 1e-3)} vs {density}");
    }

    [Fact]
    public void SmallTailProbabilitiesKeepTheirRelativeAccuracy()
    {
        // Same hypoexponential law far in the tail: S(20) ≈ 3.4e−9 (Ross 2014, hypoexponential law).
        var model = new JointModel(new ExponentialDistribution(1.0), new ExponentialDistribution(2.5), new IndependenceLaw());
        double exact = (2.5 * Math.Exp(-20.0) - 1.0 * Math.Exp(-50.0)) / 1.5;
        double s = Quadrature(model, "x + y").Survival(20.0);
        Assert.True(Math.Abs(s / exact - 1) < 1e-6, $"S(20) = {s}, exact {exact}");
    }

    [Theory]
    [InlineData(-50.0)]
    [InlineData(-3.0)]
    [InlineData(-0.5)]
    [InlineData(0.0)]
    [InlineData(0.7)]
    [InlineData(2.0)]
    [InlineData(10.0)]
    public void RatioOfIndependentStandardNormalsIsCauchy(double q)
    {
        // Standard Cauchy (Johnson, Kotz and Balakrishnan 1994, vol. 1, ch. 16):
        // F(q) = 1/2 + atan(q)/π, f(q) = 1/(π(1 + q²)). The sign change of x at u = 1/2 is a jump of the preimage.
        var model = new JointModel(new NormalDistribution(0, 1), new NormalDistribution(0, 1), new IndependenceLaw());
        var qd = Quadrature(model, "y / x");
        Assert.Equal(0.5 + Math.Atan(q) / Math.PI, qd.Cdf(q), ProbabilityTolerance);
        double f = 1 / (Math.PI * (1 + q * q));
        Assert.True(Math.Abs(qd.Density(q, 1e-4) / f - 1) < 1e-7, $"density {qd.Density(q, 1e-4)} vs {f}");
    }

    [Fact]
    public void CauchyFarTailIsResolved()
    {
        // P(Q > t) = atan(1/t)/π for the standard Cauchy law (ibid.); at t = 1/tan(π·1e−6) it is exactly 1e−6.
        var model = new JointModel(new NormalDistribution(0, 1), new NormalDistribution(0, 1), new IndependenceLaw());
        var qd = Quadrature(model, "y / x");
        double t = 1 / Math.Tan(Math.PI * 1e-6);
        Assert.True(Math.Abs(qd.Survival(t) / 1e-6 - 1) < 1e-5);
        Assert.True(Math.Abs(qd.Cdf(-t) / 1e-6 - 1) < 1e-5);
    }

    [Theory]
    [InlineData(0.6)]
    [InlineData(-0.8)]
    public void SumOfNormalsUnderGaussianLawIsNormal(double rho)
    {
        // X + Y ~ N(μ1 + μ2, σ1² + σ2² + 2ρσ1σ2) for a bivariate normal pair (standard bivariate-normal result; from memory).
        const double m1 = 1, s1 = 2, m2 = -0.5, s2 = 0.7;
        var model = new JointModel(new NormalDistribution(m1, s1), new NormalDistribution(m2, s2), new GaussianLaw(rho));
        var qd = Quadrature(model, "x + y");
        double sd = Math.Sqrt(s1 * s1 + s2 * s2 + 2 * rho * s1 * s2);
        foreach (double z in new[] { -3.5, -1.2, 0.0, 0.4, 2.0, 4.0 })
        {
            double q = m1 + m2 + z * sd;
            Assert.Equal(Normal.CDF(m1 + m2, sd, q), qd.Cdf(q), 1e-8);
            Assert.True(Math.Abs(qd.Density(q, 1e-4) / Normal.PDF(m1 + m2, sd, q) - 1) < 1e-6);
        }
    }

    [Fact]
    public void ProductOfLognormalsUnderGaussianLawIsLognormal()
    {
        // log XY = log X + log Y is normal with variance σ1² + σ2² + 2ρσ1σ2 (Aitchison and Brown 1957; from memory),
        // the Gaussian copula being invariant under the increasing map log.
        const double m1 = 0.2, s1 = 0.5, m2 = -0.1, s2 = 0.3, rho = -0.4;
        var model = new JointModel(new LogNormalDistribution(m1, s1), new LogNormalDistribution(m2, s2), new GaussianLaw(rho));
        var qd = Quadrature(model, "x * y");
        double sigma = Math.Sqrt(s1 * s1 + s2 * s2 + 2 * rho * s1 * s2);
        foreach (double q in new[] { 0.3, 0.8, 1.1, 2.0, 4.0 })
        {
            Assert.Equal(LogNormal.CDF(m1 + m2, sigma, q), qd.Cdf(q), 1e-8);
            Assert.True(Math.Abs(qd.Density(q, 1e-4) / LogNormal.PDF(m1 + m2, sigma, q) - 1) < 1e-6);
        }
    }

    [Fact]
    public void FlatPiecesOfMaxAreHandled()
    {
        // P(max(X, Y) ≤ q) = P(X ≤ q, Y ≤ q) = F(q)² for independent standard normals (distribution of the maximum, David and Nagaraja 2003);
        // its density 2φ(q)Φ(q) comes from the CDF's derivative because max is flat in y for y < x.
        var model = new JointModel(new NormalDistribution(0, 1), new NormalDistribution(0, 1), new IndependenceLaw());
        var qd = Quadrature(model, "max(x, y)");
        foreach (double q in new[] { -2.0, -0.3, 0.0, 1.0, 2.5 })
        {
            Assert.Equal(Math.Pow(Normal.CDF(0, 1, q), 2), qd.Cdf(q), 1e-9);
            // Central difference with step 1e−3: truncation error ≈ step²·F'''/6 ≲ 1e−7.
            Assert.Equal(2 * Normal.PDF(0, 1, q) * Normal.CDF(0, 1, q), qd.Density(q, 1e-3), 1e-6);
        }
    }

    [Fact]
    public void UndefinedRegionIsMeasured()
    {
        // log(y) is undefined for y ≤ 0: P(defined) = P(Y > 0) = 1 − Φ(−1) for Y ~ N(1, 1).
        var model = new JointModel(new NormalDistribution(0, 1), new NormalDistribution(1, 1), new IndependenceLaw());
        var qd = Quadrature(model, "x + log(y)");
        Assert.Equal(1 - Normal.CDF(0, 1, -1), qd.DefinedProbability(), 1e-9);
    }
}
