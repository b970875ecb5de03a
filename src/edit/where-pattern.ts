// The WHERE patterns an edit can evaluate (basic graph patterns, GRAPH, groups, VALUES and FILTER; W3C SPARQL 1.1 Query §18 for their algebra), and what it refuses.
import type * as Sparql from 'sparqljs';
import type { Literal } from '../load/statement.js';
import { boundKey, type BoundTerm, type StatementIndex } from './statement-index.js';
import { FILTER_HINT, filterKeeps, unsupportedFilter } from './where-filter.js';

/** One solution: variable name → bound value. */
export type Solution = Map<string, BoundTerm>;

/** The RDF dataset the WHERE reads (SPARQL 1.1 Update §3.1.3: WITH and USING). */
export interface WhereDataset {
  /** The graphs merged into the default graph: '' for the store's default graph. */
  defaultGraphs: string[];
  /** The named graphs GRAPH may read; undefined for every named graph of the store. */
  namedGraphs?: Set<string>;
}

/** Why a WHERE pattern cannot be evaluated here, with a hint. */
export interface Unsupported {
  reason: string;
  hint: string;
}

const SHAPE_HINT =
  'isapart evaluates WHERE patterns made of triple patterns with a fixed predicate, GRAPH blocks, nested groups, VALUES and FILTER tests; rewrite the operation as INSERT DATA / DELETE DATA (or split it), or list the statements in --add / --remove files';

/** The first feature of the patterns that is not evaluated here, or undefined when all are. */
export function unsupportedFeature(patterns: readonly Sparql.Pattern[], keptPredicates: ReadonlySet<string>): Unsupported | undefined {
  for (const pattern of patterns) {
    if ('queryType' in pattern) return { reason: 'a sub-query', hint: SHAPE_HINT };
    switch (pattern.type) {
      case 'bgp':
        for (const triple of pattern.triples) {
          const problem = unsupportedTriple(triple, keptPredicates);
          if (problem !== undefined) return problem;
        }
        break;
      case 'graph':
      case 'group': {
        const inner = unsupportedFeature(pattern.patterns, keptPredicates);
        if (inner !== undefined) return inner;
        if (pattern.type === 'graph' && pattern.name.termType === 'Variable' && filtersMention(pattern.patterns, pattern.name.value)) {
          // SPARQL 1.1 §18.6 binds ?g only after the block is evaluated, and engines differ on this.
          return {
            reason: `a FILTER inside GRAPH ?${pattern.name.value} that reads ?${pattern.name.value}`,
            hint: `SPARQL engines disagree on whether such a FILTER sees ?${pattern.name.value}; move the FILTER after the GRAPH block`,
          };
        }
        break;
      }
      case 'values':
        break;
      case 'filter': {
        const reason = unsupportedFilter(pattern.expression, (inner) => unsupportedFeature(inner, keptPredicates)?.reason);
        if (reason !== undefined) return { reason, hint: FILTER_HINT };
        break;
      }
      case 'service':
        return { reason: 'a SERVICE call (a query sent to another endpoint)', hint: 'isapart never reads the network while linting an edit; copy the statements it would read into a file and give it as a data path' };
      default:
        return { reason: `${pattern.type.toUpperCase()} in the WHERE pattern`, hint: SHAPE_HINT };
    }
  }
  return undefined;
}

/** Whether a FILTER among the patterns (in nested groups too) names the variable. */
function filtersMention(patterns: readonly Sparql.Pattern[], variable: string): boolean {
  return patterns.some((pattern) => {
    if ('queryType' in pattern) return false;
    if (pattern.type === 'filter') return mentions(pattern.expression, variable);
    return (pattern.type === 'group' || pattern.type === 'graph') && filtersMention(pattern.patterns, variable);
  });
}

/** Whether an expression (or a pattern inside EXISTS) names the variable anywhere. */
function mentions(value: unknown, variable: string): boolean {
  if (Array.isArray(value)) return value.some((item) => mentions(item, variable));
  if (typeof value !== 'object' || value === null) return false;
  const term = value as { termType?: string; value?: unknown };
  if (term.termType !== undefined) return term.termType === 'Variable' && term.value === variable;
  return Object.values(value).some((item) => mentions(item, variable));
}

