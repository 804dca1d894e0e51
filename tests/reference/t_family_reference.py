"""Reference values for seedsift's statistics core, part 1 (tests/stats/*.test.ts).

Run with Debian's python3 (python3-scipy 1.10.1, python3-numpy 1.24.2, python3-mpmath 1.2.1):
    /usr/bin/python3 tests/reference/t_family_reference.py
mpmath values are computed at 40 significant digits from definitions independent of seedsift's
algorithms (integrals and root-finding in mpmath), then printed to 17 significant digits.
"""
import mpmath as mp
import numpy as np
from scipy import stats

mp.mp.dps = 40

A = [71.2, 69.8, 73.1, 70.4, 72.0]
B = [68.9, 70.1, 69.5, 71.0, 67.8, 70.6, 69.2]


def f17(x):
    return mp.nstr(mp.mpf(x), 17, min_fixed=-30, max_fixed=30)


def t_cdf(t, df):
    t, df = mp.mpf(t), mp.mpf(df)
    x = df / (df + t * t)
    tail = mp.betainc(df / 2, mp.mpf(1) / 2, 0, x, regularized=True) / 2
    return 1 - tail if t > 0 else tail


def t_quantile(p, df):
    p = mp.mpf(p)
    guess = stats.t.ppf(float(p), float(df))
    return mp.findroot(lambda q: t_cdf(q, df) - p, mp.mpf(guess))


def nct_cdf(t, df, ncp):
    """P(T <= t) for T = (Z + ncp) / sqrt(V / df), V ~ chi^2_df: E[Phi(t S / sqrt(df) - ncp)], S ~ chi_df."""
    t, df, ncp = mp.mpf(t), mp.mpf(df), mp.mpf(ncp)
    logc = (1 - df / 2) * mp.log(2) - mp.loggamma(df / 2)

    def integrand(s):
        if s == 0:
            return mp.mpf(0)
        return mp.ncdf(t * s / mp.sqrt(df) - ncp) * mp.exp(logc + (df - 1) * mp.log(s) - s * s / 2)

    mode = mp.sqrt(max(df - 1, mp.mpf('0.5')))
    pts = [0, mode / 4, mode / 2, mode, mode + 2, mode + 5, mode + 10, mp.inf]
    return mp.quad(integrand, pts)


def exact_sums(x):
    x = [mp.mpf(repr(v)) for v in x]  # decimal value of the literal as typed
    n = len(x)
    m = sum(x) / n
    v = sum((xi - m) ** 2 for xi in x) / (n - 1)
    return n, m, v


print('# Welch A vs B at 40 digits (inputs taken as the decimal literals)')
n1, m1, v1 = exact_sums(A)
n2, m2, v2 = exact_sums(B)
se2 = v1 / n1 + v2 / n2
se = mp.sqrt(se2)
df = se2 ** 2 / ((v1 / n1) ** 2 / (n1 - 1) + (v2 / n2) ** 2 / (n2 - 1))
diff = m1 - m2
q975 = t_quantile('0.975', df)
q95 = t_quantile('0.95', df)
print('t', f17(diff / se), 'df', f17(df), 'se', f17(se))
print('95% two-sided', f17(diff - q975 * se), f17(diff + q975 * se))
print('95% one-sided lower (greater)', f17(diff - q95 * se), 'upper (less)', f17(diff + q95 * se))
print('scipy 1.10.1 t.ppf(0.975, df) =', repr(stats.t.ppf(0.975, float(df))), 'mpmath', f17(q975))

print('# t quantiles 0.975')
for k in [1, 2, 4, 5, 10, 30, 120]:
    print(k, f17(t_quantile('0.975', k)))

print('# noncentral t CDF grid: t, df, ncp, F')
grid = [(t, d, c) for t in [-3, -0.5, 0.5, 2.5, 8] for d in [1, 3.5, 10, 60] for c in [-2.5, 0, 0.7, 4]]
grid += [(40, 10, 40), (45, 30, 38), (-1, 5, -30), (2.2281388519649385, 8, 3.1622776601683795), (1.5, 200000, 1.2)]
for t, d, c in grid:
    print('[%r, %r, %r, %s],' % (t, d, c, f17(nct_cdf(t, d, c))))

print('# Hedges A vs B, noncentral-t 95% interval for delta')
sp = mp.sqrt(((n1 - 1) * v1 + (n2 - 1) * v2) / (n1 + n2 - 2))
d = diff / sp
scale = mp.sqrt(mp.mpf(n1 * n2) / (n1 + n2))
tt = d * scale
lo = mp.findroot(lambda c: nct_cdf(tt, 10, c) - mp.mpf('0.975'), mp.mpf('0.2'))
hi = mp.findroot(lambda c: nct_cdf(tt, 10, c) - mp.mpf('0.025'), mp.mpf('4.67'))
J = mp.gamma(5) / (mp.sqrt(5) * mp.gamma(mp.mpf(9) / 2))
print('d', f17(d), 'J', f17(J), 'g', f17(J * d), 'dLow', f17(lo / scale), 'dHigh', f17(hi / scale))

