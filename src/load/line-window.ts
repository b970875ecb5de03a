// The lines of a text read in chunks that a lexer has not finished with, so a syntax error can show its line.

/**
 * Keeps the text from the start of the line where a lexer's unread text begins to the end of what
 * has been given, and that first line's number. Lines end at LF, CRLF or a lone CR, as n3 counts
 * them; everything before the kept lines is dropped, so a long text is never held whole.
 */
export class LineWindow {
  private kept = '';
  /** The 1-based number of the line `kept` starts with. */
  private firstLine = 1;

  /** Adds the next chunk of the text. */
  append(chunk: string): void {
    this.kept += chunk;
  }

  /** Drops the lines before the one holding the last `unreadLength` characters given (the lexer's unread tail). */
  dropBefore(unreadLength: number): void {
    const kept = this.kept;
    const unreadStart = kept.length - unreadLength;
    if (unreadStart <= 0) return;
    const cut = lineStartBefore(kept, unreadStart);
    if (cut === 0) return;
    this.firstLine += lineBreaksIn(kept, cut);
    this.kept = kept.slice(cut);
  }

  /** The text of a 1-based line without its line end ('' when it is not kept, or past the text given). */
  textOfLine(line: number): string {
    if (line < this.firstLine) return '';
    let start = 0;
    for (let current = this.firstLine; current < line; current++) {
      const end = lineEnd(this.kept, start);
      if (end === this.kept.length) return '';
      start = end + (this.kept.charCodeAt(end) === 13 && this.kept.charCodeAt(end + 1) === 10 ? 2 : 1);
    }
    return this.kept.slice(start, lineEnd(this.kept, start));
  }
}

/** Where the line holding `offset` starts: just after the last line break before it (0 when none). */
function lineStartBefore(text: string, offset: number): number {
  const lf = text.lastIndexOf('\n', offset - 1);
  const cr = text.lastIndexOf('\r', offset - 1);
  // A CR right before `offset` may be the first half of a CRLF whose LF is unread; its line is not over.
  const crEnds = cr >= 0 && cr + 1 < offset;
  return Math.max(lf + 1, crEnds ? cr + 1 : 0);
}

/** The number of line breaks (LF, CRLF, lone CR) that end before `end`. */
function lineBreaksIn(text: string, end: number): number {
  let count = 0;
  for (let index = text.indexOf('\n'); index >= 0 && index < end; index = text.indexOf('\n', index + 1)) count++;
  // Lone CRs are rare; only a text that has any CR is looked through for them.
  for (let index = text.indexOf('\r'); index >= 0 && index < end; index = text.indexOf('\r', index + 1)) {
    if (text.charCodeAt(index + 1) !== 10) count++;
  }
  return count;
}

/** The offset of the first line break at or after `start`, or the text's length. */
function lineEnd(text: string, start: number): number {
  const lf = text.indexOf('\n', start);
  const cr = text.indexOf('\r', start);
  const first = lf < 0 ? cr : cr < 0 ? lf : Math.min(lf, cr);
  return first < 0 ? text.length : first;
}
