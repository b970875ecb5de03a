// Compiles a rule to one SPARQL 1.1 SELECT over the role predicates, for push-down to an endpoint.
import type { NodeKind } from '../graph/hierarchy-graph.js';
import { singleSteps } from './automaton.js';
import { matchesEmpty, parseValidPath, type PathExpression } from './path.js';
import type { MatchEntry, RuleDefinition, Variable } from './rule.js';
import { GraphTerms, VariableNames, type PushDownSetting } from './sparql-graph-terms.js';
import { pathPattern, propertyPath } from './sparql-path.js';
import { iriRef, PushDownError, variableRef } from './sparql-text.js';

export { PushDownError } from './sparql-text.js';
export type { PushDownSetting } from './sparql-graph-terms.js';

/** One rule as a SPARQL 1.1 SELECT; the variables it returns are named as in the rule. */
export interface PushDownQuery {
  ruleId: string;
  /** A SELECT DISTINCT query; see `pushDownVariables` for what each returned variable holds. */
  sparql: string;
}

/** The extra variables a cycle entry returns: each row is one edge `members → next` inside a cyclic component. */
export interface CycleVariables {
  /** The rule's member-list variable, here one member per row. */
  members: Variable;
  /** The member the edge leads to. */
  next: Variable;
  /** `true` when `members` is in scope (an xsd:boolean literal). */
  inScope: Variable;
}

/** What a push-down query of a rule returns: the rule's reported node variables, and per cycle entry its edge variables. */
export interface PushDownVariables {
  nodes: Variable[];
  cycles: CycleVariables[];
  /**
   * When the focus is one of an unordered pair, which of the pair ends up the focus is known only
   * after sorting, so the query returns an in-scope flag per variable of the pair (variable → flag
   * variable) instead of filtering; empty otherwise.
   */
  inScope: Map<Variable, Variable>;
}

const PLACEHOLDER = /\{([A-Za-z_][A-Za-z0-9_]*)\}/g;

/** Every variable a rule names, in match, report and fix. */
function ruleVariables(rule: RuleDefinition): Set<string> {
  const names = new Set<string>();
  const visit = (entries: MatchEntry[]): void => {
    for (const entry of entries) {
      if (entry.type === 'path') names.add(entry.subject).add(entry.object);
      else if (entry.type === 'is' || entry.type === 'absent') names.add(entry.variable);
      else if (entry.type === 'differ') names.add(entry.left).add(entry.right);
      else if (entry.type === 'cycle') names.add(entry.members);
      else visit(entry.entries);
    }
  };
  visit(rule.match);
  names.add(rule.report.focus);
  for (const variable of rule.report.nodes) names.add(variable);
  return names;
}

/** The variables a rule's push-down query returns; `findingsFromRows` reads rows by these names. */
export function pushDownVariables(rule: RuleDefinition): PushDownVariables {
  const taken = ruleVariables(rule);
  const unique = (base: string): string => {
    let name = base;
    while (taken.has(name)) name += '_';
    taken.add(name);
    return name;
  };
  const cycles = rule.match.flatMap((entry, index) =>
    entry.type === 'cycle' ? [{ members: entry.members, next: unique(`?_cycle${index}_next`), inScope: unique(`?_cycle${index}_in_scope`) }] : [],
  );
  const lists = new Set(cycles.map((cycle) => cycle.members));
  const reported = [rule.report.focus, ...rule.report.nodes, ...[...rule.report.message.matchAll(PLACEHOLDER)].map((found) => `?${found[1]}`)];
  const nodes = [...new Set(reported)].filter((variable) => !lists.has(variable));
  const inScope = new Map<Variable, Variable>();
  for (const pair of rule.report.unordered) {
    if (!pair.includes(rule.report.focus)) continue;
    for (const variable of pair) if (!inScope.has(variable)) inScope.set(variable, unique(`?_in_scope_${variable.slice(1)}`));
  }
  return { nodes, cycles, inScope };
}

/** Node variables bound by the positive entries (paths and `is`) of one conjunction. */
function positiveVariables(entries: MatchEntry[]): Set<Variable> {
  const bound = new Set<Variable>();
  for (const entry of entries) {
    if (entry.type === 'path') bound.add(entry.subject).add(entry.object);
    if (entry.type === 'is') bound.add(entry.variable);
  }
  return bound;
}

/** Compiles one conjunction; `outer` are the variables its enclosing conjunctions bind. */
class GroupCompiler {
  constructor(
    private readonly terms: GraphTerms,
    private readonly paths: Map<MatchEntry, PathExpression>,
  ) {}

