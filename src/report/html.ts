import { createHash } from 'node:crypto';
import type { DocumentOutput, FindingOutput, Report, StatisticOutput } from './model.js';
import { visibleControls } from './visible.js';
import { tableNotReadTag } from './tableNotRead.js';
import { countOf, crossesAlphaPhrase, noResultsMessage, tablesNotReadPhrase } from './wording.js';
import { extremes } from '../arrays.js';

/**
 * One self-contained HTML page for reading a report in a browser: no network
 * access, no external fonts or scripts. Everything that comes from a document
 * (text, paths, messages, rule data) is escaped for HTML; the page's own
 * script is fixed text, allowed by its sha256 hash in a Content-Security-
 * Policy that allows no other script. The script reads nothing but the DOM
 * (data-* attributes holding escaped values) and only toggles `hidden`.
 */

type Severity = FindingOutput['severity'];

const SEVERITIES: readonly Severity[] = ['fail', 'warn', 'note'];
const SEVERITY_RANK: Record<Severity, number> = { fail: 3, warn: 2, note: 1 };

/**
 * Escapes a string for HTML text and for double- or single-quoted attribute
 * values. Control characters are made visible too (src/report/visible.ts):
 * a bidirectional override from a document would otherwise reorder the rest
 * of its line on the page, and the other controls would be invisible. Tab,
 * line feed and carriage return stay: the page shows them as white space.
 */
export function escapeHtml(value: string): string {
  return visibleControls(value, '\t\n\r').replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c);
}

const e = escapeHtml;

function worstSeverity(findings: readonly FindingOutput[]): Severity | null {
  let worst: Severity | null = null;
  for (const finding of findings) if (worst === null || SEVERITY_RANK[finding.severity] > SEVERITY_RANK[worst]) worst = finding.severity;
  return worst;
}

function allFindings(document: DocumentOutput): FindingOutput[] {
  return [...document.findings, ...document.statistics.flatMap((s) => s.findings)];
}

/** p and other small numbers, readable and short: 0.0123, 1.33e-8. */
function formatNumber(value: number | null): string {
  if (value === null) return '';
  if (value === 0) return '0';
  if (!Number.isFinite(value)) return String(value);
  const magnitude = Math.abs(value);
  if (magnitude < 0.001 || magnitude >= 1e6) return value.toExponential(2).replace('e+', 'e');
  return String(Number(value.toPrecision(3)));
}

function where(statistic: StatisticOutput): string {
  const page = statistic.location.page === null ? '' : `page ${statistic.location.page}, `;
  return `${page}line ${statistic.location.line}, column ${statistic.location.column}`;
}


// ---------------------------------------------------------------- style and script

