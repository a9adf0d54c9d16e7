/**
 * The page of `plumbline web` (and of dist/web/plumbline.html): paste text or
 * drop files, and every result is read, recomputed and checked here, in the
 * browser, by the same code as the command line: reader -> text with
 * positions -> scanner -> checks -> findings -> report formatters. Nothing
 * is sent anywhere; the page's policy allows no request outside it.
 *
 * Document text is only ever inserted as text (text nodes, textContent),
 * never parsed as markup, so a manuscript holding <script>, event
 * attributes or javascript: links runs nothing.
 */
import { z } from 'zod';
import catalogue from './catalogue.js';
import { resolveConfig, type ResolvedConfig } from '../../checks/config.js';
import { auditDocument } from '../../audit.js';
import { plainTextDocument } from '../../documents/text.js';
import type { DocumentText } from '../../documents/types.js';
import { buildReport, unreadableDocument } from '../../report/build.js';
import { formatCsv } from '../../report/csv.js';
import { formatHtml } from '../../report/html.js';
import { formatJson } from '../../report/json.js';
import { formatMarkdown } from '../../report/markdown.js';
import type { DocumentOutput, Report, StatisticOutput } from '../../report/model.js';
import { byId, download, element } from './dom.js';
import { readFileInPage } from './readers.js';
import { loadSettings, measuresFromText, saveSettings, userConfigOf, type PageSettings } from './settings.js';
import { setUpRefitTab } from './refit.js';

// zod compiles validators with new Function unless told not to; the page's policy allows no eval.
z.config({ jitless: true });

type Severity = 'fail' | 'warn' | 'note';
type Verdict = Severity | 'none';
const SEVERITY_ORDER: Record<Verdict, number> = { fail: 0, warn: 1, note: 2, none: 3 };
const VERDICT_WORD: Record<Verdict, string> = { fail: 'fail', warn: 'warn', note: 'note', none: 'no flag' };

/** One audited document: what the reader gave (kept, so new settings re-check it without reading again) and its audit. */
interface Audited {
  name: string;
  source: DocumentText | null;
  output: DocumentOutput;
}

const state: {
  documents: Audited[];
  selectedDocument: number;
  selectedResult: number | null;
  settings: PageSettings;
  config: ResolvedConfig;
  sort: { key: 'document' | 'where' | 'verdict' | 'rule'; descending: boolean };
} = {
  documents: [],
  selectedDocument: 0,
  selectedResult: null,
  settings: loadSettings(storage()),
  config: resolveConfig({}, 'page settings', catalogue),
  sort: { key: 'where', descending: false },
};

function storage(): Storage | null {
  try {
    return window.localStorage;
  } catch {
    return null;
  }
}

const ruleIds = catalogue.map((entry) => entry.id);
const ruleEntry = new Map(catalogue.map((entry) => [entry.id, entry]));

function configFor(settings: PageSettings): ResolvedConfig {
  return resolveConfig(userConfigOf(settings, ruleIds), 'page settings', catalogue);
}

function verdictOf(statistic: StatisticOutput): Verdict {
  let best: Verdict = 'none';
  for (const finding of statistic.findings) if (SEVERITY_ORDER[finding.severity] < SEVERITY_ORDER[best]) best = finding.severity;
  return best;
}

/** As the command line audits a file read by a reader (src/batch/auditFile.ts): the audit, with the format. */
function audit(name: string, source: DocumentText): DocumentOutput {
  return { ...auditDocument(source, state.config, name), format: source.format };
}

function setStatus(text: string): void {
  byId('status').textContent = text;
}

// ------------------------------------------------------------------ input

function addDocuments(added: Audited[]): void {
  if (added.length === 0) return;
  const first = state.documents.length;
  state.documents.push(...added);
  state.selectedDocument = first;
  state.selectedResult = null;
  renderAll();
  const results = added.reduce((sum, item) => sum + item.output.statistics.length, 0);
  const flagged = added.reduce((sum, item) => sum + item.output.statistics.filter((s) => s.findings.length > 0).length, 0);
  const unreadable = added.filter((item) => item.output.status === 'unreadable').length;
  setStatus(
    `${added.length === 1 ? `${added[0]!.name}` : `${added.length} documents`}: ${results} ${results === 1 ? 'result' : 'results'} read, ${flagged} flagged` +
      (unreadable > 0 ? `; ${unreadable} could not be read (see the list of documents)` : '') +
      '.',
  );
}

