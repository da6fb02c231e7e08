namespace PairFit.Core.Copulas.Fitting;

/// <summary>One family and rotation fitted by maximum (pseudo-)likelihood.</summary>
public sealed record CopulaEstimate
{
    public required ICopula Copula { get; init; }
    public required double[] Parameters { get; init; }
    public required double?[] StandardErrors { get; init; }
    public required double LogLikelihood { get; init; }
    public bool Converged { get; init; }
    public string? Note { get; init; }
    public int Evaluations { get; init; }
}

/// <summary>
/// Maximises Σ log c(u_i, v_i; θ) over one family and rotation, for given uniforms: pseudo-observations
/// (maximum pseudo-likelihood, Genest, Ghoudi and Rivest 1995) or marginal probability transforms (IFM,
/// Joe and Xu 1996). One parameter: bracketing + Brent on the free coordinate. Several (Student t's ρ
/// and ν): Nelder–Mead jointly on the free coordinates, so ν stays inside the family's documented range.
/// Large samples (n &gt; <see cref="LargeSample"/>) are first fitted on an evenly spaced subsample and the
/// answer polished on all the data by Newton steps on numerical derivatives, which also yield the
/// observed information; this needs a handful of full-data passes instead of a few dozen.
/// </summary>
public static class CopulaMaximumLikelihood
{
    /// <summary>First bracketing step in free coordinates; starts from the tau inversion are usually this close.</summary>
    private const double FirstStep = 0.05;

    /// <summary>Above this many pairs the subsample-then-Newton path is taken.</summary>
    public const int LargeSample = 20_000;

    /// <summary>
    /// Subsample of max(10,000, n/20) pairs: big enough that its optimum is within a few full-sample
    /// standard errors, so two Newton steps on all the data usually finish the job.
    /// </summary>
    private static int SubsampleSize(int n) => Math.Max(10_000, n / 20);

