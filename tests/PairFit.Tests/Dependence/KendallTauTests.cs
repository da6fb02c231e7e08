using PairFit.Core.Common;
using PairFit.Core.Dependence;

namespace PairFit.Tests.Dependence;

/// <summary>The O(n log n) Kendall routines against a plain O(n²) pair count (an independent computation).</summary>
public class KendallTauTests
{
    /// <summary>Plain pair count straight from the definition of tau-b (Kendall 1945).</summary>
    private static (long S, long TiesX, long TiesY, double TauB) BruteForce(double[] x, double[] y)
    {
        int n = x.Length;
        long s = 0, tx = 0, ty = 0;
        for (int i = 0; i < n; i++)
            for (int j = i + 1; j < n; j++)
            {
                int a = Math.Sign(x[i] - x[j]), b = Math.Sign(y[i] - y[j]);
                s += a * b;
                if (a == 0) tx++;
                if (b == 0) ty++;
            }
        double n0 = (double)n * (n - 1) / 2;
        return (s, tx, ty, s / Math.Sqrt((n0 - tx) * (n0 - ty)));
    }

    private static (double[] X, double[] Y) RandomPairs(int seed, int n, int tieLevels, double dependence)
    {
        var rng = RandomStreams.For(seed);
        var x = new double[n];
        var y = new double[n];
        for (int i = 0; i < n; i++)
        {
            double a = rng.NextDouble(), b = dependence * a + (1 - Math.Abs(dependence)) * rng.NextDouble();
            // tieLevels > 0 rounds to that many levels, producing ties in x, in y and in both.
            x[i] = tieLevels > 0 ? Math.Floor(a * tieLevels) : a;
            y[i] = tieLevels > 0 ? Math.Floor((b + 1) * tieLevels / 2) : b;
        }
        return (x, y);
    }

    [Theory]
    [InlineData(0)]     // continuous: no ties
    [InlineData(3)]     // very heavy ties
    [InlineData(12)]    // moderate ties
    [InlineData(200)]   // light ties
    public void MergeSortCountEqualsPlainCountOverManySeeds(int tieLevels)
    {
        for (int seed = 1; seed <= 150; seed++)
        {
            var rng = RandomStreams.For(seed, 99);
            int n = 2 + rng.Next(0, 260); // spans the insertion-sort block size (16) and several merge levels
            double dep = rng.NextDouble() * 2 - 1;
            var (x, y) = RandomPairs(seed, n, tieLevels, dep);
            var plain = BruteForce(x, y);
            var fast = KendallTau.Count(x, y);
            Assert.Equal(plain.S, fast.S);
            Assert.Equal(plain.TiesX, fast.XTies.Pairs);
            Assert.Equal(plain.TiesY, fast.YTies.Pairs);
            double tau = KendallTau.TauB(x, y);
            if (double.IsNaN(plain.TauB)) Assert.True(double.IsNaN(tau), $"seed {seed}: constant input must give NaN");
            else Assert.Equal(plain.TauB, tau, 1e-14); // same integers, one division and a square root
        }
    }

    [Fact]
    public void ConcordanceScoresMatchPlainPerObservationCount()
    {
        for (int seed = 1; seed <= 60; seed++)
        {
            var (x, y) = RandomPairs(seed, 5 + seed * 3, seed % 2 == 0 ? 7 : 0, 0.5);
            var (score, xGroup, yGroup) = KendallTau.ConcordanceScores(x, y);
            long total = 0;
            for (int i = 0; i < x.Length; i++)
            {
                long expected = 0;
                int gx = 0, gy = 0;
                for (int j = 0; j < x.Length; j++)
                {
                    expected += Math.Sign(x[i] - x[j]) * Math.Sign(y[i] - y[j]);
                    if (x[i] == x[j]) gx++;
                    if (y[i] == y[j]) gy++;
                }
                Assert.Equal(expected, score[i]);
                Assert.Equal(gx, xGroup[i]);
                Assert.Equal(gy, yGroup[i]);
                total += score[i];
            }
            Assert.Equal(2 * KendallTau.Count(x, y).S, total); // each pair is counted from both ends
        }
    }

    [Fact]
    public void JackknifeEqualsExplicitLeaveOneOut()
    {
        for (int seed = 1; seed <= 20; seed++)
        {
            var (x, y) = RandomPairs(seed, 30 + seed, seed % 3 == 0 ? 5 : 0, -0.4);
            int n = x.Length;
            var loo = new double[n];
            for (int i = 0; i < n; i++)
            {
                var xi = x.Where((_, j) => j != i).ToArray();
                var yi = y.Where((_, j) => j != i).ToArray();
                loo[i] = BruteForce(xi, yi).TauB;
            }
            double mean = loo.Average();
            double expected = Math.Sqrt((n - 1.0) / n * loo.Sum(t => (t - mean) * (t - mean)));
            Assert.Equal(expected, KendallTau.JackknifeStandardError(x, y, KendallTau.Count(x, y))!.Value, 1e-13);
        }
    }

    [Fact]
    public void ExactPValueMatchesFullPermutationEnumeration()
    {
        // Independent check: enumerate all n! orderings of y for n = 6 and 7 and count |S'| ≥ |S|.
        foreach (int n in new[] { 6, 7 })
        {
            var x = Enumerable.Range(1, n).Select(i => (double)i).ToArray();
            var perms = Permutations(Enumerable.Range(1, n).Select(i => (double)i).ToArray()).ToList();
            var scores = perms.Select(p => Math.Abs(KendallTau.Count(x, p).S)).ToArray();
            foreach (var y in perms.Take(200))
            {
                var c = KendallTau.Count(x, y);
                double expected = (double)scores.Count(s => s >= Math.Abs(c.S)) / perms.Count;
                Assert.Equal(expected, KendallTau.PValue(c, out bool exact), 13);
                Assert.True(exact);
            }
        }
    }

    private static IEnumerable<double[]> Permutations(double[] items)
    {
        if (items.Length == 1) { yield return items; yield break; }
        for (int i = 0; i < items.Length; i++)
            foreach (var rest in Permutations(items.Where((_, j) => j != i).ToArray()))
                yield return [items[i], .. rest];
    }

    [Fact]
    public void NullVarianceWithoutTiesIsTheClassicalFormula()
    {
        // Without ties Var(S) = n(n − 1)(2n + 5)/18 (Kendall 1970, eq. 4.3 with no tie terms).
        var (x, y) = RandomPairs(5, 37, 0, 0.3);
        double n = 37;
        Assert.Equal(n * (n - 1) * (2 * n + 5) / 18, KendallTau.Count(x, y).NullVarianceOfS, 1e-9);
    }

    [Fact]
    public void PerfectAgreementAndReversalGivePlusAndMinusOne()
    {
        double[] x = [3, 1, 4, 1, 5, 9, 2, 6];
        double[] up = x.Select(v => 2 * v + 1).ToArray();
        double[] down = x.Select(v => -v).ToArray();
        Assert.Equal(1.0, KendallTau.TauB(x, up), 15);
        Assert.Equal(-1.0, KendallTau.TauB(x, down), 15);
    }

    [Fact]
    public void ConstantInputGivesNaNAndNaNInputIsRefused()
    {
        Assert.True(double.IsNaN(KendallTau.TauB([1, 1, 1], [1, 2, 3])));
        Assert.Throws<ArgumentException>(() => KendallTau.TauB([1, double.NaN, 3], [1, 2, 3]));
    }
}