function checkPastedText(): void {
  const text = byId<HTMLTextAreaElement>('paste').value;
  if (text.trim() === '') {
    setStatus('Paste some text first.');
    return;
  }
  const count = state.documents.filter((item) => item.name.startsWith('pasted text')).length;
  const name = count === 0 ? 'pasted text' : `pasted text ${count + 1}`;
  const source = plainTextDocument(name, 'text', text);
  addDocuments([{ name, source, output: audit(name, source) }]);
}

async function readFiles(files: readonly File[]): Promise<void> {
  if (files.length === 0) return;
  setStatus(`Reading ${files.length === 1 ? files[0]!.name : `${files.length} files`}…`);
  const added: Audited[] = [];
  // One bad file never stops the others: each gives its document or its reason.
  for (const file of files) {
    let outcome;
    try {
      outcome = await readFileInPage(file.name, new Uint8Array(await file.arrayBuffer()));
    } catch (error) {
      outcome = { ok: false as const, path: file.name, format: 'unknown', error: `cannot read the file (${error instanceof Error ? error.message : String(error)})` };
    }
    if (outcome.ok) added.push({ name: file.name, source: outcome.document, output: audit(file.name, outcome.document) });
    else added.push({ name: file.name, source: null, output: unreadableDocument(file.name, outcome.error, outcome.format) });
  }
  addDocuments(added);
}

// ------------------------------------------------------------------ manuscript

/** The document's text with each result a button, coloured (and outlined) by its worst flag. */
function renderManuscript(): void {
  const view = byId('manuscript');
  view.replaceChildren();
  const current = state.documents[state.selectedDocument];
  const heading = byId('manuscript-heading');
  if (current === undefined) {
    byId('manuscript-notes').hidden = true;
    heading.textContent = 'Manuscript';
    view.append(element('p', { class: 'empty' }, 'Paste text or choose files above; the manuscript appears here with every result marked.'));
    return;
  }
  heading.textContent = `Manuscript: ${current.name}`;
  // What the audit could not do is said before the text: a document must not look cleaner than it was checked.
  const notes = byId('manuscript-notes');
  notes.replaceChildren(
    ...(current.output.noResults ? [element('li', {}, current.output.noResults.message)] : []),
    ...current.output.tablesNotRead.map((table) => element('li', {}, `Table not read in full (line ${table.location.line}): ${table.message}`)),
    ...current.output.findings.map((finding) => element('li', {}, element('span', { class: `badge v-${finding.severity}` }, finding.severity), ` ${finding.rule}: ${finding.message}`)),
  );
  notes.hidden = notes.childElementCount === 0;
  if (current.source === null) {
    view.append(element('p', { class: 'unreadable' }, `${current.name} could not be read: ${current.output.error ?? 'no reason given'}`));
    return;
  }
  const text = current.source.text;
  const places: { start: number; end: number; index: number }[] = [];
  current.output.statistics.forEach((statistic, index) => {
    places.push({ start: statistic.location.start, end: statistic.location.end, index });
    for (const place of statistic.alsoAt ?? []) places.push({ start: place.start, end: place.end, index });
  });
  places.sort((a, b) => a.start - b.start || b.end - a.end);
  const fragment = document.createDocumentFragment();
  let at = 0;
  for (const place of places) {
    // A place inside one already marked (a cell of a marked row) stays in its text.
    if (place.start < at || place.end <= place.start) continue;
    if (place.start > at) fragment.append(plainText(text.slice(at, place.start)));
    const statistic = current.output.statistics[place.index]!;
    const verdict = verdictOf(statistic);
    const button = element(
      'button',
      {
        type: 'button',
        class: `result v-${verdict}${place.index === state.selectedResult ? ' selected' : ''}`,
        'data-result': String(place.index),
        'aria-pressed': place.index === state.selectedResult ? 'true' : 'false',
        'aria-describedby': `verdict-word-${verdict}`,
      },
      plainText(text.slice(place.start, place.end)),
      element('span', { class: 'verdict-tag', 'aria-hidden': 'true' }, VERDICT_WORD[verdict]),
    );
    fragment.append(button);
    at = place.end;
  }
  if (at < text.length) fragment.append(plainText(text.slice(at)));
  view.append(fragment);
}

