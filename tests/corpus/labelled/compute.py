#!/usr/bin/python3
"""Build the labelled corpus from its templates, and check every label.

Run with Debian's Python (it has python3-scipy 1.10.1), not the first python3
on PATH:

    /usr/bin/python3 tests/corpus/labelled/compute.py          # rebuild all
    /usr/bin/python3 tests/corpus/labelled/compute.py calc F 2 57 4.21
    /usr/bin/python3 tests/corpus/labelled/compute.py calc t 28 -2.21
    /usr/bin/python3 tests/corpus/labelled/compute.py calc chi2 2 7.81 120
    /usr/bin/python3 tests/corpus/labelled/compute.py calc r 48 .32
    /usr/bin/python3 tests/corpus/labelled/compute.py calc z - 2.45

Each templates/<name>.tpl becomes <name> (a .txt or .md excerpt) plus
<name-without-extension>.labels.json beside it. The template is the excerpt's
text with three kinds of marks:

  \\u00a0 (any \\uXXXX)      replaced by that character (so invisible spaces,
                            minus signs and ligatures stay visible in the source)
  <<lookalike text>>        written as is, and labelled as a look-alike
                            (the real delimiters are U+27EA / U+27EB)
  [[HEADER|BODY]]           a reported result (real delimiters U+27E6 / U+27E7)

HEADER = KIND DF VALUE [options], e.g. `F 2,57 4.21`, `t 45.3 -2.05`,
`chi2 2 7.81 N=120`, `r - -.41 N=50`, `z - 2.45`, `F - <1 p=ns`.
  DF      comma-separated degrees of freedom, `-` for none
  VALUE   the statistic exactly as written (minus as '-'); `<1` for "F < 1"
  options
    p=eq:.021 p=lt:.001 p=le:.01 p=gt:.10 p=ge:.05   p written literally in BODY
    p=ns      "n.s." with no p;  p=none  no p at all
    ns        "n.s." written in addition to a p
    pshared   the p is written after a later result ("ps < .001")
    N=120     sample size (chi-square effect sizes; r written without df)
    calc=4.12 compute the p/effect placeholders from this value (a typo'd
              statistic: the text shows VALUE, the p belongs to calc)
    phalf     p placeholders show half the true p (a one-tailed p passed off)
    eff=KIND:VALUE   an effect size written literally in BODY
    pre=KIND:VALUE   an effect size written literally just BEFORE the result
              ("R² = .12, F(3, 96) = ..."), only separators in between
    bad       the result is meant to be inconsistent (checked below)

BODY is the text, starting at the statistic's symbol. Placeholders, computed
from the statistic (or calc):
  {p}  "p = .021" (3 decimals, "p < .001" below .001)   {p0} "p = 0.021"
  {p2} "p = .04" (2 decimals, "p < .01" below .01)      {p4} "p = .0213"
  {pval} ".021" alone (comparator "=" written in the body)   {pval2} ".04"
  {plt} "p < .001"/"p < .01"/"p < .05"/"p > .05"      {ple} same with "≤"
  {pns} "n.s." (only when p > .05)
  {pes} ηp² ".13"  {pes3} ".128"  {pes0} "0.13"  {es} η² (one-way) ".13"
  {w2} ω² (one-way) ".10"  {f} Cohen's f "0.38"  {pesci} 90% CI "[.02, .25]"
  {d} 2|t|/sqrt(df) "0.45"  {dz} |t|/sqrt(df+1)  {g} Hedges' g  {dci} 95% CI
  {phi} sqrt(chi2/N) ".25"  {V} Cramér's V (same formula, 2 x k tables)
  {pes_} etc.: a trailing underscore renders an effect size without labelling
         it (a bare number in a table column has no symbol, so it is not labelled)

The consistency of every result is recomputed here from what the text shows:
the statistic's own rounding interval (4.21 means 4.205..4.215) gives an
interval of exact p values; a reported "p = .021" is consistent when its own
rounding interval meets it, "p < .05" when some exact p in it is below .05,
"n.s." when some exact p is above .05; a partial eta squared (or one-way eta
squared) is checked the same way. The generator stops when that verdict
disagrees with the template's `bad` flag.
"""
import json
import math
import os
import re
import sys

from scipy import stats, optimize

HERE = os.path.dirname(os.path.abspath(__file__))
TPL = os.path.join(HERE, "templates")

MINUS = "-\u2212\u2013"


