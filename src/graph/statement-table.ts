// The statements of a run as integer columns: term numbers of subject and object, and a predicate number.
import type { LiteralKind } from '../load/literal-table.js';
import type { Literal, LoadedSource, Statement } from '../load/statement.js';
import { StatementStore } from '../load/statement-store.js';
import { TermInterner } from './interner.js';

/**
 * All kept statements of all sources in source order, with row i's subject and object as term
 * numbers of `terms` (a literal object as a negative number) and its predicate as an index into
 * `predicateIris`. Statements and literals are made from the rows only when asked for.
 */
export interface StatementTable {
  rowCount: number;
  /** The statement of a row (the same object each time). */
  statement(row: number): Statement;
  /** The literal object of a row, or undefined when its object is a term. */
  literal(row: number): Literal | undefined;
  /** The datatype and language of literal k, the object value `-2 - k` (a shared object: never modify it). */
  literalKind(literal: number): LiteralKind;
  /** The lexical form of literal k, the object value `-2 - k`. */
  literalValue(literal: number): string;
  terms: TermInterner;
  subjects: Int32Array;
  objects: Int32Array;
  predicates: Int32Array;
  /** Each distinct predicate IRI once, in first-seen order. */
  predicateIris: readonly string[];
  /** Term numbers of blank nodes that are subjects of statements the loader did not keep. */
  unkeptBlankSubjects: ReadonlySet<number>;
}

/** Whether an object column value is a literal rather than a term number. */
export function isLiteralObject(object: number): boolean {
  return object < 0;
}

/**
 * The table of the sources' statements. Sources read by one `loadSources` call already sit in its
 * store, in order, and are used as they are; any others are numbered here, one lookup per term.
 */
export function tabulateStatements(sources: readonly LoadedSource[]): StatementTable {
  const store = sharedStore(sources) ?? copiedStore(sources);
  const terms = new TermInterner(store);
  return {
    rowCount: store.size,
    statement: (row) => store.statement(row),
    literal: (row) => store.literalOf(row),
    literalKind: (literal) => store.literalKind(literal),
    literalValue: (literal) => store.literalValue(literal),
    terms,
    subjects: store.subjects,
    objects: store.objects,
    predicates: store.predicates,
    predicateIris: store.predicateIris,
    unkeptBlankSubjects: store.unkeptBlankSubjects,
  };
}

/** The store of the sources when they fill it exactly, in order; otherwise undefined. */
function sharedStore(sources: readonly LoadedSource[]): StatementStore | undefined {
  const store = sources[0]?.rows?.store;
  if (store === undefined) return undefined;
  let next = 0;
  for (const source of sources) {
    if (source.rows === undefined || source.rows.store !== store || source.rows.start !== next) return undefined;
    next = source.rows.end;
  }
  return next === store.size ? store : undefined;
}

/** A new store holding the statements of the sources, in order; each row gives back its own statement object. */
function copiedStore(sources: readonly LoadedSource[]): StatementStore {
  const store = new StatementStore();
  for (const source of sources) {
    store.file(source.file);
    for (const statement of source.statements) store.addStatement(statement, true);
  }
  return store;
}
