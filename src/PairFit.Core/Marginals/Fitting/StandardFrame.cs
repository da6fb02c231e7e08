namespace PairFit.Core.Marginals.Fitting;

/// <summary>
/// Data shifted by λ1 and divided by λ2 (sample L-moments) for location–scale families: the
/// optimiser then works on numbers of order one whatever the units (1e-300 or 1e300), and the
/// estimates map back exactly (location' = (location − c)/d, scale' = scale/d, shapes unchanged).
/// </summary>
internal sealed class StandardFrame
{
    private StandardFrame(double shift, double scale, double[] values)
    {
        Shift = shift;
        Scale = scale;
        Values = values;
    }

    public double Shift { get; }
    public double Scale { get; }

    /// <summary>Standardised values, ascending.</summary>
    public double[] Values { get; }

    public static StandardFrame Of(MarginalSample s) => Of(s.Values, s.LMoments);

    public static StandardFrame Of(double[] sorted, LMoments l)
    {
        double c = l.L1, d = l.L2 > 0 ? l.L2 : 1.0;
        var y = new double[sorted.Length];
        for (int i = 0; i < y.Length; i++) y[i] = (sorted[i] - c) / d;
        return new StandardFrame(c, d, y);
    }

    /// <summary>(location, scale, shapes…) in data units → standardised units.</summary>
    public double[] Standardise(double[] p)
    {
        var q = (double[])p.Clone();
        q[0] = (p[0] - Shift) / Scale;
        q[1] = p[1] / Scale;
        return q;
    }

    /// <summary>Standardised (location, scale, shapes…) → data units.</summary>
    public double[] Unstandardise(double[] q)
    {
        var p = (double[])q.Clone();
        p[0] = Shift + q[0] * Scale;
        p[1] = q[1] * Scale;
        return p;
    }
}
