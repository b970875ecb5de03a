// Where a parser's statements go as they are read: a list of Statement objects, or a run's StatementStore.
import type * as RDF from '@rdfjs/types';
import { Literal as N3Literal } from 'n3';
import type { Literal, Statement } from './statement.js';

/** Takes the statements of one source as a parser reads them, in order. */
export interface StatementSink {
  /** One statement of RDF 1.1 terms (no triple terms), with its subject's line and column and its object's line. */
  add(quad: RDF.BaseQuad, line: number, column: number, objectLine: number): void;
}

/** A sink that makes a Statement object of each statement it takes, for a source held whole (an editor buffer, a git blob). */
export class StatementList implements StatementSink {
  readonly statements: Statement[] = [];

  constructor(private readonly file: string) {}

  add(quad: RDF.BaseQuad, line: number, column: number, objectLine: number): void {
    const { object, graph } = quad;
    this.statements.push({
      subject: termText(quad.subject),
      predicate: quad.predicate.value,
      object: object.termType === 'Literal' ? literalOf(object as RDF.Literal) : termText(object),
      graph: graph.termType === 'DefaultGraph' ? '' : termText(graph),
      position: { file: this.file, line, column },
      objectLine,
    });
  }
}

/** A literal's parts; n3's `datatypeString` gives the datatype IRI without making a term for it. */
export function literalOf(literal: RDF.Literal): Literal {
  const datatype = literal instanceof N3Literal ? literal.datatypeString : literal.datatype.value;
  return { value: literal.value, datatype, language: literal.language };
}

/** An IRI as itself, a blank node as `_:label`. */
export function termText(term: RDF.Term): string {
  return term.termType === 'BlankNode' ? `_:${term.value}` : term.value;
}
