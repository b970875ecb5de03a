// Re-runs rules after an edit around the changed nodes only, giving the findings a full run would.
import type { GraphChanges } from '../graph/apply-edit.js';
import { BuiltHierarchyGraph } from '../graph/built-graph.js';
import type { HierarchyGraph, NodeKind } from '../graph/hierarchy-graph.js';
import type { Statement } from '../load/statement.js';
import { ROLES, type Role } from '../roles/role.js';
import { BACKWARD, compileAutomaton, singleSteps } from './automaton.js';
import type { Finding, Level, RuleFailure } from './finding.js';
import { formatPath, type PathExpression } from './path.js';
import { PlanContext, mentionedSlots, planConjunction, planRule, positiveSlots, type PlanSeed } from './plan.js';
import { SearchArena } from './path-search.js';
import { compileRule, type ProgramEntry, type RuleProgram } from './program.js';
import { createBindings, evaluatePlan } from './evaluate.js';
import { compareFindings, findingsOf, messageFollowsNodes, planContextFor, runRules, type RuleToRun, type RunResult } from './run.js';

/*
 * Why the seeded re-run gives the findings of a full run (the argument, in short).
 *
 * A rule's solutions are bindings of its slots that satisfy every top-level entry. A binding that
 * is a solution on one graph and not on the other binds a node that only one graph has (an added
 * or vanished node: every positive entry's seed set holds those), or has some entry whose truth
 * differs between the graphs. Per entry, that can happen only here:
 * - `[?s, P, ?o]`: a walk of P from s to o exists in one graph only, so it steps over a changed
 *   edge; the walk's part before its first changed edge has unchanged edges only, which both graphs
 *   have, so s reaches that edge by P's automaton over the new graph's edges (s ∈ A_P), and
 *   symmetrically (the part after its last changed edge) o ∈ B_P. One of the two suffices.
 * - `{is: [?x, K]}`: x's K bit differs. The focus being in scope is such an entry too.
 * - `{absent: [?x, P]}`: the walks of P from x differ, so x ∈ A_P.
 * - `cycle` over X: a component whose members or walk differ holds a node whose X-steps differ (an
 *   end of a changed relation pair, A_X ∪ B_X), or is part of one that does in the other graph (a
 *   component that grows or splits); so the seeds are those nodes plus the members of the old and
 *   new components that hold them, and every component holding a seed is re-read.
 * - `{differ: ...}` never changes (ids are kept).
 * - `{not: D}`: for outer binding β, D has a solution τ ⊇ β in one graph only; τ is a changed
 *   solution of D, so by the same cases some inner entry seeds one of τ's slots. A seed on a slot
 *   bound outside D is used as it is; a seed on a slot of D's own is carried to a shared slot by
 *   evaluating D, with its `not`s and the filters on outer-only slots left out (a weaker
 *   conjunction, so every τ is among its solutions), from the seed on both graphs.
 * So seeded evaluation finds, on the new graph, every solution that is new and, on the old graph,
 * every one that is gone (when the rule had few findings, each of them is point-checked instead of
 * that second run, which decides it as well). A fingerprint neither finds has the same solutions on both graphs, so
 * its finding (and, since the kept message is the least one, its message) is the old one. A
 * fingerprint either finds is decided by a point check on the new graph (every reported slot seeded
 * with the finding's nodes), which enumerates all of its solutions there; when the message and focus
 * read only reported slots, a fingerprint found on the new graph needs none.
 * Where the argument does not reach, the rule is run in full: a cycle entry inside a `not`, a `not`
 * whose own seeds cannot be carried to a shared slot, and more than one member list among the
 * reported nodes.
 */

/** How many times the pairs of the object side's search the subject side's may visit before the object side is taken. */
const SUBJECT_SIDE_PREFERENCE = 2;

/**
 * The search behind A_P: breadth-first over (node, automaton state) pairs, backwards from the
 * changed edges, over the new graph's edges; resumable, so two can run in step.
 */
class SideSearch {
  private readonly states: number;
  /** Per state: the moves into it, as the state they leave and the new graph's neighbours that walk them back. */
  private readonly incoming: { from: number; neighbours: NeighbourColumns }[][];
  private readonly visited: Uint8Array;
  /** Visited pairs in the order they were queued; `head` is the next to expand. */
  private queue = new Int32Array(1024);
  private tail = 0;
  private head = 0;
  /** Per node, 1 once it is among the nodes found; the found nodes in the order found. */
  private readonly reached: Uint8Array;
  private readonly found: number[] = [];

