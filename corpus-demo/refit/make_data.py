"""Invented demo study for `plumbline refit`: a walking-route trial.

Run with Debian's Python (python3-numpy, python3-pandas, python3-statsmodels):

    /usr/bin/python3 corpus-demo/refit/make_data.py

Seeded: writes the same files on every run.

- harbour-walks.csv: 150 participants; route (harbour, park, indoor) x pace
  (self, guided), a loneliness rating 1-5 (6 = don't know, 7 = refused,
  8 = not asked) and a mood score 0-40 (99 = questionnaire not returned).
- harbour-walks.analysis.json: the analysis the authors describe (ANCOVA,
  type III sums of squares, sum-to-zero coding, codes 99 and 6-8 missing).
- harbour-walks-manuscript.md: the manuscript. Its ANOVA table and written
  results carry one planted slip: the missing-value codes were left in the
  data as numbers (99 analysed as a mood score, 6-8 as loneliness ratings),
  so the table has error df 143 (all 150 rows) instead of 127. The slipped
  numbers are computed here with statsmodels, so they are what that slip
  really gives; the correct table is printed for reference.
"""
import json
import os

import numpy as np
import pandas as pd
import statsmodels
import statsmodels.api as sm
import statsmodels.formula.api as smf

HERE = os.path.dirname(os.path.abspath(__file__))
NAME = "harbour-walks"
rng = np.random.default_rng(20250317)

ROUTES = ["harbour", "park", "indoor"]
PACES = ["self", "guided"]
SIZES = {("harbour", "self"): 26, ("harbour", "guided"): 24, ("park", "self"): 25,
         ("park", "guided"): 27, ("indoor", "self"): 23, ("indoor", "guided"): 25}


def make_data():
    rows = []
    for (route, pace), n in SIZES.items():
        for _ in range(n):
            lonely = int(rng.integers(1, 6))
            mood = (22 + {"harbour": 2.5, "park": 1.5, "indoor": 0.0}[route] + (1.2 if pace == "guided" else 0.0)
                    + (1.5 if (route, pace) == ("harbour", "guided") else 0.0) - 1.4 * (lonely - 3) + rng.normal(0, 3.2))
            rows.append({"route": route, "pace": pace, "loneliness": lonely, "mood": int(np.clip(round(mood), 0, 40))})
    df = pd.DataFrame(rows).sample(frac=1, random_state=7).reset_index(drop=True)
    df.insert(0, "pid", [f"HW{i + 1:03d}" for i in range(len(df))])
    # Missing-value codes: 8 mood questionnaires not returned, 10 loneliness answers not given.
    mood_missing = rng.choice(len(df), size=8, replace=False)
    df.loc[mood_missing, "mood"] = 99
    lonely_missing = rng.choice(np.setdiff1d(np.arange(len(df)), mood_missing[:5]), size=10, replace=False)
    df.loc[lonely_missing, "loneliness"] = rng.choice([6, 7, 8], size=10, p=[0.6, 0.25, 0.15])
    return df


FORMULA = "mood ~ C(route, Sum) * C(pace, Sum) + loneliness"
TERMS = {"route": "C(route, Sum)", "pace": "C(pace, Sum)", "route:pace": "C(route, Sum):C(pace, Sum)", "loneliness": "loneliness"}


def anova(data):
    fit = smf.ols(FORMULA, data=data).fit()
    res = sm.stats.anova_lm(fit, typ=3)
    resid = res.loc["Residual"]
    out = []
    for term, name in TERMS.items():
        r = res.loc[name]
        out.append({"term": term, "ss": float(r["sum_sq"]), "df": int(r["df"]), "ms": float(r["sum_sq"] / r["df"]),
                    "F": float(r["F"]), "p": float(r["PR(>F)"]),
                    "pes": float(r["sum_sq"] / (r["sum_sq"] + resid["sum_sq"]))})
    return out, {"ss": float(resid["sum_sq"]), "df": int(resid["df"]), "ms": float(resid["sum_sq"] / resid["df"])}


def p_text(p):
    return "< .001" if p < 0.001 else ("%.3f" % p)[1:]


def written(row, error_df):
    p = row["p"]
    p_part = "p < .001" if p < 0.001 else "p = " + p_text(p)
    return "F(%d, %d) = %.2f, %s, ηp² = %s" % (row["df"], error_df, row["F"], p_part, ("%.3f" % row["pes"])[1:])


