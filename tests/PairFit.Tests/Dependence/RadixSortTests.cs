using PairFit.Core.Common;
using PairFit.Core.Dependence;

namespace PairFit.Tests.Dependence;

/// <summary>The radix sort behind ranks and Kendall's tau against .NET's comparison sort.</summary>
public class RadixSortTests
{
    [Fact]
    public void KeysKeepTheOrderOfDoublesIncludingSpecialValues()
    {
        double[] ordered = [double.NegativeInfinity, double.MinValue, -1e300, -1, -double.Epsilon, 0, double.Epsilon, 1e-300, 1, 1e300, double.MaxValue, double.PositiveInfinity];
        for (int i = 1; i < ordered.Length; i++)
            Assert.True(RadixSort.Key(ordered[i - 1]) < RadixSort.Key(ordered[i]), $"{ordered[i - 1]} vs {ordered[i]}");
        Assert.Equal(RadixSort.Key(0.0), RadixSort.Key(-0.0)); // equal values, equal keys
        foreach (double v in ordered) Assert.Equal(v, RadixSort.Value(RadixSort.Key(v)));
        Assert.Throws<ArgumentException>(() => RadixSort.Keys([1, double.NaN], "value"));
    }

    [Fact]
    public void OrderIsStableAndSortsLikeArraySort()
    {
        for (int seed = 1; seed <= 30; seed++)
        {
            var rng = RandomStreams.For(seed);
            int n = rng.Next(1, 5000);
            // Wide magnitudes and signs, and many ties (rounded values) in half of the cases.
            var v = Enumerable.Range(0, n).Select(_ => (rng.NextDouble() - 0.4) * Math.Pow(10, rng.Next(-5, 6))).ToArray();
            if (seed % 2 == 0) v = v.Select(a => Math.Round(a)).ToArray();
            var order = RadixSort.Order(v, "value", out var keys);
            var expected = v.ToArray();
            Array.Sort(expected);
            for (int i = 0; i < n; i++)
            {
                Assert.Equal(expected[i], v[order[i]]);
                Assert.Equal(RadixSort.Key(expected[i]), keys[i]);
                if (i > 0 && v[order[i]] == v[order[i - 1]]) Assert.True(order[i] > order[i - 1], "ties keep input order");
            }
        }
    }

    [Fact]
    public void SortInPlaceMatchesArraySort()
    {
        var rng = RandomStreams.For(9);
        var v = Enumerable.Range(0, 4000).Select(_ => Math.Round((rng.NextDouble() - 0.5) * 100, 1)).ToArray();
        var expected = v.ToArray();
        Array.Sort(expected);
        RadixSort.Sort(v, "value");
        Assert.Equal(expected, v);
    }

    [Fact]
    public void SortPairsIsLexicographic()
    {
        var rng = RandomStreams.For(8);
        var x = Enumerable.Range(0, 3000).Select(_ => (double)rng.Next(0, 40)).ToArray();
        var y = Enumerable.Range(0, 3000).Select(_ => rng.NextDouble() - 0.5).ToArray();
        var xk = RadixSort.Keys(x, "x");
        var yk = RadixSort.Keys(y, "y");
        RadixSort.SortPairs(xk, yk);
        var expected = x.Zip(y).OrderBy(p => p.First).ThenBy(p => p.Second).ToArray();
        for (int i = 0; i < x.Length; i++)
        {
            Assert.Equal(expected[i].First, RadixSort.Value(xk[i]));
            Assert.Equal(expected[i].Second, RadixSort.Value(yk[i]));
        }
    }
}
