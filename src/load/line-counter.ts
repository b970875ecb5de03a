// Turning offsets into a text that arrives in chunks into 1-based lines and columns, keeping little of the text.

/** A 1-based line and 1-based column in UTF-16 code units. */
export interface LineColumn {
  line: number;
  column: number;
}

/**
 * Follows a text chunk by chunk and answers, for offsets that never go backwards, their line and
 * column. Line breaks are LF, CRLF and a lone CR, as XML and editors count them. Only the text
 * from the last answered offset on is kept.
 */
export class LineCounter {
  private kept = '';
  /** The offset of `kept[0]` in the whole text. */
  private keptStart = 0;
  private line = 1;
  /** The offset at which the current line starts. */
  private lineStart = 0;
  /** The last character counted, so a CRLF split across chunks is one break. */
  private previousCode = 0;

  /** Adds the next chunk of the text. */
  append(chunk: string): void {
    this.kept += chunk;
  }

  /** The line and column of an offset at or after the last one asked about (and within the text appended). */
  positionAt(offset: number): LineColumn {
    const end = Math.min(offset, this.keptStart + this.kept.length);
    for (let index = 0; this.keptStart + index < end; index++) {
      const code = this.kept.charCodeAt(index);
      if (code === 10 || code === 13) {
        // The LF of a CRLF ends the same line as its CR did.
        if (code === 13 || this.previousCode !== 13) this.line++;
        this.lineStart = this.keptStart + index + 1;
      }
      this.previousCode = code;
    }
    if (end > this.keptStart) {
      this.kept = this.kept.slice(end - this.keptStart);
      this.keptStart = end;
    }
    return { line: this.line, column: offset - this.lineStart + 1 };
  }

  /** The offset of the last `character` before `offset` in the kept text, or -1. */
  lastIndexBefore(character: string, offset: number): number {
    const index = this.kept.lastIndexOf(character, offset - this.keptStart - 1);
    return index < 0 ? -1 : this.keptStart + index;
  }
}
