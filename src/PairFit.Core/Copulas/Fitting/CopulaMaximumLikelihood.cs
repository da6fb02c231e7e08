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
/// </summary>
public static class CopulaMaximumLikelihood
{
    /// <summary>First bracketing step in free coordinates; starts from the tau inversion are usually this close.</summary>
    private const double FirstStep = 0.05;

    public static CopulaEstimate Fit(ICopulaFamily family, int rotation, double[] u, double[] v, IReadOnlyList<double> start,
        bool computeStandardErrors = true, int? maxDegreeOfParallelism = null)
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

        double LogLik(double[] t)
        {
            var c = TryCreate(family, rotation, transforms, t);
            return c is null ? double.NegativeInfinity : CopulaLogLikelihood.Sum(c, u, v, maxDegreeOfParallelism);
        }

        var t0 = new double[k];
        var lo = new double[k];
        var hi = new double[k];
        for (int i = 0; i < k; i++)
        {
            t0[i] = transforms[i].ToFree(start[i]);
            lo[i] = transforms[i].FreeMin;
            hi[i] = transforms[i].FreeMax;
        }

        MinimumFound found;
        if (k == 1)
            found = Minimizers.Scalar(t => -LogLik([t]), t0[0], FirstStep, lo[0], hi[0]);
        else
        {
            var step = new double[k];
            Array.Fill(step, 0.2);
            found = Minimizers.NelderMead(t => -LogLik(t), t0, step, lo, hi);
        }

        double logLik = -found.Value;
        if (!double.IsFinite(logLik))
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
                se = ObservedInformation.StandardErrors(LogLik, tHat, derivative, out var seNote);
                if (seNote is not null) notes.Add(seNote);
            }
        }

        return new CopulaEstimate
        {
            Copula = RotatedCopula.Rotate(family.Create(parameters), rotation),
            Parameters = parameters,
            StandardErrors = se,
            LogLikelihood = logLik,
            Converged = found.Converged,
            Note = notes.Count == 0 ? null : string.Join("; ", notes),
            Evaluations = found.Evaluations,
        };
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
        var p = new double[transforms.Length];
        for (int i = 0; i < p.Length; i++) p[i] = transforms[i].FromFree(free[i]);
        try
        {
            return RotatedCopula.Rotate(family.Create(p), rotation);
        }
        catch (ArgumentException)
        {
            return null;
        }
    }
}

/// <summary>A candidate whose likelihood could not be maximised at all; reported as excluded with the message.</summary>
public sealed class CopulaFitFailedException(string message) : Exception(message);
