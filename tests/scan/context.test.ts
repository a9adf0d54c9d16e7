import { describe, expect, it } from 'vitest';
import { scanText } from '../../src/scan/scan.js';
import { slice } from './helpers.js';

function contextOf(text: string) {
  return scanText(text).context;
}

describe('declared alpha', () => {
  it.each([
    ['An alpha level of .01 was used throughout.', 0.01],
    ['We set alpha = .01 for all tests.', 0.01],
    ['We set \u03b1 = .005 for all tests.', 0.005],
    ['Alpha was set at .05 for all tests.', 0.05],
    ['We used a significance level of .10 for these tests.', 0.1],
    ['The significance level was set at p < .05.', 0.05],
    ['Statistical significance was accepted at p < .01 in all analyses.', 0.01],
    ['A p < .01 was considered significant.', 0.01],
    ['Results with p \u2264 .005 were considered statistically significant.', 0.005],
    ['p values below .01 were deemed significant.', 0.01],
    ['Effects were considered significant at p < .01.', 0.01],
  ])('reads %j', (text, value) => {
    const alpha = contextOf(text).alpha;
    expect(alpha?.value).toBe(value);
    expect(slice(text, alpha!)).toBe(alpha!.text);
    expect(alpha!.text.length).toBeGreaterThan(0);
  });

  it.each([
    'Internal consistency was good (Cronbach\u2019s \u03b1 = .85).',
    'Cronbach\u2019s alpha = .09 for the short scale indicated poor reliability.',
    'The effect was significant at p < .05 in both groups.',
    'The main effect was significant, p < .01.',
    'The alphabet task took 5 minutes.',
  ])('finds no declared alpha in %j', (text) => {
    expect(contextOf(text).alpha).toBeNull();
  });

  it('takes the first declaration in the document', () => {
    const alpha = contextOf('We set alpha = .05. For follow-up tests, alpha = .0125 was used.').alpha;
    expect(alpha?.value).toBe(0.05);
  });
});

describe('one-tailed statements', () => {
  it.each([
    'One-tailed tests were used for the preregistered predictions.',
    'All tests were one-sided.',
    'We report one tailed p-values.',
    'A 1-tailed test was used.',
    'Given our directional hypotheses, we tested accordingly.',
    'These were directional tests of the prediction.',
  ])('finds %j', (text) => {
    const statements = contextOf(text).oneTailed;
    expect(statements).toHaveLength(1);
    expect(slice(text, statements[0]!)).toBe(statements[0]!.text);
  });

  it('gives the offset of the statement so checks can tell how near it stands to a result', () => {
    const text = 'Intro text here. We used a one-tailed test. Later, t(30) = 1.80, p = .04.';
    const [statement] = contextOf(text).oneTailed;
    expect(statement?.start).toBe(text.indexOf('We used'));
    expect(statement?.end).toBe(text.indexOf('Later') - 1);
  });

  it.each([
    'All tests were two-tailed.',
    'We stated non-directional hypotheses.',
    'Bidirectional links were drawn.',
    'The arrows were directional in the figure.',
    'Someone-sided views were rare.',
  ])('finds none in %j', (text) => {
    expect(contextOf(text).oneTailed).toEqual([]);
  });

  it('reports one statement per sentence', () => {
    expect(contextOf('One-tailed tests of the directional hypotheses were one-sided.').oneTailed).toHaveLength(1);
  });

  it.each([
    'All tests were two-tailed rather than one-tailed.',
    'We did not use one-sided tests.',
    'Tests were two-sided instead of one-sided.',
  ])('reads no declaration where one-tailed testing is denied: %j', (text) => {
    expect(contextOf(text).oneTailed).toEqual([]);
  });
});

