// The statements an edit's WHERE patterns are matched against, indexed by predicate and by subject or object, changing as operations apply.
import type { Literal, Statement } from '../load/statement.js';
import { statementKey } from './delta.js';

/** A bound value: an IRI, `_:label` for a blank node, or a literal. */
export type BoundTerm = string | Literal;

/** The key two equal bound values share. */
export function boundKey(term: BoundTerm): string {
  return typeof term === 'string' ? `T${term}` : `L${term.value}\u0000${term.datatype}\u0000${term.language}`;
}

interface PredicateIndex {
  bySubject: Map<string, Map<string, Statement>>;
  byObject: Map<string, Map<string, Statement>>;
  all: Map<string, Statement>;
}

/** What to look up: a predicate, and a subject, object or graph when known. */
export interface StatementQuery {
  predicate: string;
  subject?: string;
  object?: BoundTerm;
  /** A graph IRI, or '' for the default graph; undefined for any graph. */
  graph?: string;
}

/** A set of statements, one per triple and graph, with lookups by predicate and subject or object. */
export class StatementIndex {
  private readonly predicates = new Map<string, PredicateIndex>();
  private readonly statements = new Map<string, Statement>();

  /** Whether the same triple in the same graph is held. */
  has(statement: Statement): boolean {
    return this.statements.has(statementKey(statement));
  }

  /** Adds a statement; false when the same triple in the same graph was already held. */
  add(statement: Statement): boolean {
    const key = statementKey(statement);
    if (this.statements.has(key)) return false;
    this.statements.set(key, statement);
    const index = this.predicateIndex(statement.predicate);
    index.all.set(key, statement);
    entry(index.bySubject, statement.subject).set(key, statement);
    entry(index.byObject, boundKey(statement.object)).set(key, statement);
    return true;
  }

  /** Removes a statement; false when it was not held. */
  remove(statement: Statement): boolean {
    const key = statementKey(statement);
    if (!this.statements.delete(key)) return false;
    const index = this.predicates.get(statement.predicate)!;
    index.all.delete(key);
    index.bySubject.get(statement.subject)?.delete(key);
    index.byObject.get(boundKey(statement.object))?.delete(key);
    return true;
  }

  /** The statements that fit the query, from the narrowest index that applies. */
  *match(query: StatementQuery): Iterable<Statement> {
    const index = this.predicates.get(query.predicate);
    if (index === undefined) return;
    const candidates =
      query.subject !== undefined
        ? index.bySubject.get(query.subject)
        : query.object !== undefined
          ? index.byObject.get(boundKey(query.object))
          : index.all;
    if (candidates === undefined) return;
    const objectKey = query.object === undefined ? undefined : boundKey(query.object);
    for (const statement of candidates.values()) {
      if (query.subject !== undefined && statement.subject !== query.subject) continue;
      if (objectKey !== undefined && boundKey(statement.object) !== objectKey) continue;
      if (query.graph !== undefined && statement.graph !== query.graph) continue;
      yield statement;
    }
  }

  /** The named graphs that hold at least one statement. */
  namedGraphs(): Set<string> {
    const graphs = new Set<string>();
    for (const statement of this.statements.values()) if (statement.graph !== '') graphs.add(statement.graph);
    return graphs;
  }

  private predicateIndex(predicate: string): PredicateIndex {
    let index = this.predicates.get(predicate);
    if (index === undefined) {
      index = { bySubject: new Map(), byObject: new Map(), all: new Map() };
      this.predicates.set(predicate, index);
    }
    return index;
  }
}

function entry(map: Map<string, Map<string, Statement>>, key: string): Map<string, Statement> {
  let found = map.get(key);
  if (found === undefined) {
    found = new Map();
    map.set(key, found);
  }
  return found;
}
