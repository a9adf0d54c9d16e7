import { partitionPoint } from '../sortedSearch.js';

/**
 * A map from offsets in a text a reader wrote back to offsets in what it
 * read, for readers whose text is not the file's own (LaTeX drops comments
 * and markup, writes symbols out and moves footnotes), so a report can give
 * the line of the file rather than of the text.
 *
 * It holds anchors, added in increasing order of text offset: "the text
 * from `text` on comes from `source` on, the first `copied` characters one
 * for one". An offset maps to its anchor's source offset plus how far it
 * lies past the anchor, up to `copied`; text that is not a copy (a symbol
 * written out, a converted caption) maps to where its anchor starts. An
 * anchor that continues the last one at the same distance (the next word
 * of a paragraph copied as it stands) only lengthens it, so plain prose
 * costs a few anchors, not one per word.
 */
export class OffsetMap {
  private readonly text: number[] = [];
  private readonly source: number[] = [];
  private readonly copied: number[] = [];

  add(textOffset: number, sourceOffset: number, copied = 0): void {
    const last = this.text.length - 1;
    if (last >= 0) {
      const lastText = this.text[last]!;
      if (textOffset < lastText) return; // out of order: the earlier anchor stands
      if (textOffset === lastText) {
        this.source[last] = sourceOffset;
        this.copied[last] = copied;
        return;
      }
      if (textOffset - lastText === sourceOffset - this.source[last]!) {
        this.copied[last] = Math.max(this.copied[last]!, textOffset - lastText + copied);
        return;
      }
    }
    this.text.push(textOffset);
    this.source.push(sourceOffset);
    this.copied.push(copied);
  }

  /** The source offset of a text offset; before the first anchor, the first anchor's; with no anchors, null. */
  sourceOffsetOf(textOffset: number): number | null {
    if (this.text.length === 0) return null;
    const index = partitionPoint(this.text.length, (i) => this.text[i]! <= textOffset) - 1;
    if (index < 0) return this.source[0]!;
    return this.source[index]! + Math.min(textOffset - this.text[index]!, this.copied[index]!);
  }
}
