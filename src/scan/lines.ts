/**
 * Line and column numbers for offsets, so a report can say "line 12, column 40".
 *
 * Lines end at "\n", "\r\n" or a lone "\r". Lines and columns are 1-based;
 * columns count UTF-16 code units, the same unit as the offsets.
 */

export interface LineAndColumn {
  line: number;
  column: number;
}

/** Offsets at which each line starts (the first is always 0). */
function lineStarts(text: string): Int32Array | number[] {
  const starts: number[] = [0];
  const LINE_BREAK = /\r\n?|\n/g;
  for (let match = LINE_BREAK.exec(text); match !== null; match = LINE_BREAK.exec(text)) {
    starts.push(match.index + match[0].length);
  }
  return Int32Array.from(starts);
}

/**
 * Builds the line index once (linear time) and returns a lookup from an
 * offset to its line and column (binary search). Offsets outside the text are
 * clamped to it.
 */
export function createLineIndex(text: string): (offset: number) => LineAndColumn {
  const starts = lineStarts(text);
  return (offset: number): LineAndColumn => {
    const clamped = Math.min(Math.max(offset, 0), text.length);
    let low = 0;
    let high = starts.length - 1;
    while (low < high) {
      const middle = (low + high + 1) >> 1;
      if (starts[middle]! <= clamped) low = middle;
      else high = middle - 1;
    }
    return { line: low + 1, column: clamped - starts[low]! + 1 };
  };
}

/** One-off lookup; build an index with createLineIndex when converting many offsets. */
export function lineAndColumn(text: string, offset: number): LineAndColumn {
  return createLineIndex(text)(offset);
}