describe('stated sample sizes', () => {
  it.each([
    ['The final sample (N = 120) was balanced.', 120, 'N = 120'],
    ['In total, N=1,024 people responded.', 1024, 'N=1,024'],
    ['We recruited 120 participants online.', 120, '120 participants'],
    ['A total of 86 adults took part.', 86, '86 adults'],
    ['We drew a sample of 64 students.', 64, '64 students'],
    ['We tested 120 undergraduate psychology students.', 120, '120 undergraduate psychology students'],
    ['Overall 1,024 respondents answered.', 1024, '1,024 respondents'],
    // A count that begins a sentence is written in words (APA style; tests/corpus/real/passages/divl-03.txt).
    ['Thirty-two healthy subjects were enrolled in the study.', 32, 'Thirty-two healthy subjects'],
    ['Twelve children took part.', 12, 'Twelve children'],
    ['We had N = 40. The rest was pilot work.', 40, 'N = 40'],
    // Real phrasings (tests/corpus/real/passages/dvyb-06.txt, dvyb-10.txt).
    ['It was carried out in a sample of 251 first-cycle Peruvian undergraduate mathematics students.', 251, '251'],
    ['Questionnaires (n=125) were collected from sixteen schools.', 125, 'n=125'],
  ])('reads %j', (text, value, phrase) => {
    const sizes = contextOf(text).sampleSizes;
    expect(sizes.map((size) => size.value)).toEqual([value]);
    expect(slice(text, sizes[0]!)).toBe(phrase);
  });

  it.each([
    'Data from 3 participants were excluded.',
    'We excluded 4 participants for inattention.',
    'Each of the 12 items was rated.',
    'Responses took 120 ms on average.',
    'Group A (n = 24) was smaller.',
    'Participants (n = 40) and controls (n = 38) were matched.',
  ])('finds none in %j', (text) => {
    expect(contextOf(text).sampleSizes).toEqual([]);
  });

  it('reads a lower-case n after "of the students" as a part of the sample', () => {
    // tests/corpus/real/passages/prose-10.txt: "20% of the students (n = 43) slept less than five hours".
    const text = 'It was seen that 20% of the students (n = 43) slept less than five hours a day.';
    expect(contextOf(text).sampleSizes.map((size) => [size.value, size.scope])).toEqual([[43, 'subset']]);
  });

  it('reads the N inside a chi-square result as a stated sample size, of that test', () => {
    const text = 'Choices differed, \u03c72(2, N = 120) = 7.81, p = .02.';
    expect(contextOf(text).sampleSizes.map((size) => [size.value, size.scope])).toEqual([[120, 'test']]);
  });

  it.each([
    ['The final sample (N = 214) was balanced.', 214, 'total', 'N = 214'],
    ['We recruited 214 participants online.', 214, 'total', '214 participants'],
    ['A total of 120 Year 9 students took part.', 120, 'total', '120 Year 9 students'],
    ['There were 20 participants in each condition.', 20, 'per-group', '20 participants in each condition'],
    ['Thirty were tested, 20 in each condition.', 20, 'per-group', '20 in each condition'],
    ['Groups were equal (n = 15 per group).', 15, 'per-group', 'n = 15 per group'],
    ['Cells were small (N = 12 per cell).', 12, 'per-group', 'N = 12'],
    ['Cortisol was available for 96 participants.', 96, 'subset', '96 participants'],
    ['Only 96 participants returned the diary.', 96, 'subset', '96 participants'],
    ['Of these, 40 students completed the follow-up.', 40, 'subset', '40 students'],
    ['Correlations used r = .30, N = 90 for the subsample.', 90, 'test', 'N = 90'],
    // tests/corpus/real/passages/divl-06.txt: the N of one test, in its brackets before the statistic.
    ['with an average ERD (N = 18, r = \u22120.595, p = 0.009)', 18, 'test', 'N = 18'],
  ] as const)('reads %j with its scope', (text, value, scope, phrase) => {
    const [size] = contextOf(text).sampleSizes;
    expect(size).toMatchObject({ value, scope });
    expect(slice(text, size!)).toBe(phrase);
  });

  it('reads the parts of "17 men and 31 women" as parts, and their total as the whole sample', () => {
    const sizes = contextOf('We tested 48 adults (17 men and 31 women).').sampleSizes;
    expect(sizes.map((size) => [size.value, size.scope])).toEqual([
      [48, 'total'],
      [17, 'subset'],
      [31, 'subset'],
    ]);
  });

  it('reads "180 of the 214 participants" as a part and a total', () => {
    const sizes = contextOf('Data from the diary were complete for 180 of the 214 participants.').sampleSizes;
    expect(sizes.map((size) => [size.value, size.scope])).toEqual([
      [180, 'subset'],
      [214, 'total'],
    ]);
  });

  it('reads "fifteen of the participants" and "12 of our students" as parts of the sample, not its size', () => {
    const text = 'For PD: although fifteen of the participants (38%) scored in the impaired range, 12 of our students did not.';
    const sizes = contextOf(text).sampleSizes;
    expect(sizes.map((size) => [size.value, size.scope])).toContainEqual([15, 'subset']);
    expect(sizes.filter((size) => size.scope === 'total')).toEqual([]);
  });

  it.each(['40 participants each completed 20 trials.', 'We recruited 120 participants and assigned them to one of three conditions.'])(
    'a per-group word without a group is not a per-group statement: %j',
    (text) => {
      expect(contextOf(text).sampleSizes.map((size) => size.scope)).toEqual(['total']);
    },
  );
});