/** Text as text; a PDF's page breaks (form feeds) as line breaks. */
function plainText(text: string): Text {
  return document.createTextNode(text.replaceAll('\f', '\n'));
}

// ------------------------------------------------------------------ the result chosen

function formatNumber(value: number | null, digits = 4): string {
  if (value === null || !Number.isFinite(value)) return '–';
  if (value !== 0 && Math.abs(value) < 0.0001) return value.toExponential(2);
  return String(Number(value.toPrecision(digits)));
}

function renderDetail(): void {
  const panel = byId('detail');
  panel.replaceChildren();
  const current = state.documents[state.selectedDocument];
  const statistic = state.selectedResult === null ? undefined : current?.output.statistics[state.selectedResult];
  if (current === undefined || statistic === undefined) {
    panel.append(element('h2', {}, 'Result'), element('p', { class: 'empty' }, 'Choose a marked result in the manuscript or in the list to see what was recomputed and why it was flagged.'));
    return;
  }
  const verdict = verdictOf(statistic);
  const where = [statistic.location.page === null ? null : `page ${statistic.location.page}`, `line ${statistic.location.line}`, statistic.inTable ? 'in a table' : 'in the text'].filter(Boolean).join(', ');
  const recomputed = statistic.recomputed;
  const list = element('dl', { class: 'numbers' });
  const row = (term: string, value: string): void => {
    list.append(element('dt', {}, term), element('dd', {}, value));
  };
  row('Printed', statistic.text);
  row('Test', `${statistic.symbol ?? statistic.kind}${statistic.df.length > 0 ? ` with df ${statistic.df.join(', ')}` : ''}${statistic.dfFrom ? ` (df worked out: ${statistic.dfFrom})` : ''}`);
  row('p as printed', statistic.p === null ? (statistic.notSignificant ? 'n.s.' : 'none') : `p ${statistic.p.comparator} ${statistic.p.text}`);
  if (recomputed.evaluable) {
    row(`Recomputed p (${recomputed.tails === 'two' ? 'two-tailed' : 'upper tail'})`, `${formatNumber(recomputed.p)}; from ${formatNumber(recomputed.pLow)} to ${formatNumber(recomputed.pHigh)} over the values that round to the printed ones`);
    if (recomputed.partialEtaSquared !== null) {
      row('Recomputed partial eta squared', `${formatNumber(recomputed.partialEtaSquared, 3)} (${formatNumber(recomputed.partialEtaSquaredLow, 3)} to ${formatNumber(recomputed.partialEtaSquaredHigh, 3)})`);
    }
  } else row('Recomputed', `not recomputed${recomputed.reason ? `: ${recomputed.reason}` : ''}`);
  row('Alpha', String(current.output.alpha ?? state.config.defaultAlpha));

  const findings = element('div', { class: 'findings' });
  if (statistic.findings.length === 0) findings.append(element('p', {}, 'No rule flags this result.'));
  for (const finding of statistic.findings) {
    const entry = ruleEntry.get(finding.rule);
    const block = element(
      'section',
      { class: `finding v-${finding.severity}` },
      element('h3', {}, element('span', { class: `badge v-${finding.severity}` }, finding.severity), ` ${entry?.title ?? finding.rule}`),
      element('p', { class: 'rule-id' }, `rule ${finding.rule}${finding.crossesAlpha ? '; changes the conclusion at alpha' : ''}`),
      element('p', { class: 'message' }, finding.message),
    );
    if (finding.slip) block.append(element('p', { class: 'slip' }, element('strong', {}, 'Slip that reproduces the printed numbers: '), finding.slip));
    if (finding.rowImplies) {
      const implied = finding.rowImplies;
      block.append(element('p', {}, `The row's own numbers (${implied.from}) imply F = ${formatNumber(implied.statistic)} (${formatNumber(implied.statisticLow)} to ${formatNumber(implied.statisticHigh)}), p = ${formatNumber(implied.p)}.`));
    }
    if (entry) {
      block.append(
        element('details', {}, element('summary', {}, 'Why this rule'), element('p', {}, entry.rationale), element('ul', {}, ...entry.sources.map((source) => element('li', {}, source)))),
      );
    }
    findings.append(block);
  }
  panel.append(
    element('h2', {}, 'Result'),
    element('p', { class: `verdict v-${verdict}` }, element('span', { class: `badge v-${verdict}` }, VERDICT_WORD[verdict]), ` ${current.name}, ${where}`),
    element('p', { class: 'context' }, element('span', {}, statistic.surroundings.before), element('mark', {}, statistic.text), element('span', {}, statistic.surroundings.after)),
    list,
    findings,
  );
}

