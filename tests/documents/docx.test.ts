import { describe, expect, it } from 'vitest';
import { demo, expectWellFormedRegions, readOk, regionAt, regionTexts } from './helpers.js';

describe('DOCX reader (mammoth, then the HTML reader)', () => {
  it('reads headings, text with flattened sub/superscripts, and footnotes', async () => {
    const document = await readOk(demo('orchard-noise-vigilance.docx'));
    expect(document.format).toBe('docx');
    expect(document.pageOf(0)).toBeNull();
    expect(document.text).toContain('F(2, 87) = 5.43, p = .006, ηp2 = .11 (Table 1)');
    expect(regionTexts(document, 'heading')).toEqual(expect.arrayContaining(['Abstract', 'Method', 'Participants', 'Results', 'References']));
    expect(regionTexts(document, 'footnote').join('\n')).toContain('t(84) = 2.21, p = .030');
    expect(document.text).toContain('p = .019.[1]');
    expectWellFormedRegions(document);
  });

  it('reads a Word table with its "Table 1." caption paragraph and "Note." paragraph', async () => {
    const document = await readOk(demo('lantern-reading-fluency.docx'));
    expect(document.tables).toHaveLength(1);
    const table = document.tables[0]!;
    expect(table.caption).toBe('Table 1. Mixed analysis of variance of oral reading fluency');
    expect(table.rows[0]).toEqual(['Source', 'SS', 'df', 'MS', 'F', 'p', 'ηp2']);
    expect(table.rows).toContainEqual(['Session', '566.27', '2', '283.14', '12.64', '< .001', '.15']);
    expect(table.notes).toEqual(["Note. Sphericity held (Mauchly's test, p > .20), so no correction was applied."]);
    expect(document.text.slice(table.start, table.end)).toContain('Session × Group | 152.77 | 2 | 76.38 | 3.41 | .036 | .05');
  });

  it('marks the reference list after the References heading', async () => {
    const document = await readOk(demo('gravel-path-wayfinding.docx'));
    const references = regionTexts(document, 'references').join('\n');
    expect(references).toContain('Crestwell, A. (2018).');
    expect(references).toContain('Underhay, P. (2014).');
    expect(regionAt(document, document.text.indexOf('t(62) = 3.58'))).toBe('table');
  });
});
