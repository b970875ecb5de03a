// The fast path for N-Triples and N-Quads: lines read from byte chunks, only kept predicates decoded, odd lines left to n3.
import { isUtf8 } from 'node:buffer';
import type { InputError, LoadedSource, RdfFormat } from './statement.js';
import { DEFAULT_GRAPH, type StatementStore } from './statement-store.js';
import type { LiteralKind } from './literal-table.js';
import { ByteTable } from './byte-table.js';
import { scanLine, skipSpace, type ScannedLine } from './line-scan.js';
import { parseSource } from './parse.js';
import { readAllowComment } from './allow-comments.js';
import { firstInvalidUtf8 } from './source-text.js';
import { formatName } from './syntax-error.js';
import { XSD_STRING } from '../roles/vocabulary.js';

/** What a LineReader needs to know about its source. */
export interface LineReaderOptions {
  file: string;
  format: Extract<RdfFormat, 'n-triples' | 'n-quads'>;
  store: StatementStore;
  /** Predicates whose statements are kept; undefined keeps every statement. */
  keep?: ReadonlySet<string>;
  /** The blank node label prefix of the file (see `blankNodeLabelPrefix`). */
  labelPrefix: string;
  baseIri: string;
  cwd: string;
}

/** How many line errors one file lists before it only counts the rest. */
export const LINE_ERRORS_LISTED = 100;

const NEWLINE = 10;
const RETURN = 13;
const HASH = 35;
const UNDERSCORE = 95;

const RDF_LANG_STRING = 'http://www.w3.org/1999/02/22-rdf-syntax-ns#langString';
const RDF_DIR_LANG_STRING = 'http://www.w3.org/1999/02/22-rdf-syntax-ns#dirLangString';

/** A predicate seen before: its number in the store, and whether its statements are kept. */
interface KnownPredicate {
  number: number;
  kept: boolean;
}

/**
 * Reads an N-Triples or N-Quads source from chunks of bytes, line by line, into a StatementStore.
 * A simple line (see `scanLine`) is read from its bytes, and only when its predicate is kept are
 * its terms decoded; any other line is parsed by n3 on its own, with the file's blank node prefix,
 * so every statement is exactly what n3 would give. Line numbers are exact, and a bad line is an
 * error at its line while the lines after it are still read.
 */
export class LineReader {
  /** The source being read; its statements are rows of the store. */
  readonly source: LoadedSource;
  /** How many lines were read so far. */
  lineNumber = 0;
  /** How many lines were not simple and went to n3. */
  linesReadByN3 = 0;
  private readonly firstRow: number;
  private readonly quads: boolean;
  private readonly predicateTable = new ByteTable();
  private readonly knownPredicates: KnownPredicate[] = [];
  /** Blank node labels of this file (`_:label`, as bytes) → store term numbers. */
  private readonly blankTable = new ByteTable();
  private readonly scanned = emptyScan();
  private carry: Buffer | undefined;
  private statementCount = 0;
  private unkeptCount = 0;
  private errorCount = 0;

  constructor(private readonly options: LineReaderOptions) {
    const { store } = options;
    store.file(options.file);
    this.firstRow = store.size;
    this.quads = options.format === 'n-quads';
    this.source = { file: options.file, format: options.format, statements: [], errors: [], allowComments: [], prefixes: {} };
  }

  /** Reads the complete lines of a chunk; a last line without its newline waits for the next chunk. */
  push(chunk: Buffer): void {
    let start = 0;
    if (this.carry !== undefined) {
      // Only the line that spans the two chunks is copied.
      const newline = chunk.indexOf(NEWLINE);
      if (newline < 0) {
        this.carry = Buffer.concat([this.carry, chunk]);
        return;
      }
      const joined = Buffer.concat([this.carry, chunk.subarray(0, newline + 1)]);
      this.carry = undefined;
      this.readLines(joined, 0, joined.length);
      start = newline + 1;
    }
    const lastNewline = chunk.lastIndexOf(NEWLINE);
    if (lastNewline >= start) this.readLines(chunk, start, lastNewline + 1);
    const rest = Math.max(start, lastNewline + 1);
    if (rest < chunk.length) this.carry = Buffer.from(chunk.subarray(rest));
  }