const STYLE = `
:root { color-scheme: light; --fail: #b71c1c; --warn: #a35200; --note: #1555a0; --none: #6b7280; --line: #d9dce1; --soft: #f5f6f8; }
* { box-sizing: border-box; }
[hidden] { display: none !important; }
body { margin: 0; font: 15px/1.5 system-ui, -apple-system, "Segoe UI", Roboto, "Helvetica Neue", Arial, sans-serif; color: #1d2330; background: #fff; }
main { max-width: 70rem; margin: 0 auto; padding: 1.5rem 1.25rem 4rem; }
h1 { font-size: 1.6rem; margin: 0 0 .25rem; }
h2 { font-size: 1.25rem; margin: 2rem 0 .75rem; border-bottom: 1px solid var(--line); padding-bottom: .25rem; }
h3 { font-size: 1.05rem; margin: 1.25rem 0 .5rem; }
.meta { color: #4b5260; margin: 0; }
.caution { border: 2px solid #c77700; background: #fff7e6; padding: .75rem 1rem; border-radius: 6px; margin: 1rem 0; font-weight: 600; }
.totals { display: flex; flex-wrap: wrap; gap: .5rem 1.5rem; padding: 0; margin: .5rem 0; list-style: none; }
.totals li { background: var(--soft); border: 1px solid var(--line); border-radius: 6px; padding: .35rem .75rem; }
.totals strong { font-size: 1.1rem; }
table { border-collapse: collapse; width: 100%; margin: .5rem 0 1rem; font-size: .92rem; }
th, td { border-bottom: 1px solid var(--line); padding: .3rem .5rem; text-align: left; vertical-align: top; }
th { background: var(--soft); }
td.num, th.num { text-align: right; font-variant-numeric: tabular-nums; }
.filters { position: sticky; top: 0; z-index: 2; background: #fff; border: 1px solid var(--line); border-radius: 6px; padding: .5rem .75rem; margin: 1rem 0; box-shadow: 0 2px 6px rgba(0,0,0,.06); }
.filters fieldset { border: 0; margin: 0; padding: .15rem 0; display: flex; flex-wrap: wrap; gap: .25rem 1rem; align-items: center; }
.filters legend { float: left; font-weight: 600; margin-right: .75rem; padding: 0; }
.filters label { white-space: nowrap; }
.filters button { font: inherit; font-size: .85rem; padding: 0 .5rem; }
.filter-count { margin: .25rem 0 0; color: #4b5260; }
.doc { border: 1px solid var(--line); border-radius: 8px; padding: .25rem 1rem 1rem; margin: 1rem 0; }
.doc > h3 { word-break: break-all; }
.result { border-left: 4px solid var(--none); padding: .25rem 0 .25rem .75rem; margin: .9rem 0; }
.result.sev-fail { border-left-color: var(--fail); }
.result.sev-warn { border-left-color: var(--warn); }
.result.sev-note { border-left-color: var(--note); }
.where { color: #4b5260; font-size: .88rem; }
.context { white-space: pre-wrap; background: var(--soft); border-radius: 4px; padding: .5rem .75rem; margin: .35rem 0; font-family: Georgia, "Times New Roman", serif; }
.context mark { background: #ffe082; padding: 0 .1rem; border-radius: 2px; font-weight: 700; }
.numbers { font-size: .9rem; margin: .25rem 0; color: #333a47; }
ul.findings { list-style: none; margin: .25rem 0; padding: 0; }
.finding { margin: .35rem 0; }
.finding p { margin: .1rem 0 0 0; }
.badge { display: inline-block; min-width: 3rem; text-align: center; border-radius: 4px; color: #fff; font-size: .8rem; font-weight: 700; padding: 0 .4rem; text-transform: uppercase; }
.badge.fail { background: var(--fail); }
.badge.warn { background: var(--warn); }
.badge.note { background: var(--note); }
.rule { font-family: ui-monospace, SFMono-Regular, Menlo, Consolas, monospace; font-size: .85rem; }
.alpha { color: var(--fail); font-weight: 600; font-size: .85rem; }
.unreadable .reason { color: var(--fail); }
details { margin-top: .5rem; }
summary { cursor: pointer; color: #2b4c7e; }
code { font-family: ui-monospace, SFMono-Regular, Menlo, Consolas, monospace; font-size: .88em; }
figure { margin: .5rem 0 1rem; }
figcaption { font-size: .88rem; color: #4b5260; max-width: 46rem; }
svg.chart { max-width: 100%; height: auto; font: 12px system-ui, sans-serif; }
.legend { display: flex; flex-wrap: wrap; gap: .25rem 1.25rem; font-size: .88rem; margin: .25rem 0; padding: 0; list-style: none; }
.swatch { display: inline-block; width: .8rem; height: .8rem; border-radius: 50%; vertical-align: -1px; margin-right: .3rem; }
.swatch.fail { background: var(--fail); } .swatch.warn { background: var(--warn); } .swatch.note { background: var(--note); } .swatch.none { background: var(--none); }
@media print { .filters { display: none !important; } .doc { break-inside: avoid-page; } }
`;

/** The page's only script. Fixed text (no data in it), allowed by its hash. */
const SCRIPT = `
(function () {
  'use strict';
  var panel = document.getElementById('filters');
  if (!panel) return;
  var count = document.getElementById('filter-count');
  var boxes = Array.prototype.slice.call(panel.querySelectorAll('input[type="checkbox"]'));
  function chosen(group) {
    var set = Object.create(null);
    boxes.forEach(function (box) { if (box.getAttribute('data-group') === group && box.checked) set[box.value] = true; });
    return set;
  }
  function apply() {
    var severities = chosen('severity');
    var rules = chosen('rule');
    var shown = 0;
    var total = 0;
    document.querySelectorAll('.finding').forEach(function (item) {
      var visible = severities[item.getAttribute('data-severity')] === true && rules[item.getAttribute('data-rule')] === true;
      item.hidden = !visible;
      total += 1;
      if (visible) shown += 1;
    });
    document.querySelectorAll('.result, .doc-findings, .doc.flagged').forEach(function (block) {
      block.hidden = block.querySelector('.finding:not([hidden])') === null;
    });
    var documents = document.querySelectorAll('.doc.flagged:not([hidden])').length;
    if (count) count.textContent = 'Showing ' + shown + ' of ' + total + ' flags, in ' + documents + ' document' + (documents === 1 ? '' : 's') + '.';
  }
  panel.addEventListener('change', apply);
  panel.querySelectorAll('button[data-set]').forEach(function (button) {
    button.addEventListener('click', function () {
      var group = button.getAttribute('data-set');
      var on = button.getAttribute('data-value') === 'on';
      boxes.forEach(function (box) { if (box.getAttribute('data-group') === group) box.checked = on; });
      apply();
    });
  });
  panel.hidden = false;
  apply();
})();
`;

