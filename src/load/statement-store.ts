// Compact storage of the statements a run keeps: term numbers and positions as integer columns.
import type { Literal, Statement } from './statement.js';
import { ByteTable } from './byte-table.js';
import { IntColumn } from './int-column.js';
import { LiteralTable, type LiteralKind } from './literal-table.js';
import { writeTermBytes } from './term-bytes.js';

/** The graph column's value for a statement in the default graph. */
export const DEFAULT_GRAPH = -1;

/**
 * A column whose rows mostly hold one default value (a subject in column 1, an object on the
 * subject's line, the default graph): no memory at all until a row holds another value.
 */
class OptionalColumn {
  private column: IntColumn | undefined;

  constructor(private readonly fallback: number) {}

  /** Sets row's value; `capacity` is the row count the store has room for. */
  set(row: number, value: number, capacity: number): void {
    if (this.column === undefined) {
      if (value === this.fallback) return;
      this.column = new IntColumn();
      this.column.values = new Int32Array(capacity).fill(this.fallback);
    }
    this.column.reserve(capacity);
    this.column.values[row] = value;
  }

  /** The value of a row. */
  get(row: number): number {
    return this.column === undefined ? this.fallback : this.column.values[row];
  }
}

/**
 * Every kept statement of a run, one row each: subject, predicate, object and graph as numbers,
 * and the file, line, column and object line of where it was stated (the file by row ranges, and
 * column, object line and graph only where they differ from 1, the line and the default graph). Terms (IRIs and `_:label`s)
 * are numbered once in first-seen order and kept as their UTF-8 bytes, decoded to a string only
 * when asked for (`text`); a literal object is stored as `-2 - k` for the k-th literal of a
 * LiteralTable. Full `Statement` objects are made only for the rows that are asked for (evidence of
 * reported findings), and the same row always gives the same object.
 */
export class StatementStore {
  /** UTF-8 bytes of a term's text → term number (its entry number), so the fast path finds a term without decoding it. */
  private readonly termIndex = new ByteTable();
  /** Texts with a lone surrogate, whose bytes do not decode back to them (see `writeTermBytes`), by term number. */
  private readonly oddTexts = new Map<number, string>();
  private readonly literals = new LiteralTable();
  private scratch = Buffer.alloc(4096);
  /** Each distinct predicate IRI once, in first-seen order. */
  readonly predicateIris: string[] = [];
  /** File names of the sources, by file number. */
  readonly files: string[] = [];
  /** Term numbers of blank nodes that are the subject of a statement that was not kept. */
  readonly unkeptBlankSubjects = new Set<number>();
  private readonly predicateNumbers = new Map<string, number>();
  private readonly columns = {
    subject: new IntColumn(),
    predicate: new IntColumn(),
    object: new IntColumn(),
    line: new IntColumn(),
  };
  private readonly graphs = new OptionalColumn(DEFAULT_GRAPH);
  private readonly subjectColumns = new OptionalColumn(1);
  /** Object line minus line. */
  private readonly objectLineOffsets = new OptionalColumn(0);
  /** The first row of each file; a file's rows are the ones added after it was opened and before the next. */
  private readonly fileFirstRows: number[] = [];
  private readonly made = new Map<number, Statement>();
  private rows = 0;

  /** How many statements are stored. */
  get size(): number {
    return this.rows;
  }

  /** How many terms are numbered. */
  get termCount(): number {
    return this.termIndex.size;
  }

  /** The number of a term, numbering it when new. */
  term(text: string): number {
    const { length, loneSurrogate } = this.encode(text);
    const known = this.termIndex.get(this.scratch, 0, length);
    if (known >= 0) return known;
    const termNumber = this.termIndex.size;
    this.termIndex.set(this.scratch, 0, length, termNumber);
    if (loneSurrogate) this.oddTexts.set(termNumber, text);
    return termNumber;
  }

  /** The number of a term, or -1 when it has none. */
  termNumberOf(text: string): number {
    const { length } = this.encode(text);
    return this.termIndex.get(this.scratch, 0, length);
  }

  /** The number of the term whose text is the UTF-8 bytes[start..end), numbering it when new (nothing is decoded). */
  termOfBytes(bytes: Buffer, start: number, end: number): number {
    const known = this.termIndex.get(bytes, start, end);
    if (known >= 0) return known;
    const termNumber = this.termIndex.size;
    this.termIndex.set(bytes, start, end, termNumber);
    return termNumber;
  }

  /** The text of a term number, decoded from its bytes (a new string each time). */
  text(termNumber: number): string {
    if (this.oddTexts.size > 0) {
      const odd = this.oddTexts.get(termNumber);
      if (odd !== undefined) return odd;
    }
    return this.termIndex.keyText(termNumber);
  }

  /**
   * Whether a term's text starts with the text whose UTF-8 bytes are `prefix`, read from the bytes.
   * For a prefix without lone surrogates this is `text(termNumber).startsWith(prefix text)`.
   */
  termStartsWith(termNumber: number, prefix: Uint8Array): boolean {
    return this.termIndex.keyStartsWith(termNumber, prefix);
  }

  /** Bytes the term index and the literals take (arenas and columns), for measuring. */
  get termBytes(): { terms: number; literals: number } {
    return { terms: this.termIndex.allocatedBytes, literals: this.literals.allocatedBytes };
  }

