using PairFit.Core.Common;
using PairFit.Core.Marginals.Fitting;

namespace PairFit.Core.Marginals;

/// <summary>
/// Generalized Pareto law for exceedances, with location (threshold) μ, scale σ and shape ξ
/// (Pickands 1975; Coles 2001, eq. 4.2): F(x) = 1 − (1 + ξ (x − μ)/σ)^(−1/ξ) for x ≥ μ.
/// ξ &gt; 0 heavy tail, ξ = 0 exponential, ξ &lt; 0 bounded above at μ − σ/ξ. SciPy's genpareto c is ξ.
/// MLE: for ξ &gt; −1 the density falls on its support, so the likelihood rises with μ up to the
/// smallest value: μ̂ = x_(1), a boundary estimate with no standard error. (σ, ξ) then follow from
/// the one-dimensional profile of Grimshaw (1993): with θ = ξ/σ, ξ̂(θ) = mean ln(1 + θ y) and
/// ℓ(θ) = −n ln(ξ̂/θ) − n ξ̂ − n, maximised by Brent on its derivative. ξ is kept above −1, where
/// the likelihood is unbounded. L-moments (Hosking and Wallis 1997, Appendix A): k = (1 − 3τ3)/(1 + τ3),
/// σ = (1 + k)(2 + k) λ2, μ = λ1 − (2 + k) λ2, ξ = −k.
/// </summary>
public sealed class GeneralizedParetoDistribution : IMarginalDistribution
{
    public const string FamilyName = "genpareto";
    private static readonly string[] Names = ["location", "scale", "shape"];
    public static readonly IMarginalFamily Definition = new GeneralizedParetoFamily();

    private const double ExponentialLimit = 1e-10;

    public GeneralizedParetoDistribution(double location, double scale, double shape)
    {
        if (!double.IsFinite(location) || !(scale > 0) || !double.IsFinite(scale) || !double.IsFinite(shape))
            throw new ArgumentOutOfRangeException(nameof(scale), $"genpareto needs finite location, scale > 0 and finite shape (got {location}, {scale}, {shape}).");
        Location = location;
        Scale = scale;
        Shape = shape;
    }

    public double Location { get; }
    public double Scale { get; }
    public double Shape { get; }

    public string Family => FamilyName;
    public IReadOnlyList<string> ParameterNames => Names;
    public IReadOnlyList<double> Parameters => [Location, Scale, Shape];
    public double SupportLower => Location;
    public double SupportUpper => Shape < 0 ? Location - Scale / Shape : double.PositiveInfinity;
    public double Mean => Shape < 1 ? Location + Scale / (1 - Shape) : double.NaN;
    public double Variance => Shape < 0.5 ? Scale * Scale / ((1 - Shape) * (1 - Shape) * (1 - 2 * Shape)) : double.NaN;

    /// <summary>−ln S(x) = ln(1 + ξz)/ξ for z ≥ 0 inside the support, NaN below the threshold, +∞ above the upper end.</summary>
    private double CumulativeHazard(double x)
    {
        double z = (x - Location) / Scale;
        if (z < 0 || double.IsNaN(z)) return double.NaN;
        if (Math.Abs(Shape) < ExponentialLimit) return z;
        double t = Shape * z;
        return t > -1 ? MathExtras.Log1P(t) / Shape : double.PositiveInfinity;
    }

    public double LogDensity(double x)
    {
        double h = CumulativeHazard(x);
        if (double.IsNaN(h) || double.IsPositiveInfinity(h)) return double.NegativeInfinity;
        return -Math.Log(Scale) - (1 + Shape) * h;
    }

    public double Cdf(double x)
    {
        double h = CumulativeHazard(x);
        return double.IsNaN(h) ? 0.0 : -MathExtras.ExpM1(-h);
    }

    public double Survival(double x)
    {
        double h = CumulativeHazard(x);
        return double.IsNaN(h) ? 1.0 : Math.Exp(-h);
    }

    public double Quantile(double p)
    {
        if (p <= 0) return SupportLower;
        if (p >= 1) return SupportUpper;
        double h = -MathExtras.Log1P(-p);
        if (Math.Abs(Shape) < ExponentialLimit) return Location + Scale * h;
        return Location + Scale * MathExtras.ExpM1(Shape * h) / Shape;
    }

