#!/usr/bin/env node
/**
 * Turns every labelled excerpt in tests/corpus/labelled/ (*.txt, *.md) into the same text as
 *
 *   tests/corpus/formats/pdf/<name>.pdf    printed by headless Chromium from HTML; every other
 *                                          excerpt (and the two hard-wrapped "PDF copy" excerpts)
 *                                          in two columns with soft hyphens in long words, the
 *                                          rest in one column; fonts alternate between DejaVu
 *                                          Serif and Liberation Serif (both have Greek letters
 *                                          and the Unicode minus); page set-ups rotate between A4
 *                                          and A5 (A5 with a running head and page numbers, which
 *                                          land inside a result that crosses a page); indented
 *                                          rows of a plain-text table are set as a borderless table
 *   tests/corpus/formats/docx/<name>.docx  Word, via the `docx` package (headings, italics and
 *                                          bold, numbered and bulleted lists, real tables)
 *   tests/corpus/formats/html/<name>.html  HTML
 *   tests/corpus/formats/jats/<name>.xml   JATS XML (<sec>, <p>, <list>, <table-wrap>)
 *
 * Line structure: a plain-text excerpt becomes one paragraph per line (a short title-like line
 * without a result becomes a heading). The two hard-wrapped excerpts (every line short, as
 * copied from a PDF) become one paragraph per blank-line-separated block instead, their lines
 * joined with a space and words hyphenated at a line end joined again ("re-" + "peated" ->
 * "repeated"), as the paragraph would be in the document the copy came from. A Markdown
 * excerpt is rendered with markdown-it: emphasis as italics, strong as bold, lists as lists,
 * pipe tables as real tables. The words and numbers are not changed otherwise.
 *
 * Run from the repository root:  node tests/corpus/formats/build.mjs
 * Needs: `npm install` (docx and markdown-it are dev dependencies) and Chromium.
 * CI does not run this script; the generated files are committed. The test that reads them is
 * tests/corpus/labelled-formats.test.ts.
 */
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import * as docx from 'docx';
import { findChromium, printPdf } from '../../../corpus-demo/tools/print-pdf.mjs';
import MarkdownIt from 'markdown-it';

const here = dirname(fileURLToPath(import.meta.url));
const labelledDirectory = resolve(here, '..', 'labelled');

// ---------- reading an excerpt into blocks ----------
// block: { type: 'heading', level, runs } | { type: 'paragraph', runs, row? } | { type: 'list', ordered, start, items: runs[] }
//      | { type: 'table', header: runs[], rows: runs[][] } | { type: 'quote', blocks }
// run:   { text, italic?, bold?, code? }

const plain = (text) => [{ text }];

/** A hard-wrapped excerpt: every non-blank line short, as text copied from a PDF column. */
function isHardWrapped(lines) {
  const nonBlank = lines.filter((line) => line.trim() !== '');
  return nonBlank.length >= 20 && nonBlank.every((line) => line.length <= 66);
}

function looksLikeHeading(line, hasResult) {
  const text = line.trim();
  return !hasResult && !/^\s/.test(line) && text.length > 0 && text.length <= 50 && /^[A-Z0-9]/.test(text) && !/[.,;:]$/.test(text);
}

function joinWrapped(lines) {
  let out = '';
  for (const raw of lines) {
    const line = raw.trim();
    if (out === '') out = line;
    else if (/\p{L}-$/u.test(out) && /^\p{Ll}/u.test(line)) out = out.slice(0, -1) + line;
    else out += ` ${line}`;
  }
  return out;
}

