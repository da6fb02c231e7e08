using MathNet.Numerics.Differentiation;
using MathNet.Numerics.LinearAlgebra;

namespace PairFit.Core.Marginals.Fitting;

/// <summary>
/// Standard errors from the observed information: the inverse of minus the Hessian of the
/// log-likelihood at the estimate (Cox and Hinkley 1974, §9.2), the Hessian by central
/// differences (MathNet NumericalHessian). Parameters marked fixed (boundary estimates) are held
/// at their value and get no standard error. <c>weight</c> scales the Hessian when it is computed on
/// a stratified subsample of m of the n values (weight n/m): the Hessian is a sum over observations,
/// so this estimates the full-data information to about 1/√m relative, i.e. standard errors to
/// better than 1 % at m = 20,000, at a fraction of the cost.
/// </summary>
public static class StandardErrors
{
    public static double?[] FromObservedInformation(Func<double[], double> logLikelihood, double[] estimate, bool[]? fixedMask = null, double weight = 1.0)
    {
        int p = estimate.Length;
        var free = new List<int>(p);
        for (int i = 0; i < p; i++) if (fixedMask is null || !fixedMask[i]) free.Add(i);
        var result = new double?[p];
        if (free.Count == 0) return result;

        double Reduced(double[] q)
        {
            var full = (double[])estimate.Clone();
            for (int k = 0; k < free.Count; k++) full[free[k]] = q[k];
            return logLikelihood(full);
        }
        var x0 = new double[free.Count];
        for (int k = 0; k < free.Count; k++) x0[k] = estimate[free[k]];
        double[,] h;
        try { h = new NumericalHessian().Evaluate(Reduced, x0); }
        catch (Exception) { return result; }
        var info = -weight * Matrix<double>.Build.DenseOfArray(h);
        if (!info.Enumerate().All(double.IsFinite)) return result;
        Matrix<double> cov;
        try { cov = info.Inverse(); }
        catch (Exception) { return result; }
        for (int k = 0; k < free.Count; k++)
        {
            double v = cov[k, k];
            result[free[k]] = v > 0 && double.IsFinite(v) ? Math.Sqrt(v) : null;
        }
        return result;
    }
}