# ---------------------------------------------------------------- statistics
def p_of(kind, df, value, n=None):
    """Two-tailed p (upper tail for F and chi-square)."""
    v = value
    if kind == "F":
        return stats.f.sf(v, df[0], df[1])
    if kind == "t":
        return 2 * stats.t.sf(abs(v), df[0])
    if kind == "chi2":
        return stats.chi2.sf(v, df[0])
    if kind == "z":
        return 2 * stats.norm.sf(abs(v))
    if kind == "r":
        d = df[0] if df else n - 2
        if abs(v) >= 1:
            return 0.0
        t = abs(v) * math.sqrt(d / (1 - v * v))
        return 2 * stats.t.sf(t, d)
    raise ValueError(kind)


def pes_of(F, df1, df2):
    return F * df1 / (F * df1 + df2)


def omega_of(F, df1, df2):
    n = df1 + df2 + 1
    return df1 * (F - 1) / (df1 * (F - 1) + n)


def pes_ci(F, df1, df2, level=0.90):
    """Confidence interval for partial eta squared by inverting the noncentral F."""
    a = (1 - level) / 2

    def lam_for(target):
        f = lambda lam: stats.ncf.sf(F, df1, df2, lam) - target
        if f(0) >= 0:
            return 0.0
        hi = 10.0
        while f(hi) < 0:
            hi *= 2
        return optimize.brentq(f, 0, hi)

    n = df1 + df2 + 1
    lo = lam_for(a)
    hi = lam_for(1 - a)
    return lo / (lo + n), hi / (hi + n)


def d_of(t, df):
    return 2 * abs(t) / math.sqrt(df)


def dz_of(t, df):
    return abs(t) / math.sqrt(df + 1)


def g_of(t, df):
    return d_of(t, df) * (1 - 3 / (4 * df - 1))


def d_ci(t, df):
    d = d_of(t, df)
    n = df + 2
    n1 = n2 = n / 2
    se = math.sqrt((n1 + n2) / (n1 * n2) + d * d / (2 * (n1 + n2)))
    return d - 1.96 * se, d + 1.96 * se


# ---------------------------------------------------------------- formatting
def rnd(x, k):
    """Round half up on the decimal string (what authors do by hand)."""
    q = 10 ** k
    return math.floor(x * q + 0.5 + 1e-12) / q


def nolead(x, k):
    s = f"{rnd(x, k):.{k}f}"
    if s.startswith("0."):
        return s[1:]
    if s.startswith("-0."):
        return "-" + s[2:]
    return s


def lead(x, k):
    return f"{rnd(x, k):.{k}f}"


def parse_num(s):
    s = s.replace("\u2212", "-").replace("\u2013", "-")
    return float(s)


def decimals_of(s):
    s = s.lstrip("<").replace("\u2212", "-").replace("\u2013", "-")
    m = re.match(r"-?\d*(?:\.(\d+))?(?:e(-?\d+))?$", s)
    if not m:
        raise ValueError(s)
    k = len(m.group(1) or "")
    e = int(m.group(2) or 0)
    return k, e


def half_unit(s):
    k, e = decimals_of(s)
    return 0.5 * 10 ** (e - k)


# ---------------------------------------------------------------- templates
TOKEN = re.compile("\u27e6([^|\u27e7]*)\\|(.*?)\u27e7", re.S)
LOOK = re.compile("\u27ea(.*?)\u27eb", re.S)
UESC = re.compile(r"\\u([0-9a-fA-F]{4})")
PH = re.compile(r"\{(\w+)\}")
EFFECT_SYMBOL = re.compile(r"(?:η|ω|φ|\bdz?\b|\bg\b|\bV\b|eta squared|\bf\b|\bR²|\bR2)[^=<>,;()]{0,6}[=<>]")
KINDS = {"F", "t", "chi2", "r", "z"}
# H is Kruskal-Wallis (tested as chi-square); ρ is Spearman's rho (a correlation).
SYMBOL_START = {"F": "F", "t": "t", "chi2": "χXxcCH", "r": "rρ", "z": "zZ"}
CMP = {"eq": "=", "lt": "<", "le": "<=", "gt": ">", "ge": ">="}


