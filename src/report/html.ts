import { createHash } from 'node:crypto';
import type { DocumentOutput, FindingOutput, Report, StatisticOutput } from './model.js';
import { visibleControls, visibleLine } from './visible.js';
import { tableNotReadTag } from './tableNotRead.js';
import { countOf, crossesAlphaPhrase, noResultsMessage, tablesNotReadPhrase } from './wording.js';

/**
 * One self-contained HTML page for reading a report in a browser: no network
 * access, no external fonts or scripts. Everything that comes from a document
 * (text, paths, messages, rule data) is escaped for HTML; the page's own
 * script is fixed text, allowed by its sha256 hash in a Content-Security-
 * Policy that allows no other script. The script reads nothing but the DOM
 * (data-* attributes holding escaped values) and the reviewer's seen marks in
 * localStorage; it toggles `hidden`, reorders the rows of the document table
 * and saves a CSV the reviewer asks for. The page is written in one pass,
 * in time linear in the results (the ranking sorts the documents once).
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
:root { color-scheme: light; --fail: #b71c1c; --warn: #a35200; --note: #1555a0; --none: #6b7280; --line: #d9dce1; --soft: #f5f6f8; --focus: #1d4ed8; }
* { box-sizing: border-box; }
[hidden] { display: none !important; }
body:not(.scripted) .needs-script { display: none !important; }
html.booting [data-item]:not([data-first]) { display: none !important; }
body { margin: 0; font: 15px/1.5 system-ui, -apple-system, "Segoe UI", Roboto, "Helvetica Neue", Arial, sans-serif; color: #1d2330; background: #fff; }
main { max-width: 76rem; margin: 0 auto; padding: 1.5rem 1.25rem 4rem; }
h1 { font-size: 1.6rem; margin: 0 0 .25rem; }
h2 { font-size: 1.25rem; margin: 2rem 0 .75rem; border-bottom: 1px solid var(--line); padding-bottom: .25rem; }
h3 { font-size: 1.05rem; margin: 1.25rem 0 .5rem; }
:focus-visible { outline: 3px solid var(--focus); outline-offset: 2px; }
.meta { color: #4b5260; margin: 0; }
.caution { border: 2px solid #c77700; background: #fff7e6; padding: .75rem 1rem; border-radius: 6px; margin: 1rem 0; font-weight: 600; }
.totals { display: flex; flex-wrap: wrap; gap: .5rem 1.5rem; padding: 0; margin: .5rem 0; list-style: none; }
.totals li { background: var(--soft); border: 1px solid var(--line); border-radius: 6px; padding: .35rem .75rem; }
.totals strong { font-size: 1.1rem; }
table { border-collapse: collapse; width: 100%; margin: .5rem 0 1rem; font-size: .92rem; }
th, td { border-bottom: 1px solid var(--line); padding: .3rem .5rem; text-align: left; vertical-align: top; }
th { background: var(--soft); }
td.num, th.num { text-align: right; font-variant-numeric: tabular-nums; }
th button.sort { font: inherit; font-weight: 700; border: 0; background: none; padding: 0; cursor: pointer; color: inherit; text-align: inherit; }
th[aria-sort="ascending"] button.sort::after { content: " \\25B2"; }
th[aria-sort="descending"] button.sort::after { content: " \\25BC"; }
table.documents td.map { padding: .15rem .5rem; }
table.documents td.name { word-break: break-all; }
.controls, .filters { background: #fff; border: 1px solid var(--line); border-radius: 6px; padding: .5rem .75rem; margin: .75rem 0; }
.filters { position: sticky; top: 0; z-index: 2; box-shadow: 0 2px 6px rgba(0,0,0,.06); }
.controls { display: flex; flex-wrap: wrap; gap: .35rem 1.25rem; align-items: center; }
.filters fieldset { border: 0; margin: 0; padding: .15rem 0; display: flex; flex-wrap: wrap; gap: .25rem 1rem; align-items: center; }
.filters legend { float: left; font-weight: 600; margin-right: .75rem; padding: 0; }
.filters label, .controls label { white-space: nowrap; }
.filters button, .controls button, .pager button, .pager select, .controls input, .filters select { font: inherit; font-size: .85rem; padding: 0 .5rem; }
.filter-count { margin: .25rem 0 0; color: #4b5260; }
.pager { display: flex; flex-wrap: wrap; gap: .35rem .75rem; align-items: center; margin: .35rem 0; font-size: .9rem; }
.doc { border: 1px solid var(--line); border-radius: 8px; padding: .25rem 1rem 1rem; margin: 1rem 0; }
.doc > h3 { word-break: break-all; }
.result { border-left: 4px solid var(--none); padding: .25rem 0 .25rem .75rem; margin: .9rem 0; }
.result.sev-fail { border-left-color: var(--fail); }
.result.sev-warn { border-left-color: var(--warn); }
.result.sev-note { border-left-color: var(--note); }
.where { color: #4b5260; font-size: .88rem; }
.context { white-space: pre-wrap; background: var(--soft); border-radius: 4px; padding: .5rem .75rem; margin: .35rem 0; font-family: Georgia, "Times New Roman", serif; }
.context mark { background: #ffe082; padding: 0 .1rem; border-radius: 2px; font-weight: 700; }
.numbers, .implied { font-size: .9rem; margin: .25rem 0; color: #333a47; }
.implied { border-left: 3px solid #9aa0a8; padding-left: .5rem; }
ul.findings { list-style: none; margin: .25rem 0; padding: 0; }
.finding { margin: .35rem 0; }
.finding p { margin: .1rem 0 0 0; }
.finding.is-seen .message { color: #6b7280; }
.seen-box { font-size: .85rem; margin-left: .75rem; color: #4b5260; }
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
figcaption, .explain { font-size: .88rem; color: #4b5260; max-width: 52rem; }
svg.map { display: block; font: 11px system-ui, sans-serif; }
svg.map a:focus-visible { outline: 2px solid var(--focus); }
.legend { display: flex; flex-wrap: wrap; gap: .25rem 1.25rem; font-size: .88rem; margin: .25rem 0; padding: 0; list-style: none; align-items: center; }
.legend svg { vertical-align: -2px; margin-right: .3rem; }
@media print { .filters, .controls, .pager, .seen-box { display: none !important; } .doc { break-inside: avoid-page; } }
`;

/**
 * The first of the page's two scripts, in its head: while the page loads
 * (and until SCRIPT has paged the lists), only the first page of each list
 * is laid out, so a report of thousands of documents is not laid out whole
 * first. Where scripts do not run, neither does this one, and everything
 * shows.
 */
