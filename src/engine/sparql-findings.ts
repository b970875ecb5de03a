// Turns the rows of a pushed-down rule's SELECT into findings, as the in-memory run would make them.
import { endpointPosition } from '../load/endpoint-location.js';
import type { Finding, Level } from './finding.js';
import { fingerprintOf } from './fingerprint.js';
import type { RuleDefinition, Variable } from './rule.js';
import { pushDownVariables, type CycleVariables } from './sparql-compile.js';

/** One row of SPARQL 1.1 Query Results JSON Format (`results.bindings[i]`), by variable name without `?`. */
export type SparqlBinding = Record<string, { type: 'uri' | 'bnode' | 'literal'; value: string }>;

/** Rows that are not what the rule's query returns: a missing or mistyped variable. */
export class PushDownResultError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'PushDownResultError';
  }
}

/** The term of a bound variable as the graph writes it: the IRI, or `_:label` for a blank node. */
function termOf(row: SparqlBinding, variable: Variable): string {
  const bound = row[variable.slice(1)];
  if (bound === undefined) throw new PushDownResultError(`a result row has no value for ${variable}`);
  if (bound.type === 'uri') return bound.value;
  if (bound.type === 'bnode') return `_:${bound.value}`;
  throw new PushDownResultError(`${variable} is bound to the literal "${bound.value}", where a node was expected`);
}

/** An xsd:boolean result value. */
function booleanOf(row: SparqlBinding, variable: Variable): boolean {
  const bound = row[variable.slice(1)];
  if (bound === undefined || bound.type !== 'literal') throw new PushDownResultError(`a result row has no boolean for ${variable}`);
  if (bound.value === 'true' || bound.value === '1') return true;
  if (bound.value === 'false' || bound.value === '0') return false;
  throw new PushDownResultError(`${variable} is "${bound.value}", not a boolean`);
}

/** Without the graph's prefixes a node is shown as `<IRI>` or `_:label`. */
function displayName(term: string): string {
  return term.startsWith('_:') ? term : `<${term}>`;
}

function compareText(left: string, right: string): number {
  return left < right ? -1 : left > right ? 1 : 0;
}

/** One solution of the rule: a term per node variable and a member list per cycle members variable. */
interface Solution {
  nodes: Map<Variable, string>;
  lists: Map<Variable, string[]>;
}

/**
 * The findings of a rule from its push-down rows: the same focus, nodes (unordered pairs sorted),
 * fingerprint and level as the in-memory engine gives. Cycle rows (edges inside cyclic components)
 * are grouped into components and each one's members ordered along the shortest closed walk from
 * its in-scope member whose term sorts first, as src/engine/cycle.ts does. Evidence is empty (an
 * endpoint has no statement positions) and `location` names the endpoint and graph. Messages show
 * nodes as `<IRI>` (the endpoint has no prefixes); where several solutions share a fingerprint,
 * the one whose message terms sort first is kept, so a message may name another witness than the
 * in-memory run (which keeps the first in its evaluation order). Throws PushDownResultError on a
 * row that lacks a variable or binds a literal where a node belongs.
 */
export function findingsFromRows(rule: RuleDefinition, level: Level, rows: SparqlBinding[], location: { endpoint: string; graph?: string }): Finding[] {
  const variables = pushDownVariables(rule);
  const solutions = variables.cycles.length === 0 ? rows.map((row) => nodeSolution(row, variables.nodes)) : cycleSolutions(rows, variables.nodes, variables.cycles);
  const lists = new Set(variables.cycles.map((cycle) => cycle.members));
  const inScopeMembers = new Map<string, boolean>();
  for (const cycle of variables.cycles) for (const row of rows) inScopeMembers.set(termOf(row, cycle.members), booleanOf(row, cycle.inScope));
  const place = endpointPosition(location.endpoint, location.graph);
  const chosen = new Map<string, { finding: Finding; key: string }>();
  // Being in scope belongs to the term, so flags read before an unordered pair is sorted still hold after.
  const flags = new Map<string, boolean>();
  for (const [variable, flag] of variables.inScope) for (const row of rows) flags.set(termOf(row, variable), booleanOf(row, flag));
  for (const solution of solutions) {
    for (const [left, right] of rule.report.unordered) {
      const a = solution.nodes.get(left);
      const b = solution.nodes.get(right);
      if (a !== undefined && b !== undefined && a > b) {
        solution.nodes.set(left, b);
        solution.nodes.set(right, a);
      }
    }
    const members = (variable: Variable): string[] => {
      if (lists.has(variable)) return solution.lists.get(variable) ?? [];
      const term = solution.nodes.get(variable);
      if (term === undefined) throw new PushDownResultError(`a result row has no value for ${variable}`);
      return [term];
    };
    const focus = members(rule.report.focus)[0];
    // The query keeps only in-scope foci; a cycle's focus is its first member, in scope when any member is.
    if (lists.has(rule.report.focus) && inScopeMembers.get(focus) !== true) continue;
    if (variables.inScope.size > 0 && flags.get(focus) !== true) continue;
    // A cycle's members go in by term, as in the in-memory engine (src/engine/run.ts): the fingerprint is the walk's, whatever its start.
    const nodes = rule.report.nodes.flatMap((variable) => (lists.has(variable) ? [...members(variable)].sort(compareText) : members(variable)));
    const fingerprint = fingerprintOf(rule.id, nodes);
    const parts = rule.report.message.split(/(\{[A-Za-z_][A-Za-z0-9_]*\})/);
    const shown: string[] = [];
    const message = parts
      .map((part) => {
        const placeholder = /^\{([A-Za-z_][A-Za-z0-9_]*)\}$/.exec(part);
        if (placeholder === null) return part;
        const variable = `?${placeholder[1]}`;
        const terms = members(variable);
        shown.push(...terms);
        const names = terms.map(displayName);
        if (lists.has(variable) && names.length > 0) names.push(names[0]);
        return names.join(' → ');
      })
      .join('');
    const key = shown.join('\n');
    const earlier = chosen.get(fingerprint);
    if (earlier !== undefined && compareText(earlier.key, key) <= 0) continue;
    chosen.set(fingerprint, { finding: { ruleId: rule.id, level, focus, nodes, message, evidence: [], fingerprint, location: place }, key });
  }
  return [...chosen.values()].map((entry) => entry.finding).sort((left, right) => compareText(left.fingerprint, right.fingerprint));
}

