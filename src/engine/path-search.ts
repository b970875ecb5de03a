// Breadth-first evaluation of a compiled path over (node, state) pairs, with scratch arrays reused between calls.
import { ReachLabels } from '../graph/reach-labels.js';
import { cyclicComponents, stronglyConnected, type ComponentAssignment, type NeighbourColumns } from '../graph/scc.js';
import { BuiltHierarchyGraph } from '../graph/built-graph.js';
import type { HierarchyGraph } from '../graph/hierarchy-graph.js';
import { ROLES, type Role } from '../roles/role.js';
import { BACKWARD, FORWARD, compileAutomaton, singleSteps, type PathAutomaton, type RoleStep } from './automaton.js';
import { invertPath, type PathExpression } from './path.js';

/** One edge walked by a path, in the role's stored direction (so `graph.edgeStatements` finds it). */
export interface WalkedEdge {
  role: Role;
  from: number;
  to: number;
}

const NO_PARENT = -1;
const MAX_GENERATION = 0xffffffff;
/** How many end nodes one search may keep memoised before its memo is dropped and refilled. */
const MEMO_BUDGET = 1 << 20;
/**
 * Searches towards a known end must have visited this many pairs per graph node before the
 * reachability labels are built: a few checks keep to the component rank, which costs one pass.
 */
const LABELS_AFTER_WORK_PER_NODE = 2;

/**
 * Scratch space shared by every path search of one run: visit marks per (node, state) pair and per
 * node, stamped with a generation number so nothing is cleared between searches; parents and the
 * queue for witnesses; the strongly connected components of each union of steps some search used.
 * Searches never interleave (each call finishes before the next starts).
 */
export class SearchArena {
  private readonly stepComponentsMemo = new Map<string, ComponentAssignment>();
  private pairMarks = new Uint32Array(0);
  private pairGeneration = 0;
  private nodeMarks: Uint32Array;
  private nodeGeneration = 0;
  queue = new Int32Array(1024);
  parents = new Int32Array(0);
  parentMoves = new Int32Array(0);

  /**
   * `local`: the searches of a run that asks about a few nodes only (an edit's seeded re-run) do
   * not compute whole-graph structures (components, labels) up front, only once their work has
   * cost as much as building them.
   */
  constructor(
    readonly nodeCount: number,
    readonly local = false,
  ) {
    this.nodeMarks = new Uint32Array(nodeCount);
  }

  /** Starts a search over `pairCount` pairs: every pair and node counts as unvisited again. */
  begin(pairCount: number, withParents: boolean): void {
    if (this.pairMarks.length < pairCount) {
      this.pairMarks = new Uint32Array(pairCount);
      this.pairGeneration = 0;
    }
    if (withParents && this.parents.length < pairCount) {
      this.parents = new Int32Array(pairCount);
      this.parentMoves = new Int32Array(pairCount);
    }
    if (this.pairGeneration === MAX_GENERATION) {
      this.pairMarks.fill(0);
      this.pairGeneration = 0;
    }
    if (this.nodeGeneration === MAX_GENERATION) {
      this.nodeMarks.fill(0);
      this.nodeGeneration = 0;
    }
    this.pairGeneration++;
    this.nodeGeneration++;
  }

  /**
   * The strongly connected components over a union of single steps, computed once per run; the same
   * steps walked the other way have the same components, numbered in the opposite order.
   */
  stepComponents(graph: HierarchyGraph, steps: RoleStep[]): ComponentAssignment {
    const key = stepsKey(steps);
    let found = this.stepComponentsMemo.get(key);
    if (found !== undefined) return found;
    const flipped = steps.map(({ role, direction }) => ({ role, direction: direction === FORWARD ? BACKWARD : FORWARD }));
    const mirror = this.stepComponentsMemo.get(stepsKey(flipped));
    if (mirror !== undefined) {
      const last = mirror.count - 1;
      found = { component: mirror.component.map((index) => last - index), count: mirror.count };
    } else {
      found = stronglyConnected(graph.nodeCount, stepColumns(graph, steps) ?? stepSuccessors(graph, steps));
    }
    this.stepComponentsMemo.set(key, found);
    return found;
  }

