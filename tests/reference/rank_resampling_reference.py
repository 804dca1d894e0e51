"""Reference values for tests/stats/{mannWhitney,wilcoxon,benjaminiHochberg,holm,permutation,bootstrap,
cliffsDelta,ranks}.test.ts that do not come straight from a METHODS.md table.

Run from anywhere with Debian's system interpreter and packages (python3-scipy 1.10.1, python3-numpy
1.24.2, python3-statsmodels 0.13.5, python3-mpmath), not a pyenv or virtualenv python:

    /usr/bin/python3 tests/reference/rank_resampling_reference.py

Every line prints the value computed here, the value the test asserts and the test's tolerance, and says
`ok` or `MISMATCH`; the script exits with status 1 if any line is a mismatch. Lines marked "formula" are
not scipy functions (scipy 1.10.1 has none for them) but the published definition written out in numpy,
and say so. The 10 v 10 permutation enumeration takes about 20 seconds.
"""
import itertools
import math
import pathlib
import sys
import warnings

import numpy as np
import scipy
from scipy import stats
from scipy.special import ndtri
from scipy.stats import _resampling  # private: the code behind stats.bootstrap(method='BCa') in 1.10.1
from statsmodels.stats.multitest import multipletests

from checks import MISMATCHES, check  # noqa: E402  (tests/reference/checks.py)


print('scipy', scipy.__version__, 'numpy', np.__version__, 'python', sys.version.split()[0])
A = [71.2, 69.8, 73.1, 70.4, 72.0]
B = [68.9, 70.1, 69.5, 71.0, 67.8, 70.6, 69.2]
C = [72, 70, 74, 70, 72]
D = [69, 70, 68, 71, 70, 67, 72]

# ---------------------------------------------------------------- mannWhitney.test.ts
print('\n# mannWhitney.test.ts')
mw = stats.mannwhitneyu
check('MW A,B U1', mw(A, B, method='exact').statistic, 30)
check('MW A,B exact two-sided', mw(A, B, method='exact').pvalue, 0.04797979797979798, rel=1e-10)
check('MW A,B exact greater', mw(A, B, alternative='greater', method='exact').pvalue, 0.02398989898989899, rel=1e-10)
check('MW A,B exact less', mw(A, B, alternative='less', method='exact').pvalue, 0.9848484848484849, rel=1e-10)
check('MW A,B asymptotic two-sided, cc', mw(A, B, method='asymptotic').pvalue, 0.05131990358807116, rel=1e-10)
check('MW A,B asymptotic two-sided, no cc', mw(A, B, method='asymptotic', use_continuity=False).pvalue, 0.042357062026854894, rel=1e-10)
check('MW A,B asymptotic greater, cc', mw(A, B, alternative='greater', method='asymptotic').pvalue, 0.02565995179403558, rel=1e-10)
check('MW A,B asymptotic greater, no cc', mw(A, B, alternative='greater', method='asymptotic', use_continuity=False).pvalue,
      0.021178531013427447, rel=1e-10)
check('MW C,D asymptotic two-sided, cc', mw(C, D, method='asymptotic').pvalue, 0.09585979482497743, rel=1e-10)
check('MW C,D asymptotic two-sided, no cc', mw(C, D, method='asymptotic', use_continuity=False).pvalue, 0.08037250424680117, rel=1e-10)
check('MW C,D asymptotic less, cc', mw(C, D, alternative='less', method='asymptotic').pvalue, 0.9665087973635119, rel=1e-10)
check('MW C,D U1', mw(C, D, method='asymptotic').statistic, 28)


# Exact conditional distribution with ties: scipy 1.10.1's mannwhitneyu has no permutation method
# (PermutationMethod came in 1.11), so enumerate all 792 splits with stats.permutation_test on U itself.
def u_of_x(x, y):
    return mw(x, y, method='asymptotic').statistic


