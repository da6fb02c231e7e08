#!/usr/bin/python3
"""Reference values for the figure computations (tests/PairFit.Tests/Figures).

Run with Debian's SciPy 1.10.1:  /usr/bin/python3 make_reference.py   (from this folder)
Writes:
  kendall_plot_w.csv  n,i,w  -- W_{i:n}, the expected i-th order statistic of the Kendall-plot
                                statistic H under independence (Genest and Boies 2003, eq. 1):
                                W_{i:n} = n C(n-1, i-1) * int_0^1 w k0(w) K0(w)^(i-1) (1-K0(w))^(n-i) dw,
                                K0(w) = w - w ln w, k0(w) = -ln w; by scipy.integrate.quad in w.
  qq_band.csv         n,i,lower,upper -- pointwise 95 % band of the i-th order statistic of n draws from
                                lognormal(mu=1, sigma=0.5): F^-1(Beta(i, n+1-i).ppf(0.025 / 0.975)),
                                by scipy.stats.beta.ppf and scipy.stats.lognorm.ppf.
"""
import csv
import math

import numpy as np
import scipy
from scipy import integrate, special, stats

assert scipy.__version__ == "1.10.1", scipy.__version__


def k0(w):
    return w - w * math.log(w) if w > 0 else 0.0


def w_in(i, n):
    logc = math.log(n) + special.gammaln(n) - special.gammaln(i) - special.gammaln(n - i + 1)

    def f(w):
        if w <= 0 or w >= 1:
            return 0.0
        K = k0(w)
        return math.exp(logc + (i - 1) * math.log(K) + (n - i) * math.log1p(-K)) * w * (-math.log(w))

    # split the range to help quad with the peaked integrand
    pts = np.linspace(0, 1, 41)
    total = 0.0
    for a, b in zip(pts[:-1], pts[1:]):
        val, _ = integrate.quad(f, a, b, epsabs=1e-14, epsrel=1e-12, limit=200)
        total += val
    return total


with open("kendall_plot_w.csv", "w", newline="") as fh:
    wr = csv.writer(fh)
    wr.writerow(["n", "i", "w"])
    for n in (10, 50):
        for i in range(1, n + 1):
            wr.writerow([n, i, repr(w_in(i, n))])

with open("qq_band.csv", "w", newline="") as fh:
    wr = csv.writer(fh)
    wr.writerow(["n", "i", "lower", "upper"])
    dist = stats.lognorm(s=0.5, scale=math.exp(1.0))
    n = 20
    for i in range(1, n + 1):
        b = stats.beta(i, n + 1 - i)
        wr.writerow([n, i, repr(float(dist.ppf(b.ppf(0.025)))), repr(float(dist.ppf(b.ppf(0.975))))])