  compile(entries: MatchEntry[], outer: ReadonlySet<Variable>, topLevel: boolean): string[] {
    const lines: string[] = [];
    const positive = positiveVariables(entries);
    const inPaths = new Set<Variable>(outer);
    for (const entry of entries) if (entry.type === 'path') inPaths.add(entry.subject).add(entry.object);
    const certified = this.certified(entries, outer);

    // Single-step entries first: they bind both ends, so no closure is evaluated with both ends
    // open (which some stores refuse, and which is slow everywhere). The order changes no solution.
    const single = (entry: MatchEntry): number => (entry.type === 'path' && singleSteps(this.path(entry)) !== undefined ? 0 : 1);
    // The path patterns so far, the variables they bind, and whether they bind them on their own.
    let prefix: string[] = [];
    const local = new Set<Variable>();
    let selfContained = true;
    for (const entry of [...entries].sort((left, right) => single(left) - single(right))) {
      if (entry.type === 'cycle') {
        if (!topLevel) throw new PushDownError('a cycle entry inside not cannot be pushed down', 'move the cycle entry to the top level of match');
      } else if (entry.type === 'path') {
        const subject = variableRef(entry.subject);
        const object = variableRef(entry.object);
        const subjectBound = outer.has(subject) || local.has(subject);
        const pattern = pathPattern(subject, this.path(entry), object, this.terms, subjectBound);
        const closure = singleSteps(this.path(entry)) === undefined;
        const fromPrefix = local.has(subject) || local.has(object);
        // A closure whose bound end comes from earlier patterns of the group joins their sub-SELECT:
        // Virtuoso 7.2 answers such a closure wrongly or not at all when it joins the patterns
        // themselves (alternatives, unions, other closures). The solutions are the same.
        // Variables of enclosing groups stay out of it (Virtuoso fails on them inside a sub-SELECT).
        const closed = [...local].every((variable) => !outer.has(variable));
        if (closure && fromPrefix && selfContained && closed && prefix.length > 0) prefix = [subSelect([...local], prefix)];
        if (closure && !fromPrefix) selfContained = false;
        prefix.push(pattern === undefined ? 'FILTER(false)' : `${pattern} .`);
        local.add(subject).add(object);
      }
    }
    lines.push(...prefix);
    const generated = new Set<Variable>();
    const kinds = entries.filter((entry): entry is Extract<MatchEntry, { type: 'is' }> => entry.type === 'is');
    // A variable bound only by `is` is generated by its most selective kind, in-scope last.
    const ordered = [...kinds.filter((entry) => entry.kind !== 'in-scope'), ...kinds.filter((entry) => entry.kind === 'in-scope')];
    for (const entry of ordered) {
      const variable = variableRef(entry.variable);
      if (inPaths.has(variable) || generated.has(variable)) {
        lines.push(`FILTER(${this.terms.kind(entry.kind as NodeKind, variable)})`);
      } else {
        generated.add(variable);
        lines.push(this.terms.kindGenerator(entry.kind as NodeKind, variable));
      }
    }
    // The node checks come after the kind filters, which are cheaper and more selective.
    for (const variable of positive) {
      if (outer.has(variable)) continue;
      if (inPaths.has(variable)) {
        lines.push(`FILTER(${this.terms.valid(variable)})`);
        if (!certified.has(variable)) lines.push(this.terms.nodeGenerator(variable));
      }
    }
    const bound = new Set([...outer, ...positive]);
    for (const entry of entries) {
      if (entry.type === 'differ') lines.push(`FILTER(!sameTerm(${variableRef(entry.left)}, ${variableRef(entry.right)}))`);
      else if (entry.type === 'absent') lines.push(...this.absent(entry));
      else if (entry.type === 'not') lines.push(this.not(entry.entries, bound));
    }
    return lines;
  }

  /** Variables known to be nodes: bound by a kind other than in-scope, or by a path whose other end is one (or that cannot be empty). */
  private certified(entries: MatchEntry[], outer: ReadonlySet<Variable>): Set<Variable> {
    const certified = new Set<Variable>(outer);
    for (const entry of entries) if (entry.type === 'is' && entry.kind !== 'in-scope') certified.add(entry.variable);
    let grew = true;
    while (grew) {
      grew = false;
      for (const entry of entries) {
        if (entry.type !== 'path') continue;
        const nonEmpty = !matchesEmpty(this.path(entry));
        const either = nonEmpty || certified.has(entry.subject) || certified.has(entry.object);
        if (!either) continue;
        for (const variable of [entry.subject, entry.object]) {
          if (!certified.has(variable)) {
            certified.add(variable);
            grew = true;
          }
        }
      }
    }
    return certified;
  }

  private absent(entry: Extract<MatchEntry, { type: 'absent' }>): string[] {
    const path = this.path(entry);
    // A path that can be empty reaches the node itself, so it is never absent.
    if (matchesEmpty(path)) return ['FILTER(false)'];
    const end = this.terms.names.fresh();
    const pattern = pathPattern(variableRef(entry.variable), path, end, this.terms);
    if (pattern === undefined) return [];
    return [`FILTER NOT EXISTS { ${pattern} . FILTER(${this.terms.valid(end)}) }`];
  }

