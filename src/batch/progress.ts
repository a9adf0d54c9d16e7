export interface ProgressCounts {
  results: number;
  flags: number;
}

/**
 * A progress bar on stderr for long audits; shown only when stderr is a
 * terminal. The bar library loads only then, so scripted runs (and re-audits
 * from the cache) do not pay for it.
 */
export async function createProgress(total: number, enabled: boolean): Promise<{ tick: (counts: ProgressCounts) => void; stop: () => void }> {
  if (!enabled || total < 2) return { tick: () => {}, stop: () => {} };
  const { default: cliProgress } = await import('cli-progress');
  const bar = new cliProgress.SingleBar(
    {
      format: 'auditing [{bar}] {value}/{total} documents | {results} results | {flags} flags | {rate}/s | ETA {eta_formatted}',
      stream: process.stderr,
      hideCursor: true,
      etaBuffer: 50,
    },
    cliProgress.Presets.shades_classic,
  );
  const started = Date.now();
  let done = 0;
  bar.start(total, 0, { results: 0, flags: 0, rate: '0.0' });
  return {
    tick: (counts) => {
      done += 1;
      const rate = (done / Math.max(0.001, (Date.now() - started) / 1000)).toFixed(1);
      bar.update(done, { ...counts, rate });
    },
    stop: () => bar.stop(),
  };
}
