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

/** Of a line, only its start is needed to tell a heading or what ends a reference list. */
const LINE_PREFIX = 200;

/**
 * findReferenceListRegions for a text read in pieces (a streamed text file):
 * feed it the text in order with `add`, then `finish` gives the same
 * reference-list region (untrimmed, which selects the same results) in
 * offsets of the whole text. Memory: one line's first characters.
 */
export class ReferenceListTracker {
  private offset = 0;
  private lineStart = 0;
  private prefix = '';
  private heading: { start: number; end: number } | null = null;
  private endAfterHeading: number | null = null;

  add(piece: string): void {
    let from = 0;
    for (;;) {
      const newline = nextBreak(piece, from);
      if (newline === -1) {
        if (this.prefix.length < LINE_PREFIX) this.prefix += piece.slice(from, from + LINE_PREFIX - this.prefix.length);
        this.offset += piece.length - from;
        return;
      }
      if (this.prefix.length < LINE_PREFIX) this.prefix += piece.slice(from, Math.min(newline, from + LINE_PREFIX - this.prefix.length));
      this.offset += newline - from;
      this.endLine(this.offset);
      this.offset += 1;
      this.lineStart = this.offset;
      from = newline + 1;
    }
  }

  private endLine(end: number): void {
    const line = this.prefix.trim();
    const whole = end - this.lineStart <= LINE_PREFIX;
    if (whole && REFERENCE_HEADING.test(line)) {
      this.heading = { start: this.lineStart, end };
      this.endAfterHeading = null;
    } else if (this.heading !== null && this.endAfterHeading === null) {
      if ((whole && AFTER_REFERENCES.test(line)) || FOOTNOTE_AFTER_REFERENCES.test(line)) this.endAfterHeading = this.lineStart;
    }
    this.prefix = '';
  }

  finish(): Region[] {
    this.endLine(this.offset);
    if (this.heading === null) return [];
    const end = this.endAfterHeading ?? this.offset;
    const regions: Region[] = [{ kind: 'heading', start: this.heading.start, end: this.heading.end }];
    if (end > this.heading.end) regions.push({ kind: 'references', start: this.heading.end, end });
    return regions;
  }
}

function nextBreak(text: string, from: number): number {
  const newline = text.indexOf('\n', from);
  const formFeed = text.indexOf('\f', from);
  if (newline === -1) return formFeed;
  if (formFeed === -1) return newline;
  return Math.min(newline, formFeed);
}
