#!/usr/bin/python3
"""Recompute every number reported in the plumbline demo corpus.

Run with Debian's Python (SciPy 1.10.1):

    /usr/bin/python3 corpus-demo/tools/compute_values.py

Nothing here is random: each statistic below was chosen by hand, and every p,
effect size and confidence interval printed in the manuscripts is derived from
it here. For each result the script prints the recomputed values, how the
manuscript writes the result, and, for planted mistakes, what is wrong.

Conventions (APA style):
  * statistics to 2 decimals; p to 3 decimals without a leading zero
    (a few to 2 decimals); "p < .001" when p < .001;
  * all p values two-tailed unless a manuscript states otherwise;
  * partial eta squared  = F*df1 / (F*df1 + df2);
  * Cohen's d (independent groups) = t * sqrt(1/n1 + 1/n2);
  * phi / Cramer's V    = sqrt(chi2 / (N * (k - 1))), k = min(rows, cols);
  * r is tested with t = r * sqrt(df) / sqrt(1 - r^2), df = N - 2;
  * CI for partial eta squared: invert the noncentral F distribution for the
    noncentrality lambda (root finding with scipy.stats.ncf), then convert
    lambda to partial eta squared with lambda / (lambda + df1 + df2 + 1).
    A 90% CI uses the 5% and 95% quantiles; lower limit 0 when p > .05.

The script also warns when a correctly reported value sits close to a rounding
boundary, so that a correct result cannot look inconsistent by accident.
"""

import math
import sys

from scipy import stats
from scipy.optimize import brentq


# --------------------------------------------------------------------------
# basic computations
# --------------------------------------------------------------------------

def p_F(F, df1, df2):
    return stats.f.sf(F, df1, df2)


def p_t(t, df):
    return 2 * stats.t.sf(abs(t), df)


def p_r(r, df):
    t = r * math.sqrt(df) / math.sqrt(1 - r * r)
    return p_t(t, df)


def p_chi2(x, df):
    return stats.chi2.sf(x, df)


def p_z(z):
    return 2 * stats.norm.sf(abs(z))


def partial_eta(F, df1, df2):
    return F * df1 / (F * df1 + df2)


def cohens_d(t, n1, n2):
    return abs(t) * math.sqrt(1 / n1 + 1 / n2)


def cramers_v(chi2, n, k=2):
    return math.sqrt(chi2 / (n * (k - 1)))


def eta_ci(F, df1, df2, level=0.90):
    """CI for partial eta squared by inverting the noncentral F."""
    tail = (1 - level) / 2

    def cdf(lam):
        return stats.ncf.cdf(F, df1, df2, lam) if lam > 0 else stats.f.cdf(F, df1, df2)

    def to_eta(lam):
        return lam / (lam + df1 + df2 + 1)

    # lower limit: cdf(F; lambda) = 1 - tail
    if cdf(0) < 1 - tail:
        lo = 0.0
    else:
        lo = brentq(lambda lam: cdf(lam) - (1 - tail), 0, 1000)
    if cdf(0) < tail:
        hi = 0.0
    else:
        hi = brentq(lambda lam: cdf(lam) - tail, 0, 1000)
    return to_eta(lo), to_eta(hi)


# --------------------------------------------------------------------------
# formatting
# --------------------------------------------------------------------------

def nolead(x, dec):
    s = f"{x:.{dec}f}"
    if s.startswith("0."):
        s = s[1:]
    elif s.startswith("-0."):
        s = "-" + s[2:]
    return s


def fmt_p(p, dec=3):
    if p < 0.001:
        return "p < .001"
    return "p = " + nolead(p, dec)


def edge(x, dec):
    """Distance of x from the nearest rounding boundary, in units of the last place."""
    scaled = abs(x) * 10 ** dec
    return abs((scaled - math.floor(scaled)) - 0.5)


WARNINGS = []


def check_edge(label, x, dec, what):
    if x < 0.001 and what == "p":
        return
    if edge(x, dec) < 0.10:
        WARNINGS.append(f"{label}: {what} = {x:.6f} is within 0.1 units of a rounding boundary at {dec} decimals")