function sha256Base64(text: string): string {
  return createHash('sha256').update(text, 'utf8').digest('base64');
}

/** The policy: no network, no script but ours, no style but ours. */
export function contentSecurityPolicy(): string {
  return [
    "default-src 'none'",
    `script-src 'sha256-${sha256Base64(SCRIPT)}'`,
    `style-src 'sha256-${sha256Base64(STYLE)}'`,
    "img-src 'none'",
    "base-uri 'none'",
    "form-action 'none'",
  ].join('; ');
}

// ---------------------------------------------------------------- overview

interface DocumentCounts {
  index: number;
  document: DocumentOutput;
  flags: number;
  flagged: number;
  bySeverity: Record<Severity, number>;
  crossesAlpha: number;
}

function countDocument(document: DocumentOutput, index: number): DocumentCounts {
  const findings = allFindings(document);
  const bySeverity: Record<Severity, number> = { fail: 0, warn: 0, note: 0 };
  for (const finding of findings) bySeverity[finding.severity] += 1;
  return {
    index,
    document,
    flags: findings.length,
    flagged: document.statistics.filter((s) => s.findings.length > 0).length,
    bySeverity,
    crossesAlpha: findings.filter((f) => f.crossesAlpha).length,
  };
}

function documentAnchor(index: number): string {
  return `doc-${index + 1}`;
}

function resultAnchor(documentIndex: number, statisticIndex: number): string {
  return `doc-${documentIndex + 1}-result-${statisticIndex + 1}`;
}

function rankingTable(counts: readonly DocumentCounts[]): string {
  const ranked = [...counts].sort(
    (a, b) =>
      Number(a.document.status === 'unreadable') - Number(b.document.status === 'unreadable') ||
      b.flags - a.flags ||
      b.bySeverity.fail - a.bySeverity.fail ||
      b.bySeverity.warn - a.bySeverity.warn ||
      a.index - b.index,
  );
  const rows = ranked.map((c, position) => {
    const d = c.document;
    const name = `<a href="#${documentAnchor(c.index)}">${e(d.path)}</a>`;
    if (d.status === 'unreadable') {
      return `<tr><td class="num">${position + 1}</td><td>${name}</td><td colspan="7">unreadable</td></tr>`;
    }
    return (
      `<tr><td class="num">${position + 1}</td><td>${name}</td><td class="num">${c.flags}</td>` +
      `<td class="num">${c.flagged}</td><td class="num">${d.statistics.length}</td>` +
      `<td class="num">${c.bySeverity.fail}</td><td class="num">${c.bySeverity.warn}</td><td class="num">${c.bySeverity.note}</td>` +
      `<td class="num">${c.crossesAlpha}</td></tr>`
    );
  });
  return (
    `<h3>Documents ranked by number of flags</h3>` +
    `<table class="ranking"><thead><tr><th class="num">Rank</th><th>Document</th><th class="num">Flags</th><th class="num">Flagged results</th>` +
    `<th class="num">Results</th><th class="num">fail</th><th class="num">warn</th><th class="num">note</th><th class="num">Change the conclusion</th></tr></thead>` +
    `<tbody>${rows.join('')}</tbody></table>`
  );
}

interface RuleCounts {
  rule: string;
  bySeverity: Record<Severity, number>;
  total: number;
  documents: Set<number>;
  crossesAlpha: number;
}

function countRules(documents: readonly DocumentOutput[]): RuleCounts[] {
  const byRule = new Map<string, RuleCounts>();
  documents.forEach((document, index) => {
    for (const finding of allFindings(document)) {
      let entry = byRule.get(finding.rule);
      if (!entry) {
        entry = { rule: finding.rule, bySeverity: { fail: 0, warn: 0, note: 0 }, total: 0, documents: new Set(), crossesAlpha: 0 };
        byRule.set(finding.rule, entry);
      }
      entry.bySeverity[finding.severity] += 1;
      entry.total += 1;
      entry.documents.add(index);
      if (finding.crossesAlpha) entry.crossesAlpha += 1;
    }
  });
  return [...byRule.values()].sort((a, b) => b.total - a.total || (a.rule < b.rule ? -1 : a.rule > b.rule ? 1 : 0));
}