    /// <param name="start">Starting parameters of the unrotated family (e.g. from <see cref="ICopulaFamily.StartFromTau"/>).</param>
    /// <param name="allowLargeSamplePath">False forces the direct search on all the data (used by tests to cross-check the fast path).</param>
    public static CopulaEstimate Fit(ICopulaFamily family, int rotation, double[] u, double[] v, IReadOnlyList<double> start,
        bool computeStandardErrors = true, int? maxDegreeOfParallelism = null, bool allowLargeSamplePath = true)
    {
        int k = family.ParameterNames.Count;
        var transforms = Transforms(family);
        if (k == 0)
        {
            var c0 = RotatedCopula.Rotate(family.Create([]), rotation);
            return new CopulaEstimate
            {
                Copula = c0, Parameters = [], StandardErrors = [], Converged = true,
                LogLikelihood = CopulaLogLikelihood.Sum(c0, u, v, maxDegreeOfParallelism),
            };
        }

        bool elliptical = EllipticalLikelihood.TryCreate(family, rotation, start, u, v, maxDegreeOfParallelism) is not null;
        Func<double[], double> LogLikOf(double[] uu, double[] vv)
        {
            if (elliptical)
            {
                var cached = EllipticalLikelihood.TryCreate(family, rotation, start, uu, vv, maxDegreeOfParallelism)!;
                return t => cached.LogLikelihood(ToNatural(transforms, t));
            }
            return t =>
            {
                var c = TryCreate(family, rotation, transforms, t);
                return c is null ? double.NegativeInfinity : CopulaLogLikelihood.Sum(c, uu, vv, maxDegreeOfParallelism);
            };
        }
        var logLik = LogLikOf(u, v);

        var t0 = new double[k];
        for (int i = 0; i < k; i++) t0[i] = transforms[i].ToFree(start[i]);

        MinimumFound found;
        MathNet.Numerics.LinearAlgebra.Matrix<double>? hessian = null;
        int n = u.Length;
        if (allowLargeSamplePath && n > LargeSample)
        {
            int stride = n / SubsampleSize(n);
            var su = new double[n / stride];
            var sv = new double[su.Length];
            for (int i = 0; i < su.Length; i++) { su[i] = u[i * stride]; sv[i] = v[i * stride]; }
            var coarse = Search(LogLikOf(su, sv), t0, transforms, elliptical);
            var polished = NewtonPolish(logLik, coarse.Point, transforms);
            if (polished is { } p)
            {
                found = p.Found with { Evaluations = p.Found.Evaluations + coarse.Evaluations };
                hessian = p.Hessian;
            }
            else
                found = Search(logLik, coarse.Point, transforms, elliptical);
        }
        else
            found = Search(logLik, t0, transforms, elliptical);

        double maxLogLik = -found.Value;
        if (!double.IsFinite(maxLogLik))
            throw new CopulaFitFailedException($"the log-likelihood is not finite anywhere the search went (start {string.Join(", ", start)})");

        var tHat = found.Point;
        var parameters = new double[k];
        var derivative = new double[k];
        for (int i = 0; i < k; i++)
        {
            parameters[i] = transforms[i].FromFree(tHat[i]);
            derivative[i] = transforms[i].Derivative(tHat[i]);
        }
        var notes = new List<string>();
        if (!found.Converged) notes.Add($"optimiser stopped after {found.Evaluations} evaluations without meeting its tolerance");
        bool atLimit = false;
        for (int i = 0; i < k; i++)
            if (transforms[i].AtLimit(tHat[i]))
            {
                atLimit = true;
                notes.Add($"{family.ParameterNames[i]} = {parameters[i]:G6} is at the end of the family's range [{family.LowerBounds[i]:G6}, {family.UpperBounds[i]:G6}]");
            }

        var se = new double?[k];
        if (computeStandardErrors)
        {
            if (atLimit) notes.Add("standard errors not computed at a range limit");
            else
            {
                string? seNote;
                se = hessian is not null
                    ? ObservedInformation.FromHessian(hessian, derivative, out seNote)
                    : ObservedInformation.StandardErrors(logLik, tHat, derivative, out seNote);
                if (seNote is not null) notes.Add(seNote);
            }
        }

        return new CopulaEstimate
        {
            Copula = RotatedCopula.Rotate(family.Create(parameters), rotation),
            Parameters = parameters,
            StandardErrors = se,
            LogLikelihood = maxLogLik,
            Converged = found.Converged,
            Note = notes.Count == 0 ? null : string.Join("; ", notes),
            Evaluations = found.Evaluations,
        };
    }

    /// <summary>
    /// Minimum of −ℓ from <paramref name="t0"/>: Brent for one free coordinate; for an elliptical family with a
    /// shape parameter (Student t's ν) Brent on the profile log-likelihood ℓ_p(ν) = max_ρ ℓ(ρ, ν), each profile
    /// point maximised over ρ by Brent on cached quantiles (the joint maximum is the maximum of the profile);
    /// Nelder–Mead for any other several-parameter family.
    /// </summary>
    private static MinimumFound Search(Func<double[], double> logLik, double[] t0, ParameterTransform[] transforms, bool elliptical)
    {
        int k = t0.Length;
        var lo = new double[k];
        var hi = new double[k];
        for (int i = 0; i < k; i++) { lo[i] = transforms[i].FreeMin; hi[i] = transforms[i].FreeMax; }
        if (k == 1) return Minimizers.Scalar(t => -logLik([t]), t0[0], FirstStep, lo[0], hi[0]);
        if (k == 2 && elliptical)
        {
            double rho = t0[0];
            bool innerConverged = true;
            int evals = 0;
            MinimumFound Inner(double shape)
            {
                var inner = Minimizers.Scalar(t => -logLik([t, shape]), rho, FirstStep, lo[0], hi[0]);
                evals += inner.Evaluations;
                return inner;
            }
            double Profile(double shape)
            {
                var inner = Inner(shape);
                rho = inner.Point[0]; // warm start for the next profile point
                innerConverged &= inner.Converged;
                return inner.Value;
            }
            var outer = Minimizers.Scalar(Profile, t0[1], 0.2, lo[1], hi[1], tolerance: 1e-7);
            var last = Inner(outer.Point[0]);
            return new MinimumFound([last.Point[0], outer.Point[0]], last.Value, outer.Converged && innerConverged && last.Converged, evals);
        }
        var step = new double[k];
        Array.Fill(step, 0.2);
        return Minimizers.NelderMead(t => -logLik(t), t0, step, lo, hi);
    }