  /**
   * Reads what is left after the last chunk and settles the source's counts. When the stream broke
   * off (`brokenOff`), a last line without its newline is cut short and is not read.
   */
  finish(brokenOff = false): LoadedSource {
    if (this.carry !== undefined && brokenOff) this.carry = undefined;
    if (this.carry !== undefined) {
      const rest = this.carry;
      this.carry = undefined;
      this.readLines(rest, 0, rest.length);
    }
    if (this.errorCount > LINE_ERRORS_LISTED) {
      const more = this.errorCount - LINE_ERRORS_LISTED;
      this.source.errors.push({
        file: this.options.file,
        line: 0,
        column: 0,
        message: `${more} more line${more === 1 ? '' : 's'} of ${this.options.file} could not be read and ${more === 1 ? 'was' : 'were'} skipped (only the first ${LINE_ERRORS_LISTED} are listed).`,
        hint: `fix the lines listed first; each ${formatName(this.options.format)} line must be one complete statement`,
      });
    }
    const { store } = this.options;
    const start = this.firstRow;
    const end = store.size;
    this.source.statementCount = this.statementCount;
    this.source.unkeptStatements = this.unkeptCount;
    this.source.rows = { store, start, end };
    Object.defineProperty(this.source, 'statements', { get: () => store.statementsOf(start, end), enumerable: true });
    return this.source;
  }

  /** Reads the lines of bytes[from..end), where end is just after a newline or the end of the source. */
  private readLines(bytes: Buffer, from: number, end: number): void {
    const valid = isUtf8(bytes.subarray(from, end));
    let start = from;
    let nextReturn = bytes.indexOf(RETURN, from);
    while (start < end) {
      let newline = bytes.indexOf(NEWLINE, start);
      if (newline < 0 || newline >= end) newline = end;
      let lineEnd = newline;
      if (lineEnd > start && bytes[lineEnd - 1] === RETURN) lineEnd--;
      if (nextReturn >= 0 && nextReturn < start) nextReturn = bytes.indexOf(RETURN, start);
      if (nextReturn >= start && nextReturn < lineEnd) {
        // n3 also ends a line at a lone carriage return; such a line counts as several.
        this.readSplitLine(bytes, start, lineEnd, valid);
      } else {
        this.lineNumber++;
        this.readLine(bytes, start, lineEnd, valid);
      }
      start = newline + 1;
    }
  }

  private readSplitLine(bytes: Buffer, start: number, end: number, valid: boolean): void {
    let partStart = start;
    for (let index = start; index <= end; index++) {
      if (index === end || bytes[index] === RETURN) {
        this.lineNumber++;
        this.readLine(bytes, partStart, index, valid);
        // \r\n inside the part ends one line, not two.
        if (index < end && bytes[index + 1] === NEWLINE) index++;
        partStart = index + 1;
      }
    }
  }

  /** Reads one line, bytes[start..end) without its line ending. */
  private readLine(bytes: Buffer, start: number, end: number, chunkValid: boolean): void {
    if (!chunkValid && !isUtf8(bytes.subarray(start, end))) {
      this.invalidUtf8(bytes, start, end);
      return;
    }
    const first = skipSpace(bytes, start, end);
    if (first === end) return;
    if (bytes[first] === HASH) {
      this.readComment(bytes, start, first, end, true);
      return;
    }
    const found = this.scanned;
    if (!scanLine(bytes, start, end, this.quads, found)) {
      this.readWithN3(bytes.toString('utf8', start, end));
      return;
    }
    // n3 refuses an explicit rdf:langString datatype, on any line.
    if (found.datatypeStart >= 0 && isLanguageStringType(bytes, found.datatypeStart, found.datatypeEnd)) {
      this.readWithN3(bytes.toString('utf8', start, end));
      return;
    }
    const predicate = this.predicateOf(bytes, found);
    if (!predicate.kept) {
      this.statementCount++;
      this.unkeptCount++;
      if (bytes[found.subjectStart] === UNDERSCORE) {
        this.options.store.unkeptBlankSubjects.add(this.termNumber(bytes, found.subjectStart, found.subjectEnd));
      }
    } else if (!this.keepLine(bytes, found, predicate.number, first - start + 1)) {
      this.readWithN3(bytes.toString('utf8', start, end));
      return;
    }
    if (found.commentStart >= 0) this.readComment(bytes, start, found.commentStart, end, false);
  }

