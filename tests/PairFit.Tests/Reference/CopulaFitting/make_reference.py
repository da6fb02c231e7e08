#!/usr/bin/python3
# Reference values for tests/PairFit.Tests/CopulaFitting (maximum pseudo-likelihood optima).
# Run from this directory with Debian's Python (SciPy 1.10.1, NumPy):  /usr/bin/python3 make_reference.py
# Writes data_<name>.csv (synthetic paired samples, columns x,y) and optima.json.
#
# Independent of PairFit: the copula log densities below are written directly from their
# published forms (Nelsen 2006, Table 4.1; Joe 2014, sections 4.3-4.8), pseudo-observations are
# scipy.stats.rankdata/(n+1), optima come from a dense grid followed by SciPy's bounded scalar
# minimiser (one parameter) or Nelder-Mead from several starts (Student t), and standard errors
# from a central second difference of the log-likelihood in the natural parameter.
import json
import numpy as np
import scipy
from scipy import optimize, stats

assert scipy.__version__ == "1.10.1", scipy.__version__
N = 400
rng = np.random.default_rng(20261202)


def clayton_sample(theta, n):
    u, w = rng.uniform(size=n), rng.uniform(size=n)
    v = ((w ** (-theta / (1 + theta)) - 1) * u ** (-theta) + 1) ** (-1 / theta)
    return u, v


def t_sample(rho, nu, n):
    z = rng.multivariate_normal([0, 0], [[1, rho], [rho, 1]], size=n)
    w = rng.chisquare(nu, size=n) / nu
    x = z / np.sqrt(w)[:, None]
    return stats.t.cdf(x[:, 0], nu), stats.t.cdf(x[:, 1], nu)


def to_data(u, v):
    # Arbitrary continuous marginals (exponential and lognormal); the ranks are what matter.
    return -3.0 * np.log1p(-u), np.exp(0.5 * stats.norm.ppf(v) + 1.0)


def log_clayton(u, v, th):
    return np.log1p(th) - (1 + th) * (np.log(u) + np.log(v)) - (2 + 1 / th) * np.log(u ** -th + v ** -th - 1)


def log_gumbel(u, v, th):
    x, y = -np.log(u), -np.log(v)
    a = x ** th + y ** th
    return (-a ** (1 / th) + (th - 1) * (np.log(x) + np.log(y)) - np.log(u) - np.log(v)
            + (2 / th - 2) * np.log(a) + np.log1p((th - 1) * a ** (-1 / th)))


def log_frank(u, v, th):
    em = -np.expm1(-th)  # 1 - e^-th
    den = em - (-np.expm1(-th * u)) * (-np.expm1(-th * v))
    # th * em > 0 and den has the sign of th for either sign of th, hence the absolute value.
    return np.log(th * em) - th * (u + v) - 2 * np.log(np.abs(den))


def log_joe(u, v, th):
    a, b = (1 - u) ** th, (1 - v) ** th
    s = a + b - a * b
    return (1 / th - 2) * np.log(s) + (th - 1) * (np.log1p(-u) + np.log1p(-v)) + np.log(th - 1 + s)


def log_gaussian(u, v, rho):
    a, b = stats.norm.ppf(u), stats.norm.ppf(v)
    return -0.5 * np.log1p(-rho * rho) - (rho * rho * (a * a + b * b) - 2 * rho * a * b) / (2 * (1 - rho * rho))


def log_t(u, v, rho, nu):
    a, b = stats.t.ppf(u, nu), stats.t.ppf(v, nu)
    joint = stats.multivariate_t(loc=[0, 0], shape=[[1, rho], [rho, 1]], df=nu).logpdf(np.column_stack([a, b]))
    return joint - stats.t.logpdf(a, nu) - stats.t.logpdf(b, nu)


ONE_PARAM = {
    # family: (log density, natural range searched)
    "clayton": (log_clayton, (1e-4, 50.0)),
    "gumbel": (log_gumbel, (1.0 + 1e-8, 30.0)),
    "joe": (log_joe, (1.0 + 1e-8, 30.0)),
    "frank": (log_frank, (-50.0, 50.0)),
    "gaussian": (log_gaussian, (-0.999, 0.999)),
}


def rotate(u, v, rotation):
    return {0: (u, v), 90: (1 - u, v), 180: (1 - u, 1 - v), 270: (u, 1 - v)}[rotation]


