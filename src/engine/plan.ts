// Chooses the join order of a rule's match against one graph, greedily by estimated cost.
import type { HierarchyGraph, NodeKind } from '../graph/hierarchy-graph.js';
import { SYMMETRIC_ROLES } from '../roles/role.js';
import { singleSteps, type RoleStep } from './automaton.js';
import { CycleSource } from './cycle.js';
import { formatPath, type PathExpression } from './path.js';
import { PathSearch, type SearchArena } from './path-search.js';
import type { ProgramEntry, RuleProgram } from './program.js';

/** One step of a plan; the evaluator runs them in order, backtracking over the bindings they make. */
export type PlanStep =
  /** Binds `slot` to each of `ids` (ascending) in turn: the start of a plan seeded by an edit's changed nodes. */
  | { kind: 'seed'; slot: number; ids: Int32Array }
  | { kind: 'is'; slot: number; nodeKind: NodeKind; generate: boolean }
  | { kind: 'differ'; left: number; right: number }
  | { kind: 'edge-check'; subject: number; object: number; steps: RoleStep[] }
  | { kind: 'path-check'; subject: number; object: number; search: PathSearch }
  /** Binds `free` to every node the search reaches from the node in `bound` (a reverse search for a bound object). */
  | { kind: 'expand'; bound: number; free: number; search: PathSearch }
  | { kind: 'generate'; subject: number; object: number; search: PathSearch; steps: RoleStep[] | undefined }
  | { kind: 'anti-join'; steps: PlanStep[] }
  | { kind: 'absent'; slot: number; search: PathSearch }
  /** One binding per cyclic component; with `only`, just the components that hold one of those nodes. */
  | { kind: 'cycle'; slot: number; source: CycleSource; only?: Int32Array };

/** A slot a seeded plan binds first: a node slot to each of some ids, or a member-list slot to the components holding them. */
export interface PlanSeed {
  slot: number;
  list: boolean;
  ids: Int32Array;
}

/** A rule planned against one graph: its steps, and the searches that give the evidence of each positive path entry. */
export interface RulePlan {
  program: RuleProgram;
  steps: PlanStep[];
  /** Per entry of `program.match`: its forward search (path entries) or cycle source (cycle entries). */
  evidence: (PathSearch | CycleSource | undefined)[];
}

/** The graph and scratch space plans are made for, with one search per distinct path (shared memo). */
export class PlanContext {
  private readonly searches = new Map<string, PathSearch>();
  private readonly cycles = new Map<string, CycleSource>();

  constructor(
    readonly graph: HierarchyGraph,
    readonly arena: SearchArena,
  ) {}

  /** The search of a path, shared by every entry with the same path. */
  search(path: PathExpression): PathSearch {
    const key = formatPath(path);
    let found = this.searches.get(key);
    if (found === undefined) {
      found = new PathSearch(this.graph, path, this.arena);
      this.searches.set(key, found);
    }
    return found;
  }

  /** The cycle components of a path, shared by every entry with the same path. */
  cycleSource(path: PathExpression): CycleSource {
    const key = formatPath(path);
    let found = this.cycles.get(key);
    if (found === undefined) {
      found = new CycleSource(this.graph, path, this.arena);
      this.cycles.set(key, found);
    }
    return found;
  }
}

/** Cost of a search whose walks have no length bound, relative to one edge lookup (common practice: pessimistic). */
const UNBOUNDED_FACTOR = 24;

interface Candidate {
  cost: number;
  generator: boolean;
  build(): PlanStep;
  binds: number[];
}

/**
 * Plans a compiled rule: top-level entries with nothing bound (or only the seeds' slots); every
 * reported variable must end up bound.
 */
export function planRule(program: RuleProgram, context: PlanContext, seeds: readonly PlanSeed[] = []): RulePlan {
  const bound = new Set<number>();
  const steps = planConjunction(program.match, context, seeds, positiveSlots(program.match), bound);
  const messageReferences = program.message.filter((part) => typeof part !== 'string');
  for (const reference of [program.focus, ...program.nodes, ...messageReferences]) {
    if (!reference.list && !bound.has(reference.slot)) throw new Error('a reported variable is bound only inside not or absent');
  }
  for (const pattern of program.remove) {
    if (!bound.has(pattern.subject) || !bound.has(pattern.object)) throw new Error('a fix variable is bound only inside not or absent');
  }
  const evidence = program.match.map((entry) => {
    if (entry.type === 'path') return context.search(entry.path);
    if (entry.type === 'cycle') return context.cycleSource(entry.path);
    return undefined;
  });
  return { program, steps, evidence };
}

/**
 * Plans a conjunction with the seeds' node slots bound first (a seed step each) and each seeded
 * member-list slot's cycle entry limited to the components holding its ids.
 */
