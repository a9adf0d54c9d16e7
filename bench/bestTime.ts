/** Best-of-`repetitions` wall time of `work` in milliseconds (best, because noise only ever adds time). */
export function bestTime(work: () => unknown, repetitions: number): number {
  let best = Number.POSITIVE_INFINITY;
  for (let run = 0; run < repetitions; run++) {
    const started = process.hrtime.bigint();
    work();
    const elapsed = Number(process.hrtime.bigint() - started) / 1e6;
    if (elapsed < best) best = elapsed;
  }
  return best;
}
