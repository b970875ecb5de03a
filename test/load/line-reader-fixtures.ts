// Test helpers for the N-Triples/N-Quads fast path: read a text through LineReader in chunks, or whole with n3.
import type { LoadedSource, Statement } from '../../src/load/statement.js';
import { LineReader } from '../../src/load/line-reader.js';
import { blankNodeLabelPrefix, parseSource } from '../../src/load/parse.js';
import { StatementStore } from '../../src/load/statement-store.js';

/** Options of the two readers: the file name, its syntax, and the predicates to keep. */
export interface ReadOptions {
  file: string;
  format: 'n-triples' | 'n-quads';
  keep?: ReadonlySet<string>;
  baseIri?: string;
  /** Bytes per chunk handed to the fast path; small sizes cut lines and characters in two. */
  chunkBytes?: number;
}

const CWD = '/work/isapart-test';

/** Reads bytes through the fast path, `chunkBytes` at a time. */
export function readFast(bytes: Uint8Array, options: ReadOptions): LoadedSource & { linesReadByN3: number } {
  const reader = new LineReader({
    file: options.file,
    format: options.format,
    store: new StatementStore(),
    keep: options.keep,
    labelPrefix: blankNodeLabelPrefix(options.file, CWD),
    baseIri: options.baseIri ?? 'file:///work/isapart-test/data.nt',
    cwd: CWD,
  });
  const buffer = Buffer.from(bytes);
  const step = options.chunkBytes ?? buffer.length + 1;
  for (let start = 0; start < buffer.length; start += step) reader.push(buffer.subarray(start, start + step));
  return Object.assign(reader.finish(), { linesReadByN3: reader.linesReadByN3 });
}

/** Reads the text whole with n3 (parseSource), keeping the statements whose predicate is kept. */
export function readWithN3(text: string, options: ReadOptions): LoadedSource {
  const source = parseSource(text, options.file, options.format, {
    baseIri: options.baseIri ?? 'file:///work/isapart-test/data.nt',
    cwd: CWD,
  });
  const keep = options.keep;
  return { ...source, statements: keep === undefined ? source.statements : source.statements.filter((s) => keep.has(s.predicate)) };
}

/** A statement as one comparable line of text: terms, graph, line, column and object line. */
export function statementKey(statement: Statement): string {
  return JSON.stringify([
    statement.subject,
    statement.predicate,
    statement.object,
    statement.graph,
    statement.position.file,
    statement.position.line,
    statement.position.column,
    statement.objectLine,
  ]);
}
