#!/usr/bin/env node
/**
 * Builds the demo documents from the manuscript sources in corpus-demo/sources/*.ms:
 *
 *   corpus-demo/<name>.txt           the same manuscript as plain text
 *   corpus-demo/<name>.html          HTML (tables with captions and notes, footnotes, reference list)
 *   corpus-demo/<name>.xml           JATS XML
 *   corpus-demo/<name>.docx          Word (via the `docx` package: real footnotes, tables, heading styles)
 *   corpus-demo/<name>.pdf           PDF printed by headless Chromium from the HTML (a real text
 *                                    layer with embedded fonts; "layout: two-column" gives a
 *                                    two-column page with soft hyphens in long words)
 *
 * Run from the repository root:  node corpus-demo/tools/build-documents.mjs
 * Needs: `npm install` (docx is a dev dependency) and Chromium (`apt-get install chromium`).
 * CI does not run this script; the generated files are committed.
 *
 * Source format (*.ms): "key: value" header lines (title, authors, affiliation, layout), then
 * "# Section" and "## Subsection" headings, paragraphs separated by blank lines, tables between
 * "::: table" and ":::" (a "caption:" line, "| a | b |" rows, "note:" lines), and "- " items
 * under "# References". Inline: *italic*, _{sub}, ^{sup}, [^footnote text].
 */
import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import * as docx from 'docx';
import { findChromium, printPdf } from './print-pdf.mjs';

const demoDirectory = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const sourceDirectory = join(demoDirectory, 'sources');

// ---------- parsing the source ----------

function parseManuscript(source) {
  const lines = source.replace(/\r\n/g, '\n').split('\n');
  const meta = {};
  let index = 0;
  for (; index < lines.length && lines[index].trim() !== ''; index += 1) {
    const match = /^(\w+):\s*(.*)$/.exec(lines[index]);
    if (match) meta[match[1]] = match[2];
  }
  const blocks = [];
  let paragraph = [];
  const flush = () => {
    if (paragraph.length > 0) blocks.push({ type: 'paragraph', text: paragraph.join(' ') });
    paragraph = [];
  };
  for (; index < lines.length; index += 1) {
    const line = lines[index];
    if (line.trim() === '') { flush(); continue; }
    const heading = /^(#{1,2})\s+(.*)$/.exec(line);
    if (heading) { flush(); blocks.push({ type: 'heading', level: heading[1].length, text: heading[2] }); continue; }
    if (line.startsWith('- ')) { flush(); blocks.push({ type: 'reference', text: line.slice(2) }); continue; }
    if (line.trim() === '::: table') {
      flush();
      const table = { type: 'table', caption: '', rows: [], notes: [] };
      for (index += 1; index < lines.length && lines[index].trim() !== ':::'; index += 1) {
        const row = lines[index].trim();
        if (row.startsWith('caption:')) table.caption = row.slice(8).trim();
        else if (row.startsWith('note:')) table.notes.push(row.slice(5).trim());
        else if (row.startsWith('|')) table.rows.push(row.replace(/^\||\|$/g, '').split('|').map((cell) => cell.trim()));
      }
      blocks.push(table);
      continue;
    }
    paragraph.push(line.trim());
  }
  flush();
  return { meta, blocks };
}

/** Inline markup as a list of runs: { text, italic, sub, sup } or { footnote: runs }. */
function parseInline(text) {
  const runs = [];
  const pattern = /\*([^*]+)\*|_\{([^}]*)\}|\^\{([^}]*)\}|\[\^([^\]]*)\]/g;
  let last = 0;
  for (let match = pattern.exec(text); match; match = pattern.exec(text)) {
    if (match.index > last) runs.push({ text: text.slice(last, match.index) });
    if (match[1] !== undefined) runs.push({ text: match[1], italic: true });
    else if (match[2] !== undefined) runs.push({ text: match[2], sub: true });
    else if (match[3] !== undefined) runs.push({ text: match[3], sup: true });
    else runs.push({ footnote: parseInline(match[4]) });
    last = match.index + match[0].length;
  }
  if (last < text.length) runs.push({ text: text.slice(last) });
  return runs;
}

