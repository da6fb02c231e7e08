using PairFit.Core.Common;

namespace PairFit.Core.Marginals;

/// <summary>
/// One variable's values prepared once for every candidate family: sorted copy, moments,
/// logarithms (when all values are positive) and sample L-moments, so that families with
/// sufficient statistics fit without touching the data again.
/// </summary>
public sealed class MarginalSample
{
    private double[]? _logs;
    private double[]? _log10s;
    private LMoments? _lMoments, _logLMoments;
    private MarginalSample? _subsample;

    public MarginalSample(ReadOnlySpan<double> values)
    {
        var sorted = values.ToArray();
        Array.Sort(sorted);
        Values = sorted;
        N = sorted.Length;
        if (N == 0) throw new ArgumentException("empty sample", nameof(values));
        Min = sorted[0];
        Max = sorted[^1];
        // Scale by the largest magnitude so that sums of squares neither overflow (1e300) nor
        // underflow (1e-300); the moments are scaled back at the end.
        Magnitude = Math.Max(Math.Abs(Min), Math.Abs(Max));
        double s = Magnitude > 0 ? Magnitude : 1.0;
        double sum = 0;
        for (int i = 0; i < N; i++) sum += sorted[i] / s;
        double meanScaled = sum / N;
        double ss = 0, s3 = 0;
        for (int i = 0; i < N; i++)
        {
            double d = sorted[i] / s - meanScaled;
            ss += d * d;
            s3 += d * d * d;
        }
        Mean = meanScaled * s;
        double sdScaled = Math.Sqrt(ss / N);
        StandardDeviation = sdScaled * s;
        Skewness = sdScaled > 0 ? s3 / N / (sdScaled * sdScaled * sdScaled) : 0.0;
        if (Min > 0)
        {
            double sl = 0;
            var logs = Logs;
            for (int i = 0; i < N; i++) sl += logs[i];
            MeanLog = sl / N;
            double sll = 0;
            for (int i = 0; i < N; i++) { double d = logs[i] - MeanLog; sll += d * d; }
            StandardDeviationLog = Math.Sqrt(sll / N);
        }
        else
        {
            MeanLog = double.NaN;
            StandardDeviationLog = double.NaN;
        }
    }

    /// <summary>The values in ascending order.</summary>
    public double[] Values { get; }
    public int N { get; }
    public double Min { get; }
    public double Max { get; }
    public double Magnitude { get; }
    public double Mean { get; }

    /// <summary>Population standard deviation (divisor n), the normal MLE.</summary>
    public double StandardDeviation { get; }

    /// <summary>Moment skewness with divisor n.</summary>
    public double Skewness { get; }

    /// <summary>Mean and population SD of ln x; NaN unless every value is positive.</summary>
    public double MeanLog { get; }
    public double StandardDeviationLog { get; }

    public bool AllPositive => Min > 0;

    /// <summary>ln of the sorted values (ascending); only when every value is positive.</summary>
    public double[] Logs
    {
        get
        {
            if (_logs is not null) return _logs;
            if (!AllPositive) throw new InvalidOperationException("logarithms need positive values");
            var l = new double[N];
            for (int i = 0; i < N; i++) l[i] = Math.Log(Values[i]);
            return _logs = l;
        }
    }

    public LMoments LMoments => _lMoments ??= LMoments.FromSorted(Values);

    /// <summary>log10 of the sorted values (ascending); only when every value is positive.</summary>
    public double[] Log10s
    {
        get
        {
            if (_log10s is not null) return _log10s;
            var logs = Logs;
            var v = new double[N];
            double inv = 1 / Math.Log(10);
            for (int i = 0; i < N; i++) v[i] = logs[i] * inv;
            return _log10s = v;
        }
    }

    /// <summary>L-moments of ln x; only when every value is positive.</summary>
    public LMoments LogLMoments => _logLMoments ??= LMoments.FromSorted(Logs);

    /// <summary>
    /// A stratified subsample of at most <see cref="LikelihoodMaximizer.SubsampleSize"/> values (this
    /// sample itself when it is no larger), for curvature estimates at large n.
    /// </summary>
    public MarginalSample Subsample => N <= Fitting.LikelihoodMaximizer.SubsampleSize ? this
        : _subsample ??= new MarginalSample(Stratified(Values, Fitting.LikelihoodMaximizer.SubsampleSize));

    /// <summary>
    /// Every k-th order statistic (about <paramref name="size"/> of them): a stratified subsample
    /// whose likelihood surface has the shape of the full one, used to find a starting point cheaply.
    /// </summary>
    public static double[] Stratified(double[] sorted, int size)
    {
        if (sorted.Length <= size) return sorted;
        var sub = new double[size];
        double step = (double)sorted.Length / size;
        for (int i = 0; i < size; i++) sub[i] = sorted[(int)((i + 0.5) * step)];
        return sub;
    }

    /// <summary>Σ log f(xᵢ) for a distribution, −Infinity as soon as one value is outside the support.</summary>
    public static double SumLogDensity(IMarginalDistribution d, ReadOnlySpan<double> values)
    {
        double s = 0;
        foreach (double x in values)
        {
            double l = d.LogDensity(x);
            if (double.IsNegativeInfinity(l) || double.IsNaN(l)) return double.NegativeInfinity;
            s += l;
        }
        return s;
    }

    /// <summary>A short description of an offending value for skip reasons.</summary>
    internal string Describe(double v) => v.ToString("G6", System.Globalization.CultureInfo.InvariantCulture);
}