  constructor(
    view: EditView,
    path: PathExpression,
    inverted: boolean,
    private readonly keep?: (id: number) => boolean,
  ) {
    const automaton = compileAutomaton(path, inverted);
    this.states = automaton.stateCount;
    this.visited = new Uint8Array(view.after.nodeCount * this.states);
    this.reached = new Uint8Array(view.after.nodeCount);
    this.incoming = Array.from({ length: this.states }, () => []);
    for (const id of view.existence) this.reach(id);
    for (let state = 0; state < this.states; state++) {
      for (let move = automaton.transitionStart[state]; move < automaton.transitionStart[state + 1]; move++) {
        const role = ROLES[automaton.transitionRole[move]];
        const backward = automaton.transitionDirection[move] === BACKWARD;
        // The walk came into a node over this move: from a predecessor for a forward step, a successor for a backward one.
        this.incoming[automaton.transitionTarget[move]].push({ from: state, neighbours: view.newNeighbours(role, backward) });
        // A walk at `state` that takes this move over a changed edge stands at the edge's start (its end, walked backwards).
        const edges = view.changes.edges[role];
        for (const list of [edges.added, edges.removed]) {
          for (const [from, to] of list) this.push(backward ? to : from, state);
        }
      }
    }
  }

  private reach(node: number): void {
    if (this.reached[node] === 1) return;
    this.reached[node] = 1;
    this.found.push(node);
  }

  private push(node: number, state: number): void {
    const pair = node * this.states + state;
    if (this.visited[pair] === 1) return;
    if (this.keep !== undefined && !this.keep(node)) return;
    this.visited[pair] = 1;
    if (this.tail === this.queue.length) {
      const grown = new Int32Array(this.queue.length * 2);
      grown.set(this.queue);
      this.queue = grown;
    }
    this.queue[this.tail++] = pair;
  }

  /** Visits up to `pairs` more pairs; true when the search is done. */
  advance(pairs: number): boolean {
    const states = this.states;
    const stop = this.head + pairs;
    while (this.head < this.tail && this.head < stop) {
      const pair = this.queue[this.head++];
      const node = Math.floor(pair / states);
      const state = pair - node * states;
      if (state === 0) this.reach(node);
      const moves = this.incoming[state];
      for (let move = 0; move < moves.length; move++) {
        const { from, neighbours } = moves[move];
        const { offsets, column } = neighbours;
        if (node + 1 >= offsets.length) continue;
        for (let index = offsets[node], end = offsets[node + 1]; index < end; index++) this.push(column[index], from);
      }
    }
    return this.head >= this.tail;
  }

  /** Pairs visited so far. */
  visitedPairs(): number {
    return this.head;
  }

  /** The nodes reached at the start state, ascending. */
  result(): Int32Array {
    return Int32Array.from(this.found).sort();
  }
}

/** A role's CSR columns in the direction a search walks it: offsets and the neighbours they index. */
interface NeighbourColumns {
  offsets: Int32Array;
  column: Int32Array;
}

/** A rule that the seeded re-run cannot cover, and why (the rule is then run in full). */
class NotSeedable extends Error {}

/** Seeds for one slot, before they are merged per slot. */
interface SlotSeed {
  slot: number;
  list: boolean;
  ids: Iterable<number>;
}

/** The two graphs of an edit and what changed between them, with the seed sets worked out once per path. */
class EditView {
  /** Nodes only one graph has. */
  readonly existence: number[];
  private readonly reach = new Map<string, Int32Array>();
  private readonly pathSides = new Map<string, { subject: boolean; ids: Int32Array }>();
  private readonly kindSets = new Map<NodeKind, Int32Array>();
  private readonly cycleSets = new Map<string, Int32Array>();

  /** The new graph's plan context: local, so seeded runs compute no whole-graph structure they have not earned. */
  private readonly afterContext: PlanContext;

  constructor(
    readonly before: HierarchyGraph,
    readonly after: HierarchyGraph,
    readonly changes: GraphChanges,
  ) {
    this.existence = [...changes.addedNodes, ...changes.vanishedNodes];
    this.afterContext = new PlanContext(after, new SearchArena(after.nodeCount, true));
  }