  private not(entries: MatchEntry[], bound: ReadonlySet<Variable>): string {
    const onlyTests = entries.every(
      (entry) => (entry.type === 'is' && bound.has(entry.variable)) || (entry.type === 'differ' && bound.has(entry.left) && bound.has(entry.right)),
    );
    if (onlyTests) {
      const tests = entries.map((entry) => {
        if (entry.type === 'is') return this.terms.kind(entry.kind as NodeKind, variableRef(entry.variable));
        if (entry.type === 'differ') return `!sameTerm(${variableRef(entry.left)}, ${variableRef(entry.right)})`;
        throw new Error('only is and differ entries are tests');
      });
      return `FILTER(!(${tests.join(' && ')}))`;
    }
    const inner = this.compile(entries, bound, false);
    return `FILTER NOT EXISTS {\n${indent(inner, 1)}\n}`;
  }

  /** A cycle entry: one row per edge of the path's relation that lies on a cycle (`?m X ?next . ?next X* ?m`). */
  cycle(entry: Extract<MatchEntry, { type: 'cycle' }>, names: CycleVariables): string[] {
    const path = this.path(entry);
    const base = path.type === 'modified' && path.modifier === '+' ? path.path : path;
    const members = variableRef(names.members);
    const step = pathPattern(members, base, names.next, this.terms);
    const closure = propertyPath(base, this.terms);
    if (step === undefined || closure.kind !== 'path') return ['FILTER(false)'];
    return [
      `${step} .`,
      `${names.next} (${closure.text})* ${members} .`,
      `FILTER(${this.terms.valid(members)} && ${this.terms.valid(names.next)})`,
    ];
  }

  private path(entry: MatchEntry): PathExpression {
    const found = this.paths.get(entry);
    if (found !== undefined) return found;
    if (entry.type !== 'path' && entry.type !== 'absent' && entry.type !== 'cycle') throw new Error('only path, absent and cycle entries have a path');
    const parsed = parseValidPath(entry.path);
    this.paths.set(entry, parsed);
    return parsed;
  }
}

/** Patterns as `{ SELECT DISTINCT vars WHERE { ... } }`, to be joined with what follows. */
function subSelect(variables: Variable[], patterns: string[]): string {
  return `{ SELECT DISTINCT ${variables.join(' ')} WHERE {\n${indent(patterns, 1)}\n} }`;
}

function indent(lines: string[], depth: number): string {
  const pad = '  '.repeat(depth);
  return lines.map((line) => line.split('\n').map((part) => pad + part).join('\n')).join('\n');
}

/**
 * Compiles a rule to one SPARQL 1.1 SELECT DISTINCT over the role predicates of the setting: role
 * paths become property paths, `not` and `absent` FILTER NOT EXISTS, node kinds and scope FILTERs,
 * and a cycle entry the edges `?m X ?next . ?next X* ?m` that `findingsFromRows` groups into
 * components. The focus must be in scope, as in the in-memory run. Every IRI is validated and
 * written as `<IRI>`, every scope prefix as an escaped string; throws PushDownError for a value
 * that may not reach a query, or a rule this compiler cannot express.
 */
export function compileRuleToSparql(rule: RuleDefinition, setting: PushDownSetting): PushDownQuery {
  const variables = pushDownVariables(rule);
  const taken = ruleVariables(rule);
  for (const variable of taken) variableRef(variable);
  for (const cycle of variables.cycles) taken.add(cycle.next).add(cycle.inScope);
  for (const flag of variables.inScope.values()) taken.add(flag);
  const terms = new GraphTerms(setting, new VariableNames(taken));
  const group = new GroupCompiler(terms, new Map());
  const lines: string[] = [];
  let cycleIndex = 0;
  for (const entry of rule.match) if (entry.type === 'cycle') lines.push(...group.cycle(entry, variables.cycles[cycleIndex++]));
  const lists = new Set(variables.cycles.map((cycle) => cycle.members));
  const bound = new Set<Variable>(lists);
  lines.push(...group.compile(rule.match, bound, true));
  // Flags come last: their OPTIONAL must see every other pattern's bindings.
  for (const cycle of variables.cycles) lines.push(...terms.inScopeFlag(variableRef(cycle.members), cycle.inScope));
  for (const [variable, flag] of variables.inScope) lines.push(...terms.inScopeFlag(variableRef(variable), flag));
  if (!lists.has(rule.report.focus) && variables.inScope.size === 0) lines.push(`FILTER(${terms.kind('in-scope', variableRef(rule.report.focus))})`);
  const selected = [
    ...variables.nodes,
    ...variables.cycles.flatMap((cycle) => [cycle.members, cycle.next, cycle.inScope]),
    ...variables.inScope.values(),
  ];
  const from = setting.graph === undefined ? [] : [`FROM ${iriRef(setting.graph, 'graph')}`];
  const sparql = [
    `# isapart rule ${rule.id.replace(/[\r\n]/g, ' ')}, pushed down`,
    `SELECT DISTINCT ${selected.map(variableRef).join(' ')}`,
    ...from,
    'WHERE {',
    indent(lines, 1),
    '}',
    '',
  ].join('\n');
  return { ruleId: rule.id, sparql };
}
