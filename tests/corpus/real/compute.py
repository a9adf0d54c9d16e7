#!/usr/bin/python3
"""Check the real corpus's hand-written labels and compute what is not typed.

Run with Debian's Python (python3-scipy 1.10.1):

    /usr/bin/python3 tests/corpus/real/compute.py            # all passages
    /usr/bin/python3 tests/corpus/real/compute.py --check    # check only, write nothing

For every labels/<id>.json this script
  - checks the label file's fields and that the passage passages/<id>.txt
    exists, is at most MAX_CHARS long, and holds every result's span (and the
    statistic's valueText inside it);
  - parses the printed numbers (Unicode minus signs, decimal commas, spaces
    inside numbers, "1.2e-5") into values and decimals;
  - computes, with SciPy, the range of exact p values the printed statistic
    allows (over the rounding of the statistic and of decimal df), and the
    verdict `consistent` (see README.md);
  - writes computed/<id>.json and manifest.json, and prints the totals.

The split is decided here from the id alone (SHA-256), so adding passages
never moves an old one between splits.
"""
import hashlib
import json
import math
import os
import re
import sys

from scipy import stats

HERE = os.path.dirname(os.path.abspath(__file__))
PASSAGES = os.path.join(HERE, "passages")
LABELS = os.path.join(HERE, "labels")
COMPUTED = os.path.join(HERE, "computed")
MAX_CHARS = 2600  # "about 2,000 characters": a little room for a table row that ends just past it

KINDS = {"F", "t", "chi2", "r", "z"}
SYMBOLS = {"H", "rs"}
COMPARATORS = {"=", "<", ">", "<=", ">="}
DF_SOURCES = {"inline", "column", "error-row", "header", "row-label", "caption", "note", "text", "sample-size", "none"}
EFFECT_KINDS = {
    "partial-eta-squared", "eta-squared", "generalized-eta-squared", "omega-squared",
    "partial-omega-squared", "cohens-d", "hedges-g", "cohens-f", "r", "phi", "cramers-v",
    "r-squared", "adjusted-r-squared",
}
PASSAGE_FIELDS = {"source", "licence", "licenceEvidence", "attribution", "language", "origin", "shapes", "damage", "results", "note"}
RESULT_FIELDS = {
    "span", "occurrence", "valueText", "inTable", "kind", "symbol", "df", "dfSource", "valueComparator",
    "p", "notSignificant", "effects", "n", "adjusted", "tails", "note",
}
OPEN_LICENCES = re.compile(r"^(CC BY( \d\.\d)?|CC0( 1\.0)?|public domain)$", re.I)


class LabelError(Exception):
    pass


# ---------------------------------------------------------------- numbers
MINUS = "\u2212\u2013\u2012\u2010\u002d\ufe63\uff0d"


def parse_printed(text):
    """(value, decimals, exponent) of a number as printed: '−0.47', '- 0.47', '4,21', '.013', '1:95', '1.2e-5'."""
    s = text.strip()
    s = re.sub(r"\s+", "", s)
    for m in MINUS:
        s = s.replace(m, "-")
    if re.fullmatch(r"\ufffd[:.]?\d[\d:.,]*", s):
        # A minus sign a PDF's symbol font lost (U+FFFD, then the digits): kept in valueText only where the
        # label's note says the value is negative ('r ¼ \ufffd0:627' after 'turns out to be negative').
        s = "-" + s[1:]
    if re.fullmatch(r"-?\d{1,3}(?:,\d{3})+\.\d+", s):
        s = s.replace(",", "")  # thousands separators before a decimal point ('1,050,284.622')
    if "," in s and "." not in s:
        s = s.replace(",", ".")  # a decimal comma
    if re.fullmatch(r"-?\d*:\d+", s):
        s = s.replace(":", ".")  # a decimal point a PDF font extracted as ':' ('t~1:95', 'p~0:07')
    m = re.fullmatch(r"(-?)(\d*)(?:\.(\d+))?(?:e(-?\d+))?", s, re.I)
    if not m or (m.group(2) == "" and m.group(3) is None):
        raise LabelError(f"cannot read the number {text!r}")
    decimals = len(m.group(3) or "")
    exponent = int(m.group(4) or 0)
    value = float(f"{m.group(1)}{m.group(2) or '0'}.{m.group(3) or '0'}e{exponent}")
    return value, decimals, exponent


def half_unit(decimals, exponent):
    return 0.5 * 10 ** (exponent - decimals)


