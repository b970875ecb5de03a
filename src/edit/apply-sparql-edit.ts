// Applying a parsed SPARQL Update to the loaded statements, operation by operation, as SPARQL 1.1 Update §3.1 says, into an EditDelta.
import type { InputError, LoadedSource, Statement } from '../load/statement.js';
import { statementKey, type EditDelta } from './delta.js';
import type { EditOperation, SparqlEdit } from './sparql-edit.js';
import { StatementIndex, type BoundTerm } from './statement-index.js';
import type { PlacedTriple, TemplateTerm } from './update-text.js';
import { FILTER_HINT, UnevaluatedFilter } from './where-filter.js';
import { evaluateWhere, type Solution } from './where-pattern.js';

/** What applying an edit needs besides the edit: the data, and which predicates are kept. */
export interface ApplyEditOptions {
  sources: readonly LoadedSource[];
  keptPredicates: ReadonlySet<string>;
  /** The prefix of the edit's own blank node labels (see `blankNodeLabelPrefix`), distinct from the data's. */
  blankNodePrefix: string;
}

/**
 * The statements the edit adds and removes. Each operation sees the effects of the ones before it;
 * a DELETE/INSERT computes its solutions first, then deletes, then inserts. A statement whose
 * last change inserts it is added, one whose last change deletes it is removed; statements of a
 * predicate the graph does not read are counted as ignored.
 */
export function applySparqlEdit(edit: SparqlEdit, options: ApplyEditOptions): EditDelta | { error: InputError } {
  const changes = new Map<string, { inserted: boolean; statement: Statement }>();
  let index: StatementIndex | undefined;
  let ignored = 0;
  // Only the statements of predicates some WHERE reads are indexed (WHERE predicates are always named).
  const wherePredicates = new Set(edit.operations.flatMap((operation) => patternPredicates(operation.where)));
  const change = (statement: Statement, inserted: boolean) => {
    if (!options.keptPredicates.has(statement.predicate)) {
      ignored += 1;
      return;
    }
    const key = statementKey(statement);
    changes.delete(key);
    changes.set(key, { inserted, statement });
    if (index === undefined || !wherePredicates.has(statement.predicate)) return;
    if (inserted) index.add(statement);
    else index.remove(statement);
  };
  let refusal: InputError | undefined;
  edit.operations.forEach((operation, operationIndex) => {
    if (refusal !== undefined) return;
    const instantiate = (triple: PlacedTriple, solution: Solution, solutionIndex: number) =>
      statementOf(triple, solution, { operation, file: edit.file, blankPrefix: `${options.blankNodePrefix}${operationIndex + 1}.${solutionIndex}.` });
    const { kind } = operation.written;
    if (kind === 'INSERT DATA' || kind === 'DELETE DATA') {
      const triples = kind === 'INSERT DATA' ? operation.written.insert : operation.written.delete;
      for (const triple of triples) {
        const statement = instantiate(triple, new Map(), 0);
        if (statement !== undefined) change(statement, kind === 'INSERT DATA');
      }
      return;
    }
    index ??= indexOf(options.sources, changes, wherePredicates);
    let solutions: Solution[];
    try {
      solutions = evaluateWhere(operation.where, index, operation.dataset);
    } catch (error) {
      if (!(error instanceof UnevaluatedFilter)) throw error;
      const { line, column, name } = operation.written;
      refusal = {
        file: edit.file,
        line,
        column,
        message: `${name} (line ${line}) has a FILTER that needs ${error.message}, which isapart does not evaluate`,
        hint: FILTER_HINT,
      };
      return;
    }
    const deletions: Statement[] = [];
    const insertions: Statement[] = [];
    solutions.forEach((solution, solutionIndex) => {
      for (const triple of operation.written.delete) {
        const statement = instantiate(triple, solution, solutionIndex);
        if (statement !== undefined) deletions.push(statement);
      }
      for (const triple of operation.written.insert) {
        const statement = instantiate(triple, solution, solutionIndex);
        if (statement !== undefined) insertions.push(statement);
      }
    });
    for (const statement of deletions) change(statement, false);
    for (const statement of insertions) change(statement, true);
  });
  if (refusal !== undefined) return { error: refusal };
  const added: Statement[] = [];
  const removed: Statement[] = [];
  for (const { inserted, statement } of changes.values()) (inserted ? added : removed).push(statement);
  return { file: edit.file, added, removed, ignored };
}

/** The loaded statements with the changes so far applied. */
function indexOf(sources: readonly LoadedSource[], changes: Map<string, { inserted: boolean; statement: Statement }>, predicates: ReadonlySet<string>): StatementIndex {
  const index = new StatementIndex();
  for (const source of sources) for (const statement of source.statements) if (predicates.has(statement.predicate)) index.add(statement);
  for (const { inserted, statement } of changes.values()) {
    if (!predicates.has(statement.predicate)) continue;
    if (inserted) index.add(statement);
    else index.remove(statement);
  }
  return index;
}

/**
 * A template triple with the solution's values, placed at the triple's line in the edit; undefined
 * when a variable is unbound or the result is no RDF triple (SPARQL 1.1 Update §3.1.3 leaves such
 * template instances out).
 */
function statementOf(
  triple: PlacedTriple,
  solution: Solution,
  context: { operation: EditOperation; file: string; blankPrefix: string },
): Statement | undefined {
  const value = (term: TemplateTerm): BoundTerm | undefined => {
    switch (term.kind) {
      case 'iri':
        return term.value;
      case 'literal':
        return term.literal;
      case 'blank':
        return `_:${context.blankPrefix}${term.label}`;
      case 'variable':
        return solution.get(term.name);
    }
  };
  const subject = value(triple.subject);
  const predicate = value(triple.predicate);
  const object = value(triple.object);
  const graph = triple.graph === undefined ? context.operation.withGraph : value(triple.graph);
  if (typeof subject !== 'string' || typeof predicate !== 'string' || predicate.startsWith('_:') || object === undefined) return undefined;
  if (typeof graph !== 'string' || graph.startsWith('_:')) return undefined;
  return {
    subject,
    predicate,
    object,
    graph,
    position: { file: context.file, line: triple.line, column: triple.column },
    objectLine: triple.objectLine,
  };
}

/** The predicates the triple patterns of a WHERE name, in groups, GRAPH blocks and FILTER EXISTS alike (checked to be IRIs before evaluation). */
function patternPredicates(value: unknown): string[] {
  if (Array.isArray(value)) return value.flatMap(patternPredicates);
  if (typeof value !== 'object' || value === null || 'termType' in value) return [];
  const pattern = value as { type?: string; triples?: { predicate: { termType?: string; value: string } }[] };
  const own = pattern.type === 'bgp' ? (pattern.triples ?? []).flatMap((triple) => (triple.predicate.termType === 'NamedNode' ? [triple.predicate.value] : [])) : [];
  return [...own, ...Object.values(value).flatMap(patternPredicates)];
}
