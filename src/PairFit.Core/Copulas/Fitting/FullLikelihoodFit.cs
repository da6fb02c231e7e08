using PairFit.Core.Data;
using PairFit.Core.Marginals;
using PairFit.Core.Model;

namespace PairFit.Core.Copulas.Fitting;

/// <summary>A copula and its two marginals maximised together.</summary>
public sealed record JointEstimate
{
    public required CopulaEstimate Copula { get; init; }
    public required IMarginalDistribution X { get; init; }
    public required IMarginalDistribution Y { get; init; }

    /// <summary>Marginal plus copula parameters: the k in the joint AIC.</summary>
    public int ParameterCount { get; init; }
}

/// <summary>
/// Full maximum likelihood: Σ [log f_X(x_i; α) + log f_Y(y_i; β) + log c(F_X(x_i; α), F_Y(y_i; β); θ)]
/// over (α, β, θ) jointly (Joe 2014, section 5.5), started from the IFM estimate (marginals fitted
/// alone, then the copula given them), by Nelder–Mead. Marginal parameters are searched on their
/// natural scale; a value the family rejects counts as an infeasible point.
/// </summary>
public static class FullLikelihoodFit
{
    /// <summary>
    /// Simplex steps of about one standard error per coordinate, 1/√(−∂²ℓ/∂p_i²) from a second difference
    /// at the start, so the simplex is neither lost on a flat scale nor stuck on a steep one; 5 % of |p| where
    /// the curvature has the wrong sign.
    /// </summary>
    private static void InitialSteps(Func<double[], double> logLik, double[] start, double[] step)
    {
        double f0 = logLik(start);
        var p = (double[])start.Clone();
        for (int i = 0; i < start.Length; i++)
        {
            double h = 1e-3 * Math.Max(Math.Abs(start[i]), 1e-2);
            p[i] = start[i] + h;
            double up = logLik(p);
            p[i] = start[i] - h;
            double down = logLik(p);
            p[i] = start[i];
            double curvature = (up - 2 * f0 + down) / (h * h);
            double fallback = 0.05 * Math.Max(Math.Abs(start[i]), 1e-2);
            step[i] = curvature < 0 && double.IsFinite(curvature) ? Math.Min(1 / Math.Sqrt(-curvature), fallback * 20) : fallback;
        }
    }

    public static JointEstimate Fit(PairedSample sample, IMarginalDistribution x0, IMarginalDistribution y0,
        ICopulaFamily family, int rotation, CopulaEstimate ifm, int? maxDegreeOfParallelism = null)
    {
        int kx = x0.Parameters.Count, ky = y0.Parameters.Count, kc = family.ParameterNames.Count, k = kx + ky + kc;
        var transforms = CopulaMaximumLikelihood.Transforms(family);
        double[] xs = sample.X, ys = sample.Y;

        JointModel? Build(double[] p)
        {
            try
            {
                var mx = MarginalRegistry.Create(x0.Family, p.AsSpan(0, kx).ToArray());
                var my = MarginalRegistry.Create(y0.Family, p.AsSpan(kx, ky).ToArray());
                var c = CopulaMaximumLikelihood.TryCreate(family, rotation, transforms, p.AsSpan(kx + ky, kc));
                return c is null ? null : new JointModel(mx, my, c);
            }
            catch (Common.PairFitInputException)
            {
                return null;
            }
        }

        double LogLik(double[] p)
        {
            var m = Build(p);
            if (m is null) return double.NegativeInfinity;
            return DeterministicSum.Over(xs.Length, (start, end) =>
            {
                double s = 0;
                for (int i = start; i < end; i++)
                {
                    double l = m.LogDensity(xs[i], ys[i]);
                    if (!double.IsFinite(l)) return double.NegativeInfinity;
                    s += l;
                }
                return s;
            }, maxDegreeOfParallelism);
        }

        var start = new double[k];
        var step = new double[k];
        var lo = new double[k];
        var hi = new double[k];
        for (int i = 0; i < kx; i++) start[i] = x0.Parameters[i];
        for (int i = 0; i < ky; i++) start[kx + i] = y0.Parameters[i];
        for (int i = 0; i < k; i++)
        {
            lo[i] = -1e12;
            hi[i] = 1e12;
        }
        for (int i = 0; i < kc; i++)
        {
            start[kx + ky + i] = transforms[i].ToFree(ifm.Parameters[i]);
            lo[kx + ky + i] = transforms[i].FreeMin;
            hi[kx + ky + i] = transforms[i].FreeMax;
        }
        InitialSteps(LogLik, start, step);

        var found = Minimizers.NelderMead(p => -LogLik(p), start, step, lo, hi, xTolerance: 1e-5, maxEvaluations: 400 * k + 400);
        var best = found.Point;
        var model = Build(best) ?? throw new CopulaFitFailedException("the joint likelihood is not finite at any point the search reached");

        var derivative = new double[k];
        for (int i = 0; i < kx + ky; i++) derivative[i] = 1.0;
        for (int i = 0; i < kc; i++) derivative[kx + ky + i] = transforms[i].Derivative(best[kx + ky + i]);
        var seAll = ObservedInformation.StandardErrors(LogLik, best, derivative, out var seNote);

        var notes = new List<string>();
        if (!found.Converged) notes.Add($"joint optimiser stopped after {found.Evaluations} evaluations without meeting its tolerance");
        if (seNote is not null) notes.Add(seNote);
        var copulaParameters = new double[kc];
        var copulaSe = new double?[kc];
        for (int i = 0; i < kc; i++)
        {
            copulaParameters[i] = model.Copula.Parameters[i];
            copulaSe[i] = seAll[kx + ky + i];
        }
        return new JointEstimate
        {
            Copula = new CopulaEstimate
            {
                Copula = model.Copula,
                Parameters = copulaParameters,
                StandardErrors = copulaSe,
                LogLikelihood = -found.Value,
                Converged = found.Converged,
                Note = notes.Count == 0 ? null : string.Join("; ", notes),
                Evaluations = found.Evaluations,
            },
            X = model.X,
            Y = model.Y,
            ParameterCount = k,
        };
    }
}
