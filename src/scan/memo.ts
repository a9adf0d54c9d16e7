/**
 * A pure function of one string with its answers kept: the table readers ask
 * the same few header words and cells again and again (every line is looked
 * at by several readers, and a header by every row). Only for answers that
 * cannot be changed by their callers (strings, numbers, booleans, null, and
 * arrays the type system keeps read-only, of read-only objects). The
 * store is emptied when it reaches `limit` entries, so a long document of
 * distinct words costs a bounded amount of memory.
 */
export function keepAnswers<Answer extends string | number | boolean | null | readonly Readonly<object>[]>(answer: (text: string) => Answer, limit = 8192): (text: string) => Answer {
  const kept = new Map<string, Answer>();
  return (text) => {
    // (No answer is undefined, so a miss needs no second look-up.)
    const known = kept.get(text);
    if (known !== undefined) return known;
    const fresh = answer(text);
    if (kept.size >= limit) kept.clear();
    kept.set(text, fresh);
    return fresh;
  };
}