function textBlocks(text, labelLines) {
  const lines = text.replace(/\n$/, '').split('\n');
  const blocks = [];
  if (isHardWrapped(lines)) {
    let block = [];
    const flush = () => {
      if (block.length === 0) return;
      let body = block;
      if (looksLikeHeading(body[0].text, labelLines.has(body[0].number))) {
        blocks.push({ type: 'heading', level: 2, runs: plain(body[0].text.trim()) });
        body = body.slice(1);
      }
      if (body.length > 0) blocks.push({ type: 'paragraph', runs: plain(joinWrapped(body.map((entry) => entry.text))) });
      block = [];
    };
    lines.forEach((line, index) => {
      if (line.trim() === '') flush();
      else block.push({ text: line, number: index + 1 });
    });
    flush();
    return blocks;
  }
  lines.forEach((line, index) => {
    if (line.trim() === '') return;
    if (looksLikeHeading(line, labelLines.has(index + 1))) blocks.push({ type: 'heading', level: 2, runs: plain(line.trim()) });
    else if (/^\s{2,}\S/.test(line)) blocks.push({ type: 'paragraph', runs: plain(line.trim()), row: line.trim().split(/\s{2,}/) });
    else blocks.push({ type: 'paragraph', runs: plain(line.trim()) });
  });
  return blocks;
}

function inlineRuns(token) {
  const runs = [];
  let italic = 0;
  let bold = 0;
  for (const child of token.children ?? []) {
    if (child.type === 'em_open') italic += 1;
    else if (child.type === 'em_close') italic -= 1;
    else if (child.type === 'strong_open') bold += 1;
    else if (child.type === 'strong_close') bold -= 1;
    else if (child.type === 'text') runs.push({ text: child.content, italic: italic > 0, bold: bold > 0 });
    else if (child.type === 'code_inline') runs.push({ text: child.content, code: true });
    else if (child.type === 'softbreak' || child.type === 'hardbreak') runs.push({ text: ' ' });
    else throw new Error(`unexpected inline token ${child.type}`);
  }
  return runs;
}

function markdownBlocks(source) {
  const tokens = new MarkdownIt({ html: false }).parse(source, {});
  const root = [];
  const stack = [root];
  const top = () => stack[stack.length - 1];
  let list = null;
  let table = null;
  let row = null;
  for (const token of tokens) {
    switch (token.type) {
      case 'heading_open':
      case 'paragraph_open':
      case 'paragraph_close':
      case 'heading_close':
      case 'list_item_close':
      case 'thead_open':
      case 'thead_close':
      case 'tbody_open':
      case 'tbody_close':
      case 'th_open':
      case 'td_open':
      case 'th_close':
      case 'td_close':
        break;
      case 'inline': {
        const runs = inlineRuns(token);
        if (row) row.push(runs);
        else if (list) list.items.push(runs);
        else {
          const previous = tokens[tokens.indexOf(token) - 1];
          if (previous.type === 'heading_open') top().push({ type: 'heading', level: Number(previous.tag.slice(1)), runs });
          else top().push({ type: 'paragraph', runs });
        }
        break;
      }
      case 'bullet_list_open':
      case 'ordered_list_open':
        list = { type: 'list', ordered: token.type === 'ordered_list_open', start: Number(token.attrGet('start') ?? 1), items: [] };
        top().push(list);
        break;
      case 'bullet_list_close':
      case 'ordered_list_close':
        list = null;
        break;
      case 'list_item_open':
        break;
      case 'blockquote_open': {
        const quote = { type: 'quote', blocks: [] };
        top().push(quote);
        stack.push(quote.blocks);
        break;
      }
      case 'blockquote_close':
        stack.pop();
        break;
      case 'table_open':
        table = { type: 'table', header: [], rows: [] };
        top().push(table);
        break;
      case 'table_close':
        table = null;
        break;
      case 'tr_open':
        row = [];
        break;
      case 'tr_close':
        if (table.header.length === 0) table.header = row;
        else table.rows.push(row);
        row = null;
        break;
      case 'hr':
        break;
      default:
        throw new Error(`unexpected markdown token ${token.type}`);
    }
  }
  return root;
}

// ---------- HTML ----------

const escapeXml = (text) => text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');

function softHyphenate(text) {
  // Long lower-case words get a soft hyphen in the middle, so printed columns may hyphenate them.
  return text.replace(/\b([a-z]{6,})([a-z]{6,})\b/g, '$1\u00AD$2');
}