# --------------------------------------------------------------------------
# the corpus
# --------------------------------------------------------------------------
# Each entry: (file, label, kind, parameters, options).
#   kind F:    (F, df1, df2)          options: eta, ci (level), pdec
#   kind t:    (t, df)                options: n1, n2 (for d), pdec
#   kind r:    (r, df)
#   kind chi2: (x, df, N or None)     options: v_k (for phi / V)
#   kind z:    (z,)
# 'planted' describes what the manuscript writes instead of the true value.

C = []


def add(file, label, kind, params, **opt):
    C.append(dict(file=file, label=label, kind=kind, params=params, opt=opt))


# 1. sleep-and-recall.md -- between subjects, N = 90, 30 per group
f = "sleep-and-recall.md"
add(f, "age check", "F", (0.42, 2, 87))
add(f, "recall main effect (eta p, 90% CI)", "F", (8.44, 2, 87), eta=True, ci=0.90)
add(f, "nap vs wake", "t", (3.92, 58), n1=30, n2=30)
add(f, "nap vs rest [PLANTED d = 1.20]", "t", (2.40, 58), n1=30, n2=30,
    planted="d written as 1.20; t*sqrt(1/30+1/30) = 0.62")
add(f, "rest vs wake", "t", (1.46, 58), n1=30, n2=30)
add(f, "ANCOVA covariate [PLANTED p = .000]", "F", (18.90, 1, 86), eta=True,
    planted="p written as .000")
add(f, "ANCOVA group, true F = 6.31 [PLANTED typed 3.61]", "F", (6.31, 2, 86),
    planted="F typed 3.61; p for 3.61 is shown below")
add(f, "  ... what 3.61 would give", "F", (3.61, 2, 86))
add(f, "strategy x group", "chi2", (10.20, 4, 90))
add(f, "imagery by nap [PLANTED p < .05]", "chi2", (5.10, 2, 90),
    planted="written p < .05; true p is about .08")
add(f, "sex x group", "chi2", (0.58, 2, 90))
add(f, "nap duration and recall (n = 30)", "r", (0.43, 28))

# 2. classroom-feedback.txt -- between subjects, N = 120 (40 per condition), alpha = .01
f = "classroom-feedback.txt"
add(f, "ANCOVA covariate", "F", (64.20, 1, 116), eta=True)
add(f, "ANCOVA condition", "F", (5.85, 2, 116), eta=True)
add(f, "spoken vs grade-only", "t", (3.52, 116))
add(f, "written vs grade-only [PLANTED p = .004]", "t", (2.30, 116),
    planted="p written as .004 and called significant at alpha = .01")
add(f, "time on feedback [PLANTED df 124 > N]", "t", (2.95, 124),
    planted="df 124 although N = 120 (true df 78); p computed from df 124")
add(f, "  ... same with df 78", "t", (2.95, 78))
add(f, "completion t [PLANTED p = 1.20]", "t", (1.57, 78),
    planted="p written as 1.20 (true .120)")
add(f, "completion chi2 (V, 2x3)", "chi2", (9.87, 2, 120), v_k=2)
add(f, "read feedback z", "z", (2.74,))
add(f, "prior attainment r", "r", (0.60, 118))
add(f, "attitude spoken vs written", "t", (2.90, 78), n1=40, n2=40)

# 3. cueing-alerting-tones.md -- within subjects, 30 participants, Greenhouse-Geisser
f = "cueing-alerting-tones.md"
add(f, "cue validity", "F", (48.60, 1, 29), eta=True)
add(f, "tone, GG corrected df", "F", (9.12, 1.64, 47.56), eta=True)
add(f, "tone x cue [PLANTED corrected p, uncorrected df]", "F", (3.40, 2, 58),
    planted="p written as .059 = p for df (1.40, 40.60), epsilon = .70")