  /** The plan context of either graph (the old one's is shared with the run that made the old findings). */
  context(graph: HierarchyGraph): PlanContext {
    return graph === this.after ? this.afterContext : planContextFor(graph);
  }

  /**
   * A role's CSR columns in one direction on the new graph. A side search walks these only: the
   * edges before a walk's first changed edge (after its last, walking back) are in both graphs.
   */
  newNeighbours(role: Role, outgoing: boolean): NeighbourColumns {
    if (!(this.after instanceof BuiltHierarchyGraph)) throw new Error('an edit view needs built graphs');
    const adjacency = this.after.parts.adjacency[role];
    return outgoing ? { offsets: adjacency.offsets, column: adjacency.targets } : { offsets: adjacency.reverseOffsets, column: adjacency.reverseSources };
  }

  /** Whether a role has added or removed edges. */
  changed(role: Role): boolean {
    const edges = this.changes.edges[role];
    return edges.added.length > 0 || edges.removed.length > 0;
  }

  /**
   * A_P (inverted false): the nodes from which P's automaton, over the new graph's edges, reaches a
   * changed edge at a state that walks it; B_P is A of the inverted path. Nodes only one graph
   * has are included.
   */
  startSide(path: PathExpression, inverted: boolean): Int32Array {
    const key = `${inverted ? '^' : ''}${formatPath(path)}`;
    let found = this.reach.get(key);
    if (found === undefined) {
      const search = new SideSearch(this, path, inverted);
      search.advance(Infinity);
      found = search.result();
      this.reach.set(key, found);
    }
    return found;
  }

  /**
   * The seeds of a path entry: A_P on its subject or B_P on its object. Either covers the entry;
   * the subject side is preferred, since evaluation from it walks the path forward, which in a
   * hierarchy (edges point to the broader term) stays near the seeds. It is given up only when its
   * search visits many times the pairs the object side's does (a change near the top).
   */
  pathSeeds(path: PathExpression): { subject: boolean; ids: Int32Array } {
    const subjectKey = formatPath(path);
    let chosen = this.pathSides.get(subjectKey);
    if (chosen === undefined) {
      chosen = this.chooseSide(path);
      this.pathSides.set(subjectKey, chosen);
    }
    return chosen;
  }

  private chooseSide(path: PathExpression): { subject: boolean; ids: Int32Array } {
    const subjectKey = formatPath(path);
    const objectKey = `^${subjectKey}`;
    const known = this.reach.get(subjectKey);
    if (known !== undefined) return { subject: true, ids: known };
    const starts = new SideSearch(this, path, false);
    const ends = new SideSearch(this, path, true);
    const chunk = 4096;
    while (!starts.advance(SUBJECT_SIDE_PREFERENCE * chunk)) {
      if (ends.advance(chunk)) {
        const limit = SUBJECT_SIDE_PREFERENCE * ends.visitedPairs();
        if (starts.advance(limit - starts.visitedPairs())) break;
        const ids = ends.result();
        this.reach.set(objectKey, ids);
        return { subject: false, ids };
      }
    }
    const ids = starts.result();
    this.reach.set(subjectKey, ids);
    return { subject: true, ids };
  }

  /**
   * The seeds of `[?x, P, ?x]`: a closed walk of P from x that exists in one graph only steps over
   * a changed edge, so x reaches the edge (A_P) and is reached from it (B_P), and so does every
   * node of the walk. When P is X+ or X* with X single steps, A_P ∩ B_P is found by a backward
   * search from the changed edges kept inside B_P, not A_P in full; X* holds for every x anyway.
   * For X+ the entry's truth at x is whether x is on a cycle of X, which both graphs answer at
   * once from their components: only the nodes where it differs (and those one graph lacks) are kept.
   */
  closedWalkSeeds(path: PathExpression): Int32Array {
    const key = `closed ${formatPath(path)}`;
    let found = this.reach.get(key);
    if (found !== undefined) return found;
    if (path.type !== 'modified' || path.modifier === '?' || singleSteps(path.path) === undefined) {
      found = this.startSide(path, true);
    } else if (path.modifier === '*') {
      found = Int32Array.from(this.existence).sort();
    } else {
      const ends = new Set(this.startSide(path, true));
      const search = new SideSearch(this, path, false, (id) => ends.has(id));
      search.advance(Infinity);
      const existence = new Set(this.existence);
      const before = this.context(this.before).search(path);
      const after = this.context(this.after).search(path);
      found = search.result().filter((id) => existence.has(id) || before.holds(id, id) !== after.holds(id, id));
    }
    this.reach.set(key, found);
    return found;
  }