function htmlRuns(runs, options = {}) {
  return runs
    .map((run) => {
      let text = escapeXml(options.hyphenate && !run.code ? softHyphenate(run.text) : run.text);
      if (run.code) text = `<code>${text}</code>`;
      if (run.bold) text = `<strong>${text}</strong>`;
      if (run.italic) text = `<em>${text}</em>`;
      return text;
    })
    .join('');
}

function htmlBlocks(blocks, options) {
  const out = [];
  for (let index = 0; index < blocks.length; index += 1) {
    const block = blocks[index];
    if (block.type === 'heading') out.push(`<h${block.level + 1}>${htmlRuns(block.runs)}</h${block.level + 1}>`);
    else if (block.type === 'paragraph' && block.row && options.print) {
      // Indented rows of a plain-text table: set as a borderless table in print.
      const rows = [];
      for (; index < blocks.length && blocks[index].row; index += 1) rows.push(blocks[index].row);
      index -= 1;
      const width = Math.max(...rows.map((cells) => cells.length));
      out.push(
        `<table class="rows">\n${rows
          .map((cells) => `<tr>${cells.map((cell, i) => `<td${i === cells.length - 1 && cells.length < width ? ` colspan="${width - cells.length + 1}"` : ''}>${escapeXml(cell)}</td>`).join('')}</tr>`)
          .join('\n')}\n</table>`,
      );
    } else if (block.type === 'paragraph') out.push(`<p>${htmlRuns(block.runs, options)}</p>`);
    else if (block.type === 'list') {
      const tag = block.ordered ? 'ol' : 'ul';
      const start = block.ordered && block.start !== 1 ? ` start="${block.start}"` : '';
      out.push(`<${tag}${start}>\n${block.items.map((runs) => `<li>${htmlRuns(runs, options)}</li>`).join('\n')}\n</${tag}>`);
    } else if (block.type === 'quote') out.push(`<blockquote>\n${htmlBlocks(block.blocks, options)}\n</blockquote>`);
    else if (block.type === 'table') {
      out.push(
        `<table class="grid">\n<thead><tr>${block.header.map((cell) => `<th>${htmlRuns(cell)}</th>`).join('')}</tr></thead>\n<tbody>\n${block.rows
          .map((cells) => `<tr>${cells.map((cell) => `<td>${htmlRuns(cell)}</td>`).join('')}</tr>`)
          .join('\n')}\n</tbody>\n</table>`,
      );
    }
  }
  return out.join('\n');
}

function printCss({ twoColumn, font, page }) {
  // A running head and a page number in the margin boxes: a result that crosses a page has them in between.
  const margins = page.furniture
    ? `@top-center { content: 'Labelled excerpts (invented)'; font-family: '${font}', serif; font-size: 8pt; font-style: italic; }
    @bottom-center { content: counter(page); font-family: '${font}', serif; font-size: 9pt; }`
    : '';
  return `
  @page { size: ${page.size}; margin: ${page.margin}; ${margins} }
  body { font-family: '${font}', serif; font-size: ${page.fontSize}; line-height: 1.35; }
  h1 { font-size: 14pt; margin: 0 0 0.6em; }
  h2 { font-size: 12pt; margin: 0.9em 0 0.3em; }
  h3, h4 { font-size: 10.5pt; font-style: italic; margin: 0.8em 0 0.2em; }
  p, li { margin: 0 0 0.45em; text-align: ${twoColumn ? 'left' : 'justify'}; }
  blockquote { margin: 0.5em 1.5em; font-size: 9.5pt; }
  table { border-collapse: collapse; margin: 0.5em 0; font-size: 9pt; }
  table.grid th { border-top: 1px solid #000; border-bottom: 1px solid #000; }
  table.grid tbody tr:last-child td { border-bottom: 1px solid #000; }
  th, td { padding: 1px 8px 1px 0; text-align: left; vertical-align: top; }
  code { font-family: 'DejaVu Sans Mono', monospace; font-size: 9pt; }
  ${twoColumn ? '.columns { column-count: 2; column-gap: 2.2em; } .columns table.rows { column-span: all; } .columns h2, .columns h3 { break-after: avoid; }' : ''}
`;
}

