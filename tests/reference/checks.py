"""The comparison the reference scripts share: compute with scipy, compare the way the vitest test
does, print ok or MISMATCH. Imported by the scripts beside it (run them from the repository root)."""
import numpy as np

MISMATCHES = []


def check(label, got, want, rel=None, digits=None):
    """Compare like the test does: rel -> expectRelative (|a - e| <= rel |e|); digits -> toBeCloseTo
    (|a - e| < 10^-digits / 2); neither -> toBe / toEqual (exact)."""
    got_list = list(got) if isinstance(got, (list, tuple, np.ndarray)) else [got]
    want_list = list(want) if isinstance(want, (list, tuple)) else [want]
    if len(got_list) != len(want_list):
        ok, tol = False, 'length'
    elif rel is not None:
        ok, tol = all(abs(g - w) <= rel * abs(w) for g, w in zip(got_list, want_list)), f'rel {rel:g}'
    elif digits is not None:
        ok, tol = all(abs(g - w) < 10 ** -digits / 2 for g, w in zip(got_list, want_list)), f'toBeCloseTo {digits}'
    else:
        ok, tol = all(g == w for g, w in zip(got_list, want_list)), 'exact'
    shown = [float(g) if isinstance(g, (float, np.floating)) else g for g in got_list]
    print(f"{'ok' if ok else 'MISMATCH':8} {label}: computed {shown if len(shown) > 1 else shown[0]!r}; "
          f"test {want_list if len(want_list) > 1 else want_list[0]!r} ({tol})")
    if not ok:
        MISMATCHES.append(label)
