namespace PairFit.Core.Projection;

/// <summary>
/// Globally adaptive Gauss–Kronrod quadrature (7-point Gauss, 15-point Kronrod rule, the QK15
/// rule of QUADPACK: Piessens, de Doncker-Kapenga, Überhuber and Kahaner 1983). The interval is
/// first cut at the given break points (known jumps or kinks of the integrand), then the panel
/// with the largest error estimate is halved until the total estimated error is below
/// max(absoluteTolerance, relativeTolerance·|integral|) or the panel budget is spent.
/// </summary>
public static class AdaptiveQuadrature
{
    // Abscissae and weights of the 15-point Kronrod rule and the embedded 7-point Gauss rule on [−1, 1] (QUADPACK qk15).
    private static readonly double[] Xgk =
    [
        0.991455371120812639206854697526329, 0.949107912342758524526189684047851, 0.864864423359769072789712788640926,
        0.741531185599394439863864773280788, 0.586087235467691130294144845693013, 0.405845151377397166906606412076961,
        0.207784955007898467600689403773245, 0.000000000000000000000000000000000,
    ];

    private static readonly double[] Wgk =
    [
        0.022935322010529224963732008058970, 0.063092092629978553290700663189204, 0.104790010322250183839876322541518,
        0.140653259715525918745189590510238, 0.169004726639267902826583426598550, 0.190350578064785409913256402421014,
        0.204432940075298892414161999234649, 0.209482141084727828012999174891714,
    ];

    private static readonly double[] Wg =
    [
        0.129484966168869693270611432679082, 0.279705391489276667901467771423780,
        0.381830050505118944950369775488975, 0.417959183673469387755102040816327,
    ];

    /// <summary>The 15 nodes of the rule on [a, b], in a fixed order (used to precompute integrand inputs).</summary>
    public static void Nodes(double a, double b, Span<double> nodes)
    {
        double c = 0.5 * (a + b), h = 0.5 * (b - a);
        for (int j = 0; j < 7; j++)
        {
            nodes[2 * j] = c - h * Xgk[j];
            nodes[2 * j + 1] = c + h * Xgk[j];
        }
        nodes[14] = c;
    }

    /// <summary>
    /// Integral and error estimate of f on [a, b] from its values at <see cref="Nodes"/>. The raw
    /// Kronrod–Gauss difference is rescaled as in QUADPACK's qk15,
    /// err = resasc·min(1, (200|K − G|/resasc)^1.5), which tracks the (much smaller) error of the
    /// Kronrod result on smooth panels instead of that of the Gauss result.
    /// </summary>
    public static (double Value, double Error) Rule(double a, double b, ReadOnlySpan<double> values)
    {
        double h = 0.5 * (b - a);
        double center = values[14];
        double kronrod = center * Wgk[7], gauss = center * Wg[3], absolute = Math.Abs(center) * Wgk[7];
        for (int j = 0; j < 7; j++)
        {
            double pair = values[2 * j] + values[2 * j + 1];
            kronrod += Wgk[j] * pair;
            absolute += Wgk[j] * (Math.Abs(values[2 * j]) + Math.Abs(values[2 * j + 1]));
            if (j % 2 == 1) gauss += Wg[j / 2] * pair;
        }
        double mean = 0.5 * kronrod;
        double spread = Wgk[7] * Math.Abs(center - mean);
        for (int j = 0; j < 7; j++)
            spread += Wgk[j] * (Math.Abs(values[2 * j] - mean) + Math.Abs(values[2 * j + 1] - mean));
        double error = Math.Abs((kronrod - gauss) * h);
        spread *= Math.Abs(h);
        if (spread != 0 && error != 0) error = spread * Math.Min(1.0, Math.Pow(200 * error / spread, 1.5));
        // Round-off floor (QUADPACK: 50·eps·resabs).
        error = Math.Max(error, 50 * 2.220446049250313e-16 * absolute * Math.Abs(h));
        return (kronrod * h, error);
    }

    /// <summary>
    /// ∫ f over the panels between consecutive <paramref name="breaks"/> (sorted, at least two).
    /// <paramref name="initial"/> optionally holds f at the 15 nodes of every initial panel
    /// (15 values per panel, as laid out by <see cref="Nodes"/>), so callers that integrate many
    /// related functions over the same panels can reuse their precomputation.
    /// </summary>
    public static double Integrate(Func<double, double> f, ReadOnlySpan<double> breaks, double absoluteTolerance, double relativeTolerance,
        int maxPanels = 400, ReadOnlySpan<double> initial = default)
    {
        int panels0 = breaks.Length - 1;
        var lo = new List<double>(panels0 * 4);
        var hi = new List<double>(panels0 * 4);
        var val = new List<double>(panels0 * 4);
        var err = new List<double>(panels0 * 4);
        Span<double> nodes = stackalloc double[15];
        Span<double> values = stackalloc double[15];
        for (int p = 0; p < panels0; p++)
        {
            double a = breaks[p], b = breaks[p + 1];
            if (!(b > a)) continue;
            (double v, double e) r;
            if (!initial.IsEmpty) r = Rule(a, b, initial.Slice(15 * p, 15));
            else r = Evaluate(f, a, b, nodes, values);
            lo.Add(a); hi.Add(b); val.Add(r.v); err.Add(r.e);
        }
        while (true)
        {
            double total = 0, totalError = 0;
            int worst = -1;
            for (int i = 0; i < val.Count; i++)
            {
                total += val[i];
                totalError += err[i];
                if (worst < 0 || err[i] > err[worst]) worst = i;
            }
            if (worst < 0) return 0.0;
            if (totalError <= Math.Max(absoluteTolerance, relativeTolerance * Math.Abs(total)) || val.Count >= maxPanels)
                return total;
            double a = lo[worst], b = hi[worst], m = 0.5 * (a + b);
            if (!(m > a && m < b)) { err[worst] = 0; continue; } // cannot split further in floating point
            var left = Evaluate(f, a, m, nodes, values);
            var right = Evaluate(f, m, b, nodes, values);
            hi[worst] = m; val[worst] = left.Value; err[worst] = left.Error;
            lo.Add(m); hi.Add(b); val.Add(right.Value); err.Add(right.Error);
        }
    }

    private static (double Value, double Error) Evaluate(Func<double, double> f, double a, double b, Span<double> nodes, Span<double> values)
    {
        Nodes(a, b, nodes);
        for (int i = 0; i < 15; i++) values[i] = f(nodes[i]);
        return Rule(a, b, values);
    }
}
