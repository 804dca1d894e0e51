"""Answer tests/stats/scipyLive.test.ts: read cases as JSON on stdin, write scipy's results as JSON on stdout.

Run by the test with Debian's /usr/bin/python3 (python3-scipy). Input: {"cases": [...]}, each case one of
  {"fn": "welch", "x": [...], "y": [...]}          -> t, df, p for the three alternatives (ttest_ind, equal_var=False)
  {"fn": "pairedT", "x": [...], "y": [...]}        -> t, df, p for the three alternatives (ttest_rel)
  {"fn": "mannWhitney", "x": [...], "y": [...]}    -> U of x, asymptotic p with and without continuity correction
  {"fn": "nctCdf", "t": t, "df": df, "ncp": ncp}   -> nct.cdf
Output: {"scipy": version, "results": [...]} in the same order.
"""
import json
import sys
import warnings

import scipy
from scipy import stats

ALTERNATIVES = ("two-sided", "greater", "less")
warnings.simplefilter("ignore")


def answer(case):
    fn = case["fn"]
    if fn == "welch":
        runs = {a: stats.ttest_ind(case["x"], case["y"], equal_var=False, alternative=a) for a in ALTERNATIVES}
        x, y = case["x"], case["y"]
        vx = stats.tvar(x) / len(x)
        vy = stats.tvar(y) / len(y)
        df = (vx + vy) ** 2 / (vx**2 / (len(x) - 1) + vy**2 / (len(y) - 1))
        return {"statistic": float(runs["two-sided"].statistic), "df": float(df), "p": {a: float(r.pvalue) for a, r in runs.items()}}
    if fn == "pairedT":
        runs = {a: stats.ttest_rel(case["x"], case["y"], alternative=a) for a in ALTERNATIVES}
        r = runs["two-sided"]
        return {"statistic": float(r.statistic), "df": float(r.df), "p": {a: float(r.pvalue) for a, r in runs.items()}}
    if fn == "mannWhitney":
        x, y = case["x"], case["y"]
        return {
            "u": float(stats.mannwhitneyu(x, y, method="asymptotic").statistic),
            "asymptotic": {a: float(stats.mannwhitneyu(x, y, alternative=a, method="asymptotic").pvalue) for a in ALTERNATIVES},
            "asymptoticNoContinuity": {
                a: float(stats.mannwhitneyu(x, y, alternative=a, method="asymptotic", use_continuity=False).pvalue) for a in ALTERNATIVES
            },
        }
    if fn == "nctCdf":
        return {"cdf": float(stats.nct.cdf(case["t"], case["df"], case["ncp"]))}
    raise ValueError(f"unknown fn {fn}")


def main():
    request = json.load(sys.stdin)
    json.dump({"scipy": scipy.__version__, "results": [answer(c) for c in request["cases"]]}, sys.stdout, allow_nan=False)


if __name__ == "__main__":
    main()
