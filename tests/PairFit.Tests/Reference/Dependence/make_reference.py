#!/usr/bin/python3
"""Reference values for PairFit's dependence measures.

Run from this folder with Debian's Python (it has SciPy; the pyenv `python3` on PATH does not):

    /usr/bin/python3 make_reference.py

Written against SciPy 1.10.1 and NumPy from Debian 12 (python3-scipy, python3-numpy). It writes
small synthetic datasets (fixed seeds; ties and negative dependence included) as CSV files and
reference.json with, per dataset:
  pearson  : scipy.stats.pearsonr -> statistic, pvalue, confidence_interval(0.95) (Fisher z)
  spearman : scipy.stats.spearmanr -> statistic, pvalue (t approximation)
  kendall  : scipy.stats.kendalltau(variant='b', method='asymptotic') -> statistic, pvalue;
             pValueAuto from the default method='auto' (exact when no ties and n <= 33)
  kendallJackknifeSe : jackknife standard error of tau-b from n leave-one-out scipy kendalltau calls
  tail     : empirical tail dependence counted directly on scipy.stats.rankdata pseudo-observations
             u = rank/(n+1), k = floor(sqrt(n)): upper = #{u > 1-k/n, v > 1-k/n}/k, lower = #{u <= k/n, v <= k/n}/k
"""
import json
import math

import numpy as np
import scipy
from scipy import stats


def datasets():
    rng = np.random.default_rng(20261202)
    out = {}
    # Many ties, positive dependence (rounded values).
    x = np.round(rng.normal(0, 2, 40))
    y = np.round(x + rng.normal(0, 1.5, 40))
    out["ties_positive"] = (x, y)
    # Continuous, negative dependence.
    x = rng.normal(10, 3, 25)
    y = -0.6 * x + rng.normal(0, 2, 25)
    out["negative"] = (x, y)
    # Heavy ties: x in 1..4, y in 1..3, negatively related.
    x = rng.integers(1, 5, 60).astype(float)
    y = np.clip(np.round(4 - 0.7 * x + rng.normal(0, 0.8, 60)), 1, 3)
    out["heavy_ties"] = (x, y)
    # Skewed, positively dependent, larger n (lognormal margins from a normal pair).
    z1 = rng.normal(0, 1, 500)
    z2 = 0.7 * z1 + math.sqrt(1 - 0.49) * rng.normal(0, 1, 500)
    out["skewed_500"] = (np.exp(1.0 * z1 + 2), np.exp(0.5 * z2))
    # No ties, n = 30: the exact p-value region.
    x = rng.normal(0, 1, 30)
    out["no_ties_30"] = (x, 0.4 * x + rng.normal(0, 1, 30))
    # Small, no ties.
    out["tiny"] = (np.array([1.2, 3.4, 2.2, 5.9, 4.1]), np.array([2.0, 2.9, 3.5, 6.1, 3.3]))
    # Monotone but not linear: Spearman and Kendall are 1, Pearson is not.
    x = np.sort(rng.uniform(0, 3, 12))
    out["monotone"] = (x, x ** 3)
    return out


def jackknife_se(x, y):
    n = len(x)
    taus = np.array([stats.kendalltau(np.delete(x, i), np.delete(y, i), variant="b", method="asymptotic").statistic for i in range(n)])
    return math.sqrt((n - 1) / n * np.sum((taus - taus.mean()) ** 2))


def tail(x, y):
    n = len(x)
    k = int(math.floor(math.sqrt(n)))
    u = stats.rankdata(x) / (n + 1)
    v = stats.rankdata(y) / (n + 1)
    upper = np.sum((u > 1 - k / n) & (v > 1 - k / n)) / k
    lower = np.sum((u <= k / n) & (v <= k / n)) / k
    return {"k": k, "threshold": 1 - k / n, "lower": float(lower), "upper": float(upper)}


def main():
    ref = {"scipy": scipy.__version__, "numpy": np.__version__, "datasets": {}}
    for name, (x, y) in datasets().items():
        with open(f"{name}.csv", "w") as f:
            f.write("x,y\n")
            for a, b in zip(x, y):
                f.write(f"{float(a)!r},{float(b)!r}\n")
        p = stats.pearsonr(x, y)
        ci = p.confidence_interval(0.95)
        s = stats.spearmanr(x, y)
        k = stats.kendalltau(x, y, variant="b", method="asymptotic")
        k_auto = stats.kendalltau(x, y, variant="b")
        entry = {
            "n": len(x),
            "pearson": {"estimate": float(p.statistic), "pValue": float(p.pvalue), "ci95": [float(ci.low), float(ci.high)]},
            "spearman": {"estimate": float(s.statistic), "pValue": float(s.pvalue)},
            "kendall": {"estimate": float(k.statistic), "pValue": float(k.pvalue), "pValueAuto": float(k_auto.pvalue)},
            "tail": tail(x, y),
        }
        if len(x) <= 100:
            entry["kendallJackknifeSe"] = jackknife_se(x, y)
        ref["datasets"][name] = entry
    with open("reference.json", "w") as f:
        json.dump(ref, f, indent=1)


if __name__ == "__main__":
    main()