add(f, "  ... with epsilon .70", "F", (3.40, 1.40, 40.60))
add(f, "high vs none", "t", (4.35, 29))
add(f, "low vs none", "t", (2.21, 29))
add(f, "high vs low", "t", (-1.95, 29))
add(f, "errors [PLANTED eta p = .31]", "F", (5.60, 1, 29), eta=True,
    planted="partial eta squared written as .31")
add(f, "accuracy [PLANTED p = .015]", "t", (1.48, 29),
    planted="p written as .015 (true .150)")
add(f, "cueing effect and lapses scale", "r", (0.47, 28))
add(f, "tone on errors, GG", "F", (1.85, 1.71, 49.59), eta=True)

# 4. stillpoint-breathing-app.md -- between subjects RCT, N = 84 (42 + 42), one-tailed for directional
f = "stillpoint-breathing-app.md"
add(f, "stress ANCOVA (90% CI)", "F", (9.30, 1, 81), eta=True, ci=0.90)
add(f, "sleepiness ANCOVA [PLANTED CI]", "F", (4.90, 1, 81), eta=True, ci=0.90,
    planted="90% CI written as [.15, .38]")
add(f, "fatigue ANCOVA [PLANTED eta p = .21]", "F", (6.75, 1, 81), eta=True,
    planted="partial eta squared written as .21")
add(f, "satisfaction one-tailed [PLANTED halved, declared]", "t", (2.60, 82), n1=42, n2=42,
    planted="p written as .006, the one-tailed p; paper declares one-tailed tests")
add(f, "HRV", "t", (0.86, 82), n1=42, n2=42)
add(f, "usage and stress change (app arm)", "r", (-0.37, 40))
add(f, "dropout", "chi2", (0.74, 1, None))
add(f, "mood ANCOVA (95% CI)", "F", (13.20, 1, 81), eta=True, ci=0.95)

# 5. eye-signage-handwashing.txt -- field observation (N = 640 visits) + vendor survey (66 vendors)
f = "eye-signage-handwashing.txt"
add(f, "washing by sign (V, 2x3)", "chi2", (14.30, 2, 640), v_k=2)
add(f, "eyes vs text z", "z", (3.12,))
add(f, "text vs none z", "z", (1.05,))
add(f, "soap use 2x2 (phi)", "chi2", (6.05, 1, 640), v_k=2)
add(f, "effectiveness, true F 5.71 [PLANTED typed 2.71]", "F", (5.71, 2, 63),
    planted="F typed 2.71; the p belongs to 5.71")
add(f, "  ... what 2.71 would give", "F", (2.71, 2, 63))
add(f, "cleanliness", "F", (4.15, 2, 63), eta=True)
add(f, "crowding [PLANTED p copied from cleanliness]", "F", (1.12, 2, 63),
    planted="p = .020 copied from the cleanliness result")
add(f, "time at sink [PLANTED negative F]", "F", (3.30, 2, 63),
    planted="F written as -3.30")
add(f, "hot food vs drinks [PLANTED halved F p]", "F", (3.20, 1, 64),
    planted="p written as .039 = half the true p")
add(f, "vendor years and rating", "r", (0.29, 64))

# 6. fernhollow-paired-reading.txt -- mixed design, 15 pupils (3 groups of 5) x 3 terms
f = "fernhollow-paired-reading.txt"
add(f, "Mauchly chi2", "chi2", (1.88, 2, None))
add(f, "term main effect", "F", (38.50, 2, 24), eta=True)
add(f, "group main effect, true df (2, 12) [PLANTED typed (2, 15)]", "F", (4.50, 2, 12),
    planted="df2 typed as N = 15; p computed from df (2, 12)")
add(f, "  ... with df (2, 15)", "F", (4.50, 2, 15))
add(f, "group x term", "F", (3.95, 4, 24), eta=True)
add(f, "echo group autumn vs summer", "t", (6.10, 4))
add(f, "usual practice autumn vs summer", "t", (2.05, 4))
add(f, "baseline and gain, true df 13 [PLANTED typed r(15)]", "r", (0.58, 13),
    planted="df typed as N = 15; p computed from df 13")