# ---------------------------------------------------------------- p values (SciPy)
def p_of(kind, df, value):
    """Two-tailed p for t, z and r; upper tail for F and chi-square."""
    v = abs(value) if kind in ("t", "z", "r") else value
    if kind == "F":
        return float(stats.f.sf(v, df[0], df[1]))
    if kind == "t":
        return float(2 * stats.t.sf(v, df[0]))
    if kind == "chi2":
        return float(stats.chi2.sf(v, df[0]))
    if kind == "z":
        return float(2 * stats.norm.sf(v))
    if kind == "r":
        d = df[0]
        if v >= 1:
            return 0.0
        return float(2 * stats.t.sf(v * math.sqrt(d / (1 - v * v)), d))
    raise LabelError(kind)


def needed_df(kind):
    return {"F": 2, "t": 1, "chi2": 1, "r": 1, "z": 0}[kind]


def p_range(kind, df, df_text, value, decimals, exponent):
    """Smallest and largest exact p over the rounding box of the statistic and of decimal df."""
    h = half_unit(decimals, exponent)
    lo_v, hi_v = abs(value) - h, abs(value) + h
    lo_v = max(lo_v, 0.0)
    if kind == "r":
        hi_v = min(hi_v, 0.999999999)
    df_choices = []
    for d, t in zip(df, df_text):
        if "." in t or "," in t:
            _, k, e = parse_printed(t)
            hu = half_unit(k, e)
            df_choices.append([max(d - hu, 1e-9), d + hu])
        else:
            df_choices.append([d])
    corners = [[]]
    for choice in df_choices:
        corners = [c + [x] for c in corners for x in choice]
    ps = [p_of(kind, c, v) for c in corners for v in (lo_v, hi_v)]
    return min(ps), max(ps)


def pes_of(F, df1, df2):
    return F * df1 / (F * df1 + df2)


# ---------------------------------------------------------------- one passage
def split_of(pid):
    return "holdout" if int(hashlib.sha256(pid.encode()).hexdigest()[:8], 16) % 5 == 0 else "tune"


def locate(text, span, occurrence):
    at = -1
    for _ in range(occurrence):
        at = text.find(span, at + 1)
        if at < 0:
            return -1
    return at


def verdict(kind, df, df_text, value, decimals, exponent, comparator, p, ns, effects, adjusted, tails):
    """(consistent, pRange, reasons)."""
    if len(df) < needed_df(kind):
        return None, None, ["no df"]
    if kind in ("F", "chi2") and value < 0:
        # F and chi-square are sums of squares over positive df: never negative (common practice).
        return False, None, [f"a negative {kind}"]
    lo, hi = p_range(kind, df, df_text, value, decimals, exponent)
    if comparator == "<":  # "F < 1": the p is large whatever the df
        if p is not None and p["comparator"] in ("<", "<=") and p["value"] <= 0.2:
            return False, [lo, 1.0], ["a statistic below 1 with a small p"]
        return True, [lo, 1.0], []
    if p is None and not ns:
        return None, [lo, hi], ["no p"]
    if adjusted or tails == "one":
        return None, [lo, hi], ["adjusted or one-tailed p"]
    reasons = []
    if p is not None:
        v = p["value"]
        c = p["comparator"]
        if c == "=":
            hu = half_unit(p["decimals"], p["exponent"])
            # Float slack scaled to the printed unit: a fixed 1e-15 would pass any p printed below
            # 1e-15 ('p=1.2×10−44' for an exact p of 1.7e-313).
            eps = min(1e-15, 1e-6 * hu)
            # Rounded, or truncated (0.0499 printed as .04), both common practice.
            ok = hi >= v - hu - eps and lo <= v + 2 * hu + eps
            if v == 0:
                ok = lo <= 2 * hu + 1e-15
        elif c == "<":
            ok = lo < v
        elif c == "<=":
            ok = lo <= v
        elif c == ">":
            ok = hi > v
        else:
            ok = hi >= v
        if not ok:
            reasons.append(f"p {c} {p['text']} but the exact p is in [{lo:.6g}, {hi:.6g}]")
    if ns and hi <= 0.05:
        reasons.append(f"n.s. but the exact p is at most {hi:.6g}")
    if kind == "F" and len(df) == 2:
        h = half_unit(decimals, exponent)
        elo, ehi = pes_of(max(value - h, 0), df[0], df[1]), pes_of(value + h, df[0], df[1])
        for e in effects:
            if e["kind"] != "partial-eta-squared":
                continue
            hu = half_unit(e["decimals"], e["exponent"])
            if e["comparator"] == "<":
                ok = elo < e["value"]
            else:
                ok = ehi >= e["value"] - hu - 1e-12 and elo <= e["value"] + hu + 1e-12
            if not ok:
                reasons.append(f"partial eta squared {e['text']} but F gives [{elo:.4f}, {ehi:.4f}]")
    if kind == "chi2" and len(df) == 1 and float(df[0]).is_integer():
        # phi = sqrt(chi2 / N) reaches at most sqrt(min(r, c) - 1) (Cramer 1946,
        # from memory); over every r x c table with (r - 1)(c - 1) = df that is
        # the square root of df's largest divisor not above sqrt(df).
        d = int(df[0])
        bound = max(a for a in range(1, int(math.isqrt(d)) + 1) if d % a == 0) ** 0.5
        for e in effects:
            if e["kind"] == "phi" and abs(e["value"]) - half_unit(e["decimals"], e["exponent"]) > bound + 1e-12:
                reasons.append(f"phi {e['text']} but a table with df = {d} allows at most {bound:.4g}")
    return not reasons, [lo, hi], reasons


