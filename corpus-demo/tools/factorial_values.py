#!/usr/bin/python3
"""Numbers of the invented factorial demo (corpus-demo/harbour-choir-warmups.md), from its cell statistics.

    /usr/bin/python3 corpus-demo/tools/factorial_values.py

The manuscript prints the cell means, SDs and ns of a 2 (format) x 3 (warm-up)
between-subjects design. For each cell, n raw scores are constructed whose
mean and SD (ddof = 1) are exactly the printed ones (standardised seeded
normal draws, rescaled); statsmodels' ols and anova_lm (typ = 1, 2, 3, with
sum-to-zero coding for type III) then give the ANOVA of those scores, which
is the ANOVA the printed cells imply. The script prints each effect's F, p
and partial eta squared under each type, and the Bonferroni-adjusted
pairwise comparisons of the warm-up levels' observed (n-weighted) marginal
means, t on the full model's error mean square and df (scipy.stats.t.sf),
that the manuscript reports.

Used by check_corpus.py (factorial_tables) to verify the manuscript.
"""

import itertools
import sys

import numpy
import pandas
import statsmodels.formula.api as smf
from scipy import stats
from statsmodels.stats.anova import anova_lm

sys.dont_write_bytecode = True

FACTORS = ["format", "warmup"]
# (format, warm-up): n, mean, SD as printed in the manuscript's Table 1.
CELLS = {
    ("In person", "None"): (22, "71.42", "8.31"),
    ("In person", "Breathing"): (18, "76.95", "7.64"),
    ("In person", "Vocal"): (20, "80.18", "8.02"),
    ("Hybrid", "None"): (17, "68.73", "9.12"),
    ("Hybrid", "Breathing"): (21, "70.36", "8.57"),
    ("Hybrid", "Vocal"): (22, "77.54", "7.96"),
}


def raw_scores(cells, seed=20261204):
    """Scores with exactly the printed mean and SD in every cell."""
    rng = numpy.random.default_rng(seed)
    rows = []
    for (fmt, warm), (n, mean, sd) in cells.items():
        z = rng.normal(size=n)
        z = (z - z.mean()) / z.std(ddof=1)
        for value in float(mean) + float(sd) * z:
            rows.append({"format": fmt, "warmup": warm, "y": value})
    return pandas.DataFrame(rows)


def anova(cells):
    """{type: {effect name: (df1, df2, F, p, partial eta squared)}}."""
    frame = raw_scores(cells)
    model = smf.ols("y ~ C(format, Sum) * C(warmup, Sum)", data=frame).fit()
    names = {"C(format, Sum)": "Format", "C(warmup, Sum)": "Warm-up", "C(format, Sum):C(warmup, Sum)": "Format x Warm-up"}
    out = {}
    for typ in (1, 2, 3):
        table = anova_lm(model, typ=typ)
        residual = table.loc["Residual"]
        out[typ] = {}
        for name, row in table.iterrows():
            if name in names:
                eta = row["sum_sq"] / (row["sum_sq"] + residual["sum_sq"])
                out[typ][names[name]] = (int(row["df"]), int(residual["df"]), float(row["F"]), float(row["PR(>F)"]), float(eta))
    return out, float(model.mse_resid), int(model.df_resid)


def warmup_comparisons(cells):
    """Bonferroni-adjusted pairwise comparisons of the warm-up levels' observed (n-weighted) marginal means, on the
    full model's error mean square: {(level, level): (t, df, unadjusted p, Bonferroni p)} and the marginal means."""
    _, mse, df = anova(cells)
    levels = ["None", "Breathing", "Vocal"]
    sizes = {level: sum(n for (f, w), (n, _, _) in cells.items() if w == level) for level in levels}
    means = {level: sum(n * float(m) for (f, w), (n, m, _) in cells.items() if w == level) / sizes[level] for level in levels}
    pairs = list(itertools.combinations(levels, 2))
    out = {}
    for a, b in pairs:
        t = (means[a] - means[b]) / (mse * (1 / sizes[a] + 1 / sizes[b])) ** 0.5
        p = 2 * stats.t.sf(abs(t), df)
        out[(a, b)] = (t, df, p, min(1.0, len(pairs) * p))
    return out, means


def main():
    tables, mse, df = anova(CELLS)
    for typ, effects in tables.items():
        print(f"type {typ}")
        for name, (df1, df2, f, p, eta) in effects.items():
            print(f"  {name:<18} F({df1}, {df2}) = {f:.3f}  p = {p:.4f}  partial eta squared = {eta:.3f}")
    print(f"MSE = {mse:.4f} on {df} df")
    comparisons, means = warmup_comparisons(CELLS)
    print("warm-up marginal means (n-weighted): " + ", ".join(f"{level} {mean:.2f}" for level, mean in means.items()))
    for (a, b), (t, df, p, bonferroni) in comparisons.items():
        print(f"  {a} vs {b}: t({df}) = {t:.3f}, unadjusted p = {p:.4f}, Bonferroni p = {bonferroni:.4f}")


if __name__ == "__main__":
    main()
