using MathNet.Numerics.Random;

namespace PairFit.Core.Common;

/// <summary>
/// One user seed drives every random draw. Work that is split across threads (bootstrap
/// replicates, Monte Carlo blocks) takes one independent stream per work item, derived from the
/// seed and the item's index, so results do not depend on how many threads ran them.
/// </summary>
public static class RandomStreams
{
    /// <summary>The generator for stream <paramref name="index"/> of <paramref name="seed"/>.</summary>
    public static Random For(int seed, long index = 0)
    {
        // SplitMix64 finaliser (Steele, Lea and Flood 2014) spreads nearby (seed, index) pairs
        // over the whole 32-bit seed space, so streams 0, 1, 2, ... are not correlated starts.
        ulong z = unchecked((ulong)(uint)seed * 0x9E3779B97F4A7C15UL + (ulong)index * 0xBF58476D1CE4E5B9UL + 0x94D049BB133111EBUL);
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        z ^= z >> 31;
        return new MersenneTwister(unchecked((int)(z ^ (z >> 32))), threadSafe: false);
    }

    /// <summary>A uniform draw strictly inside (0, 1), safe to pass to quantile functions.</summary>
    public static double OpenUniform(Random rng)
    {
        double u;
        do { u = rng.NextDouble(); } while (u <= 0.0);
        return u;
    }
}