function rulesTable(rules: readonly RuleCounts[]): string {
  if (rules.length === 0) return `<h3>Flags by rule</h3><p>No flags.</p>`;
  const rows = rules.map(
    (r) =>
      `<tr><td class="rule">${e(r.rule)}</td><td class="num">${r.total}</td><td class="num">${r.bySeverity.fail}</td>` +
      `<td class="num">${r.bySeverity.warn}</td><td class="num">${r.bySeverity.note}</td><td class="num">${r.documents.size}</td>` +
      `<td class="num">${r.crossesAlpha}</td></tr>`,
  );
  return (
    `<h3>Flags by rule</h3>` +
    `<table class="by-rule"><thead><tr><th>Rule</th><th class="num">Flags</th><th class="num">fail</th><th class="num">warn</th>` +
    `<th class="num">note</th><th class="num">Documents</th><th class="num">Change the conclusion</th></tr></thead>` +
    `<tbody>${rows.join('')}</tbody></table>`
  );
}

// ---------------------------------------------------------------- chart

const SEVERITY_COLOUR: Record<Severity | 'none', string> = { fail: '#b71c1c', warn: '#a35200', note: '#1555a0', none: '#6b7280' };

interface ChartPoint {
  documentIndex: number;
  statisticIndex: number;
  path: string;
  statistic: StatisticOutput;
  reported: number;
  comparator: StatisticOutput['valueComparator'];
  recomputed: number;
  severity: Severity | null;
}

function chartPoints(documents: readonly DocumentOutput[]): { points: ChartPoint[]; left: number } {
  const points: ChartPoint[] = [];
  let left = 0;
  documents.forEach((document, documentIndex) => {
    document.statistics.forEach((statistic, statisticIndex) => {
      const recomputed = statistic.recomputed.p;
      if (statistic.p === null || recomputed === null || !Number.isFinite(recomputed) || !Number.isFinite(statistic.p.value)) {
        left += 1;
        return;
      }
      points.push({
        documentIndex,
        statisticIndex,
        path: document.path,
        statistic,
        reported: statistic.p.value,
        comparator: statistic.p.comparator,
        recomputed,
        severity: worstSeverity(statistic.findings),
      });
    });
  });
  return { points, left };
}

function tickLabel(exponent: number): string {
  if (exponent >= 0) return String(10 ** exponent);
  if (exponent >= -3) return `.${'0'.repeat(-exponent - 1)}1`;
  return `1e${exponent}`;
}

