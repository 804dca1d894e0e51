"""Reference values for the tick tests: tests/stats/{certainty,calibrationError}.test.ts and
tests/analysis/{ticks,halting,calibration}.test.ts (the scipy commands named in their comments).

Run from anywhere with Debian's system interpreter and packages (python3-scipy 1.10.1, python3-numpy
1.24.2, python3-statsmodels 0.13.5, python3-mpmath), not a pyenv or virtualenv python:

    /usr/bin/python3 tests/reference/ticks_reference.py

Every line prints the value computed here, the value the test asserts and the test's tolerance, and says
`ok` or `MISMATCH`; the script exits with status 1 if any line is a mismatch. Lines marked "definition"
recompute a hand-worked input of a test from its published definition in numpy (no scipy function
exists for it); they check the numbers fed to the scipy calls. Lines marked "mpmath" use 40-digit
arithmetic as a second opinion where scipy 1.10.1's Student t quantile is less exact than the test.
"""
import sys

import mpmath
import numpy as np
import scipy
from scipy import stats
from scipy.special import softmax
from statsmodels.stats.multitest import multipletests

from checks import MISMATCHES, check  # noqa: E402  (tests/reference/checks.py)


def t_interval(x, level=0.95):
    """stats.t.interval(level, n - 1, loc=mean(x), scale=stats.sem(x)), as the test comments write it."""
    x = np.asarray(x, dtype=float)
    return stats.t.interval(level, len(x) - 1, loc=x.mean(), scale=stats.sem(x))


def t_ppf_mpmath(p, df):
    """Student t quantile for p > 0.5 to 40 digits: solve P(T > t) = I_{df/(df+t^2)}(df/2, 1/2) / 2 = 1 - p."""
    mpmath.mp.dps = 40
    tail = lambda t: mpmath.betainc(mpmath.mpf(df) / 2, 0.5, 0, df / (df + t * t), regularized=True) / 2 - (1 - mpmath.mpf(p))
    return float(mpmath.findroot(tail, float(stats.t.ppf(p, df))))


def t_interval_mpmath(x, level=0.95):
    """The same interval with the quantile from t_ppf_mpmath (numpy mean, scipy sem)."""
    x = np.asarray(x, dtype=float)
    half = t_ppf_mpmath((1 + level) / 2, len(x) - 1) * stats.sem(x)
    return x.mean() - half, x.mean() + half


print('scipy', scipy.__version__, 'numpy', np.__version__, 'python', sys.version.split()[0])

# ---------------------------------------------------------------- certainty.test.ts
print('\n# certainty.test.ts')
p = softmax([2.0, 1.0, 0.0])
check('softmax([2, 1, 0])', p, [0.6652409557748219, 0.24472847105479767, 0.09003057317038046], rel=1e-15)
check('1 - entropy(softmax([2,1,0])) / log(3)', 1 - stats.entropy(p) / np.log(3), 0.24232088933841778, digits=12)
check('confidence = max softmax', p.max(), 0.6652409557748219, digits=12)
check('1 - entropy(softmax([1002,1001,1000])) / log(3)', 1 - stats.entropy(softmax([1002.0, 1001.0, 1000.0])) / np.log(3),
      0.24232088933841778, digits=12)

# ---------------------------------------------------------------- calibrationError.test.ts
# ECE = sum_b |B_b|/n |acc(B_b) - conf(B_b)| (Naeini et al. 2015; Guo et al. 2017), bins ((m-1)/M, m/M], 0 in the first.
print('\n# calibrationError.test.ts')


def ece(conf, correct, bins):
    """Definition: expected calibration error with equal-width bins (lo, hi], confidence 0 in bin 0."""
    conf = np.asarray(conf, dtype=float)
    correct = np.asarray(correct, dtype=float)
    keep = ~np.isnan(conf)
    conf, correct = conf[keep], correct[keep]
    index = np.clip(np.ceil(conf * bins).astype(int) - 1, 0, bins - 1)
    total = sum(abs(correct[index == b].sum() - conf[index == b].sum()) for b in range(bins))
    return total / len(conf), np.bincount(index, minlength=bins)