  /** Nodes whose kind bit differs between the graphs, and nodes only one graph has. */
  kindChanged(kind: NodeKind): Int32Array {
    let found = this.kindSets.get(kind);
    if (found === undefined) {
      const ids = new Set<number>(this.existence);
      for (const id of this.changes.kinds) {
        const had = id < this.before.nodeCount && this.before.is(kind, id);
        if (had !== this.after.is(kind, id)) ids.add(id);
      }
      found = Int32Array.from(ids).sort();
      this.kindSets.set(kind, found);
    }
    return found;
  }

  /** The seeds of a cycle entry: ends of changed relation pairs and in-scope changes, with the members of the old and new components that hold them. */
  cycleSeeds(path: PathExpression): Int32Array {
    const key = formatPath(path);
    let found = this.cycleSets.get(key);
    if (found !== undefined) return found;
    const base = path.type === 'modified' && path.modifier === '+' ? path.path : path;
    const ends = new Set<number>([...this.startSide(base, false), ...this.startSide(base, true), ...this.kindChanged('in-scope')]);
    const endIds = Int32Array.from(ends);
    const seeds = new Set<number>(ends);
    for (const graph of [this.before, this.after]) {
      const source = this.context(graph).cycleSource(path);
      for (const index of source.componentsHolding(endIds)) for (const member of source.memberIds(index)) seeds.add(member);
    }
    found = Int32Array.from(seeds).sort();
    this.cycleSets.set(key, found);
    return found;
  }
}

/** Seeds of a conjunction: every changed solution has one of its slots in one of these sets. */
function conjunctionSeeds(view: EditView, entries: ProgramEntry[], outer: Set<number>): SlotSeed[] {
  const available = new Set([...outer, ...positiveSlots(entries)]);
  const seeds: SlotSeed[] = [];
  for (const entry of entries) {
    switch (entry.type) {
      case 'path': {
        if (entry.subject === entry.object) {
          seeds.push({ slot: entry.subject, list: false, ids: view.closedWalkSeeds(entry.path) });
          break;
        }
        const { subject, ids } = view.pathSeeds(entry.path);
        seeds.push({ slot: subject ? entry.subject : entry.object, list: false, ids });
        break;
      }
      case 'is':
        seeds.push({ slot: entry.slot, list: false, ids: view.kindChanged(entry.kind) });
        break;
      case 'absent':
        seeds.push({ slot: entry.slot, list: false, ids: view.startSide(entry.path, false) });
        break;
      case 'differ':
        break;
      case 'cycle':
        seeds.push({ slot: entry.members, list: true, ids: view.cycleSeeds(entry.path) });
        break;
      case 'not':
        for (const seed of notSeeds(view, entry.entries, available)) seeds.push(seed);
        break;
    }
  }
  return seeds;
}

/** Seeds of a `not` block on the slots its conjunction shares with the enclosing one. */
function notSeeds(view: EditView, inner: ProgramEntry[], available: Set<number>): SlotSeed[] {
  const seeds: SlotSeed[] = [];
  const innerPositive = positiveSlots(inner);
  const shared = [...mentionedSlots(inner)].filter((slot) => available.has(slot));
  const target = shared.find((slot) => innerPositive.has(slot));
  for (const seed of conjunctionSeeds(view, inner, available)) {
    if (seed.list) throw new NotSeedable('a cycle entry inside not');
    if (available.has(seed.slot)) {
      seeds.push(seed);
      continue;
    }
    if (target === undefined) throw new NotSeedable('a not block whose shared variables none of its own entries bind');
    const ids = Int32Array.from(new Set(seed.ids)).sort();
    if (ids.length === 0) continue;
    // The weaker conjunction: no nested not, no filter on a slot it does not bind itself.
    const bindable = new Set([...innerPositive, seed.slot]);
    const relaxed = inner.filter((entry) => {
      if (entry.type === 'path' || entry.type === 'is') return true;
      if (entry.type === 'differ') return bindable.has(entry.left) && bindable.has(entry.right);
      if (entry.type === 'absent') return bindable.has(entry.slot);
      if (entry.type === 'cycle') throw new NotSeedable('a cycle entry inside not');
      return false;
    });
    const carried = new Set<number>();
    const slotCount = Math.max(...[...mentionedSlots(inner), seed.slot]) + 1;
    for (const graph of [view.before, view.after]) {
      const steps = planConjunction(relaxed, view.context(graph), [{ slot: seed.slot, list: false, ids }]);
      const bindings = createBindings(slotCount, 0);
      evaluatePlan(graph, steps, bindings, (solution) => {
        carried.add(solution.nodes[target]);
        return false;
      });
    }
    seeds.push({ slot: target, list: false, ids: carried });
  }
  return seeds;
}