def compute_passage(pid):
    label_path = os.path.join(LABELS, f"{pid}.json")
    passage_path = os.path.join(PASSAGES, f"{pid}.txt")
    try:
        labels = json.load(open(label_path, encoding="utf-8"))
    except json.JSONDecodeError as e:
        raise LabelError(f"{label_path}: not valid JSON ({e})")
    if not os.path.exists(passage_path):
        raise LabelError(f"{passage_path}: missing")
    text = open(passage_path, encoding="utf-8").read()
    where = f"labels/{pid}.json"
    if len(text) > MAX_CHARS:
        raise LabelError(f"{where}: the passage has {len(text)} characters (at most {MAX_CHARS})")
    unknown = set(labels) - PASSAGE_FIELDS
    if unknown:
        raise LabelError(f"{where}: unknown fields {sorted(unknown)}")
    for field in ("source", "licence", "licenceEvidence", "attribution", "language", "origin", "shapes", "results"):
        if field not in labels:
            raise LabelError(f"{where}: missing {field}")
    if not OPEN_LICENCES.match(labels["licence"]):
        raise LabelError(f"{where}: licence {labels['licence']!r} is not CC BY, CC0 or public domain")
    out_results = []
    for i, r in enumerate(labels["results"]):
        at = f"{where} result {i + 1}"
        unknown = set(r) - RESULT_FIELDS
        if unknown:
            raise LabelError(f"{at}: unknown fields {sorted(unknown)}")
        for field in ("span", "valueText", "inTable", "kind", "df", "p"):
            if field not in r:
                raise LabelError(f"{at}: missing {field}")
        if r["kind"] not in KINDS:
            raise LabelError(f"{at}: kind {r['kind']!r}")
        if r.get("symbol") is not None and r["symbol"] not in SYMBOLS:
            raise LabelError(f"{at}: symbol {r['symbol']!r}")
        start = locate(text, r["span"], r.get("occurrence", 1))
        if start < 0:
            raise LabelError(f"{at}: span {r['span']!r} (occurrence {r.get('occurrence', 1)}) is not in the passage")
        inner = r["span"].find(r["valueText"])
        if inner < 0:
            raise LabelError(f"{at}: valueText {r['valueText']!r} is not inside the span {r['span']!r}")
        value, decimals, exponent = parse_printed(r["valueText"])
        df_text = [str(d) for d in r["df"]]
        df = [float(d) for d in r["df"]]
        if len(df) > needed_df(r["kind"]):
            raise LabelError(f"{at}: {len(df)} df for {r['kind']}")
        comparator = r.get("valueComparator", "=")
        if comparator not in COMPARATORS:
            raise LabelError(f"{at}: valueComparator {comparator!r}")
        p = None
        if r["p"] is not None:
            if r["p"].get("comparator") not in COMPARATORS:
                raise LabelError(f"{at}: p comparator {r['p'].get('comparator')!r}")
            pv, pk, pe = parse_printed(r["p"]["text"])
            p = {"comparator": r["p"]["comparator"], "text": r["p"]["text"], "value": pv, "decimals": pk, "exponent": pe}
        effects = []
        for e in r.get("effects", []):
            if e.get("kind") not in EFFECT_KINDS:
                raise LabelError(f"{at}: effect kind {e.get('kind')!r}")
            ev, ek, ee = parse_printed(e["text"])
            effects.append({"kind": e["kind"], "text": e["text"], "comparator": e.get("comparator", "="), "value": ev, "decimals": ek, "exponent": ee})
        dfs = r.get("dfSource", "inline" if df else "none")
        if dfs not in DF_SOURCES:
            raise LabelError(f"{at}: dfSource {dfs!r}")
        ns = bool(r.get("notSignificant", False))
        consistent, prange, reasons = verdict(
            r["kind"], df, df_text, value, decimals, exponent, comparator, p, ns, effects, r.get("adjusted"), r.get("tails")
        )
        value_start = start + inner
        # Offsets in UTF-16 code units, as JavaScript strings count them (a character outside the
        # Basic Multilingual Plane, such as a mathematical italic letter, counts twice).
        u16 = lambda offset: len(text[:offset].encode("utf-16-le")) // 2
        out_results.append({
            "kind": r["kind"],
            "symbol": r.get("symbol"),
            "span": r["span"],
            "start": u16(start),
            "end": u16(start + len(r["span"])),
            "valueStart": u16(value_start),
            "valueEnd": u16(value_start + len(r["valueText"])),
            "line": text.count("\n", 0, value_start) + 1,
            "inTable": bool(r["inTable"]),
            "df": df,
            "dfSource": dfs,
            "value": value,
            "valueText": r["valueText"],
            "valueComparator": comparator,
            "p": None if p is None else {"comparator": p["comparator"], "value": p["value"], "text": p["text"]},
            "notSignificant": ns,
            "effects": [{"kind": e["kind"], "value": e["value"], "text": e["text"]} for e in effects],
            "adjusted": r.get("adjusted"),
            "tails": r.get("tails"),
            "pRange": prange,
            "consistent": consistent,
            "reasons": reasons,
        })
    meta = {k: labels.get(k) for k in ("source", "licence", "licenceEvidence", "attribution", "language", "origin", "shapes")}
    meta["damage"] = labels.get("damage", [])
    return {"id": pid, "split": split_of(pid), "characters": len(text), **meta, "results": out_results}