function unsupportedTriple(triple: Sparql.Triple, keptPredicates: ReadonlySet<string>): Unsupported | undefined {
  const { subject, predicate, object } = triple;
  if (subject.termType === 'Quad' || object.termType === 'Quad') return { reason: 'an RDF-star quoted triple', hint: SHAPE_HINT };
  if ('type' in predicate) return { reason: 'a property path', hint: SHAPE_HINT };
  if (predicate.termType === 'Variable') {
    return {
      reason: `a variable predicate (?${predicate.value})`,
      hint: 'isapart keeps only the statements of the predicates the hierarchy reads, so a variable predicate would miss the others; name the predicate in each triple pattern',
    };
  }
  if (!keptPredicates.has(predicate.value)) {
    return {
      reason: `the predicate <${predicate.value}>, which plays no part in the hierarchy, so its statements are not read`,
      hint: 'a WHERE may read only role predicates (and rdf:type, owl:deprecated, labels and OWL list predicates); map the predicate to a role in isapart.yaml, or list the statements in --add / --remove files',
    };
  }
  return undefined;
}

/** The solutions of the patterns (a conjunction) over the index, extending each of `start`. */
export function evaluateWhere(patterns: readonly Sparql.Pattern[], index: StatementIndex, dataset: WhereDataset, start: Solution[] = [new Map()]): Solution[] {
  return evaluateGroup(patterns, { index, dataset, graph: undefined }, start);
}

interface Scope {
  index: StatementIndex;
  dataset: WhereDataset;
  /** The active graph: a named graph's IRI, or undefined for the default graph. */
  graph: string | undefined;
  /** Inside EXISTS: the outer solution's values stand in for its variables everywhere, FILTERs included (§18.6). */
  substituted?: boolean;
}

function evaluateGroup(patterns: readonly Sparql.Pattern[], scope: Scope, start: Solution[]): Solution[] {
  const filters = patterns.filter((pattern): pattern is Sparql.FilterPattern => !('queryType' in pattern) && pattern.type === 'filter');
  if (filters.length === 0) return extendByPatterns(patterns, scope, start);
  // A group's FILTERs see only the group's own solutions (SPARQL 1.1 Query §18.2.2), so the group is
  // evaluated on its own, filtered, and then joined with the solutions it extends.
  const exists = (inner: Sparql.Pattern[], solution: Solution) => evaluateGroup(inner, { ...scope, substituted: true }, [solution]).length > 0;
  const rest = patterns.filter((pattern) => !filters.includes(pattern as Sparql.FilterPattern));
  const keeps = (solution: Solution) => filters.every((filter) => filterKeeps(filter.expression, solution, exists));
  if (scope.substituted === true) return extendByPatterns(rest, scope, start).filter(keeps);
  const own = extendByPatterns(rest, scope, [new Map()]).filter(keeps);
  return start.flatMap((outer) => own.flatMap((inner) => joined(outer, inner) ?? []));
}

/** The merge of two compatible solutions (every shared variable has one value), or undefined. */
function joined(left: Solution, right: Solution): Solution | undefined {
  const merged = new Map(left);
  for (const [name, value] of right) {
    const earlier = merged.get(name);
    if (earlier === undefined) merged.set(name, value);
    else if (boundKey(earlier) !== boundKey(value)) return undefined;
  }
  return merged;
}

/** The solutions extending each of `start` by the patterns, in order (no FILTER among them). */
function extendByPatterns(patterns: readonly Sparql.Pattern[], scope: Scope, start: Solution[]): Solution[] {
  let solutions = start;
  for (const pattern of patterns) {
    if ('queryType' in pattern) throw new Error('sub-queries are refused before evaluation');
    switch (pattern.type) {
      case 'bgp':
        for (const triple of pattern.triples) solutions = solutions.flatMap((solution) => matchTriple(triple, scope, solution));
        break;
      case 'group':
        solutions = evaluateGroup(pattern.patterns, scope, solutions);
        break;
      case 'graph':
        solutions = solutions.flatMap((solution) => evaluateGraph(pattern, scope, solution));
        break;
      case 'values':
        solutions = solutions.flatMap((solution) => joinValues(pattern, solution));
        break;
      default:
        throw new Error(`${pattern.type} patterns are refused before evaluation`);
    }
  }
  return solutions;
}

