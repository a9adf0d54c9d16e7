/** The statistics core's public surface: one family per file, re-exported here. */
export { fUpperTail, fCdf } from './fDistribution.js';
export { chiSquareUpperTail } from './chiSquareDistribution.js';
export { tUpperTail, tTwoTailed } from './tDistribution.js';
export { zUpperTail, zTwoTailed } from './normalDistribution.js';
export { rToT, rTwoTailed } from './correlation.js';
export { noncentralFCdf, noncentralFUpperTail } from './noncentralF.js';
export { partialEtaSquaredInterval } from './partialEtaSquaredInterval.js';
export {
  partialEtaSquaredFromF,
  partialOmegaSquaredFromF,
  cohensFFromPartialEtaSquared,
  rFromT,
  cohensDFromTIndependent,
  cohensDzFromTPaired,
} from './effectSizes.js';
export { parseReportedNumber, roundingInterval, roundsTo, roundToDecimals, halfUnitInLastPlace } from './reportedNumber.js';