/** Reported against recomputed p on log scales, drawn here as inline SVG (no script needed to show it). */
function scatterPlot(documents: readonly DocumentOutput[]): string {
  const { points, left } = chartPoints(documents);
  const heading = `<h3>Reported against recomputed p</h3>`;
  if (points.length === 0) {
    return `${heading}<p>No result has both a reported p and a recomputed p, so there is nothing to draw.</p>`;
  }
  const FLOOR_EXPONENT = -8;
  const positives = points.flatMap((p) => [p.reported, p.recomputed]).filter((v) => v > 0);
  const range = extremes(positives);
  const smallest = range?.min ?? 0.001;
  const largest = Math.max(1, range?.max ?? 1);
  const lowExponent = Math.max(FLOOR_EXPONENT, Math.min(-1, Math.floor(Math.log10(smallest))));
  const highExponent = Math.max(0, Math.ceil(Math.log10(largest)));
  const low = 10 ** lowExponent;
  const high = 10 ** highExponent;

  const width = 640;
  const height = 480;
  const margin = { left: 70, right: 20, top: 16, bottom: 56 };
  const plotWidth = width - margin.left - margin.right;
  const plotHeight = height - margin.top - margin.bottom;
  const clamp = (v: number): { value: number; clamped: boolean } =>
    v < low ? { value: low, clamped: true } : v > high ? { value: high, clamped: true } : { value: v, clamped: false };
  const fraction = (v: number): number => (Math.log10(v) - lowExponent) / (highExponent - lowExponent);
  const x = (v: number): number => margin.left + fraction(v) * plotWidth;
  const y = (v: number): number => margin.top + (1 - fraction(v)) * plotHeight;
  const r = (n: number): string => n.toFixed(1);

  const parts: string[] = [];
  parts.push(`<rect x="${margin.left}" y="${margin.top}" width="${plotWidth}" height="${plotHeight}" fill="#fbfbfc" stroke="#c4c8cf"/>`);
  const step = highExponent - lowExponent > 8 ? 2 : 1;
  for (let k = lowExponent; k <= highExponent; k += 1) {
    const v = 10 ** k;
    const labelled = (k - lowExponent) % step === 0 || k === highExponent;
    parts.push(`<line x1="${r(x(v))}" y1="${margin.top}" x2="${r(x(v))}" y2="${margin.top + plotHeight}" stroke="#e6e8ec"/>`);
    parts.push(`<line x1="${margin.left}" y1="${r(y(v))}" x2="${margin.left + plotWidth}" y2="${r(y(v))}" stroke="#e6e8ec"/>`);
    if (labelled) {
      parts.push(`<text x="${r(x(v))}" y="${margin.top + plotHeight + 16}" text-anchor="middle" fill="#333">${tickLabel(k)}</text>`);
      parts.push(`<text x="${margin.left - 6}" y="${r(y(v) + 4)}" text-anchor="end" fill="#333">${tickLabel(k)}</text>`);
    }
  }
  // The .05 guides: a point in the top-left or bottom-right quadrant would change a conclusion at alpha .05.
  if (0.05 > low && 0.05 < high) {
    parts.push(`<line x1="${r(x(0.05))}" y1="${margin.top}" x2="${r(x(0.05))}" y2="${margin.top + plotHeight}" stroke="#9aa0a8" stroke-dasharray="4 4"/>`);
    parts.push(`<line x1="${margin.left}" y1="${r(y(0.05))}" x2="${margin.left + plotWidth}" y2="${r(y(0.05))}" stroke="#9aa0a8" stroke-dasharray="4 4"/>`);
  }
  parts.push(`<line class="diagonal" x1="${r(x(low))}" y1="${r(y(low))}" x2="${r(x(high))}" y2="${r(y(high))}" stroke="#444" stroke-width="1.2"/>`);
  parts.push(
    `<text x="${margin.left + plotWidth / 2}" y="${height - 12}" text-anchor="middle" fill="#1d2330">recomputed p (log scale)</text>`,
    `<text transform="translate(16 ${margin.top + plotHeight / 2}) rotate(-90)" text-anchor="middle" fill="#1d2330">reported p (log scale)</text>`,
  );

  // Least severe first, so the worst points are drawn on top.
  const order = (p: ChartPoint): number => (p.severity === null ? 0 : SEVERITY_RANK[p.severity]);
  const sorted = [...points].sort((a, b) => order(a) - order(b));
  for (const point of sorted) {
    const px = clamp(point.recomputed);
    const py = clamp(point.reported);
    const cx = x(px.value);
    const cy = y(py.value);
    const colour = SEVERITY_COLOUR[point.severity ?? 'none'];
    const severityWord = point.severity ?? 'no flag';
    const title =
      `${point.path}, ${where(point.statistic)}: ${point.statistic.text.replace(/\s+/g, ' ')}\n` +
      `reported p ${point.comparator} ${point.statistic.p?.text ?? formatNumber(point.reported)}, recomputed p = ${formatNumber(point.recomputed)}; ${severityWord}` +
      (px.clamped || py.clamped ? '\n(outside the chart\u2019s range: drawn on its edge)' : '');
    let marker: string;
    const shape = point.comparator === '<' || point.comparator === '<=' ? 'below' : point.comparator === '>' || point.comparator === '>=' ? 'above' : 'equal';
    if (shape === 'below') {
      marker = `<path d="M${r(cx - 5.5)} ${r(cy - 4)}L${r(cx + 5.5)} ${r(cy - 4)}L${r(cx)} ${r(cy + 5.5)}Z" fill="#fff" fill-opacity="0.6" stroke="${colour}" stroke-width="2"/>`;
    } else if (shape === 'above') {
      marker = `<path d="M${r(cx - 5.5)} ${r(cy + 4)}L${r(cx + 5.5)} ${r(cy + 4)}L${r(cx)} ${r(cy - 5.5)}Z" fill="#fff" fill-opacity="0.6" stroke="${colour}" stroke-width="2"/>`;
    } else {
      marker = `<circle cx="${r(cx)}" cy="${r(cy)}" r="4.5" fill="${colour}" fill-opacity="0.8" stroke="#fff" stroke-width="1"/>`;
    }
    parts.push(
      `<a class="point" href="#${resultAnchor(point.documentIndex, point.statisticIndex)}" data-severity="${point.severity ?? 'none'}" data-comparator="${shape}">` +
        `<title>${e(title)}</title>${marker}</a>`,
    );
  }

  const svg =
    `<svg class="chart" role="img" aria-labelledby="chart-title" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}" xmlns="http://www.w3.org/2000/svg">` +
    `<title id="chart-title">Reported p against recomputed p for ${countOf(points.length, 'result')}, log scales, with the line where they agree</title>` +
    parts.join('') +
    `</svg>`;
  const legend =
    `<ul class="legend">` +
    (['fail', 'warn', 'note', 'none'] as const)
      .map((s) => `<li><span class="swatch ${s}"></span>${s === 'none' ? 'no flag' : `worst flag: ${s}`}</li>`)
      .join('') +
    `<li>\u25CF reported p = value</li><li>\u25BD reported p &lt; value</li><li>\u25B3 reported p &gt; value</li></ul>`;
  const caption =
    `<figcaption>Each mark is one result: across, the p recomputed from its printed statistic and degrees of freedom; up, the p printed in the document. ` +
    `Marks on the diagonal agree. Dashed lines mark .05. Values below ${tickLabel(lowExponent)} (including a printed p of 0) are drawn on the chart\u2019s edge. ` +
    `${countOf(points.length, 'result')} drawn; ${countOf(left, 'result')} not drawn (no p printed, or p could not be recomputed). ` +
    `Hover a mark for its text; click it to go to the result.</figcaption>`;
  return `${heading}<figure>${svg}${legend}${caption}</figure>`;
}

