// Statements as the loaders give them: RDF terms as plain strings, plus where they were stated.
import type { StatementStore } from './statement-store.js';

/** A literal object: lexical form, datatype IRI, and language tag ('' when none). */
export interface Literal {
  value: string;
  datatype: string;
  language: string;
}

/** Where a statement was stated: 1-based line and 1-based column (UTF-16 code units) of its subject. */
export interface Position {
  file: string;
  line: number;
  column: number;
}

/**
 * One RDF statement with its source position.
 * Subject and object are an IRI, or `_:label` for a blank node (labels are stable per file and
 * distinct across files); a literal object is a `Literal`. `graph` is '' for the default graph.
 * `objectLine` is the line of the object token, which differs from `position.line` when a Turtle
 * statement spans lines (`;` and `,` lists); suppression comments are matched against both.
 */
export interface Statement {
  subject: string;
  predicate: string;
  object: string | Literal;
  graph: string;
  position: Position;
  objectLine: number;
}

/** A syntax or input error: where it is, what was expected, and a hint for fixing it. */
export interface InputError {
  file: string;
  line: number;
  column: number;
  message: string;
  hint?: string;
}

/** An `# isapart-allow RULE-ID: reason` comment found in a source file. */
export interface AllowComment {
  file: string;
  line: number;
  column: number;
  ruleId: string;
  reason: string;
  /** true when the comment stands alone on its line (it then applies to the line below). */
  ownLine: boolean;
}

/** The RDF syntaxes that n3's parser reads. */
export type N3Format = 'turtle' | 'trig' | 'n-triples' | 'n-quads';

/** The RDF syntaxes isapart reads. */
export type RdfFormat = N3Format | 'rdf-xml' | 'json-ld';

/** Where a source's kept statements are: rows start..end-1 of a run's StatementStore. */
export interface StoredRows {
  store: StatementStore;
  start: number;
  end: number;
}

/** Everything read from one source (a file, or stdin as file '<stdin>'). */
export interface LoadedSource {
  file: string;
  format: RdfFormat;
  /** The kept statements; for a source read into a store, made from its rows when asked for. */
  statements: Statement[];
  /** Statements read, kept or not; when absent, `statements.length`. */
  statementCount?: number;
  /** Statements read whose predicate plays no part in the graph, so they were counted and not kept. */
  unkeptStatements?: number;
  /** The store rows of the kept statements, when the loader read the source into a store. */
  rows?: StoredRows;
  errors: InputError[];
  /** Problems that leave the source readable (a JSON-LD key that states nothing); they do not change the exit code. */
  warnings?: InputError[];
  allowComments: AllowComment[];
  /** Prefixes declared in the source, prefix → namespace IRI. */
  prefixes: Record<string, string>;
}

/** The result of reading every source of a run. */
export interface LoadResult {
  sources: LoadedSource[];
  /** Errors not tied to a parsed source: a missing path, an unreadable file, a bad gzip stream. */
  errors: InputError[];
}
