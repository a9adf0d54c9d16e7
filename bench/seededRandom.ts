/** Deterministic pseudo-random numbers (mulberry32), so every run of a bench generates the same input. */
export function seededRandom(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let mixed = Math.imul(state ^ (state >>> 15), 1 | state);
    mixed = (mixed + Math.imul(mixed ^ (mixed >>> 7), 61 | mixed)) ^ mixed;
    return ((mixed ^ (mixed >>> 14)) >>> 0) / 4294967296;
  };
}

/** A p as authors print it, for invented manuscripts: three decimals, "< .001" below that; one in ten deliberately wrong. */
export function printedP(p: number, random: () => number): string {
  if (random() < 0.1) return `= ${(random() * 0.2).toFixed(3).replace(/^0/, '')}`;
  return p < 0.001 ? '< .001' : `= ${p.toFixed(3).replace(/^0/, '')}`;
}