// SPARQL 1.1 Query §18.5: GRAPH ?g evaluates its group in each named graph, then binds ?g; a FILTER
// inside the group therefore does not see ?g, which evaluateGroup's own evaluation keeps.
function evaluateGraph(pattern: Sparql.GraphPattern, scope: Scope, solution: Solution): Solution[] {
  const named = scope.dataset.namedGraphs ?? scope.index.namedGraphs();
  if (pattern.name.termType === 'NamedNode') {
    if (!named.has(pattern.name.value)) return [];
    return evaluateGroup(pattern.patterns, { ...scope, graph: pattern.name.value }, [solution]);
  }
  const variable = pattern.name.value;
  const bound = solution.get(variable);
  const graphs = bound === undefined ? [...named] : typeof bound === 'string' && named.has(bound) ? [bound] : [];
  return graphs.flatMap((graph) => {
    const withGraph = new Map(solution).set(variable, graph);
    return evaluateGroup(pattern.patterns, { ...scope, graph }, [withGraph]);
  });
}

function joinValues(pattern: Sparql.ValuesPattern, solution: Solution): Solution[] {
  const joined: Solution[] = [];
  for (const row of pattern.values) {
    const extended = new Map(solution);
    let compatible = true;
    for (const [name, term] of Object.entries(row)) {
      if (term === undefined) continue;
      const value = boundTermOf(term);
      const variable = name.slice(1);
      const earlier = extended.get(variable);
      if (earlier === undefined) extended.set(variable, value);
      else if (boundKey(earlier) !== boundKey(value)) compatible = false;
    }
    if (compatible) joined.push(extended);
  }
  return joined;
}

/** The solutions extending one solution by the statements a triple pattern matches in the active graph. */
function matchTriple(triple: Sparql.Triple, scope: Scope, solution: Solution): Solution[] {
  const subject = patternSlot(triple.subject as Sparql.Term, solution);
  const object = patternSlot(triple.object, solution);
  const predicate = (triple.predicate as Sparql.IriTerm).value;
  const graphs = scope.graph !== undefined ? [scope.graph] : scope.dataset.defaultGraphs;
  const matched: Solution[] = [];
  // The default graph is the merge of its graphs: one triple stated in two of them matches once.
  const seen = graphs.length > 1 ? new Set<string>() : undefined;
  for (const graph of graphs) {
    for (const statement of scope.index.match({ predicate, subject: subject.value as string | undefined, object: object.value, graph })) {
      if (seen !== undefined) {
        const key = `${statement.subject}\u0000${boundKey(statement.object)}`;
        if (seen.has(key)) continue;
        seen.add(key);
      }
      const extended = new Map(solution);
      if (!bind(extended, subject.variable, statement.subject) || !bind(extended, object.variable, statement.object)) continue;
      matched.push(extended);
    }
  }
  return matched;
}

/** A pattern position: a known value, or a variable still to bind. Blank nodes in a WHERE act as variables (SPARQL 1.1 Query §4.1.4). */
function patternSlot(term: Sparql.Term, solution: Solution): { value?: BoundTerm; variable?: string } {
  if (term.termType === 'Variable' || term.termType === 'BlankNode') {
    const name = term.termType === 'Variable' ? term.value : `_:${term.value}`;
    const value = solution.get(name);
    return value === undefined ? { variable: name } : { value };
  }
  return { value: boundTermOf(term) };
}

// The same variable in subject and object position must take one value.
function bind(solution: Solution, variable: string | undefined, value: BoundTerm): boolean {
  if (variable === undefined) return true;
  const earlier = solution.get(variable);
  if (earlier === undefined) {
    solution.set(variable, value);
    return true;
  }
  return boundKey(earlier) === boundKey(value);
}

/** A constant RDF/JS term of sparqljs as a bound value. */
export function boundTermOf(term: Sparql.Term): BoundTerm {
  switch (term.termType) {
    case 'NamedNode':
      return term.value;
    case 'BlankNode':
      return `_:${term.value}`;
    case 'Literal':
      return literalOf(term);
    default:
      throw new Error(`a ${term.termType} is not a constant term`);
  }
}

function literalOf(term: Sparql.LiteralTerm): Literal {
  return { value: term.value, datatype: term.datatype.value, language: term.language };
}
