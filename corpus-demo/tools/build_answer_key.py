#!/usr/bin/python3
"""Write corpus-demo/answer-key.json from the list of planted findings below.

Each finding names a snippet of the manuscript that starts at the statistic's
symbol; the line number is looked up (the snippet must occur exactly once), so
the key stays right when a manuscript is edited. check_corpus.py then verifies
every finding numerically and recomputes every correct result.

    /usr/bin/python3 corpus-demo/tools/build_answer_key.py
"""

import json
import os
import sys

sys.dont_write_bytecode = True  # keep the corpus folder free of __pycache__

HERE = os.path.dirname(os.path.abspath(__file__))
CORPUS = os.path.dirname(HERE)

# (file, snippet starting at the statistic symbol, rule, severity, crossesAlpha, planted)
FINDINGS = [
    # sleep-and-recall.md
    ("sleep-and-recall.md", "t(58) = 2.40, p = .020, d = 1.20", "cohens-d-mismatch", "warn", False,
     "d = 1.20 for t(58) = 2.40 with 30 per group; t*sqrt(1/30 + 1/30) = 0.62"),
    ("sleep-and-recall.md", "F(1, 86) = 18.90, p = .000", "p-reported-as-zero", "warn", False,
     "p written as .000; true p = .00004, should be p < .001"),
    ("sleep-and-recall.md", "F(2, 86) = 3.61, p = .003", "p-value-mismatch", "fail", False,
     "digits transposed: F typed as 3.61 instead of 6.31; p = .003 belongs to 6.31, p for 3.61 is .031"),
    ("sleep-and-recall.md", "χ2(2, N = 90) = 5.10, p < .05", "p-value-mismatch", "fail", True,
     "written p < .05 but chi2(2) = 5.10 gives p = .078"),
    # classroom-feedback.txt (alpha = .01)
    ("classroom-feedback.txt", "t(116) = 2.30, p = .004", "p-value-mismatch", "fail", True,
     "p written as .004 and called significant at the declared alpha = .01; true p = .023"),
    ("classroom-feedback.txt", "t(124) = 2.95, p = .004", "df-exceeds-sample", "fail", False,
     "df = 124 although a total of 120 students took part (true df for 40 vs 40 is 78); p is consistent with the written df"),
    ("classroom-feedback.txt", "t(78) = 1.57, p = 1.20", "impossible-value", "fail", False,
     "p = 1.20 is impossible (decimal point slip for .120)"),
    # cueing-alerting-tones.md (Greenhouse-Geisser stated)
    # The epsilon is printed beside the test, so epsilon-df-mismatch checks the p against it (sphericity-corrected-p
    # would report it without an epsilon).
    ("cueing-alerting-tones.md", "F(2, 58) = 3.40, p = .059", "epsilon-df-mismatch", "note", True,
     "Greenhouse-Geisser-corrected p (epsilon = .70 printed beside it; df 1.40, 40.60 give p = .059) reported with uncorrected df; p for df (2, 58) is .040"),
    ("cueing-alerting-tones.md", "F(1, 29) = 5.60, p = .025, ηp² = .31", "partial-eta-squared-mismatch", "fail", False,
     "partial eta squared written as .31; F*df1/(F*df1+df2) = .16"),
    ("cueing-alerting-tones.md", "t(29) = 1.48, p = .015", "p-value-mismatch", "fail", True,
     "wrong p: .015 written for .150 (decimal slip); text says the blocks did not differ"),
    # stillpoint-breathing-app.md (one-tailed tests declared for directional hypotheses)
    ("stillpoint-breathing-app.md", "F(1, 81) = 4.90, p = .030, ηp2 = .06, 90% CI [.15, .38]",
     "effect-size-interval-mismatch", "warn", False,
     "90% CI written as [.15, .38]; noncentral-F inversion gives [.00, .15] (does not even contain the point estimate .06)"),
    ("stillpoint-breathing-app.md", "F(1, 81) = 6.75, p = .011, ηp2 = .21", "partial-eta-squared-mismatch", "fail", False,
     "partial eta squared written as .21; F*df1/(F*df1+df2) = .08"),
    ("stillpoint-breathing-app.md", "t(82) = 2.60, p = .006, d = 0.57", "halved-p", "note", False,
     "one-tailed p (.006 = .011 / 2); the paper declares one-tailed tests for directional hypotheses (H2)"),
    # eye-signage-handwashing.txt
    ("eye-signage-handwashing.txt", "F(2, 63) = 2.71, p = .005", "p-value-mismatch", "fail", True,
     "typo in F: 2.71 written for 5.71; p = .005 belongs to 5.71, p for 2.71 is .074"),
    ("eye-signage-handwashing.txt", "F(2, 63) = 1.12, p = .020", "p-value-mismatch", "fail", True,
     "p of the neighbouring result (cleanliness, p = .020) copied; true p for F(2, 63) = 1.12 is .333"),
    ("eye-signage-handwashing.txt", "F(2, 63) = -3.30, p = .043", "impossible-value", "fail", False,
     "negative F (sign slip; p = .043 belongs to F = 3.30)"),
    ("eye-signage-handwashing.txt", "F(1, 64) = 3.20, p = .039", "halved-p", "warn", True,
     "F test with p = .039, half of the true p = .078; no one-tailed statement (and F tests have no tails)"),
    # fernhollow-paired-reading.txt (mixed design)
    ("fernhollow-paired-reading.txt", "F(2, 15) = 4.50, p = .035", "p-value-mismatch", "fail", False,
     "df2 typed as N: 15 pupils in 3 groups give df (2, 12), which gives p = .035; df (2, 15) gives p = .029"),
    ("fernhollow-paired-reading.txt", "r(15) = .58, p = .023", "p-value-mismatch", "fail", False,
     "r reported with df = N (15) instead of N - 2 (13); p = .023 belongs to df 13, df 15 gives .015"),
    ("fernhollow-paired-reading.txt", "r(15) = .58, p = .023", "df-exceeds-sample", "fail", False,
     "the same slip seen from the sample size: r has df = N - 2 = 13 with N = 15, so df = 15 cannot come from this sample"),
    # carbon-label-trust.md (2 x 2 between subjects, N = 96)
    ("carbon-label-trust.md", "t(98) = 9.85, p < .001", "df-exceeds-sample", "fail", False,
     "df = 98 although a total of 96 adults took part (true df 94)"),
    ("carbon-label-trust.md", "F(1, 92) = 12.40, p < .001, η2 = .12", "eta-squared-labelled-partial", "note", False,
     "labelled eta squared but .12 = 12.40/(12.40 + 92), the partial eta squared, in a two-way ANOVA"),
    ("carbon-label-trust.md", "F(1, 92) = 7.20, p = .009, η2 = .07", "eta-squared-labelled-partial", "note", False,
     "labelled eta squared but .07 = 7.20/(7.20 + 92), the partial eta squared, in a two-way ANOVA"),
    ("carbon-label-trust.md", "F(1, 92) = 4.60, p = .035, η2 = .05", "eta-squared-labelled-partial", "note", False,
     "labelled eta squared but .05 = 4.60/(4.60 + 92), the partial eta squared, in a two-way ANOVA"),
    ("carbon-label-trust.md", "F(1, 92) = 13.75, p < .001, ηp2 = 1.30", "impossible-value", "fail", False,
     "partial eta squared of 1.30 is impossible (slip for .130; true .13)"),
    ("carbon-label-trust.md", "t(92) = 6.10, p = .015", "p-value-mismatch", "fail", False,
     "F confused with t squared: 6.10 is F = t^2; the contrast is t(92) = 2.47, p = .015; t = 6.10 gives p < .001"),
    # brannock-commute-survey.txt
    ("brannock-commute-survey.txt", "F(2, 209) = 19.80, p = .000", "p-reported-as-zero", "warn", False,
     "p written as .000; true p < .001"),
    ("brannock-commute-survey.txt", "t(210) = 3.10, p = .021", "p-value-mismatch", "fail", False,
     "wrong p: .021 written, true p = .002"),
    ("brannock-commute-survey.txt", "r(48) = 1.12, p = .439", "impossible-value", "fail", False,
     "r = 1.12 is impossible (slip for .112; p = .439 belongs to r = .112)"),
    ("brannock-commute-survey.txt", "t(120) = 2.45, p = .008", "halved-p", "warn", False,
     "p = .008 is half the two-tailed p = .016; the report says all tests were two-tailed"),
    # heathmoor-ferry-queues.txt (decimal commas; H = Kruskal-Wallis, tested as chi-square)
    ("heathmoor-ferry-queues.txt", "H(3, N = 120) = 4,10; p = ,025", "p-value-mismatch", "fail", True,
     "p written as ,025; chi-square(3) = 4.10 gives p = .251, so the gates did not differ, as the text says"),
    ("heathmoor-ferry-queues.txt", "F(1, 116) = 23,20; p = 0,000", "p-reported-as-zero", "warn", False,
     "p written as 0,000; true p < .001"),
    ("heathmoor-ferry-queues.txt", "t(78) = 2,05; p = ,022", "halved-p", "warn", False,
     "p = ,022 is half the two-tailed p = .044; no one-tailed test is declared"),
    ("heathmoor-ferry-queues.txt", "F(2, 117) = 5,30; p = ,006; R² = ,07", "r-squared-mismatch", "warn", False,
     "R² written as ,07, the adjusted R²; F(2, 117) = 5.30 gives R² = .083"),
    # quiet-carrel-study-rooms.txt (group means, SDs and ns written beside each test)
    ("quiet-carrel-study-rooms.txt", "t(38) = 2.95, p = .005", "group-statistics-test-mismatch", "fail", True,
     "M = 9.12 (0.61) vs 9.05 (0.70), n = 20 each, give t(38) = 0.34, p = .74; 2.95 does not follow"),
    ("quiet-carrel-study-rooms.txt", "F(2, 66) = 4.29, p = .018", "group-sizes-df-mismatch", "fail", False,
     "three groups of 21 give df2 = 63 - 3 = 60, not 66 (F = 4.29 itself follows from the groups)"),
    ("quiet-carrel-study-rooms.txt", "F(2, 66) = 4.29, p = .018", "integer-data-granularity", "warn", False,
     "M = 4.37 with n = 21 on a single 7-point item is impossible (GRIM): 91/21 = 4.33, 92/21 = 4.38"),
    # lichen-trail-signage.md (means (SDs) with a per-group n)
    ("lichen-trail-signage.md", "t(36) = 2.20, p = .034", "group-sizes-df-mismatch", "fail", False,
     "17 hikers in each of two groups give df = 32, not 36 (t = 2.20 itself follows from the groups)"),
    ("lichen-trail-signage.md", "F(2, 42) = 2.10, p = .135", "group-statistics-test-mismatch", "fail", True,
     "means 6.8, 7.9, 9.6 (SDs 2.1, 2.4, 2.2), n = 15 each, give F(2, 42) = 5.97, p = .005; 2.10 does not follow"),
    # harbour-choir-warmups.md (a 2 x 3 between-subjects design, cell n, M, SD in Table 1; tools/factorial_values.py)
    ("harbour-choir-warmups.md", "F(1, 114) = 6.86, p = .010, ηp² = .57", "partial-eta-squared-mismatch", "fail", False,
     "partial eta squared written as .57 for .057 (decimal slip); F(1, 114) = 6.86 gives .057"),
    ("harbour-choir-warmups.md", "F(1, 114) = 6.86, p = .010, ηp² = .57", "cell-statistics-test-mismatch", "fail", False,
     "the same slip seen from the cells: type III gives F = 6.86 and partial eta squared .057; no type gives .57"),
    ("harbour-choir-warmups.md", "F(2, 114) = 11.50, p < .001", "cell-statistics-test-mismatch", "note", False,
     "correct, and only type III gives it (types I and II: 11.87), as the text says: the note names the type"),
    ("harbour-choir-warmups.md", "F(2, 114) = 3.14, p = .047", "cell-statistics-test-mismatch", "fail", True,
     "the interaction F and p agree with each other but not with the cells: every type gives F(2, 114) = 0.74, p = .481"),
    ("harbour-choir-warmups.md", "t(114) = 2.93, p = .004", "post-hoc-comparison-mismatch", "fail", False,
     "the unadjusted p printed under the Bonferroni heading: t(114) = 2.93 gives p = .004, Bonferroni (3 comparisons) .012"),
]

