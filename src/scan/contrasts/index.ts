/**
 * What follows an ANOVA besides pairwise t tests (scan/comparisons):
 * planned contrasts of its groups (readContrasts.ts), comparisons printed
 * without a t (readPrintedComparisons.ts: Tukey's q, a mean difference with
 * its SE or CI), and the F tests of an analysis of covariance with the
 * adjusted means printed beside raw ones (ancova.ts, adjustedMeans.ts). family.ts builds the
 * groups and error terms they are checked against.
 */

export { familiesOf, readContrasts } from './readContrasts.js';
export { readPrintedComparisons } from './readPrintedComparisons.js';
export { readAncova, statedCovariates } from './ancova.js';
export { namesAdjustedMeans } from './adjustedMeans.js';
