"""Reference values for Fisher's exact test, Kaplan-Meier and the log-rank test
(tests/stats/fisherExact.test.ts, kaplanMeier.test.ts, logRank.test.ts).

Run with Debian's python3 (python3-scipy 1.10.1, python3-numpy 1.24.2, python3-statsmodels 0.13.5):
    /usr/bin/python3 tests/reference/survival_reference.py
It rewrites tests/reference/survival-cases.json. Inputs are drawn with numpy default_rng(20251203),
so a rerun with the same packages writes the same file.

- fisher: scipy.stats.fisher_exact (scipy 1.10.1), three alternatives, on hand-picked tables (zeros,
  empty margins, all-failed arms, symmetric ties, large counts) and random ones.
- kaplanMeier: statsmodels.duration.survfunc.SurvfuncRight (statsmodels 0.13.5): surv_times,
  surv_prob and quantile(0.5). statsmodels' quantile uses a strict inequality (first time with
  S(t) < 0.5); the file records it as `medianStrict` and the test says where it differs from
  seedsift's median (first time with S(t) <= 0.5).
- logRank: statsmodels.duration.survfunc.survdiff (Mantel-Cox, no weights): chi-square and p.
  Observed event counts are counted here with numpy.
"""
import json
import os

import numpy as np
import scipy
import statsmodels
from scipy import stats
from statsmodels.duration.survfunc import SurvfuncRight, survdiff

HERE = os.path.dirname(os.path.abspath(__file__))
rng = np.random.default_rng(20251203)

# Freireich et al. (1963) 6-MP remission data as tabulated by Gehan (1965), Biometrika 52:203-223
# (METHODS.md "Check values"); censored = 0.
MP6_TIMES = [6, 6, 6, 6, 7, 9, 10, 10, 11, 13, 16, 17, 19, 20, 22, 23, 25, 32, 32, 34, 35]
MP6_EVENTS = [1, 1, 1, 0, 1, 0, 1, 0, 0, 1, 1, 0, 0, 0, 1, 1, 0, 0, 0, 0, 0]
PLACEBO_TIMES = [1, 1, 2, 2, 3, 4, 4, 5, 5, 8, 8, 8, 8, 11, 11, 12, 12, 15, 17, 22, 23]
PLACEBO_EVENTS = [1] * 21


def fisher_case(table, label):
    a, b, c, d = table
    out = {"label": label, "table": [int(v) for v in table]}
    for alt in ("two-sided", "less", "greater"):
        r = stats.fisher_exact([[a, b], [c, d]], alternative=alt)
        key = {"two-sided": "twoSided", "less": "less", "greater": "greater"}[alt]
        out[key] = float(r.pvalue)
        out["oddsRatio"] = None if np.isnan(r.statistic) else (
            "Infinity" if np.isinf(r.statistic) else float(r.statistic))
    return out


def fisher_cases():
    fixed = [
        ([3, 1, 1, 3], "Fisher's tea-tasting table"),
        ([0, 5, 5, 0], "zeros on the diagonal"),
        ([5, 0, 0, 5], "zeros off the diagonal"),
        ([0, 0, 3, 4], "empty first row"),
        ([2, 0, 3, 0], "empty second column"),
        ([0, 5, 0, 5], "no failures in either arm (empty first column)"),
        ([5, 0, 5, 0], "every run failed in both arms"),
        ([5, 0, 0, 5], "every run of one arm failed, none of the other"),
        ([4, 1, 0, 5], "all but one failed in one arm"),
        ([0, 10, 3, 7], "no failures in one arm"),
        ([1, 9, 1, 9], "equal arms"),
        ([2, 3, 3, 2], "symmetric table (tied probabilities)"),
        ([7, 13, 13, 7], "symmetric table, larger"),
        ([500, 500, 500, 500], "large, at the mode"),
        ([520, 480, 480, 520], "large, symmetric"),
        ([1000, 1, 2, 1000], "large, p underflows toward 0"),
        ([1200, 800, 1000, 1000], "large counts"),
        ([37, 2963, 12, 2988], "rare events, large arms"),
        ([0, 1, 1, 0], "smallest non-trivial table"),
        ([1, 0, 0, 0], "a single run"),
    ]
    out = [fisher_case(t, label) for t, label in fixed]
    for i in range(40):
        n1 = int(rng.integers(1, 31))
        n2 = int(rng.integers(1, 31))
        p1 = rng.uniform(0, 0.6)
        p2 = rng.uniform(0, 0.6)
        a = int(rng.binomial(n1, p1))
        c = int(rng.binomial(n2, p2))
        out.append(fisher_case([a, n1 - a, c, n2 - c], f"random {i}: {n1} v {n2} runs"))
    return out


