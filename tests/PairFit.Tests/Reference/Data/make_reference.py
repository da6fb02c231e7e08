#!/usr/bin/python3
"""Reference values for PairFit's CSV intake and `describe`.

Run from this folder with Debian's Python (it has SciPy; the pyenv `python3` on PATH does not):

    /usr/bin/python3 make_reference.py

Written against SciPy 1.10.1 and NumPy from Debian 12. It writes intake_sample.csv, a synthetic
file (fixed seed) with an id, two skewed measurement columns holding empty cells, NA, null,
the sentinel -9999 and a few non-numeric entries, a text column with quoted commas and a date
column; and reference.json with what a reader that follows PairFit's rules must find. The rules
are re-implemented here independently in a few lines of plain Python:
  * missing = empty, NA, NaN, null (any case) or the sentinel -9999 (as a number);
  * otherwise a cell that float() accepts is a number, anything else is non-numeric;
  * a row is used when both selected cells are numbers.
Per numeric column: count of numbers, min, median (numpy.median), max and the adjusted
skewness scipy.stats.skew(bias=False). For the pair (rain_mm, runoff_mm): rows read, rows used,
drop counts by reason, and sums of the used values.
"""
import csv
import json

import numpy as np
import scipy
from scipy import stats

MISSING = {"", "na", "nan", "null"}
SENTINEL = -9999.0


def kind(cell):
    c = cell.strip()
    if c.lower() in MISSING:
        return "missing", None
    try:
        v = float(c)
    except ValueError:
        return "non-numeric", None
    if v == SENTINEL:
        return "missing", None
    return "number", v


def make_rows():
    rng = np.random.default_rng(7)
    n = 300
    z = rng.normal(size=n)
    rain = np.exp(2.5 + 0.8 * z)
    runoff = np.exp(1.0 + 0.6 * (0.8 * z + 0.6 * rng.normal(size=n)))
    rows = []
    for i in range(n):
        r = f"{rain[i]:.3f}"
        q = f"{runoff[i]:.4f}"
        if i % 37 == 5: r = ""
        if i % 41 == 7: q = "NA"
        if i % 53 == 11: r = "-9999"
        if i % 59 == 13: q = "null"
        if i % 61 == 17: q = "gauge fault"
        if i % 67 == 19: r = "n/a?"
        if i % 71 == 23: r, q = "", ""
        label = f'"site {i % 4}, block {i % 3}"' if i % 5 == 0 else f"plot{i % 9}"
        date = f"2031-{1 + i % 12:02d}-{1 + i % 28:02d}"
        rows.append([str(i + 1), r, q, label, date])
    return rows


def main():
    rows = make_rows()
    with open("intake_sample.csv", "w") as f:
        f.write("id,rain_mm,runoff_mm,label,date\n")
        for r in rows:
            f.write(",".join(r) + "\n")
    # Read back with Python's csv module to get the cells as a CSV reader sees them.
    with open("intake_sample.csv") as f:
        table = list(csv.reader(f))
    header, data = table[0], table[1:]
    ref = {"scipy": scipy.__version__, "numpy": np.__version__, "rows": len(data), "columns": {}}
    for c, name in enumerate(header):
        kinds = [kind(r[c]) for r in data]
        nums = np.array([v for k, v in kinds if k == "number"])
        entry = {"missing": sum(k == "missing" for k, _ in kinds), "numeric": int(len(nums))}
        if len(nums):
            entry.update(min=float(nums.min()), median=float(np.median(nums)), max=float(nums.max()),
                         skewness=float(stats.skew(nums, bias=False)))
        ref["columns"][name] = entry
    xi, yi = header.index("rain_mm"), header.index("runoff_mm")
    dropped, used_x, used_y = {}, [], []
    for r in data:
        (kx, vx), (ky, vy) = kind(r[xi]), kind(r[yi])
        if kx == "number" and ky == "number":
            used_x.append(vx); used_y.append(vy)
            continue
        if kx == "number": reason = f"{ky} y"
        elif ky == "number": reason = f"{kx} x"
        elif kx == ky: reason = f"{kx} x and y"
        else: reason = f"{kx} x, {ky} y"
        dropped[reason] = dropped.get(reason, 0) + 1
    ref["pair"] = {"x": "rain_mm", "y": "runoff_mm", "rowsUsed": len(used_x), "dropped": dropped,
                   "sumX": float(np.sum(used_x)), "sumY": float(np.sum(used_y))}
    with open("reference.json", "w") as f:
        json.dump(ref, f, indent=1)


if __name__ == "__main__":
    main()