function selectResult(documentIndex: number, resultIndex: number, focusManuscript: boolean): void {
  const changedDocument = documentIndex !== state.selectedDocument;
  state.selectedDocument = documentIndex;
  state.selectedResult = resultIndex;
  if (changedDocument) {
    renderDocumentsList();
    renderManuscript();
  } else {
    for (const button of byId('manuscript').querySelectorAll<HTMLButtonElement>('button.result')) {
      const chosen = button.dataset.result === String(resultIndex);
      button.classList.toggle('selected', chosen);
      button.setAttribute('aria-pressed', chosen ? 'true' : 'false');
    }
  }
  renderDetail();
  const mark = byId('manuscript').querySelector<HTMLButtonElement>(`button.result[data-result="${resultIndex}"]`);
  if (mark) {
    mark.scrollIntoView({ block: 'center' });
    if (focusManuscript) mark.focus();
  }
}

// ------------------------------------------------------------------ documents and the list of results

function renderDocumentsList(): void {
  const list = byId('document-list');
  list.replaceChildren();
  state.documents.forEach((item, index) => {
    const flagged = item.output.statistics.filter((s) => s.findings.length > 0).length;
    const label =
      item.output.status === 'unreadable'
        ? `${item.name}: could not be read`
        : `${item.name}: ${item.output.statistics.length} ${item.output.statistics.length === 1 ? 'result' : 'results'}, ${flagged} flagged`;
    const button = element('button', { type: 'button', class: `document-choice${index === state.selectedDocument ? ' selected' : ''}`, 'aria-pressed': index === state.selectedDocument ? 'true' : 'false' }, label);
    button.addEventListener('click', () => {
      state.selectedDocument = index;
      state.selectedResult = null;
      renderDocumentsList();
      renderManuscript();
      renderDetail();
    });
    const remove = element('button', { type: 'button', class: 'remove', 'aria-label': `Remove ${item.name}` }, '×');
    remove.addEventListener('click', () => {
      state.documents.splice(index, 1);
      state.selectedDocument = Math.max(0, Math.min(state.selectedDocument, state.documents.length - 1));
      state.selectedResult = null;
      renderAll();
    });
    list.append(element('li', {}, button, remove));
  });
  byId('documents-section').hidden = state.documents.length === 0;
}

interface ListRow {
  documentIndex: number;
  resultIndex: number;
  document: string;
  statistic: StatisticOutput;
  verdict: Verdict;
  rules: string[];
}

function listRows(): ListRow[] {
  const rows: ListRow[] = [];
  state.documents.forEach((item, documentIndex) => {
    item.output.statistics.forEach((statistic, resultIndex) => {
      rows.push({ documentIndex, resultIndex, document: item.name, statistic, verdict: verdictOf(statistic), rules: [...new Set(statistic.findings.map((f) => f.rule))] });
    });
  });
  return rows;
}

function renderRuleFilter(): void {
  const select = byId<HTMLSelectElement>('filter-rule');
  const chosen = select.value;
  const used = new Set(listRows().flatMap((row) => row.rules));
  select.replaceChildren(element('option', { value: '' }, 'every rule'));
  for (const id of ruleIds) if (used.has(id)) select.append(element('option', { value: id }, id));
  select.value = used.has(chosen) ? chosen : '';
}