// ---------------------------------------------------------------- documents

function findingItem(finding: FindingOutput, alpha: number | undefined): string {
  const crosses = finding.crossesAlpha
    ? ` <span class="alpha">changes the conclusion${alpha === undefined ? '' : ` at alpha ${e(String(alpha))}`}</span>`
    : '';
  return (
    `<li class="finding" data-severity="${e(finding.severity)}" data-rule="${e(finding.rule)}">` +
    `<span class="badge ${e(finding.severity)}">${e(finding.severity)}</span> <span class="rule">${e(finding.rule)}</span>${crosses}` +
    `<p class="message">${e(finding.message)}</p></li>`
  );
}

function numbersLine(statistic: StatisticOutput): string {
  const parts: string[] = [];
  if (statistic.p) parts.push(`reported p ${e(statistic.p.comparator)} ${e(statistic.p.text)}`);
  const rec = statistic.recomputed;
  if (rec.p !== null) {
    const range =
      rec.pLow !== null && rec.pHigh !== null && (formatNumber(rec.pLow) !== formatNumber(rec.p) || formatNumber(rec.pHigh) !== formatNumber(rec.p))
        ? ` (${formatNumber(rec.pLow)} to ${formatNumber(rec.pHigh)} for values that round to the printed ones)`
        : '';
    parts.push(`recomputed p = ${formatNumber(rec.p)}${range}, ${rec.tails === 'two' ? 'two-tailed' : 'upper tail'}`);
  } else if (!rec.evaluable && rec.reason) {
    parts.push(`not recomputed: ${e(rec.reason)}`);
  }
  return parts.length > 0 ? `<p class="numbers">${parts.join('; ')}</p>` : '';
}

function contextBlock(statistic: StatisticOutput): string {
  const { before, after } = statistic.surroundings;
  const cut = statistic.location.start > before.length ? '\u2026' : '';
  return `<p class="context">${cut}${e(before)}<mark>${e(statistic.text)}</mark>${e(after)}</p>`;
}

function resultBlock(statistic: StatisticOutput, documentIndex: number, statisticIndex: number, alpha: number | undefined): string {
  const worst = worstSeverity(statistic.findings);
  return (
    `<article class="result sev-${worst ?? 'none'}" id="${resultAnchor(documentIndex, statisticIndex)}">` +
    `<div class="where">${e(where(statistic))}</div>` +
    contextBlock(statistic) +
    numbersLine(statistic) +
    `<ul class="findings">${statistic.findings.map((f) => findingItem(f, alpha)).join('')}</ul>` +
    `</article>`
  );
}