add(f, "  ... with df 15", "r", (0.58, 15))
add(f, "teacher rating", "r", (0.71, 13))

# 7. carbon-label-trust.md -- 2 x 2 between subjects, N = 96 (24 per cell)
f = "carbon-label-trust.md"
add(f, "manipulation check [PLANTED df 98 >= N]", "t", (9.85, 98),
    planted="df 98 although N = 96 (true df 94)")
add(f, "trust: label [PLANTED eta labelled plain]", "F", (12.40, 1, 92), eta=True,
    planted="written eta squared (plain) = partial value")
add(f, "trust: source [PLANTED eta labelled plain]", "F", (7.20, 1, 92), eta=True,
    planted="written eta squared (plain) = partial value")
add(f, "trust: interaction [PLANTED eta labelled plain]", "F", (4.60, 1, 92), eta=True,
    planted="written eta squared (plain) = partial value")
add(f, "simple effect of format, independent source", "F", (16.00, 1, 92))
add(f, "simple effect of format, manufacturer source", "F", (0.95, 1, 92))
add(f, "purchase intention [PLANTED eta p = 1.30]", "F", (13.75, 1, 92), eta=True,
    planted="partial eta squared written as 1.30 (true .13)")
add(f, "planned contrast, t = sqrt(6.10) [PLANTED t written as 6.10]", "t", (math.sqrt(6.10), 92),
    planted="t written as 6.10, which is F = t^2; p belongs to t = 2.47")
add(f, "choice 2x2 (phi)", "chi2", (5.50, 1, 96), v_k=2)
add(f, "trust and intention", "r", (0.52, 94))
add(f, "trust and recommending", "r", (0.47, 94))
add(f, "source on willingness to pay", "F", (2.64, 1, 92), eta=True)

# 8. brannock-commute-survey.txt -- cross-sectional, N = 212
f = "brannock-commute-survey.txt"
add(f, "commute minutes and stress", "r", (0.31, 210))
add(f, "cyclists subsample, true r = .112 [PLANTED r = 1.12]", "r", (0.112, 48),
    planted="r written as 1.12")
add(f, "stress by mode [PLANTED p = .000]", "F", (19.80, 2, 209), eta=True,
    planted="p written as .000")
add(f, "cyclists vs drivers [PLANTED p = .021]", "t", (3.10, 210),
    planted="p written as .021 (true .002)")
add(f, "night vs day shift [PLANTED halved t p]", "t", (2.45, 120),
    planted="p written as .008 = half the two-tailed p")
add(f, "sleep hours, cyclists vs others", "t", (-2.76, 210))
add(f, "Fisher z, correlations", "z", (2.21,))
add(f, "mode x shift (V, 3x2)", "chi2", (11.40, 2, 212), v_k=2)
add(f, "sex x mode 2x2", "chi2", (2.95, 1, None))
add(f, "bus vs car stress", "t", (1.32, 150))

# 9. heathmoor-ferry-queues.txt -- between subjects, N = 120 (40 per sign condition), decimal commas
#    (H results are Kruskal-Wallis tests, tested as chi-square with k - 1 df)
f = "heathmoor-ferry-queues.txt"
add(f, "sign condition", "F", (5.12, 2, 117), eta=True)
add(f, "countdown vs none", "t", (2.40, 78), n1=40, n2=40)
add(f, "fixed vs none", "t", (1.12, 78))
add(f, "waiting estimates, Kruskal-Wallis H", "chi2", (9.84, 2, None))
add(f, "gates, Kruskal-Wallis H [PLANTED p = .025]", "chi2", (4.10, 3, 120),
    planted="p written as ,025 (true .251)")
add(f, "earlier use [PLANTED p = 0,000]", "F", (23.20, 1, 116), eta=True,
    planted="p written as 0,000")
add(f, "express lane 2x2", "chi2", (4.62, 1, 120))
add(f, "earlier trips and satisfaction", "r", (0.24, 118))
add(f, "luggage, countdown vs fixed [PLANTED halved p]", "t", (2.05, 78),
    planted="p written as ,022 = half the two-tailed p")