DESCRIPTION = (
    "Planted findings in the plumbline demo corpus (invented manuscripts). "
    "line = 1-based line on which the statistic symbol of the flagged result starts. "
    "crossesAlpha = the p recomputed from the statistic and df as written and the reported p "
    "lie on different sides of the paper's alpha (.05 unless declared; classroom-feedback.txt "
    "declares .01). correctResults counts the results that are reported correctly (no planted "
    "problem). Values are reproduced by tools/compute_values.py and checked by tools/check_corpus.py."
)


def locate(file, snippet):
    with open(os.path.join(CORPUS, file), encoding="utf-8") as fh:
        lines = fh.read().split("\n")
    hits = [i for i, line in enumerate(lines) if snippet in line]
    if len(hits) != 1:
        raise SystemExit(f"{file}: snippet {snippet!r} found on {len(hits)} lines")
    total = sum(line.count(snippet) for line in lines)
    if total != 1:
        raise SystemExit(f"{file}: snippet {snippet!r} occurs {total} times")
    return hits[0] + 1


def planted_in_document_sources():
    """The four manuscripts built in every format (tools/build-documents.mjs) plant the
    p-value mismatches listed in sources/planted.json; their .txt versions carry the lines.
    Every planted p there crosses .05 (see the 'what' of each entry)."""
    with open(os.path.join(CORPUS, "sources", "planted.json"), encoding="utf-8") as fh:
        planted = json.load(fh)
    return [(f"{p['document']}.txt", p["text"], "p-value-mismatch", "fail", True, p["what"]) for p in planted]


def main():
    findings = []
    for file, snippet, rule, severity, crosses, planted in FINDINGS + planted_in_document_sources():
        findings.append({
            "file": file,
            "line": locate(file, snippet),
            "rule": rule,
            "severity": severity,
            "crossesAlpha": crosses,
            "planted": planted,
        })
    import check_corpus  # counts the correct results from the manuscripts themselves
    correct = check_corpus.count_correct_results(findings)
    key = {"description": DESCRIPTION, "findings": findings, "correctResults": correct}
    with open(os.path.join(CORPUS, "answer-key.json"), "w", encoding="utf-8") as fh:
        json.dump(key, fh, ensure_ascii=False, indent=2)
        fh.write("\n")
    print(f"wrote {len(findings)} findings, correctResults = {correct}")


if __name__ == "__main__":
    main()