for alt, want in (('two-sided', 0.11363636363636363), ('greater', 0.056818181818181816), ('less', 0.9709595959595959)):
    r = stats.permutation_test((C, D), u_of_x, permutation_type='independent', alternative=alt, n_resamples=np.inf)
    check(f'MW C,D exact conditional {alt} (permutation_test of U, n_resamples=inf)', r.pvalue, want, rel=1e-10)
check('MW smallest p 3 v 3', mw([4, 5, 6], [1, 2, 3], method='exact').pvalue, 0.1, rel=1e-10)
check('MW smallest p 4 v 4', mw([5, 6, 7, 8], [1, 2, 3, 4], method='exact').pvalue, 2 / 70, rel=1e-10)
check('MW smallest p 5 v 5', mw([6, 7, 8, 9, 10], [1, 2, 3, 4, 5], method='exact').pvalue, 2 / 252, rel=1e-10)

# ---------------------------------------------------------------- wilcoxon.test.ts
print('\n# wilcoxon.test.ts')
wx = stats.wilcoxon
# scipy rightly warns that 4 non-zero pairs are few for the normal approximation; the tests ask for it anyway.
warnings.filterwarnings('ignore', message='Sample size too small for normal approximation')
DARWIN = [6, 8, 14, 16, 23, 24, 28, 29, 41, -48, 49, 56, 60, -67, 75]
B5, D5, D5b = B[:5], D[:5], D[2:7]
check('W darwin W+ (alternative greater statistic)', wx(DARWIN, alternative='greater', method='exact').statistic, 96)
check('W darwin exact two-sided', wx(DARWIN, method='exact').pvalue, 0.041259765625, rel=1e-10)
check('W darwin exact greater', wx(DARWIN, alternative='greater', method='exact').pvalue, 0.0206298828125, rel=1e-10)
check('W darwin exact less', wx(DARWIN, alternative='less', method='exact').pvalue, 0.982330322265625, rel=1e-10)
check('W A,B[:5] W+', wx(A, B5, alternative='greater', method='exact').statistic, 12)
check('W A,B[:5] exact two-sided', wx(A, B5, method='exact').pvalue, 0.3125, rel=1e-10)
check('W A,B[:5] exact greater', wx(A, B5, alternative='greater', method='exact').pvalue, 0.15625, rel=1e-10)
check('W A,B[:5] exact less', wx(A, B5, alternative='less', method='exact').pvalue, 0.90625, rel=1e-10)
check('W C,D[:5] W+ (zero dropped)', wx(C, D5, alternative='greater', method='approx').statistic, 9)
check('W C,D[:5] approx two-sided', wx(C, D5, method='approx').pvalue, 0.14412703481601533, rel=1e-10)
check('W C,D[:5] approx greater', wx(C, D5, alternative='greater', method='approx').pvalue, 0.07206351740800766, rel=1e-10)
check('W C,D[:5] approx less', wx(C, D5, alternative='less', method='approx').pvalue, 0.9279364825919924, rel=1e-10)
check('W C,D[2:7] approx two-sided', wx(C, D5b, method='approx').pvalue, 0.14077277337135014, rel=1e-10)
check('W C,D[2:7] approx greater', wx(C, D5b, alternative='greater', method='approx').pvalue, 0.07038638668567507, rel=1e-10)
check('W darwin x4 W+', wx(DARWIN * 4, alternative='greater', method='approx').statistic, 1458)
check('W darwin x4 approx two-sided', wx(DARWIN * 4, method='approx').pvalue, 6.350786691903962e-5, rel=1e-10)
check('W darwin x4 approx greater', wx(DARWIN * 4, alternative='greater', method='approx').pvalue, 3.175393345951981e-5, rel=1e-10)

# ---------------------------------------------------------------- ranks.test.ts
print('\n# ranks.test.ts')
check('rankdata(C + D)', list(stats.rankdata(C + D)), [10, 5.5, 12, 5.5, 10, 3, 5.5, 2, 8, 5.5, 1, 10])

