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
    /// <summary>
    /// Step in free coordinates. Truncation error of the central differences is O(h²) ≈ 1e−8 relative;
    /// round-off is about ε|ℓ|/h² ≈ 2e−8|ℓ|, negligible against the curvature, which grows like n as |ℓ| does.
    /// </summary>
    public const double Step = 1e-4;

    /// <summary>Gradient and Hessian of <paramref name="f"/> at <paramref name="x"/> (whose value is <paramref name="f0"/>) by central differences.</summary>
    public static (double[] Gradient, Matrix<double> Hessian) Derivatives(Func<double[], double> f, double[] x, double f0, double h = Step)
    {
        int k = x.Length;
        var g = new double[k];
        var hess = Matrix<double>.Build.Dense(k, k);
        var t = (double[])x.Clone();
        double At(int i, double di, int j, double dj)
        {
            Array.Copy(x, t, k);
            t[i] += di;
            t[j] += dj;
            return f(t);
        }
        for (int i = 0; i < k; i++)
        {
            double up = At(i, h, i, 0), down = At(i, -h, i, 0);
            g[i] = (up - down) / (2 * h);
            hess[i, i] = (up - 2 * f0 + down) / (h * h);
            for (int j = 0; j < i; j++)
            {
                double hij = (At(i, h, j, h) - At(i, h, j, -h) - At(i, -h, j, h) + At(i, -h, j, -h)) / (4 * h * h);
                hess[i, j] = hij;
                hess[j, i] = hij;
            }
        }
        return (g, hess);
    }

    /// <summary>
    /// Standard errors of the natural parameters, null for every entry when −H is not positive
    /// definite (then <paramref name="note"/> says so).
    /// </summary>
    public static double?[] StandardErrors(Func<double[], double> logLikelihood, double[] free, double[] derivative, out string? note)
    {
        if (free.Length == 0) { note = null; return []; }
        var (_, hessian) = Derivatives(logLikelihood, free, logLikelihood(free));
        return FromHessian(hessian, derivative, out note);
    }

    /// <summary>Standard errors from a Hessian of the log-likelihood in free coordinates (see the class summary).</summary>
    public static double?[] FromHessian(Matrix<double> hessian, double[] derivative, out string? note)
    {
        int k = derivative.Length;
        note = null;
        var se = new double?[k];
        var information = -hessian;
        bool finite = true;
        for (int i = 0; i < k; i++) for (int j = 0; j < k; j++) finite &= double.IsFinite(information[i, j]);
        if (!finite)
        {
            note = "standard errors unavailable: the log-likelihood is not finite next to the optimum";
            return se;
        }
        try
        {
            var covariance = information.Cholesky().Solve(Matrix<double>.Build.DenseIdentity(k));
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