class Spec:
    def __init__(self, header, file):
        parts = header.split()
        self.file = file
        self.header = header
        self.kind = parts[0]
        assert self.kind in KINDS, (file, header)
        self.df_text = [] if parts[1] == "-" else parts[1].split(",")
        self.df = [float(x) for x in self.df_text]
        vt = parts[2]
        self.value_cmp = "<" if vt.startswith("<") else "="
        self.value_text = vt.lstrip("<")
        self.value = parse_num(self.value_text)
        self.p = "auto"
        self.ns = False
        self.N = None
        self.calc = None
        self.phalf = False
        self.bad = False
        self.lit_effects = []
        self.pre_effects = []
        self.pshared = False
        for o in parts[3:]:
            if o == "bad":
                self.bad = True
            elif o == "phalf":
                self.phalf = True
            elif o == "ns":
                self.ns = True
            elif o == "pshared":
                self.pshared = True
            elif o.startswith("p="):
                v = o[2:]
                if v == "ns":
                    self.p = None
                    self.ns = True
                elif v == "none":
                    self.p = None
                else:
                    c, num = v.split(":")
                    self.p = (CMP[c], num)
            elif o.startswith("N="):
                self.N = float(o[2:])
            elif o.startswith("calc="):
                self.calc = parse_num(o[5:])
            elif o.startswith("eff="):
                k, num = o[4:].split(":")
                self.lit_effects.append((k, num))
            elif o.startswith("pre="):
                k, num = o[4:].split(":")
                self.pre_effects.append((k, num))
            else:
                raise ValueError(f"{file}: unknown option {o}")
        self.effects = []  # (kind, text)
        self.placeholder_p = None  # (cmp, text)

    # the value placeholders are computed from
    def base(self):
        return self.calc if self.calc is not None else self.value

    def exact_p(self):
        p = p_of(self.kind, self.df, self.base(), self.N)
        return p / 2 if self.phalf else p

    def render(self, body):
        def rep(m):
            name = m.group(1)
            if name.endswith("_"):  # rendered but not labelled (a bare table cell)
                n = len(self.effects)
                out = rep_named(name[:-1])
                del self.effects[n:]
                return out
            return rep_named(name)

        def rep_named(name):
            v = self.base()
            df = self.df
            p = self.exact_p() if self.value_cmp == "=" else None

            def setp(cmp, text):
                assert self.placeholder_p is None, (self.file, self.header)
                self.placeholder_p = (cmp, text)

            if name in ("p", "p0", "p2", "p4", "pval", "pval2"):
                k = {"p": 3, "p0": 3, "p2": 2, "p4": 4, "pval": 3, "pval2": 2}[name]
                fmt = lead if name == "p0" else nolead
                floor = 10 ** -k
                if name.startswith("pval"):
                    assert rnd(p, k) >= floor, (self.file, self.header, p)
                    t = fmt(p, k)
                    setp("=", t)
                    return t
                if p < floor:
                    t = fmt(floor, k)
                    setp("<", t)
                    return "p < " + t
                t = fmt(p, k)
                setp("=", t)
                return "p = " + t
            if name in ("plt", "ple"):
                sym = "<" if name == "plt" else "≤"
                cmp = "<" if name == "plt" else "<="
                for cut, t in ((0.001, ".001"), (0.01, ".01"), (0.05, ".05")):
                    if p < cut:
                        setp(cmp, t)
                        return f"p {sym} {t}"
                setp(">", ".05")
                return "p > .05"
            if name == "pns":
                assert p > 0.05, (self.file, self.header, p)
                self.ns = True
                self.p = None
                return "n.s."
            F = v
            if name in ("pes", "pes3", "pes0", "es"):
                k = 3 if name == "pes3" else 2
                x = pes_of(F, df[0], df[1])
                t = lead(x, k) if name == "pes0" else nolead(x, k)
                self.effects.append(("eta-squared" if name == "es" else "partial-eta-squared", t))
                return t
            if name == "w2":
                t = nolead(omega_of(F, df[0], df[1]), 2)
                self.effects.append(("omega-squared", t))
                return t
            if name == "f":
                x = pes_of(F, df[0], df[1])
                t = lead(math.sqrt(x / (1 - x)), 2)
                self.effects.append(("cohens-f", t))
                return t
            if name == "pesci":
                lo, hi = pes_ci(F, df[0], df[1])
                return f"[{nolead(lo, 2)}, {nolead(hi, 2)}]"
            if name in ("d", "dz", "g"):
                fn = {"d": d_of, "dz": dz_of, "g": g_of}[name]
                t = lead(fn(v, df[0]), 2)
                self.effects.append(("hedges-g" if name == "g" else "cohens-d", t))
                return t
            if name == "dci":
                lo, hi = d_ci(v, df[0])
                return f"[{lead(lo, 2)}, {lead(hi, 2)}]"
            if name in ("phi", "V"):
                t = nolead(math.sqrt(v / self.N), 2)
                self.effects.append(("phi" if name == "phi" else "cramers-v", t))
                return t
            raise ValueError(f"{self.file}: unknown placeholder {name}")

        return PH.sub(rep, body)

    def reported_p(self):
        if self.p == "auto":
            return self.placeholder_p
        return self.p

    def label(self, line):
        rp = self.reported_p()
        effects = self.pre_effects + [(k, t) for k, t in self.effects] + self.lit_effects
        num = lambda s: int(float(s)) if float(s).is_integer() and "." not in s else float(s)
        return {
            "line": line,
            "kind": self.kind,
            "df": [num(x) for x in self.df_text],
            "value": parse_num(self.value_text),
            "valueComparator": self.value_cmp,
            "p": None if rp is None else {"comparator": rp[0], "value": float(rp[1])},
            "notSignificant": self.ns,
            "effects": [{"kind": k, "value": float(t)} for k, t in effects],
            "consistent": self.check()[0],
        }

    # ------------------------------------------------------------ consistency
    def p_interval(self):
        h = half_unit(self.value_text)
        a, b = abs(self.value) - h, abs(self.value) + h
        a = max(a, 0.0)
        if self.kind == "r":
            b = min(b, 0.999999999)
        pa = p_of(self.kind, self.df, a, self.N)
        pb = p_of(self.kind, self.df, b, self.N)
        return min(pa, pb), max(pa, pb)

    def check(self):
        """(consistent, reasons) from what the text shows."""
        reasons = []
        if self.value_cmp == "<":  # "F < 1": p is large whatever the df
            rp = self.reported_p()
            if rp is not None and rp[0] in ("<", "<=") and float(rp[1]) <= 0.2:
                reasons.append("F < 1 with a small p")
            return (not reasons, reasons)
        if self.kind == "r" and not self.df and self.N is None:
            return (True, ["unchecked"])
        lo, hi = self.p_interval()
        rp = self.reported_p()
        if rp is not None:
            cmp, t = rp
            v = float(t)
            if cmp == "=":
                hu = half_unit(t)
                ok = hi >= v - hu - 1e-15 and lo <= v + hu + 1e-15
            elif cmp == "<":
                ok = lo < v
            elif cmp == "<=":
                ok = lo <= v
            elif cmp == ">":
                ok = hi > v
            else:
                ok = hi >= v
            if not ok:
                reasons.append(f"p {cmp} {t} but exact p in [{lo:.6g}, {hi:.6g}]")
        if self.ns and hi <= 0.05:
            reasons.append(f"n.s. but exact p <= {hi:.6g}")
        if self.kind == "F" and len(self.df) == 2:
            h = half_unit(self.value_text)
            elo = pes_of(max(self.value - h, 0), *self.df)
            ehi = pes_of(self.value + h, *self.df)
            # R² of a whole model is the same function of F; adjusted R² = 1 - (1 - R²)(df1 + df2) / df2.
            adjust = lambda r2: 1 - (1 - r2) * (self.df[0] + self.df[1]) / self.df[1]
            for k, t in self.pre_effects + self.effects + self.lit_effects:
                if k in ("partial-eta-squared", "eta-squared", "r-squared", "adjusted-r-squared"):
                    lo_e, hi_e = (adjust(elo), adjust(ehi)) if k == "adjusted-r-squared" else (elo, ehi)
                    hu = half_unit(t)
                    v = float(t)
                    if not (hi_e >= v - hu - 1e-12 and lo_e <= v + hu + 1e-12):
                        reasons.append(f"{k} {t} but F gives [{lo_e:.4f}, {hi_e:.4f}]")
        return (not reasons, reasons)


