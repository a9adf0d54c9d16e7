#!/usr/bin/python3
"""Self-check of the plumbline demo corpus.

    /usr/bin/python3 corpus-demo/tools/check_corpus.py

1. Reads every manuscript (*.md, *.txt except README.md) with a small parser of
   its own and finds every reported result (F, t, r, chi-square, z).
2. For every finding in answer-key.json: confirms that the named line holds the
   statistic, that the planted problem is really there and clearly outside
   rounding tolerance, that the result has no other (unplanted) problem, and
   that crossesAlpha is right.
3. For every other result: recomputes p (and partial eta squared, its CI,
   Cohen's d, phi / Cramer's V) from the statistic as written and confirms it
   rounds to what is reported.
4. Confirms that the count of correct results equals correctResults and that
   the number of results per manuscript equals the number in compute_values.py.
"""

import json
import math
import os
import re
import sys

sys.dont_write_bytecode = True  # keep the corpus folder free of __pycache__

HERE = os.path.dirname(os.path.abspath(__file__))
CORPUS = os.path.dirname(HERE)
sys.path.insert(0, HERE)

import compute_values as cv  # noqa: E402

NUM = r"(-?\d*\.?\d+)"
PATTERNS = [
    ("F", re.compile(r"\bF\s*\(\s*(\d*\.?\d+)\s*,\s*(\d*\.?\d+)\s*\)\s*=\s*" + NUM)),
    ("t", re.compile(r"\bt\s*\(\s*(\d*\.?\d+)\s*\)\s*=\s*" + NUM)),
    ("r", re.compile(r"\br\s*\(\s*(\d+)\s*\)\s*=\s*" + NUM)),
    ("chi2", re.compile(r"χ2\s*\(\s*(\d+)\s*(?:,\s*N\s*=\s*(\d+))?\s*\)\s*=\s*" + NUM)),
    ("z", re.compile(r"\bz\s*=\s*" + NUM)),
]
P_RE = re.compile(r"\b(ps?)\s*(=|<|≤|>)\s*" + NUM)
EFFECT_RE = re.compile(r"(ηp2|partial η2|η2|\bd|Cramér's V|φ)\s*=\s*" + NUM)
CI_RE = re.compile(r"(\d+)% CI \[" + NUM + r", " + NUM + r"\]")
SENTENCE_END = re.compile(r"\.(?=\s|$)")


def decimals(text):
    return len(text.split(".")[1]) if "." in text else 0


def half(text):
    return 0.5 * 10 ** (-decimals(text))


def normalise(text):
    # same length, so offsets and lines are unchanged
    return text.replace("−", "-").replace("²", "2")


def manuscripts():
    return sorted(f for f in os.listdir(CORPUS)
                  if f.endswith((".md", ".txt")) and f != "README.md")


def parse(file):
    with open(os.path.join(CORPUS, file), encoding="utf-8") as fh:
        raw = fh.read()
    text = normalise(raw)
    hits = []
    for kind, rx in PATTERNS:
        for m in rx.finditer(text):
            hits.append((m.start(), m.end(), kind, m))
    hits.sort()
    results = []
    for i, (start, end, kind, m) in enumerate(hits):
        nxt = hits[i + 1][0] if i + 1 < len(hits) else len(text)
        sent = SENTENCE_END.search(text, end)
        sent_end = sent.start() if sent else len(text)
        seg = text[end:min(nxt, sent_end)]
        g = m.groups()
        res = {"file": file, "kind": kind, "start": start,
               "line": text.count("\n", 0, start) + 1,
               "text": text[start:min(nxt, sent_end)].strip()}
        if kind == "F":
            res["df"] = [float(g[0]), float(g[1])]
            res["value"] = g[2]
        elif kind in ("t", "r"):
            res["df"] = [float(g[0])]
            res["value"] = g[1]
        elif kind == "chi2":
            res["df"] = [float(g[0])]
            res["N"] = int(g[1]) if g[1] else None
            res["value"] = g[2]
        else:
            res["df"] = []
            res["value"] = g[0]
        pm = P_RE.search(seg)
        if not pm:  # a shared "ps < .001" later in the same sentence
            pm2 = P_RE.search(text, end, sent_end)
            if pm2 and pm2.group(1) == "ps":
                pm = pm2
        res["p"] = None if not pm else {"plural": pm.group(1) == "ps", "cmp": pm.group(2), "text": pm.group(3)}
        res["effects"] = [(e.group(1).strip(), e.group(2)) for e in EFFECT_RE.finditer(seg)]
        ci = CI_RE.search(seg)
        res["ci"] = None if not ci else (int(ci.group(1)) / 100, ci.group(2), ci.group(3))
        results.append(res)
    return raw, text, results