    /// <summary>
    /// Newton ascent t ← t − H⁻¹g on central-difference derivatives, from a point already close to the optimum
    /// (Nocedal and Wright 2006, section 3.3), with step halving. Converged when a full Newton step shorter than
    /// 1e−4 has been taken: quadratic convergence leaves an error of order (1e−4)², far inside the standard error.
    /// Returns null when the Hessian is not negative definite or no step improves ℓ, so the caller can fall back.
    /// </summary>
    private static (MinimumFound Found, MathNet.Numerics.LinearAlgebra.Matrix<double> Hessian)? NewtonPolish(
        Func<double[], double> logLik, double[] start, ParameterTransform[] transforms)
    {
        int k = start.Length, evals = 0;
        double F(double[] t) { evals++; return logLik(t); }
        var t = (double[])start.Clone();
        double f = F(t);
        if (!double.IsFinite(f)) return null;
        for (int iter = 0; iter < 8; iter++)
        {
            var (g, h) = ObservedInformation.Derivatives(F, t, f);
            MathNet.Numerics.LinearAlgebra.Vector<double> step;
            try
            {
                step = (-h).Cholesky().Solve(MathNet.Numerics.LinearAlgebra.Vector<double>.Build.DenseOfArray(g));
            }
            catch (ArgumentException)
            {
                return null;
            }
            bool full = true, accepted = false;
            for (int halving = 0; halving < 20 && !accepted; halving++)
            {
                var trial = new double[k];
                double longest = 0;
                for (int i = 0; i < k; i++)
                {
                    trial[i] = Math.Clamp(t[i] + step[i], transforms[i].FreeMin, transforms[i].FreeMax);
                    longest = Math.Max(longest, Math.Abs(trial[i] - t[i]));
                }
                double ft = F(trial);
                if (ft >= f)
                {
                    t = trial;
                    f = ft;
                    if (full && longest <= 1e-4)
                        return (new MinimumFound(t, -f, true, evals), h);
                    accepted = true;
                    continue;
                }
                if (longest < 1e-12) return (new MinimumFound(t, -f, true, evals), h); // no better point exists at this resolution
                step = step * 0.5;
                full = false;
            }
            if (!accepted) return null;
        }
        return null;
    }

    private static double[] ToNatural(ParameterTransform[] transforms, double[] free)
    {
        var p = new double[free.Length];
        for (int i = 0; i < p.Length; i++) p[i] = transforms[i].FromFree(free[i]);
        return p;
    }

    internal static ParameterTransform[] Transforms(ICopulaFamily family)
    {
        int k = family.ParameterNames.Count;
        var t = new ParameterTransform[k];
        for (int i = 0; i < k; i++) t[i] = new ParameterTransform(family.LowerBounds[i], family.UpperBounds[i]);
        return t;
    }

    internal static ICopula? TryCreate(ICopulaFamily family, int rotation, ParameterTransform[] transforms, ReadOnlySpan<double> free)
    {
        try
        {
            return RotatedCopula.Rotate(family.Create(ToNatural(transforms, free.ToArray())), rotation);
        }
        catch (ArgumentException)
        {
            return null;
        }
    }
}

/// <summary>A candidate whose likelihood could not be maximised at all; reported as excluded with the message.</summary>
public sealed class CopulaFitFailedException(string message) : Exception(message);