print('# power of the two-sided two-sample t test (alpha .05): d, n1, n2, power')
for dd, a, b in [(1, 5, 5), (0.5, 64, 64), (0.5, 63, 63), (0.8, 26, 26), (0.8, 25, 25), (1.5, 9, 9), (1.5, 8, 8), (2, 6, 6), (2, 5, 5), (3, 4, 4), (3, 3, 3), (1, 3, 8), (-0.7, 12, 20)]:
    dfp = a + b - 2
    crit = t_quantile('0.975', dfp)
    ncp = mp.mpf(dd) * mp.sqrt(mp.mpf(a * b) / (a + b))
    pw = 1 - nct_cdf(crit, dfp, ncp) + nct_cdf(-crit, dfp, ncp)
    print(dd, a, b, f17(pw))

print('# scipy 1.10.1 one-sided Welch on shifted data')
print('A+0.5 vs B greater', repr(stats.ttest_ind(np.array(A) + 0.5, B, equal_var=False, alternative='greater').pvalue))
print('A-2.5 vs B less', repr(stats.ttest_ind(np.array(A) - 2.5, B, equal_var=False, alternative='less').pvalue))
print('A vs B less', repr(stats.ttest_ind(A, B, equal_var=False, alternative='less').pvalue))

print('# Student sleep data (R datasets::sleep), scipy 1.10.1 ttest_rel')
g1 = [0.7, -1.6, -0.2, -1.2, -0.1, 3.4, 3.7, 0.8, 0.0, 2.0]
g2 = [1.9, 0.8, 1.1, 0.1, -0.1, 4.4, 5.5, 1.6, 4.6, 3.4]
for alt in ['two-sided', 'greater', 'less']:
    r = stats.ttest_rel(g1, g2, alternative=alt)
    print(alt, repr(r.statistic), repr(r.pvalue))
dd_ = [a - b for a, b in zip(g1, g2)]
nd, md, vd = exact_sums(dd_)
sed = mp.sqrt(vd / nd)
print('sleep 95% interval (mpmath t quantile)', f17(md - t_quantile('0.975', 9) * sed), f17(md + t_quantile('0.975', 9) * sed))

print('# numpy 1.24.2 quantile (method linear = Hyndman-Fan type 7)')
Q = [3.2, -1.0, 7.5, 0.0, 2.25, 9.0, 4.4]
for p in [0, 0.1, 0.25, 0.5, 0.8, 0.9, 1]:
    print(p, repr(float(np.quantile(Q, p))))
print('# interval for the mean of A (scipy 1.10.1 t.interval and mpmath)')
print(stats.t.interval(0.95, 4, loc=np.mean(A), scale=stats.sem(A)))
q4 = t_quantile('0.975', 4)
_, mA, vA = exact_sums(A)
print(f17(mA - q4 * mp.sqrt(vA / 5)), f17(mA + q4 * mp.sqrt(vA / 5)))
print('# minimum detectable effect n=10/10 and 5/5 (power .8)')
for a in [5, 10]:
    crit = t_quantile('0.975', 2 * a - 2)
    f = lambda dd: 1 - nct_cdf(crit, 2 * a - 2, dd * mp.sqrt(mp.mpf(a) / 2)) + nct_cdf(-crit, 2 * a - 2, dd * mp.sqrt(mp.mpf(a) / 2)) - mp.mpf('0.8')
    print(a, f17(mp.findroot(f, mp.mpf(1.5))))
print('# t quantile 0.95 at df 10')
print(f17(t_quantile('0.95', 10)))

print('# seedsPerArm far beyond 2^20 runs per arm: exact t power around the answer (slow)')
za = mp.sqrt(2) * mp.erfinv(mp.mpf('0.95'))
for ds, c in [('0.002', 3924432), ('0.001', 15697722)]:
    dd = mp.mpf(ds)
    for n in [c - 1, c]:
        dfp = 2 * n - 2
        crit = t_quantile('0.975', dfp)
        ncp = dd * mp.sqrt(mp.mpf(n) / 2)
        print(ds, n, mp.nstr(1 - nct_cdf(crit, dfp, ncp) + nct_cdf(-crit, dfp, ncp), 15))

# studentTQuantile.test.ts 'matches 40-digit t quantiles': whole and fractional df, both tails
print('\nstudentTQuantile cases (p, df, mpmath quantile; scipy 1.10.1 t.ppf beside it)')
for p, df in [('0.975', 1), ('0.975', '7.5'), ('0.95', 10), ('0.995', '3.25'), ('0.025', 12)]:
    print(p, df, f17(t_quantile(p, df)), repr(stats.t.ppf(float(p), float(df))))

# tests/stats/tTable.ts and tests/report: METHODS.md's 6-decimal table of 0.975 quantiles, from 40-digit roots
print('\n0.975 quantiles (df, 40-digit root, rounded to 6 decimals)')
for df in [1, 2, 3, 4, 5, 6, 10, 30, 120]:
    q = t_quantile('0.975', df)
    print(df, f17(q), f'{float(q):.6f}')
