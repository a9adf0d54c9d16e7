/**
 * Group sizes stated near a two-group result ("30 in each group",
 * "(n = 31) ... (n = 29)"), read from a bounded window of the original text.
 * Returns the two sizes when their total fits the test's df (N = df + 2).
 */
export function statedGroupSizes(text: string, resultStart: number, df: number, window = 1500): [number, number] | null {
  const excerpt = text.slice(Math.max(0, resultStart - window), resultStart);
  const eachGroup = /\b(\d{1,5})\s+(?:[a-z]+\s+){0,2}(?:in|per)\s+(?:each|every)\s+(?:of\s+the\s+(?:two\s+)?)?(?:group|condition|arm|cell)s?\b/gi;
  let match: RegExpExecArray | null;
  let equal: number | null = null;
  while ((match = eachGroup.exec(excerpt))) equal = Number(match[1]);
  if (equal !== null && 2 * equal === df + 2) return [equal, equal];

  const sizes: number[] = [];
  const sizePattern = /\bn\s*[=:]\s*(\d{1,5})\b/g; // lower-case n: a group size, not the total N
  while ((match = sizePattern.exec(excerpt))) sizes.push(Number(match[1]));
  // Use the last pair whose total fits the df.
  for (let i = sizes.length - 1; i > 0; i -= 1) {
    if (sizes[i - 1]! + sizes[i]! === df + 2) return [sizes[i - 1]!, sizes[i]!];
  }
  return null;
}

/** True when the text around a result suggests a paired or within-subjects comparison. */
export function looksPaired(text: string, resultStart: number, window = 1500): boolean {
  const excerpt = text.slice(Math.max(0, resultStart - window), Math.min(text.length, resultStart + 200));
  return /\b(?:paired|within[- ]subjects?|within[- ]person|repeated[- ]measures?|pre[- ]?(?:test|intervention)|post[- ]?(?:test|intervention)|dependent[- ]samples?|one[- ]sample|matched)\b/i.test(excerpt);
}
