using MathNet.Numerics;

namespace PairFit.Core.Common;

/// <summary>
/// The bivariate Student t CDF T2(h, k; ρ, ν) = P(X ≤ h, Y ≤ k) for the standard bivariate t law
/// with correlation ρ and ν degrees of freedom. MathNet has none.
/// </summary>
public static class BivariateStudentT
{
    /// <summary>
    /// Integer ν: the closed form of Dunnett and Sobel (1954) in the arrangement of Genz (2004,
    /// function BVTL; written from memory, confirmed against SciPy quadrature to 2e−15). Other ν:
    /// the t law as a normal variance mixture, T2 = E[Φ2(hR/√ν, kR/√ν; ρ)] with R ~ χ_ν, by an
    /// 80-node Gauss–Jacobi rule built once per ν (see <see cref="MixtureRule"/>): about 1e−12
    /// absolute while |h|, |k| ≤ 10, up to ~2e−9 when one of them is 20–40 (Φ2 is then steep near
    /// r = 0 and under-resolved). Costs 80 bivariate normal CDFs per call, ~100× the integer case.
    /// </summary>
    public static double Cdf(double h, double k, double rho, double nu)
    {
        if (double.IsNegativeInfinity(h) || double.IsNegativeInfinity(k)) return 0.0;
        var t = new StudentTFunctions(nu);
        if (double.IsPositiveInfinity(h)) return t.Cdf(k);
        if (double.IsPositiveInfinity(k)) return t.Cdf(h);
        double p = nu == Math.Round(nu) && nu <= 1000 ? DunnettSobel(h, k, rho, (int)nu, t) : ByQuadrature(h, k, rho, nu, t);
        return Math.Clamp(p, 0.0, 1.0);
    }

    private static double DunnettSobel(double dh, double dk, double r, int nu, StudentTFunctions t)
    {
        const double eps = 1e-15;
        const double tpi = 2 * Math.PI;
        if (1 - r < eps) return t.Cdf(Math.Min(dh, dk));
        if (r + 1 < eps) return dh > -dk ? t.Cdf(dh) - t.Cdf(-dk) : 0.0;

        double snu = Math.Sqrt(nu);
        double ors = 1 - r * r, hrk = dh - r * dk, krh = dk - r * dh;
        double xnhk = 0, xnkh = 0;
        if (Math.Abs(hrk) + ors > 0)
        {
            xnhk = hrk * hrk / (hrk * hrk + ors * (nu + dk * dk));
            xnkh = krh * krh / (krh * krh + ors * (nu + dh * dh));
        }
        double hs = Math.Sign(dh - r * dk), ks = Math.Sign(dk - r * dh);
        double bvt;
        if (nu % 2 == 0)
        {
            bvt = Math.Atan2(Math.Sqrt(ors), -r) / tpi;
            double gmph = dh / Math.Sqrt(16 * (nu + dh * dh)), gmpk = dk / Math.Sqrt(16 * (nu + dk * dk));
            double btnckh = 2 * Math.Atan2(Math.Sqrt(xnkh), Math.Sqrt(1 - xnkh)) / Math.PI;
            double btpdkh = 2 * Math.Sqrt(xnkh * (1 - xnkh)) / Math.PI;
            double btnchk = 2 * Math.Atan2(Math.Sqrt(xnhk), Math.Sqrt(1 - xnhk)) / Math.PI;
            double btpdhk = 2 * Math.Sqrt(xnhk * (1 - xnhk)) / Math.PI;
            for (int j = 1; j <= nu / 2; j++)
            {
                bvt += gmph * (1 + ks * btnckh) + gmpk * (1 + hs * btnchk);
                btnckh += btpdkh;
                btpdkh = 2 * j * btpdkh * (1 - xnkh) / (2 * j + 1);
                btnchk += btpdhk;
                btpdhk = 2 * j * btpdhk * (1 - xnhk) / (2 * j + 1);
                gmph = gmph * (2 * j - 1) / (2 * j * (1 + dh * dh / nu));
                gmpk = gmpk * (2 * j - 1) / (2 * j * (1 + dk * dk / nu));
            }
        }
        else
        {
            double qhrk = Math.Sqrt(dh * dh + dk * dk - 2 * r * dh * dk + nu * ors);
            double hkrn = dh * dk + r * nu, hkn = dh * dk - nu, hpk = dh + dk;
            bvt = Math.Atan2(-snu * (hkn * qhrk + hpk * hkrn), hkn * hkrn - nu * hpk * qhrk) / tpi;
            if (bvt < -eps) bvt += 1;
            double gmph = dh / (tpi * snu * (1 + dh * dh / nu)), gmpk = dk / (tpi * snu * (1 + dk * dk / nu));
            double btnckh = Math.Sqrt(xnkh), btpdkh = btnckh;
            double btnchk = Math.Sqrt(xnhk), btpdhk = btnchk;
            for (int j = 1; j <= (nu - 1) / 2; j++)
            {
                bvt += gmph * (1 + ks * btnckh) + gmpk * (1 + hs * btnchk);
                btpdkh = (2 * j - 1) * btpdkh * (1 - xnkh) / (2 * j);
                btnckh += btpdkh;
                btpdhk = (2 * j - 1) * btpdhk * (1 - xnhk) / (2 * j);
                btnchk += btpdhk;
                gmph = gmph * 2 * j / ((2 * j + 1) * (1 + dh * dh / nu));
                gmpk = gmpk * 2 * j / ((2 * j + 1) * (1 + dk * dk / nu));
            }
        }
        return bvt;
    }