def km_case(times, events, label):
    sf = SurvfuncRight(np.asarray(times, float), np.asarray(events, float))
    median = sf.quantile(0.5)
    return {
        "label": label,
        "times": [float(t) for t in times],
        "events": [bool(e) for e in events],
        "survTimes": [float(t) for t in sf.surv_times],
        "survProb": [float(p) for p in sf.surv_prob],
        "medianStrict": None if np.isnan(median) else float(median),
    }


def censored_sample(n, kind):
    """Integer steps to reach a value, censored at a run's last step (ties on purpose)."""
    if kind == "exponential":
        reach = np.ceil(rng.exponential(rng.uniform(5, 40), n))
    else:
        reach = np.ceil(rng.weibull(rng.uniform(0.7, 3), n) * rng.uniform(5, 40))
    end = np.ceil(rng.uniform(10, 60, n))
    if rng.uniform() < 0.2:
        end = np.full(n, float(np.ceil(rng.uniform(10, 60))))  # every run logged to the same step
    times = np.minimum(reach, end)
    events = (reach <= end).astype(int)
    return [float(t) for t in times], [int(e) for e in events]


def km_cases():
    out = [
        km_case(MP6_TIMES, MP6_EVENTS, "Gehan 6-MP arm"),
        km_case(PLACEBO_TIMES, PLACEBO_EVENTS, "Gehan placebo arm"),
        km_case([1, 2, 3, 4], [1, 1, 1, 1], "four events, survival hits 0.5 exactly at 2"),
        km_case([5, 5, 5], [0, 0, 0], "all censored"),
    ]
    for i in range(12):
        n = int(rng.integers(2, 31))
        t, e = censored_sample(n, "exponential" if i % 2 else "weibull")
        out.append(km_case(t, e, f"random {i}: {n} runs"))
    return out


def logrank_case(ta, ea, tb, eb, label):
    time = np.asarray(ta + tb, float)
    status = np.asarray(ea + eb, float)
    group = np.asarray([0] * len(ta) + [1] * len(tb))
    try:
        chisq, p = survdiff(time, status, group)
    except np.linalg.LinAlgError:
        chisq, p = None, None  # zero variance: statsmodels cannot invert it (seedsift: statistic 0, p 1)
    return {
        "label": label,
        "a": {"times": ta, "events": [bool(e) for e in ea]},
        "b": {"times": tb, "events": [bool(e) for e in eb]},
        "statistic": None if chisq is None else float(chisq),
        "p": None if p is None else float(p),
        "observed": [int(sum(ea)), int(sum(eb))],
    }


def logrank_cases():
    out = [logrank_case(MP6_TIMES, MP6_EVENTS, PLACEBO_TIMES, PLACEBO_EVENTS, "Gehan 6-MP vs placebo")]
    i = 0
    while len(out) < 41:
        n1 = int(rng.integers(2, 31))
        n2 = int(rng.integers(2, 31))
        ta, ea = censored_sample(n1, "exponential" if i % 2 else "weibull")
        tb, eb = censored_sample(n2, "weibull" if i % 3 else "exponential")
        if i % 7 == 0:
            eb = [0] * n2  # one arm never reaches
        i += 1
        if sum(ea) + sum(eb) == 0:
            continue
        out.append(logrank_case(ta, ea, tb, eb, f"random {i}: {n1} v {n2} runs"))
    return out


def main():
    fixture = {
        "source": "tests/reference/survival_reference.py: scipy.stats.fisher_exact; statsmodels.duration.survfunc "
        "SurvfuncRight and survdiff, through Debian's /usr/bin/python3",
        "scipyVersion": scipy.__version__,
        "numpyVersion": np.__version__,
        "statsmodelsVersion": statsmodels.__version__,
        "seed": 20251203,
        "fisher": fisher_cases(),
        "kaplanMeier": km_cases(),
        "logRank": logrank_cases(),
    }
    with open(os.path.join(HERE, "survival-cases.json"), "w") as f:
        json.dump(fixture, f, indent=1)
        f.write("\n")


if __name__ == "__main__":
    main()
