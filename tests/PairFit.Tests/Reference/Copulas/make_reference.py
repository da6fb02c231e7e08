#!/usr/bin/python3
"""Reference values for PairFit's copula families and special functions.

Run from this folder with Debian's Python (SciPy 1.10.1, NumPy):
    /usr/bin/python3 make_reference.py
It rewrites the CSV files beside it. Every value is computed by a route different from the C#
code: copula log densities of Archimedean families from their generators (c = -phi''(C) phi'(u)
phi'(v) / phi'(C)^3, Nelsen 2006, sec. 4.3) in 250-digit decimal arithmetic; Gaussian and Student t
log densities as the joint log density (scipy.stats.multivariate_normal / multivariate_t) minus
the marginal log densities; bivariate normal and t CDFs by adaptive quadrature of the conditional
law (scipy.integrate.quad); Kendall's tau of Archimedean families by Genest and MacKay (1986),
tau = 1 + 4 int_0^1 phi(t)/phi'(t) dt; Debye functions by quad of their defining integral.
"""
import csv
import numpy as np
import scipy
from scipy import integrate, stats

assert scipy.__version__ == "1.10.1", scipy.__version__

def r(x):
    return repr(float(x))

def t_ppf(p, nu):
    # SciPy 1.10.1's t.ppf (cephes stdtrit) is off by up to ~2e-10 relative in the far tail (seen at
    # p = 1e-8, nu = 2 against the closed form); two Newton steps on t.cdf/t.pdf restore full accuracy.
    x = stats.t.ppf(p, nu)
    for _ in range(2):
        if p < 0.5:
            x -= (stats.t.cdf(x, nu) - p) / stats.t.pdf(x, nu)
        else:
            x += (stats.t.sf(x, nu) - (1 - p)) / stats.t.pdf(x, nu)
    return x

# ---------- points ----------
rng = np.random.default_rng(20261202)
pts = [tuple(p) for p in rng.uniform(0.002, 0.998, size=(30, 2))]
pts += [(1e-6, 0.3), (0.7, 1e-6), (0.999999, 0.5), (0.2, 0.999999), (0.01, 0.02), (0.98, 0.97), (0.5, 0.5)]

# ---------- Archimedean generators (phi, phi', phi'', psi = phi^-1) in 250-digit decimal arithmetic ----------
# (so that psi(phi(u) + phi(v)) and 1 - (1-t)^theta lose nothing to cancellation near the corners)
import decimal
from decimal import Decimal as Dec
decimal.getcontext().prec = 250
ONE = Dec(1)

def dexp(x): return x.exp()
def dlog(x): return x.ln()
def dpow(x, y): return dexp(y * dlog(x))

def gen(family, th):
    th = Dec(repr(float(th)))
    if family == "clayton":
        phi = lambda t: (dpow(t, -th) - 1) / th
        d1 = lambda t: -dpow(t, -th - 1)
        d2 = lambda t: (th + 1) * dpow(t, -th - 2)
        psi = lambda s: dpow(1 + th * s, -1 / th)
    elif family == "gumbel":
        phi = lambda t: dpow(-dlog(t), th)
        d1 = lambda t: -th * dpow(-dlog(t), th - 1) / t
        d2 = lambda t: th * dpow(-dlog(t), th - 2) * ((th - 1) - dlog(t)) / (t * t)
        psi = lambda s: dexp(-dpow(s, 1 / th))
    elif family == "frank":
        phi = lambda t: -dlog((dexp(-th * t) - 1) / (dexp(-th) - 1))
        d1 = lambda t: th * dexp(-th * t) / (dexp(-th * t) - 1)
        d2 = lambda t: th * th * dexp(-th * t) / (dexp(-th * t) - 1) ** 2
        psi = lambda s: -dlog(1 + dexp(-s) * (dexp(-th) - 1)) / th
    elif family == "joe":
        phi = lambda t: -dlog(1 - dpow(1 - t, th))
        d1 = lambda t: -th * dpow(1 - t, th - 1) / (1 - dpow(1 - t, th))
        d2 = lambda t: th * dpow(1 - t, th - 2) * (th - 1 + dpow(1 - t, th)) / (1 - dpow(1 - t, th)) ** 2
        psi = lambda s: 1 - dpow(1 - dexp(-s), 1 / th)
    return phi, d1, d2, psi

def D(x):
    return Dec(repr(float(x)))

def arch_logdensity(family, th, u, v):
    phi, d1, d2, psi = gen(family, th)
    u, v = D(u), D(v)
    c = psi(phi(u) + phi(v))
    return dlog(-d2(c) * d1(u) * d1(v) / d1(c) ** 3)

def arch_cdf(family, th, u, v):
    phi, d1, d2, psi = gen(family, th)
    return psi(phi(D(u)) + phi(D(v)))