// ---------- plain text ----------

function plainRuns(runs, footnotes) {
  return runs.map((run) => {
    if (run.footnote) {
      footnotes.push(plainRuns(run.footnote, footnotes));
      return `[${footnotes.length}]`;
    }
    return run.text;
  }).join('');
}

function toPlainText({ meta, blocks }) {
  const footnotes = [];
  const out = [meta.title, '', meta.authors, meta.affiliation, ''];
  for (const block of blocks) {
    if (block.type === 'heading') out.push(block.text, '');
    else if (block.type === 'paragraph') out.push(plainRuns(parseInline(block.text), footnotes), '');
    else if (block.type === 'reference') out.push(plainRuns(parseInline(block.text), footnotes));
    else if (block.type === 'table') {
      out.push(plainRuns(parseInline(block.caption), footnotes));
      for (const row of block.rows) out.push(row.map((cell) => plainRuns(parseInline(cell), footnotes)).join(' | '));
      for (const note of block.notes) out.push(plainRuns(parseInline(note), footnotes));
      out.push('');
    }
  }
  if (footnotes.length > 0) out.push('', 'Notes', ...footnotes.map((note, index) => `[${index + 1}] ${note}`));
  return `${out.join('\n').replace(/\n{3,}/g, '\n\n').trim()}\n`;
}

// ---------- HTML ----------

const escapeXml = (text) => text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');

function softHyphenate(text) {
  // Long lower-case words get a soft hyphen in the middle, so the printed columns hyphenate.
  return text.replace(/\b([a-z]{6,})([a-z]{6,})\b/g, '$1\u00AD$2');
}

function htmlRuns(runs, state) {
  return runs.map((run) => {
    if (run.footnote) {
      state.footnotes.push(htmlRuns(run.footnote, state));
      const number = state.footnotes.length;
      return `<sup><a href="#fn${number}" id="fnref${number}">${number}</a></sup>`;
    }
    const text = escapeXml(state.hyphenate ? softHyphenate(run.text) : run.text);
    if (run.italic) return `<em>${text}</em>`;
    if (run.sub) return `<sub>${text}</sub>`;
    if (run.sup) return `<sup>${text}</sup>`;
    return text;
  }).join('');
}

const PRINT_CSS = `
  @page { size: A4; margin: 2cm 1.8cm; }
  body { font-family: 'Liberation Serif', 'DejaVu Serif', serif; font-size: 10.5pt; line-height: 1.35; }
  h1 { font-size: 16pt; text-align: center; margin: 0 0 0.4em; }
  p.authors, p.affiliation { text-align: center; margin: 0.2em 0; }
  h2 { font-size: 12pt; margin: 1em 0 0.3em; }
  h3 { font-size: 10.5pt; font-style: italic; margin: 0.8em 0 0.2em; }
  p { margin: 0 0 0.5em; text-align: justify; }
  table { border-collapse: collapse; margin: 0.6em 0; font-size: 9.5pt; }
  caption, figcaption { text-align: left; font-style: italic; margin-bottom: 0.3em; }
  th, td { padding: 2px 8px; text-align: left; }
  thead th { border-top: 1px solid #000; border-bottom: 1px solid #000; }
  tbody tr:last-child td { border-bottom: 1px solid #000; }
  tfoot td, .table-note { font-size: 9pt; }
  ol.references { padding-left: 0; list-style: none; }
  ol.references li { padding-left: 2em; text-indent: -2em; margin-bottom: 0.3em; }
  .footnotes { font-size: 9pt; border-top: 1px solid #999; margin-top: 1em; }
`;
const TWO_COLUMN_CSS = `
  .columns { column-count: 2; column-gap: 2.4em; }
  .columns p { text-align: left; }
  .columns table, .columns figure { column-span: all; }
  .columns h2 { break-after: avoid; }
`;

