// The text of one document as the server keeps it: line starts for turning 1-based positions into LSP ranges.
import type { Range } from 'vscode-languageserver';

/** A document's text with the offset of each line's start, for position arithmetic in UTF-16 code units. */
export class DocumentText {
  /** Offset of the first code unit of each line (line 0 starts at 0). */
  private readonly lineStarts: number[];

  constructor(readonly text: string) {
    const starts = [0];
    for (let index = 0; index < text.length; index++) {
      const code = text.charCodeAt(index);
      // CR LF is one line break; a lone CR or LF is one too, as in Turtle's EOL.
      if (code === 13) {
        if (text.charCodeAt(index + 1) === 10) index++;
        starts.push(index + 1);
      } else if (code === 10) starts.push(index + 1);
    }
    this.lineStarts = starts;
  }

  /** How many lines the text has (an empty text has one). */
  get lineCount(): number {
    return this.lineStarts.length;
  }

  /** The text of a 0-based line without its line break ('' past the end). */
  lineText(line: number): string {
    if (line < 0 || line >= this.lineStarts.length) return '';
    const start = this.lineStarts[line];
    const end = line + 1 < this.lineStarts.length ? this.lineStarts[line + 1] : this.text.length;
    return this.text.slice(start, end).replace(/\r?\n$|\r$/, '');
  }

  /** The 0-based offset of a 0-based line and UTF-16 character. */
  offsetAt(line: number, character: number): number {
    if (line >= this.lineStarts.length) return this.text.length;
    return Math.min(this.lineStarts[Math.max(0, line)] + character, this.text.length);
  }

  /**
   * The range of a statement written at 1-based `line`/`column` (UTF-16, its subject) whose object
   * is on 1-based `objectLine`: from the subject to the end of the object's line, trailing blanks
   * and a trailing comment left out. Line 0 (a whole-file problem) is the first line.
   */
  statementRange(line: number, column: number, objectLine: number = line): Range {
    const startLine = Math.max(0, line - 1);
    const startCharacter = Math.max(0, column - 1);
    const endLine = Math.max(startLine, objectLine - 1);
    const endCharacter = codeEnd(this.lineText(endLine));
    if (endLine === startLine && endCharacter <= startCharacter) {
      // Nothing after the start on its line: mark one character (or the line's end) so the range is visible.
      const length = this.lineText(startLine).length;
      return { start: { line: startLine, character: startCharacter }, end: { line: startLine, character: Math.min(length, startCharacter + 1) } };
    }
    return { start: { line: startLine, character: startCharacter }, end: { line: endLine, character: endCharacter } };
  }
}

/** Where the code of a line ends: before trailing blanks and a comment that starts outside an IRI or string. */
function codeEnd(line: string): number {
  let end = line.length;
  let inIri = false;
  let quote = '';
  for (let index = 0; index < line.length; index++) {
    const char = line[index];
    if (quote !== '') {
      if (char === '\\') index++;
      else if (char === quote) quote = '';
    } else if (inIri) {
      if (char === '>') inIri = false;
    } else if (char === '<') inIri = true;
    else if (char === '"' || char === "'") quote = char;
    else if (char === '#') {
      end = index;
      break;
    }
  }
  while (end > 0 && (line[end - 1] === ' ' || line[end - 1] === '\t')) end--;
  return end;
}
