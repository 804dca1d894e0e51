"""Write tests/reference/scipy-cases.json: random inputs and what scipy says about them.

Run with Debian's python (python3-scipy 1.10.1, the version METHODS.md's check values came from):

    /usr/bin/python3 tests/reference/scipy_reference.py

The numpy generator is seeded (SEED below), so a rerun with the same scipy and numpy writes the same
file. tests/stats/scipyFixture.test.ts checks every case against src/stats/. What each section
records, and which sections are library checks and which are formula checks, is in README.md here.
"""
import itertools
import json
import math
import os
import sys
import warnings

import mpmath  # Debian python3-mpmath: 40-digit reference for t quantiles
import numpy as np
import scipy
from scipy import optimize, special, stats

try:  # Debian python3-statsmodels: a library implementation of Holm and Benjamini-Hochberg.
    import statsmodels
    from statsmodels.stats.multitest import multipletests
except ImportError:  # pragma: no cover - the adjustments then come from the formulas only
    statsmodels = None

SEED = 20240611
CASES = 60  # random cases per function (the brief asks for at least 50)
MAX_SPLITS = 200_000  # largest C(n1 + n2, n1) enumerated (src/stats defaults: maxExact, Mann-Whitney auto)
ALTERNATIVES = ("two-sided", "greater", "less")
OUT = os.path.join(os.path.dirname(os.path.abspath(__file__)), "scipy-cases.json")

rng = np.random.default_rng(SEED)
mpmath.mp.dps = 40
warnings.simplefilter("ignore")  # scipy warns "sample size too small for normal approximation"; we know


def floats(a):
    return [float(v) for v in a]


# ---------------------------------------------------------------------------------------------
# Random samples. Values are rounded to 3 decimals (integers for the tie kinds), so that the exact
# permutation counts below can be done in integer arithmetic on round(1000 v).


def sample(kind, n, shift=0.0, scale=1.0):
    if kind == "normal":
        v = rng.normal(50 + shift, 2 * scale, n)
    elif kind == "skewed":  # lognormal(0, 1) times 5: strongly right-skewed
        v = 5 * scale * rng.lognormal(0.0, 1.0, n) + shift
    elif kind == "ties":  # integers from a range of 4 to 7 values: many ties
        v = rng.integers(0, int(rng.integers(4, 8)), n) + round(shift)
        return v.astype(float)
    else:
        raise ValueError(kind)
    return np.round(v, 3)


def sizes(i, lo=2, hi=30):
    """Equal sizes for even i, unequal for odd i; both in [lo, hi]."""
    n1 = int(rng.integers(lo, hi + 1))
    if i % 2 == 0:
        return n1, n1
    n2 = int(rng.integers(lo, hi + 1))
    while n2 == n1:
        n2 = int(rng.integers(lo, hi + 1))
    return n1, n2


KINDS = ("normal", "normal-unequal-variance", "skewed", "ties")


