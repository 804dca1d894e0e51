"""Reference values of the noncentral t CDF far from the centre (|ncp| in the thousands to 10^8),
for tests/stats/noncentralT.test.ts and the power checks at extreme alpha.

Run with Debian's python3 (python3-mpmath 1.2.1, python3-scipy 1.10.1):
    /usr/bin/python3 tests/reference/noncentral_t_far_reference.py
Each value is the 40-digit mpmath integral of Phi(t s / sqrt(df) - ncp) against the chi density with
df degrees of freedom (the definition T = (Z + ncp) / sqrt(V / df)), the same route as
t_family_reference.py's nct_cdf, with the integration split where the Phi factor steps
(s = ncp sqrt(df) / t, width sqrt(df) / |t|), which is needed when t and ncp are large.
Printed as [t, df, ncp, F] rows to paste into the test.
"""
import mpmath as mp
from scipy import stats

mp.mp.dps = 40


def nct_cdf(t, df, ncp):
    t, df, ncp = mp.mpf(t), mp.mpf(df), mp.mpf(ncp)
    logc = (1 - df / 2) * mp.log(2) - mp.loggamma(df / 2)

    def integrand(s):
        if s == 0:
            return mp.mpf(0)
        return mp.ncdf(t * s / mp.sqrt(df) - ncp) * mp.exp(logc + (df - 1) * mp.log(s) - s * s / 2)

    mode = mp.sqrt(max(df - 1, mp.mpf('0.5')))
    pts = {mp.mpf(0), mode / 4, mode / 2, mode, mode + 2, mode + 5, mode + 10}
    step = ncp * mp.sqrt(df) / t
    width = mp.sqrt(df) / abs(t)
    for k in (-40, -10, -3, -1, 0, 1, 3, 10, 40):
        p = step + k * width
        if p > 0:
            pts.add(p)
    return mp.quad(integrand, sorted(pts) + [mp.inf])


def f17(x):
    return mp.nstr(x, 17, min_fixed=-30, max_fixed=30)


# 2 v 2 at alpha 1e-11: the critical t at df 2 (scipy's Boost quantile nct.ppf(p, df, 0)).
tc = float(stats.nct.ppf(1 - 5e-12, 2, 0))
print('# critical t, df 2, alpha 1e-11 two-sided:', repr(tc))
cases = [
    (tc, 2, 2.0e5), (tc, 2, 3.0e5), (tc, 2, 4.0e5), (tc, 2, 6.0e5), (-tc, 2, 3.0e5),
    (1500.0, 10, 1499.0), (2600.0, 10, 2500.0), (-2500.0, 5, -2200.0), (3000.0, 30, 2980.0),
    (2.0e8, 2, 2.5e8), (50.0, 4, 2500.0), (1.0e5, 60, 9.9e4),
]
for t, d, c in cases:
    print('[%r, %r, %r, %s],' % (t, d, c, f17(nct_cdf(t, d, c))))


def t2_upper(alpha):
    """t_{1 - alpha/2} at df 2 in closed form: t_p = (2p - 1) / sqrt(2 p (1 - p)), from p = alpha/2 exactly."""
    p = mp.mpf(alpha) / 2
    return (1 - 2 * p) / mp.sqrt(2 * p * (1 - p))


def mde_2v2(alpha, power='0.8'):
    """Minimum detectable effect at 2 v 2 (df 2, ncp = d): power(d) = 1 - F(tc; 2, d) + F(-tc; 2, d)."""
    tc = t2_upper(alpha)
    def f(d):
        return 1 - nct_cdf(tc, 2, d) + nct_cdf(-tc, 2, d) - mp.mpf(power)
    return mp.findroot(f, (tc, 2 * tc), solver='anderson')


print('# minimum detectable effect at 2 v 2, power 0.8: alpha, critical t, d')
for alpha in ('1e-11', '1e-15', '1e-40'):
    print(alpha, f17(t2_upper(alpha)), f17(mde_2v2(alpha)))
