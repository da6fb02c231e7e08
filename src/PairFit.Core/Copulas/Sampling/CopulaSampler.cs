using PairFit.Core.Common;

namespace PairFit.Core.Copulas.Sampling;

/// <summary>Draws pairs from a copula by conditional inversion (Nelsen 2006, section 2.9): u ~ U(0,1), w ~ U(0,1), v = h⁻¹(w | u).</summary>
public static class CopulaSampler
{
    /// <summary>Fills <paramref name="u"/> and <paramref name="v"/> (same length) from one random stream.</summary>
    public static void Fill(ICopula copula, Random rng, Span<double> u, Span<double> v)
    {
        for (int i = 0; i < u.Length; i++)
        {
            double ui = RandomStreams.OpenUniform(rng), wi = RandomStreams.OpenUniform(rng);
            u[i] = ui;
            v[i] = copula.InverseConditionalCdf(ui, wi);
        }
    }
}
