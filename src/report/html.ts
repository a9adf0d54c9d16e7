import { createHash } from 'node:crypto';
import type { DocumentOutput, FindingOutput, Report, StatisticOutput, StreamedReport } from './model.js';
import { visibleControls } from './visible.js';
import { tableNotReadTag } from './tableNotRead.js';
import { countOf, crossesAlphaPhrase, noResultsMessage, tablesNotReadPhrase } from './wording.js';

/**
 * One self-contained HTML page for reading a report in a browser: no network
 * access, no external fonts or scripts.
 *
 * The page is written as a stream, a document at a time: a fixed head (the
 * totals come from the summary, known before the documents), then each
 * document's details as compact data (JSON in `<script type="application/
 * json">` blocks, which a browser never runs), then the page's own script.
 * Memory does not grow with the documents, and a page of 10,000 documents is
 * a third of the size it was as markup: what was repeated markup per result
 * (a table row, a map mark, a card) is drawn by the script, only for the
 * page of a list being shown. The script ranks the documents, counts the
 * flags by rule, sorts, searches and pages the document table, pages the
 * cards and the lists, filters the flags, keeps the reviewer's seen marks in
 * localStorage and saves the flags shown as CSV.
 *
 * Safety: the data is JSON with every `<` written as `\u003c`, so no text
 * from a document can end its block or open markup; the script sets it only
 * as text (text nodes and attribute values, never markup). The script is
 * fixed text, allowed by its sha256 hash in a Content-Security-Policy that
 * allows no other script (a data block is not a script to the policy: it is
 * never run). Control characters in document text are made visible before
 * they are written (src/report/visible.ts).
 */

type Severity = FindingOutput['severity'];

const SEVERITIES: readonly Severity[] = ['fail', 'warn', 'note'];
/** How the data writes a severity: the rank the script sorts by (3 fail, 2 warn, 1 note). */
const SEVERITY_CODE: Record<Severity, number> = { fail: 3, warn: 2, note: 1 };

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

/** Document text as the page shows it: controls made visible, tab and line breaks kept as white space. */
function shown(value: string): string {
  return visibleControls(value, '\t\n\r');
}

// ---------------------------------------------------------------- style and script

const STYLE = `
:root { color-scheme: light; --fail: #b71c1c; --warn: #a35200; --note: #1555a0; --none: #6b7280; --line: #d9dce1; --soft: #f5f6f8; --focus: #1d4ed8; }
* { box-sizing: border-box; }
[hidden] { display: none !important; }
body:not(.scripted) .needs-script { display: none !important; }
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
#rule-boxes { display: contents; }
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
.noscript { border: 2px solid var(--line); padding: .75rem 1rem; border-radius: 6px; }
@media print { .filters, .controls, .pager, .seen-box { display: none !important; } .doc { break-inside: avoid-page; } }
`;
/**
 * The page's script. Fixed text (no data in it), allowed by its hash. It
 * reads the documents' data blocks once, ranks the documents and counts the
 * flags by rule, then draws only what is shown: the page of the document
 * table (each row with its map), the page of flag cards, the page of each
 * list, a document's table of all results when it is opened. Sorting,
 * searching, filtering and paging work on the data and draw the new page.
 * Text from documents is set only as text. A link to a result on another
 * page, or one the filters hide, brings it into view first.
 */
