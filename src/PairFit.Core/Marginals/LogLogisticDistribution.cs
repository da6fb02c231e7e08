using PairFit.Core.Common;
using PairFit.Core.Marginals.Fitting;

namespace PairFit.Core.Marginals;

/// <summary>
/// Log-logistic law with scale α and shape β on (0, ∞): F(x) = 1 / (1 + (x/α)^(−β)); ln X is
/// logistic with location ln α and scale 1/β (Johnson, Kotz and Balakrishnan 1995, ch. 23).
/// MLE: the logistic likelihood of ln x (Nelder–Mead then Newton, <see cref="LikelihoodMaximizer"/>),
/// started from the log-moments (scale = sd·√3/π), plus the Jacobian −Σ ln x.
/// </summary>
public sealed class LogLogisticDistribution : IMarginalDistribution
{
    public const string FamilyName = "loglogistic";
    private static readonly string[] Names = ["scale", "shape"];
    public static readonly IMarginalFamily Definition = new LogLogisticFamily();

    public LogLogisticDistribution(double scale, double shape)
    {
        if (!(scale > 0) || !double.IsFinite(scale) || !(shape > 0) || !double.IsFinite(shape))
            throw new ArgumentOutOfRangeException(nameof(scale), $"loglogistic needs finite scale > 0 and shape > 0 (got scale={scale}, shape={shape}).");
        Scale = scale;
        Shape = shape;
    }

    public double Scale { get; }
    public double Shape { get; }

    public string Family => FamilyName;
    public IReadOnlyList<string> ParameterNames => Names;
    public IReadOnlyList<double> Parameters => [Scale, Shape];
    public double SupportLower => 0.0;
    public double SupportUpper => double.PositiveInfinity;

    /// <summary>α (π/β) / sin(π/β) for β &gt; 1.</summary>
    public double Mean => Shape > 1 ? Scale * (Math.PI / Shape) / Math.Sin(Math.PI / Shape) : double.NaN;

    /// <summary>α² (2b / sin 2b − b² / sin² b), b = π/β, for β &gt; 2.</summary>
    public double Variance
    {
        get
        {
            if (!(Shape > 2)) return double.NaN;
            double b = Math.PI / Shape;
            return Scale * Scale * (2 * b / Math.Sin(2 * b) - b * b / (Math.Sin(b) * Math.Sin(b)));
        }
    }

    /// <summary>w = β ln(x/α), the logistic variate.</summary>
    private double W(double x) => Shape * Math.Log(x / Scale);

    // f(x) = (β/x) e^w / (1 + e^w)², written symmetric in w so no exp overflows.
    public double LogDensity(double x) => x > 0 ? Math.Log(Shape / x) + StandardLogisticLogDensity(W(x)) : double.NegativeInfinity;

    public double Cdf(double x) => x > 0 ? 1 / (1 + Math.Exp(-W(x))) : 0.0;

    public double Survival(double x) => x > 0 ? 1 / (1 + Math.Exp(W(x))) : 1.0;

    public double Quantile(double p) => p <= 0 ? 0.0 : p >= 1 ? double.PositiveInfinity : Scale * Math.Exp((Math.Log(p) - MathExtras.Log1P(-p)) / Shape);

    /// <summary>log of e^(−z) / (1 + e^(−z))², equal for z and −z.</summary>
    private static double StandardLogisticLogDensity(double z)
    {
        double a = Math.Abs(z);
        return -a - 2 * MathExtras.Log1P(Math.Exp(-a));
    }

    /// <summary>Σ log of the logistic density with location m and scale s at the values.</summary>
    private static double LogisticLogLikelihood(ReadOnlySpan<double> values, double m, double s)
        => LogisticLogLikelihoodWithGradient(values, [m, s], null);

    /// <summary>
    /// Σ log of the logistic density and its gradient in (m, s): with z = (v − m)/s and
    /// q = 1/(1 + e^(−z)), ∂ℓ/∂m = (2q − 1)/s and ∂ℓ/∂s = ((2q − 1) z − 1)/s per value.
    /// </summary>
    private static double LogisticLogLikelihoodWithGradient(ReadOnlySpan<double> values, double[] p, double[]? gradient)
    {
        double m = p[0], s = p[1];
        if (!(s > 0) || !double.IsFinite(m)) return double.NegativeInfinity;
        double sum = 0, gm = 0, gs = 0, inv = 1 / s;
        foreach (double v in values)
        {
            double z = (v - m) * inv, e = Math.Exp(-Math.Abs(z));
            sum += -Math.Abs(z) - 2 * MathExtras.Log1P(e);
            if (gradient is null) continue;
            // 2q − 1 = tanh(z/2) = sign(z)(1 − e)/(1 + e) with e = e^(−|z|).
            double w = Math.Sign(z) * (1 - e) / (1 + e);
            gm += w;
            gs += w * z;
        }
        int n = values.Length;
        if (gradient is not null)
        {
            gradient[0] = gm * inv;
            gradient[1] = (gs - n) * inv;
        }
        return sum - n * Math.Log(s);
    }

    private sealed class LogLogisticFamily : IMarginalFamily
    {
        public string Name => FamilyName;
        public IReadOnlyList<string> ParameterNames => Names;
        public string? SupportProblem(MarginalSample s) => SupportChecks.Positive(s, FamilyName);

        public MarginalEstimate FitMaximumLikelihood(MarginalSample s)
        {
            var frame = StandardFrame.Of(s.Logs, s.LogLMoments);
            double[] start = frame.Standardise([s.Logs[s.N / 2], s.StandardDeviationLog * Math.Sqrt(3) / Math.PI]);
            var outcome = LikelihoodMaximizer.Maximize(LogisticLogLikelihoodWithGradient, frame.Values, [start], [0.1, 0.1]);
            var q = frame.Unstandardise(outcome.Parameters);   // (location, scale) of ln X
            return new([Math.Exp(q[0]), 1 / q[1]], outcome.Converged, "mle", outcome.Note);
        }

        public double LogLikelihood(MarginalSample s, ReadOnlySpan<double> p)
            => p[0] > 0 && p[1] > 0 ? LogisticLogLikelihood(s.Logs, Math.Log(p[0]), 1 / p[1]) - s.N * s.MeanLog : double.NegativeInfinity;

        public IMarginalDistribution Create(IReadOnlyList<double> p) => new LogLogisticDistribution(p[0], p[1]);
    }
}
