using MathNet.Numerics.LinearAlgebra;

namespace PairFit.Core.Copulas.Fitting;

/// <summary>
/// Standard errors from the observed information: the inverse of minus the Hessian of the
/// log-likelihood at the optimum (Pawitan 2001, section 2.5), taken by central differences in the
/// free coordinates t and carried to the natural parameters θ = g(t) by the delta method,
/// se(θ_i) = |g_i'(t_i)| √[(−H)⁻¹]_ii (Casella and Berger 2002, Theorem 5.5.24).
/// </summary>
public static class ObservedInformation
{
    /// <summary>Step in free coordinates: truncation error O(h²) ≈ 1e−6 relative, round-off ε|ℓ|/h² negligible against n.</summary>
    private const double Step = 1e-3;

    /// <summary>
    /// Standard errors of the natural parameters, null for every entry when −H is not positive
    /// definite (then <paramref name="note"/> says so).
    /// </summary>
    public static double?[] StandardErrors(Func<double[], double> logLikelihood, double[] free, double[] derivative, out string? note)
    {
        int k = free.Length;
        note = null;
        var se = new double?[k];
        if (k == 0) return se;
        double f0 = logLikelihood(free);
        var h = Matrix<double>.Build.Dense(k, k);
        var t = (double[])free.Clone();
        double At(int i, double di, int j, double dj)
        {
            Array.Copy(free, t, k);
            t[i] += di;
            t[j] += dj;
            return logLikelihood(t);
        }
        for (int i = 0; i < k; i++)
        {
            h[i, i] = (At(i, Step, i, 0) - 2 * f0 + At(i, -Step, i, 0)) / (Step * Step);
            for (int j = 0; j < i; j++)
            {
                double hij = (At(i, Step, j, Step) - At(i, Step, j, -Step) - At(i, -Step, j, Step) + At(i, -Step, j, -Step)) / (4 * Step * Step);
                h[i, j] = hij;
                h[j, i] = hij;
            }
        }
        var information = -h;
        bool finite = true;
        for (int i = 0; i < k; i++) for (int j = 0; j < k; j++) finite &= double.IsFinite(information[i, j]);
        if (!finite)
        {
            note = "standard errors unavailable: the log-likelihood is not finite next to the optimum";
            return se;
        }
        try
        {
            var cholesky = information.Cholesky();
            var covariance = cholesky.Solve(Matrix<double>.Build.DenseIdentity(k));
            for (int i = 0; i < k; i++)
            {
                double var = covariance[i, i];
                se[i] = var > 0 && double.IsFinite(var) ? Math.Abs(derivative[i]) * Math.Sqrt(var) : null;
            }
        }
        catch (ArgumentException)
        {
            note = "standard errors unavailable: the observed information is not positive definite (optimum on a flat ridge or at a bound)";
        }
        return se;
    }
}