def line_of(text, pos):
    return text.count("\n", 0, pos) + 1


def build(tpl_name):
    src = open(os.path.join(TPL, tpl_name), encoding="utf-8").read()
    out_name = tpl_name[: -len(".tpl")]
    src = UESC.sub(lambda m: chr(int(m.group(1), 16)), src)
    lines = src.split("\n", 1)
    assert lines[0].startswith("#description "), tpl_name
    description = lines[0][len("#description "):].strip()
    src = lines[1]

    out = []
    results = []
    looks = []
    pos = 0
    cur = 0  # length of output so far
    pattern = re.compile(TOKEN.pattern + "|" + LOOK.pattern, re.S)
    problems = []
    for m in pattern.finditer(src):
        chunk = src[pos:m.start()]
        out.append(chunk)
        cur += len(chunk)
        if m.group(1) is not None:
            spec = Spec(m.group(1), out_name)
            body = spec.render(m.group(2))
            assert body.lstrip("*_")[0] in SYMBOL_START[spec.kind], (out_name, spec.header, body)
            if spec.reported_p() is None and re.search(r"\bps?\s*[<=>≤≥]", body):
                problems.append(f"{out_name}: {spec.header}: a p is written but not labelled: {body}")
            n_eff = len(EFFECT_SYMBOL.findall(body))
            if n_eff != len(spec.effects) + len(spec.lit_effects):
                problems.append(f"{out_name}: {spec.header}: {n_eff} effect sizes written, "
                                f"{len(spec.effects) + len(spec.lit_effects)} labelled: {body}")
            norm = re.sub("[\u2212\u2013]", "-", body)
            if spec.value_cmp == "=":
                assert spec.value_text in norm, (out_name, spec.header, body)
            for k, t in spec.lit_effects:
                assert t.lstrip("0") in norm or t in norm, (out_name, spec.header, body, t)
            before = "".join(out)
            for k, t in reversed(spec.pre_effects):
                # written just before the result, only separators (and the next pre effect) in between
                m_pre = re.search(re.escape(t) + r"[,;(\s]*(?:adjusted R² = [-.\d]+[,;(\s]*)?$", before)
                assert m_pre, (out_name, spec.header, t, before[-60:])
            if spec.p not in ("auto", None):
                t = spec.p[1]
                if "e" not in t and not spec.pshared:
                    assert t in norm or t.lstrip("0") in norm, (out_name, spec.header, body)
            results.append((cur, spec))
            out.append(body)
            cur += len(body)
        else:
            t = m.group(3)
            assert "\n" not in t, (out_name, t)
            looks.append((cur, t))
            out.append(t)
            cur += len(t)
        pos = m.end()
    out.append(src[pos:])
    text = "".join(out)
    assert "\u27e6" not in text and "\u27ea" not in text and "\u27e7" not in text, out_name

    labels = []
    for off, spec in results:
        lab = spec.label(line_of(text, off))
        ok, reasons = spec.check()
        if ok == spec.bad:
            problems.append(f"{out_name}:{lab['line']}: {spec.header}: marked "
                            f"{'bad' if spec.bad else 'good'} but check says {ok} {reasons}")
        labels.append(lab)
    look_labels = [{"line": line_of(text, off), "text": t} for off, t in looks]
    with open(os.path.join(HERE, out_name), "w", encoding="utf-8") as fh:
        fh.write(text)
    base = re.sub(r"\.(txt|md)$", "", out_name)
    with open(os.path.join(HERE, base + ".labels.json"), "w", encoding="utf-8") as fh:
        one = lambda o: json.dumps(o, ensure_ascii=False)
        fh.write("{\n")
        fh.write(f'  "description": {one(description)},\n')
        fh.write('  "results": [\n' + ",\n".join("    " + one(r) for r in labels) + "\n  ],\n")
        fh.write('  "lookalikes": [\n' + ",\n".join("    " + one(r) for r in look_labels)
                 + "\n  ]\n}\n")
    return out_name, labels, look_labels, problems