    internal static double LogLikelihood(ReadOnlySpan<double> values, double location, double scale, double shape)
    {
        if (!(scale > 0) || !(shape > -1) || !double.IsFinite(location) || !double.IsFinite(shape)) return double.NegativeInfinity;
        double sum = 0, inv = 1 / scale;
        bool exponential = Math.Abs(shape) < ExponentialLimit;
        foreach (double x in values)
        {
            double z = (x - location) * inv;
            if (z < 0) return double.NegativeInfinity;
            if (exponential) { sum -= z; continue; }
            double t = shape * z;
            if (!(t > -1)) return double.NegativeInfinity;
            sum -= (1 + shape) * MathExtras.Log1P(t) / shape;
        }
        return sum - values.Length * Math.Log(scale);
    }

    internal static double[] FromLMoments(LMoments l)
    {
        double k = (1 - 3 * l.T3) / (1 + l.T3);
        return [l.L1 - (2 + k) * l.L2, (1 + k) * (2 + k) * l.L2, -k];
    }

    /// <summary>(σ, ξ) given the threshold at the minimum, by Grimshaw's profile in θ = ξ/σ.</summary>
    private static MarginalEstimate FitAboveMinimum(MarginalSample s)
    {
        double[] x = s.Values;
        int n = x.Length;
        double location = x[0];
        double d = s.LMoments.L2;
        var y = new double[n];
        for (int i = 0; i < n; i++) y[i] = (x[i] - location) / d;
        double yMax = y[n - 1];
        double[] sub = MarginalSample.Stratified(y, LikelihoodMaximizer.SubsampleSize);

        // θ = expm1(u)/y_max keeps 1 + θy > 0 for every u. Returns ℓ and dℓ/du.
        (double Value, double Slope, double Xi) Profile(double[] v, double u)
        {
            double theta = MathExtras.ExpM1(u) / yMax;
            double sum = 0, sumRatio = 0;
            foreach (double yi in v)
            {
                double t = theta * yi;
                sum += MathExtras.Log1P(t);
                sumRatio += yi / (1 + t);
            }
            int m = v.Length;
            double xi = sum / m;
            if (!(xi > -1) || theta == 0) return (double.NegativeInfinity, double.NaN, xi);
            double value = -m * Math.Log(xi / theta) - sum - m;
            // dℓ/dθ = −m (S'/S − 1/θ) − S'  with S = Σ ln(1 + θy), S' = Σ y/(1 + θy); dθ/du = e^u / y_max.
            double slope = (-m * (sumRatio / sum - 1 / theta) - sumRatio) * Math.Exp(u) / yMax;
            return (value, slope, xi);
        }

        const double uLow = -12, uHigh = 12;
        const int gridSize = 24;   // even, so no grid point falls on θ = 0
        int best = -1;
        double bestValue = double.NegativeInfinity;
        for (int i = 0; i < gridSize; i++)
        {
            double u = uLow + (uHigh - uLow) * (i + 0.5) / gridSize;
            double v = Profile(sub, u).Value;
            if (v > bestValue) { bestValue = v; best = i; }
        }
        var fixedMask = new[] { true, false, false };
        if (best < 0) return new([location, s.Mean - location, 0], false, "mle", "profile likelihood undefined", fixedMask);
        double step = (uHigh - uLow) / gridSize;
        double centre = uLow + step * (best + 0.5);
        double? root = DataRoot.Find((v, u) => Profile(v, u).Slope, y, sub, centre - step, centre + step, uLow - 10, uHigh + 10, 0.05, 1e-12);
        bool converged = root is not null;
        double uStar = root ?? centre;
        var (_, _, xiHat) = Profile(y, uStar);
        double thetaHat = MathExtras.ExpM1(uStar) / yMax;
        double sigma = Math.Abs(thetaHat) > 1e-300 ? xiHat / thetaHat : 1.0;
        return new([location, sigma * d, xiHat], converged, "mle",
            "location is the sample minimum (its maximum-likelihood value), so it has no standard error"
            + (converged ? "" : "; profile likelihood has no interior maximum"), fixedMask);
    }

    private sealed class GeneralizedParetoFamily : IMarginalFamily
    {
        public string Name => FamilyName;
        public IReadOnlyList<string> ParameterNames => Names;
        public string? SupportProblem(MarginalSample s) => null;

        public MarginalEstimate FitMaximumLikelihood(MarginalSample s) => FitAboveMinimum(s);

        public MarginalEstimate? FitLMoments(MarginalSample s) => new(FromLMoments(s.LMoments), true, "lmoments");

        public double LogLikelihood(MarginalSample s, ReadOnlySpan<double> p) => GeneralizedParetoDistribution.LogLikelihood(s.Values, p[0], p[1], p[2]);

        public IMarginalDistribution Create(IReadOnlyList<double> p) => new GeneralizedParetoDistribution(p[0], p[1], p[2]);
    }
}
