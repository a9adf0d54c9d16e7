"""Recomputes every p value and partial eta squared written in the demo manuscripts' sources.

Run with Debian's Python (it has SciPy): /usr/bin/python3 corpus-demo/sources/values.py
Prints each result with the exact p, so correct reports can be checked and
kept away from rounding edges, and planted mistakes can be confirmed wrong.
"""
from scipy import stats

# (document, label, kind, df, value, written p)
RESULTS = [
    # orchard-noise-vigilance
    ("orchard", "noise main F", "F", (2, 87), 5.43, ".006"),
    ("orchard", "linear contrast F", "F", (1, 87), 10.12, ".002"),
    ("orchard", "planted: F p wrong", "F", (1, 87), 2.95, ".019"),
    ("orchard", "t quiet vs intermittent", "t", (58,), 3.12, ".003"),
    ("orchard", "t steady vs quiet", "t", (58,), 1.48, ".144"),
    ("orchard", "chi2 lapses", "chi2", (2,), 6.84, ".033"),
    ("orchard", "r sleep-hits", "r", (88,), 0.29, ".006"),
    ("orchard", "planted: r p wrong", "r", (88,), -0.17, ".011"),
    ("orchard", "footnote t", "t", (84,), 2.21, ".030"),
    # tidepool-volunteer-persistence
    ("tidepool", "framing F", "F", (1, 116), 8.94, ".003"),
    ("tidepool", "membership F", "F", (1, 116), 0.62, ".433"),
    ("tidepool", "interaction F", "F", (1, 116), 4.51, ".036"),
    ("tidepool", "t simple effect", "t", (58,), 3.37, ".001"),
    ("tidepool", "planted: t p wrong", "t", (58,), 0.88, ".038"),
    ("tidepool", "chi2 return", "chi2", (1,), 5.26, ".022"),
    ("tidepool", "r hours", "r", (118,), 0.34, "< .001"),
    ("tidepool", "planted: chi2 p wrong", "chi2", (3,), 4.12, ".042"),
    # lantern-reading-fluency
    ("lantern", "session F", "F", (2, 142), 12.64, "< .001"),
    ("lantern", "group F", "F", (1, 71), 4.83, ".031"),
    ("lantern", "interaction F", "F", (2, 142), 3.41, ".036"),
    ("lantern", "t follow-up", "t", (71,), 2.56, ".013"),
    ("lantern", "r fluency-comprehension", "r", (71,), 0.41, "< .001"),
    ("lantern", "chi2 completion", "chi2", (1,), 0.94, ".332"),
    ("lantern", "planted: F p wrong", "F", (2, 142), 2.18, ".021"),
    ("lantern", "planted: t p wrong", "t", (71,), 1.73, ".008"),
    # gravel-path-wayfinding
    ("gravel", "cue F", "F", (2, 93), 7.31, ".001"),
    ("gravel", "t map vs none", "t", (62,), 3.58, "< .001"),
    ("gravel", "t landmark vs none", "t", (62,), 2.14, ".036"),
    ("gravel", "chi2 route choice", "chi2", (2,), 9.47, ".009"),
    ("gravel", "r confidence-error", "r", (94,), -0.27, ".008"),
    ("gravel", "planted: F p wrong", "F", (1, 93), 3.61, ".006"),
    ("gravel", "planted: chi2 p wrong", "chi2", (1,), 2.37, ".024"),
]

def p_of(kind, df, value):
    if kind == "F":
        return stats.f.sf(value, *df)
    if kind == "t":
        return 2 * stats.t.sf(abs(value), df[0])
    if kind == "chi2":
        return stats.chi2.sf(value, df[0])
    if kind == "r":
        n2 = df[0]
        t = value * (n2 / (1 - value * value)) ** 0.5
        return 2 * stats.t.sf(abs(t), n2)
    raise ValueError(kind)

def partial_eta(df1, df2, f):
    return f * df1 / (f * df1 + df2)

if __name__ == "__main__":
    import scipy
    print(f"SciPy {scipy.__version__}")
    for document, label, kind, df, value, written in RESULTS:
        p = p_of(kind, df, value)
        extra = f" etap2={partial_eta(df[0], df[1], value):.4f}" if kind == "F" else ""
        print(f"{document:9} {label:28} {kind}{df} = {value}: p = {p:.5f} (written {written}){extra}")