  /** Stores a kept simple line; false when its literal needs n3 after all (escapes, a reserved datatype). */
  private keepLine(bytes: Buffer, found: ScannedLine, predicate: number, column: number): boolean {
    const { store } = this.options;
    let object: number;
    if (found.literalEnd >= 0) {
      if (found.literalEscaped) return false;
      // The lexical form is stored as the bytes between the quotes; what follows them is read once per distinct suffix.
      const kind = store.literalKindOfSuffix(bytes, found.literalEnd + 1, found.objectEnd, () => literalKind(bytes, found));
      object = store.literalOfBytes(bytes, found.objectStart + 1, found.literalEnd, kind);
    } else {
      object = this.termNumber(bytes, found.objectStart, found.objectEnd);
    }
    const graph = found.graphStart < 0 ? DEFAULT_GRAPH : this.termNumber(bytes, found.graphStart, found.graphEnd);
    store.addRow({
      subject: this.termNumber(bytes, found.subjectStart, found.subjectEnd),
      predicate,
      object,
      graph,
      line: this.lineNumber,
      column,
      objectLine: this.lineNumber,
    });
    this.statementCount++;
    return true;
  }

  /** The predicate of a scanned line, looked up once per distinct IRI. */
  private predicateOf(bytes: Buffer, found: ScannedLine): KnownPredicate {
    const { predicateStart, predicateEnd } = found;
    const index = this.predicateTable.get(bytes, predicateStart, predicateEnd);
    if (index >= 0) return this.knownPredicates[index];
    const iri = this.text(bytes, predicateStart, predicateEnd, found.ascii);
    const kept = this.options.keep === undefined || this.options.keep.has(iri);
    const known = { number: kept ? this.options.store.predicate(iri) : -1, kept };
    this.predicateTable.set(bytes, predicateStart, predicateEnd, this.knownPredicates.length);
    this.knownPredicates.push(known);
    return known;
  }

  /** The store's number of a written term; an IRI is never decoded, a blank node label only the first time it is met. */
  private termNumber(bytes: Buffer, start: number, end: number): number {
    // An IRI's bytes between its brackets are its text; a blank node's text adds the file's prefix.
    if (bytes[start] !== UNDERSCORE) return this.options.store.termOfBytes(bytes, start + 1, end - 1);
    let termNumber = this.blankTable.get(bytes, start, end);
    if (termNumber < 0) {
      termNumber = this.options.store.term(this.blankText(bytes, start, end));
      this.blankTable.set(bytes, start, end, termNumber);
    }
    return termNumber;
  }

  /** A `_:label` as `_:` + the file's prefix + label. */
  private blankText(bytes: Buffer, start: number, end: number): string {
    return `_:${this.options.labelPrefix}${bytes.toString('latin1', start + 2, end)}`;
  }

  private text(bytes: Buffer, start: number, end: number, ascii: boolean): string {
    return bytes.toString(ascii ? 'latin1' : 'utf8', start, end);
  }