CONF = [0.95, 0.85, 0.9, 0.8, 0.65, 0.7, 0.55, 0.45, 0.3, 0]
CORRECT = [1, 1, 0, 1, 0, 1, 1, 0, 0, 0]
value, counts = ece(CONF, CORRECT, 5)
check('ECE of the hand-worked example, 5 bins (definition)', value, 0.115, digits=14)
check('bin counts, 5 bins (definition)', list(counts), [1, 1, 2, 3, 3])
check('ECE, 1 bin (definition)', ece(CONF, CORRECT, 1)[0], 0.115, digits=14)

# ---------------------------------------------------------------- analysis/ticks.test.ts
print('\n# analysis/ticks.test.ts')
TA = np.array([[0.5, 0.62, 0.7, 0.71], [0.48, 0.6, 0.69, 0.7], [0.52, 0.65, 0.72, 0.72], [0.49, 0.61, 0.71, 0.73]])
TB = np.array([[0.55, 0.75, 0.8, 0.8], [0.54, 0.74, 0.79, 0.81], [0.57, 0.77, 0.81, 0.8], [0.53, 0.73, 0.785, 0.79]])
B_MEAN = [0.5475000000000001, 0.7474999999999999, 0.7962500000000001, 0.8]
B_LOW = [0.52032469116204, 0.7203246911620398, 0.7786084607053466, 0.787007717363749]
B_HIGH = [0.5746753088379601, 0.7746753088379601, 0.8138915392946536, 0.8129922826362511]
A_LOW = [0.47032469116203984, 0.5856256511814169, 0.6844573974323948, 0.6944573974323948]
WELCH_P = [0.006075947389614592, 0.00012069697695037666, 4.501038023428222e-5, 9.384246400884444e-5]
HOLM = [0.006075947389614592, 0.0002815273920265333, 0.0001800415209371289, 0.0002815273920265333]
check('mean of B per tick', TB.mean(axis=0), B_MEAN, digits=14)
check('t.interval low of B per tick', [t_interval(TB[:, k])[0] for k in range(4)], B_LOW, digits=10)
check('t.interval high of B per tick', [t_interval(TB[:, k])[1] for k in range(4)], B_HIGH, digits=10)
check('t.interval low of A per tick', [t_interval(TA[:, k])[0] for k in range(4)], A_LOW, digits=10)
welch = [stats.ttest_ind(TB[:, k], TA[:, k], equal_var=False).pvalue for k in range(4)]
check('Welch p per tick, ttest_ind(B[:, k], A[:, k], equal_var=False)', welch, WELCH_P, digits=10)
check('Holm across ticks (statsmodels multipletests holm)', multipletests(welch, method='holm')[1], HOLM, digits=10)
# Earliest good tick per seed (definition: first tick within tolerance 0.01 of the seed's own best).
per_seed = [int(np.argmax(row >= row.max() - 0.01)) for row in TB]
check('per-seed earliest good tick, tolerance 0.01 (definition)', per_seed, [2, 3, 2, 2])
check('t.interval(0.95, 3, loc=2.25, scale=sem) of the per-seed ticks', t_interval(per_seed), [1.454388423679073, 3.045611576320927], digits=10)

# ---------------------------------------------------------------- analysis/halting.test.ts
print('\n# analysis/halting.test.ts')


def halt(certainty, correct, tau):
    """Definition: exit at the first tick with certainty >= tau, else the last; accuracy and mean exit tick."""
    certainty, correct = np.asarray(certainty, dtype=float), np.asarray(correct)
    hit = certainty >= tau
    exits = np.where(hit.any(axis=1), hit.argmax(axis=1), certainty.shape[1] - 1)
    return correct[np.arange(len(exits)), exits].mean(), exits.mean()


