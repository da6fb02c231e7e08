using PairFit.Core.Common;
using PairFit.Core.Copulas;
using PairFit.Core.Copulas.Sampling;
using PairFit.Core.Marginals;

namespace PairFit.Core.Model;

/// <summary>
/// The fitted joint law of (X, Y) by Sklar's theorem: H(x, y) = C(F_X(x), F_Y(y)),
/// f(x, y) = c(F_X(x), F_Y(y)) f_X(x) f_Y(y). Saved in the results file and reused by later
/// commands (projection, joint probabilities, simulation) without refitting.
/// </summary>
public sealed record JointModel(IMarginalDistribution X, IMarginalDistribution Y, ICopula Copula)
{
    /// <summary>log f(x, y); −Infinity outside the support.</summary>
    public double LogDensity(double x, double y)
    {
        double lx = X.LogDensity(x), ly = Y.LogDensity(y);
        if (double.IsNegativeInfinity(lx) || double.IsNegativeInfinity(ly)) return double.NegativeInfinity;
        double u = MathExtras.ClampOpen(X.Cdf(x)), v = MathExtras.ClampOpen(Y.Cdf(y));
        return Copula.LogDensity(u, v) + lx + ly;
    }

    /// <summary>H(x, y) = P(X ≤ x, Y ≤ y).</summary>
    public double Cdf(double x, double y) => Copula.Cdf(X.Cdf(x), Y.Cdf(y));

    /// <summary>
    /// Draws n pairs (u, v) from the copula by conditional inversion: u ~ U(0,1), w ~ U(0,1),
    /// v = h⁻¹(w | u). Block b of 4096 draws uses random stream b of <paramref name="seed"/>, so the
    /// result is the same whatever the number of threads.
    /// </summary>
    public static void SampleCopula(ICopula copula, int n, int seed, Span<double> u, Span<double> v)
    {
        const int block = 4096;
        int blocks = (n + block - 1) / block;
        double[] ua = new double[n], va = new double[n];
        Parallel.For(0, blocks, b =>
        {
            int start = b * block, count = Math.Min(n, start + block) - start;
            CopulaSampler.Fill(copula, RandomStreams.For(seed, b), ua.AsSpan(start, count), va.AsSpan(start, count));
        });
        ua.AsSpan().CopyTo(u);
        va.AsSpan().CopyTo(v);
    }

    /// <summary>Draws n pairs (x, y) from the joint model: copula draws pushed through the marginal quantiles.</summary>
    public (double[] X, double[] Y) Sample(int n, int seed)
    {
        double[] x = new double[n], y = new double[n];
        SampleCopula(Copula, n, seed, x, y);
        for (int i = 0; i < n; i++)
        {
            x[i] = X.Quantile(x[i]);
            y[i] = Y.Quantile(y[i]);
        }
        return (x, y);
    }
}
