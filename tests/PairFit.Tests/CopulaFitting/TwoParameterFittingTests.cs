using MathNet.Numerics;
using PairFit.Core.Copulas;
using PairFit.Core.Copulas.Fitting;
using PairFit.Core.Dependence;

namespace PairFit.Tests.CopulaFitting;

/// <summary>
/// The several-parameter path (Nelder–Mead on free coordinates, 2×2 observed information, large-sample
/// Newton polish) exercised with a test-only two-parameter family: a mixture w·Clayton(θ) + (1 − w)·independence,
/// whose density, CDF and h-function are the weighted sums of the parts (a mixture of copulas is a copula,
/// Nelsen 2006, Exercise 2.3).
/// </summary>
public class TwoParameterFittingTests
{
    [Fact]
    public void NelderMeadPathRecoversBothParametersWithin4StandardErrors()
    {
        var truth = new ClaytonIndependenceMixture(3.0, 0.6);
        var s = FittingTestData.Simulate(truth, 2000, 404);
        double[] u = Ranks.PseudoObservations(s.X), v = Ranks.PseudoObservations(s.Y);
        var fit = CopulaMaximumLikelihood.Fit(ClaytonIndependenceMixture.Family, 0, u, v, [1.0, 0.5]);
        Assert.True(fit.Converged, fit.Note);
        Assert.True(Math.Abs(fit.Parameters[0] - 3.0) <= 4 * fit.StandardErrors[0]!.Value, $"theta {fit.Parameters[0]} se {fit.StandardErrors[0]}");
        Assert.True(Math.Abs(fit.Parameters[1] - 0.6) <= 4 * fit.StandardErrors[1]!.Value, $"w {fit.Parameters[1]} se {fit.StandardErrors[1]}");
        // Independent check of the optimum: no point of an 11×11 grid spanning ±3 standard errors does better.
        for (int i = -5; i <= 5; i++)
            for (int j = -5; j <= 5; j++)
            {
                double th = fit.Parameters[0] + 0.6 * i * fit.StandardErrors[0]!.Value, w = fit.Parameters[1] + 0.6 * j * fit.StandardErrors[1]!.Value;
                if (w <= 0 || w >= 1) continue;
                Assert.True(CopulaLogLikelihood.Sum(new ClaytonIndependenceMixture(th, w), u, v) <= fit.LogLikelihood + 1e-6);
            }
    }

    [Fact]
    public void LargeSampleNewtonPolishLandsOnTheMaximum()
    {
        // Above LargeSample pairs the fit is a subsample Nelder–Mead plus Newton steps on all the data. Checked
        // independently of the optimiser: no point of a 9×9 grid spanning ±0.4 standard errors has a higher ℓ
        // (a quadratic maximum would beat the grid's best neighbour by ≥ ½(0.1)² ≈ 5e-3, far above round-off).
        var s = FittingTestData.Simulate(new ClaytonIndependenceMixture(2.0, 0.7), CopulaMaximumLikelihood.LargeSample + 1000, 405);
        double[] u = Ranks.PseudoObservations(s.X), v = Ranks.PseudoObservations(s.Y);
        var fast = CopulaMaximumLikelihood.Fit(ClaytonIndependenceMixture.Family, 0, u, v, [1.0, 0.5]);
        Assert.True(fast.Converged, fast.Note);
        Assert.True(Math.Abs(fast.Parameters[0] - 2.0) <= 4 * fast.StandardErrors[0]!.Value);
        Assert.True(Math.Abs(fast.Parameters[1] - 0.7) <= 4 * fast.StandardErrors[1]!.Value);
        for (int i = -4; i <= 4; i++)
            for (int j = -4; j <= 4; j++)
            {
                if (i == 0 && j == 0) continue;
                double th = fast.Parameters[0] + 0.1 * i * fast.StandardErrors[0]!.Value, w = fast.Parameters[1] + 0.1 * j * fast.StandardErrors[1]!.Value;
                Assert.True(CopulaLogLikelihood.Sum(new ClaytonIndependenceMixture(th, w), u, v) <= fast.LogLikelihood + 1e-6, $"grid point ({i}, {j})");
            }
    }

    /// <summary>w·C_θ + (1 − w)·Π with C_θ Clayton; θ in [1e−6, 200], w in (0, 1).</summary>
    private sealed class ClaytonIndependenceMixture : ICopula
    {
        public static readonly ICopulaFamily Family = new MixtureFamily();
        private readonly ICopula _clayton;

        public ClaytonIndependenceMixture(double theta, double weight)
        {
            if (!(weight > 0 && weight < 1)) throw new ArgumentOutOfRangeException(nameof(weight));
            _clayton = new ClaytonLaw(theta);
            Weight = weight;
        }

        public double Weight { get; }
        string ICopula.Family => "test-mixture";
        public int Rotation => 0;
        public IReadOnlyList<string> ParameterNames => ["theta", "weight"];
        public IReadOnlyList<double> Parameters => [_clayton.Parameters[0], Weight];
        public double LogDensity(double u, double v) => Math.Log(Weight * _clayton.Density(u, v) + (1 - Weight));
        public double Cdf(double u, double v) => Weight * _clayton.Cdf(u, v) + (1 - Weight) * u * v;
        public double ConditionalCdf(double u, double v) => Weight * _clayton.ConditionalCdf(u, v) + (1 - Weight) * v;

        public double InverseConditionalCdf(double u, double w)
        {
            double lo = 0, hi = 1; // h is increasing in v: bisection to double resolution
            for (int i = 0; i < 60; i++) { double m = 0.5 * (lo + hi); if (ConditionalCdf(u, m) < w) lo = m; else hi = m; }
            return 0.5 * (lo + hi);
        }

        // τ = 4 ∫∫ C c − 1 (Nelsen 2006, Theorem 5.1.3) by quadrature; only read for reporting.
        public double KendallTau => 4 * Integrate.OnRectangle((u, v) => Cdf(u, v) * Math.Exp(LogDensity(u, v)), 0, 1, 0, 1, 64) - 1;
        public double SpearmanRho => CopulaMeasures.SpearmanRhoByQuadrature(this);
        public double TailLower => Weight * _clayton.TailLower;
        public double TailUpper => 0;

        private sealed class MixtureFamily : ICopulaFamily
        {
            public string Name => "test-mixture";
            public IReadOnlyList<string> ParameterNames => ["theta", "weight"];
            public IReadOnlyList<double> LowerBounds => [1e-6, 0.0];
            public IReadOnlyList<double> UpperBounds => [200.0, 1.0];
            public IReadOnlyList<int> Rotations => [0];
            public double[]? StartFromTau(double tau) => tau <= 0 ? null : [2 * tau / (1 - tau), 0.5];
            public ICopula Create(IReadOnlyList<double> p) => new ClaytonIndependenceMixture(p[0], p[1]);
        }
    }
}