def p_of(kind, value, df):
    if kind == "F":
        return cv.p_F(value, df[0], df[1])
    if kind == "t":
        return cv.p_t(value, df[0])
    if kind == "r":
        return cv.p_r(value, df[0])
    if kind == "chi2":
        return cv.p_chi2(value, df[0])
    return cv.p_z(value)


def p_range(res):
    """Recomputed p for every statistic that rounds to the written one."""
    v, h = float(res["value"]), half(res["value"])
    lo_v, hi_v = abs(v) - h, abs(v) + h
    if res["kind"] == "r":
        hi_v = min(hi_v, 0.999999)
    ps = [p_of(res["kind"], max(x, 0.0), res["df"]) for x in (lo_v, hi_v)]
    return min(ps), max(ps)


def file_context(text):
    alpha = re.search(r"(?:α|alpha)\s*=\s*(\.\d+)", text)
    total = re.search(r"A total of (\d+)|\(N = (\d+)", text)
    return {
        "alpha": float(alpha.group(1)) if alpha else 0.05,
        "N": int(total.group(1) or total.group(2)) if total else None,
        "one_tailed": bool(re.search(r"one-tailed tests were used", text, re.I)),
        "gg": "Greenhouse-Geisser" in text,
        "repeated": bool(re.search(r"within-subjects|within subjects|repeated-measures|mixed ANOVA", text)),
    }


def registry_n(file, tvalue):
    for e in cv.C:
        if e["file"] == file and e["kind"] == "t" and "n1" in e["opt"]:
            if f"{abs(e['params'][0]):.2f}" == f"{abs(tvalue):.2f}":
                return e["opt"]["n1"], e["opt"]["n2"]
    return None


def p_consistent_strict(p_true, p):
    val = float(p["text"])
    if p["cmp"] == "=":
        return round(p_true + 1e-15, decimals(p["text"])) == val or (
            abs(p_true - val) < 1e-12)
    if p["cmp"] == "<":
        return p_true < val
    if p["cmp"] == "≤":
        return p_true <= val
    return p_true > val


def p_consistent_lenient(res):
    lo, hi = p_range(res)
    p = res["p"]
    val = float(p["text"])
    if p["cmp"] == "=":
        h = half(p["text"])
        return not (hi < val - h or lo > val + h), max(val - h - hi, lo - (val + h))
    if p["cmp"] in ("<", "≤"):
        return lo <= val, lo - val
    return hi >= val, val - hi


def df_exceeds_sample(res, ctx):
    """Error df above what N allows: r has N - 2 whatever the design; t at most N - 1;
    F at most N - 2, except in repeated-measures designs, where error df can exceed N."""
    if not ctx["N"] or not res["df"]:
        return False
    N = ctx["N"]
    if res["kind"] == "r":
        return res["df"][0] > N - 2
    if res["kind"] == "t":
        return res["df"][0] > N - 1
    if res["kind"] == "F":
        return res["df"][-1] > N - 2 and not ctx["repeated"]
    return False


def issues(res, ctx, strict):
    """Problems of a result: a set of tags matching the answer-key rules."""
    out = set()
    kind, v = res["kind"], float(res["value"])
    p = res["p"]
    # impossible values stop the arithmetic
    if (kind == "r" and abs(v) > 1) or (kind in ("F", "chi2") and v < 0) or \
            (p and float(p["text"]) > 1) or any(lbl in ("ηp2", "partial η2", "η2") and float(x) > 1
                                                for lbl, x in res["effects"]):
        return {"impossible-value"}
    if df_exceeds_sample(res, ctx):
        out.add("df-exceeds-sample")
    if p is None:
        out.add("no-p")
    else:
        p_true = p_of(kind, abs(v), res["df"])
        if p["cmp"] == "=" and float(p["text"]) == 0:
            out.add("p-reported-as-zero" if p_true < 0.0005 else "p-value-mismatch")
        elif strict:
            if not p_consistent_strict(p_true, p):
                out.add("p-value-mismatch")
        elif not p_consistent_lenient(res)[0]:
            out.add("p-value-mismatch")
    for label, x in res["effects"]:
        xv = float(x)
        if label in ("ηp2", "partial η2", "η2"):
            eta = cv.partial_eta(v, *res["df"])
            if round(eta + 1e-12, 2) != round(xv, 2):
                out.add("partial-eta-squared-mismatch" if label != "η2" else "eta-squared-mismatch")
            elif label == "η2":
                out.add("eta-squared-labelled-partial")
        elif label == "d":
            n = registry_n(res["file"], v)
            if n is None:
                out.add("d-without-n")
            elif round(cv.cohens_d(v, *n) + 1e-12, 2) != round(xv, 2):
                out.add("cohens-d-mismatch")
        elif label in ("Cramér's V", "φ"):
            if round(cv.cramers_v(v, res["N"]) + 1e-12, 2) != round(xv, 2):
                out.add("v-mismatch")
    if res["ci"]:
        level, lo_t, hi_t = res["ci"]
        lo, hi = cv.eta_ci(v, res["df"][0], res["df"][1], level)
        if round(lo + 1e-12, 2) != float(lo_t) or round(hi + 1e-12, 2) != float(hi_t):
            out.add("effect-size-interval-mismatch")
    return out