  /** Marks a pair visited; false when it already was. */
  visitPair(pair: number): boolean {
    if (this.pairMarks[pair] === this.pairGeneration) return false;
    this.pairMarks[pair] = this.pairGeneration;
    return true;
  }

  /** Marks a node reached; false when it already was. */
  reachNode(node: number): boolean {
    if (this.nodeMarks[node] === this.nodeGeneration) return false;
    this.nodeMarks[node] = this.nodeGeneration;
    return true;
  }

  /** Puts a pair at a queue position, growing the queue when needed. */
  enqueue(position: number, pair: number): void {
    if (position >= this.queue.length) {
      const grown = new Int32Array(Math.max(this.queue.length * 2, position + 1));
      grown.set(this.queue);
      this.queue = grown;
    }
    this.queue[position] = pair;
  }
}

/** What a search does with each node it newly reaches in an accepting state; true stops the search. */
type ReachAction = (node: number, pair: number) => boolean;

/**
 * One path over one graph: `from(start)` the end nodes, `to(end)` the start nodes, `holds`,
 * `reachesAny` and `witness` (a shortest walk). Forward results are memoised per start node within
 * a bound; the full transitive closure is never materialised.
 */
export class PathSearch {
  readonly forward: PathAutomaton;
  private backwardSearch: PathSearch | undefined;
  private readonly memo = new Map<number, Int32Array>();
  private memoSize = 0;
  private askedOnce: Uint8Array | undefined;
  /** Per end node whose forward searches grew costly: the start nodes that reach it, ascending. */
  private readonly reachersMemo = new Map<number, Int32Array>();
  /** Per end node: the pairs that forward searches towards it have visited so far. */
  private workTowardEnd: Float64Array | undefined;
  /** The pairs the last `run` put on its queue. */
  private lastRunWork = 0;
  private cycleMembers: Uint8Array | undefined;
  private stepComponents: ComponentAssignment | undefined;
  private reachLabels: ReachLabels | undefined;
  /** The pairs visited so far by searches towards a known end (what the labels would have pruned). */
  private searchWork = 0;
  /** The single steps of `X` when the path is `X+` with X a union of single steps (cycle shortcut). */
  private readonly plusSteps: RoleStep[] | undefined;
  /** True when the path is `X+` or `X*` with X a union of single steps: between two different nodes it holds exactly when the steps connect them. */
  private readonly closureOfSteps: boolean;
  /** The role and direction when the path is one step (`part-of`, `^part-of`): read straight from the adjacency. */
  private readonly onlyStep: RoleStep | undefined;
  /** Per automaton move, on a built graph: the CSR offsets and neighbour column it walks, read in place rather than through a view per node. */
  private readonly moveOffsets: Int32Array[] | undefined;
  private readonly moveColumns: Int32Array[] | undefined;

  constructor(
    private readonly graph: HierarchyGraph,
    readonly path: PathExpression,
    private readonly arena: SearchArena,
    automaton?: PathAutomaton,
  ) {
    this.forward = automaton ?? compileAutomaton(path);
    this.plusSteps = path.type === 'modified' && path.modifier === '+' ? singleSteps(path.path) : undefined;
    this.closureOfSteps = path.type === 'modified' && path.modifier !== '?' && singleSteps(path.path) !== undefined;
    const steps = singleSteps(path);
    this.onlyStep = steps?.length === 1 ? steps[0] : undefined;
    if (graph instanceof BuiltHierarchyGraph) {
      const automaton = this.forward;
      this.moveOffsets = [];
      this.moveColumns = [];
      for (let move = 0; move < automaton.transitionRole.length; move++) {
        const adjacency = graph.parts.adjacency[ROLES[automaton.transitionRole[move]]];
        const backward = automaton.transitionDirection[move] === BACKWARD;
        this.moveOffsets.push(backward ? adjacency.reverseOffsets : adjacency.offsets);
        this.moveColumns.push(backward ? adjacency.reverseSources : adjacency.targets);
      }
    }
  }

  /** The end nodes of the path from a start node, ascending (may be shared with the memo: never modify it). */
  from(start: number): Int32Array {
    if (this.onlyStep !== undefined) {
      const { role, direction } = this.onlyStep;
      return direction === FORWARD ? this.graph.successors(role, start) : this.graph.predecessors(role, start);
    }
    const memoised = this.memo.get(start);
    if (memoised !== undefined) return memoised;
    const reached: number[] = [];
    this.run(start, false, (node) => {
      reached.push(node);
      return false;
    });
    const result = Int32Array.from(reached).sort();
    // Only a start asked about more than once is memoised, so one pass over every node keeps nothing.
    if (this.markAsked(start)) this.remember(start, result);
    return result;
  }

