using MathNet.Numerics.Differentiation;
using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.Optimization;

namespace PairFit.Core.Marginals.Fitting;

/// <summary>
/// Maximises a log-likelihood for families without a closed form or a one-dimensional profile.
/// Nelder–Mead (derivative-free, copes with −Infinity at infeasible points) finds the optimum on a
/// stratified subsample of at most <see cref="SubsampleSize"/> order statistics; Newton steps on the
/// full data then polish it. The polishing Newton step uses the subsample Hessian scaled by n/m
/// (a quasi-Newton step: the log-likelihood Hessian is a sum over observations, so it scales with n)
/// and a central-difference gradient of the full log-likelihood, with step halving so the
/// likelihood never decreases.
/// </summary>
public static class LikelihoodMaximizer
{
    public const int SubsampleSize = 20_000;

    public sealed record Outcome(double[] Parameters, double LogLikelihood, bool Converged, string? Note);

    /// <param name="logLikelihood">Full-data log-likelihood of the parameter vector (−Infinity when infeasible).</param>
    /// <param name="subsampleLogLikelihood">The same on the stratified subsample, or null when the data are small.</param>
    /// <param name="weight">n/m, the factor from subsample to full-data curvature (1 when no subsample).</param>
    /// <param name="starts">Starting points, tried in order; the best end point wins.</param>
    /// <param name="steps">Initial simplex size per parameter.</param>
    public static Outcome Maximize(Func<double[], double> logLikelihood, Func<double[], double>? subsampleLogLikelihood,
        double weight, IReadOnlyList<double[]> starts, double[] steps)
    {
        var searchLl = subsampleLogLikelihood ?? logLikelihood;
        double[]? best = null;
        double bestValue = double.NegativeInfinity;
        bool simplexConverged = false;
        foreach (var start in starts)
        {
            if (!double.IsFinite(searchLl(start))) continue;
            var (point, value, converged) = NelderMead(searchLl, start, steps);
            if (value > bestValue) { best = point; bestValue = value; simplexConverged = converged; }
        }
        if (best is null) return new Outcome(starts[0], double.NegativeInfinity, false, "no feasible starting point");

        var (polished, ll, newtonConverged) = Polish(logLikelihood, searchLl, weight, best);
        bool ok = newtonConverged && (simplexConverged || subsampleLogLikelihood is not null);
        string? note = ok ? null : newtonConverged ? "Nelder–Mead stopped at its iteration limit; Newton polish converged" : "Newton polish did not reach its tolerance";
        return new Outcome(polished, ll, newtonConverged, note);
    }

    private static (double[] Point, double Value, bool Converged) NelderMead(Func<double[], double> ll, double[] start, double[] steps)
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
            var solver = new NelderMeadSimplex(1e-12, 4000);
            var result = solver.FindMinimum(ObjectiveFunction.Value(Objective), Vector<double>.Build.DenseOfArray(start),
                Vector<double>.Build.DenseOfArray(steps));
            var p = result.MinimizingPoint.ToArray();
            double l = ll(p);
            return l >= bestValue ? (p, l, true) : (best, bestValue, true);
        }
        catch (MaximumIterationsException)
        {
            return (best, bestValue, false);
        }
    }

    /// <summary>
    /// Newton iterations on the full log-likelihood with curvature from <paramref name="curvatureLl"/> × weight.
    /// </summary>
    private static (double[] Point, double Value, bool Converged) Polish(Func<double[], double> ll, Func<double[], double> curvatureLl, double weight, double[] start)
    {
        int p = start.Length;
        var x = (double[])start.Clone();
        double fx = ll(x);
        var hessian = new NumericalHessian();
        for (int iteration = 0; iteration < 20; iteration++)
        {
            var h = Matrix<double>.Build.DenseOfArray(hessian.Evaluate(curvatureLl, x)) * weight;
            var g = CentralGradient(ll, x);
            if (g is null) return (x, fx, false);
            Vector<double> step;
            try
            {
                // Newton direction for a maximum: −H⁻¹ g with H negative definite.
                step = -h.Solve(Vector<double>.Build.DenseOfArray(g));
            }
            catch (Exception) { return (x, fx, false); }
            if (!step.All(double.IsFinite)) return (x, fx, false);
            double decrement = Vector<double>.Build.DenseOfArray(g) * step;   // predicted gain × 2
            if (decrement <= 0)   // not an ascent direction: H not negative definite here
                return (x, fx, Math.Abs(decrement) < 1e-10);
            if (decrement < 1e-9) return (x, fx, true);
            double t = 1.0;
            bool improved = false;
            for (int half = 0; half < 30; half++, t *= 0.5)
            {
                var trial = new double[p];
                for (int i = 0; i < p; i++) trial[i] = x[i] + t * step[i];
                double ft = ll(trial);
                if (ft >= fx)
                {
                    x = trial;
                    fx = ft;
                    improved = true;
                    break;
                }
            }
            if (!improved) return (x, fx, decrement < 1e-6);
        }
        return (x, fx, false);
    }

    /// <summary>Central differences with relative steps (about ε^(1/3) of the parameter scale).</summary>
    internal static double[]? CentralGradient(Func<double[], double> f, double[] x)
    {
        var g = new double[x.Length];
        var y = (double[])x.Clone();
        for (int i = 0; i < x.Length; i++)
        {
            double h = 6e-6 * Math.Max(1.0, Math.Abs(x[i]));
            y[i] = x[i] + h;
            double up = f(y);
            y[i] = x[i] - h;
            double down = f(y);
            y[i] = x[i];
            if (!double.IsFinite(up) || !double.IsFinite(down)) return null;
            g[i] = (up - down) / (2 * h);
        }
        return g;
    }
}
