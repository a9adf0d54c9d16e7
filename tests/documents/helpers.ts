import { fileURLToPath } from 'node:url';
import { expect } from 'vitest';
import { findPdftotext } from '../../src/documents/pdf.js';
import { readDocument, type ReadOptions } from '../../src/documents/read.js';
import type { DocumentText, RegionKind } from '../../src/documents/types.js';

export const fixture = (name: string): string => fileURLToPath(new URL(`../fixtures/documents/${name}`, import.meta.url));
export const demo = (name: string): string => fileURLToPath(new URL(`../../corpus-demo/${name}`, import.meta.url));

export const DEMO_MANUSCRIPTS = ['orchard-noise-vigilance', 'tidepool-volunteer-persistence', 'lantern-reading-fluency', 'gravel-path-wayfinding'] as const;

/** Reads a document that must be readable; fails the test with the reader's reason otherwise. */
export async function readOk(path: string, options: ReadOptions = {}): Promise<DocumentText> {
  const outcome = await readDocument(path, options);
  if (!outcome.ok) expect.fail(`expected ${path} to be readable, got: ${outcome.error}`);
  return outcome.document;
}

export function regionTexts(document: DocumentText, kind: RegionKind): string[] {
  return document.regions.filter((region) => region.kind === kind).map((region) => document.text.slice(region.start, region.end));
}

/** The kind of region an offset sits in ('body' when none). */
export function regionAt(document: DocumentText, offset: number): RegionKind {
  return document.regions.find((region) => region.start <= offset && offset < region.end)?.kind ?? 'body';
}

/** Regions must be sorted, not overlapping, inside the text, and not empty. */
export function expectWellFormedRegions(document: DocumentText): void {
  let previousEnd = 0;
  for (const region of document.regions) {
    expect(region.start).toBeGreaterThanOrEqual(previousEnd);
    expect(region.end).toBeGreaterThan(region.start);
    expect(region.end).toBeLessThanOrEqual(document.text.length);
    previousEnd = region.end;
  }
}

export const pdftotextMissing = findPdftotext() === null;
export const pdftotextRequired = process.env.PLUMBLINE_REQUIRE_PDFTOTEXT === '1';
export const PDFTOTEXT_SKIP_REASON = 'pdftotext (poppler-utils) is not on PATH, so its tests are skipped; set PLUMBLINE_REQUIRE_PDFTOTEXT=1 to make this a failure';