# ---------------------------------------------------------------- benjaminiHochberg.test.ts, holm.test.ts
# scipy 1.10.1 has no multiple-testing function (false_discovery_control came in 1.11), so the values
# are checked against Debian's statsmodels and against the formulas written out below.
print('\n# benjaminiHochberg.test.ts, holm.test.ts')
SIX = [0.01, 0.04, 0.03, 0.005, 0.2, 0.03]
BH_1995 = [0.0001, 0.0004, 0.0019, 0.0095, 0.0201, 0.0278, 0.0298, 0.0344, 0.0459, 0.324, 0.4262, 0.5719, 0.6528, 0.759, 1]
BH_1995_Q = [0.0015, 0.003, 0.0095, 0.035625, 0.0603, 0.06385714285714286, 0.06385714285714286, 0.0645, 0.07650000000000001,
             0.486, 0.5811818181818181, 0.7148749999999999, 0.7532307692307693, 0.8132142857142857, 1]


def bh_formula(p):
    """Benjamini & Hochberg (1995) step-up: q_(i) = min over j >= i of min(1, m p_(j) / j)."""
    p = np.asarray(p, dtype=float)
    m = len(p)
    order = np.argsort(p, kind='stable')
    q = np.minimum.accumulate((m * p[order] / np.arange(1, m + 1))[::-1])[::-1]
    out = np.empty(m)
    out[order] = np.minimum(q, 1)
    return out


def holm_formula(p):
    """Holm (1979) step-down: q_(i) = max over j <= i of min(1, (m - j + 1) p_(j))."""
    p = np.asarray(p, dtype=float)
    m = len(p)
    order = np.argsort(p, kind='stable')
    q = np.maximum.accumulate((m - np.arange(m)) * p[order])
    out = np.empty(m)
    out[order] = np.minimum(q, 1)
    return out


check('BH six, statsmodels multipletests fdr_bh', multipletests(SIX, method='fdr_bh')[1], [0.03, 0.048, 0.045, 0.03, 0.2, 0.045], rel=1e-10)
check('BH six, formula', bh_formula(SIX), [0.03, 0.048, 0.045, 0.03, 0.2, 0.045], rel=1e-10)
check('BH 1995, statsmodels multipletests fdr_bh', multipletests(BH_1995, method='fdr_bh')[1], BH_1995_Q, rel=1e-10)
check('BH 1995, formula', bh_formula(BH_1995), BH_1995_Q, rel=1e-10)
check('BH 1995 rejections at .05', int((multipletests(BH_1995, method='fdr_bh')[1] <= 0.05).sum()), 4)
check('Holm six, statsmodels multipletests holm', multipletests(SIX, method='holm')[1], [0.05, 0.12, 0.12, 0.03, 0.2, 0.12], rel=1e-10)
check('Holm six, formula', holm_formula(SIX), [0.05, 0.12, 0.12, 0.03, 0.2, 0.12], rel=1e-10)
check('Holm 1995 first four, statsmodels', multipletests(BH_1995, method='holm')[1][:4], [0.0015, 0.0056, 0.0247, 0.114], rel=1e-10)
check('Holm 1995 rejections below .05', int((multipletests(BH_1995, method='holm')[1] < 0.05).sum()), 3)

# ---------------------------------------------------------------- permutation.test.ts
print('\n# permutation.test.ts')


def mean_diff(x, y, axis=-1):
    return np.mean(x, axis=axis) - np.mean(y, axis=axis)


def abs_mean_diff(x, y, axis=-1):
    return np.abs(mean_diff(x, y, axis))


def perm(x, y, stat, alt):
    return stats.permutation_test((x, y), stat, permutation_type='independent', alternative=alt,
                                  n_resamples=np.inf, vectorized=True).pvalue


