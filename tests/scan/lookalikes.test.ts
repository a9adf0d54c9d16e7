import { describe, expect, it } from 'vitest';
import { scanText } from '../../src/scan/scan.js';

describe('look-alikes that are not results', () => {
  it.each([
    'As shown in Figure 2F, responses rose.',
    'See Fig. 3(2) for the layout.',
    'In panel F(2) the dots are blue.',
    'Panel F (2, 3) shows the grid.',
    'The classifier reached an F1 score of 0.83.',
    'The classifier reached F1 = 0.83 on the test set.',
    'The classifier reached F1 = 0.83, p = .02 better than chance.',
    'as described on p. 12 of the manual',
    'as described on pp. 12-15 of the manual',
    'Journal of Invented Studies, 45(2), 123-140.',
    'Psychological Reports of Nowhere, 12(4), 7.',
    'Analyses were run in version 4.2 of the software.',
    'Analyses were run in R 4.3.1 with default settings.',
    'where r = radius of the disc',
    'where r = the radius',
    'the area grows with r = 2.5 cm',
    'where t = time since onset',
    'at t = 0 the stimulus appeared',
    'We standardised the z-scores before analysis.',
    'We avoided p-hacking by preregistering.',
    'Participants in group A (n = 24) and group B (N = 120) took part.',
    'Ratings were high (M = 3.4, SD = 2.1).',
    'The target appeared in grid cell F4, then in F(3).',
    'Samples contained CF3 and ZnF2 in equal parts.',
    'The water was H2O with F2 traces.',
    'Values are listed in Table 2 (t1) and Table 3 (t2).',
    'The peak was at x = 12, y = -40, z = 8 in standard space.',
    'Coordinates x, y, z = 4, 8, 15 were used.',
    'The function F(x) = 0.5 describes the curve.',
    'A statistic r(t) = 0.2 was defined over time.',
    'Use a t-test (two-sided) for this.',
    'Student t distribution with (30) degrees.',
    'Fixed effects F = fixed, t = trial.',
  ])('finds no result in %j', (text) => {
    expect(scanText(text).results.map((result) => result.text)).toEqual([]);
  });

  it('still finds the real result next to look-alikes', () => {
    const text = 'As in Figure 2F and on p. 12, the effect (n = 24) was reliable, F(1, 22) = 6.30, p = .02, unlike the F1 = 0.83 classifier.';
    const results = scanText(text).results;
    expect(results.map((result) => result.text)).toEqual(['F(1, 22) = 6.30, p = .02']);
  });

  it('does not read a statistic inside a longer word', () => {
    expect(scanText('The shift(2, 3) = 4 and art(1) = 2 are functions.').results).toEqual([]);
  });
});