def main():
    if len(sys.argv) > 1 and sys.argv[1] == "calc":
        kind, df, val = sys.argv[2], sys.argv[3], sys.argv[4]
        n = float(sys.argv[5]) if len(sys.argv) > 5 else None
        dfl = [] if df == "-" else [float(x) for x in df.split(",")]
        v = parse_num(val)
        p = p_of(kind, dfl, v, n)
        print(f"p = {p:.6g}")
        if kind == "F":
            print(f"pes = {pes_of(v, *dfl):.4f}  omega2 = {omega_of(v, *dfl):.4f}")
        if kind == "t":
            print(f"d = {d_of(v, dfl[0]):.4f} dz = {dz_of(v, dfl[0]):.4f} g = {g_of(v, dfl[0]):.4f}")
        if kind == "chi2" and n:
            print(f"phi = {math.sqrt(v / n):.4f}")
        return
    total_r = total_l = bad = 0
    problems = []
    rows = []
    for name in sorted(os.listdir(TPL)):
        if not name.endswith(".tpl"):
            continue
        out, labels, looks, probs = build(name)
        problems += probs
        nb = sum(1 for r in labels if not r["consistent"])
        rows.append((out, len(labels), len(looks), nb))
        total_r += len(labels)
        total_l += len(looks)
        bad += nb
    for r in rows:
        print(f"{r[0]:40s} results {r[1]:3d}  look-alikes {r[2]:3d}  inconsistent {r[3]:3d}")
    print(f"TOTAL results {total_r}, look-alikes {total_l}, inconsistent {bad} "
          f"({bad / max(total_r, 1):.1%})")
    if problems:
        print("\n".join(problems))
        sys.exit(1)


if __name__ == "__main__":
    main()
