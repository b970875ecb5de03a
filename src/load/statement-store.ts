// Compact storage of the statements a run keeps: term numbers and positions as integer columns.
import type { Literal, Statement } from './statement.js';
import { ByteTable } from './byte-table.js';

/** The graph column's value for a statement in the default graph. */
export const DEFAULT_GRAPH = -1;

/** Rows a column holds before it first grows. */
const INITIAL_ROWS = 1024;

/** A growable column of 32-bit integers. */
class IntColumn {
  values = new Int32Array(INITIAL_ROWS);

  /** Makes room for `rows` values, growing by half so that appending stays amortised constant time. */
  reserve(rows: number): void {
    if (rows <= this.values.length) return;
    const grown = new Int32Array(Math.max(rows, Math.ceil(this.values.length * 1.5)));
    grown.set(this.values);
    this.values = grown;
  }
}

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
 * are numbered once in first-seen order; a literal object is stored as `-2 - k` for the k-th
 * literal. Full `Statement` objects are made only for the rows that are asked for (evidence of
 * reported findings), and the same row always gives the same object.
 */
export class StatementStore {
  /** Term number → term text. */
  readonly termTexts: string[] = [];
  /** UTF-8 bytes of a term's text → term number, so the fast path finds a term without decoding it. */
  private readonly termIndex = new ByteTable();
  private scratch = Buffer.alloc(4096);
  /** Each distinct predicate IRI once, in first-seen order. */
  readonly predicateIris: string[] = [];
  /** File names of the sources, by file number. */
  readonly files: string[] = [];
  /** Term numbers of blank nodes that are the subject of a statement that was not kept. */
  readonly unkeptBlankSubjects = new Set<number>();
  private readonly predicateNumbers = new Map<string, number>();
  private readonly literalValues: string[] = [];
  private readonly literalDatatypes: string[] = [];
  private readonly literalLanguages: string[] = [];
  // Datatype and language strings are shared, so a million labels hold one copy of "en".
  private readonly sharedStrings = new Map<string, string>();
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

  /** The number of a term, numbering it when new. */
  term(text: string): number {
    const length = this.encode(text);
    const known = this.termIndex.get(this.scratch, 0, length);
    if (known >= 0) return known;
    return this.addTerm(this.scratch, 0, length, text);
  }

  /** The number of a term, or -1 when it has none. */
  termNumberOf(text: string): number {
    const length = this.encode(text);
    return this.termIndex.get(this.scratch, 0, length);
  }

  /**
   * The number of the term whose text is the UTF-8 bytes[start..end), numbering it when new; the
   * bytes are decoded only then (latin1 when `ascii`, which gives the same text faster).
   */
  termOfBytes(bytes: Buffer, start: number, end: number, ascii: boolean): number {
    const known = this.termIndex.get(bytes, start, end);
    if (known >= 0) return known;
    return this.addTerm(bytes, start, end, bytes.toString(ascii ? 'latin1' : 'utf8', start, end));
  }

  private addTerm(bytes: Buffer, start: number, end: number, text: string): number {
    const termNumber = this.termTexts.length;
    this.termIndex.set(bytes, start, end, termNumber);
    this.termTexts.push(text);
    return termNumber;
  }

  /** Writes a text's UTF-8 bytes into the scratch buffer and returns their length. */
  private encode(text: string): number {
    if (text.length * 3 > this.scratch.length) this.scratch = Buffer.alloc(text.length * 3);
    return this.scratch.write(text, 0, 'utf8');
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
    this.literalValues.push(literal.value);
    this.literalDatatypes.push(this.shared(literal.datatype));
    this.literalLanguages.push(this.shared(literal.language));
    return -2 - (this.literalValues.length - 1);
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
    if (object >= 0) return undefined;
    const index = -2 - object;
    return { value: this.literalValues[index], datatype: this.literalDatatypes[index], language: this.literalLanguages[index] };
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
        subject: this.termTexts[columns.subject.values[row]],
        predicate: this.predicateIris[columns.predicate.values[row]],
        object: object >= 0 ? this.termTexts[object] : (this.literalOf(row) as Literal),
        graph: graph === DEFAULT_GRAPH ? '' : this.termTexts[graph],
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

  private shared(text: string): string {
    const known = this.sharedStrings.get(text);
    if (known !== undefined) return known;
    this.sharedStrings.set(text, text);
    return text;
  }
}