/** The seeds of a rule merged per slot, empty sets left out. */
function ruleSeeds(view: EditView, program: RuleProgram): PlanSeed[] {
  const seeds = conjunctionSeeds(view, program.match, new Set());
  seeds.push({ slot: program.focus.slot, list: program.focus.list, ids: view.kindChanged('in-scope') });
  const merged = new Map<string, { slot: number; list: boolean; ids: Set<number> }>();
  for (const seed of seeds) {
    const key = `${seed.list} ${seed.slot}`;
    let entry = merged.get(key);
    if (entry === undefined) merged.set(key, (entry = { slot: seed.slot, list: seed.list, ids: new Set() }));
    for (const id of seed.ids) entry.ids.add(id);
  }
  return [...merged.values()]
    .filter((seed) => seed.ids.size > 0)
    .map((seed) => ({ slot: seed.slot, list: seed.list, ids: Int32Array.from(seed.ids).sort() }));
}

/** The finding of one fingerprint on the new graph, from every solution whose reported slots hold its nodes; undefined when it has none. */
function pointCheck(view: EditView, program: RuleProgram, level: Level, finding: Finding): Finding | undefined {
  const graph = view.after;
  const seeds: PlanSeed[] = [];
  const slotIds = new Map<number, number>();
  const listLength = finding.nodes.length - program.nodes.filter((reference) => !reference.list).length;
  let position = 0;
  for (const reference of program.nodes) {
    const terms = reference.list ? finding.nodes.slice(position, position + listLength) : [finding.nodes[position]];
    position += terms.length;
    const ids = terms.map((term) => graph.idOf(term));
    if (ids.some((id) => id < 0 || graph.vanished?.(id) === true)) return undefined;
    if (reference.list) seeds.push({ slot: reference.slot, list: true, ids: Int32Array.from(ids) });
    else if (!slotIds.has(reference.slot)) slotIds.set(reference.slot, ids[0]);
  }
  for (const [slot, id] of slotIds) {
    // An unordered pair's nodes are shown sorted, so either slot may hold either node.
    const pair = program.unordered.find(([left, right]) => left === slot || right === slot);
    const ids = pair === undefined ? [id] : [slotIds.get(pair[0]) ?? id, slotIds.get(pair[1]) ?? id];
    seeds.push({ slot, list: false, ids: Int32Array.from(new Set(ids)).sort() });
  }
  const plan = planRule(program, view.context(graph), seeds);
  return findingsOf(graph, plan, level).find((found) => found.fingerprint === finding.fingerprint);
}

/** Whether a kept finding's evidence names a removed statement or an edge whose statements changed. */
function staleEvidence(finding: Finding, removed: ReadonlySet<Statement>, restated: ReadonlySet<string>): boolean {
  const statements = [...finding.evidence, ...(finding.fix?.remove ?? [])];
  return statements.some(
    (statement) =>
      removed.has(statement) || (typeof statement.object === 'string' && restated.has(`${statement.subject} ${statement.object}`)),
  );
}

