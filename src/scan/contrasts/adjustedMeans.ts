/**
 * Adjusted means ("adjusted M = 22.77", "covariate-adjusted mean =",
 * "estimated marginal means (SDs)", "least-squares means") are recognised by
 * the words just before them, so the group statistics readers leave them
 * out: they are not the raw means that GRIM, the one-way recomputation or
 * the contrasts assume. Anchored at the end of a slice of ADJUSTED_REACH
 * characters, so each test is bounded.
 */

/** Words just before a mean that make it an adjusted one. */
const ADJUSTED_BEFORE = /(?:adjusted|estimated\smarginal|least[- ]squares?|EMM|LSM)\s?(?:\(\s?)?$/i;
const ADJUSTED_REACH = 24;

/** True when the words just before `at` (a mean's "M" or "mean") call it adjusted ("adjusted M", "estimated marginal means"). */
export function namesAdjustedMeans(text: string, at: number): boolean {
  return ADJUSTED_BEFORE.test(text.slice(Math.max(0, at - ADJUSTED_REACH), at));
}