def main():
    check_only = "--check" in sys.argv[1:]
    ids = sorted(n[:-5] for n in os.listdir(LABELS) if n.endswith(".json"))
    orphans = sorted(n[:-4] for n in os.listdir(PASSAGES) if n.endswith(".txt") and n[:-4] not in ids)
    errors = [f"passages/{o}.txt has no labels/{o}.json" for o in orphans]
    computed = []
    for pid in ids:
        try:
            computed.append(compute_passage(pid))
        except LabelError as e:
            errors.append(str(e))
    sources = {}
    for c in computed:
        sources.setdefault(c["source"], []).append(c["id"])
    if errors:
        print("\n".join(errors), file=sys.stderr)
        sys.exit(1)
    if not check_only:
        os.makedirs(COMPUTED, exist_ok=True)
        for name in os.listdir(COMPUTED):
            if name.endswith(".json") and name[:-5] not in ids:
                os.remove(os.path.join(COMPUTED, name))
        for c in computed:
            with open(os.path.join(COMPUTED, f"{c['id']}.json"), "w", encoding="utf-8") as f:
                json.dump(c, f, ensure_ascii=False, indent=1)
                f.write("\n")
        manifest = [
            {
                "id": c["id"], "split": c["split"], "source": c["source"], "licence": c["licence"],
                "attribution": c["attribution"], "language": c["language"], "origin": c["origin"],
                "shapes": c["shapes"], "damage": c["damage"], "characters": c["characters"],
                "results": len(c["results"]), "inTables": sum(r["inTable"] for r in c["results"]),
            }
            for c in computed
        ]
        with open(os.path.join(HERE, "manifest.json"), "w", encoding="utf-8") as f:
            json.dump({"generatedBy": "tests/corpus/real/compute.py (SciPy %s)" % __import__("scipy").__version__, "passages": manifest}, f, ensure_ascii=False, indent=1)
            f.write("\n")
    for split in ("tune", "holdout"):
        cs = [c for c in computed if c["split"] == split]
        rs = [r for c in cs for r in c["results"]]
        print(
            f"{split:8s} passages {len(cs):3d}  results {len(rs):4d}  in tables {sum(r['inTable'] for r in rs):4d}  "
            f"consistent {sum(r['consistent'] is True for r in rs):4d}  inconsistent {sum(r['consistent'] is False for r in rs):3d}  "
            f"unjudged {sum(r['consistent'] is None for r in rs):3d}"
        )
    languages = sorted({c["language"] for c in computed})
    print(f"languages: {', '.join(languages)}")
    for src, pids in sources.items():
        if len(pids) > 1:
            print(f"note: {len(pids)} passages from one source {src}: {', '.join(pids)}")
    for c in computed:
        for r in c["results"]:
            if r["consistent"] is False:
                print(f"inconsistent: {c['id']} line {r['line']} {r['span']!r}: {'; '.join(r['reasons'])}")


if __name__ == "__main__":
    main()
