"""Reference values for tests/analysis/{compare,seedsNeeded,cautions,curves,analyze}.test.ts that do not come
straight from a METHODS.md table.

Run from anywhere with Debian's system interpreter and packages (python3-scipy 1.10.1, python3-numpy
1.24.2, python3-statsmodels 0.13.5, python3-mpmath), not a pyenv or virtualenv python:

    /usr/bin/python3 tests/reference/analysis_reference.py

Every line prints the value computed here, the value the test asserts and the test's tolerance, and says
`ok` or `MISMATCH`; the script exits with status 1 if any line is a mismatch. Lines marked "formula" write
a published definition out with scipy's distributions because scipy 1.10.1 has no function for it; lines
marked "mpmath" use 40-digit arithmetic as a second opinion where scipy 1.10.1's t quantile is less exact.
"""
import sys

import mpmath
import numpy as np
import scipy
from scipy import optimize, stats
from scipy.special import gammaln
from statsmodels.stats.multitest import multipletests

from checks import MISMATCHES, check  # noqa: E402  (tests/reference/checks.py)


def t_ppf_mpmath(p, df):
    """Student t quantile for p > 0.5 to 40 digits: solve P(T > t) = I_{df/(df+t^2)}(df/2, 1/2) / 2 = 1 - p."""
    mpmath.mp.dps = 40
    tail = lambda t: mpmath.betainc(mpmath.mpf(df) / 2, 0.5, 0, df / (df + t * t), regularized=True) / 2 - (1 - mpmath.mpf(p))
    return float(mpmath.findroot(tail, float(stats.t.ppf(p, df))))


print('scipy', scipy.__version__, 'numpy', np.__version__, 'python', sys.version.split()[0])
A = np.array([71.2, 69.8, 73.1, 70.4, 72.0])
B = np.array([68.9, 70.1, 69.5, 71.0, 67.8, 70.6, 69.2])
C = np.array([72, 70, 74, 70, 72])
D = np.array([69, 70, 68, 71, 70, 67, 72])

# ---------------------------------------------------------------- compare.test.ts: Welch, Holm / BH in a family
print('\n# compare.test.ts')
w = stats.ttest_ind(A, B, equal_var=False)
va, vb = A.var(ddof=1) / len(A), B.var(ddof=1) / len(B)
welch_df = (va + vb) ** 2 / (va ** 2 / (len(A) - 1) + vb ** 2 / (len(B) - 1))
check('Welch A,B t', w.statistic, 2.4022431408862186, digits=12)
check('Welch A,B df (Welch-Satterthwaite formula)', welch_df, 7.701328923514923, digits=10)
check('Welch A,B p', w.pvalue, 0.04418107272139468, digits=12)
# scipy 1.10.1's ttest_ind has no confidence_interval (added in 1.11): difference -+ t.ppf(.975, df) se.
half = stats.t.ppf(0.975, welch_df) * np.sqrt(va + vb)
diff = A.mean() - B.mean()
check('Welch A,B 95% interval (formula, scipy t.ppf at fractional df)', [diff - half, diff + half], [0.057502837562101, 3.371068591009343], digits=9)
p_cd = stats.ttest_ind(C, D, equal_var=False).pvalue
check('Welch C,D p', p_cd, 0.07119723188477407, digits=12)
check('Holm of the two Welch p (statsmodels multipletests)', multipletests([w.pvalue, p_cd], method='holm')[1],
      [0.08836214544278936, 0.08836214544278936], digits=12)
check('BH of the two Welch p (statsmodels multipletests)', multipletests([w.pvalue, p_cd], method='fdr_bh')[1],
      [0.07119723188477407, 0.07119723188477407], digits=12)
check('Mann-Whitney A,B exact p', stats.mannwhitneyu(A, B, method='exact').pvalue, 0.04797979797979798, digits=14)

