import type { CheckModule } from '../types.js';
import { adjustedP } from './adjusted-p.js';
import { cohensDMismatch } from './cohens-d-mismatch.js';
import { dfExceedsSample } from './df-exceeds-sample.js';
import { effectSizeIntervalMismatch } from './effect-size-interval-mismatch.js';
import { etaSquaredLabelledPartial } from './eta-squared-labelled-partial.js';
import { halvedP } from './halved-p.js';
import { impossibleValue } from './impossible-value.js';
import { partialEtaSquaredMismatch } from './partial-eta-squared-mismatch.js';
import { pReportedAsZero } from './p-reported-as-zero.js';
import { pValueMismatch } from './p-value-mismatch.js';
import { sphericityCorrectedP } from './sphericity-corrected-p.js';
import { epsilonDfMismatch } from './epsilon-df-mismatch.js';
import { mseMismatch } from './mse-mismatch.js';
import { tableArithmetic } from './table-arithmetic.js';
import { groupStatisticsTestMismatch } from './group-statistics-test-mismatch.js';
import { groupSizesDfMismatch } from './group-sizes-df-mismatch.js';
import { integerDataGranularity } from './integer-data-granularity.js';
import { rSquaredMismatch } from './r-squared-mismatch.js';
import { cellStatisticsTestMismatch } from './cell-statistics-test-mismatch.js';
import { postHocComparisonMismatch } from './post-hoc-comparison-mismatch.js';
import { contrastMismatch } from './contrast-mismatch.js';
import { postHocDifferenceMismatch } from './post-hoc-difference-mismatch.js';
import { ancovaDfMismatch } from './ancova-df-mismatch.js';

/** Every check module by id; the id is also the file name and the rules/<id>.json entry. */
export const checkModules: Record<string, CheckModule<any>> = Object.fromEntries(
  [
    impossibleValue,
    pReportedAsZero,
    pValueMismatch,
    halvedP,
    sphericityCorrectedP,
    epsilonDfMismatch,
    adjustedP,
    partialEtaSquaredMismatch,
    rSquaredMismatch,
    etaSquaredLabelledPartial,
    effectSizeIntervalMismatch,
    cohensDMismatch,
    dfExceedsSample,
    tableArithmetic,
    groupStatisticsTestMismatch,
    mseMismatch,
    groupSizesDfMismatch,
    integerDataGranularity,
    cellStatisticsTestMismatch,
    postHocComparisonMismatch,
    contrastMismatch,
    postHocDifferenceMismatch,
    ancovaDfMismatch,
  ].map((module) => [module.id, module]),
);