EXPECTED_TAGS = {
    "p-value-mismatch": {"p-value-mismatch"},
    "halved-p": {"p-value-mismatch"},
    "sphericity-corrected-p": {"p-value-mismatch"},
    "partial-eta-squared-mismatch": {"partial-eta-squared-mismatch"},
    "eta-squared-labelled-partial": {"eta-squared-labelled-partial"},
    "effect-size-interval-mismatch": {"effect-size-interval-mismatch"},
    "cohens-d-mismatch": {"cohens-d-mismatch"},
    "p-reported-as-zero": {"p-reported-as-zero"},
    "impossible-value": {"impossible-value"},
    "df-exceeds-sample": {"df-exceeds-sample"},
}


def rule_specific(f, res, ctx, text):
    """Extra evidence that the planted problem is what the key says."""
    rule = f["rule"]
    v = float(res["value"])
    p = res["p"]
    lo, hi = p_range(res) if v >= 0 and not (res["kind"] == "r" and abs(v) > 1) else (None, None)
    notes = []
    if rule == "p-value-mismatch":
        ok, gap = p_consistent_lenient(res)
        unit = 10 ** (-decimals(p["text"])) if p["cmp"] == "=" else 0.01
        assert not ok and gap >= unit, f"gap {gap:.5f} not clearly outside tolerance (unit {unit})"
        notes.append(f"recomputed p in [{lo:.4f}, {hi:.4f}], reported p {p['cmp']} {p['text']}, gap {gap:.4f}")
    elif rule == "halved-p":
        val, h = float(p["text"]), half(p["text"])
        assert 2 * (val - h) <= hi and lo <= 2 * (val + h), "reported p is not half the true p"
        assert hi < val - h or lo > val + h
        if f["severity"] == "note":
            assert ctx["one_tailed"], "severity note needs a one-tailed statement"
        else:
            assert not ctx["one_tailed"]
        notes.append(f"true p {lo:.4f}-{hi:.4f}, reported {p['text']} (x2 = {2 * val:.3f})")
    elif rule == "sphericity-corrected-p":
        assert ctx["gg"], "no Greenhouse-Geisser statement"
        val, h = float(p["text"]), half(p["text"])
        assert val > hi, "reported p should exceed the uncorrected p"
        df1, df2 = res["df"]
        eps_ok = [e / 100 for e in range(int(100 / df1), 100)
                  if val - h <= cv.p_F(v, df1 * e / 100, df2 * e / 100) <= val + h]
        assert eps_ok, "no epsilon gives the reported p"
        notes.append(f"uncorrected p {hi:.4f}; epsilon {min(eps_ok):.2f}-{max(eps_ok):.2f} gives {p['text']}")
    elif rule == "partial-eta-squared-mismatch":
        eta = cv.partial_eta(v, *res["df"])
        rep = [float(x) for lbl, x in res["effects"] if lbl in ("ηp2", "partial η2")][0]
        assert abs(eta - rep) > 0.05
        notes.append(f"partial eta {eta:.3f} vs reported {rep}")
    elif rule == "eta-squared-labelled-partial":
        same = [r for r in PARSED[f["file"]] if r["kind"] == "F" and r["df"] == res["df"]
                and any(lbl == "η2" for lbl, _ in r["effects"])]
        assert len(same) >= 3, "need three F tests with the same error df labelled eta squared"
        notes.append(f"{len(same)} F tests share df {res['df']}; partial eta {cv.partial_eta(v, *res['df']):.3f}")
    elif rule == "effect-size-interval-mismatch":
        lvl, a, b = res["ci"]
        ci = cv.eta_ci(v, res["df"][0], res["df"][1], lvl)
        assert abs(ci[0] - float(a)) > 0.05 or abs(ci[1] - float(b)) > 0.05
        notes.append(f"correct {int(lvl * 100)}% CI [{ci[0]:.3f}, {ci[1]:.3f}] vs [{a}, {b}]")
    elif rule == "cohens-d-mismatch":
        n = registry_n(f["file"], v)
        d = cv.cohens_d(v, *n)
        rep = [float(x) for lbl, x in res["effects"] if lbl == "d"][0]
        assert abs(d - rep) > 0.2
        assert re.search(rf"\b{n[0]} per group|n = {n[0]}", text), "group sizes not stated"
        notes.append(f"d {d:.3f} vs reported {rep} (n = {n})")
    elif rule == "p-reported-as-zero":
        assert p["text"] == ".000" and hi < 0.0005
        notes.append(f"true p {hi:.2e}")
    elif rule == "impossible-value":
        notes.append(f"value {res['value']}, p {p['text'] if p else None}, effects {res['effects']}")
    elif rule == "df-exceeds-sample":
        assert df_exceeds_sample(res, ctx)
        notes.append(f"df {res['df']} vs N {ctx['N']}")
    return "; ".join(notes)


