using MathNet.Numerics.Integration;

namespace PairFit.Core.Common;

/// <summary>
/// Debye functions D_n(x) = (n / x^n) ∫_0^x t^n / (e^t − 1) dt for n = 1, 2 (Abramowitz and Stegun
/// 1964, 27.1.1), needed by the Frank copula's Kendall tau and Spearman rho. For negative x,
/// D_n(−x) = D_n(x) + n x / (n + 1) (A&amp;S 1964, 27.1.2).
/// </summary>
public static class Debye
{
    // 0 < x ≤ 3: Gauss–Legendre on [0, x]. The integrand is analytic with its nearest poles at
    // ±2πi, far from an interval of length 3, so 24 nodes are exact to rounding.
    private const double QuadratureLimit = 3.0;
    private static readonly GaussLegendreRule Rule = new(0.0, 1.0, 24);

    public static double D1(double x) => Evaluate(1, x);

    public static double D2(double x) => Evaluate(2, x);

    private static double Evaluate(int n, double x)
    {
        if (x == 0) return 1.0;
        if (x < 0) return Evaluate(n, -x) + n * (-x) / (n + 1);
        double integral = x <= QuadratureLimit ? IntegralByQuadrature(n, x) : IntegralBySeries(n, x);
        return n * integral / Math.Pow(x, n);
    }

    private static double IntegralByQuadrature(int n, double x)
    {
        double sum = 0;
        for (int i = 0; i < Rule.Abscissas.Length; i++)
        {
            double t = x * Rule.Abscissas[i];
            sum += Rule.Weights[i] * Math.Pow(t, n) / MathExtras.ExpM1(t);
        }
        return x * sum;
    }

    // ∫_0^x t^n/(e^t−1) dt = n! ζ(n+1) − Σ_{k≥1} e^{−kx} Σ_{j=0}^{n} n!/j! x^j / k^{n+1−j}
    // (A&amp;S 1964, 27.1.2 with the expansion of the upper tail); for x > 3 the terms fall like e^{−3k}.
    private static double IntegralBySeries(int n, double x)
    {
        double full = n == 1 ? Math.PI * Math.PI / 6 : 2 * 1.2020569031595942853997; // 1!ζ(2), 2!ζ(3)
        double tail = 0;
        for (int k = 1; k <= 60; k++)
        {
            double e = Math.Exp(-k * x);
            if (e == 0) break;
            double inner = 0, factorial = 1; // n!/j! built from j = n down
            for (int j = n; j >= 0; j--)
            {
                inner += factorial * Math.Pow(x, j) / Math.Pow(k, n + 1 - j);
                factorial *= j;
            }
            double term = e * inner;
            tail += term;
            if (term < 1e-17 * full) break;
        }
        return full - tail;
    }
}