def loglik_one(fam, rotation, u, v, th):
    if fam == "frank" and th == 0:
        return 0.0
    ru, rv = rotate(u, v, rotation)
    s = np.sum(ONE_PARAM[fam][0](ru, rv, th))
    return s if np.isfinite(s) else -np.inf


def optimum_one(fam, rotation, u, v):
    lo, hi = ONE_PARAM[fam][1]
    grid = np.linspace(lo, hi, 4001)
    vals = np.array([loglik_one(fam, rotation, u, v, g) for g in grid])
    k = int(np.nanargmax(vals))
    a, b = grid[max(k - 1, 0)], grid[min(k + 1, len(grid) - 1)]
    res = optimize.minimize_scalar(lambda t: -loglik_one(fam, rotation, u, v, t), bounds=(a, b), method="bounded",
                                   options={"xatol": 1e-12, "maxiter": 500})
    th = float(res.x)
    h = 1e-4 * max(abs(th), 0.05)
    d2 = (loglik_one(fam, rotation, u, v, th + h) - 2 * loglik_one(fam, rotation, u, v, th)
          + loglik_one(fam, rotation, u, v, th - h)) / (h * h)
    return [th], float(-res.fun), [float(1 / np.sqrt(-d2))]


def optimum_t(u, v):
    f = lambda p: -np.sum(log_t(u, v, np.tanh(p[0]), np.exp(p[1])))
    best = None
    for r0 in (0.2, 0.5, 0.8):
        for n0 in (3.0, 8.0, 20.0):
            res = optimize.minimize(f, [np.arctanh(r0), np.log(n0)], method="Nelder-Mead",
                                    options={"xatol": 1e-11, "fatol": 1e-12, "maxiter": 20000, "maxfev": 40000})
            if best is None or res.fun < best.fun:
                best = res
    rho, nu = float(np.tanh(best.x[0])), float(np.exp(best.x[1]))
    g = lambda r, n: np.sum(log_t(u, v, r, n))
    hr, hn = 1e-4, 1e-4 * nu
    l0 = g(rho, nu)
    hrr = (g(rho + hr, nu) - 2 * l0 + g(rho - hr, nu)) / hr ** 2
    hnn = (g(rho, nu + hn) - 2 * l0 + g(rho, nu - hn)) / hn ** 2
    hrn = (g(rho + hr, nu + hn) - g(rho + hr, nu - hn) - g(rho - hr, nu + hn) + g(rho - hr, nu - hn)) / (4 * hr * hn)
    cov = np.linalg.inv(-np.array([[hrr, hrn], [hrn, hnn]]))
    return [rho, nu], float(-best.fun), [float(np.sqrt(cov[0, 0])), float(np.sqrt(cov[1, 1]))]


datasets = {}
u, v = clayton_sample(2.0, N)
datasets["positive"] = to_data(u, v)
datasets["negative"] = to_data(1 - u, v)  # (1-U, V): the same sample mirrored, negative dependence
datasets["heavy"] = to_data(*t_sample(0.5, 4.0, N))

plans = {
    "positive": [("clayton", 0), ("clayton", 180), ("gumbel", 0), ("gumbel", 180), ("joe", 0), ("joe", 180),
                 ("frank", 0), ("gaussian", 0), ("student-t", 0)],
    "negative": [("clayton", 90), ("clayton", 270), ("gumbel", 90), ("gumbel", 270), ("joe", 90), ("joe", 270),
                 ("frank", 0), ("gaussian", 0)],
    "heavy": [("gaussian", 0), ("student-t", 0), ("clayton", 0), ("gumbel", 0)],
}

rows = []
for name, (x, y) in datasets.items():
    with open(f"data_{name}.csv", "w") as fh:
        fh.write("x,y\n")
        for a, b in zip(x, y):
            fh.write(f"{a!r},{b!r}\n")
    pu, pv = stats.rankdata(x) / (N + 1), stats.rankdata(y) / (N + 1)
    for fam, rot in plans[name]:
        if fam == "student-t":
            params, ll, se = optimum_t(pu, pv)
            names = ["rho", "nu"]
        else:
            params, ll, se = optimum_one(fam, rot, pu, pv)
            names = ["rho"] if fam == "gaussian" else ["theta"]
        rows.append({"dataset": name, "family": fam, "rotation": rot, "parameterNames": names,
                     "parameters": params, "logLikelihood": ll, "standardErrors": se})
        print(name, fam, rot, params, ll, se)

with open("optima.json", "w") as fh:
    json.dump({"source": "SciPy 1.10.1 via make_reference.py", "n": N, "optima": rows}, fh, indent=1)
