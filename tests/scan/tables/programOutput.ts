/**
 * A statistics program's within-subjects table as tests of the table reader
 * use it: each effect and its error term printed once per sphericity
 * correction (common practice). Invented, consistent numbers (SciPy 1.10.1
 * scipy.stats.f.sf): F(2, 58) = 6.02 gives p = .0042, F(1.62, 46.98) = 6.02
 * gives .0076, F(1.70, 49.30) = 6.02 gives .0067, F(1, 29) = 6.02 gives .020.
 */
export const WITHIN_SUBJECTS_HEADER = ['Source', '', 'Type III Sum of Squares', 'df', 'Mean Square', 'F', 'Sig.', 'Partial Eta Squared'];

export const WITHIN_SUBJECTS_ROWS = [
  ['Time', 'Sphericity Assumed', '24.300', '2', '12.150', '6.020', '.004', '.172'],
  ['', 'Greenhouse-Geisser', '24.300', '1.620', '15.000', '6.020', '.008', '.172'],
  ['', 'Huynh-Feldt', '24.300', '1.700', '14.294', '6.020', '.007', '.172'],
  ['', 'Lower-bound', '24.300', '1.000', '24.300', '6.020', '.020', '.172'],
  ['Error(Time)', 'Sphericity Assumed', '117.060', '58', '2.018', '', '', ''],
  ['', 'Greenhouse-Geisser', '117.060', '46.980', '2.492', '', '', ''],
  ['', 'Huynh-Feldt', '117.060', '49.300', '2.374', '', '', ''],
  ['', 'Lower-bound', '117.060', '29.000', '4.037', '', '', ''],
];

/** The F tests the table prints, as the tests write them: one per correction, each with its error row's df. */
export const WITHIN_SUBJECTS_TESTS = ['F(2, 58) = 6.020', 'F(1.620, 46.980) = 6.020', 'F(1.700, 49.300) = 6.020', 'F(1.000, 29.000) = 6.020'];