RUNS = [
    ([[0.2, 0.6, 0.9, 0.95], [0.7, 0.5, 0.8, 0.4], [0.1, 0.3, 0.4, 0.45]], [[0, 1, 1, 1], [1, 0, 0, 1], [0, 0, 1, 0]]),
    ([[0.9, 0.9, 0.9, 0.9], [1, 1, 1, 1], [0.95, 0.1, 0.1, 0.1]], [[1, 0, 0, 0], [1, 0, 0, 0], [0, 1, 1, 1]]),
    ([[0, 0, 0, 0], [0.1, 0.2, 0.3, 0.4], [0.3, 0.3, 0.3, 0.3]], [[0, 0, 0, 1], [0, 0, 0, 1], [0, 0, 0, 1]]),
]
acc_08 = [halt(c, k, 0.8)[0] for c, k in RUNS]
exit_05 = [halt(c, k, 0.5)[1] for c, k in RUNS]
check('per-run accuracy at tau .8 (definition)', acc_08, [1 / 3, 2 / 3, 1], digits=15)
check('per-run mean exit tick at tau .5 (definition)', exit_05, [4 / 3, 0, 3], digits=15)
# scipy 1.10.1's t.ppf is good to a few 1e-9 relative (tests/reference/README.md), so its intervals can
# only agree to 8 digits; the mpmath lines below hold the test's 10.
check('t.interval(0.95, 2, ...) of [1/3, 2/3, 1]', t_interval([1 / 3, 2 / 3, 1]), [-0.16137923725011016, 1.4947125705834434], digits=8)
check('t.interval(0.95, 2, ...) of [4/3, 0, 3]', t_interval([4 / 3, 0, 3]), [-2.289421343118291, 5.17831023200718], digits=8)
print(f'info     t quantile .975 at df 2: scipy {stats.t.ppf(0.975, 2)!r}, mpmath {t_ppf_mpmath(0.975, 2)!r}, '
      f'closed form (2p - 1) / sqrt(2p(1 - p)) {(0.95 / np.sqrt(2 * 0.975 * 0.025))!r}')
check('interval of [1/3, 2/3, 1] (mpmath t quantile)', t_interval_mpmath([1 / 3, 2 / 3, 1]), [-0.16137923725011016, 1.4947125705834434], digits=10)
check('interval of [4/3, 0, 3] (mpmath t quantile)', t_interval_mpmath([4 / 3, 0, 3]), [-2.289421343118291, 5.17831023200718], digits=10)

# ---------------------------------------------------------------- analysis/calibration.test.ts
print('\n# analysis/calibration.test.ts')
RUN_1 = ([[0.4, 0.9], [0.6, 0.8], [0.7, 0.6], [0.3, 0.5]], [[0, 1], [1, 1], [0, 0], [1, 0]])
RUN_2 = ([[0.2, 1], [0.9, 0.95], [0.55, 0.7], [np.nan, 0.4]], [[0, 1], [1, 1], [1, 1], [0, 0]])
per_tick = [[ece(np.asarray(conf)[:, t], np.asarray(correct)[:, t], 2)[0] for t in range(2)] for conf, correct in (RUN_1, RUN_2)]
check('ECE per tick, run 1, 2 bins (definition)', per_tick[0], [0.15, 0.2], digits=14)
check('ECE per tick, run 2, 2 bins, NaN left out (definition)', per_tick[1], [0.25, 0.1875], digits=14)
check('t.interval(0.95, 1, ...) of [.15, .25]', t_interval([0.15, 0.25]), [-0.43531023680873476, 0.8353102368087348], digits=10)
check('t.interval(0.95, 1, ...) of [.2, .1875]', t_interval([0.2, 0.1875]), [0.1143362203989081, 0.2731637796010919], digits=10)
print(f'info     t quantile .975 at df 1: scipy {stats.t.ppf(0.975, 1)!r}, mpmath {t_ppf_mpmath(0.975, 1)!r}, '
      f'closed form tan(pi (p - 1/2)) {np.tan(np.pi * 0.475)!r}')
check('interval of [.15, .25] (mpmath t quantile)', t_interval_mpmath([0.15, 0.25]), [-0.43531023680873476, 0.8353102368087348], digits=10)
check('interval of [.2, .1875] (mpmath t quantile)', t_interval_mpmath([0.2, 0.1875]), [0.1143362203989081, 0.2731637796010919], digits=10)

print(f"\n{len(MISMATCHES)} mismatch(es){': ' + '; '.join(MISMATCHES) if MISMATCHES else ''}")
sys.exit(1 if MISMATCHES else 0)