def rotate_point(rot, u, v):
    # exact complements of the double inputs, in decimal
    u, v = D(u), D(v)
    return {0: (u, v), 90: (1 - u, v), 180: (1 - u, 1 - v), 270: (u, 1 - v)}[rot]

# ---------- 1. log densities at fixed parameters ----------
rows = []
arch_cases = [("clayton", 0.7), ("clayton", 4.0), ("gumbel", 1.4), ("gumbel", 5.0),
              ("frank", 3.0), ("frank", -6.0), ("frank", 25.0), ("joe", 1.6), ("joe", 6.0)]
for fam, th in arch_cases:
    rots = [0] if fam == "frank" else [0, 90, 180, 270]
    for rot in rots:
        for (u, v) in pts:
            a, b = rotate_point(rot, u, v)
            rows.append((fam, rot, th, "", u, v, arch_logdensity(fam, th, a, b)))
for rho in (0.6, -0.85, 0.99):
    cov = [[1, rho], [rho, 1]]
    for (u, v) in pts:
        x, y = stats.norm.ppf(u), stats.norm.ppf(v)
        val = stats.multivariate_normal.logpdf([x, y], mean=[0, 0], cov=cov) - stats.norm.logpdf(x) - stats.norm.logpdf(y)
        rows.append(("gaussian", 0, rho, "", u, v, val))
for rho, nu in ((0.5, 4.0), (-0.7, 2.0), (0.9, 7.5), (0.3, 30.0)):
    shape = [[1, rho], [rho, 1]]
    for (u, v) in pts:
        x, y = t_ppf(u, nu), t_ppf(v, nu)
        val = stats.multivariate_t.logpdf([x, y], loc=[0, 0], shape=shape, df=nu) - stats.t.logpdf(x, nu) - stats.t.logpdf(y, nu)
        rows.append(("student-t", 0, rho, nu, u, v, val))
with open("log_densities.csv", "w", newline="") as f:
    w = csv.writer(f)
    w.writerow(["family", "rotation", "p1", "p2", "u", "v", "logDensity"])
    for fam, rot, p1, p2, u, v, val in rows:
        w.writerow([fam, rot, r(p1), "" if p2 == "" else r(p2), r(u), r(v), r(val)])

# ---------- 2. copula CDFs (Archimedean by generator; normal and t by quadrature) ----------
def bvn_cdf(h, k, rho):
    s = np.sqrt(1 - rho * rho)
    f = lambda t: stats.norm.pdf(t) * stats.norm.cdf((k - rho * t) / s)
    return integrate.quad(f, -np.inf, h, epsabs=1e-15, epsrel=1e-13, limit=200)[0]

def bvt_cdf(h, k, rho, nu):
    f = lambda t: stats.t.pdf(t, nu) * stats.t.cdf((k - rho * t) / np.sqrt((1 - rho * rho) * (nu + t * t) / (nu + 1)), nu + 1)
    return integrate.quad(f, -np.inf, h, epsabs=1e-15, epsrel=1e-13, limit=200)[0]

cdf_rows = []
cdf_pts = [(0.3, 0.6), (0.05, 0.9), (0.8, 0.85), (0.01, 0.015), (0.5, 0.5), (0.97, 0.2)]
for fam, th in arch_cases:
    for (u, v) in cdf_pts:
        cdf_rows.append((fam, th, "", u, v, arch_cdf(fam, th, u, v)))
for rho in (0.6, -0.85, 0.95, -0.97, 0.2):
    for (u, v) in cdf_pts:
        cdf_rows.append(("gaussian", rho, "", u, v, bvn_cdf(stats.norm.ppf(u), stats.norm.ppf(v), rho)))
for rho, nu in ((0.5, 4.0), (-0.7, 2.0), (0.9, 7.5), (0.3, 30.0), (0.95, 3.0), (-0.3, 5.0)):
    for (u, v) in cdf_pts:
        cdf_rows.append(("student-t", rho, nu, u, v, bvt_cdf(t_ppf(u, nu), t_ppf(v, nu), rho, nu)))
with open("cdfs.csv", "w", newline="") as f:
    w = csv.writer(f)
    w.writerow(["family", "p1", "p2", "u", "v", "cdf"])
    for fam, p1, p2, u, v, val in cdf_rows:
        w.writerow([fam, r(p1), "" if p2 == "" else r(p2), r(u), r(v), r(val)])

# ---------- 3. bivariate normal CDF on the normal scale, including far tails ----------
with open("bivariate_normal.csv", "w", newline="") as f:
    w = csv.writer(f)
    w.writerow(["h", "k", "rho", "cdf"])
    for h, k in ((0, 0), (-1, 0.5), (1.5, -2), (-3, -3), (2, 2.5), (-6, 1), (0.3, 0.3), (-2, 4)):
        for rho in (-0.999, -0.95, -0.6, -0.2, 0.0, 0.1, 0.5, 0.8, 0.93, 0.999):
            w.writerow([r(h), r(k), r(rho), r(bvn_cdf(h, k, rho))])