  /** The start nodes from which the path reaches an end node, ascending. */
  to(end: number): Int32Array {
    return this.reverse().from(end);
  }

  /** The search of the inverse path (walks from end nodes back to start nodes). */
  reverse(): PathSearch {
    this.backwardSearch ??= new PathSearch(this.graph, invertPath(this.path), this.arena, compileAutomaton(this.path, true));
    return this.backwardSearch;
  }

  /** Whether the path leads from start to end; stops as soon as end is reached. */
  holds(start: number, end: number): boolean {
    if (this.onlyStep !== undefined) return this.stepEdge(start, end) !== undefined;
    if (start === end && this.plusSteps !== undefined && !this.wholeGraphUnearned()) return this.onCycle(start);
    const memoised = this.memo.get(start);
    if (memoised !== undefined) return binarySearch(memoised, end);
    if (start !== end) {
      // Most questions on a large hierarchy are answered by the labels alone, without a search.
      const labels = this.labelsOnceEarned();
      if (labels === undefined && this.wholeGraphUnearned()) {
        // A local run: no component rank before the searches have earned it.
      } else if (labels === undefined) {
        const rank = this.components().component;
        if (rank[start] < rank[end]) return false;
      } else {
        if (!labels.mayReach(start, end)) return false;
        if (this.closureOfSteps && labels.surelyReaches(start, end)) return true;
      }
    }
    const reachers = this.reachersMemo.get(end);
    if (reachers !== undefined) return binarySearch(reachers, start);
    // An end whose forward searches have together visited as many pairs as the graph has nodes (a
    // rule's fixed class checked against many starts on a deep chain): one backward search, which
    // costs about that much once, answers every later start. Ends that the labels keep cheap never get here.
    const work = (this.workTowardEnd ??= new Float64Array(this.graph.nodeCount));
    if (work[end] >= this.graph.nodeCount) {
      const found = this.reverse().from(end);
      this.remember(end, found, this.reachersMemo);
      return binarySearch(found, start);
    }
    // No full closure here: an early exit, with the labels pruning what cannot reach end, stays cheap on deep chains.
    const reached = this.run(start, false, (node) => node === end, end);
    work[end] += this.lastRunWork;
    // A local run's searches back to their start earn the components that answer them at once.
    if (start === end && this.arena.local) this.searchWork += this.lastRunWork;
    return reached;
  }

  /** Whether the path leads from start to any node at all. */
  reachesAny(start: number): boolean {
    if (this.onlyStep !== undefined) return this.from(start).length > 0;
    const memoised = this.memo.get(start);
    if (memoised !== undefined) return memoised.length > 0;
    return this.run(start, false, () => true);
  }

  /** A shortest walk of the path from start to end as edges (empty for a zero-length match), or undefined. */
  witness(start: number, end: number): WalkedEdge[] | undefined {
    if (this.onlyStep !== undefined) {
      const edge = this.stepEdge(start, end);
      return edge === undefined ? undefined : [edge];
    }
    const automaton = this.forward;
    const states = automaton.stateCount;
    let found = NO_PARENT;
    this.run(
      start,
      true,
      (node, pair) => {
        if (node !== end) return false;
        found = pair;
        return true;
      },
      end,
    );
    if (found === NO_PARENT) return undefined;
    const edges: WalkedEdge[] = [];
    const { parents, parentMoves } = this.arena;
    for (let pair = found; parents[pair] !== NO_PARENT; pair = parents[pair]) {
      const move = parentMoves[pair];
      const node = Math.floor(pair / states);
      const previous = Math.floor(parents[pair] / states);
      const role = ROLES[automaton.transitionRole[move]];
      const forward = automaton.transitionDirection[move] === FORWARD;
      edges.push(forward ? { role, from: previous, to: node } : { role, from: node, to: previous });
    }
    return edges.reverse();
  }