function toHtml(name, blocks, { print = false, twoColumn = false, font = 'DejaVu Serif', page = PAGES[0] } = {}) {
  const css = print ? printCss({ twoColumn, font, page }) : 'body { max-width: 46em; margin: 2em auto; font-family: serif; }';
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<title>${escapeXml(name)}</title>
<style>${css}</style>
</head>
<body>
<main${twoColumn ? ' class="columns"' : ''}>
${htmlBlocks(blocks, { print, hyphenate: print && twoColumn })}
</main>
</body>
</html>
`;
}

// ---------- JATS ----------

function jatsRuns(runs) {
  return runs
    .map((run) => {
      let text = escapeXml(run.text);
      if (run.code) text = `<monospace>${text}</monospace>`;
      if (run.bold) text = `<bold>${text}</bold>`;
      if (run.italic) text = `<italic>${text}</italic>`;
      return text;
    })
    .join('');
}

function jatsBlocks(blocks, state) {
  const out = [];
  for (const block of blocks) {
    if (block.type === 'heading') {
      // Every heading opens a section; a deeper heading nests, a shallower one closes.
      while (state.open.length > 0 && state.open[state.open.length - 1] >= block.level) {
        out.push('</sec>');
        state.open.pop();
      }
      out.push(`<sec>\n<title>${jatsRuns(block.runs)}</title>`);
      state.open.push(block.level);
    } else if (block.type === 'paragraph') out.push(`<p>${jatsRuns(block.runs)}</p>`);
    else if (block.type === 'list') {
      out.push(`<list list-type="${block.ordered ? 'order' : 'bullet'}">\n${block.items.map((runs) => `<list-item><p>${jatsRuns(runs)}</p></list-item>`).join('\n')}\n</list>`);
    } else if (block.type === 'quote') {
      out.push(`<disp-quote>\n${jatsBlocks(block.blocks, { open: [] })}\n</disp-quote>`);
    } else if (block.type === 'table') {
      state.tables += 1;
      out.push(`<table-wrap id="t${state.tables}">
<table>
<thead><tr>${block.header.map((cell) => `<th>${jatsRuns(cell)}</th>`).join('')}</tr></thead>
<tbody>
${block.rows.map((cells) => `<tr>${cells.map((cell) => `<td>${jatsRuns(cell)}</td>`).join('')}</tr>`).join('\n')}
</tbody>
</table>
</table-wrap>`);
    }
  }
  return out.join('\n');
}

function toJats(name, blocks) {
  const state = { open: [], tables: 0 };
  const body = jatsBlocks(blocks, state);
  const close = state.open.map(() => '</sec>').join('\n');
  return `<?xml version="1.0" encoding="UTF-8"?>
<!DOCTYPE article PUBLIC "-//NLM//DTD JATS (Z39.96) Journal Publishing DTD v1.3 20210610//EN" "JATS-journalpublishing1-3.dtd">
<article xmlns:xlink="http://www.w3.org/1999/xlink" article-type="research-article" xml:lang="en">
<front>
<journal-meta><journal-title-group><journal-title>Labelled Excerpts (invented)</journal-title></journal-title-group></journal-meta>
<article-meta>
<title-group><article-title>${escapeXml(name)}</article-title></title-group>
</article-meta>
</front>
<body>
${body}
${close}
</body>
</article>
`;
}

// ---------- DOCX ----------

function docxRuns(runs) {
  return runs.map(
    (run) =>
      new docx.TextRun({
        text: run.text,
        italics: Boolean(run.italic),
        bold: Boolean(run.bold),
        ...(run.code ? { font: 'Courier New' } : {}),
      }),
  );
}

const HEADINGS = [docx.HeadingLevel.HEADING_1, docx.HeadingLevel.HEADING_2, docx.HeadingLevel.HEADING_3, docx.HeadingLevel.HEADING_4];

function docxBlocks(blocks, state, indent = 0) {
  const children = [];
  for (const block of blocks) {
    if (block.type === 'heading') children.push(new docx.Paragraph({ heading: HEADINGS[block.level - 1], children: docxRuns(block.runs) }));
    else if (block.type === 'paragraph') children.push(new docx.Paragraph({ children: docxRuns(block.runs), ...(indent ? { indent: { left: indent } } : {}) }));
    else if (block.type === 'list') {
      state.lists += 1;
      const instance = state.lists;
      for (const runs of block.items) {
        children.push(
          new docx.Paragraph({
            children: docxRuns(runs),
            ...(block.ordered ? { numbering: { reference: 'ordered', level: 0, instance } } : { bullet: { level: 0 } }),
          }),
        );
      }
    } else if (block.type === 'quote') children.push(...docxBlocks(block.blocks, state, 720));
    else if (block.type === 'table') {
      children.push(
        new docx.Table({
          width: { size: 100, type: docx.WidthType.PERCENTAGE },
          rows: [block.header, ...block.rows].map(
            (cells, rowIndex) =>
              new docx.TableRow({
                tableHeader: rowIndex === 0,
                children: cells.map((cell) => new docx.TableCell({ children: [new docx.Paragraph({ children: docxRuns(cell) })] })),
              }),
          ),
        }),
      );
    }
  }
  return children;
}

async function toDocx(name, blocks) {
  const document = new docx.Document({
    creator: 'plumbline labelled-corpus builder',
    title: name,
    numbering: {
      config: [
        {
          reference: 'ordered',
          levels: [{ level: 0, format: docx.LevelFormat.DECIMAL, text: '%1.', alignment: docx.AlignmentType.START, style: { paragraph: { indent: { left: 720, hanging: 360 } } } }],
        },
      ],
    },
    sections: [{ children: docxBlocks(blocks, { lists: 0 }) }],
  });
  return docx.Packer.toBuffer(document);
}

// ---------- PDF ----------

// ---------- main ----------

const FONTS = ['DejaVu Serif', 'Liberation Serif'];
/** Page set-ups, taken in turn: the A5 pages make most excerpts run over two or three pages. */
const PAGES = [
  { size: 'A4', margin: '2cm 1.8cm', fontSize: '10pt', furniture: false },
  { size: 'A5', margin: '1.6cm 1.4cm', fontSize: '11pt', furniture: true },
  { size: 'A5', margin: '1.8cm 1.6cm', fontSize: '11.5pt', furniture: true },
];
for (const format of ['pdf', 'docx', 'html', 'jats']) mkdirSync(join(here, format), { recursive: true });
const chromium = findChromium();
const files = readdirSync(labelledDirectory).filter((file) => /\.(txt|md)$/.test(file)).sort();
for (const [index, file] of files.entries()) {
  const name = file.replace(/\.(txt|md)$/, '');
  const source = readFileSync(join(labelledDirectory, file), 'utf8');
  const labels = JSON.parse(readFileSync(join(labelledDirectory, `${name}.labels.json`), 'utf8'));
  const labelLines = new Set(labels.results.map((result) => result.line));
  const blocks = file.endsWith('.md') ? markdownBlocks(source) : textBlocks(source, labelLines);
  const twoColumn = index % 2 === 0 || (!file.endsWith('.md') && isHardWrapped(source.split('\n')));
  const font = FONTS[Math.floor(index / 2) % FONTS.length];
  const page = PAGES[index % PAGES.length];
  writeFileSync(join(here, 'html', `${name}.html`), toHtml(name, blocks));
  writeFileSync(join(here, 'jats', `${name}.xml`), toJats(name, blocks));
  writeFileSync(join(here, 'docx', `${name}.docx`), await toDocx(name, blocks));
  printPdf(chromium, toHtml(name, blocks, { print: true, twoColumn, font, page }), join(here, 'pdf', `${name}.pdf`));
  console.log(`built ${name}: ${twoColumn ? 'two-column' : 'one-column'} ${page.size} PDF in ${font}, DOCX, HTML, JATS`);
}