/** Tables are written three ways on purpose, so the readers meet each markup: <caption> + <tfoot>, <figure>, and a bare table. */
function htmlTable(block, state, style) {
  const [header, ...body] = block.rows;
  const head = `<thead><tr>${header.map((cell) => `<th>${htmlRuns(parseInline(cell), state)}</th>`).join('')}</tr></thead>`;
  const rows = `<tbody>${body.map((row) => `<tr>${row.map((cell) => `<td>${htmlRuns(parseInline(cell), state)}</td>`).join('')}</tr>`).join('')}</tbody>`;
  const caption = htmlRuns(parseInline(block.caption), state);
  const notes = block.notes.map((note) => htmlRuns(parseInline(note), state));
  if (style === 'figure') {
    return `<figure class="table">\n<figcaption>${caption}</figcaption>\n<table>${head}${rows}</table>\n${notes.map((note) => `<p class="table-note">${note}</p>`).join('\n')}\n</figure>`;
  }
  const foot = notes.length > 0 ? `<tfoot>${notes.map((note) => `<tr><td colspan="${header.length}">${note}</td></tr>`).join('')}</tfoot>` : '';
  return `<table>\n<caption>${caption}</caption>\n${head}\n${rows}\n${foot}\n</table>`;
}

function toHtml({ meta, blocks }, { print, tableStyle }) {
  const twoColumn = print && meta.layout === 'two-column';
  const state = { footnotes: [], hyphenate: false };
  const body = [];
  let inReferences = false;
  let sectionOpen = false;
  const closeList = () => { if (inReferences) body.push('</ol>'); inReferences = false; };
  for (const block of blocks) {
    if (block.type !== 'reference') closeList();
    if (block.type === 'heading' && block.level === 1) {
      if (sectionOpen) body.push('</section>');
      const id = block.text.toLowerCase().replace(/[^a-z]+/g, '-');
      body.push(`<section id="${id}">`, `<h2>${escapeXml(block.text)}</h2>`);
      sectionOpen = true;
    } else if (block.type === 'heading') body.push(`<h3>${escapeXml(block.text)}</h3>`);
    else if (block.type === 'paragraph') body.push(`<p>${htmlRuns(parseInline(block.text), state)}</p>`);
    else if (block.type === 'table') body.push(htmlTable(block, { ...state, hyphenate: false, footnotes: state.footnotes }, tableStyle));
    else if (block.type === 'reference') {
      if (!inReferences) body.push('<ol class="references">');
      inReferences = true;
      body.push(`<li>${htmlRuns(parseInline(block.text), { ...state, hyphenate: false })}</li>`);
    }
  }
  closeList();
  if (sectionOpen) body.push('</section>');
  const footnotes = state.footnotes.length > 0
    ? `<section class="footnotes" role="doc-endnotes">\n<ol>\n${state.footnotes.map((note, index) => `<li id="fn${index + 1}">${note} <a href="#fnref${index + 1}" role="doc-backlink">↩</a></li>`).join('\n')}\n</ol>\n</section>`
    : '';
  const css = print ? PRINT_CSS + (twoColumn ? TWO_COLUMN_CSS : '') : 'body { max-width: 46em; margin: 2em auto; font-family: serif; }';
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<title>${escapeXml(meta.title)}</title>
<style>${css}</style>
</head>
<body>
<header>
<h1>${escapeXml(meta.title)}</h1>
<p class="authors">${escapeXml(meta.authors)}</p>
<p class="affiliation">${escapeXml(meta.affiliation)}</p>
</header>
<main${twoColumn ? ' class="columns"' : ''}>
${body.join('\n')}
${footnotes}
</main>
</body>
</html>
`;
}

// ---------- JATS ----------

function jatsRuns(runs, state) {
  return runs.map((run) => {
    if (run.footnote) {
      state.footnotes.push(jatsRuns(run.footnote, state));
      const number = state.footnotes.length;
      return `<xref ref-type="fn" rid="fn${number}">${number}</xref>`;
    }
    const text = escapeXml(run.text);
    if (run.italic) return `<italic>${text}</italic>`;
    if (run.sub) return `<sub>${text}</sub>`;
    if (run.sup) return `<sup>${text}</sup>`;
    return text;
  }).join('');
}

function toJats({ meta, blocks }) {
  const state = { footnotes: [] };
  let abstract = '';
  const body = [];
  const references = [];
  let section = null;
  let subsectionOpen = false;
  let tableCount = 0;
  const closeSubsection = () => { if (subsectionOpen) body.push('</sec>'); subsectionOpen = false; };
  const closeSection = () => { closeSubsection(); if (section && section !== 'Abstract' && section !== 'References') body.push('</sec>'); };
  for (const block of blocks) {
    if (block.type === 'heading' && block.level === 1) {
      closeSection();
      section = block.text;
      if (section !== 'Abstract' && section !== 'References') body.push(`<sec>`, `<title>${escapeXml(section)}</title>`);
    } else if (block.type === 'heading') {
      closeSubsection();
      body.push('<sec>', `<title>${escapeXml(block.text)}</title>`);
      subsectionOpen = true;
    } else if (block.type === 'paragraph') {
      const paragraph = `<p>${jatsRuns(parseInline(block.text), state)}</p>`;
      if (section === 'Abstract') abstract += paragraph;
      else body.push(paragraph);
    } else if (block.type === 'reference') {
      references.push(`<ref id="r${references.length + 1}"><mixed-citation publication-type="journal">${jatsRuns(parseInline(block.text), state)}</mixed-citation></ref>`);
    } else if (block.type === 'table') {
      tableCount += 1;
      const [label, ...title] = block.caption.split(/(?<=^Table \d+\.)\s+/);
      const [header, ...rows] = block.rows;
      body.push(`<table-wrap id="t${tableCount}">
<label>${escapeXml(label)}</label>
<caption><title>${jatsRuns(parseInline(title.join(' ')), state)}</title></caption>
<table>
<thead><tr>${header.map((cell) => `<th>${jatsRuns(parseInline(cell), state)}</th>`).join('')}</tr></thead>
<tbody>
${rows.map((row) => `<tr>${row.map((cell) => `<td>${jatsRuns(parseInline(cell), state)}</td>`).join('')}</tr>`).join('\n')}
</tbody>
</table>
<table-wrap-foot>${block.notes.map((note) => `<fn><p>${jatsRuns(parseInline(note), state)}</p></fn>`).join('')}</table-wrap-foot>
</table-wrap>`);
    }
  }
  closeSection();
  const footnotes = state.footnotes.length > 0
    ? `<fn-group>\n${state.footnotes.map((note, index) => `<fn id="fn${index + 1}"><label>${index + 1}</label><p>${note}</p></fn>`).join('\n')}\n</fn-group>`
    : '';
  const contributors = meta.authors.split(/\s+and\s+/).map((name) => {
    const parts = name.trim().split(/\s+/);
    return `<contrib contrib-type="author"><name><surname>${escapeXml(parts.pop())}</surname><given-names>${escapeXml(parts.join(' '))}</given-names></name></contrib>`;
  }).join('');
  return `<?xml version="1.0" encoding="UTF-8"?>
<!DOCTYPE article PUBLIC "-//NLM//DTD JATS (Z39.96) Journal Publishing DTD v1.3 20210610//EN" "JATS-journalpublishing1-3.dtd">
<article xmlns:xlink="http://www.w3.org/1999/xlink" article-type="research-article" xml:lang="en">
<front>
<journal-meta><journal-title-group><journal-title>Demonstration Manuscripts (invented)</journal-title></journal-title-group></journal-meta>
<article-meta>
<title-group><article-title>${escapeXml(meta.title)}</article-title></title-group>
<contrib-group>${contributors}</contrib-group>
<aff>${escapeXml(meta.affiliation)}</aff>
<abstract>${abstract}</abstract>
</article-meta>
</front>
<body>
${body.join('\n')}
</body>
<back>
<ref-list><title>References</title>
${references.join('\n')}
</ref-list>
${footnotes}
</back>
</article>
`;
}

// ---------- DOCX ----------

function docxRuns(runs, state) {
  return runs.map((run) => {
    if (run.footnote) {
      state.footnotes.push(run.footnote);
      return new docx.FootnoteReferenceRun(state.footnotes.length);
    }
    return new docx.TextRun({ text: run.text, italics: Boolean(run.italic), subScript: Boolean(run.sub), superScript: Boolean(run.sup) });
  });
}

async function toDocx({ meta, blocks }) {
  const state = { footnotes: [] };
  const children = [
    new docx.Paragraph({ heading: docx.HeadingLevel.HEADING_1, children: [new docx.TextRun(meta.title)] }),
    new docx.Paragraph({ children: [new docx.TextRun(meta.authors)] }),
    new docx.Paragraph({ children: [new docx.TextRun(meta.affiliation)] }),
  ];
  for (const block of blocks) {
    if (block.type === 'heading') {
      children.push(new docx.Paragraph({ heading: block.level === 1 ? docx.HeadingLevel.HEADING_2 : docx.HeadingLevel.HEADING_3, children: [new docx.TextRun(block.text)] }));
    } else if (block.type === 'paragraph' || block.type === 'reference') {
      children.push(new docx.Paragraph({ children: docxRuns(parseInline(block.text), state) }));
    } else if (block.type === 'table') {
      children.push(new docx.Paragraph({ children: docxRuns(parseInline(block.caption), state) }));
      children.push(new docx.Table({
        width: { size: 100, type: docx.WidthType.PERCENTAGE },
        rows: block.rows.map((row) => new docx.TableRow({
          children: row.map((cell) => new docx.TableCell({ children: [new docx.Paragraph({ children: docxRuns(parseInline(cell), state) })] })),
        })),
      }));
      for (const note of block.notes) children.push(new docx.Paragraph({ children: docxRuns(parseInline(note), state) }));
    }
  }
  const footnotes = Object.fromEntries(state.footnotes.map((runs, index) => [index + 1, { children: [new docx.Paragraph({ children: docxRuns(runs, { footnotes: [] }) })] }]));
  const document = new docx.Document({
    creator: 'plumbline demo builder',
    title: meta.title,
    footnotes,
    sections: [{ children }],
  });
  return docx.Packer.toBuffer(document);
}

// ---------- PDF ----------

// ---------- main ----------

const TABLE_STYLES = ['caption', 'figure'];
const chromium = findChromium();
const names = readdirSync(sourceDirectory).filter((file) => file.endsWith('.ms')).map((file) => basename(file, '.ms')).sort();
for (const [index, name] of names.entries()) {
  const manuscript = parseManuscript(readFileSync(join(sourceDirectory, `${name}.ms`), 'utf8'));
  const tableStyle = TABLE_STYLES[index % TABLE_STYLES.length];
  writeFileSync(join(demoDirectory, `${name}.txt`), toPlainText(manuscript));
  writeFileSync(join(demoDirectory, `${name}.html`), toHtml(manuscript, { print: false, tableStyle }));
  writeFileSync(join(demoDirectory, `${name}.xml`), toJats(manuscript));
  writeFileSync(join(demoDirectory, `${name}.docx`), await toDocx(manuscript));
  printPdf(chromium, toHtml(manuscript, { print: true, tableStyle }), join(demoDirectory, `${name}.pdf`));
  console.log(`built ${name}: .txt, .html, .xml, .docx, .pdf`);
}