describe('sphericity corrections', () => {
  it.each([
    ['Greenhouse-Geisser corrections were applied.', 'greenhouse-geisser'],
    ['Degrees of freedom were Greenhouse\u2013Geisser corrected.', 'greenhouse-geisser'],
    ['We applied the Huynh-Feldt correction.', 'huynh-feldt'],
    ['Degrees of freedom were corrected for violations of sphericity.', 'unspecified'],
    ['Sphericity was violated, so Greenhouse\u2013Geisser corrections were applied.', 'greenhouse-geisser'],
  ] as const)('reads %j', (text, method) => {
    const statements = contextOf(text).sphericity;
    expect(statements.map((statement) => statement.method)).toEqual([method]);
    expect(slice(text, statements[0]!)).toBe(statements[0]!.text);
  });

  it.each([
    'Mauchly\u2019s test showed that sphericity was not violated.',
    'Because sphericity was met, no correction was applied.',
    'No Greenhouse-Geisser correction was necessary because sphericity was not violated.',
    'The greenhouse was warm.',
  ])('finds none in %j', (text) => {
    expect(contextOf(text).sphericity).toEqual([]);
  });
});

describe('statements that p-values were adjusted', () => {
  it.each([
    ['All post hoc comparisons were Bonferroni-corrected.', 'bonferroni', null, 'post-hoc'],
    ['Pairwise comparisons used Tukey\u2019s HSD.', 'tukey', null, 'post-hoc'],
    ['p values were adjusted for multiple comparisons with the Benjamini-Hochberg procedure.', 'fdr', null, 'all'],
    ['All p values were Holm-corrected for six tests.', 'holm', 6, 'all'],
    ['Follow-up tests used a \u0160id\u00e1k correction for 3 comparisons.', 'sidak', 3, 'post-hoc'],
    ['We used a Bonferroni-adjusted \u03b1 = .05/4 for the simple effects.', 'bonferroni', 4, 'post-hoc'],
    ['Post hoc Scheff\u00e9 tests followed each ANOVA.', 'scheffe', null, 'post-hoc'],
    ['All tests were corrected for multiple comparisons.', 'unspecified', null, 'all'],
  ] as const)('reads %j', (text, method, comparisons, appliesTo) => {
    const [statement] = contextOf(text).pAdjustments!;
    expect(statement).toMatchObject({ method, comparisons, appliesTo });
    expect(slice(text, statement!)).toBe(statement!.text);
  });

  it.each([
    'Greenhouse-Geisser corrected p values are reported.',
    'Adjusted means are shown in Table 2.',
    'Scores were adjusted for age and sex.',
    'No correction for multiple comparisons was applied.',
    'Uncorrected p values are reported throughout.',
    'The corrected item-total correlations were high.',
    'Responses were coded as correct or incorrect.',
    'Post hoc tests (Bonferroni) showed A > B, p = .01.',
  ])('finds none in %j', (text) => {
    expect(contextOf(text).pAdjustments).toEqual([]);
  });

  it('reads each sentence once, however many keywords it holds', () => {
    expect(contextOf('All pairwise comparisons were Bonferroni-corrected (adjusted p values are reported).').pAdjustments).toHaveLength(1);
  });
});

describe('a document without context statements', () => {
  it('returns empty context', () => {
    expect(contextOf('The effect was reliable, F(1, 44) = 5.10, p = .03.')).toEqual({
      alpha: null,
      oneTailed: [],
      sampleSizes: [],
      sphericity: [],
      pAdjustments: [],
      epsilons: [],
      meanSquareErrors: [],
    });
  });
});
