// The lines of a text read in chunks that a lexer has not finished with, so a syntax error can show its line.

/**
 * Keeps the text from the start of the line where a lexer's unread text begins to the end of what
 * has been given, and that first line's number. Lines are counted at LF, as `textOfLine` splits
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
    const unreadStart = this.kept.length - unreadLength;
    if (unreadStart <= 0) return;
    const cut = this.kept.lastIndexOf('\n', unreadStart - 1) + 1;
    if (cut === 0) return;
    for (let index = this.kept.indexOf('\n'); index >= 0 && index < cut; index = this.kept.indexOf('\n', index + 1)) this.firstLine++;
    this.kept = this.kept.slice(cut);
  }

  /** The text of a 1-based line without its line end ('' when it is not kept, or past the text given). */
  textOfLine(line: number): string {
    if (line < this.firstLine) return '';
    let start = 0;
    for (let current = this.firstLine; current < line; current++) {
      const next = this.kept.indexOf('\n', start);
      if (next < 0) return '';
      start = next + 1;
    }
    const end = this.kept.indexOf('\n', start);
    return this.kept.slice(start, end < 0 ? this.kept.length : end).replace(/\r$/, '');
  }
}