function renderList(): void {
  const shownVerdicts = new Set(
    [...document.querySelectorAll<HTMLInputElement>('input[name="filter-verdict"]')].filter((box) => box.checked).map((box) => box.value),
  );
  const rule = byId<HTMLSelectElement>('filter-rule').value;
  const all = listRows();
  const rows = all.filter((row) => shownVerdicts.has(row.verdict) && (rule === '' || row.rules.includes(rule)));
  const { key, descending } = state.sort;
  const compare = (a: ListRow, b: ListRow): number => {
    const place = a.documentIndex - b.documentIndex || a.statistic.location.start - b.statistic.location.start;
    switch (key) {
      case 'document':
        return a.document.localeCompare(b.document) || place;
      case 'verdict':
        return SEVERITY_ORDER[a.verdict] - SEVERITY_ORDER[b.verdict] || place;
      case 'rule':
        return (a.rules[0] ?? '~').localeCompare(b.rules[0] ?? '~') || place;
      case 'where':
        return place;
    }
  };
  rows.sort((a, b) => (descending ? -compare(a, b) : compare(a, b)));
  for (const header of document.querySelectorAll<HTMLElement>('#results-table th[data-sort]')) {
    header.setAttribute('aria-sort', header.dataset.sort === key ? (descending ? 'descending' : 'ascending') : 'none');
  }
  const body = byId('results-body');
  body.replaceChildren(
    ...rows.map((row) => {
      const where = [row.statistic.location.page === null ? null : `p. ${row.statistic.location.page}`, `line ${row.statistic.location.line}`].filter(Boolean).join(', ');
      const show = element('button', { type: 'button', class: 'show-result' }, row.statistic.text);
      show.addEventListener('click', () => selectResult(row.documentIndex, row.resultIndex, false));
      return element(
        'tr',
        { class: `v-${row.verdict}` },
        element('td', {}, row.document),
        element('td', {}, where),
        element('td', {}, show),
        element('td', {}, element('span', { class: `badge v-${row.verdict}` }, VERDICT_WORD[row.verdict])),
        element('td', {}, row.rules.join(', ')),
        element('td', {}, row.statistic.findings.some((f) => f.crossesAlpha) ? 'yes' : ''),
      );
    }),
  );
  byId('list-count').textContent = `${rows.length} of ${all.length} results shown`;
}

function renderAll(): void {
  renderDocumentsList();
  renderManuscript();
  renderDetail();
  renderRuleFilter();
  renderList();
  const empty = state.documents.length === 0;
  for (const button of document.querySelectorAll<HTMLButtonElement>('#downloads button')) button.disabled = empty;
}

// ------------------------------------------------------------------ downloads

function currentReport(): Report {
  const report = buildReport(state.documents.map((item) => item.output));
  return { ...report, tool: { ...report.tool, version: PLUMBLINE_PAGE_VERSION } };
}

const FORMATS: Record<string, { name: string; type: string; format: (report: Report) => string }> = {
  html: { name: 'plumbline-report.html', type: 'text/html', format: formatHtml },
  csv: { name: 'plumbline-report.csv', type: 'text/csv', format: formatCsv },
  json: { name: 'plumbline-report.json', type: 'application/json', format: formatJson },
  md: { name: 'plumbline-report.md', type: 'text/markdown', format: formatMarkdown },
};

// ------------------------------------------------------------------ settings

function renderSettings(): void {
  const { settings } = state;
  byId<HTMLInputElement>('alpha').value = String(settings.alpha);
  byId<HTMLInputElement>(settings.tails === 'one' ? 'tails-one' : 'tails-two').checked = true;
  byId<HTMLInputElement>('integer-scales').checked = settings.integerScales;
  byId<HTMLInputElement>('integer-measures').value = settings.integerMeasures.join(', ');
  const rules = byId('rules-list');
  rules.replaceChildren(
    ...catalogue.map((entry) => {
      const box = element('input', { type: 'checkbox', id: `rule-${entry.id}`, value: entry.id });
      box.checked = !settings.rulesOff.includes(entry.id);
      return element('li', {}, box, element('label', { for: `rule-${entry.id}` }, element('code', {}, entry.id), ` ${entry.title} (${entry.defaultSeverity})`));
    }),
  );
}

function readSettingsForm(): PageSettings | string {
  const alphaText = byId<HTMLInputElement>('alpha').value.trim();
  const alpha = Number(alphaText);
  if (!(alpha > 0 && alpha < 1)) return `Alpha must be a number between 0 and 1 (got "${alphaText}").`;
  return {
    alpha,
    tails: byId<HTMLInputElement>('tails-one').checked ? 'one' : 'two',
    rulesOff: [...document.querySelectorAll<HTMLInputElement>('#rules-list input[type="checkbox"]')].filter((box) => !box.checked).map((box) => box.value),
    integerScales: byId<HTMLInputElement>('integer-scales').checked,
    integerMeasures: measuresFromText(byId<HTMLInputElement>('integer-measures').value),
  };
}

