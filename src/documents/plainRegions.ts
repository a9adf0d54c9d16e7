import { REFERENCE_HEADING } from './builder.js';
import type { Region } from './types.js';

/** Lines that end a reference list in text without markup (what usually follows one). */
const AFTER_REFERENCES = /^(?:appendix|appendices|supplementary (?:material|materials|information)|tables?|figures?|figure captions|author note|notes|endnotes|footnotes)\b[^.]{0,60}$/i;

/**
 * A footnote that extraction placed after the list: a number, then a
 * sentence ("1. A sensitivity analysis that left out ..."). A numbered
 * reference starts with a name and a comma instead ("1. Almond, R. P.").
 */
const FOOTNOTE_AFTER_REFERENCES = /^\d{1,2}[.)]?\s+[A-Z][a-z]*(?:\s+[a-z][\p{L}-]*){2}/u;

/**
 * Regions that can be found in text without markup (PDF): the reference
 * list, from the last line that reads only "References" (or "Bibliography",
 * "Works Cited"...) to the end of the text or to a following "Appendix"
 * line, and that heading line itself. The last such line is taken because a
 * table of contents or a running head may name the section earlier.
 */
export function findReferenceListRegions(text: string): Region[] {
  const lines = lineSpans(text);
  let headingIndex = -1;
  lines.forEach((line, index) => {
    if (REFERENCE_HEADING.test(text.slice(line.start, line.end).trim())) headingIndex = index;
  });
  if (headingIndex === -1) return [];
  const heading = lines[headingIndex]!;
  let end = text.length;
  for (const line of lines.slice(headingIndex + 1)) {
    const lineText = text.slice(line.start, line.end).trim();
    if (AFTER_REFERENCES.test(lineText) || FOOTNOTE_AFTER_REFERENCES.test(lineText)) {
      end = line.start;
      break;
    }
  }
  const regions: Region[] = [trimmed({ kind: 'heading', start: heading.start, end: heading.end }, text)];
  const list = trimmed({ kind: 'references', start: heading.end, end }, text);
  if (list.end > list.start) regions.push(list);
  return regions;
}

function lineSpans(text: string): { start: number; end: number }[] {
  const spans: { start: number; end: number }[] = [];
  const pattern = /[^\n\f]*/g;
  for (let match = pattern.exec(text); match; match = pattern.exec(text)) {
    spans.push({ start: match.index, end: match.index + match[0].length });
    pattern.lastIndex = match.index + match[0].length + 1;
    if (pattern.lastIndex > text.length) break;
  }
  return spans;
}

function trimmed(region: Region, text: string): Region {
  let { start, end } = region;
  while (start < end && /\s/.test(text[start]!)) start += 1;
  while (end > start && /\s/.test(text[end - 1]!)) end -= 1;
  return { kind: region.kind, start, end };
}