export function planConjunction(
  entries: ProgramEntry[],
  context: PlanContext,
  seeds: readonly PlanSeed[],
  outer = positiveSlots(entries),
  bound = new Set<number>(),
): PlanStep[] {
  const steps: PlanStep[] = [];
  const listSeeds = new Map<number, Int32Array>();
  for (const seed of seeds) {
    if (seed.list) {
      listSeeds.set(seed.slot, seed.ids);
    } else {
      steps.push({ kind: 'seed', slot: seed.slot, ids: seed.ids });
      bound.add(seed.slot);
    }
  }
  return [...steps, ...planEntries(entries, bound, outer, context, listSeeds)];
}

/** Node slots that a conjunction binds by its positive entries (paths and `is`). */
export function positiveSlots(entries: ProgramEntry[]): Set<number> {
  const slots = new Set<number>();
  for (const entry of entries) {
    if (entry.type === 'path') slots.add(entry.subject).add(entry.object);
    if (entry.type === 'is') slots.add(entry.slot);
  }
  return slots;
}

/** Node slots named anywhere inside entries (including nested `not`). */
export function mentionedSlots(entries: ProgramEntry[], into = new Set<number>()): Set<number> {
  for (const entry of entries) {
    if (entry.type === 'path') into.add(entry.subject).add(entry.object);
    else if (entry.type === 'is' || entry.type === 'absent') into.add(entry.slot);
    else if (entry.type === 'differ') into.add(entry.left).add(entry.right);
    else if (entry.type === 'not') mentionedSlots(entry.entries, into);
  }
  return into;
}

/**
 * Greedy ordering: among the entries that can run with the current bindings, the cheapest; filters
 * cost nearly nothing so they run as soon as their variables are bound; generators (entries with no
 * bound variable) only when nothing else can run. `outer` are the slots bound by enclosing conjunctions.
 */
function planEntries(
  entries: ProgramEntry[],
  bound: Set<number>,
  outer: Set<number>,
  context: PlanContext,
  listSeeds: ReadonlyMap<number, Int32Array> = new Map(),
): PlanStep[] {
  const remaining = entries.map((entry, index) => ({ entry, index }));
  const steps: PlanStep[] = [];
  const available = new Set([...outer, ...positiveSlots(entries)]);
  while (remaining.length > 0) {
    let best: { candidate: Candidate; position: number } | undefined;
    remaining.forEach(({ entry }, position) => {
      const candidate = candidateFor(entry, bound, available, context, listSeeds);
      if (candidate === undefined) return;
      if (
        best === undefined ||
        (best.candidate.generator && !candidate.generator) ||
        (best.candidate.generator === candidate.generator && candidate.cost < best.candidate.cost)
      ) {
        best = { candidate, position };
      }
    });
    if (best === undefined) throw new Error('an entry of match uses a variable that no positive entry binds');
    const chosen: { candidate: Candidate; position: number } = best;
    steps.push(chosen.candidate.build());
    for (const slot of chosen.candidate.binds) bound.add(slot);
    remaining.splice(chosen.position, 1);
  }
  return steps;
}

/** How an entry would run with the current bindings, or undefined when it cannot run yet. */
function candidateFor(
  entry: ProgramEntry,
  bound: Set<number>,
  available: Set<number>,
  context: PlanContext,
  listSeeds: ReadonlyMap<number, Int32Array>,
): Candidate | undefined {
  const graph = context.graph;
  switch (entry.type) {
    case 'is':
      if (bound.has(entry.slot)) {
        return { cost: 0, generator: false, binds: [], build: () => ({ kind: 'is', slot: entry.slot, nodeKind: entry.kind, generate: false }) };
      }
      return { cost: graph.nodeCount, generator: true, binds: [entry.slot], build: () => ({ kind: 'is', slot: entry.slot, nodeKind: entry.kind, generate: true }) };
    case 'differ':
      if (!bound.has(entry.left) || !bound.has(entry.right)) return undefined;
      return { cost: 0, generator: false, binds: [], build: () => ({ kind: 'differ', left: entry.left, right: entry.right }) };
    case 'absent':
      if (!bound.has(entry.slot)) return undefined;
      return {
        cost: searchCost(entry.path, graph),
        generator: false,
        binds: [],
        build: () => ({ kind: 'absent', slot: entry.slot, search: context.search(entry.path) }),
      };
    case 'not': {
      const shared = [...mentionedSlots(entry.entries)].filter((slot) => available.has(slot));
      if (shared.some((slot) => !bound.has(slot))) return undefined;
      const inner = planEntries(entry.entries, new Set(shared), available, context);
      return { cost: planCost(inner, graph), generator: false, binds: [], build: () => ({ kind: 'anti-join', steps: inner }) };
    }
    case 'cycle': {
      const only = listSeeds.get(entry.members);
      if (only !== undefined) {
        // Seeded: few components, so it runs before any generator.
        return { cost: only.length, generator: false, binds: [], build: () => ({ kind: 'cycle', slot: entry.members, source: context.cycleSource(entry.path), only }) };
      }
      return { cost: 1, generator: true, binds: [], build: () => ({ kind: 'cycle', slot: entry.members, source: context.cycleSource(entry.path) }) };
    }
    case 'path':
      return pathCandidate(entry, bound, context);
  }
}