# The test's two-sided p counts |T*| >= |T| (not scipy's 2 min(greater, less)): permutation_test on |T|, 'greater'.
check('perm A,B two-sided p = #(|T*|>=|T|)/792', perm(A, B, abs_mean_diff, 'greater'), 0.03409090909090909, rel=1e-13)
check('perm A,B #(T* >= T)', round(perm(A, B, mean_diff, 'greater') * 792), 15)
check('perm C,D #(T* >= T)', round(perm(C, D, mean_diff, 'greater') * 792), 40)
check('perm C,D #(|T*| >= |T|)', round(perm(C, D, abs_mean_diff, 'greater') * 792), 76)

# Michelson (NIST StRD "Michelso", data from line 61): counts by exact integer arithmetic (values x 100).
MICH_TXT = pathlib.Path(__file__).resolve().parent / 'nist-strd-univariate/Michelso.txt'
mich_float = [float(v) for v in MICH_TXT.read_text().split('\n')[60:] if v.strip()]
mich = [int(round(v * 100)) for v in mich_float]


def counts(x, y):
    pooled = x + y
    n1, n2, total = len(x), len(y), sum(x + y)
    obs = n2 * sum(x) - n1 * sum(y)
    ge = le = ab = tot = 0
    for c in itertools.combinations(range(len(pooled)), n1):
        sx = sum(pooled[i] for i in c)
        t = n2 * sx - n1 * (total - sx)
        tot += 1
        ge += t >= obs
        le += t <= obs
        ab += abs(t) >= abs(obs)
    return tot, ge, le, ab


check('perm Michelson 10 v 10 (splits, >=, <=, |.|>=), integer arithmetic', counts(mich[0:10], mich[20:30]), [184756, 57448, 131048, 114896])
check('perm Michelson 7 v 13 (splits, >=, <=, |.|>=), integer arithmetic', counts(mich[0:7], mich[20:33]), [77520, 21188, 57795, 41365])
# The test's comment says scipy's permutation_test loses some of these ties to rounding: shown here for 1.10.1.
x10, y10 = np.array(mich_float[0:10]), np.array(mich_float[20:30])
lost = (round(perm(x10, y10, mean_diff, 'greater') * 184756), round(perm(x10, y10, mean_diff, 'less') * 184756))
print(f'info     scipy {scipy.__version__} permutation_test on the floats, 10 v 10: #(T*>=T), #(T*<=T) = {lost} '
      f'(integer arithmetic: 57448, 131048) -> ties lost to rounding: {lost != (57448, 131048)}')

# ---------------------------------------------------------------- bootstrap.test.ts
print('\n# bootstrap.test.ts')
Ai = [712, 698, 731, 704, 720]
S = sum(Ai)
below = sum(1 for c in itertools.product(Ai, repeat=5) if sum(c) < S)
equal = sum(1 for c in itertools.product(Ai, repeat=5) if sum(c) == S)
check('ideal bootstrap sums below / equal (integer arithmetic)', [below, equal], [1523, 140])
check('z0 with exact ties, ndtri((1523 + 70)/3125)', ndtri((below + equal / 2) / 3125), 0.02446713291103201, rel=1e-10)
# The ideal bootstrap distribution in floating point (numpy mean of every resample, as stats.bootstrap does),
# fed to scipy 1.10.1's own BCa routine: z0 by its mid-rank rule with floating-point ties, a by the jackknife.
ideal = np.mean(np.array(list(itertools.product(A, repeat=5))), axis=-1)
theta = np.mean(A)
check('theta = mean(A)', float(theta), 71.3)
z0 = ndtri(_resampling._percentile_of_score(ideal, theta, axis=-1))
check('z0 (mid-rank, floating-point ties)', z0, 0.026071887453559196, rel=1e-10)
alpha_1, alpha_2, a_hat = _resampling._bca_interval((np.array(A),), np.mean, axis=-1, alpha=0.025, theta_hat_b=ideal, batch=None)
check('jackknife acceleration a of mean(A)', a_hat, 0.019456097143550056, rel=1e-10)
check('percentile 95% (np.percentile of the 3125 means)', [np.percentile(ideal, 2.5), np.percentile(ideal, 97.5)], [70.32, 72.34], rel=1e-10)
check('BCa 95% (scipy _bca_interval levels, np.percentile)', [np.percentile(ideal, 100 * alpha_1), np.percentile(ideal, 100 * alpha_2)],
      [70.36, 72.44], rel=1e-10)