def crosses_alpha(res, ctx):
    p = res["p"]
    v = float(res["value"])
    if p is None or float(p["text"]) > 1 or v < 0 and res["kind"] in ("F", "chi2") or \
            res["kind"] == "r" and abs(v) > 1:
        return False
    true_p = p_of(res["kind"], abs(v), res["df"])
    val = float(p["text"])
    reported_sig = val < ctx["alpha"] if p["cmp"] in ("=", "<", "≤") else False
    if p["cmp"] == "<" or p["cmp"] == "≤":
        reported_sig = val <= ctx["alpha"]
    return (true_p < ctx["alpha"]) != reported_sig


PARSED = {}
TEXTS = {}


def load():
    if PARSED:
        return
    for file in manuscripts():
        raw, text, results = parse(file)
        PARSED[file] = results
        TEXTS[file] = text


def count_correct_results(findings, verbose=False):
    load()
    planted_lines = {(f["file"], f["line"]) for f in findings}
    n = 0
    bad = []
    for file, results in PARSED.items():
        ctx = file_context(TEXTS[file])
        for res in results:
            if (file, res["line"]) in planted_lines:
                continue
            problems = issues(res, ctx, strict=True)
            if problems:
                bad.append(f"{file}:{res['line']}: {res['text']!r}: {sorted(problems)}")
            else:
                n += 1
                if verbose:
                    print(f"  ok  {file}:{res['line']}: {res['text']}")
    if bad:
        raise SystemExit("correct results that do not check out:\n  " + "\n  ".join(bad))
    return n


def main():
    load()
    with open(os.path.join(CORPUS, "answer-key.json"), encoding="utf-8") as fh:
        key = json.load(fh)
    failures = []
    print("Planted findings:")
    per_line = {}
    for f in key["findings"]:
        per_line.setdefault((f["file"], f["line"]), []).append(f)
    for f in key["findings"]:
        on_line = [r for r in PARSED[f["file"]] if r["line"] == f["line"]]
        try:
            assert len(on_line) == 1, f"{len(on_line)} results start on this line"
            res = on_line[0]
            ctx = file_context(TEXTS[f["file"]])
            expected = set().union(*(EXPECTED_TAGS[g["rule"]] for g in per_line[(f["file"], f["line"])]))
            for strict in (True, False):
                got = issues(res, ctx, strict)
                assert got == expected, f"problems found {sorted(got)}, expected {sorted(expected)} (strict={strict})"
            detail = rule_specific(f, res, ctx, TEXTS[f["file"]])
            ca = crosses_alpha(res, ctx)
            assert ca == f["crossesAlpha"], f"crossesAlpha should be {ca}"
            print(f"  ok  {f['file']}:{f['line']} {f['rule']:<30} {res['text']}\n        {detail}")
        except AssertionError as exc:
            failures.append(f"{f['file']}:{f['line']} {f['rule']}: {exc}")
    print("\nCorrect results:")
    correct = count_correct_results(key["findings"], verbose=True)
    if correct != key["correctResults"]:
        failures.append(f"correctResults is {key['correctResults']}, counted {correct}")
    # every result in the manuscripts is one of the registry's, and vice versa
    for file, results in PARSED.items():
        expected = sum(1 for e in cv.C if e["file"] == file and not e["label"].startswith("  ..."))
        if expected != len(results):
            failures.append(f"{file}: parsed {len(results)} results, compute_values.py lists {expected}")
    if cv.main.__code__ and cv.WARNINGS:
        failures.append("compute_values.py has rounding-edge warnings")
    total = sum(len(r) for r in PARSED.values())
    print(f"\n{len(key['findings'])} planted findings, {correct} correct results, {total} results parsed "
          f"in {len(PARSED)} manuscripts")
    if failures:
        print("\nFAILURES:\n  " + "\n  ".join(failures))
        return 1
    print("All checks passed.")
    return 0


if __name__ == "__main__":
    for e in cv.C:  # fill cv.WARNINGS
        cv.describe(e)
    sys.exit(main())
