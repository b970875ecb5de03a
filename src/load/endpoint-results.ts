// Reading SPARQL 1.1 Query Results JSON into plain terms, refusing anything malformed.
import { createHash } from 'node:crypto';
import type { Literal } from './statement.js';
import { XSD_STRING } from '../roles/vocabulary.js';

/** One bound value of a result row (SPARQL 1.1 Query Results JSON Format, section 3.2.2). */
export interface ResultTerm {
  type: 'uri' | 'bnode' | 'literal' | 'typed-literal';
  value: string;
  datatype?: string;
  'xml:lang'?: string;
}

/** One row: variable name (without `?`) → value. */
export type ResultRow = Record<string, ResultTerm>;

/** Why an answer could not be read as results; the caller turns it into an input error. */
export class MalformedResults extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'MalformedResults';
  }
}

const RDF_LANG_STRING = 'http://www.w3.org/1999/02/22-rdf-syntax-ns#langString';
const TERM_TYPES: ReadonlySet<string> = new Set(['uri', 'bnode', 'literal', 'typed-literal']);

/** The rows of a SELECT answer; throws MalformedResults when the text is not results JSON. */
export function parseResultsJson(text: string): ResultRow[] {
  let document: unknown;
  try {
    document = JSON.parse(text);
  } catch (error) {
    throw new MalformedResults(`the answer is not JSON (${error instanceof Error ? error.message : String(error)})`);
  }
  const bindings = (document as { results?: { bindings?: unknown } } | null)?.results?.bindings;
  if (!Array.isArray(bindings)) throw new MalformedResults('the answer has no `results.bindings` list, as SPARQL 1.1 Query Results JSON has');
  for (const [index, row] of bindings.entries()) {
    if (typeof row !== 'object' || row === null || Array.isArray(row)) throw new MalformedResults(`result row ${index + 1} is not an object`);
    for (const [name, term] of Object.entries(row as Record<string, unknown>)) {
      const candidate = term as Partial<ResultTerm> | null;
      if (typeof candidate !== 'object' || candidate === null || typeof candidate.type !== 'string' || !TERM_TYPES.has(candidate.type) || typeof candidate.value !== 'string') {
        throw new MalformedResults(`result row ${index + 1} binds ?${name} to something that is not a term with a type and a value`);
      }
    }
  }
  // Virtuoso writes typed literals as `typed-literal`, the form of the 2008 W3C results note (seen on
  // Virtuoso 7.2.5); SPARQL 1.1 results name every literal `literal`, so readers downstream see one form.
  for (const row of bindings as ResultRow[]) {
    for (const term of Object.values(row)) if (term.type === 'typed-literal') term.type = 'literal';
  }
  return bindings as ResultRow[];
}

/** The integer an aggregate row holds in a variable; throws MalformedResults when it is none. */
export function integerOf(rows: ResultRow[], variable: string): number {
  const term = rows[0]?.[variable];
  const count = term === undefined ? Number.NaN : Number(term.value);
  if (rows.length !== 1 || !Number.isSafeInteger(count) || count < 0) {
    throw new MalformedResults(`the count query returned ${rows.length} rows and no whole number in ?${variable}`);
  }
  return count;
}

/**
 * Stable blank node labels for one endpoint: `_:e`, 8 hex digits of the SHA-1 of the location, `_`,
 * then the server's label with every character outside `[A-Za-z0-9-]` written as `_` and its hex code.
 * The same server label always gives the same node, and labels never clash with those of files.
 */
export class BlankLabels {
  private readonly prefix: string;
  private readonly labels = new Map<string, string>();

  constructor(location: string) {
    this.prefix = `_:e${createHash('sha1').update(location).digest('hex').slice(0, 8)}_`;
  }

  /** The `_:label` of a server's blank node label. */
  label(serverLabel: string): string {
    let label = this.labels.get(serverLabel);
    if (label === undefined) {
      label = this.prefix + serverLabel.replace(/[^A-Za-z0-9-]/g, (character) => `_${character.codePointAt(0)!.toString(16)}`);
      this.labels.set(serverLabel, label);
    }
    return label;
  }
}

/** A subject term: an IRI, or a blank node as `_:label`; throws MalformedResults on a literal. */
export function nodeOf(term: ResultTerm | undefined, variable: string, blanks: BlankLabels): string {
  if (term === undefined) throw new MalformedResults(`a result row has no value for ?${variable}`);
  if (term.type === 'uri') return term.value;
  if (term.type === 'bnode') return blanks.label(term.value);
  throw new MalformedResults(`?${variable} is bound to the literal "${term.value}", where an IRI or blank node belongs`);
}

/** An object term: a node, or a literal with its datatype and language (plain literals as xsd:string, RDF 1.1). */
export function objectOf(term: ResultTerm | undefined, variable: string, blanks: BlankLabels): string | Literal {
  if (term === undefined || (term.type !== 'literal' && term.type !== 'typed-literal')) return nodeOf(term, variable, blanks);
  const language = term['xml:lang'] ?? '';
  const datatype = term.datatype ?? (language === '' ? XSD_STRING : RDF_LANG_STRING);
  return { value: term.value, datatype, language };
}