def was_(row, yes, no):
    return yes if row["p"] < .05 else no


def discussion(by):
    if by["route"]["p"] >= .05 and by["pace"]["p"] >= .05:
        return "In this sample, mood after six weeks depended neither on the walking route nor on its pace."
    return "Mood after six weeks depended on how the programme was walked (see Table 1)."


def main():
    df = make_data()
    df.to_csv(os.path.join(HERE, NAME + ".csv"), index=False)
    spec = {"factors": {"route": {"levels": ROUTES}, "pace": {"levels": PACES}}, "covariates": ["loneliness"],
            "missing": {"mood": "99", "loneliness": "6-8"}, "model": "mood ~ route * pace + loneliness",
            "type": 3, "coding": "sum"}
    with open(os.path.join(HERE, NAME + ".analysis.json"), "w") as fh:
        json.dump(spec, fh, indent=2)
        fh.write("\n")

    read = pd.read_csv(os.path.join(HERE, NAME + ".csv"))
    clean = read[(read["mood"] != 99) & (~read["loneliness"].between(6, 8))].reset_index(drop=True)
    correct, correct_resid = anova(clean)
    slipped, slipped_resid = anova(read)  # the slip: codes analysed as numbers

    by = {r["term"]: r for r in slipped}
    e = slipped_resid["df"]
    table = ["| Source | SS | df | MS | F | p | ηp² |", "|---|---:|---:|---:|---:|---:|---:|"]
    labels = {"route": "Route", "pace": "Pace", "route:pace": "Route × Pace", "loneliness": "Loneliness"}
    for term in ["loneliness", "route", "pace", "route:pace"]:
        r = by[term]
        table.append("| %s | %.2f | %d | %.2f | %.2f | %s | %s |" % (labels[term], r["ss"], r["df"], r["ms"], r["F"], p_text(r["p"]),
                                                                     ("%.3f" % r["pes"])[1:]))
    table.append("| Error | %.2f | %d | %.2f | | | |" % (slipped_resid["ss"], e, slipped_resid["ms"]))

    manuscript = f"""# Harbour walks: route and pace of a six-week walking programme and mood

*Invented manuscript for the plumbline refit demo. The study, the data and the authors do not exist.*

## Method

We randomised 150 adults who had signed up for a community walking programme to one of three
routes (harbour front, city park, indoor track) and to a self-paced or a guided pace. Before the
programme, participants rated their loneliness from 1 (never lonely) to 5 (always lonely); the form
also offered "don't know" (coded 6), "refused" (7) and "not asked" (8). After six weeks they
completed a mood questionnaire (0-40; a questionnaire that was not returned is coded 99). The raw
data are in harbour-walks.csv.

We analysed mood in a 3 (route) × 2 (pace) analysis of covariance with loneliness as covariate,
using type III sums of squares.

## Results

The covariate loneliness {was_(by["loneliness"], "was related", "was not related")} to mood after the
programme, {written(by["loneliness"], e)}. The main effect of route
{was_(by["route"], "was significant", "was not significant")}, {written(by["route"], e)}. The main effect of pace
{was_(by["pace"], "was significant", "was not significant")}, {written(by["pace"], e)}. The route × pace
interaction {was_(by["route:pace"], "was significant", "was not significant")}, {written(by["route:pace"], e)}. Table 1 gives the full analysis.

Table 1. Analysis of covariance of mood after six weeks

{chr(10).join(table)}

## Discussion

{discussion(by)}
"""
    with open(os.path.join(HERE, NAME + "-manuscript.md"), "w") as fh:
        fh.write(manuscript)

    print("statsmodels", statsmodels.__version__)
    print("rows", len(read), "analysed correctly", len(clean), "dropped", len(read) - len(clean))
    print("correct (codes removed):")
    for r in correct:
        print("  %-11s SS %9.3f df %d F %7.3f p %.4f pes %.4f" % (r["term"], r["ss"], r["df"], r["F"], r["p"], r["pes"]))
    print("  residual SS %.3f df %d" % (correct_resid["ss"], correct_resid["df"]))
    print("slipped (codes left in):")
    for r in slipped:
        print("  %-11s SS %9.3f df %d F %7.3f p %.4f pes %.4f" % (r["term"], r["ss"], r["df"], r["F"], r["p"], r["pes"]))
    print("  residual SS %.3f df %d" % (slipped_resid["ss"], slipped_resid["df"]))


if __name__ == "__main__":
    main()
