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
    /// section 3, function BVTL), exact up to rounding (~1e−15). Other ν: adaptive quadrature of
    /// the conditional law, T2 = ∫_{−∞}^{h} f_ν(s) T_{ν+1}((k − ρs)/√((1 − ρ²)(ν + s²)/(ν + 1))) ds
    /// (Y | X = s is t with ν + 1 degrees of freedom, location ρs and that scale; Joe 2014, ch. 4),
    /// by double-exponential quadrature after mapping the half line to (0, 1), about 1e−13.
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

    private static double ByQuadrature(double h, double k, double rho, double nu, StudentTFunctions t)
    {
        var conditional = new StudentTFunctions(nu + 1);
        double oneMinusRho2 = (1 - rho) * (1 + rho);
        double Integrand(double s)
            => Math.Exp(t.LogPdf(s)) * conditional.Cdf((k - rho * s) / Math.Sqrt(oneMinusRho2 * (nu + s * s) / (nu + 1)));
        // Split at min(h, 0) so the infinite piece is a pure tail and the finite piece is smooth.
        double split = Math.Min(h, 0.0);
        double tailPart = Integrate.DoubleExponential(Integrand, double.NegativeInfinity, split, 1e-14);
        double finitePart = h > split ? Integrate.DoubleExponential(Integrand, split, h, 1e-14) : 0.0;
        return tailPart + finitePart;
    }
}
