// Public surface of the statistics core. Each family lives in its own file with its method and references.
export { fUpperTail, fCdf } from './fDistribution.js';
export { tUpperTail, tTwoTailed } from './tDistribution.js';
export { chiSquareUpperTail } from './chiSquareDistribution.js';
export { zUpperTail, zTwoTailed } from './normalDistribution.js';
export { rToT, rTwoTailed } from './correlation.js';
export { spearmanTwoTailed, SPEARMAN_SERIES_UP_TO, type SpearmanUpperStep } from './spearman.js';
export { noncentralFCdf, noncentralFUpperTail } from './noncentralF.js';
export { studentizedRangeCdf, studentizedRangeUpperTail } from './studentizedRange.js';
export { partialEtaSquaredInterval, noncentralityInterval } from './partialEtaSquaredInterval.js';
export {
  partialEtaSquaredFromF,
  adjustedRSquared,
  partialOmegaSquaredFromF,
  cohensFFromPartialEtaSquared,
  rFromT,
  cohensDFromTIndependent,
  cohensDzFromTPaired,
} from './effectSizes.js';
export { fUpperTailRange, tTwoTailedRange, partialEtaSquaredRange } from './statisticRanges.js';
export { monotoneImage, type NumberInterval } from './monotoneImage.js';
export { findRootBrent, bracketDecreasingRoot, type BrentOptions } from './rootFinding.js';
export {
  oneWayAnovaFromSummary,
  oneWayAnovaRange,
  welchAnovaFromSummary,
  welchAnovaRange,
  brownForsytheAnovaFromSummary,
  brownForsytheAnovaRange,
  studentTFromSummary,
  welchTFromSummary,
  welchDf,
  independentTRange,
  weightedSpread,
  weightedSpreadRange,
  type GroupSummary,
  type GroupSummaryBox,
} from './summaryStatistics.js';
export { grimTest, grimmerTest, type GrimOutcome, type GrimmerOutcome } from './grim.js';