function applySettings(): void {
  const read = readSettingsForm();
  const message = byId('settings-message');
  if (typeof read === 'string') {
    message.textContent = read;
    return;
  }
  try {
    state.config = configFor(read);
  } catch (error) {
    message.textContent = error instanceof Error ? error.message : String(error);
    return;
  }
  state.settings = read;
  saveSettings(storage(), read);
  for (const item of state.documents) if (item.source !== null) item.output = audit(item.name, item.source);
  message.textContent = state.documents.length === 0 ? 'Settings saved in this browser.' : 'Settings saved in this browser; every document was checked again.';
  renderAll();
}

// ------------------------------------------------------------------ wiring

function setUpTabs(): void {
  const tabs = [...document.querySelectorAll<HTMLButtonElement>('[role="tab"]')];
  const choose = (tab: HTMLButtonElement, focus: boolean): void => {
    for (const other of tabs) {
      const chosen = other === tab;
      other.setAttribute('aria-selected', chosen ? 'true' : 'false');
      other.tabIndex = chosen ? 0 : -1;
      byId(other.getAttribute('aria-controls')!).hidden = !chosen;
    }
    if (focus) tab.focus();
  };
  tabs.forEach((tab, index) => {
    tab.addEventListener('click', () => choose(tab, false));
    tab.addEventListener('keydown', (event) => {
      const step = event.key === 'ArrowRight' ? 1 : event.key === 'ArrowLeft' ? -1 : 0;
      if (step !== 0) {
        event.preventDefault();
        choose(tabs[(index + step + tabs.length) % tabs.length]!, true);
      } else if (event.key === 'Home' || event.key === 'End') {
        event.preventDefault();
        choose(tabs[event.key === 'Home' ? 0 : tabs.length - 1]!, true);
      }
    });
  });
}

function setUpDropZone(): void {
  const zone = byId('drop-zone');
  // A file dropped anywhere else must not make the browser open it in place of the page.
  for (const type of ['dragover', 'drop'] as const) document.addEventListener(type, (event) => event.preventDefault());
  zone.addEventListener('dragover', (event) => {
    event.preventDefault();
    zone.classList.add('dragging');
  });
  zone.addEventListener('dragleave', () => zone.classList.remove('dragging'));
  zone.addEventListener('drop', (event) => {
    event.preventDefault();
    zone.classList.remove('dragging');
    void readFiles([...(event.dataTransfer?.files ?? [])]);
  });
}

function start(): void {
  try {
    state.config = configFor(state.settings);
  } catch {
    // stored settings the catalogue no longer accepts: start from the defaults
    state.config = resolveConfig({}, 'page settings', catalogue);
  }
  document.documentElement.classList.add('scripted');
  setUpTabs();
  setUpDropZone();
  renderSettings();
  byId('paste-form').addEventListener('submit', (event) => {
    event.preventDefault();
    checkPastedText();
  });
  const input = byId<HTMLInputElement>('files');
  input.addEventListener('change', () => {
    void readFiles([...(input.files ?? [])]).then(() => {
      input.value = '';
    });
  });
  byId('settings-form').addEventListener('submit', (event) => {
    event.preventDefault();
    applySettings();
  });
  byId('manuscript').addEventListener('click', (event) => {
    const button = (event.target as Element).closest<HTMLButtonElement>('button.result');
    if (button) selectResult(state.selectedDocument, Number(button.dataset.result), false);
  });
  for (const box of document.querySelectorAll<HTMLInputElement>('input[name="filter-verdict"]')) box.addEventListener('change', renderList);
  byId('filter-rule').addEventListener('change', renderList);
  for (const header of document.querySelectorAll<HTMLElement>('#results-table th[data-sort]')) {
    header.querySelector('button')!.addEventListener('click', () => {
      const key = header.dataset.sort as typeof state.sort.key;
      state.sort = { key, descending: state.sort.key === key ? !state.sort.descending : false };
      renderList();
    });
  }
  for (const button of document.querySelectorAll<HTMLButtonElement>('#downloads button')) {
    button.addEventListener('click', () => {
      const chosen = FORMATS[button.dataset.format ?? '']!;
      download(chosen.name, chosen.type, chosen.format(currentReport()));
    });
  }
  setUpRefitTab();
  renderAll();
  setStatus('Ready. Nothing you paste or drop leaves this page.');
  document.body.dataset.readyAt = String(performance.now());
  document.body.dataset.ready = 'true';
}

start();