const SCRIPT = `
(function () {
  'use strict';
  var body = document.body;
  body.classList.add('scripted');
  var slice = Array.prototype.slice;
  var SVG = 'http://www.w3.org/2000/svg';
  var SEVERITY = ['', 'note', 'warn', 'fail'];
  var WORST_WORDS = { '3': 'fail', '2': 'warn', '1': 'note', '0': 'no flag', '-1': 'unreadable' };
  var COLOUR = { fail: '#b71c1c', warn: '#a35200', note: '#1555a0', none: '#6b7280' };
  function all(selector, root) { return slice.call((root || document).querySelectorAll(selector)); }
  function plural(n, one, many) { return n + ' ' + (n === 1 ? one : (many || one + 's')); }
  function make(tag, className, text) {
    var element = document.createElement(tag);
    if (className) element.className = className;
    if (text !== undefined && text !== null) element.textContent = text;
    return element;
  }
  function add(parent) {
    for (var i = 1; i < arguments.length; i += 1) {
      var child = arguments[i];
      if (child === null || child === undefined) continue;
      parent.appendChild(typeof child === 'string' ? document.createTextNode(child) : child);
    }
    return parent;
  }
  function shape(tag, attributes) {
    var element = document.createElementNS(SVG, tag);
    for (var name in attributes) element.setAttribute(name, attributes[name]);
    return element;
  }
  function clear(element) { while (element.firstChild) element.removeChild(element.firstChild); }

  // ---- the data: each document once, with its counts
  var docs = [];
  all('script.report-data').forEach(function (block) {
    var list = JSON.parse(block.textContent);
    for (var i = 0; i < list.length; i += 1) docs.push(list[i]);
  });
  docs.forEach(function (d, index) {
    d.index = index;
    d.r = d.r || []; d.c = d.c || []; d.g = d.g || []; d.t = d.t || [];
    d.fail = 0; d.warn = 0; d.note = 0; d.crosses = 0; d.flags = 0;
    d.flagged = d.c.length;
    function count(f) { d[SEVERITY[f[0]]] += 1; d.flags += 1; if (f[2]) d.crosses += 1; }
    d.g.forEach(count);
    d.c.forEach(function (card) { card[4].forEach(count); });
    d.worst = d.x !== undefined ? -1 : d.fail ? 3 : d.warn ? 2 : d.note ? 1 : 0;
  });
  function byPath(a, b) { return a.p < b.p ? -1 : a.p > b.p ? 1 : a.index - b.index; }
  // Worst severity first, then the most fail, warn and note flags, then the most that change the conclusion; unreadable last; ties by name.
  var ranked = docs.slice().sort(function (a, b) {
    return b.worst - a.worst || b.fail - a.fail || b.warn - a.warn || b.note - a.note || b.crosses - a.crosses || byPath(a, b);
  });
  ranked.forEach(function (d, i) { d.rank = i + 1; });
  var flaggedDocs = ranked.filter(function (d) { return d.worst > 0; });
  var cleanDocs = docs.filter(function (d) { return d.worst === 0; });
  var unreadableDocs = docs.filter(function (d) { return d.worst === -1; });

  /** p and other small numbers, readable and short: 0.0123, 1.33e-8 (the data holds them to three significant digits). */
  function formatNumber(value) {
    if (value === null || value === undefined) return '';
    if (value === 0) return '0';
    var magnitude = Math.abs(value);
    if (magnitude < 0.001 || magnitude >= 1e6) return value.toExponential(2).replace('e+', 'e');
    return String(value);
  }
  function numbersText(n) {
    var parts = [];
    if (n[0]) parts.push('reported p ' + n[0]);
    if (n[1] !== null) {
      var p = formatNumber(n[1]);
      var range = n[2] !== null && n[3] !== null && (formatNumber(n[2]) !== p || formatNumber(n[3]) !== p)
        ? ' (' + formatNumber(n[2]) + ' to ' + formatNumber(n[3]) + ' for values that round to the printed ones)' : '';
      parts.push('recomputed p' + (n[5] ? ' from the printed F' : '') + ' = ' + p + range + ', ' + (n[4] === 2 ? 'two-tailed' : 'upper tail'));
    } else if (n[6]) parts.push('not recomputed: ' + n[6]);
    return parts.join('; ');
  }
  function where(page, line, column) { return (page ? 'page ' + page + ', ' : '') + 'line ' + line + ', column ' + column; }
  function documentId(d) { return 'doc-' + (d.index + 1); }
  function resultId(d, resultIndex) { return 'doc-' + (d.index + 1) + '-result-' + (resultIndex + 1); }
  /** The key a seen mark is kept under: the document, the place and the rule, so it survives a new report of the same audit. */
  function keyOf(d, card, f) {
    var place = 'document';
    if (card) { var r = d.r[card[0]]; place = (r[0] ? r[0] : '') + ':' + r[1] + ':' + r[2]; }
    // The separator is written as the four characters \\x00, as the report has always kept it.
    return d.p + '\\\\x00' + place + '\\\\x00' + f[1] + '\\\\x00' + f[4];
  }

  // ---- marks kept in the browser
  var SEEN_KEY = 'plumbline.seen.v1';
  var store = null;
  try { store = window.localStorage; store.getItem(SEEN_KEY); } catch (error) { store = null; }
  var seen = {};
  if (store) { try { seen = JSON.parse(store.getItem(SEEN_KEY) || '{}') || {}; } catch (error) { seen = {}; } }
  function saveSeen() { if (store) { try { store.setItem(SEEN_KEY, JSON.stringify(seen)); } catch (error) { /* full or refused: the marks last for this visit */ } } }

  // ---- pagers: a list drawn a page at a time from the items it is given
  var pagers = {};
  function makePager(id, count, draw) {
    var list = document.getElementById(id);
    if (!list) return null;
    var nav = document.querySelector('nav.pager[data-for="' + id + '"]');
    var pager = { size: Number(list.getAttribute('data-page-size')) || 25, page: 0 };
    pager.render = function () {
      var kept = count();
      var size = pager.size > 0 ? pager.size : Math.max(1, kept);
      var pages = Math.max(1, Math.ceil(kept / size));
      if (pager.page >= pages) pager.page = pages - 1;
      if (pager.page < 0) pager.page = 0;
      var from = pager.page * size;
      var to = Math.min(kept, from + size);
      var fragment = document.createDocumentFragment();
      for (var i = from; i < to; i += 1) fragment.appendChild(draw(i));
      clear(list);
      list.appendChild(fragment);
      pager.drawn = true;
      if (nav) {
        var noun = nav.getAttribute('data-noun') || 'item';
        nav.querySelector('.page-status').textContent = 'Page ' + (pager.page + 1) + ' of ' + pages + ': ' + (kept === 0 ? 0 : from + 1) + ' to ' + to + ' of ' + plural(kept, noun);
        nav.querySelector('[data-go="first"]').disabled = pager.page === 0;
        nav.querySelector('[data-go="prev"]').disabled = pager.page === 0;
        nav.querySelector('[data-go="next"]').disabled = pager.page >= pages - 1;
        nav.querySelector('[data-go="last"]').disabled = pager.page >= pages - 1;
      }
    };
    pager.show = function (position) {
      var page = Math.floor(position / (pager.size > 0 ? pager.size : 1e9));
      // Drawn again only for another page: the browser may be scrolling to an element of this one.
      if (page === pager.page && pager.drawn) return;
      pager.page = page;
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
    pagers[id] = pager;
    return pager;
  }

  // ---- flags by rule
  var ruleCounts = {};
  var ruleList = [];
  docs.forEach(function (d) {
    function tally(f) {
      var entry = ruleCounts[f[1]];
      if (!entry) { entry = ruleCounts[f[1]] = { rule: f[1], fail: 0, warn: 0, note: 0, total: 0, documents: 0, last: -1, crosses: 0 }; ruleList.push(entry); }
      entry[SEVERITY[f[0]]] += 1;
      entry.total += 1;
      if (entry.last !== d.index) { entry.documents += 1; entry.last = d.index; }
      if (f[2]) entry.crosses += 1;
    }
    d.g.forEach(tally);
    d.c.forEach(function (card) { card[4].forEach(tally); });
  });
  ruleList.sort(function (a, b) { return b.total - a.total || (a.rule < b.rule ? -1 : a.rule > b.rule ? 1 : 0); });
  (function drawRules() {
    var holder = document.getElementById('by-rule');
    if (!holder) return;
    if (ruleList.length === 0) { add(holder, make('p', null, 'No flags.')); return; }
    var table = make('table', 'by-rule');
    var head = add(make('tr'), make('th', null, 'Rule'));
    ['Flags', 'fail', 'warn', 'note', 'Documents', 'Change the conclusion'].forEach(function (label) { head.appendChild(make('th', 'num', label)); });
    add(table, add(make('thead'), head));
    var tbody = make('tbody');
    ruleList.forEach(function (r) {
      var row = add(make('tr'), make('td', 'rule', r.rule));
      [r.total, r.fail, r.warn, r.note, r.documents, r.crosses].forEach(function (n) { row.appendChild(make('td', 'num', String(n))); });
      tbody.appendChild(row);
    });
    add(holder, add(table, tbody));
  })();

  // ---- the document map: a strip per document, a mark where each result is
  function markShape(severity, x, y) {
    var colour = COLOUR[severity];
    var common = { fill: colour, stroke: '#fff', 'stroke-width': '0.8' };
    var element;
    if (severity === 'fail') element = shape('rect', { x: (x - 4).toFixed(1), y: (y - 4).toFixed(1), width: '8', height: '8' });
    else if (severity === 'warn') element = shape('path', { d: 'M' + x.toFixed(1) + ' ' + (y - 5).toFixed(1) + 'L' + (x + 5).toFixed(1) + ' ' + (y + 4).toFixed(1) + 'L' + (x - 5).toFixed(1) + ' ' + (y + 4).toFixed(1) + 'Z' });
    else element = shape('circle', { cx: x.toFixed(1), cy: y.toFixed(1), r: '4' });
    for (var name in common) element.setAttribute(name, common[name]);
    return element;
  }
  function documentMap(d) {
    var svg = shape('svg', { 'class': 'map', viewBox: '0 0 240 20', width: '240', height: '20', role: 'group', 'aria-label': 'Map of ' + plural(d.r.length, 'result') + ' in order of place in the document' });
    svg.appendChild(shape('line', { x1: '6', y1: '10', x2: '234', y2: '10', stroke: '#d9dce1', 'stroke-width': '2' }));
    var ticks = '';
    var unflagged = 0;
    var marks = { fail: [], warn: [], note: [] };
    var cardOf = {};
    d.c.forEach(function (card) { cardOf[card[0]] = card; });
    d.r.forEach(function (r, i) {
      var x = r[3] / 10;
      if (r[7] <= 0) { ticks += 'M' + x.toFixed(1) + ' 6v8'; unflagged += 1; return; }
      var worst = SEVERITY[r[7]];
      var crosses = cardOf[i] && cardOf[i][4].some(function (f) { return f[2] === 1; }) ? '; changes the conclusion' : '';
      var label = where(r[0], r[1], r[2]) + ': ' + r[4] + ': ' + worst + crosses;
      var link = shape('a', { href: '#' + resultId(d, i), 'class': 'map-mark', 'data-severity': worst, 'aria-label': label });
      link.appendChild(shape('title', {})).textContent = label;
      link.appendChild(markShape(worst, x, 10));
      marks[worst].push(link);
    });
    if (unflagged > 0) svg.appendChild(shape('path', { 'class': 'map-ticks', 'data-count': String(unflagged), d: ticks, stroke: COLOUR.none, 'stroke-width': '1.5', fill: 'none' }));
    // The worst drawn last, on top.
    marks.note.concat(marks.warn, marks.fail).forEach(function (mark) { svg.appendChild(mark); });
    return svg;
  }

  // ---- the document table: sort, search, changes the conclusion only
  var table = document.getElementById('documents');
  var search = document.getElementById('doc-search');
  var docCrosses = document.getElementById('doc-crosses');
  var docCount = document.getElementById('doc-count');
  var sortKey = 'rank';
  var sortDirection = 1;
  var sorted = ranked.slice();
  var shownDocs = sorted;
  function numberCell(value) { return make('td', 'num', String(value)); }
  function documentRow(i) {
    var d = shownDocs[i];
    var row = make('tr');
    var data = { rank: d.rank, name: d.p, worst: d.worst, fail: d.fail, warn: d.warn, note: d.note, crosses: d.crosses, results: d.r.length, flagged: d.flagged };
    for (var name in data) row.setAttribute('data-' + name, String(data[name]));
    var link = make('a', null, d.p);
    link.setAttribute('href', '#' + documentId(d));
    var nameCell = add(make('td', 'name'), link);
    var map = make('td', 'map');
    if (d.worst === -1) map.textContent = 'unreadable';
    else if (d.r.length === 0) map.textContent = 'no results';
    else map.appendChild(documentMap(d));
    add(row, numberCell(d.rank), nameCell, map);
    if (d.worst === -1) {
      add(row, make('td', null, 'unreadable'));
      for (var k = 0; k < 5; k += 1) row.appendChild(make('td', 'num'));
      return row;
    }
    return add(row, make('td', null, WORST_WORDS[String(d.worst)]), numberCell(d.fail), numberCell(d.warn), numberCell(d.note), numberCell(d.crosses), numberCell(d.flagged + ' of ' + d.r.length));
  }
  var documentsPager = makePager('documents-body', function () { return shownDocs.length; }, documentRow);
  function applyDocuments() {
    var query = search ? search.value.trim().toLowerCase() : '';
    var crossesOnly = docCrosses ? docCrosses.checked : false;
    shownDocs = sorted.filter(function (d) { return (query === '' || d.p.toLowerCase().indexOf(query) >= 0) && (!crossesOnly || d.crosses > 0); });
    if (docCount) docCount.textContent = plural(shownDocs.length, 'document') + ' of ' + docs.length + ' match.';
    documentsPager.page = 0;
    documentsPager.render();
  }
  function sortDocuments(key, direction) {
    sorted = ranked.slice();
    if (key !== 'rank' || direction !== 1) {
      sorted.sort(function (a, b) {
        var order;
        if (key === 'name') { var x = a.p.toLowerCase(); var y = b.p.toLowerCase(); order = x < y ? -1 : x > y ? 1 : 0; }
        else order = a[key] - b[key];
        return order * direction || a.rank - b.rank;
      });
    }
    all('th[data-sort]', table).forEach(function (th) {
      if (th.getAttribute('data-sort') === key) th.setAttribute('aria-sort', direction > 0 ? 'ascending' : 'descending');
      else th.removeAttribute('aria-sort');
    });
    sortKey = key;
    sortDirection = direction;
    applyDocuments();
  }
  if (table && documentsPager) {
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

  // ---- what a document shows: its line of counts, its tables not read, its table of all results
  function metaOf(d) {
    var bits = [plural(d.r.length, 'result'), d.flagged + ' flagged'];
    if (d.f) bits.push('format ' + d.f);
    if (d.a !== undefined) bits.push('alpha ' + d.a);
    var fragment = document.createDocumentFragment();
    add(fragment, make('p', 'meta', bits.join(' \\u00B7 ')), d.n !== undefined ? make('p', 'no-results', d.n) : null);
    return fragment;
  }
  function tablesNotRead(d) {
    if (d.t.length === 0) return null;
    var list = make('ul');
    d.t.forEach(function (t) {
      add(list, add(make('li'), make('span', 'badge warn', t[0]), ' ', make('span', 'where', (t[1] ? 'page ' + t[1] + ', ' : '') + 'line ' + t[2]), ': ' + t[3]));
    });
    return add(make('div', 'tables-not-read'), make('h4', null, 'Tables not read'), list);
  }
  function allResults(d) {
    if (d.r.length === 0) return null;
    var details = make('details');
    details.appendChild(make('summary', null, 'All ' + plural(d.r.length, 'result') + ' in this document'));
    // Drawn when opened: a large document's rows are not made until they are read.
    details.addEventListener('toggle', function () {
      if (!details.open || details.querySelector('table')) return;
      var tableOfAll = make('table', 'all-results');
      var head = make('tr');
      ['Where', 'Result', 'Reported p'].forEach(function (label) { head.appendChild(make('th', null, label)); });
      add(head, make('th', 'num', 'Recomputed p'), make('th', null, 'Worst flag'));
      add(tableOfAll, add(make('thead'), head));
      var tbody = make('tbody');
      d.r.forEach(function (r, i) {
        var label;
        if (r[7] > 0) { label = make('a', null, SEVERITY[r[7]]); label.setAttribute('href', '#' + resultId(d, i)); }
        else label = r[7] === 0 ? 'no flag' : 'not checked';
        add(tbody, add(make('tr'), make('td', null, where(r[0], r[1], r[2])), add(make('td'), make('code', null, r[4])), make('td', null, typeof r[5] === 'number' ? r[4].slice(r[4].length - r[5]) : r[5]), make('td', 'num', formatNumber(r[6])), add(make('td'), label)));
      });
      details.appendChild(add(tableOfAll, tbody));
    });
    return details;
  }

  // ---- flag cards, filters, seen marks and the CSV of the flags shown
  var panel = document.getElementById('filters');
  var cards = document.getElementById('flag-cards');
  var count = document.getElementById('filter-count');
  var ruleBoxes = document.getElementById('rule-boxes');
  if (ruleBoxes) {
    ruleList.forEach(function (r) {
      var box = make('input');
      box.type = 'checkbox';
      box.defaultChecked = true;
      box.checked = true;
      box.value = r.rule;
      box.setAttribute('data-group', 'rule');
      add(ruleBoxes, add(make('label'), box, ' ', make('span', 'rule', r.rule), ' (' + r.total + ')'));
    });
  }
  var boxes = panel ? all('input[type="checkbox"][data-group]', panel) : [];
  var filter = null;
  function readFilters() {
    var chosen = { severity: {}, rule: {} };
    boxes.forEach(function (box) { if (box.checked) chosen[box.getAttribute('data-group')][box.value] = true; });
    return { severities: chosen.severity, rules: chosen.rule, crossesOnly: document.getElementById('only-crosses').checked, seenMode: document.getElementById('seen-filter').value };
  }
  function shows(d, card, f) {
    if (filter.severities[SEVERITY[f[0]]] !== true || filter.rules[f[1]] !== true) return false;
    if (filter.crossesOnly && f[2] !== 1) return false;
    return filter.seenMode === 'all' || (filter.seenMode === 'seen') === (seen[keyOf(d, card, f)] === 1);
  }
  function anyShown(d) {
    if (d.g.some(function (f) { return shows(d, null, f); })) return true;
    return d.c.some(function (card) { return card[4].some(function (f) { return shows(d, card, f); }); });
  }
  var cardDocs = flaggedDocs;
  function findingItem(d, card, f) {
    var key = keyOf(d, card, f);
    var severity = SEVERITY[f[0]];
    var item = make('li', 'finding');
    item.setAttribute('data-severity', severity);
    item.setAttribute('data-rule', f[1]);
    item.setAttribute('data-crosses', f[2] === 1 ? 'true' : 'false');
    item.setAttribute('data-key', key);
    var isSeen = seen[key] === 1;
    item.classList.toggle('is-seen', isSeen);
    var box = make('input', 'seen');
    box.type = 'checkbox';
    box.checked = isSeen;
    add(item, make('span', 'badge ' + severity, severity), ' ', make('span', 'rule', f[1]));
    if (f[2] === 1) add(item, ' ', make('span', 'alpha', 'changes the conclusion' + (d.a === undefined ? '' : ' at alpha ' + d.a)));
    add(item, add(make('label', 'seen-box needs-script'), box, ' seen'), make('p', 'message', f[3]), f[5] ? make('p', 'implied', f[5]) : null);
    item.hidden = !shows(d, card, f);
    return item;
  }
  function findingList(d, card, findings) {
    var list = make('ul', 'findings');
    findings.forEach(function (f) { list.appendChild(findingItem(d, card, f)); });
    return list;
  }
  function drawCard(i) {
    var d = cardDocs[i];
    var section = make('section', 'doc flagged');
    section.id = documentId(d);
    section.tabIndex = -1;
    add(section, make('h3', null, d.p), metaOf(d));
    if (d.g.length > 0) {
      var whole = add(make('div', 'doc-findings'), make('h4', null, 'About the document as a whole'), findingList(d, null, d.g));
      whole.hidden = !d.g.some(function (f) { return shows(d, null, f); });
      section.appendChild(whole);
    }
    d.c.forEach(function (card) {
      var r = d.r[card[0]];
      var article = make('article', 'result sev-' + SEVERITY[r[7]]);
      article.id = resultId(d, card[0]);
      article.tabIndex = -1;
      add(article, make('div', 'where', where(r[0], r[1], r[2])), add(make('p', 'context'), card[1], make('mark', null, card[5] || r[4]), card[2]));
      var numbers = numbersText(card[3]);
      if (numbers) article.appendChild(make('p', 'numbers', numbers));
      article.appendChild(findingList(d, card, card[4]));
      article.hidden = !card[4].some(function (f) { return shows(d, card, f); });
      section.appendChild(article);
    });
    add(section, tablesNotRead(d), allResults(d));
    return section;
  }
  var cardsPager = cards ? makePager('flag-cards', function () { return cardDocs.length; }, drawCard) : null;
  function applyFilters() {
    if (!panel) return;
    filter = readFilters();
    var shown = 0;
    var total = 0;
    cardDocs = flaggedDocs.filter(function (d) {
      var before = shown;
      d.g.forEach(function (f) { total += 1; if (shows(d, null, f)) shown += 1; });
      d.c.forEach(function (card) { card[4].forEach(function (f) { total += 1; if (shows(d, card, f)) shown += 1; }); });
      return shown > before;
    });
    cardsPager.render();
    if (count) count.textContent = 'Showing ' + shown + ' of ' + total + ' flags, in ' + plural(cardDocs.length, 'document') + '.';
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
  function exportCsv() {
    var caution = document.querySelector('header .caution').textContent;
    var lines = [['document', 'where', 'result as printed', 'reported and recomputed', 'severity', 'rule', 'changes the conclusion', 'seen', 'why', 'caution'].map(csvCell).join(',')];
    function line(d, card, f) {
      if (!shows(d, card, f)) return;
      var r = card ? d.r[card[0]] : null;
      lines.push([
        d.p,
        r ? where(r[0], r[1], r[2]) : '',
        card ? card[5] || r[4] : '',
        ((card ? numbersText(card[3]) : '') + ' ' + f[5]).trim(),
        SEVERITY[f[0]],
        f[1],
        f[2] === 1 ? 'yes' : 'no',
        seen[keyOf(d, card, f)] === 1 ? 'yes' : 'no',
        f[3],
        caution
      ].map(csvCell).join(','));
    }
    flaggedDocs.forEach(function (d) {
      d.g.forEach(function (f) { line(d, null, f); });
      d.c.forEach(function (card) { card[4].forEach(function (f) { line(d, card, f); }); });
    });
    var blob = new Blob([lines.join('\\r\\n') + '\\r\\n'], { type: 'text/csv;charset=utf-8' });
    var link = document.createElement('a');
    link.href = URL.createObjectURL(blob);
    link.download = 'plumbline-flags.csv';
    body.appendChild(link);
    link.click();
    setTimeout(function () { URL.revokeObjectURL(link.href); link.remove(); }, 1000);
  }
  if (panel && cardsPager) {
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

  // ---- the lists of documents without flags and of unreadable documents
  function drawClean(i) {
    var d = cleanDocs[i];
    var item = make('li', d.n === undefined ? 'clean' : 'clean no-results');
    item.id = documentId(d);
    item.tabIndex = -1;
    add(item, d.p + ': ' + (d.n === undefined ? plural(d.r.length, 'result') + ', none flagged' : '0 results. ' + d.n), tablesNotRead(d), allResults(d));
    return item;
  }
  function drawUnreadable(i) {
    var d = unreadableDocs[i];
    var item = make('li', 'unreadable');
    item.id = documentId(d);
    item.tabIndex = -1;
    return add(item, make('span', 'path', d.p), ': ', make('span', 'reason', d.x));
  }
  var cleanPager = null;
  if (cleanDocs.length > 0) {
    document.getElementById('clean-count').textContent = String(cleanDocs.length);
    document.getElementById('clean').hidden = false;
    cleanPager = makePager('clean-list', function () { return cleanDocs.length; }, drawClean);
    cleanPager.render();
  }
  var unreadablePager = makePager('unreadable-list', function () { return unreadableDocs.length; }, drawUnreadable);
  if (unreadablePager) unreadablePager.render();

  // ---- links: draw the target (its page, past the filters) before the browser scrolls to it
  function reveal(id) {
    var match = /^doc-(\\d+)(?:-result-(\\d+))?$/.exec(id || '');
    var d = match ? docs[Number(match[1]) - 1] : undefined;
    if (!d) return;
    if (d.worst > 0 && cardsPager) {
      var resultIndex = match[2] ? Number(match[2]) - 1 : -1;
      var hidden = cardDocs.indexOf(d) < 0;
      if (!hidden && resultIndex >= 0) {
        hidden = !d.c.some(function (card) { return card[0] === resultIndex && card[4].some(function (f) { return shows(d, card, f); }); });
      }
      if (hidden) resetFilters();
      cardsPager.show(cardDocs.indexOf(d));
    } else if (d.worst === 0 && cleanPager) cleanPager.show(cleanDocs.indexOf(d));
    else if (d.worst === -1 && unreadablePager) unreadablePager.show(unreadableDocs.indexOf(d));
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
  document.documentElement.setAttribute('data-ready', '');
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

// ---------------------------------------------------------------- the data of one document

/**
 * A finding as data: [severity (3 fail, 2 warn, 1 note), rule, changes the conclusion (1 or 0), message,
 * message id (part of the key a seen mark is kept under), the F and p a table row's own numbers imply, or ''].
 */
export type FindingData = [number, string, number, string, string, string];
/**
 * A result as data, for its row in the table of all results and its mark on the map: [page (0 for none),
 * line, column, place on the map (tenths of a unit of the map's 240), the result as printed on one line,
 * reported p (or, when the result as printed ends with it, its length), recomputed p (three significant digits, or null), worst flag (3 fail, 2 warn, 1 note, 0 none,
 * -1 not checked)].
 */
export type ResultData = [number, number, number, number, string, string | number, number | null, number];
/**
 * A flagged result's p values: [reported p ('' when none), recomputed p, its lowest and highest over the values
 * that round to the printed ones (three significant digits, or null), 2 two-tailed or 1 upper tail, 1 when
 * recomputed from the printed F of a table row that does not add up, why it was not recomputed ('' when it was)].
 */
export type NumbersData = [string, number | null, number | null, number | null, number, number, string];
/**
 * A flagged result's card: [index of the result, text before it (with "…" where it was cut), text after it,
 * its p values, its findings, and the result as printed when it spans lines (else '')].
 */
export type CardData = [number, string, string, NumbersData, FindingData[], string];
/** A table not read in full: [tag, page (0 for none), line, message]. */
export type TableData = [string, number, number, string];

/** One document as the page's script reads it; short keys, as they repeat 10,000 times in a large report. */
export interface DocumentData {
  /** Path. */
  p: string;
  /** Set on an unreadable document: why. */
  x?: string;
  /** Format, alpha. */
  f?: string;
  a?: number;
  /** Set on a document read without results: why it has none. */
  n?: string;
  r?: ResultData[];
  c?: CardData[];
  /** Findings about the document as a whole. */
  g?: FindingData[];
  t?: TableData[];
}

/** For a table row that does not add up: the F and p its own numbers imply, beside the printed F's p (numbersText). */
function impliedText(finding: FindingOutput): string {
  const implied = finding.rowImplies;
  if (!implied) return '';
  // Four significant digits: the interval of a row printed to two decimals is narrow.
  const number = (value: number): string => (value !== 0 && Math.abs(value) < 0.001 ? value.toExponential(3).replace('e+', 'e') : String(Number(value.toPrecision(4))));
  const range = (low: number | null, high: number | null): string => (low !== null && high !== null && number(low) !== number(high) ? ` (${number(low)} to ${number(high)})` : '');
  const f = `F = ${number(implied.statistic)}${range(implied.statisticLow, implied.statisticHigh)}`;
  const p = implied.p === null ? '' : `, p = ${number(implied.p)}${range(implied.pLow, implied.pHigh)}`;
  return `The row\u2019s own numbers imply ${f}${p}: ${shown(implied.from)}; in brackets, the range over the values that round to the printed cells.`;
}

function findingData(finding: FindingOutput): FindingData {
  return [SEVERITY_CODE[finding.severity], shown(finding.rule), finding.crossesAlpha ? 1 : 0, shown(finding.message), shown(finding.messageId), impliedText(finding)];
}

/** A p to three significant digits, as the page shows it (its script's formatNumber: 0.0123, 1.33e-8); null stays null. */
function threeDigits(value: number | null): number | null {
  return value === null || !Number.isFinite(value) ? value : Number(value.toPrecision(3));
}

/**
 * The reported p and the p recomputed from the printed numbers, as data the script puts in words ("reported p
 * = .152; recomputed p = 5.53e-4 (5.43e-4 to 5.62e-4 for values that round to the printed ones), two-tailed").
 */
function numbersData(statistic: StatisticOutput): NumbersData {
  const rec = statistic.recomputed;
  return [
    statistic.p ? `${statistic.p.comparator} ${shown(statistic.p.text)}` : '',
    threeDigits(rec.p),
    threeDigits(rec.pLow),
    threeDigits(rec.pHigh),
    rec.tails === 'two' ? 2 : 1,
    statistic.findings.some((f) => f.rowImplies) ? 1 : 0,
    !rec.evaluable && rec.reason ? shown(rec.reason) : '',
  ];
}

const MAP_WIDTH = 240;
const MAP_PAD = 6;

/** The worst severity of a result's findings as the data writes it; 0 for none, -1 when the result was not checked. */
function worstCode(statistic: StatisticOutput): number {
  let worst = 0;
  for (const finding of statistic.findings) worst = Math.max(worst, SEVERITY_CODE[finding.severity]);
  return worst === 0 && !statistic.recomputed.evaluable ? -1 : worst;
}

/** One document as data: what its row, map, card and list entry need, nothing drawn. */
export function documentData(document: DocumentOutput): DocumentData {
  const data: DocumentData = { p: shown(document.path) };
  if (document.status === 'unreadable') {
    data.x = shown(document.error ?? 'unreadable (no reason given)');
    return data;
  }
  if (document.format) data.f = shown(document.format);
  if (document.alpha !== undefined) data.a = document.alpha;
  const noResults = noResultsMessage(document);
  if (noResults !== null) data.n = shown(noResults);
  // The map runs from the start of the text to the last result.
  let extent = 1;
  for (const statistic of document.statistics) extent = Math.max(extent, statistic.location.start + 1);
  const results: ResultData[] = [];
  const cards: CardData[] = [];
  document.statistics.forEach((statistic, index) => {
    const { page, line, column, start } = statistic.location;
    const x = MAP_PAD + (start / extent) * (MAP_WIDTH - 2 * MAP_PAD);
    const oneLine = shown(statistic.text.replace(/\s+/g, ' '));
    const reported = statistic.p ? `${statistic.p.comparator} ${shown(statistic.p.text)}` : '';
    // Most results end with their p as the column shows it ("..., p = .001"): then the length of that end is enough.
    const reportedData = reported !== '' && oneLine.endsWith(` ${reported}`) ? reported.length : reported;
    results.push([page ?? 0, line, column, Math.round(x * 10), oneLine, reportedData, threeDigits(statistic.recomputed.p), worstCode(statistic)]);
    if (statistic.findings.length === 0) return;
    const { before, after } = statistic.surroundings;
    const cut = start > before.length ? '\u2026' : '';
    const asPrinted = shown(statistic.text);
    cards.push([index, cut + shown(before), shown(after), numbersData(statistic), statistic.findings.map(findingData), asPrinted === oneLine ? '' : asPrinted]);
  });
  if (results.length > 0) data.r = results;
  if (cards.length > 0) data.c = cards;
  if (document.findings.length > 0) data.g = document.findings.map(findingData);
  if (document.tablesNotRead.length > 0) {
    data.t = document.tablesNotRead.map((table) => [tableNotReadTag(table), table.location.page ?? 0, table.location.line, shown(table.message)]);
  }
  return data;
}

/** JSON that cannot end the script element it sits in, nor open a comment there: every `<` escaped. */
export function inertJson(value: unknown): string {
  return JSON.stringify(value).replace(/</g, '\\u003c');
}

/** Documents a data block holds at most, and characters after which it is closed: the browser parses one block at a time. */
const BLOCK_DOCUMENTS = 200;
const BLOCK_CHARACTERS = 1 << 19;

function dataBlock(parts: readonly string[]): string {
  return `<script type="application/json" class="report-data">[${parts.join(',')}]</script>\n`;
}

/** The documents' data blocks, made a document at a time. */
function* dataBlocks(documents: Iterable<DocumentOutput>): Iterable<string> {
  let parts: string[] = [];
  let length = 0;
  for (const document of documents) {
    const json = inertJson(documentData(document));
    parts.push(json);
    length += json.length;
    if (parts.length >= BLOCK_DOCUMENTS || length >= BLOCK_CHARACTERS) {
      yield dataBlock(parts);
      parts = [];
      length = 0;
    }
  }
  if (parts.length > 0) yield dataBlock(parts);
}

// ---------------------------------------------------------------- the fixed parts of the page

/** The shapes of the map's legend: severity by colour and by shape, so the map reads in grey too (the script draws the same). */
const SEVERITY_COLOUR: Record<Severity | 'none', string> = { fail: '#b71c1c', warn: '#a35200', note: '#1555a0', none: '#6b7280' };
const SHAPE_WORDS: Record<Severity | 'none', string> = { fail: 'square', warn: 'triangle', note: 'circle', none: 'tick' };

function legendShape(severity: Severity | 'none'): string {
  const colour = SEVERITY_COLOUR[severity];
  const inner =
    severity === 'none'
      ? `<path d="M7 2v10" stroke="${colour}" stroke-width="1.5"/>`
      : severity === 'fail'
        ? `<rect x="3.0" y="3.0" width="8" height="8" fill="${colour}" stroke="#fff" stroke-width="0.8"/>`
        : severity === 'warn'
          ? `<path d="M7.0 2.0L12.0 11.0L2.0 11.0Z" fill="${colour}" stroke="#fff" stroke-width="0.8"/>`
          : `<circle cx="7.0" cy="7.0" r="4" fill="${colour}" stroke="#fff" stroke-width="0.8"/>`;
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

/** Items a list shows on a page at first (the reader can choose the other sizes). */
const PAGE_SIZES = { documents: 25, cards: 10, lists: 100 } as const;

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

/**
 * The documents table, empty: the script ranks the documents and draws the rows of the page shown, each with
 * its map. It sorts by any column, searches by name, keeps only the documents where a flag changes the
 * conclusion, and pages.
 */
function documentsTable(): string {
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
    `</tr></thead><tbody id="documents-body" data-page-size="${PAGE_SIZES.documents}"></tbody></table>`
  );
}

/** The filters of the flag cards; the script adds a box per rule (the rules are known once the documents are read). */
function filtersPanel(summary: Report['summary']): string {
  const severityBoxes = SEVERITIES.map(
    (s) => `<label><input type="checkbox" data-group="severity" value="${s}" checked> <span class="badge ${s}">${s}</span> (${summary.findings[s]})</label>`,
  ).join('');
  return (
    `<form class="filters" id="filters" hidden>` +
    `<fieldset><legend>Severity</legend>${severityBoxes}</fieldset>` +
    `<fieldset><legend>Rule</legend><span id="rule-boxes"></span>` +
    `<button type="button" data-set="rule" data-value="on">all</button><button type="button" data-set="rule" data-value="off">none</button></fieldset>` +
    `<fieldset><legend>Show</legend>` +
    `<label><input type="checkbox" id="only-crosses"> changes the conclusion only (${summary.crossesAlpha})</label>` +
    `<label>marked <select id="seen-filter"><option value="all">seen or not</option><option value="unseen">not yet seen</option><option value="seen">seen</option></select></label>` +
    `<button type="button" id="export-csv">Save the flags shown as CSV</button></fieldset>` +
    `<p class="filter-count" id="filter-count" aria-live="polite"></p>` +
    `<p class="explain">A flag marked seen is kept in this browser (its local storage), for this document, place and rule, in every plumbline report opened here; nothing is sent anywhere.</p></form>`
  );
}

function totalsList(summary: Report['summary']): string {
  // Results (what was read) and findings (what the rules say of them) are counted apart.
  const findingCount = summary.findings.fail + summary.findings.warn + summary.findings.note;
  const noun = (count: number, one: string, many = `${one}s`): string => (count === 1 ? one : many);
  return (
    `<ul class="totals">` +
    `<li><strong>${summary.documents}</strong> ${noun(summary.documents, 'document')}` +
    (summary.unreadable > 0 ? ` (${summary.unreadable} unreadable)` : '') +
    `</li>` +
    `<li><strong>${summary.statistics}</strong> ${noun(summary.statistics, 'result')} found (${summary.resultsInText} in text, ${summary.resultsInTables} in tables), ` +
    `<strong>${summary.flaggedStatistics}</strong> flagged</li>` +
    `<li><strong>${findingCount}</strong> ${noun(findingCount, 'finding')}: <span class="badge fail">fail</span> ${summary.findings.fail} <span class="badge warn">warn</span> ${summary.findings.warn} <span class="badge note">note</span> ${summary.findings.note}</li>` +
    `<li>${e(crossesAlphaPhrase(summary) ?? 'No finding changes the conclusion at alpha')}</li>` +
    `<li>${e(tablesNotReadPhrase(summary) ?? 'Every results table was read')}</li></ul>`
  );
}

/** The page from its start to the documents' data: everything it holds that the summary alone decides. */
function pageHead(report: StreamedReport, tool: Report['tool']): string {
  const { summary } = report;
  const findingCount = summary.findings.fail + summary.findings.warn + summary.findings.note;
  const overview =
    `<section class="overview" id="overview"><h2>Overview</h2>` +
    `<div id="by-rule"><h3>Flags by rule</h3></div>` +
    documentsTable() +
    `</section>`;
  const flaggedSection =
    `<section id="flagged"><h2>Flagged results</h2>` +
    (findingCount === 0
      ? `<p>No result was flagged.</p>`
      : filtersPanel(summary) + pagerNav('flag-cards', 'document', [10, 25, 100, 0]) + `<div id="flag-cards" data-page-size="${PAGE_SIZES.cards}"></div>`) +
    `</section>`;
  // Which documents have no flag the script finds out; the section shows when there is one.
  const cleanSection =
    `<section id="clean" hidden><h2>Documents without flags (<span id="clean-count"></span>)</h2>` +
    pagerNav('clean-list', 'document', [100, 500, 0]) +
    `<ul class="clean-list" id="clean-list" data-page-size="${PAGE_SIZES.lists}"></ul></section>`;
  const unreadableSection =
    summary.unreadable === 0
      ? ''
      : `<section id="unreadable"><h2>Unreadable documents (${summary.unreadable})</h2>` +
        pagerNav('unreadable-list', 'document', [100, 500, 0]) +
        `<ul id="unreadable-list" data-page-size="${PAGE_SIZES.lists}"></ul></section>`;
  const noScript =
    `<noscript><p class="noscript">This page draws its documents, results and flags with its own script, which this browser did not run. ` +
    `The same audit without a script: <code>--format md</code> (a summary to read) or <code>--format csv</code> (a table).</p></noscript>`;
  const title = `plumbline report: ${countOf(summary.documents, 'document')}, ${countOf(summary.flaggedStatistics, 'result')} flagged`;
  return (
    `<!DOCTYPE html>\n<html lang="en">\n<head>\n<meta charset="utf-8">\n` +
    `<meta http-equiv="Content-Security-Policy" content="${e(contentSecurityPolicy())}">\n` +
    `<meta name="referrer" content="no-referrer">\n` +
    `<meta name="viewport" content="width=device-width, initial-scale=1">\n` +
    `<meta name="generator" content="${e(`${tool.name} ${tool.version}`)}">\n` +
    `<title>${e(title)}</title>\n<style>${STYLE}</style>\n</head>\n<body>\n<main>\n` +
    `<header><h1>plumbline report</h1><p class="meta">${e(tool.name)} ${e(tool.version)}</p>` +
    `<p class="caution" role="note">${e(report.caution)}</p>${totalsList(summary)}${noScript}</header>\n` +
    `${overview}\n${flaggedSection}\n${cleanSection}\n${unreadableSection}\n` +
    `<footer><p class="caution">${e(report.caution)}</p></footer>\n</main>\n`
  );
}

/**
 * The HTML report a piece at a time: the head, one data block per few hundred documents (each document read,
 * written and let go), the script. One pass over the documents.
 */
export function* htmlPieces(report: StreamedReport, tool: Report['tool']): Iterable<string> {
  yield pageHead(report, tool);
  yield* dataBlocks(report.documents());
  yield `<script>${SCRIPT}</script>\n</body>\n</html>\n`;
}

/** The HTML report: a single file with inline style, data and script, safe to open whatever the documents contain. */
export function formatHtml(report: Report): string {
  return [...htmlPieces({ caution: report.caution, summary: report.summary, documents: () => report.documents }, report.tool)].join('');
}