function allResultsTable(document: DocumentOutput, documentIndex: number): string {
  if (document.statistics.length === 0) return '';
  const rows = document.statistics.map((s, i) => {
    const worst = worstSeverity(s.findings);
    const text = e(s.text.replace(/\s+/g, ' '));
    const label = worst === null ? (s.recomputed.evaluable ? 'no flag' : 'not checked') : `<a href="#${resultAnchor(documentIndex, i)}">${worst}</a>`;
    return (
      `<tr><td>${e(where(s))}</td><td><code>${text}</code></td><td>${s.p ? `${e(s.p.comparator)} ${e(s.p.text)}` : ''}</td>` +
      `<td class="num">${formatNumber(s.recomputed.p)}</td><td>${label}</td></tr>`
    );
  });
  return (
    `<details><summary>All ${countOf(document.statistics.length, 'result')} in this document</summary>` +
    `<table class="all-results"><thead><tr><th>Where</th><th>Result</th><th>Reported p</th><th class="num">Recomputed p</th><th>Worst flag</th></tr></thead>` +
    `<tbody>${rows.join('')}</tbody></table></details>`
  );
}

/** What the list of documents without flags says of one: its results, or why it has none. */
function cleanDocumentWords(document: DocumentOutput): string {
  const noResults = noResultsMessage(document);
  return noResults === null ? `${countOf(document.statistics.length, 'result')}, none flagged` : `0 results. ${e(noResults)}`;
}

function documentMeta(document: DocumentOutput, counts: DocumentCounts): string {
  const bits = [`${countOf(document.statistics.length, 'result')}`, `${counts.flagged} flagged`];
  if (document.format) bits.push(`format ${e(document.format)}`);
  if (document.alpha !== undefined) bits.push(`alpha ${e(String(document.alpha))}`);
  const noResults = noResultsMessage(document);
  return `<p class="meta">${bits.join(' \u00B7 ')}</p>${noResults === null ? '' : `<p class="no-results">${e(noResults)}</p>`}`;
}

/** Tables that look like results tables but were not read in full, with the reason. */
function tablesNotReadBlock(document: DocumentOutput): string {
  if (document.tablesNotRead.length === 0) return '';
  const items = document.tablesNotRead
    .map((table) => {
      const page = table.location.page === null ? '' : `page ${table.location.page}, `;
      return `<li><span class="badge warn">${tableNotReadTag(table)}</span> <span class="where">${page}line ${table.location.line}</span>: ${e(table.message)}</li>`;
    })
    .join('');
  return `<div class="tables-not-read"><h4>Tables not read</h4><ul>${items}</ul></div>`;
}

function flaggedDocument(counts: DocumentCounts): string {
  const { document, index } = counts;
  const documentFindings =
    document.findings.length > 0
      ? `<div class="doc-findings"><h4>About the document as a whole</h4><ul class="findings">${document.findings.map((f) => findingItem(f, document.alpha)).join('')}</ul></div>`
      : '';
  const results = document.statistics
    .map((s, i) => (s.findings.length > 0 ? resultBlock(s, index, i, document.alpha) : ''))
    .join('');
  return (
    `<section class="doc flagged" id="${documentAnchor(index)}">` +
    `<h3>${e(document.path)}</h3>${documentMeta(document, counts)}${documentFindings}${results}${tablesNotReadBlock(document)}${allResultsTable(document, index)}</section>`
  );
}

function filtersPanel(report: Report, rules: readonly RuleCounts[]): string {
  const severityCounts = report.summary.findings;
  const severityBoxes = SEVERITIES.map(
    (s) =>
      `<label><input type="checkbox" data-group="severity" value="${s}" checked> <span class="badge ${s}">${s}</span> (${severityCounts[s]})</label>`,
  ).join('');
  const ruleBoxes = rules
    .map((r) => `<label><input type="checkbox" data-group="rule" value="${e(r.rule)}" checked> <span class="rule">${e(r.rule)}</span> (${r.total})</label>`)
    .join('');
  return (
    `<form class="filters" id="filters" hidden>` +
    `<fieldset><legend>Severity</legend>${severityBoxes}</fieldset>` +
    `<fieldset><legend>Rule</legend>${ruleBoxes}` +
    `<button type="button" data-set="rule" data-value="on">all</button><button type="button" data-set="rule" data-value="off">none</button></fieldset>` +
    `<p class="filter-count" id="filter-count" aria-live="polite"></p></form>`
  );
}