const BOOT_SCRIPT = `document.documentElement.classList.add('booting');`;

/**
 * The page's main script. Fixed text (no data in it), allowed by its hash.
 * Without it the page shows everything at once (no paging, no sorting);
 * with it: the document table is sorted, searched and paged, the flag cards
 * and the long lists are paged, the filters hide and show flags, a flag can
 * be marked as seen (kept in the browser's localStorage) and the flags the
 * filters show can be saved as CSV. A link to a result on another page, or
 * one the filters hide, brings it into view first.
 */
const SCRIPT = `
(function () {
  'use strict';
  try { run(); } finally { document.documentElement.classList.remove('booting'); }
  function run() {
  var body = document.body;
  body.classList.add('scripted');
  var slice = Array.prototype.slice;
  function all(selector, root) { return slice.call((root || document).querySelectorAll(selector)); }
  function plural(n, one, many) { return n + ' ' + (n === 1 ? one : (many || one + 's')); }

  // ---- marks kept in the browser
  var SEEN_KEY = 'plumbline.seen.v1';
  var store = null;
  try { store = window.localStorage; store.getItem(SEEN_KEY); } catch (error) { store = null; }
  var seen = {};
  if (store) { try { seen = JSON.parse(store.getItem(SEEN_KEY) || '{}') || {}; } catch (error) { seen = {}; } }
  function saveSeen() { if (store) { try { store.setItem(SEEN_KEY, JSON.stringify(seen)); } catch (error) { /* full or refused: the marks last for this visit */ } } }

  // ---- pagers: a list whose items carry data-item; data-out="1" is an item the filters leave out
  var pagers = {};
  function makePager(list) {
    var nav = document.querySelector('nav.pager[data-for="' + list.id + '"]');
    var pager = { size: Number(list.getAttribute('data-page-size')) || 25, page: 0 };
    function items() { return slice.call(list.children).filter(function (item) { return item.hasAttribute('data-item'); }); }
    pager.render = function () {
      var kept = 0;
      var every = items();
      every.forEach(function (item) { if (item.getAttribute('data-out') !== '1') kept += 1; });
      var size = pager.size > 0 ? pager.size : Math.max(1, kept);
      var pages = Math.max(1, Math.ceil(kept / size));
      if (pager.page >= pages) pager.page = pages - 1;
      if (pager.page < 0) pager.page = 0;
      var from = pager.page * size;
      var index = 0;
      every.forEach(function (item) {
        if (item.getAttribute('data-out') === '1') { item.hidden = true; return; }
        item.hidden = index < from || index >= from + size;
        index += 1;
      });
      if (nav) {
        var status = nav.querySelector('.page-status');
        var noun = nav.getAttribute('data-noun') || 'item';
        var first = kept === 0 ? 0 : from + 1;
        var last = Math.min(kept, from + size);
        status.textContent = 'Page ' + (pager.page + 1) + ' of ' + pages + ': ' + first + ' to ' + last + ' of ' + plural(kept, noun);
        nav.querySelector('[data-go="first"]').disabled = pager.page === 0;
        nav.querySelector('[data-go="prev"]').disabled = pager.page === 0;
        nav.querySelector('[data-go="next"]').disabled = pager.page >= pages - 1;
        nav.querySelector('[data-go="last"]').disabled = pager.page >= pages - 1;
      }
    };
    pager.show = function (item) {
      var index = 0;
      var size = pager.size > 0 ? pager.size : 1e9;
      items().some(function (candidate) {
        if (candidate === item) return true;
        if (candidate.getAttribute('data-out') !== '1') index += 1;
        return false;
      });
      pager.page = Math.floor(index / size);
      pager.render();
    };
    if (nav) {
      nav.addEventListener('click', function (event) {
        var button = event.target.closest('button[data-go]');
        if (!button) return;
        var go = button.getAttribute('data-go');
        if (go === 'first') pager.page = 0;
        else if (go === 'prev') pager.page -= 1;
        else if (go === 'next') pager.page += 1;
        else pager.page = 1e9;
        pager.render();
      });
      var select = nav.querySelector('select[data-size]');
      if (select) {
        select.value = String(pager.size);
        select.addEventListener('change', function () { pager.size = Number(select.value); pager.page = 0; pager.render(); });
      }
    }
    pagers[list.id] = pager;
    return pager;
  }
  all('[data-paged]').forEach(makePager);

  // ---- the document table: sort, search, changes the conclusion only
  var table = document.getElementById('documents');
  var tbody = document.getElementById('documents-body');
  var search = document.getElementById('doc-search');
  var docCrosses = document.getElementById('doc-crosses');
  var docCount = document.getElementById('doc-count');
  var sortKey = 'rank';
  var sortDirection = 1;
  function applyDocuments() {
    if (!tbody) return;
    var query = search ? search.value.trim().toLowerCase() : '';
    var crossesOnly = docCrosses ? docCrosses.checked : false;
    var shown = 0;
    slice.call(tbody.rows).forEach(function (row) {
      var keep = (query === '' || (row.getAttribute('data-name') || '').toLowerCase().indexOf(query) >= 0) &&
        (!crossesOnly || Number(row.getAttribute('data-crosses')) > 0);
      row.setAttribute('data-out', keep ? '0' : '1');
      if (keep) shown += 1;
    });
    if (docCount) docCount.textContent = plural(shown, 'document') + ' of ' + tbody.rows.length + ' match.';
    pagers['documents-body'].page = 0;
    pagers['documents-body'].render();
  }
  function sortDocuments(key, direction) {
    var numeric = key !== 'name';
    var rows = slice.call(tbody.rows);
    rows.sort(function (a, b) {
      var x = a.getAttribute('data-' + key) || '';
      var y = b.getAttribute('data-' + key) || '';
      var order = numeric ? Number(x) - Number(y) : (x.toLowerCase() < y.toLowerCase() ? -1 : x.toLowerCase() > y.toLowerCase() ? 1 : 0);
      return order * direction || Number(a.getAttribute('data-rank')) - Number(b.getAttribute('data-rank'));
    });
    var fragment = document.createDocumentFragment();
    rows.forEach(function (row) { fragment.appendChild(row); });
    tbody.appendChild(fragment);
    all('th[data-sort]', table).forEach(function (th) {
      if (th.getAttribute('data-sort') === key) th.setAttribute('aria-sort', direction > 0 ? 'ascending' : 'descending');
      else th.removeAttribute('aria-sort');
    });
    sortKey = key;
    sortDirection = direction;
    pagers['documents-body'].page = 0;
    pagers['documents-body'].render();
  }
  if (table && tbody) {
    table.addEventListener('click', function (event) {
      var button = event.target.closest('button.sort');
      if (!button) return;
      var key = button.parentNode.getAttribute('data-sort');
      // A new column starts the way a reviewer reads it: names A to Z, the rank from the worst, counts from the most.
      var first = key === 'name' || key === 'rank' ? 1 : -1;
      sortDocuments(key, key === sortKey ? -sortDirection : first);
    });
    if (search) search.addEventListener('input', applyDocuments);
    if (docCrosses) docCrosses.addEventListener('change', applyDocuments);
    applyDocuments();
  }

  // ---- flag filters, seen marks and the CSV of the flags shown
  var panel = document.getElementById('filters');
  var count = document.getElementById('filter-count');
  var findings = all('#flag-cards .finding');
  var boxes = panel ? all('input[type="checkbox"][data-group]', panel) : [];
  function chosen(group) {
    var set = Object.create(null);
    boxes.forEach(function (box) { if (box.getAttribute('data-group') === group && box.checked) set[box.value] = true; });
    return set;
  }
  function applyFilters() {
    if (!panel) return;
    var severities = chosen('severity');
    var rules = chosen('rule');
    var crossesOnly = document.getElementById('only-crosses').checked;
    var seenMode = document.getElementById('seen-filter').value;
    var shown = 0;
    findings.forEach(function (item) {
      var isSeen = seen[item.getAttribute('data-key')] === 1;
      var box = item.querySelector('input.seen');
      if (box) box.checked = isSeen;
      item.classList.toggle('is-seen', isSeen);
      var visible = severities[item.getAttribute('data-severity')] === true && rules[item.getAttribute('data-rule')] === true &&
        (!crossesOnly || item.getAttribute('data-crosses') === 'true') &&
        (seenMode === 'all' || (seenMode === 'seen') === isSeen);
      item.hidden = !visible;
      if (visible) shown += 1;
    });
    all('#flag-cards .result, #flag-cards .doc-findings').forEach(function (block) {
      block.hidden = block.querySelector('.finding:not([hidden])') === null;
    });
    var documents = 0;
    all('#flag-cards > .doc').forEach(function (section) {
      var keep = section.querySelector('.finding:not([hidden])') !== null;
      section.setAttribute('data-out', keep ? '0' : '1');
      if (keep) documents += 1;
    });
    if (pagers['flag-cards']) pagers['flag-cards'].render();
    if (count) count.textContent = 'Showing ' + shown + ' of ' + findings.length + ' flags, in ' + plural(documents, 'document') + '.';
  }
  function resetFilters() {
    boxes.forEach(function (box) { box.checked = true; });
    document.getElementById('only-crosses').checked = false;
    document.getElementById('seen-filter').value = 'all';
    applyFilters();
  }
  function csvCell(text) {
    var value = String(text).replace(/\\s+/g, ' ').trim();
    if (/^[=+\\-@]/.test(value)) value = "'" + value;
    return '"' + value.replace(/"/g, '""') + '"';
  }
  function textIn(root, selector) {
    var element = root ? root.querySelector(selector) : null;
    return element ? element.textContent : '';
  }
  function exportCsv() {
    var caution = textIn(document, 'header .caution');
    var lines = [['document', 'where', 'result as printed', 'reported and recomputed', 'severity', 'rule', 'changes the conclusion', 'seen', 'why', 'caution'].map(csvCell).join(',')];
    findings.forEach(function (item) {
      if (item.hidden) return;
      var section = item.closest('.doc');
      var result = item.closest('.result');
      lines.push([
        textIn(section, 'h3'),
        textIn(result, '.where'),
        textIn(result, 'mark'),
        (textIn(result, '.numbers') + ' ' + textIn(item, '.implied')).trim(),
        item.getAttribute('data-severity'),
        item.getAttribute('data-rule'),
        item.getAttribute('data-crosses') === 'true' ? 'yes' : 'no',
        seen[item.getAttribute('data-key')] === 1 ? 'yes' : 'no',
        textIn(item, '.message'),
        caution
      ].map(csvCell).join(','));
    });
    var blob = new Blob([lines.join('\\r\\n') + '\\r\\n'], { type: 'text/csv;charset=utf-8' });
    var link = document.createElement('a');
    link.href = URL.createObjectURL(blob);
    link.download = 'plumbline-flags.csv';
    body.appendChild(link);
    link.click();
    setTimeout(function () { URL.revokeObjectURL(link.href); link.remove(); }, 1000);
  }
  if (panel) {
    panel.addEventListener('change', function (event) {
      if (event.target.id === 'seen-filter' || event.target.hasAttribute('data-group') || event.target.id === 'only-crosses') applyFilters();
    });
    panel.addEventListener('click', function (event) {
      var button = event.target.closest('button');
      if (!button) return;
      if (button.id === 'export-csv') { exportCsv(); return; }
      var group = button.getAttribute('data-set');
      if (!group) return;
      var on = button.getAttribute('data-value') === 'on';
      boxes.forEach(function (box) { if (box.getAttribute('data-group') === group) box.checked = on; });
      applyFilters();
    });
    var cards = document.getElementById('flag-cards');
    cards.addEventListener('change', function (event) {
      var box = event.target;
      if (!box.classList || !box.classList.contains('seen')) return;
      var item = box.closest('.finding');
      var key = item.getAttribute('data-key');
      if (box.checked) seen[key] = 1; else delete seen[key];
      item.classList.toggle('is-seen', box.checked);
      saveSeen();
    });
    panel.hidden = false;
    applyFilters();
  }

  // ---- links: bring the target into view (its page, past the filters) before the browser scrolls to it
  function reveal(id) {
    var target = id ? document.getElementById(id) : null;
    if (!target) return;
    var item = target.closest('[data-item]');
    if (target.closest('#flag-cards') && (target.closest('.result[hidden], .doc-findings[hidden]') || (item && item.getAttribute('data-out') === '1'))) resetFilters();
    if (item && pagers[item.parentNode.id]) pagers[item.parentNode.id].show(item);
  }
  document.addEventListener('click', function (event) {
    var link = event.target.closest ? event.target.closest('a') : null;
    var href = link ? link.getAttribute('href') : null;
    if (href && href.charAt(0) === '#') reveal(decodeURIComponent(href.slice(1)));
  });
  window.addEventListener('hashchange', function () { reveal(decodeURIComponent(location.hash.slice(1))); });
  if (location.hash.length > 1) {
    reveal(decodeURIComponent(location.hash.slice(1)));
    var target = document.getElementById(decodeURIComponent(location.hash.slice(1)));
    if (target) setTimeout(function () { target.scrollIntoView(); }, 0);
  }
  }
})();
`;

