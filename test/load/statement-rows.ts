// Loaded statements as short rows, for tests that compare what a parser read and where it placed it.
import type { LoadedSource } from '../../src/load/statement.js';

const SHORT_NAMES: [string, string][] = [
  ['https://data.northvale-rail.example/def/', 'nv:'],
  ['http://www.w3.org/1999/02/22-rdf-syntax-ns#', 'rdf:'],
  ['http://www.w3.org/2000/01/rdf-schema#', 'rdfs:'],
];

/** A term with the Northvale, RDF or RDFS namespace written as its prefix. */
function short(text: string): string {
  for (const [namespace, prefix] of SHORT_NAMES) if (text.startsWith(namespace)) return prefix + text.slice(namespace.length);
  return text;
}

/** Statements as [subject, predicate, object, line, column], names shortened for reading; a literal as its value. */
export function statementRows(source: LoadedSource): (string | number)[][] {
  return source.statements.map((statement) => [
    short(statement.subject),
    short(statement.predicate),
    typeof statement.object === 'string' ? short(statement.object) : statement.object.value,
    statement.position.line,
    statement.position.column,
  ]);
}