function pathCandidate(entry: Extract<ProgramEntry, { type: 'path' }>, bound: Set<number>, context: PlanContext): Candidate {
  const graph = context.graph;
  const { subject, object, path } = entry;
  const steps = singleSteps(path);
  const subjectBound = bound.has(subject);
  const objectBound = bound.has(object);
  if (subjectBound && objectBound) {
    if (steps !== undefined) return { cost: 0.5, generator: false, binds: [], build: () => ({ kind: 'edge-check', subject, object, steps }) };
    return {
      cost: checkCost(subject, object, path, graph),
      generator: false,
      binds: [],
      build: () => ({ kind: 'path-check', subject, object, search: context.search(path) }),
    };
  }
  if (subjectBound || objectBound) {
    // Average degree is the same both ways, so one estimate serves either direction.
    const fanOut = estimateFanOut(path, graph);
    return {
      cost: fanOut,
      generator: false,
      binds: [subjectBound ? object : subject],
      build: () => {
        const search = context.search(path);
        return subjectBound
          ? { kind: 'expand', bound: subject, free: object, search }
          : { kind: 'expand', bound: object, free: subject, search: search.reverse() };
      },
    };
  }
  const cost = steps !== undefined ? steps.reduce((sum, step) => sum + edgeCount(graph, step.role), 0) : graph.nodeCount * (1 + estimateFanOut(path, graph));
  return {
    cost,
    generator: true,
    binds: subject === object ? [subject] : [subject, object],
    build: () => ({ kind: 'generate', subject, object, search: context.search(path), steps }),
  };
}

/** Rough work of checking a path between two bound nodes; `[?a, X+, ?a]` is read from cyclic components. */
function checkCost(subject: number, object: number, path: PathExpression, graph: HierarchyGraph): number {
  const onCycle = subject === object && path.type === 'modified' && path.modifier === '+' && singleSteps(path.path) !== undefined;
  return onCycle ? 0.5 : searchCost(path, graph);
}

/** Rough work of one search of a path from a bound node. */
function searchCost(path: PathExpression, graph: HierarchyGraph): number {
  return 1 + estimateFanOut(path, graph);
}

/** A rough cost of a whole (inner) plan: the sum of its steps' costs, expansions multiplying what follows. */
function planCost(steps: PlanStep[], graph: HierarchyGraph): number {
  let rows = 1;
  let cost = 0;
  for (const step of steps) {
    if (step.kind === 'expand' || step.kind === 'generate' || (step.kind === 'is' && step.generate) || step.kind === 'cycle') {
      const fanOut = step.kind === 'expand' ? estimateFanOut(step.search.path, graph) : graph.nodeCount;
      cost += rows * (1 + fanOut);
      rows *= Math.max(1, fanOut);
    } else if (step.kind === 'seed') {
      rows *= Math.max(1, step.ids.length);
    } else if (step.kind === 'path-check') {
      cost += rows * checkCost(step.subject, step.object, step.search.path, graph);
    } else if (step.kind === 'absent') {
      cost += rows * searchCost(step.search.path, graph);
    } else if (step.kind === 'anti-join') {
      cost += rows * planCost(step.steps, graph);
    } else {
      cost += rows * 0.5;
    }
  }
  return cost;
}

/** Average edges per node of a role in one direction (symmetric roles store both directions). */
function averageDegree(graph: HierarchyGraph, role: RoleStep['role']): number {
  return edgeCount(graph, role) / Math.max(1, graph.nodeCount);
}

function edgeCount(graph: HierarchyGraph, role: RoleStep['role']): number {
  const edges = graph.stats.edges[role] ?? 0;
  return SYMMETRIC_ROLES.has(role) ? edges * 2 : edges;
}

/** Expected number of end nodes of a path from one node (also of start nodes from one end). */
export function estimateFanOut(path: PathExpression, graph: HierarchyGraph): number {
  switch (path.type) {
    case 'role':
      return averageDegree(graph, path.role);
    case 'inverse':
      return estimateFanOut(path.path, graph);
    case 'sequence':
      return path.steps.reduce((product, step) => product * estimateFanOut(step, graph), 1);
    case 'alternative':
      return path.options.reduce((sum, option) => sum + estimateFanOut(option, graph), 0);
    case 'modified': {
      const inner = estimateFanOut(path.path, graph);
      if (path.modifier === '?') return 1 + inner;
      const unbounded = Math.min(graph.nodeCount, 1 + UNBOUNDED_FACTOR * inner);
      return path.modifier === '*' ? 1 + unbounded : unbounded;
    }
  }
}
