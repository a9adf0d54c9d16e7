/**
 * The real corpus (tests/corpus/real/): excerpts of openly licensed
 * published text, labelled as printed; see its README. This test holds the
 * corpus to its own rules and plumbline to the scores it has reached on it,
 * on both splits, so that no change of the scanner or the table reader
 * lowers them unnoticed. `npm run score:real` prints the full scores.
 */
import { existsSync, readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { damageScores, figures, loadRealCorpus, REAL_CORPUS_DIRECTORY, renderingScores, scoreCorpus, type Rendering, type Split } from './real/score.js';

const corpus = loadRealCorpus();
const scores = scoreCorpus(corpus);

/**
 * Scores reached when this floor was last raised (recall and precision of
 * readable results; the highest share of consistent results failed). A
 * change that lowers one fails here; a change that raises one should raise
 * its floor too.
 */
// The corpus grew by 6 passages on 2026-12-04 (dwaa-01..06): tune table recall 0.86 -> 0.85, holdout
// table recall 0.49 -> 0.50 and its ceiling of fails on consistent results 0.01 -> 0.03 (9 of 323), as measured;
// then, with "χ(1)2" and "p = 9.4.E-07" read, holdout table recall 0.51 and fails on consistent back to 0 (ceiling 0.01).
// The corpus grew by 26 passages on 2026-12-05 (dwba-01..dwbv-01), as measured: tune table precision 1 -> 0.99
// (5 false alarms), tune text recall 0.97 -> 0.96, precision 1 -> 0.99 and its ceiling of fails on consistent
// results 0.01 -> 0.07 (9 of 148, all in dwba-02), holdout table recall 0.51 -> 0.52; then, with "N = 12 control,
// 13 drug, ..." read as group sizes, "4. 54" as 4.54, a note stating two df pairs taken for neither, and "7 (24)"
// no longer placed under "Chi-square (df)", precision back to 1 and fails on consistent to 0 (ceiling 0.01).
// The corpus grew by 7 passages on 2026-12-05 (second batch, dwca-01..dwcg-01): tune table recall 0.85 -> 0.84
// (0.848), holdout table recall 0.52 -> 0.56 (0.5667). They showed one misreading (a pipe row broken after its
// label cell, its values closed by the row's last pipe) and 7 fails on consistent results in the holdout (a p taken
// from the next row of a table); with both mended, precision stays 1 and fails on consistent results 0.
// Later the same day, with model-coefficient tables and df pairs that lost their comma read: tune table recall 0.86
// (0.869).
// The corpus grew by 7 passages on 2026-12-05 (third batch, dwda-01..dwdg-01), as measured: tune table precision
// 1 -> 0.99 (0.998: 5 false alarms, 2 in dwdc-01's pipe rows whose label cells are missing, a df of 1 read as z, and
// 3 in dwdf-01, lack of fit read with the residual df instead of pure error's) and 1 fail on a consistent result
// (dwdf-01, of 1082: under the ceiling of 0.01); tune table recall 0.866, holdout table recall 0.569: floors kept.
// The corpus grew by 2 prose passages on 2026-12-05 (prose batch, dwea-01 and dwec-01, both tune; 6 results in running
// text), as measured: tune text recall 0.96 -> 0.95 (0.954: the three correlations of dwec-01 not read); tune table
// 0.867 and holdout unchanged.
// The corpus grew by 11 passages on 2026-12-05 (fourth batch, dwfa-01..dwfk-01: 9 tables, 2 figure legends; 9 tune,
// 2 holdout whose labels all lack df), as measured after the scanner's changes of the day: tune table recall 0.863,
// tune text recall 0.95 -> 0.94 (0.948: dwfk-01's chi-squares left as LaTeX not read), holdout unchanged; all-labels
// holdout floor 0.44 -> 0.43 (0.437: the new holdout labels have no df), tune silent-miss ceiling 48 -> 56.
// The corpus grew by 11 prose passages on 2026-12-05 (second prose batch, dwga-01..dwgf-01, all tune; 62 results in running
// text, from CC BY papers' PDF text with math-italic glyphs, lost glyphs and numerator-only df), as measured: tune text
// recall 0.94 -> 0.95 (0.957: 245 of 256 readable; the Spearman rho and Kruskal-Wallis H in math italics not read);
// tune silent-miss ceiling 56 kept (56); tables and holdout unchanged.
// The corpus grew by 8 table passages on 2026-12-05 (fifth batch, dwha-01..dwhg-01: 7 tune, 1 holdout; Hindawi tables
// whose cells ran together, a correlation table with its N in braces on the next row), as measured with the second
// prose batch: tune table recall 0.86 -> 0.83 (0.838) and 2 false alarms more (4: a correlation triangle glued to its
// diagonal, dwhd-01); holdout table recall 0.56 -> 0.54 (0.544); all-labels floors tune 0.58 -> 0.57, holdout 0.43 ->
// 0.42; silent-miss ceilings tune 56 -> 91, holdout 74 -> 97.
// 2026-12-05, code-index prose batch: the corpus grew by 12 prose passages (dwja-01..09 from an eLife article's figure
// legends, dwjb-01..02 from a CHI paper whose italic F and p were lost in extraction, dwjc-01 from a Frontiers article:
// chi-squares without df; 10 tune, 2 holdout). As measured after them: tune table recall 0.83 -> 0.85 (0.852, the floor
// had been left below the last measure), tune text recall 0.96 (0.963: dwjb-01's four F with no symbol, dwja-02's
// lower-case 'f(2,11)' and dwja-09's 'p=5.4 E-5' not read), its fails on consistent results 1 of 231 (dwja-09, the p
// misread as 5.4: under the ceiling of 0.01); holdout text recall 0.48 -> 0.51 (0.512); holdout table 0.54 kept.
// 2026-12-05, code-index table batch: the corpus grew by 9 table passages (dwia-01..dwif-01 from CC BY papers stored
// as Markdown or PDF text; 6 tune, 3 holdout), as measured after Minitab's "Adj SS"/"Adj MS" were read: tune table
// recall 0.85 -> 0.84 (0.845; 2 false alarms in dwib-01, a p cell taken for z in rows run into the caption), holdout
// table recall 0.543 and its precision 1 -> 0.96 (0.967: 14 false alarms in the new holdout passages); all-labels
// holdout floor 0.42 -> 0.41; silent-miss ceilings tune 56 -> 67, holdout 100 -> 114.
// 2026-12-05, second code-index table batch: the corpus grew by 1 table passage (dwka-01, an MDPI CC BY paper's SPSS
// multivariate and between-subjects tables as pipe rows; tune; its 10 F results not read, all in tables the report
// lists as not read). As measured: tune table recall 0.843, precision 0.999, all-labels 0.578, silent misses 65;
// holdout unchanged: every floor and ceiling kept.
// 2026-12-05, second code-index prose batch: 13 passages from seven eLife papers (dwla-01..dwlg-02; 10 tune, 3 holdout),
// as measured: holdout text recall 0.51 -> 0.60 (0.604), tune text 0.968 with no fail on a consistent result once
// 'ηp2 = 2⋅10–3' is read in scientific notation; tables unchanged.
// 2026-12-05: a titled table whose long column names run over one line before its rows is listed as not read
// (dwaa-06's 33 correlations), and an HTML table whose head holds only its title is read (dwib-02): tune
// silent-miss ceiling 67 -> 23, as measured.
// 2026-12-05, end of the session: tune table recall 0.84 -> 0.85 (0.851), tune text 0.96 -> 0.97 (0.971), tune
// silent-miss ceiling 21, as measured.
// 2026-12-05, tenth-session batch dwn: the corpus grew by 12 prose passages from six CC BY papers (dwna-01..dwnf-01:
// Frontiers and PLOS ONE full texts as Markdown or PDF text; 6 tune, 6 holdout), as measured: tune text recall
// 0.97 -> 0.96 (0.9651: dwnc-03's three display-TeX F with subscript df not read), holdout text recall 0.60 -> 0.59
// (0.5949); silent-miss ceilings tune 21 -> 24, holdout 114 -> 125; tables unchanged.
// 2026-12-05, tenth-session batch dwp: the corpus grew by 11 table passages (dwpa-01..dwpj-01, all tune: chi-square,
// correlation and Wald tables from Hindawi, BMC, PMC and OMICS table pages; 63 readable labels, 12 of them read
// before any tuning). As measured: tune table recall 0.85 -> 0.83 (0.834), tune table precision 0.99 kept (0.999,
// 3 false alarms), tune all-labels 0.57 kept (0.574), tune silent-miss ceiling 21 kept (21); holdout unchanged.
// 2026-12-05, tenth-session batch dwo: the corpus grew by 10 table passages (dwoa-01..dwoi-01; 8 tune, 2 holdout),
// each from a paper not yet in it: BMC, SpringerOpen, PeerJ, PLOS ONE and Scientific Reports table pages and one
// Scientific Reports PDF text whose tables come out column block by column block. As measured after them: tune table
// recall 0.85 -> 0.80 (0.807: 141 new correlations in three matrices the scanner does not read, dwod-01, dwof-01,
// dwoh-01), holdout table recall 0.54 -> 0.52 (0.528: dwog-01's 17 HLM t-ratios with an 'Approximatedf' column),
// precision floors kept (tune 0.999, holdout 0.963: 2 false alarms more, in dwob-01); all-labels floors tune 0.57 ->
// 0.56 (0.567), holdout 0.41 -> 0.40 (0.407); silent-miss ceilings tune 21 -> 69 (dwof-01's 48 Spearman cells lie
// before and after the span of the table listed as not read, whose caption the PDF text prints below its body),
// holdout 114 -> 121. Text floors and rendering floors unchanged (0.971 and 0.604; the new pipe table, dwoe-01, adds
// no result read from pipe rows).
// 2026-12-05, tenth session, the three batches merged (dwn, dwp, dwo) and an F's df in "F_{(1, 42)}" read: tune
// table 0.79 (0.792), tune text 0.97 (0.973), holdout table 0.52 (0.528, precision 0.963), holdout text 0.64 (0.646,
// precision 0.98 (0.984): one false alarm, a new held-out prose passage); all-labels tune 0.55 (0.559); silent-miss ceilings tune 69, holdout
// 128, as measured.
// 2026-12-05, tenth-session batch dwm: the corpus grew by 10 table and prose passages (dwma-01..dwmj-01; 9 tune, 1
// holdout: df in a df column with Error rows, in the header 'F, p value (df 1, 24)', in brackets after t '(12,000)',
// as flattened subscripts 't935=6.578', 'F3,122.84=10.41', and 'F (df); p' cells). As measured: tune table recall
// 0.85 -> 0.82 (0.8238: 93 of the 151 new readable tune table labels not read, all of dwmd-01, dwmf-01, dwmh-01 and
// dwmi-01 and four rows of dwme-02), holdout table recall 0.54 -> 0.53 (0.5355: dwmg-01, 7 of 21); precision, text
// recall and fails on consistent results unchanged.
// 2026-12-05, tenth session, after the dwm batch merged and numbered correlation matrices read (dwod-01, dwoh-01):
// tune table 0.80 (0.803), holdout table 0.52 (0.521), all-labels tune 0.57 (0.572), holdout 0.40 (0.406); silent-miss
// ceiling holdout 142 (dwm's held-out passage), tabs-page-break 0.98 (0.985), as measured.
// 2026-12-05, tenth session, helper10-sb: crushed rows ending in a column of words and stacked blocks with their own
// error rows (dwmd-01), wrapped crushed 't (df)' rows with thousands commas (dwmh-01), 'F, p value (df 1, 24)' and
// 'F (df); p' cells one per line (dwmf-01, dwmi-01): all 89 of their labels read, no other passage changed. As
// measured: tune table 0.80 -> 0.83 (0.835), all-labels tune 0.57 -> 0.58 (0.5896); holdout and renderings unchanged.
// 2026-12-05, tenth session, helper10-sa: cells written "r = 0.586*" read with their group header's n (dwpc-01, 27 r),
// chi-square cells "10.84(1, 141)" one cell per line closed by pipes (dwpd-01, 14) and a side table's "_{df = 3}"
// (dwpf-01, 3): tune table 0.80 -> 0.81 (0.819), as measured; holdout unchanged.
// 2026-12-05, tenth-session batch dwq: the corpus grew by 14 passages from five CC BY sources (dwqa-01..dwqe-03: MDPI
// full texts from Europe PMC XML and PDF text, a bioRxiv preprint with margin line numbers, R ANOVA output from a study's
// supplementary repository, an Elsevier PDF text; 11 tune, 3 holdout). As measured: holdout text recall 0.64 -> 0.70
// (0.700), all-labels tune 0.58 -> 0.59 (0.593); silent-miss ceilings tune 69 -> 71 (dwqe-01's t whose minus came out
// as '(cid:0)', dwqd-02's Intercept row with 'p < 2.2e-16'), holdout 142 -> 141; other floors kept (tune table 0.835,
// tune text 0.974, holdout table 0.523; precision 0.999, 1, 0.964, 0.986); renderings unchanged (no pipe table added).
// 2026-12-05, tenth-session batch dwr: the corpus grew by 3 prose passages from two JMIR articles' PDF text (dwra-01
// and dwrb-01 tune, dwra-02 holdout): chi-squares whose subscript df fall onto lines of their own and an F with its
// df flattened against the letter. As measured: tune text recall 0.97 -> 0.96 (0.969: dwra-01's two chi-squares not
// read), holdout text 0.642 (floor kept); silent-miss ceilings tune 69 -> 71, holdout 142 -> 143; tables unchanged.
// Then 2 tune passages from a CC BY Elsevier article converted to Markdown (dwrc-01: a table collapsed into one pipe
// row whose cells join their lines with '<br>', 26 Spearman correlations '_ρ_= −0.54' without p; dwrc-02: prose
// '_ρ_ = − 0.69'), none of the 30 read: tune table recall 0.83 -> 0.82 (0.827), tune text 0.96 -> 0.95 (0.959),
// tune silent-miss ceiling 71 -> 101; holdout and renderings unchanged.
// 2026-12-05, tenth session's end, all six batches merged (480 passages: 395 tune, 85 holdout) and the scanner
// work on them: tune table 0.84 (0.848), tune text 0.96 (0.9696), holdout table 0.52 (0.523, precision 0.964),
// holdout text 0.70 (0.707, precision 0.987); all-labels tune 0.60 (0.605), holdout 0.40 (0.407); silent-miss
// ceilings tune 50, holdout 141; renderings crushed 0.901, cell per line 0.798, consecutive lines 0.768, aligned
// 0.877, page-break copies 0.985/0.891/0.867, wrapped 0.971/0.879/0.855, as measured.
// 2026-12-05, eleventh-session batch dxb: the corpus grew by 7 passages from four CC BY articles' PDF text (dxba-01..03
// PLOS ONE: a GLMM table of Wald z, three inline t-tests, an LMM table with a decimal df column; dxbb-01/02 Language and
// Cognition: correlations whose '=' came out as '¼', minus as U+FFFD and decimal points as ':', and unsymbolled
// correlations with n in the text; dxbc-01 Springer: a chi-square in prose and its table one cell per line in
// column-block order; dxbd-01 Taylor & Francis: a crushed table of Bonferroni-adjusted r). 5 tune, 2 holdout. As
// measured: tune text recall 0.96 -> 0.95 (0.954: dxbb-01's 7 correlations not read), holdout text 0.70 -> 0.67
// (0.677: dxbb-02's 4 not read), holdout table 0.52 -> 0.53 (0.539: dxba-03's 22 read); tune table 0.844 and all
// precisions unchanged (floors kept); silent-miss ceilings tune 50 -> 57, holdout 141 -> 145.
// 2026-12-05, eleventh-session batch dxa: the corpus grew by 2 table passages (482: 396 tune, 86 holdout): dxaa-01
// (holdout, an eNeuro statistical table whose pipe rows are misaligned, 3 t with df and p in the row above, none read)
// and dxab-01 (tune, a Research Square survey table one cell per line with lone '|' lines, 4 z with P in the row
// below, none read, and 8 chi-squares without df). As measured: tune table 0.847 (precision 0.9993), tune text
// 0.9696, holdout table 0.5202 (precision 0.9637), holdout text 0.7065; all-labels tune 0.603, holdout 0.4055;
// silent misses tune 50, holdout 141 (the new misses sit in tables listed as not read): every floor and ceiling kept.
// 2026-12-05, twelfth session: glued rows whose columns print their own decimals, header names unknown to the
// vocabulary cut at capitals, footnote letters set apart on header names, "value" for a lost italic P: tune table
// 0.847 -> 0.854 (dwhg-01's 16, divx-08's 2), holdout table 0.536 -> 0.569 (as measured, aggregate only); floors
// raised: tune table 0.85, holdout table 0.56.
const FLOORS: Record<Split, Record<'table' | 'text', { recall: number; precision: number; maxFailRate: number }>> = {
  tune: {
    // (2026-12-05, twelfth session: 0.85 -> 0.86, tables whose only test columns state their df in the header and
    // mark their cells with stars or "n.s." (dwfh-01, divg-01, divg-05), 0.854 -> 0.865 as measured.)
    table: { recall: 0.86, precision: 0.99, maxFailRate: 0.01 },
    text: { recall: 0.95, precision: 1, maxFailRate: 0.01 },
  },
  holdout: {
    table: { recall: 0.56, precision: 0.96, maxFailRate: 0.01 },
    // (2026-12-05, eleventh session, end: 0.677 -> 0.719, dxbb-02's correlations in a symbol font that lost its minus
    // and decimal point, read once the same paper's tune passage was; as measured.)
    text: { recall: 0.71, precision: 0.98, maxFailRate: 0.01 },
  },
};

/** Shares of the tune split's pipe-table results also read when the same rows come in another rendering (floors, as above). */
// (2026-12-04: crushed 0.93 -> 0.92 and cell-per-line 0.79 -> 0.77: the pipe rows of divf-08 and dwaa-01, broken by
// lines of lone pipes, are now read, 13 results more; their crushed and one-cell-per-line renderings lose the rows'
// labels and breaks, and 8 and 13 of them are not read there. No result read before is lost in any rendering.)
// (2026-12-05: two renderings added, one cell per line on consecutive lines with empty cells as empty lines, and
// cells aligned by runs of spaces; floors raised where the one-cell-per-line reader now reads rows under a spanned
// first column and empty lines as empty cells.)
// (2026-12-05, the corpus grew by 26 passages: their 18 pipe-row results are read in every rendering but the
// crushed one: crushed 0.93 -> 0.90.)
// (2026-12-05, later: six renderings added, a page's running head in the middle of each table and long row labels
// wrapped over two lines, each copied with tabs, crushed or aligned.)
// (2026-12-05, later still: df pairs whose comma a copy turned into a point, "1.23" for "1, 23", are read where the
// pairs keep a design's pattern; 38 results of dvzi-01 more in its pipe rows, read in the tab-separated copy but not
// where the cells are placed by what they hold (crushed, aligned, one cell per line: "1.23" is no whole number
// there), so those shares fall by the added denominator; no result read before is lost in any rendering. Then block
// titles that carry their numerator df are read over an aligned header too: aligned 0.82 -> 0.86. Then the corpus
// grew by 7 passages (third batch): dwdc-01's pipe rows add 14 results (763, was 749), read in the tab-separated
// copies, 10 of them one cell per line, none crushed or aligned; floors lowered as measured (crushed 0.852, aligned
// 0.851, crushed-page-break 0.841, aligned-page-break 0.840, crushed-wrapped 0.828, aligned-wrapped 0.827).)
// (2026-12-05, second code-index table batch: dwka-01's 10 pipe results, SPSS multivariate and between-subjects
// tables, join the renderings; crushed and aligned copies lose the four rows labelled "Objs * <br> methods" and one
// cell per line the between-subjects rows: crushed 0.85 -> 0.84, aligned 0.85 -> 0.84, cell-per-line 0.78 -> 0.77,
// page-break copies 0.84 -> 0.83, as measured.)
// (2026-12-05, tenth session: a header that leaves one or two of the rows' columns without a name, in a copy that
// keeps no positions, takes unnamed columns on the side the rows fit; a crushed header's first group named like the
// later ones ("Pregnant women n (%)") is a column, not the label's name: crushed 0.846 -> 0.870, cell per line
// 0.775 -> 0.785, consecutive lines 0.743 -> 0.752, crushed page-break 0.836 -> 0.859, crushed wrapped 0.823 -> 0.846.)
// (2026-12-05, tenth-session batch dwm: the pipe rows of dwme-02 and dwmj-01 join the renderings (793 results now);
// with a running head put in the middle of the tab-separated copy 12 of the 793 are not read: tabs-page-break
// 0.99 -> 0.98 (0.9849), as measured; the other renderings hold their floors.)
// (2026-12-05, tenth session, later: a header with two names over its labels takes the unnamed last column too;
// crushed 0.873 -> 0.881, aligned 0.849 -> 0.858, page-break and wrapped copies alike, as measured.)
// (2026-12-05, tenth session, helper10-sa: dwpc-01's 27 pipe-row correlations written "r = 0.586*" join the renderings
// (820 results now) and are read in every one: with tabs, aligned (cut at the gaps, the header's lines kept as its
// rows), crushed (cut before each symbol, the group titles after each size), one cell per line and on consecutive
// lines (group titles with sizes an upper header row); every rendering keeps its floor (crushed 0.877, cell per line
// 0.796, consecutive lines 0.766, aligned 0.854, tabs page-break 0.985, crushed page-break 0.867, aligned page-break
// 0.844, crushed wrapped 0.855, aligned wrapped 0.832), as measured.)
// (2026-12-05, eleventh session, helper11-sa: one cell per line, rows padded with empty cells past the header's last
// named column are read without the padding; a "Statistic" cell with its df beside a column of tests, a header printed
// again partway down, empty header cells as empty lines after two cells, and correlation blocks whose variables
// include "Test" are read: cell per line 0.798 -> 0.946, consecutive lines 0.768 -> 0.956, as measured.)
// (2026-12-05, eleventh session, helper11-sc: row labels that set a factor to a level by name ("ROI = R-ant"), names
// stacked over an aligned header kept short and off a header line that starts with its F column, a software
// correlation block's "Significance" / "(2-tailed)" wrapped, and a correlation table's label kept with its gaps: crushed
// 0.901 -> 0.939, aligned 0.877 -> 0.935, crushed page-break 0.891 -> 0.930, aligned page-break 0.867 -> 0.925,
// crushed wrapped 0.879 -> 0.937, aligned wrapped 0.855 -> 0.930, as measured.)
// (2026-12-05, eleventh session, end: a caret standing apart after a matrix value ("0.12 ^") is joined to it as a mark:
// crushed 0.939 -> 0.947, aligned 0.935 -> 0.942, crushed / aligned page-break 0.930 / 0.925 -> 0.937 / 0.932, crushed /
// aligned wrapped 0.937 / 0.930 -> 0.944 / 0.937, as measured.)
const RENDERING_FLOORS: Record<Rendering, number> = {
  tabs: 0.99,
  crushed: 0.94,
  'cell-per-line': 0.94,
  'consecutive-lines': 0.95,
  aligned: 0.94,
  'tabs-page-break': 0.98,
  'crushed-page-break': 0.93,
  'aligned-page-break': 0.93,
  // 2026-12-05, eleventh session: pipe rows with a page's running head between two of them (a PDF converted to
  // Markdown), new: 0.617 before pipe tables were read across a page break, 0.966 after, as measured.
  'pipe-page-break': 0.96,
  'tabs-wrapped-labels': 0.97,
  'crushed-wrapped-labels': 0.94,
  'aligned-wrapped-labels': 0.93,
};

describe('real corpus: the passages and their labels', () => {
  it('holds at least 60 passages and 600 labelled results, 300 of them in tables, a fifth held out', () => {
    const results = corpus.flatMap((passage) => passage.results);
    expect(corpus.length).toBeGreaterThanOrEqual(60);
    expect(results.length).toBeGreaterThanOrEqual(600);
    expect(results.filter((result) => result.inTable).length).toBeGreaterThanOrEqual(300);
    const heldOut = corpus.filter((passage) => passage.split === 'holdout').length / corpus.length;
    expect(heldOut).toBeGreaterThan(0.12);
    expect(heldOut).toBeLessThan(0.3);
  });

  it('keeps every passage short and openly licensed, with its source', () => {
    const manifest = JSON.parse(readFileSync(join(REAL_CORPUS_DIRECTORY, 'manifest.json'), 'utf8')) as {
      passages: { id: string; source: string; licence: string; characters: number }[];
    };
    expect(manifest.passages.map((entry) => entry.id).sort()).toEqual(corpus.map((passage) => passage.id).sort());
    for (const entry of manifest.passages) {
      expect(entry.source, entry.id).toMatch(/^https?:\/\//);
      expect(entry.licence, entry.id).toMatch(/^(CC BY( \d\.\d)?|CC0( 1\.0)?|public domain)$/);
      expect(entry.characters, entry.id).toBeLessThanOrEqual(2600);
    }
  });

  it('has computed labels that match the hand-written ones (run compute.py after editing a label file)', () => {
    const labelled = readdirSync(join(REAL_CORPUS_DIRECTORY, 'labels')).filter((name) => name.endsWith('.json'));
    expect(labelled.length).toBe(corpus.length);
    for (const passage of corpus) {
      const path = join(REAL_CORPUS_DIRECTORY, 'labels', `${passage.id}.json`);
      expect(existsSync(path), path).toBe(true);
      const written = JSON.parse(readFileSync(path, 'utf8')) as { results: { span: string; valueText: string }[] };
      expect(passage.results.map((result) => [result.span, result.valueText]), passage.id).toEqual(written.results.map((result) => [result.span, result.valueText]));
      // Each label points at its span in the passage as it is now.
      for (const result of passage.results) expect(passage.text.slice(result.start, result.end), passage.id).toBe(result.span);
    }
  });
});

const SPLITS = ['tune', 'holdout'] as const;

describe('real corpus: plumbline reads what is printed', () => {
  for (const split of ['tune', 'holdout'] as const) {
    for (const where of ['table', 'text'] as const) {
      it(`${split} split, results in ${where === 'table' ? 'tables' : 'running text'}: recall, precision and fails on consistent results hold their floors`, () => {
        const measured = figures(scores[split], where);
        const floor = FLOORS[split][where];
        const summary = {
          recall: Number(measured.recall.toFixed(4)),
          precision: Number(measured.precision.toFixed(4)),
          failRateOnConsistent: Number(measured.failRateOnConsistent.toFixed(4)),
        };
        expect(summary.recall, JSON.stringify(summary)).toBeGreaterThanOrEqual(floor.recall);
        expect(summary.precision, JSON.stringify(summary)).toBeGreaterThanOrEqual(floor.precision);
        expect(summary.failRateOnConsistent, JSON.stringify(summary)).toBeLessThanOrEqual(floor.maxFailRate);
      });
    }
  }


  // Every label in tables, with df or without (a statistic printed with its p and no df is read as printed):
  // the share read at its place (floors, as measured).
  // (the corpus grew by 26 passages on 2026-12-05: tune 0.59 -> 0.58, as measured)
  // (the corpus grew by 7 passages on 2026-12-05, second batch: tune 0.58 -> 0.57 (0.5796), holdout 0.45 -> 0.49 (0.4907), as measured)
  // (the corpus grew by 7 passages on 2026-12-05, third batch: tune 0.57 kept (0.5890), holdout 0.49 -> 0.44 (0.4432:
  // 89 labels more in dwde-01 and dwdg-01, chi-squares and F printed without df, as measured)
  // (2026-12-05, code-index prose batch, no tables added: tune 0.57 -> 0.58 (0.584), holdout 0.42 kept (0.426), as measured)
  // (2026-12-05, tenth-session batch dwo: tune 0.57 -> 0.56 (0.567), holdout 0.41 -> 0.40 (0.407), as measured)
  const ALL_LABELS_FLOORS: Record<(typeof SPLITS)[number], number> = { tune: 0.6, holdout: 0.4 };
  for (const split of SPLITS) {
    it(`${split} split: labels in tables read with or without df stay at their floor`, () => {
      expect(figures(scores[split], 'table').recallAll).toBeGreaterThanOrEqual(ALL_LABELS_FLOORS[split]);
    });
  }

  // Misses inside no table the report lists as not read: the audit skipped them without a word (ceilings, as measured;
  // the corpus grew by 6 passages on 2026-12-04: tune 7 -> 40, holdout 74 -> 79; it grew by 26 passages on 2026-12-05:
  // tune 40 -> 48).
  // (the corpus grew by 7 passages on 2026-12-05, second batch: tune 48 -> 44, holdout 74, as measured)
  // (the corpus grew by 7 passages on 2026-12-05, third batch: tune 44 -> 45 (2 of the 13 new misses), holdout 74 kept (73), as measured)
  // (the corpus grew by 2 prose passages on 2026-12-05, prose batch: tune 45 -> 48 (dwec-01's three correlations), holdout 74 kept (73), as measured)
  // (2026-12-05, code-index prose batch: tune 91 -> 56 as measured; holdout 97 -> 100, the 3 results of the holdout
  // prose passage dwjb-02 whose F symbol was lost in extraction)
  // (2026-12-05, tenth-session batch dwn, 12 prose passages: tune 21 -> 24, holdout 114 -> 125, as measured)
  // (2026-12-05, tenth-session batch dwo: tune 21 -> 69, holdout 114 -> 121, as measured; see the note above FLOORS)
  // (2026-12-05, tenth-session batch dwm: holdout 114 -> 128, the 14 misses of dwmg-01, as measured; tune 21 kept (21))
  // (2026-12-05, eleventh session, end: tune 57 -> 55, holdout 145 -> 141, as measured)
  // (2026-12-05, twelfth session: tune 55 -> 53, holdout 141 -> 134, as measured: tables of one-cell-per-line z tests
  // named "Z-test statistic" now listed when not read, statement tables read.)
  const SILENT_CEILINGS: Record<(typeof SPLITS)[number], number> = { tune: 53, holdout: 134 };
  for (const split of SPLITS) {
    it(`${split} split: results missed without the report saying a table was not read stay under their ceiling`, () => {
      expect(figures(scores[split], 'all').silentMisses).toBeLessThanOrEqual(SILENT_CEILINGS[split]);
    });
  }

  it('reads the tune split as well with no-break or thin spaces, full-width brackets, lone carriage returns or no spaces around signs, and misreads nothing more', () => {
    const undamaged = figures(scores.tune, 'all');
    for (const [damage, damaged] of Object.entries(damageScores(corpus))) {
      expect(damaged.falseAlarms, damage).toBeLessThanOrEqual(undamaged.falseAlarms);
      // (Within a point: a change may cost a label whose printed span it alters.)
      expect(damaged.recall, damage).toBeGreaterThanOrEqual(undamaged.recall - 0.01);
    }
  });

  it('reads the tune split\'s pipe tables in the other renderings copies give them, at their floors', () => {
    const rendered = renderingScores(corpus);
    for (const rendering of Object.keys(RENDERING_FLOORS) as Rendering[]) {
      const { piped, kept, extra } = rendered[rendering];
      expect(piped).toBeGreaterThan(100);
      // Nothing read from a rendering that the pipe rows do not give.
      expect(extra, rendering).toBe(0);
      expect(Number((kept / piped).toFixed(4)), rendering).toBeGreaterThanOrEqual(RENDERING_FLOORS[rendering]);
    }
  });
});