# (a does not depend on the resamples; two placeholder values either side of the estimate keep z0 finite)
est = mean_diff(np.array(A), np.array(B))
a_two = _resampling._bca_interval((np.array(A), np.array(B)), mean_diff, axis=-1, alpha=0.025,
                                  theta_hat_b=np.array([est - 1, est + 1]), batch=None)[2]
check('two-sample jackknife acceleration of mean(A) - mean(B)', a_two, 0.013974522533729852, rel=1e-10)
check('expanded percentile tail Phi(sqrt(5/4) t_.025,4)', stats.norm.cdf(math.sqrt(5 / 4) * stats.t.ppf(0.025, 4)), 0.0009541005518824885, rel=1e-9)

# ---------------------------------------------------------------- cliffsDelta.test.ts
# scipy has no Cliff's delta: delta and P(improvement) come from scipy's U; the consistent variance
# (Cliff 1993/1996) and the Feng & Cliff (2004) bounds are formulas written out here, as R's effsize does.
print("\n# cliffsDelta.test.ts")


def cliff(x, y, level=0.95):
    """Formula: dominance d_ij = sign(x_i - y_j); consistent variance; Feng & Cliff (2004) asymmetric bounds."""
    x, y = np.asarray(x, float), np.asarray(y, float)
    n1, n2 = len(x), len(y)
    dom = np.sign(x[:, None] - y[None, :])
    d = dom.mean()
    dv = d * (n1 * n2 - 1) / (n1 * n2) if abs(d) == 1 else d
    s_i = ((dom.mean(axis=1) - dv) ** 2).sum() / (n1 - 1)
    s_j = ((dom.mean(axis=0) - dv) ** 2).sum() / (n2 - 1)
    s_ij = ((dom - dv) ** 2).sum() / ((n1 - 1) * (n2 - 1))
    s2 = ((n2 - 1) * s_i + (n1 - 1) * s_j + s_ij) / (n1 * n2)
    z = stats.norm.ppf((1 + level) / 2)
    root = z * math.sqrt(s2) * math.sqrt((1 - dv ** 2) ** 2 + z ** 2 * s2)
    den = 1 - dv ** 2 + z ** 2 * s2
    return d, s2, (dv - dv ** 3 - root) / den, (dv - dv ** 3 + root) / den


u = mw(A, B, method='exact').statistic
check("Cliff A,B delta = 2 U/(n1 n2) - 1 (scipy U)", 2 * u / 35 - 1, 25 / 35, rel=1e-10)
check("Cliff A,B P(improvement) = U/(n1 n2) (scipy U)", u / 35, 0.857142857, rel=1e-9)
d, s2, lo, hi = cliff(A, B)
check("Cliff A,B consistent variance (formula)", s2, 0.06494071914480078, rel=1e-10)
check("Cliff A,B 95% low (formula)", lo, 0.00061319297, rel=1e-8)
check("Cliff A,B 95% high (formula)", hi, 0.94588140903, rel=1e-10)
T = [10, 10, 20, 20, 20, 30, 30, 30, 40, 50]
Cn = [10, 20, 30, 40, 40, 50]
d, s2, lo, hi = cliff(T, Cn)
check("Cliff effsize data delta (formula)", d, -0.25)
check("Cliff effsize data P(improvement) (scipy U)", mw(T, Cn, method='asymptotic').statistic / 60, 0.375)
check("Cliff effsize data 95% interval (formula)", [lo, hi], [-0.7125350951, 0.363999895], rel=1e-9)

print(f"\n{len(MISMATCHES)} mismatch(es){': ' + '; '.join(MISMATCHES) if MISMATCHES else ''}")
sys.exit(1 if MISMATCHES else 0)