def two_groups(i, lo=2, hi=30, max_splits=None, kind=None):
    """(kind, x, y) for case i, cycling through KINDS; a shift in a third of the cases gives small p."""
    kind = kind or KINDS[i % len(KINDS)]
    while True:
        n1, n2 = sizes(i // len(KINDS), lo, hi)
        if max_splits is None or math.comb(n1 + n2, n1) <= max_splits:
            break
    shift = [0.0, 1.0, 4.0][i % 3]
    base = "normal" if kind.startswith("normal") else kind
    x = sample(base, n1, shift=shift)
    y = sample(base, n2, scale=(4.0 if kind == "normal-unequal-variance" else 1.0))
    if np.var(x) + np.var(y) == 0:  # both groups constant: no test is defined; draw again
        return two_groups(i, lo, hi, max_splits, kind)
    return kind, x, y


def has_ties(*groups):
    pooled = np.concatenate(groups)
    return len(np.unique(pooled)) < len(pooled)


# ---------------------------------------------------------------------------------------------
# Welch t-test. scipy 1.10's ttest_ind has no confidence_interval() (added in scipy 1.11), so the
# interval is computed here from scipy's t.ppf with the same se and Welch-Satterthwaite df (as
# ttest_rel's confidence_interval() does). Those endpoints inherit t.ppf's error (a few 1e-9 of
# the half-width; see the distributions section).


def welch_section():
    out = []
    for i in range(CASES):
        kind, x, y = two_groups(i)
        vx, vy = np.var(x, ddof=1) / len(x), np.var(y, ddof=1) / len(y)
        se = math.sqrt(vx + vy)
        df = (vx + vy) ** 2 / (vx**2 / (len(x) - 1) + vy**2 / (len(y) - 1))
        diff = float(np.mean(x) - np.mean(y))
        p = {}
        t = None
        for alt in ALTERNATIVES:
            r = stats.ttest_ind(x, y, equal_var=False, alternative=alt)
            p[alt] = float(r.pvalue)
            t = float(r.statistic)
        half = float(stats.t.ppf(0.975, df)) * se
        one = float(stats.t.ppf(0.95, df)) * se
        out.append({
            "kind": kind, "x": floats(x), "y": floats(y), "statistic": t, "df": float(df), "p": p,
            "interval95": {"low": diff - half, "high": diff + half},
            "greater95Low": diff - one, "less95High": diff + one,
        })
    return out


def paired_section():
    out = []
    for i in range(CASES):
        kind = ("normal", "skewed", "ties", "correlated")[i % 4]
        n = int(rng.integers(2, 31))
        shift = [0.0, 0.5, 2.0][i % 3]
        while True:
            if kind == "correlated":  # the same seeds in both arms: y = x + small noise
                x = np.round(rng.normal(50, 3, n), 3)
                y = np.round(x - shift + rng.normal(0, 0.5, n), 3)
            else:
                x, y = sample(kind, n, shift=shift), sample(kind, n)
            if np.var(x - y) > 0:
                break
        p = {}
        for alt in ALTERNATIVES:
            p[alt] = float(stats.ttest_rel(x, y, alternative=alt).pvalue)
        r = stats.ttest_rel(x, y)
        ci = r.confidence_interval(0.95)  # scipy 1.10 has this for ttest_rel
        g = stats.ttest_rel(x, y, alternative="greater").confidence_interval(0.95)
        l = stats.ttest_rel(x, y, alternative="less").confidence_interval(0.95)
        out.append({
            "kind": kind, "x": floats(x), "y": floats(y), "statistic": float(r.statistic), "df": float(r.df), "p": p,
            "interval95": {"low": float(ci.low), "high": float(ci.high)},
            "greater95Low": float(g.low), "less95High": float(l.high),
        })
    return out


# ---------------------------------------------------------------------------------------------
# Mann-Whitney U. Without ties: scipy's exact distribution (method='exact'). With ties scipy 1.10
# has no exact test (its 'exact' ignores ties), so the exact conditional p-value comes from
# scipy.stats.permutation_test over all C(N, n1) splits (n_resamples=inf) of the pooled mid-ranks
# with statistic U = rank sum of x - n1(n1 + 1)/2; scipy's two-sided p there is 2 min(one-sided),
# capped at 1, the same convention as mannwhitneyu's. Asymptotic p with and without continuity
# correction for every case.


def u_statistic(rx, ry, axis=-1):
    return np.sum(rx, axis=axis) - rx.shape[axis] * (rx.shape[axis] + 1) / 2


def mann_whitney_section():
    out = []
    for i in range(CASES + 30):
        if i < CASES:
            kind, x, y = two_groups(i)
        elif i < CASES + 10:  # 31-80 per group: with ties, auto uses the normal approximation
            kind, x, y = two_groups(i, 31, 80)
        else:  # 20 more tie cases small enough for the exact conditional distribution
            kind, x, y = two_groups(i, max_splits=MAX_SPLITS, kind="ties")
        ties = has_ties(x, y)
        splits = math.comb(len(x) + len(y), len(x))
        case = {"kind": kind, "x": floats(x), "y": floats(y), "ties": bool(ties), "splits": splits}
        case["u"] = float(stats.mannwhitneyu(x, y, method="asymptotic").statistic)
        case["asymptotic"] = {a: float(stats.mannwhitneyu(x, y, alternative=a, method="asymptotic").pvalue) for a in ALTERNATIVES}
        case["asymptoticNoContinuity"] = {
            a: float(stats.mannwhitneyu(x, y, alternative=a, method="asymptotic", use_continuity=False).pvalue) for a in ALTERNATIVES
        }
        if not ties and max(len(x), len(y)) <= 50:  # seedsift's auto uses the exact distribution up to 50 per group
            case["exact"] = {a: float(stats.mannwhitneyu(x, y, alternative=a, method="exact").pvalue) for a in ALTERNATIVES}
        if ties and splits <= MAX_SPLITS:
            ranks = stats.rankdata(np.concatenate([x, y]))
            rx, ry = ranks[: len(x)], ranks[len(x):]
            case["exactConditional"] = {
                a: float(stats.permutation_test((rx, ry), u_statistic, permutation_type="independent", vectorized=True,
                                                n_resamples=np.inf, alternative=a, batch=20_000).pvalue)
                for a in ALTERNATIVES
            }
        out.append(case)
    return out


# ---------------------------------------------------------------------------------------------
# Wilcoxon signed-rank (paired). scipy 1.10's wilcoxon(method='auto') is exact up to 50 pairs even
# when |differences| are tied (it then ignores the ties), and falls back to the normal
# approximation only for zeros. src/stats uses the tie-corrected normal approximation when there
# are ties, so tie cases are recorded with method='approx' explicitly (zero_method='wilcox',
# correction=False: scipy's defaults, which src/stats follows).


def wilcoxon_section():
    out = []
    for i in range(CASES + 6):
        kind = ("continuous", "zeros", "ties")[i % 3]
        n = int(rng.integers(51, 70)) if i >= CASES else int(rng.integers(2, 31))  # 6 large cases: approx without ties
        while True:
            if kind == "continuous":
                x = np.round(rng.normal(10, 2, n), 3)
                y = np.round(x - [0.0, 0.4, 1.5][(i // 3) % 3] + rng.normal(0, 1, n), 3)
            elif kind == "zeros":
                x = np.round(rng.normal(10, 2, n), 3)
                y = np.round(x + rng.normal(0.3 * (i % 2), 1, n), 3)
                zero = rng.random(n) < 0.25
                y[zero] = x[zero]
            else:
                x = rng.integers(0, 6, n).astype(float)
                y = rng.integers(0, 6, n).astype(float) - (i % 2)
            d = x - y
            nz = d[d != 0]
            if len(nz) >= 1 and (kind != "zeros" or len(nz) < n):
                break
        tied = len(np.unique(np.abs(nz))) < len(nz)
        zeros = int(np.sum(d == 0))
        method = "exact" if (zeros == 0 and not tied and len(nz) <= 50) else "approx"
        p = {a: float(stats.wilcoxon(x, y, alternative=a, method=method).pvalue) for a in ALTERNATIVES}
        r_plus = float(stats.wilcoxon(x, y, alternative="greater", method=method).statistic)
        out.append({"kind": kind, "x": floats(x), "y": floats(y), "method": method, "pairs": int(len(nz)),
                    "zeros": zeros, "ties": bool(tied), "rPlus": r_plus, "p": p})
    return out


# ---------------------------------------------------------------------------------------------
# Permutation test on the difference of means, all C(N, n1) splits. Two sources per case:
# - scipy.stats.permutation_test(permutation_type='independent', n_resamples=inf) with statistic
#   mean(x) - mean(y): its one-sided p-values, and its two-sided p, which in scipy is
#   2 min(p_greater, p_less) (capped at 1), NOT src/stats' convention;
# - an exact count in integer arithmetic (itertools over every split; values are round(1000 v)):
#   #(T* >= T), #(T* <= T) and #(|T*| >= |T|), the last being src/stats' two-sided convention.
# The script checks that scipy's one-sided p-values equal the integer counts / C(N, n1).


def exact_counts(x, y):
    ix = [int(round(1000 * v)) for v in x]
    iy = [int(round(1000 * v)) for v in y]
    assert all(abs(1000 * v - k) < 1e-6 for v, k in zip(list(x) + list(y), ix + iy)), "values must have 3 decimals"
    pooled = np.array(ix + iy, dtype=np.int64)
    n1, big_n, total = len(ix), len(pooled), int(sum(ix) + sum(iy))
    observed = big_n * sum(ix) - n1 * total  # proportional to mean(x) - mean(y), times n1 n2
    greater = less = both = 0
    for chunk in chunked(itertools.combinations(range(big_n), n1), 50_000):
        s = pooled[np.array(chunk)].sum(axis=1)
        dstar = big_n * s - n1 * total
        greater += int(np.sum(dstar >= observed))
        less += int(np.sum(dstar <= observed))
        both += int(np.sum(np.abs(dstar) >= abs(observed)))
    return {"greater": greater, "less": less, "absAtLeast": both}


def chunked(iterable, size):
    it = iter(iterable)
    while True:
        block = list(itertools.islice(it, size))
        if not block:
            return
        yield block


def mean_difference(x, y, axis=-1):
    return np.mean(x, axis=axis) - np.mean(y, axis=axis)


def permutation_section():
    out = []
    for i in range(CASES):
        kind, x, y = two_groups(i, max_splits=MAX_SPLITS)
        splits = math.comb(len(x) + len(y), len(x))
        scipy_p = {
            a: float(stats.permutation_test((x, y), mean_difference, permutation_type="independent", vectorized=True,
                                            n_resamples=np.inf, alternative=a, batch=20_000).pvalue)
            for a in ALTERNATIVES
        }
        counts = exact_counts(x, y)
        agree = (round(scipy_p["greater"] * splits) == counts["greater"] and round(scipy_p["less"] * splits) == counts["less"])
        if not agree:
            print(f"permutation case {i}: scipy's one-sided p differ from the exact counts {counts}", file=sys.stderr)
        out.append({"kind": kind, "x": floats(x), "y": floats(y), "splits": splits, "scipy": scipy_p,
                    "exactCounts": counts, "scipyAgreesWithCounts": bool(agree)})
    return out


# ---------------------------------------------------------------------------------------------
# Holm and Benjamini-Hochberg. scipy 1.10 has neither (false_discovery_control arrived in 1.11).
# Library source when installed: statsmodels' multipletests (Debian python3-statsmodels), methods
# 'holm' and 'fdr_bh'. The published step-down / step-up definitions (Holm 1979; Benjamini &
# Hochberg 1995; written as R's p.adjust does, from memory) are computed here too, and the script
# stops if the two disagree.


def holm_formula(p):
    p = np.asarray(p, dtype=float)
    m = len(p)
    order = np.argsort(p, kind="stable")
    adj = np.minimum(1.0, np.maximum.accumulate((m - np.arange(m)) * p[order]))
    out = np.empty(m)
    out[order] = adj
    return out


def bh_formula(p):
    p = np.asarray(p, dtype=float)
    m = len(p)
    order = np.argsort(p, kind="stable")[::-1]
    adj = np.minimum(1.0, np.minimum.accumulate(m / np.arange(m, 0, -1) * p[order]))
    out = np.empty(m)
    out[order] = adj
    return out


def adjustment_section():
    holm, bh = [], []
    for i in range(CASES):
        m = int(rng.integers(1, 21))
        p = rng.beta(0.4, 1.0, m)  # many small p-values, some near 1
        if i % 3 == 1 and m > 2:  # ties
            p[1] = p[0]
            p[m - 1] = p[0]
        if i % 5 == 2:
            p = np.round(p, 2)
        p = np.clip(p, 0.0, 1.0)
        h, b = holm_formula(p), bh_formula(p)
        if statsmodels is not None:
            hs = multipletests(p, method="holm")[1]
            bs = multipletests(p, method="fdr_bh")[1]
            assert np.allclose(h, hs, rtol=1e-14, atol=0), (p, h, hs)
            assert np.allclose(b, bs, rtol=1e-14, atol=0), (p, b, bs)
            h, b = hs, bs
        holm.append({"p": floats(p), "adjusted": floats(h)})
        bh.append({"p": floats(p), "adjusted": floats(b)})
    source = (f"statsmodels {statsmodels.__version__} multipletests (Debian python3-statsmodels), equal to the formula"
              if statsmodels is not None else "formula check: the published definitions, computed in this script")
    return {"source": source, "holm": holm, "benjaminiHochberg": bh}


# ---------------------------------------------------------------------------------------------
# Distributions: Student t quantiles, the noncentral t CDF (scipy.stats.nct, Boost's implementation
# in scipy 1.10), power, and the noncentral-t interval for Cohen's d.
#
# scipy 1.10.1's t.ppf (cdflib's stdtrit) is accurate to only a few 1e-9 relative (3.7e-9 at
# p = 0.9, df = 27). Each quantile case therefore records three values: t.ppf; scipy's Boost
# noncentral t quantile nct.ppf(p, df, 0), which is the central t quantile to about 1e-14; and a
# 40-digit mpmath root of the t CDF. Power uses the Boost critical value, so that its check is not
# limited by t.ppf.


def t_cdf_mp(t, df):
    """Student t CDF at 40 digits: I_x(df/2, 1/2)/2 with x = df/(df + t^2) (common practice; mpmath)."""
    tail = mpmath.betainc(df / 2, mpmath.mpf(1) / 2, 0, df / (df + t * t), regularized=True) / 2
    return 1 - tail if t > 0 else tail


def t_quantile_mp(p, df):
    """Student t quantile at 40 digits: Newton's method on t_cdf_mp from scipy's t.ppf."""
    p, df = mpmath.mpf(p), mpmath.mpf(df)
    t = mpmath.mpf(float(stats.t.ppf(float(p), float(df))))
    density = lambda u: mpmath.gamma((df + 1) / 2) / (mpmath.sqrt(df * mpmath.pi) * mpmath.gamma(df / 2)) * (1 + u * u / df) ** (-(df + 1) / 2)
    for _ in range(100):
        step = (t_cdf_mp(t, df) - p) / density(t)
        t -= step
        if abs(step) <= abs(t) * mpmath.mpf(10) ** -28:  # 40-digit arithmetic; 25 digits are kept
            return t
    raise ArithmeticError(f"t quantile did not converge at p {p}, df {df}")


def t_quantile_boost(p, df):
    """scipy 1.10.1's Boost noncentral t quantile at ncp 0: the central t quantile, to about 1e-14."""
    return float(stats.nct.ppf(p, df, 0))


def t_quantile_section():
    out = []
    fixed_p = [0.9, 0.95, 0.975, 0.99, 0.995, 0.9995, 0.025, 0.5]
    for i in range(CASES + 20):
        p = fixed_p[i % len(fixed_p)] if i % 2 == 0 else float(rng.uniform(0.001, 0.999))
        if i % 10 == 9:
            p = float(10 ** rng.uniform(-8, -4))
        choice = i % 4
        df = (float(rng.integers(1, 31)) if choice == 0 else float(rng.uniform(1.0, 60.0)) if choice == 1
              else float(rng.uniform(60.0, 2000.0)) if choice == 2 else float(rng.uniform(0.5, 3.0)))
        exact = t_quantile_mp(p, df)
        out.append({"p": p, "df": df, "tPpf": float(stats.t.ppf(p, df)), "nctPpf": t_quantile_boost(p, df), "mpmath": mpmath.nstr(exact, 25)})
    worst = max(abs(c["tPpf"] / float(c["mpmath"]) - 1) for c in out)
    print(f"scipy {scipy.__version__} t.ppf: largest relative error against mpmath {worst:.2g}")
    return out


def nct_cdf_mp(t, df, ncp):
    """Noncentral t CDF at 40 digits: P(T <= t) = E[Phi(t sqrt(V/df) - ncp)], V ~ chi-square(df)
    (T = (Z + ncp) / sqrt(V/df); any textbook), integrated by mpmath.quad with breakpoints around the
    chi-square mean. Independent of scipy and of the series that src/stats and Boost sum."""
    t, df, ncp = mpmath.mpf(t), mpmath.mpf(df), mpmath.mpf(ncp)
    k = df / 2
    log_c = -k * mpmath.log(2) - mpmath.loggamma(k)
    density = lambda v: mpmath.ncdf(t * mpmath.sqrt(v / df) - ncp) * mpmath.exp(log_c + (k - 1) * mpmath.log(v) - v / 2)
    sd = mpmath.sqrt(2 * df)
    points = sorted({mpmath.mpf(0)} | {max(mpmath.mpf(0), df + j * sd) for j in (-6, -3, -1, 0, 1, 3, 6, 12)} | {mpmath.inf})
    return mpmath.quad(density, points)


def nct_section():
    out = []
    for i in range(2 * CASES):
        df = float(rng.integers(1, 60)) if i % 2 else float(rng.uniform(1.0, 100.0))
        ncp = float(rng.uniform(-6, 10))
        if i % 15 == 14:
            ncp = float(rng.uniform(20, 38))  # large ncp: Poisson weights far from j = 0
        t = float(ncp + rng.normal(0, 2.5))
        if i % 7 == 3:
            t = -t
        out.append({"t": t, "df": df, "ncp": ncp, "cdf": float(stats.nct.cdf(t, df, ncp)), "mpmath": mpmath.nstr(nct_cdf_mp(t, df, ncp), 25)})
    worst = max(abs(c["cdf"] - float(c["mpmath"])) for c in out)
    print(f"scipy {scipy.__version__} nct.cdf: largest absolute error against the mpmath integral {worst:.2g}")
    return out


def two_sample_power(d, n1, n2, alpha):
    df = n1 + n2 - 2
    ncp = d * math.sqrt(n1 * n2 / (n1 + n2))
    tc = t_quantile_boost(1 - alpha / 2, df)  # not t.ppf: see t_quantile_section and README.md
    return float(stats.nct.sf(tc, df, ncp) + stats.nct.cdf(-tc, df, ncp))


def power_section():
    power = []
    for i in range(CASES):
        d = float(rng.uniform(-1.0, 3.0))
        n1, n2 = sizes(i)
        alpha = (0.05, 0.01, 0.1)[i % 3]
        power.append({"effect": d, "n1": n1, "n2": n2, "alpha": alpha, "power": two_sample_power(d, n1, n2, alpha)})
    mde = []
    for i in range(20):
        n1, n2 = sizes(i, 2, 40)
        alpha, target = (0.05, 0.01)[i % 2], (0.8, 0.9)[(i // 2) % 2]
        root = optimize.brentq(lambda e: two_sample_power(e, n1, n2, alpha) - target, 1e-6, 50, xtol=1e-14, rtol=1e-14)
        mde.append({"n1": n1, "n2": n2, "alpha": alpha, "power": target, "effect": float(root)})
    seeds = []
    for d in (0.3, 0.5, 0.8, 1.0, 1.2, 1.5, 2.0, 2.5, 3.0, 4.0):
        for alpha, target in ((0.05, 0.8), (0.01, 0.9)):
            n = 2
            while two_sample_power(d, n, n, alpha) < target:
                n += 1
            seeds.append({"effect": d, "alpha": alpha, "power": target, "seedsPerArm": n})
    return {"welchPower": power, "minimumDetectableEffect": mde, "seedsPerArm": seeds}


def hedges_section():
    """d and J are formula checks (J by scipy.special.gammaln); dLow, dHigh are roots of scipy's nct.cdf."""
    out = []
    for i in range(CASES):
        kind, x, y = two_groups(i)
        n1, n2 = len(x), len(y)
        v = n1 + n2 - 2
        sp = math.sqrt(((n1 - 1) * np.var(x, ddof=1) + (n2 - 1) * np.var(y, ddof=1)) / v)
        d = float((np.mean(x) - np.mean(y)) / sp)
        j = float(math.exp(special.gammaln(v / 2) - special.gammaln((v - 1) / 2)) / math.sqrt(v / 2))
        scale = math.sqrt(n1 * n2 / (n1 + n2))
        t = d * scale

        def limit(target):
            f = lambda ncp: stats.nct.cdf(t, v, ncp) - target
            lo, hi = t - 1, t + 1
            while f(lo) <= 0:
                lo -= 2 * (t - lo)
            while f(hi) > 0:
                hi += 2 * (hi - t)
            return optimize.brentq(f, lo, hi, xtol=1e-13, rtol=1e-14, maxiter=500)

        out.append({"kind": kind, "x": floats(x), "y": floats(y), "d": d, "j": j, "g": j * d,
                    "dLow": limit(0.975) / scale, "dHigh": limit(0.025) / scale})
    return out


def main():
    fixture = {
        "source": f"scipy {scipy.__version__} via Debian python3-scipy (numpy {np.__version__}, mpmath {mpmath.__version__})",
        "scipyVersion": scipy.__version__,
        "numpyVersion": np.__version__,
        "python": sys.version.split()[0],
        "generator": "tests/reference/scipy_reference.py",
        "seed": SEED,
        "welch": welch_section(),
        "pairedT": paired_section(),
        "mannWhitney": mann_whitney_section(),
        "wilcoxon": wilcoxon_section(),
        "permutation": permutation_section(),
        "adjustments": adjustment_section(),
        "tQuantile": t_quantile_section(),
        "noncentralTCdf": nct_section(),
        "power": power_section(),
        "hedgesG": hedges_section(),
    }
    with open(OUT, "w") as f:
        json.dump(fixture, f, indent=1, allow_nan=False)
        f.write("\n")
    counts = {k: len(v) for k, v in fixture.items() if isinstance(v, list)}
    print(f"wrote {OUT} with scipy {scipy.__version__}: {counts}")


if __name__ == "__main__":
    main()