    // ---- non-integer ν: the normal variance mixture ----
    // T2(h, k; ρ, ν) = E[Φ2(hR/√ν, kR/√ν; ρ)] with R = √W, W ~ χ²_ν (the t vector is Z/√(W/ν)),
    // i.e. ∫_0^∞ f_χν(r) Φ2(hr/√ν, kr/√ν; ρ) dr, f_χν(r) = r^(ν−1) e^(−r²/2)/(2^(ν/2−1) Γ(ν/2)).
    // The factor r^(ν−1) is not smooth at 0 for non-integer ν, so it is taken as the weight of a
    // Gauss–Jacobi rule on [0, r_max]; what is left, e^(−r²/2) Φ2(...), is entire in r. The tail
    // beyond r_max = √ν + 9 holds less than e^(−81/2) ≈ 3e−18 of the χ law (its sub-Gaussian bound).
    private const int MixtureNodes = 80;
    private static readonly System.Collections.Concurrent.ConcurrentDictionary<double, (double[] R, double[] W)> MixtureRules = new();

    private static double ByQuadrature(double h, double k, double rho, double nu, StudentTFunctions t)
    {
        var (r, w) = MixtureRule(nu);
        double scale = 1 / Math.Sqrt(nu), sum = 0;
        double[]? sines = BivariateNormal.SineNodes(rho); // shared by all nodes: one ρ
        for (int i = 0; i < r.Length; i++)
        {
            double p = BivariateNormal.Cdf(h * r[i] * scale, k * r[i] * scale, rho, sines);
            sum += w[i] * p;
        }
        return sum;
    }

    /// <summary>
    /// Nodes r_i and weights w_i with Σ w_i g(r_i) ≈ ∫_0^∞ f_χν(r) g(r) dr for smooth g: Gauss–Jacobi
    /// nodes for the weight (1 + z)^(ν−1) on [−1, 1] by the Golub–Welsch eigenvalue method (Golub and
    /// Welsch 1969), mapped to [0, r_max], with e^(−r²/2) and the χ normaliser folded into the weights.
    /// </summary>
    private static (double[] R, double[] W) MixtureRule(double nu)
    {
        if (MixtureRules.TryGetValue(nu, out var cached)) return cached;
        int n = MixtureNodes;
        double alpha = 0, beta = nu - 1, ab = alpha + beta;
        var jacobi = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.Dense(n, n);
        for (int i = 0; i < n; i++)
        {
            // Recurrence coefficients of the monic Jacobi polynomials (Gautschi 2004, Table 1.1; from memory, confirmed by the reference tests).
            double d = 2 * i + ab;
            jacobi[i, i] = i == 0 ? (beta - alpha) / (ab + 2) : (beta * beta - alpha * alpha) / (d * (d + 2));
            if (i > 0)
            {
                double b2 = 4.0 * i * (i + alpha) * (i + beta) * (i + ab) / (d * d * (d + 1) * (d - 1));
                jacobi[i, i - 1] = jacobi[i - 1, i] = Math.Sqrt(b2);
            }
        }
        var evd = jacobi.Evd(MathNet.Numerics.LinearAlgebra.Symmetricity.Symmetric);
        // μ0 = ∫_{−1}^{1} (1 + z)^β dz = 2^(β+1)/(β+1).
        double logMu0 = (beta + 1) * Math.Log(2) - Math.Log(beta + 1);
        double rMax = Math.Sqrt(nu) + 9, half = rMax / 2;
        // f_χν(r) dr = (half)^ν (1+z)^(ν−1) e^(−r²/2) / (2^(ν/2−1) Γ(ν/2)) dz.
        double logConstant = nu * Math.Log(half) - (nu / 2 - 1) * Math.Log(2) - SpecialFunctions.GammaLn(nu / 2);
        var r = new double[n];
        var w = new double[n];
        for (int i = 0; i < n; i++)
        {
            double z = evd.EigenValues[i].Real, v0 = evd.EigenVectors[0, i];
            r[i] = half * (1 + z);
            w[i] = v0 * v0 * Math.Exp(logMu0 + logConstant - r[i] * r[i] / 2);
        }
        if (MixtureRules.Count > 64) MixtureRules.Clear();
        MixtureRules[nu] = (r, w);
        return (r, w);
    }
}