  /** The stored edge behind a one-step path from start to end, if there is one. */
  private stepEdge(start: number, end: number): WalkedEdge | undefined {
    const { role, direction } = this.onlyStep as RoleStep;
    if (direction === FORWARD) return this.graph.hasEdge(role, start, end) ? { role, from: start, to: end } : undefined;
    return this.graph.hasEdge(role, end, start) ? { role, from: end, to: start } : undefined;
  }

  /** Whether a node reaches itself through `X+`, read from the cyclic components of X's edges. */
  private onCycle(node: number): boolean {
    if (this.cycleMembers === undefined) {
      const members = new Uint8Array(this.graph.nodeCount);
      const steps = this.plusSteps as RoleStep[];
      const successors = stepColumns(this.graph, steps) ?? stepSuccessors(this.graph, steps);
      const assignment = this.arena.stepComponents(this.graph, steps);
      for (const component of cyclicComponents(this.graph.nodeCount, successors, undefined, assignment)) {
        for (const member of component) members[member] = 1;
      }
      this.cycleMembers = members;
    }
    return this.cycleMembers[node] === 1;
  }

  /**
   * The strongly connected components over the steps the path uses (any role and direction of its
   * automaton), in Tarjan's order: a walk of the path from u can reach v only when those steps lead
   * from u to v, so only when component[u] >= component[v].
   */
  private components(): ComponentAssignment {
    this.stepComponents ??= this.arena.stepComponents(this.graph, this.pathSteps());
    return this.stepComponents;
  }

  /** The reachability labels of the same steps, once searches have cost more than building them would. */
  private labelsOnceEarned(): ReachLabels | undefined {
    if (this.reachLabels === undefined && this.searchWork >= LABELS_AFTER_WORK_PER_NODE * this.graph.nodeCount) {
      this.reachLabels = new ReachLabels(this.graph.nodeCount, stepSuccessors(this.graph, this.pathSteps()), this.components());
    }
    return this.reachLabels;
  }

  /** Every role and direction the path's automaton walks, once each. */
  private pathSteps(): RoleStep[] {
    const automaton = this.forward;
    const steps: RoleStep[] = [];
    for (let move = 0; move < automaton.transitionRole.length; move++) {
      const role = ROLES[automaton.transitionRole[move]];
      const direction = automaton.transitionDirection[move];
      if (!steps.some((step) => step.role === role && step.direction === direction)) steps.push({ role, direction });
    }
    return steps;
  }

  /**
   * Breadth-first search from (start, 0); calls `action` per newly reached accepting node until it
   * returns true. With a known `end`, nodes that cannot reach it (by the labels, or the component rank before them) are not entered.
   */
  private run(start: number, withParents: boolean, action: ReachAction, end = -1): boolean {
    const automaton = this.forward;
    const states = automaton.stateCount;
    const arena = this.arena;
    const graph = this.graph;
    const { moveOffsets, moveColumns } = this;
    const towardEnd = end >= 0 && start !== end;
    const labels = towardEnd ? this.labelsOnceEarned() : undefined;
    const rank = towardEnd && labels === undefined && !this.wholeGraphUnearned() ? this.components().component : undefined;
    const endRank = rank === undefined ? 0 : rank[end];
    this.lastRunWork = 0;
    if (labels !== undefined ? !labels.mayReach(start, end) : rank !== undefined && rank[start] < endRank) return false;
    arena.begin(this.graph.nodeCount * states, withParents);
    const first = start * states;
    arena.visitPair(first);
    if (withParents) arena.parents[first] = NO_PARENT;
    arena.enqueue(0, first);
    if (automaton.accepting[0] === 1 && arena.reachNode(start) && action(start, first)) return true;
    let head = 0;
    let tail = 1;
    while (head < tail) {
      const pair = arena.queue[head++];
      const node = Math.floor(pair / states);
      const state = pair - node * states;
      for (let move = automaton.transitionStart[state]; move < automaton.transitionStart[state + 1]; move++) {
        const target = automaton.transitionTarget[move];
        let neighbours: Int32Array;
        let first = 0;
        let stop: number;
        if (moveOffsets !== undefined && moveColumns !== undefined) {
          const offsets = moveOffsets[move];
          neighbours = moveColumns[move];
          // A patched graph keeps an unchanged role's offsets, which end before the nodes the edit added.
          if (node + 1 < offsets.length) {
            first = offsets[node];
            stop = offsets[node + 1];
          } else stop = 0;
        } else {
          const role = ROLES[automaton.transitionRole[move]];
          neighbours = automaton.transitionDirection[move] === BACKWARD ? graph.predecessors(role, node) : graph.successors(role, node);
          stop = neighbours.length;
        }
        for (let index = first; index < stop; index++) {
          const neighbour = neighbours[index];
          if (labels !== undefined ? !labels.mayReach(neighbour, end) : rank !== undefined && rank[neighbour] < endRank) continue;
          const next = neighbour * states + target;
          if (!arena.visitPair(next)) continue;
          if (withParents) {
            arena.parents[next] = pair;
            arena.parentMoves[next] = move;
          }
          arena.enqueue(tail++, next);
          if (automaton.accepting[target] === 1 && arena.reachNode(neighbour) && action(neighbour, next)) {
            this.countWork(tail, towardEnd);
            return true;
          }
        }
      }
    }
    this.countWork(tail, towardEnd);
    return false;
  }

