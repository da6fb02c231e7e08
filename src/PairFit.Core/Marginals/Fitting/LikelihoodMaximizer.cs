using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.Optimization;

namespace PairFit.Core.Marginals.Fitting;

/// <summary>
/// Σ log f over <paramref name="values"/> at parameters <paramref name="p"/> (−Infinity when infeasible);
/// when <paramref name="gradient"/> is not null it also receives the analytic gradient.
/// </summary>
public delegate double LogLikelihoodWithGradient(ReadOnlySpan<double> values, double[] p, double[]? gradient);

/// <summary>
/// Maximises a log-likelihood that has an analytic gradient (families without a closed form or a
/// one-dimensional profile: GEV, log-logistic). Newton's method on the full data from a moment or
/// L-moment start, with step halving so the likelihood never decreases. The Hessian is the forward
/// difference of the analytic gradient on a stratified subsample of at most
/// <see cref="CurvatureSampleSize"/> order statistics, scaled by n/m: the log-likelihood Hessian is a
/// sum over observations, so the subsample's curvature estimates the full one to about 1/√m, and
/// the iteration converges linearly at about that rate while each step costs one pass over the data.
/// When the Hessian is not negative definite (start far from the optimum), Nelder–Mead on the
/// subsample moves the start first.
/// </summary>
public static class LikelihoodMaximizer
{
    public const int CurvatureSampleSize = 4000;

    /// <summary>Subsample size used elsewhere for cheap searches (profile grids) before full-data refinement.</summary>
    public const int SubsampleSize = 20_000;

    public sealed record Outcome(double[] Parameters, double LogLikelihood, bool Converged, string? Note);

    public static Outcome Maximize(LogLikelihoodWithGradient f, double[] values, IReadOnlyList<double[]> starts, double[] simplexSteps)
    {
        double[] sub = MarginalSample.Stratified(values, CurvatureSampleSize);
        double weight = (double)values.Length / sub.Length;
        Outcome? best = null;
        foreach (var start in starts)
        {
            if (!double.IsFinite(f(values, start, null))) continue;
            var outcome = Newton(f, values, sub, weight, start);
            if (!outcome.Converged)
            {
                // Far from the optimum: let Nelder–Mead on the subsample find the concave region.
                var moved = NelderMead(p => f(sub, p, null), start, simplexSteps);
                var retry = Newton(f, values, sub, weight, moved);
                if (retry.LogLikelihood >= outcome.LogLikelihood) outcome = retry;
            }
            if (best is null || outcome.LogLikelihood > best.LogLikelihood) best = outcome;
            if (best.Converged) break;
        }
        return best ?? new Outcome(starts[0], double.NegativeInfinity, false, "no feasible starting point");
    }

    private static Outcome Newton(LogLikelihoodWithGradient f, double[] values, double[] sub, double weight, double[] start)
    {
        int p = start.Length;
        var x = (double[])start.Clone();
        var g = new double[p];
        double fx = f(values, x, g);
        for (int iteration = 0; iteration < 60; iteration++)
        {
            var h = SubsampleHessian(f, sub, x, weight);
            if (h is null) return new(x, fx, false, "curvature undefined");
            var grad = Vector<double>.Build.DenseOfArray(g);
            Vector<double> step;
            try { step = (-h).Cholesky().Solve(grad); }   // −H is positive definite near a maximum
            catch (ArgumentException) { return new(x, fx, false, "Hessian not negative definite"); }
            if (!step.All(double.IsFinite)) return new(x, fx, false, "Newton step not finite");
            double decrement = grad * step;   // gᵀ(−H)⁻¹g: twice the predicted gain
            if (decrement < 1e-10) return new(x, fx, true, null);
            bool improved = false;
            double t = 1;
            for (int half = 0; half < 40; half++, t *= 0.5)
            {
                var trial = new double[p];
                for (int i = 0; i < p; i++) trial[i] = x[i] + t * step[i];
                var gt = new double[p];
                double ft = f(values, trial, gt);
                if (ft >= fx)
                {
                    x = trial;
                    fx = ft;
                    g = gt;
                    improved = true;
                    break;
                }
            }
            // No improvement along an ascent direction: the remaining gain is below rounding.
            if (!improved) return new(x, fx, decrement < 1e-6, decrement < 1e-6 ? null : "line search failed");
        }
        return new(x, fx, false, "Newton iteration limit reached");
    }

    /// <summary>Forward differences of the analytic gradient on the subsample, symmetrised, times n/m.</summary>
    private static Matrix<double>? SubsampleHessian(LogLikelihoodWithGradient f, double[] sub, double[] x, double weight)
    {
        int p = x.Length;
        var g0 = new double[p];
        if (!double.IsFinite(f(sub, x, g0))) return null;
        var h = Matrix<double>.Build.Dense(p, p);
        var y = (double[])x.Clone();
        var gi = new double[p];
        for (int i = 0; i < p; i++)
        {
            // Step ~ √ε relative: the forward-difference optimum for a smooth gradient.
            double step = 1.5e-8 * Math.Max(1.0, Math.Abs(x[i]));
            y[i] = x[i] + step;
            if (!double.IsFinite(f(sub, y, gi)))
            {
                y[i] = x[i] - step;
                if (!double.IsFinite(f(sub, y, gi))) return null;
                step = -step;
            }
            y[i] = x[i];
            for (int j = 0; j < p; j++) h[j, i] = (gi[j] - g0[j]) / step;
        }
        return (h + h.Transpose()) * (0.5 * weight);
    }

    private static double[] NelderMead(Func<double[], double> ll, double[] start, double[] steps)
    {
        // Track the best point seen: MathNet's Nelder–Mead throws at the iteration limit and loses it.
        double[] best = start;
        double bestValue = ll(start);
        double Objective(Vector<double> v)
        {
            var p = v.ToArray();
            double l = ll(p);
            if (!double.IsFinite(l)) return double.MaxValue;
            if (l > bestValue) { bestValue = l; best = p; }
            return -l;
        }
        try
        {
            new NelderMeadSimplex(1e-10, 3000).FindMinimum(ObjectiveFunction.Value(Objective),
                Vector<double>.Build.DenseOfArray(start), Vector<double>.Build.DenseOfArray(steps));
        }
        catch (MaximumIterationsException) { }
        return best;
    }
}