function sha256Base64(text: string): string {
  return createHash('sha256').update(text, 'utf8').digest('base64');
}

/** The policy: no network, no script but ours, no style but ours. */
export function contentSecurityPolicy(): string {
  return [
    "default-src 'none'",
    `script-src 'sha256-${sha256Base64(BOOT_SCRIPT)}' 'sha256-${sha256Base64(SCRIPT)}'`,
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
  /** 3 fail, 2 warn, 1 note, 0 no flag, -1 unreadable: what the ranking puts first. */
  worst: number;
}

function countDocument(document: DocumentOutput, index: number): DocumentCounts {
  const bySeverity: Record<Severity, number> = { fail: 0, warn: 0, note: 0 };
  let flags = 0;
  let crossesAlpha = 0;
  let flagged = 0;
  const count = (finding: FindingOutput): void => {
    bySeverity[finding.severity] += 1;
    flags += 1;
    if (finding.crossesAlpha) crossesAlpha += 1;
  };
  document.findings.forEach(count);
  for (const statistic of document.statistics) {
    if (statistic.findings.length > 0) flagged += 1;
    statistic.findings.forEach(count);
  }
  const worst = document.status === 'unreadable' ? -1 : bySeverity.fail > 0 ? 3 : bySeverity.warn > 0 ? 2 : bySeverity.note > 0 ? 1 : 0;
  return { index, document, flags, flagged, bySeverity, crossesAlpha, worst };
}

function documentAnchor(index: number): string {
  return `doc-${index + 1}`;
}

function resultAnchor(documentIndex: number, statisticIndex: number): string {
  return `doc-${documentIndex + 1}-result-${statisticIndex + 1}`;
}

/**
 * The documents in the order a reviewer should read them: the worst severity first, then the most fail,
 * warn and note flags, then the most that change the conclusion; unreadable documents last; ties by name.
 */
function rankDocuments(counts: readonly DocumentCounts[]): DocumentCounts[] {
  return [...counts].sort(
    (a, b) =>
      b.worst - a.worst ||
      b.bySeverity.fail - a.bySeverity.fail ||
      b.bySeverity.warn - a.bySeverity.warn ||
      b.bySeverity.note - a.bySeverity.note ||
      b.crossesAlpha - a.crossesAlpha ||
      (a.document.path < b.document.path ? -1 : a.document.path > b.document.path ? 1 : a.index - b.index),
  );
}

const WORST_WORDS: Record<string, string> = { '3': 'fail', '2': 'warn', '1': 'note', '0': 'no flag', '-1': 'unreadable' };

// ---------------------------------------------------------------- the document map

/**
 * The marks of the map and its legend: severity by colour and by shape, so
 * the map reads in grey too. fail a square, warn a triangle, note a circle,
 * a result without a flag a short grey tick.
 */
const SEVERITY_COLOUR: Record<Severity | 'none', string> = { fail: '#b71c1c', warn: '#a35200', note: '#1555a0', none: '#6b7280' };
const SHAPE_WORDS: Record<Severity | 'none', string> = { fail: 'square', warn: 'triangle', note: 'circle', none: 'tick' };

function r1(n: number): string {
  return n.toFixed(1);
}

function markShape(severity: Severity, x: number, y: number): string {
  const colour = SEVERITY_COLOUR[severity];
  if (severity === 'fail') return `<rect x="${r1(x - 4)}" y="${r1(y - 4)}" width="8" height="8" fill="${colour}" stroke="#fff" stroke-width="0.8"/>`;
  if (severity === 'warn') return `<path d="M${r1(x)} ${r1(y - 5)}L${r1(x + 5)} ${r1(y + 4)}L${r1(x - 5)} ${r1(y + 4)}Z" fill="${colour}" stroke="#fff" stroke-width="0.8"/>`;
  return `<circle cx="${r1(x)}" cy="${r1(y)}" r="4" fill="${colour}" stroke="#fff" stroke-width="0.8"/>`;
}

const MAP_WIDTH = 240;
const MAP_HEIGHT = 20;
const MAP_PAD = 6;

/**
 * One document as a strip: its text runs from the left edge to its last
 * result on the right, and each result is a mark where it starts. Flagged
 * results are links to their card; results without a flag are ticks, not
 * links (there is nothing more to read about them than the table below).
 */
function documentMap(document: DocumentOutput, documentIndex: number): string {
  if (document.statistics.length === 0) return '';
  let extent = 1;
  for (const statistic of document.statistics) extent = Math.max(extent, statistic.location.start + 1);
  const x = (start: number): number => MAP_PAD + (start / extent) * (MAP_WIDTH - 2 * MAP_PAD);
  const middle = MAP_HEIGHT / 2;
  const ticks: string[] = [];
  const marks: Record<Severity, string[]> = { fail: [], warn: [], note: [] };
  document.statistics.forEach((statistic, statisticIndex) => {
    const worst = worstSeverity(statistic.findings);
    const px = x(statistic.location.start);
    if (worst === null) {
      ticks.push(`M${r1(px)} ${middle - 4}v8`);
      return;
    }
    const crosses = statistic.findings.some((f) => f.crossesAlpha) ? '; changes the conclusion' : '';
    const label = `${where(statistic)}: ${visibleLine(statistic.text)}: ${worst}${crosses}`;
    marks[worst].push(
      `<a href="#${resultAnchor(documentIndex, statisticIndex)}" class="map-mark" data-severity="${worst}" aria-label="${e(label)}">` +
        `<title>${e(label)}</title>${markShape(worst, px, middle)}</a>`,
    );
  });
  const unflagged = ticks.length;
  return (
    `<svg class="map" viewBox="0 0 ${MAP_WIDTH} ${MAP_HEIGHT}" width="${MAP_WIDTH}" height="${MAP_HEIGHT}" xmlns="http://www.w3.org/2000/svg" role="group" ` +
    `aria-label="${e(`Map of ${countOf(document.statistics.length, 'result')} in order of place in the document`)}">` +
    `<line x1="${MAP_PAD}" y1="${middle}" x2="${MAP_WIDTH - MAP_PAD}" y2="${middle}" stroke="#d9dce1" stroke-width="2"/>` +
    (unflagged > 0 ? `<path class="map-ticks" data-count="${unflagged}" d="${ticks.join('')}" stroke="${SEVERITY_COLOUR.none}" stroke-width="1.5" fill="none"/>` : '') +
    // The worst drawn last, on top.
    marks.note.join('') +
    marks.warn.join('') +
    marks.fail.join('') +
    `</svg>`
  );
}

function legendShape(severity: Severity | 'none'): string {
  const inner = severity === 'none' ? `<path d="M7 2v10" stroke="${SEVERITY_COLOUR.none}" stroke-width="1.5"/>` : markShape(severity, 7, 7);
  return `<svg width="14" height="14" viewBox="0 0 14 14" xmlns="http://www.w3.org/2000/svg" aria-hidden="true">${inner}</svg>`;
}

function mapLegend(): string {
  return (
    `<ul class="legend" aria-label="Legend of the document map">` +
    (['fail', 'warn', 'note', 'none'] as const)
      .map((s) => `<li>${legendShape(s)}${s === 'none' ? 'result without a flag (tick)' : `worst flag ${s} (${SHAPE_WORDS[s]})`}</li>`)
      .join('') +
    `</ul>`
  );
}

/** Items on a list's first page, so the page can show them alone while it loads (BOOT_SCRIPT). */
const PAGE_SIZES = { documents: 25, cards: 10, lists: 100 } as const;

/** The attributes of an item of a paged list: data-first on those of its first page. */
function itemAttributes(position: number, pageSize: number): string {
  return position < pageSize ? 'data-item data-first' : 'data-item';
}

function pagerNav(listId: string, noun: string, sizes: readonly number[]): string {
  const options = sizes.map((size) => `<option value="${size}">${size === 0 ? 'all' : size}</option>`).join('');
  return (
    `<nav class="pager needs-script" data-for="${listId}" data-noun="${noun}" aria-label="Pages of ${noun}s">` +
    `<button type="button" data-go="first">First</button><button type="button" data-go="prev">Previous</button>` +
    `<span class="page-status" aria-live="polite"></span>` +
    `<button type="button" data-go="next">Next</button><button type="button" data-go="last">Last</button>` +
    `<label>per page <select data-size>${options}</select></label></nav>`
  );
}

function documentRow(c: DocumentCounts, rank: number): string {
  const d = c.document;
  const name = `<a href="#${documentAnchor(c.index)}">${e(d.path)}</a>`;
  const data =
    `${itemAttributes(rank - 1, PAGE_SIZES.documents)} data-rank="${rank}" data-name="${e(d.path)}" data-worst="${c.worst}" data-fail="${c.bySeverity.fail}" data-warn="${c.bySeverity.warn}" ` +
    `data-note="${c.bySeverity.note}" data-crosses="${c.crossesAlpha}" data-results="${d.statistics.length}" data-flagged="${c.flagged}"`;
  if (d.status === 'unreadable') {
    return `<tr ${data}><td class="num">${rank}</td><td class="name">${name}</td><td class="map">unreadable</td><td>unreadable</td><td class="num"></td><td class="num"></td><td class="num"></td><td class="num"></td><td class="num"></td></tr>`;
  }
  const map = d.statistics.length === 0 ? (noResultsMessage(d) === null ? '' : 'no results') : documentMap(d, c.index);
  return (
    `<tr ${data}><td class="num">${rank}</td><td class="name">${name}</td><td class="map">${map}</td><td>${WORST_WORDS[String(c.worst)]}</td>` +
    `<td class="num">${c.bySeverity.fail}</td><td class="num">${c.bySeverity.warn}</td><td class="num">${c.bySeverity.note}</td>` +
    `<td class="num">${c.crossesAlpha}</td><td class="num">${c.flagged} of ${d.statistics.length}</td></tr>`
  );
}

/**
 * The documents table: every document, ranked by its worst flag, with its
 * map. The script sorts it by any column, searches it by name, keeps only
 * the documents where a flag changes the conclusion, and pages it.
 */
function documentsTable(ranked: readonly DocumentCounts[]): string {
  const header = (key: string, label: string, numeric: boolean, sorted = false): string =>
    `<th${numeric ? ' class="num"' : ''} data-sort="${key}"${sorted ? ' aria-sort="ascending"' : ''} scope="col"><button type="button" class="sort">${label}</button></th>`;
  const controls =
    `<div class="controls needs-script" role="search">` +
    `<label>Find a document <input type="search" id="doc-search" placeholder="part of its name"></label>` +
    `<label><input type="checkbox" id="doc-crosses"> only documents where a flag changes the conclusion</label>` +
    `<span id="doc-count" aria-live="polite"></span></div>`;
  return (
    `<h3>Documents, worst first, each with a map of its results</h3>` +
    `<p class="explain">Each map is one document: its text runs from the left to its last result on the right, and each result is a mark where it is printed. ` +
    `A flagged result is drawn by its worst flag, in colour and in shape; click it (or press Enter on it) to go to its card. ` +
    `A result without a flag is a grey tick. The documents are ranked by their worst flag, then by their numbers of fail, warn and note flags; ` +
    `click a column's heading to sort by it.</p>` +
    mapLegend() +
    controls +
    pagerNav('documents-body', 'document', [25, 100, 500, 0]) +
    `<table class="documents" id="documents"><thead><tr>` +
    header('rank', 'Rank', true, true) +
    header('name', 'Document', false) +
    `<th scope="col">Where the results are</th>` +
    header('worst', 'Worst flag', false) +
    header('fail', 'fail', true) +
    header('warn', 'warn', true) +
    header('note', 'note', true) +
    header('crosses', 'Change the conclusion', true) +
    header('flagged', 'Flagged results', true) +
    `</tr></thead><tbody id="documents-body" data-paged data-page-size="${PAGE_SIZES.documents}">${ranked.map((c, i) => documentRow(c, i + 1)).join('')}</tbody></table>`
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
  const add = (finding: FindingOutput, index: number): void => {
    let entry = byRule.get(finding.rule);
    if (!entry) {
      entry = { rule: finding.rule, bySeverity: { fail: 0, warn: 0, note: 0 }, total: 0, documents: new Set(), crossesAlpha: 0 };
      byRule.set(finding.rule, entry);
    }
    entry.bySeverity[finding.severity] += 1;
    entry.total += 1;
    entry.documents.add(index);
    if (finding.crossesAlpha) entry.crossesAlpha += 1;
  };
  documents.forEach((document, index) => {
    for (const finding of document.findings) add(finding, index);
    for (const statistic of document.statistics) for (const finding of statistic.findings) add(finding, index);
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

// ---------------------------------------------------------------- documents

/** The key a seen mark is kept under in the browser: the document, the place and the rule, so it survives a new report of the same audit. */
function seenKey(path: string, statistic: StatisticOutput | null, finding: FindingOutput): string {
  const place = statistic === null ? 'document' : `${statistic.location.page ?? ''}:${statistic.location.line}:${statistic.location.column}`;
  return `${path}\u0000${place}\u0000${finding.rule}\u0000${finding.messageId}`;
}

function findingItem(finding: FindingOutput, alpha: number | undefined, key: string): string {
  const crosses = finding.crossesAlpha
    ? ` <span class="alpha">changes the conclusion${alpha === undefined ? '' : ` at alpha ${e(String(alpha))}`}</span>`
    : '';
  return (
    `<li class="finding" data-severity="${e(finding.severity)}" data-rule="${e(finding.rule)}" data-crosses="${finding.crossesAlpha}" data-key="${e(key)}">` +
    `<span class="badge ${e(finding.severity)}">${e(finding.severity)}</span> <span class="rule">${e(finding.rule)}</span>${crosses}` +
    `<label class="seen-box needs-script"><input type="checkbox" class="seen"> seen</label>` +
    `<p class="message">${e(finding.message)}</p>${impliedLine(finding)}</li>`
  );
}

/** For a table row that does not add up: the F and p its own numbers imply, beside the printed F's p (numbersLine). */
function impliedLine(finding: FindingOutput): string {
  const implied = finding.rowImplies;
  if (!implied) return '';
  // Four significant digits: the interval of a row printed to two decimals is narrow.
  const number = (value: number): string => (value !== 0 && Math.abs(value) < 0.001 ? value.toExponential(3).replace('e+', 'e') : String(Number(value.toPrecision(4))));
  const range = (low: number | null, high: number | null): string => (low !== null && high !== null && number(low) !== number(high) ? ` (${number(low)} to ${number(high)})` : '');
  const f = `F = ${number(implied.statistic)}${range(implied.statisticLow, implied.statisticHigh)}`;
  const p = implied.p === null ? '' : `, p = ${number(implied.p)}${range(implied.pLow, implied.pHigh)}`;
  return (
    `<p class="implied">The row\u2019s own numbers imply ${f}${p}: ${e(implied.from)}; in brackets, the range over the values that round to the printed cells.</p>`
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
    const printedF = statistic.findings.some((f) => f.rowImplies) ? ' from the printed F' : '';
    parts.push(`recomputed p${printedF} = ${formatNumber(rec.p)}${range}, ${rec.tails === 'two' ? 'two-tailed' : 'upper tail'}`);
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

function resultBlock(document: DocumentOutput, statistic: StatisticOutput, documentIndex: number, statisticIndex: number): string {
  const worst = worstSeverity(statistic.findings);
  return (
    `<article class="result sev-${worst ?? 'none'}" id="${resultAnchor(documentIndex, statisticIndex)}" tabindex="-1">` +
    `<div class="where">${e(where(statistic))}</div>` +
    contextBlock(statistic) +
    numbersLine(statistic) +
    `<ul class="findings">${statistic.findings.map((f) => findingItem(f, document.alpha, seenKey(document.path, statistic, f))).join('')}</ul>` +
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

function flaggedDocument(counts: DocumentCounts, position: number): string {
  const { document, index } = counts;
  const documentFindings =
    document.findings.length > 0
      ? `<div class="doc-findings"><h4>About the document as a whole</h4><ul class="findings">${document.findings.map((f) => findingItem(f, document.alpha, seenKey(document.path, null, f))).join('')}</ul></div>`
      : '';
  const results = document.statistics
    .map((s, i) => (s.findings.length > 0 ? resultBlock(document, s, index, i) : ''))
    .join('');
  return (
    `<section class="doc flagged" id="${documentAnchor(index)}" ${itemAttributes(position, PAGE_SIZES.cards)} tabindex="-1">` +
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
    `<fieldset><legend>Show</legend>` +
    `<label><input type="checkbox" id="only-crosses"> changes the conclusion only (${report.summary.crossesAlpha})</label>` +
    `<label>marked <select id="seen-filter"><option value="all">seen or not</option><option value="unseen">not yet seen</option><option value="seen">seen</option></select></label>` +
    `<button type="button" id="export-csv">Save the flags shown as CSV</button></fieldset>` +
    `<p class="filter-count" id="filter-count" aria-live="polite"></p>` +
    `<p class="explain">A flag marked seen is kept in this browser (its local storage), for this document, place and rule, in every plumbline report opened here; nothing is sent anywhere.</p></form>`
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

  const ranked = rankDocuments(counts);
  const overview =
    `<section class="overview" id="overview"><h2>Overview</h2>` +
    rulesTable(rules) +
    documentsTable(ranked) +
    `</section>`;

  // The cards follow the ranking: the worst documents first.
  const flaggedRanked = ranked.filter((c) => c.document.status === 'checked' && c.flags > 0);
  const flaggedSection =
    `<section id="flagged"><h2>Flagged results</h2>` +
    (flagged.length === 0
      ? `<p>No result was flagged.</p>`
      : filtersPanel(report, rules) +
        pagerNav('flag-cards', 'document', [10, 25, 100, 0]) +
        `<div id="flag-cards" data-paged data-page-size="${PAGE_SIZES.cards}">${flaggedRanked.map((c, i) => flaggedDocument(c, i)).join('')}</div>`) +
    `</section>`;

  const cleanSection =
    clean.length === 0
      ? ''
      : `<section id="clean"><h2>Documents without flags (${clean.length})</h2>` +
        pagerNav('clean-list', 'document', [100, 500, 0]) +
        `<ul class="clean-list" id="clean-list" data-paged data-page-size="${PAGE_SIZES.lists}">` +
        clean
          .map(
            (c, i) =>
              `<li class="clean${noResultsMessage(c.document) === null ? '' : ' no-results'}" id="${documentAnchor(c.index)}" ${itemAttributes(i, PAGE_SIZES.lists)} tabindex="-1">${e(c.document.path)}: ${cleanDocumentWords(c.document)}` +
              `${tablesNotReadBlock(c.document)}${allResultsTable(c.document, c.index)}</li>`,
          )
          .join('') +
        `</ul></section>`;

  const unreadableSection =
    unreadable.length === 0
      ? ''
      : `<section id="unreadable"><h2>Unreadable documents (${unreadable.length})</h2>` +
        pagerNav('unreadable-list', 'document', [100, 500, 0]) +
        `<ul id="unreadable-list" data-paged data-page-size="${PAGE_SIZES.lists}">` +
        unreadable
          .map(
            (c, i) =>
              `<li class="unreadable" id="${documentAnchor(c.index)}" ${itemAttributes(i, PAGE_SIZES.lists)} tabindex="-1"><span class="path">${e(c.document.path)}</span>: ` +
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
    `<title>${e(title)}</title>\n<style>${STYLE}</style>\n<script>${BOOT_SCRIPT}</script>\n</head>\n<body>\n<main>\n` +
    `<header><h1>plumbline report</h1><p class="meta">${e(report.tool.name)} ${e(report.tool.version)}</p>` +
    `<p class="caution" role="note">${e(report.caution)}</p>${totals}</header>\n` +
    `${overview}\n${flaggedSection}\n${cleanSection}\n${unreadableSection}\n` +
    `<footer><p class="caution">${e(report.caution)}</p></footer>\n` +
    `</main>\n<script>${SCRIPT}</script>\n</body>\n</html>\n`
  );
}
