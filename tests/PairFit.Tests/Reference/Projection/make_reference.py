#!/usr/bin/python3
"""Reference values for PairFit's projection of a joint law onto Q = g(X, Y).

Run from this directory with Debian's Python (SciPy 1.10.1, NumPy):
    /usr/bin/python3 make_reference.py
It writes clayton_projection.csv. Columns: rotation, theta, expression, q, cdf, pdf.

Model: X ~ lognormal (log-mean 1.0, log-sd 0.5), Y ~ normal(mean 2, sd 1.5), coupled by a Clayton
copula with theta = 2 rotated by 0, 90, 180 or 270 degrees. The copula is implemented here from
its textbook formulas (Nelsen 2006, (4.2.1); rotations as in Joe 2014, section 1.7) independently of
PairFit's C# code, and the law of Q is integrated in x-space with scipy.integrate.quad,
    P(Q <= q) = int f_X(x) P(g(x, Y) <= q | X = x) dx,
    f_Q(q)    = int f(x, y(x, q)) |dy/dq| dx,
whereas PairFit integrates in u = F_X(x) with its own Gauss-Kronrod code.
"""
import csv
import math

import numpy as np
import scipy
from scipy import integrate, stats

assert scipy.__version__ == "1.10.1", scipy.__version__

THETA = 2.0
X = stats.lognorm(s=0.5, scale=math.exp(1.0))
Y = stats.norm(loc=2.0, scale=1.5)


TINY = 1e-300


def log_gen_sum(a, b, th):
    """log(a^-th + b^-th - 1), in logs so that nothing overflows."""
    la, lb = -th * math.log(max(a, TINY)), -th * math.log(max(b, TINY))
    m = max(la, lb)
    return m + math.log(math.exp(la - m) + math.exp(lb - m) - math.exp(-m))


def clayton_h(a, b, th):
    """dC/da of the unrotated Clayton copula at (a, b)."""
    if b <= 0.0:
        return 0.0
    return math.exp((-th - 1.0) * math.log(max(a, TINY)) + (-1.0 / th - 1.0) * log_gen_sum(a, b, th))


def clayton_c(a, b, th):
    if a <= 0.0 or b <= 0.0:
        return 0.0
    return math.exp(math.log1p(th) + (-1.0 - th) * (math.log(a) + math.log(b)) + (-2.0 - 1.0 / th) * log_gen_sum(a, b, th))


def h(x, y, rot):
    """P(Y <= y | X = x) of the rotated copula; complements from the survival functions."""
    u, ub, v, vb = X.cdf(x), X.sf(x), Y.cdf(y), Y.sf(y)
    if v <= 0.0:
        return 0.0
    if vb <= 0.0:
        return 1.0
    if rot == 0:
        return clayton_h(u, v, THETA)
    if rot == 90:       # (1-U, V)
        return clayton_h(ub, v, THETA)
    if rot == 180:      # (1-U, 1-V)
        return 1.0 - clayton_h(ub, vb, THETA)
    return 1.0 - clayton_h(u, vb, THETA)   # 270: (U, 1-V)


def c(x, y, rot):
    u, ub, v, vb = X.cdf(x), X.sf(x), Y.cdf(y), Y.sf(y)
    a, b = {0: (u, v), 90: (ub, v), 180: (ub, vb), 270: (u, vb)}[rot]
    return clayton_c(a, b, THETA)


OPTS = dict(limit=500, epsabs=1e-12, epsrel=1e-10)


def cdf_sum(q, rot):
    return integrate.quad(lambda x: X.pdf(x) * h(x, q - x, rot), 0, np.inf, **OPTS)[0]


def pdf_sum(q, rot):
    return integrate.quad(lambda x: X.pdf(x) * Y.pdf(q - x) * c(x, q - x, rot), 0, np.inf, **OPTS)[0]


def cdf_ratio(q, rot):
    # X > 0, so y / x <= q  <=>  y <= q x.
    return integrate.quad(lambda x: X.pdf(x) * h(x, q * x, rot), 0, np.inf, **OPTS)[0]


def pdf_ratio(q, rot):
    return integrate.quad(lambda x: X.pdf(x) * Y.pdf(q * x) * c(x, q * x, rot) * x, 0, np.inf, **OPTS)[0]


rows = []
for rot in (0, 90, 180, 270):
    for q in (-1.0, 1.5, 3.0, 4.5, 6.0, 9.0, 12.0, 16.0):
        rows.append((rot, THETA, "x + y", q, cdf_sum(q, rot), pdf_sum(q, rot)))
    for q in (-0.2, 0.0, 0.1, 0.2, 0.35, 0.5, 0.8):
        rows.append((rot, THETA, "y / x", q, cdf_ratio(q, rot), pdf_ratio(q, rot)))

with open("clayton_projection.csv", "w", newline="") as fh:
    w = csv.writer(fh)
    w.writerow(["rotation", "theta", "expression", "q", "cdf", "pdf"])
    for r in rows:
        w.writerow([r[0], r[1], r[2], repr(r[3]), repr(r[4]), repr(r[5])])
print(f"wrote {len(rows)} rows with SciPy {scipy.__version__}")