  /** Records the pairs one search visited, for the backward-search and labels decisions. */
  private countWork(pairs: number, towardEnd: boolean): void {
    this.lastRunWork = pairs;
    if (towardEnd) this.searchWork += pairs;
  }

  /** Whether this is a local run whose searches have not yet cost what a whole-graph structure would. */
  private wholeGraphUnearned(): boolean {
    return this.arena.local && this.reachLabels === undefined && this.stepComponents === undefined && this.cycleMembers === undefined && this.searchWork < this.graph.nodeCount;
  }

  /** Records that a start was asked about; true when it had been before. */
  private markAsked(start: number): boolean {
    const asked = (this.askedOnce ??= new Uint8Array(this.graph.nodeCount));
    const before = asked[start] === 1;
    asked[start] = 1;
    return before;
  }

  /** Keeps a result in one of the two memos within the shared budget (both are dropped when it is spent). */
  private remember(start: number, result: Int32Array, memo: Map<number, Int32Array> = this.memo): void {
    if (this.memoSize + result.length > MEMO_BUDGET) {
      this.memo.clear();
      this.reachersMemo.clear();
      this.memoSize = 0;
    }
    memo.set(start, result);
    this.memoSize += result.length + 1;
  }

}

/** The successor function of a union of single steps, straight from the graph's adjacency. */
export function stepSuccessors(graph: HierarchyGraph, steps: RoleStep[]): (id: number) => Int32Array {
  if (steps.length === 1) {
    const { role, direction } = steps[0];
    return direction === FORWARD ? (id) => graph.successors(role, id) : (id) => graph.predecessors(role, id);
  }
  return (id) => {
    const lists = steps.map(({ role, direction }) =>
      direction === FORWARD ? graph.successors(role, id) : graph.predecessors(role, id),
    );
    const merged = new Int32Array(lists.reduce((sum, list) => sum + list.length, 0));
    let offset = 0;
    for (const list of lists) {
      merged.set(list, offset);
      offset += list.length;
    }
    return merged;
  };
}

/** The successors of one single step on a built graph, as its CSR columns read in place; undefined otherwise. */
export function stepColumns(graph: HierarchyGraph, steps: RoleStep[]): NeighbourColumns | undefined {
  if (steps.length !== 1 || !(graph instanceof BuiltHierarchyGraph)) return undefined;
  const { role, direction } = steps[0];
  const adjacency = graph.parts.adjacency[role];
  return direction === FORWARD
    ? { offsets: adjacency.offsets, neighbours: adjacency.targets }
    : { offsets: adjacency.reverseOffsets, neighbours: adjacency.reverseSources };
}

/** A key for a union of steps that does not depend on their order. */
function stepsKey(steps: RoleStep[]): string {
  return steps
    .map(({ role, direction }) => `${role}:${direction}`)
    .sort()
    .join(' ');
}

function binarySearch(sorted: Int32Array, wanted: number): boolean {
  let low = 0;
  let high = sorted.length - 1;
  while (low <= high) {
    const middle = (low + high) >>> 1;
    const value = sorted[middle];
    if (value === wanted) return true;
    if (value < wanted) low = middle + 1;
    else high = middle - 1;
  }
  return false;
}
