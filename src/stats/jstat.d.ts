// Minimal declarations for the parts of jstat (no bundled types) that bench/stats.ts compares
// against. The statistics code in this folder does not use jstat: its incomplete beta misses the
// 1e-10 goal and its studentized range (AS 190) misses 1e-8; see src/stats/README.md.
declare module 'jstat' {
  interface JStatStatic {
    centralF: { cdf(x: number, df1: number, df2: number): number };
    tukey: { cdf(q: number, nmeans: number, df: number): number };
  }
  const jStat: JStatStatic;
  export default jStat;
  export { jStat };
}