/** The HTML report: a single file with inline style and script, safe to open whatever the documents contain. */
export function formatHtml(report: Report): string {
  const { summary } = report;
  const counts = report.documents.map(countDocument);
  const rules = countRules(report.documents);
  const flagged = counts.filter((c) => c.document.status === 'checked' && c.flags > 0);
  const clean = counts.filter((c) => c.document.status === 'checked' && c.flags === 0);
  const unreadable = counts.filter((c) => c.document.status === 'unreadable');

  // Results (what was read) and findings (what the rules say of them) are counted apart.
  const findingCount = summary.findings.fail + summary.findings.warn + summary.findings.note;
  const noun = (count: number, one: string, many = `${one}s`): string => (count === 1 ? one : many);
  const totals =
    `<ul class="totals">` +
    `<li><strong>${summary.documents}</strong> ${noun(summary.documents, 'document')}` +
    (summary.unreadable > 0 ? ` (${summary.unreadable} unreadable)` : '') +
    `</li>` +
    `<li><strong>${summary.statistics}</strong> ${noun(summary.statistics, 'result')} found (${summary.resultsInText} in text, ${summary.resultsInTables} in tables), ` +
    `<strong>${summary.flaggedStatistics}</strong> flagged</li>` +
    `<li><strong>${findingCount}</strong> ${noun(findingCount, 'finding')}: <span class="badge fail">fail</span> ${summary.findings.fail} <span class="badge warn">warn</span> ${summary.findings.warn} <span class="badge note">note</span> ${summary.findings.note}</li>` +
    `<li>${e(crossesAlphaPhrase(summary) ?? 'No finding changes the conclusion at alpha')}</li>` +
    `<li>${e(tablesNotReadPhrase(summary) ?? 'Every results table was read')}</li></ul>`;

  const overview =
    `<section class="overview" id="overview"><h2>Overview</h2>` +
    (report.documents.length > 1 ? rankingTable(counts) : '') +
    rulesTable(rules) +
    scatterPlot(report.documents) +
    `</section>`;

  const flaggedSection =
    `<section id="flagged"><h2>Flagged results</h2>` +
    (flagged.length === 0 ? `<p>No result was flagged.</p>` : filtersPanel(report, rules) + flagged.map(flaggedDocument).join('')) +
    `</section>`;

  const cleanSection =
    clean.length === 0
      ? ''
      : `<section id="clean"><h2>Documents without flags (${clean.length})</h2><ul class="clean-list">` +
        clean
          .map(
            (c) =>
              `<li class="clean${noResultsMessage(c.document) === null ? '' : ' no-results'}" id="${documentAnchor(c.index)}">${e(c.document.path)}: ${cleanDocumentWords(c.document)}` +
              `${tablesNotReadBlock(c.document)}${allResultsTable(c.document, c.index)}</li>`,
          )
          .join('') +
        `</ul></section>`;

  const unreadableSection =
    unreadable.length === 0
      ? ''
      : `<section id="unreadable"><h2>Unreadable documents (${unreadable.length})</h2><ul>` +
        unreadable
          .map(
            (c) =>
              `<li class="unreadable" id="${documentAnchor(c.index)}"><span class="path">${e(c.document.path)}</span>: ` +
              `<span class="reason">${e(c.document.error ?? 'unreadable (no reason given)')}</span></li>`,
          )
          .join('') +
        `</ul></section>`;

  const title = `plumbline report: ${countOf(summary.documents, 'document')}, ${countOf(summary.flaggedStatistics, 'result')} flagged`;
  return (
    `<!DOCTYPE html>\n<html lang="en">\n<head>\n<meta charset="utf-8">\n` +
    `<meta http-equiv="Content-Security-Policy" content="${e(contentSecurityPolicy())}">\n` +
    `<meta name="referrer" content="no-referrer">\n` +
    `<meta name="viewport" content="width=device-width, initial-scale=1">\n` +
    `<meta name="generator" content="${e(`${report.tool.name} ${report.tool.version}`)}">\n` +
    `<title>${e(title)}</title>\n<style>${STYLE}</style>\n</head>\n<body>\n<main>\n` +
    `<header><h1>plumbline report</h1><p class="meta">${e(report.tool.name)} ${e(report.tool.version)}</p>` +
    `<p class="caution" role="note">${e(report.caution)}</p>${totals}</header>\n` +
    `${overview}\n${flaggedSection}\n${cleanSection}\n${unreadableSection}\n` +
    `<footer><p class="caution">${e(report.caution)}</p></footer>\n` +
    `</main>\n<script>${SCRIPT}</script>\n</body>\n</html>\n`
  );
}