  /** Writes a text's bytes into the scratch buffer (see `writeTermBytes`). */
  private encode(text: string): { length: number; loneSurrogate: boolean } {
    if (text.length * 3 > this.scratch.length) this.scratch = Buffer.alloc(text.length * 3);
    return writeTermBytes(text, this.scratch);
  }

  /** The number of a predicate IRI, numbering it when new. */
  predicate(iri: string): number {
    let predicateNumber = this.predicateNumbers.get(iri);
    if (predicateNumber === undefined) {
      predicateNumber = this.predicateIris.length;
      this.predicateNumbers.set(iri, predicateNumber);
      this.predicateIris.push(iri);
    }
    return predicateNumber;
  }

  /** Opens a source file: the rows added from now on, until the next file is opened, are its statements. */
  file(name: string): number {
    this.files.push(name);
    this.fileFirstRows.push(this.rows);
    return this.files.length - 1;
  }

  /** The file number of a row: the last file opened at or before it. */
  private fileOf(row: number): number {
    let low = 0;
    let high = this.fileFirstRows.length - 1;
    while (low < high) {
      const middle = (low + high + 1) >>> 1;
      if (this.fileFirstRows[middle] <= row) low = middle;
      else high = middle - 1;
    }
    return low;
  }

  /** The object value of a literal, to pass to `addRow`. */
  literal(literal: Literal): number {
    return -2 - this.literals.add(literal);
  }

  /** The object value of a literal whose lexical form is the UTF-8 bytes[start..end), of a kind from `literalKindOfSuffix`. */
  literalOfBytes(bytes: Buffer, start: number, end: number, kind: number): number {
    return -2 - this.literals.addBytes(bytes, start, end, kind);
  }

  /** The kind number of a literal written with the suffix bytes[start..end) (see `LiteralTable.kindOfSuffix`). */
  literalKindOfSuffix(bytes: Buffer, start: number, end: number, decode: () => LiteralKind): number {
    return this.literals.kindOfSuffix(bytes, start, end, decode);
  }

  /** Appends one statement of the file opened last, from numbers given by `term`, `predicate` and `literal`. */
  addRow(row: { subject: number; predicate: number; object: number; graph: number; line: number; column: number; objectLine: number }): void {
    const index = this.rows;
    const { columns } = this;
    if (index === columns.subject.values.length) for (const column of Object.values(columns)) column.reserve(index + 1);
    columns.subject.values[index] = row.subject;
    columns.predicate.values[index] = row.predicate;
    columns.object.values[index] = row.object;
    columns.line.values[index] = row.line;
    const capacity = columns.subject.values.length;
    this.graphs.set(index, row.graph, capacity);
    this.subjectColumns.set(index, row.column, capacity);
    this.objectLineOffsets.set(index, row.objectLine - row.line, capacity);
    this.rows++;
  }

  /** Appends a statement given as text to the file opened last; with `same`, the row gives back this very object. */
  addStatement(statement: Statement, same = false): void {
    if (same) this.made.set(this.rows, statement);
    const { object } = statement;
    this.addRow({
      subject: this.term(statement.subject),
      predicate: this.predicate(statement.predicate),
      object: typeof object === 'string' ? this.term(object) : this.literal(object),
      graph: statement.graph === '' ? DEFAULT_GRAPH : this.term(statement.graph),
      line: statement.position.line,
      column: statement.position.column,
      objectLine: statement.objectLine,
    });
  }

  /** Subject term numbers by row (a view of the first `size` rows). */
  get subjects(): Int32Array {
    return this.columns.subject.values.subarray(0, this.rows);
  }

  /** Object values by row: a term number, or `-2 - k` for literal k. */
  get objects(): Int32Array {
    return this.columns.object.values.subarray(0, this.rows);
  }

  /** Predicate numbers by row, indexes into `predicateIris`. */
  get predicates(): Int32Array {
    return this.columns.predicate.values.subarray(0, this.rows);
  }

  /** The literal object of a row, or undefined when its object is a term. */
  literalOf(row: number): Literal | undefined {
    const object = this.columns.object.values[row];
    return object >= 0 ? undefined : this.literals.literal(-2 - object);
  }

  /** The datatype and language of literal k (the object value `-2 - k`); a shared object, never modify it. */
  literalKind(literal: number): LiteralKind {
    return this.literals.kind(literal);
  }

  /** The lexical form of literal k (the object value `-2 - k`). */
  literalValue(literal: number): string {
    return this.literals.value(literal);
  }

  /** The statement of a row, made once and then kept. */
  statement(row: number): Statement {
    let statement = this.made.get(row);
    if (statement === undefined) {
      const { columns } = this;
      const object = columns.object.values[row];
      const graph = this.graphs.get(row);
      const line = columns.line.values[row];
      statement = {
        subject: this.text(columns.subject.values[row]),
        predicate: this.predicateIris[columns.predicate.values[row]],
        object: object >= 0 ? this.text(object) : (this.literalOf(row) as Literal),
        graph: graph === DEFAULT_GRAPH ? '' : this.text(graph),
        position: { file: this.files[this.fileOf(row)], line, column: this.subjectColumns.get(row) },
        objectLine: line + this.objectLineOffsets.get(row),
      };
      this.made.set(row, statement);
    }
    return statement;
  }

  /** The statements of rows start..end-1, in order. */
  statementsOf(start: number, end: number): Statement[] {
    const statements: Statement[] = [];
    for (let row = start; row < end; row++) statements.push(this.statement(row));
    return statements;
  }
}