# ---------- 3b. bivariate t CDF on the t scale, non-integer and integer nu, including tails ----------
with open("bivariate_t.csv", "w", newline="") as f:
    w = csv.writer(f)
    w.writerow(["h", "k", "rho", "nu", "cdf"])
    for nu in (2.0, 2.5, 3.0, 4.5, 11.0, 30.5, 59.5):
        for h, k in ((0, 0), (-1, 0.5), (1.5, -2), (-3, -3), (2, 2.5), (-8, 1), (-25, -20), (0.3, 40)):
            for rho in (-0.95, -0.3, 0.0, 0.6, 0.97):
                w.writerow([r(h), r(k), r(rho), r(nu), r(bvt_cdf(h, k, rho, nu))])

# ---------- 3c. expm1 and log(1 - exp(-a)) (helpers every family leans on), in 250-digit decimal ----------
def dexpm1(x):
    # Taylor series below 1e-3 (the decimal exp cannot resolve 1 + 1e-300), exp - 1 above.
    if abs(x) < Dec("1e-3"):
        term, total = x, Dec(0)
        for n in range(2, 60):
            total += term
            term = term * x / n
        return total
    return dexp(x) - 1

with open("expm1.csv", "w", newline="") as f:
    w = csv.writer(f)
    w.writerow(["x", "expm1", "log1mexp"])
    for x in (1e-300, 1e-17, 1e-10, 3e-6, 1e-3, 0.05, 0.2, 0.49, 0.5, 0.51, 1.0, 2.5, 30.0, 700.0):
        for sx in (x, -x):
            xd = D(sx)
            em1 = dexpm1(xd)
            l1me = dlog(-dexpm1(-xd)) if sx > 0 else ""
            w.writerow([r(sx), r(em1), "" if l1me == "" else r(l1me)])

# ---------- 4. univariate Student t quantiles and CDF ----------
with open("student_t.csv", "w", newline="") as f:
    w = csv.writer(f)
    w.writerow(["nu", "p", "quantile"])
    for nu in (2.0, 2.5, 3.0, 4.5, 10.0, 60.0):
        for p in (1e-12, 1e-8, 1e-4, 0.01, 0.0101, 0.03, 0.08, 0.2, 0.4999, 0.5, 0.6, 0.9, 0.999, 1 - 1e-7):
            w.writerow([r(nu), r(p), r(t_ppf(p, nu))])

# ---------- 5. Kendall tau of Archimedean families (Genest and MacKay 1986) ----------
def tau_by_generator(family, th):
    phi, d1, d2, psi = gen(family, th)
    f = lambda t: float(phi(D(t)) / d1(D(t))) if 0 < t < 1 else 0.0
    return 1 + 4 * integrate.quad(f, 0, 1, epsabs=1e-14, epsrel=1e-13, limit=200)[0]

with open("kendall_tau.csv", "w", newline="") as f:
    w = csv.writer(f)
    w.writerow(["family", "theta", "tau"])
    for th in (0.5, 1.0, 2.0, 5.0, 15.0, -0.5, -3.0, -20.0):
        w.writerow(["frank", r(th), r(tau_by_generator("frank", th))])
    for th in (1.0, 1.2, 1.9999, 2.0, 2.0001, 3.0, 8.0, 25.0):
        w.writerow(["joe", r(th), r(tau_by_generator("joe", th) if th > 1 else 0.0)])

# ---------- 6. Debye functions ----------
with open("debye.csv", "w", newline="") as f:
    w = csv.writer(f)
    w.writerow(["n", "x", "value"])
    for n in (1, 2):
        for x in (1e-6, 0.1, 1.0, 2.5, 3.0, 3.5, 10.0, 50.0, -2.0, -40.0):
            val = n / x ** n * integrate.quad(lambda t: t ** n / np.expm1(t) if t != 0 else (1.0 if n == 1 else 0.0), 0, x, epsabs=1e-15, epsrel=1e-14, limit=200)[0]
            w.writerow([n, r(x), r(val)])

# ---------- 7. Student t tail dependence 2 t_{nu+1}(-sqrt((nu+1)(1-rho)/(1+rho))) ----------
with open("t_tail_dependence.csv", "w", newline="") as f:
    w = csv.writer(f)
    w.writerow(["rho", "nu", "lambda"])
    for rho, nu in ((0.5, 4.0), (-0.7, 2.0), (0.9, 7.5), (0.0, 3.0), (0.3, 30.0)):
        w.writerow([r(rho), r(nu), r(2 * stats.t.cdf(-np.sqrt((nu + 1) * (1 - rho) / (1 + rho)), nu + 1))])
print("ok", len(rows), "log densities,", len(cdf_rows), "cdfs")