  /** A `#` comment from `hash` to the line's end, read as a possible allow comment. */
  private readComment(bytes: Buffer, lineStart: number, hash: number, end: number, ownLine: boolean): void {
    const text = bytes.toString('utf8', hash + 1, end);
    if (!text.includes('isapart-allow')) return;
    const column = bytes.toString('utf8', lineStart, hash).length + 1;
    const reading = readAllowComment(text, { file: this.options.file, line: this.lineNumber, column, ownLine });
    if (reading.kind === 'allow') this.source.allowComments.push(reading.comment);
    else if (reading.kind === 'malformed') this.source.errors.push(reading.error);
  }

  /** Parses one line with n3, as a source of its own with the same blank node prefix, and keeps what it gives. */
  private readWithN3(lineText: string): void {
    const { options } = this;
    this.linesReadByN3++;
    const parsed = parseSource(lineText, options.file, options.format, {
      baseIri: options.baseIri,
      cwd: options.cwd,
      blankNodePrefix: options.labelPrefix,
      singleLine: true,
    });
    const offset = this.lineNumber - 1;
    // n3 may give a statement before it finds the error on the same line; a bad line is skipped whole.
    const statements = parsed.errors.length === 0 ? parsed.statements : [];
    for (const statement of statements) {
      this.statementCount++;
      if (options.keep !== undefined && !options.keep.has(statement.predicate)) {
        this.unkeptCount++;
        if (statement.subject.startsWith('_:')) options.store.unkeptBlankSubjects.add(options.store.term(statement.subject));
        continue;
      }
      options.store.addStatement(
        { ...statement, position: { ...statement.position, line: statement.position.line + offset }, objectLine: statement.objectLine + offset },
      );
    }
    for (const comment of parsed.allowComments) this.source.allowComments.push({ ...comment, line: comment.line + offset });
    for (const error of parsed.errors) this.lineError({ ...error, line: error.line + offset });
  }

  private invalidUtf8(bytes: Buffer, start: number, end: number): void {
    const { column } = firstInvalidUtf8(bytes.subarray(start, end));
    this.lineError({
      file: this.options.file,
      line: this.lineNumber,
      column,
      message: `${this.options.file} is not valid UTF-8 text: an invalid byte sequence starts at line ${this.lineNumber}, column ${column}; the line was skipped, the lines after it were read.`,
      hint: 'RDF files are UTF-8 text: save the file as UTF-8 (for example with iconv -f LATIN1 -t UTF-8)',
    });
  }

  private lineError(error: InputError): void {
    this.errorCount++;
    if (this.errorCount <= LINE_ERRORS_LISTED) this.source.errors.push(error);
  }
}

const LANGUAGE_STRING_TYPES = [RDF_LANG_STRING, RDF_DIR_LANG_STRING].map((iri) => Buffer.from(iri, 'latin1'));

/** Whether bytes[start..end) spell rdf:langString or rdf:dirLangString. */
function isLanguageStringType(bytes: Buffer, start: number, end: number): boolean {
  return LANGUAGE_STRING_TYPES.some((type) => type.length === end - start && bytes.compare(type, 0, type.length, start, end) === 0);
}

/** The datatype and language of a scanned literal, as n3 gives them: a language tag in lower case, rdf:langString for it. */
function literalKind(bytes: Buffer, found: ScannedLine): LiteralKind {
  const datatype = found.datatypeStart >= 0 ? bytes.toString('utf8', found.datatypeStart, found.datatypeEnd) : undefined;
  const language = found.languageStart >= 0 ? bytes.toString('latin1', found.languageStart, found.languageEnd).toLowerCase() : '';
  return { datatype: datatype ?? (language === '' ? XSD_STRING : RDF_LANG_STRING), language };
}

function emptyScan(): ScannedLine {
  return {
    subjectStart: 0,
    subjectEnd: 0,
    predicateStart: 0,
    predicateEnd: 0,
    objectStart: 0,
    objectEnd: 0,
    literalEnd: -1,
    languageStart: -1,
    languageEnd: -1,
    datatypeStart: -1,
    datatypeEnd: -1,
    literalEscaped: false,
    graphStart: -1,
    graphEnd: -1,
    commentStart: -1,
    ascii: true,
  };
}