# Hedges' g and its noncentral-t interval (Hedges 1981; Steiger & Fouladi 1997): formula with scipy's nct.
n1, n2 = len(A), len(B)
df = n1 + n2 - 2
sp = np.sqrt(((n1 - 1) * A.var(ddof=1) + (n2 - 1) * B.var(ddof=1)) / df)
d = diff / sp
J = np.exp(gammaln(df / 2) - gammaln((df - 1) / 2)) / np.sqrt(df / 2)
scale = np.sqrt(1 / n1 + 1 / n2)
t_obs = d / scale
ncp_low = optimize.brentq(lambda c: stats.nct.cdf(t_obs, df, c) - 0.975, -10, 10, xtol=1e-14)
ncp_high = optimize.brentq(lambda c: stats.nct.cdf(t_obs, df, c) - 0.025, -10, 10, xtol=1e-14)
check('Hedges J (exact gamma correction, formula)', J, 0.922745608053087, rel=1e-14)
check("Hedges' g = J d", J * d, 1.341293840469836, digits=10)
check("Hedges' g 95% interval = J x noncentral-t interval of d (formula, scipy nct)", [J * ncp_low * scale, J * ncp_high * scale],
      [J * 0.11761377366, J * 2.73461003886], digits=8)


def power(effect, n1, n2, alpha=0.05):
    """Two-sided equal-variance t-test power from the noncentral t (common practice)."""
    df = n1 + n2 - 2
    ncp = effect * np.sqrt(n1 * n2 / (n1 + n2))
    tc = stats.t.ppf(1 - alpha / 2, df)
    # Boost's noncentral t in scipy 1.10.1 raises a spurious 'invalid value' flag at df = 2 while
    # returning finite values; silence it and check finiteness instead.
    with np.errstate(invalid='ignore'):
        value = stats.nct.sf(tc, df, ncp) + stats.nct.cdf(-tc, df, ncp)
    assert np.isfinite(value), (effect, n1, n2)
    return value


def seeds_per_arm(effect, target=0.8):
    n = 2
    while power(effect, n, n) < target:
        n += 1
    return n


mde = optimize.brentq(lambda e: power(e, n1, n2) - 0.8, 0.01, 5, xtol=1e-14)
check('pooled sd A,B', sp, 1.1793460657742232, digits=12)
check('minimum detectable difference at 5 v 7, metric units (MDE d x pooled sd)', mde * sp, 2.1476019914743016, digits=6)
check('seeds per arm for the observed d', seeds_per_arm(d), 9)

# paired: candidate P1 against baseline P0 on the same seeds
P1 = np.array([71.2, 69.8, 73.1, 70.4, 72.0, 70.9])
P0 = np.array([70.1, 69.9, 71.8, 70.0, 71.1, 70.3])
r = stats.ttest_rel(P1, P0)
check('paired t', r.statistic, 3.362691229906825, digits=10)
check('paired df', int(r.df), 5)
check('paired p', r.pvalue, 0.020048922016727606, digits=10)
ci = r.confidence_interval(0.95)
# scipy 1.10.1's t.ppf is good to a few 1e-9 relative (tests/reference/README.md), so its interval can
# only agree to 8 digits; the mpmath line below holds the test's 10.
check('paired 95% interval (scipy ttest_rel().confidence_interval)', [ci.low, ci.high], [0.16489071939106448, 1.2351092806089412], digits=8)
diffs = P1 - P0
t975 = t_ppf_mpmath(0.975, 5)
print(f'info     t quantile .975 at df 5: scipy {stats.t.ppf(0.975, 5)!r}, mpmath {t975!r}')
check('paired 95% interval (mpmath t quantile, numpy mean and sem)',
      [diffs.mean() - t975 * stats.sem(diffs), diffs.mean() + t975 * stats.sem(diffs)], [0.16489071939106448, 1.2351092806089412], digits=10)
check('paired Wilcoxon exact p', stats.wilcoxon(P1, P0, method='exact').pvalue, 0.0625, digits=12)

# non-inferiority, goal max, margin 2: H0 mean(A) - mean(B) <= -2  <=>  one-sided Welch on A + 2 v B
check('non-inferiority A v B margin 2 (max)', stats.ttest_ind(A + 2, B, equal_var=False, alternative='greater').pvalue,
      0.0004613176303825015, digits=12)