/** One rule re-run around the changes: its findings on the new graph. */
function rerunRule(view: EditView, program: RuleProgram, level: Level, earlier: Finding[], restated: ReadonlySet<string>): Finding[] {
  if (program.nodes.filter((reference) => reference.list).length > 1) throw new NotSeedable('more than one member list among the reported nodes');
  const seeds = ruleSeeds(view, program);
  const found = new Map<string, Finding>();
  const gone = new Map<string, Finding>();
  // Few old findings beside many seeds: a point check of each costs less than the seeded run on the old graph.
  const checkEveryEarlier = earlier.length <= seeds.reduce((sum, seed) => sum + seed.ids.length, 0);
  for (const seed of seeds) {
    for (const finding of findingsOf(view.after, planRule(program, view.context(view.after), [seed]), level)) {
      if (!found.has(finding.fingerprint)) found.set(finding.fingerprint, finding);
    }
    if (checkEveryEarlier) continue;
    for (const finding of findingsOf(view.before, planRule(program, view.context(view.before), [seed]), level)) {
      if (!gone.has(finding.fingerprint)) gone.set(finding.fingerprint, finding);
    }
  }
  if (checkEveryEarlier) for (const finding of earlier) if (!found.has(finding.fingerprint)) gone.set(finding.fingerprint, finding);
  const fixedMessage = messageFollowsNodes(program);
  const findings: Finding[] = [];
  for (const finding of earlier) {
    if (found.has(finding.fingerprint) || gone.has(finding.fingerprint)) continue;
    if (!staleEvidence(finding, view.changes.removedEvidence, restated)) findings.push(finding);
    else {
      const fresh = pointCheck(view, program, level, finding);
      if (fresh === undefined) throw new Error(`the finding ${finding.fingerprint} of ${program.rule.id} lost its solutions without a changed entry`);
      findings.push(fresh);
    }
  }
  for (const [fingerprint, finding] of found) {
    const settled = fixedMessage ? finding : pointCheck(view, program, level, finding);
    if (settled !== undefined) findings.push(settled);
    gone.delete(fingerprint);
  }
  for (const finding of gone.values()) {
    const still = pointCheck(view, program, level, finding);
    if (still !== undefined) findings.push(still);
  }
  return findings;
}

/** A re-run's result, with the rules that had to run in full and why. */
export interface IncrementalResult extends RunResult {
  fullRuns: { ruleId: string; reason: string }[];
}

/**
 * The findings of `runRules(after.graph, rules)`, computed from the findings before the edit by
 * re-evaluating each rule only around what the edit changed (see the argument above). Rules whose
 * entries read nothing that changed keep their findings; a rule that failed before, or whose
 * shape the seeded re-run does not cover, is run in full; a graph that was rebuilt rather than
 * patched (its ids differ) runs every rule in full. A rule that throws becomes a RuleFailure.
 */
export function rerunRules(
  before: { graph: HierarchyGraph; result: RunResult },
  after: { graph: HierarchyGraph; changes: GraphChanges },
  rules: RuleToRun[],
): IncrementalResult {
  const patched = before.graph instanceof BuiltHierarchyGraph && after.graph instanceof BuiltHierarchyGraph;
  if (after.changes.rebuilt || !patched) {
    const reason = after.changes.reason ?? (patched ? 'the graph was rebuilt' : 'the graphs were not made by buildHierarchyGraph and applyEditToGraph');
    return { ...runRules(after.graph, rules), fullRuns: rules.map(({ rule }) => ({ ruleId: rule.id, reason })) };
  }
  const view = new EditView(before.graph, after.graph, after.changes);
  const restated = new Set<string>();
  for (const role of ROLES) {
    for (const [from, to] of after.changes.edges[role].restated) restated.add(`${after.graph.term(from)} ${after.graph.term(to)}`);
  }
  const earlierByRule = new Map<string, Finding[]>();
  for (const finding of before.result.findings) {
    const list = earlierByRule.get(finding.ruleId);
    if (list === undefined) earlierByRule.set(finding.ruleId, [finding]);
    else list.push(finding);
  }
  const failedBefore = new Set(before.result.failures.map((failure) => failure.ruleId));
  const findings: Finding[] = [];
  const failures: RuleFailure[] = [];
  const fullRuns: IncrementalResult['fullRuns'] = [];
  for (const toRun of rules) {
    const { rule, level } = toRun;
    try {
      const program = compileRule(rule);
      let ruleFindings: Finding[];
      try {
        if (failedBefore.has(rule.id)) throw new NotSeedable('the rule failed before the edit');
        ruleFindings = rerunRule(view, program, level, earlierByRule.get(rule.id) ?? [], restated);
      } catch (error) {
        if (!(error instanceof NotSeedable)) throw error;
        fullRuns.push({ ruleId: rule.id, reason: error.message });
        ruleFindings = findingsOf(after.graph, planRule(program, planContextFor(after.graph)), level);
      }
      for (const finding of ruleFindings) findings.push(finding);
    } catch (error) {
      failures.push({ ruleId: rule.id, message: error instanceof Error ? error.message : String(error) });
    }
  }
  findings.sort(compareFindings);
  return { findings, failures, fullRuns };
}
