import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { isBracketedPairCell, shapeOf } from '../../../src/scan/tables/align.js';

/**
 * isBracketedPairCell answers without reading the whole cell when the
 * pattern of a bracketed df pair does not fit; it must answer exactly as
 * shapeOf's full reading does. Cells are drawn from the pieces real df pairs,
 * intervals, brackets of prose and copy damage are made of (garbled glyphs,
 * thin spaces, tabs). Seeded; fast-check prints the seed and the shrunk cell
 * on failure.
 */
const PIECES = ['(', '[', ')', ']', ' ', '  ', '\t', '\u2009', '\u202f', '\u00c2', '\u00c2\u00a0', '\u00e2\u20ac\u201c', '\u00e2\u20ac\u2030', '\u00e2\u02c6\u2019', '0', '1', '2', '5', '57', '180', '.', '.5', ',', ';', '/', '-', '\u2212', 'df', '=', 'n', 'M', '4.32', '<'];

const cell = fc
  .tuple(fc.constantFrom('(', '[', ''), fc.array(fc.constantFrom(...PIECES), { minLength: 1, maxLength: 8 }), fc.constantFrom(')', ']', ''), fc.constantFrom('', ' '))
  .map(([open, middle, close, pad]) => `${pad}${open}${middle.join('')}${close}${pad}`);

function pairInBracketsByShape(text: string): boolean {
  const shape = shapeOf(text);
  return shape.shape === 'pair' && shape.bracketed === true;
}

describe('isBracketedPairCell', () => {
  it('answers as shapeOf does, for random cells of df pairs, intervals and damaged brackets', () => {
    fc.assert(
      fc.property(cell, (text) => isBracketedPairCell(text) === pairInBracketsByShape(text)),
      { seed: 20261205, numRuns: 20000 },
    );
  });

  it('reads df pairs in brackets and passes over brackets of prose and intervals', () => {
    // (Cells as papers print them: common practice.)
    expect(['(2, 57)', '[1; 38]', '(1/38)', ' ( 2 , 180 ) '].map(isBracketedPairCell)).toEqual([true, true, true, true]);
    expect(['(M = 4.32, SD = 1.10, n = 30)', '(0.05, 0.52)', '(2)', 'F(2, 57)', '(2, 57'].map(isBracketedPairCell)).toEqual([false, false, false, false, false]);
    expect(['(2, 57)', '(M = 4.32, SD = 1.10, n = 30)', '(0.05, 0.52)'].map(pairInBracketsByShape)).toEqual([true, false, false]);
    // A copy's garbled no-break space ("\u00c2\u00a0") is repaired before the pattern is tried.
    expect(isBracketedPairCell('(2,\u00c2\u00a057)')).toBe(pairInBracketsByShape('(2,\u00c2\u00a057)'));
  });
});