# goal min, margin 0.5, candidate B v baseline A: H0 mean(B) - mean(A) >= 0.5 <=> B - 0.5 < A one-sided
check('non-inferiority B v A margin 0.5 (min)', stats.ttest_ind(B - 0.5, A, equal_var=False, alternative='less').pvalue,
      0.007652026712195942, digits=12)

# ---------------------------------------------------------------- seedsNeeded.test.ts, analyze.test.ts
print('\n# seedsNeeded.test.ts, analyze.test.ts')
check('seeds per arm at d = 0.5, 0.8, 1, 1.5, 2, 3 (METHODS.md)', [seeds_per_arm(e) for e in (0.5, 0.8, 1, 1.5, 2, 3)], [64, 26, 17, 9, 6, 4])
check('power at d = 0.5 with 3, 5, 10, 20, 50 per arm', [power(0.5, k, k) for k in (3, 5, 10, 20, 50)],
      [0.07684904996035868, 0.10768598982105744, 0.18509565629118482, 0.33793902869253206, 0.696893405561745], digits=8)
check('pilot: pooled sd', sp, 1.1793460657742232, digits=12)
check('pilot: standardized difference d', d, 1.4535900564185282, digits=12)
check('analyze.test.ts comment: power at d = 2, 5 v 5 is about 0.79', round(power(2, 5, 5), 2), 0.79)

# ---------------------------------------------------------------- cautions.test.ts, curves.test.ts
print('\n# cautions.test.ts, curves.test.ts')
check('skew([1, 1.1, 1.2, 1.3, 5]) (bias=True)', stats.skew([1.0, 1.1, 1.2, 1.3, 5.0]), 1.48427744360567, digits=12)
V = np.array([0.61, 0.64, 0.58, 0.66])
check('t.interval(0.95, 3, mean, sem) of [0.61, 0.64, 0.58, 0.66]', stats.t.interval(0.95, len(V) - 1, loc=V.mean(), scale=stats.sem(V)),
      [0.5668071896575351, 0.678192810342465], digits=12)

# ---------------------------------------------------------------- analyzeChoices.test.ts: a level other than 0.95
print('\n# analyzeChoices.test.ts (t.interval at level 0.9 and 0.95; the test holds the mpmath values to 10 digits)')


def t_interval_mpmath(level, x):
    x = np.asarray(x, dtype=float)
    h = t_ppf_mpmath((1 + level) / 2, len(x) - 1) * stats.sem(x)
    return [x.mean() - h, x.mean() + h]


CHOICES = [
    (0.9, [0.10, 0.20, 0.40], [-0.024185189250352207, 0.49085185591701896]),
    (0.9, [0.60, 0.64, 0.71], [0.5561355961197778, 0.7438644038802222]),
    (0.9, [0.15, 0.25, 0.30], [0.10457407204149055, 0.36209259462517607]),
    (0.9, [0.66, 0.70, 0.69], [0.6482394742213973, 0.7184271924452692]),
    (0.95, [0.60, 0.64, 0.71], [0.511689065761544, 0.788310934238456]),
    (0.9, [0.15, 0.25], [-0.11568757573375188, 0.5156875757337519]),
    (0.9, [0.2, 0.1875], [0.154289053033281, 0.233210946966719]),
]
for level, x, want in CHOICES:
    # scipy 1.10.1's t.ppf is good to a few 1e-9 relative: 8 digits; the mpmath quantile: the test's 10.
    check(f't.interval({level}, {len(x) - 1}, mean, sem) of {x}',
          stats.t.interval(level, len(x) - 1, loc=np.mean(x), scale=stats.sem(x)), want, digits=8)
    check(f'the same with the mpmath t quantile', t_interval_mpmath(level, x), want, digits=10)

print(f"\n{len(MISMATCHES)} mismatch(es){': ' + '; '.join(MISMATCHES) if MISMATCHES else ''}")
sys.exit(1 if MISMATCHES else 0)