add(f, "regression of satisfaction (R2 = F df1 / (F df1 + df2))", "F", (6.12, 3, 116), eta=True)
add(f, "regression of waiting estimates [PLANTED adjusted R2 as R2]", "F", (5.30, 2, 117), eta=True,
    planted="R2 written as ,07 = adjusted R2 (R2 = .083)")


def describe(e):
    k, par, opt = e["kind"], e["params"], e["opt"]
    out = {}
    if k == "F":
        F, a, b = par
        p = p_F(abs(F), a, b)
        out["text"] = f"F({a:g}, {b:g}) = {F:.2f}, {fmt_p(p, opt.get('pdec', 3))}"
        if opt.get("eta"):
            eta = partial_eta(F, a, b)
            out["text"] += f", ηp2 = {nolead(eta, 2)}"
            out["eta"] = eta
            check_edge(e["label"], eta, 2, "partial eta squared")
        if opt.get("ci"):
            lo, hi = eta_ci(F, a, b, opt["ci"])
            out["text"] += f", {int(opt['ci'] * 100)}% CI [{nolead(lo, 2)}, {nolead(hi, 2)}]"
            out["ci"] = (lo, hi)
            check_edge(e["label"], lo, 2, "CI low")
            check_edge(e["label"], hi, 2, "CI high")
    elif k == "t":
        t, df = par
        p = p_t(t, df)
        out["text"] = f"t({df:g}) = {t:.2f}, {fmt_p(p, opt.get('pdec', 3))}"
        if "n1" in opt:
            d = cohens_d(t, opt["n1"], opt["n2"])
            out["text"] += f", d = {d:.2f}"
            out["d"] = d
            check_edge(e["label"], d, 2, "d")
        out["one-tailed p"] = p / 2
    elif k == "r":
        r, df = par
        p = p_r(r, df)
        out["text"] = f"r({df}) = {nolead(r, 2)}, {fmt_p(p, opt.get('pdec', 3))}"
    elif k == "chi2":
        x, df, n = par
        p = p_chi2(x, df)
        ntext = f", N = {n}" if n else ""
        out["text"] = f"χ2({df}{ntext}) = {x:.2f}, {fmt_p(p, opt.get('pdec', 3))}"
        if opt.get("v_k") and n:
            v = cramers_v(x, n, opt["v_k"])
            out["text"] += f", V/phi = {nolead(v, 2)}"
            out["V"] = v
            check_edge(e["label"], v, 2, "V/phi")
    elif k == "z":
        (z,) = par
        p = p_z(z)
        out["text"] = f"z = {z:.2f}, {fmt_p(p, opt.get('pdec', 3))}"
    out["p"] = p
    if "planted" not in opt and not e["label"].startswith("  ..."):
        check_edge(e["label"], p, opt.get("pdec", 3), "p")
    return out


def main():
    current = None
    for e in C:
        if e["file"] != current:
            current = e["file"]
            print(f"\n=== {current}")
        out = describe(e)
        extra = ""
        if "planted" in e["opt"]:
            extra = f"\n      PLANTED: {e['opt']['planted']}"
        print(f"  {e['label']:<62} p = {out['p']:.5f}   {out['text']}{extra}")
        for key in ("eta", "d", "V"):
            if key in out:
                print(f"      {key} = {out[key]:.4f}")
        if "ci" in out:
            print(f"      CI = [{out['ci'][0]:.4f}, {out['ci'][1]:.4f}]")
        if e["kind"] == "t" and "planted" in e["opt"] and "halved" in e["label"]:
            print(f"      one-tailed p = {out['one-tailed p']:.5f}")
        if e["kind"] == "F" and "halved" in e["label"]:
            print(f"      half of p = {out['p'] / 2:.5f}")
    if WARNINGS:
        print("\nROUNDING-EDGE WARNINGS:")
        for w in WARNINGS:
            print("  " + w)
        return 1
    print("\nNo correct value lies near a rounding boundary.")
    return 0


if __name__ == "__main__":
    sys.exit(main())