function nodeSolution(row: SparqlBinding, variables: Variable[]): Solution {
  return { nodes: new Map(variables.map((variable) => [variable, termOf(row, variable)])), lists: new Map() };
}

/** Solutions of a rule with cycle entries: per binding of its other variables, every combination of components. */
function cycleSolutions(rows: SparqlBinding[], nodeVariables: Variable[], cycles: CycleVariables[]): Solution[] {
  const groups = new Map<string, { nodes: Map<Variable, string>; rows: SparqlBinding[] }>();
  for (const row of rows) {
    const nodes = new Map(nodeVariables.map((variable) => [variable, termOf(row, variable)]));
    const key = [...nodes.values()].join('\n');
    let group = groups.get(key);
    if (group === undefined) {
      group = { nodes, rows: [] };
      groups.set(key, group);
    }
    group.rows.push(row);
  }
  const solutions: Solution[] = [];
  for (const group of groups.values()) {
    let combinations: Map<Variable, string[]>[] = [new Map()];
    for (const cycle of cycles) {
      const components = cycleComponents(group.rows, cycle);
      combinations = combinations.flatMap((combination) => components.map((component) => new Map([...combination, [cycle.members, component]])));
    }
    for (const lists of combinations) solutions.push({ nodes: new Map(group.nodes), lists });
  }
  return solutions;
}

/**
 * The cyclic components of one cycle entry's edge rows, each as its ordered member list: every
 * returned edge lies on a cycle, so the components are the connected parts of the edges.
 */
export function cycleComponents(rows: SparqlBinding[], cycle: CycleVariables): string[][] {
  const successors = new Map<string, Set<string>>();
  const inScope = new Map<string, boolean>();
  const parent = new Map<string, string>();
  const find = (term: string): string => {
    let root = term;
    while (parent.get(root) !== root) root = parent.get(root) as string;
    for (let node = term; parent.get(node) !== root; ) {
      const next = parent.get(node) as string;
      parent.set(node, root);
      node = next;
    }
    return root;
  };
  for (const row of rows) {
    const from = termOf(row, cycle.members);
    const to = termOf(row, cycle.next);
    inScope.set(from, booleanOf(row, cycle.inScope));
    for (const term of [from, to]) if (!parent.has(term)) parent.set(term, term);
    let targets = successors.get(from);
    if (targets === undefined) successors.set(from, (targets = new Set()));
    targets.add(to);
    parent.set(find(from), find(to));
  }
  const byRoot = new Map<string, string[]>();
  for (const term of parent.keys()) {
    const root = find(term);
    const members = byRoot.get(root);
    if (members === undefined) byRoot.set(root, [term]);
    else members.push(term);
  }
  return [...byRoot.values()].map((members) => orderMembers(members.sort(compareText), successors, inScope));
}

/** Members along the shortest closed walk from the first in-scope member (successors taken in term order), then the rest by term. */
function orderMembers(members: string[], successors: Map<string, Set<string>>, inScope: Map<string, boolean>): string[] {
  const start = members.find((member) => inScope.get(member) === true) ?? members[0];
  const inComponent = new Set(members);
  const next = (term: string): string[] => [...(successors.get(term) ?? [])].filter((target) => inComponent.has(target)).sort(compareText);
  const walk = shortestClosedWalk(start, next);
  const onWalk = new Set(walk);
  return [...walk, ...members.filter((member) => !onWalk.has(member))];
}

/** The nodes of a shortest closed walk from start back to it, without the repeated start (breadth first, as src/graph/paths.ts). */
function shortestClosedWalk(start: string, next: (term: string) => string[]): string[] {
  const parents = new Map<string, string | undefined>();
  const queue: string[] = [];
  for (const target of next(start)) {
    if (target === start) return [start];
    if (parents.has(target)) continue;
    parents.set(target, undefined);
    queue.push(target);
  }
  for (let head = 0; head < queue.length; head++) {
    const node = queue[head];
    for (const target of next(node)) {
      if (target === start) {
        const path: string[] = [];
        for (let step: string | undefined = node; step !== undefined; step = parents.get(step)) path.push(step);
        return [start, ...path.reverse()];
      }
      if (parents.has(target)) continue;
      parents.set(target, node);
      queue.push(target);
    }
  }
  throw new PushDownResultError(`the cycle rows through ${start} do not close a walk back to it`);
}

