// Writes RDF terms and statements compactly for reports: Turtle-like, with prefixed names when a prefix map is given.
import type { Literal, Statement } from '../load/statement.js';
import { RDF_TYPE, XSD_STRING } from '../roles/vocabulary.js';

const RDF_LANG_STRING = 'http://www.w3.org/1999/02/22-rdf-syntax-ns#langString';

// A conservative subset of Turtle's PN_LOCAL (W3C RDF 1.1 Turtle, production [168s]): ASCII letters,
// digits, `_`, `-` and inner `.`; any other local part is written as a full `<IRI>` instead.
const SAFE_LOCAL_NAME = /^([A-Za-z0-9_]([A-Za-z0-9_.-]*[A-Za-z0-9_-])?)?$/;

const LITERAL_ESCAPES: Record<string, string> = { '"': '\\"', '\\': '\\\\', '\n': '\\n', '\r': '\\r', '\t': '\\t' };

/** Writes terms and statements; built once per report from an optional prefix → namespace map. */
export interface TermWriter {
  /** An IRI as a prefixed name or `<IRI>`, a blank node as `_:label`, a literal in Turtle form. */
  term(term: string | Literal): string;
  /** A statement as `subject predicate object`, with the graph after it when not the default graph. */
  statement(statement: Statement): string;
}

/** A writer that uses the longest fitting namespace of `prefixes`, or full IRIs when there are none. */
export function createTermWriter(prefixes?: Record<string, string>): TermWriter {
  const namespaces = Object.entries(prefixes ?? {})
    .filter(([, namespace]) => namespace !== '')
    .sort(([prefixA, namespaceA], [prefixB, namespaceB]) =>
      namespaceB.length - namespaceA.length || (prefixA < prefixB ? -1 : prefixA > prefixB ? 1 : 0),
    );

  const iri = (value: string): string => {
    for (const [prefix, namespace] of namespaces) {
      if (!value.startsWith(namespace)) continue;
      const local = value.slice(namespace.length);
      if (SAFE_LOCAL_NAME.test(local)) return `${prefix}:${local}`;
    }
    return `<${value}>`;
  };

  const term = (value: string | Literal): string => {
    if (typeof value !== 'string') return literalText(value, iri);
    return value.startsWith('_:') ? value : iri(value);
  };

  const statement = (value: Statement): string => {
    // Turtle's `a` stands for rdf:type (W3C RDF 1.1 Turtle, section 2.4).
    const predicate = value.predicate === RDF_TYPE ? 'a' : term(value.predicate);
    const triple = `${term(value.subject)} ${predicate} ${term(value.object)}`;
    return value.graph === '' ? triple : `${triple} ${term(value.graph)}`;
  };

  return { term, statement };
}

function literalText(literal: Literal, iri: (value: string) => string): string {
  const quoted = `"${literal.value.replace(/["\\\n\r\t]/g, (character) => LITERAL_ESCAPES[character])}"`;
  if (literal.language !== '') return `${quoted}@${literal.language}`;
  if (literal.datatype === '' || literal.datatype === XSD_STRING || literal.datatype === RDF_LANG_STRING) return quoted;
  return `${quoted}^^${iri(literal.datatype)}`;
}
