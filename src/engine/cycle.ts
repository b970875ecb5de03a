// The `cycle` entry: strongly connected components of a path's relation, each with a shortest closed walk.
import type { HierarchyGraph } from '../graph/hierarchy-graph.js';
import { shortestClosedWalk } from '../graph/paths.js';
import { cyclicComponents } from '../graph/scc.js';
import { BACKWARD, FORWARD, singleSteps, type RoleStep } from './automaton.js';
import type { PathExpression } from './path.js';
import { PathSearch, stepColumns, stepSuccessors, type SearchArena, type WalkedEdge } from './path-search.js';

/** One cyclic component: members ordered along the closed walk, and the walk's edges (the evidence). */
export interface CycleComponent {
  /** The walk's nodes from the in-scope member whose term sorts first, then any other members by term. */
  members: number[];
  walk: WalkedEdge[];
}

/**
 * The cyclic components of a path's relation, found once and ordered on demand. For `X+` the
 * relation's components are those of X; when X is a union of single steps the graph's adjacency is
 * used directly, otherwise X is evaluated one step per node.
 */
export class CycleSource {
  private components: number[][] | undefined;
  /** Per node: 1 + the index of its cyclic component, or 0. */
  private componentOf: Int32Array | undefined;
  private readonly ordered = new Map<number, CycleComponent>();
  private readonly steps: RoleStep[] | undefined;
  private readonly stepSearch: PathSearch | undefined;

  constructor(
    private readonly graph: HierarchyGraph,
    path: PathExpression,
    private readonly arena: SearchArena,
  ) {
    const base = path.type === 'modified' && path.modifier === '+' ? path.path : path;
    this.steps = singleSteps(base);
    this.stepSearch = this.steps === undefined ? new PathSearch(graph, base, arena) : undefined;
  }

  /** How many cyclic components there are. */
  count(): number {
    return this.memberSets().length;
  }

  /** Per node in a local run: 1 once its component has been looked for. */
  private looked: Uint8Array | undefined;

  /** The indexes of the components that hold one of the nodes, ascending. */
  componentsHolding(nodes: Int32Array): number[] {
    if (this.arena.local && this.components === undefined) return this.localComponentsHolding(nodes);
    this.memberSets();
    const componentOf = this.componentOf as Int32Array;
    const found = new Set<number>();
    for (const node of nodes) {
      if (node >= 0 && node < componentOf.length && componentOf[node] > 0) found.add(componentOf[node] - 1);
    }
    return [...found].sort((left, right) => left - right);
  }

  /**
   * Local run: the component of each node is what it reaches that also reaches it back, found by a
   * forward search from it and a backward one kept inside what the forward one reached; only the
   * nodes' own components are looked for, never the whole graph's. They are numbered -1, -2, ...
   * so that they never stand for a whole-graph component.
   */
  private localComponentsHolding(nodes: Int32Array): number[] {
    const nodeCount = this.graph.nodeCount;
    const looked = (this.looked ??= new Uint8Array(nodeCount));
    const componentOf = (this.localComponentOf ??= new Int32Array(nodeCount));
    const found: number[][] = (this.localComponents ??= []);
    const successors = this.successors();
    const predecessors = this.predecessors();
    const indexes = new Set<number>();
    for (const node of nodes) {
      if (node < 0 || node >= nodeCount) continue;
      if (looked[node] === 0) {
        const forward = reachFrom(node, successors, () => true);
        const members = [...reachFrom(node, predecessors, (id) => forward.has(id))].sort((left, right) => left - right);
        const cyclic = members.length > 1 || Array.from(successors(node)).includes(node);
        for (const member of members) looked[member] = 1;
        looked[node] = 1;
        if (cyclic) {
          found.push(members);
          for (const member of members) componentOf[member] = found.length;
        }
      }
      if (componentOf[node] > 0) indexes.add(-componentOf[node]);
    }
    return [...indexes].sort((left, right) => left - right);
  }

  private localComponents: number[][] | undefined;
  private localComponentOf: Int32Array | undefined;

  private predecessors(): (id: number) => ArrayLike<number> {
    if (this.steps !== undefined) {
      const flipped = this.steps.map(({ role, direction }) => ({ role, direction: direction === FORWARD ? BACKWARD : FORWARD }));
      return stepSuccessors(this.graph, flipped);
    }
    const search = (this.stepSearch as PathSearch).reverse();
    return (id) => search.from(id);
  }

  /** The members of the component at an index, in no particular order. */
  memberIds(index: number): readonly number[] {
    return index < 0 ? (this.localComponents as number[][])[-index - 1] : this.memberSets()[index];
  }

  /** The component at an index, with its members ordered and its closed walk. */
  component(index: number): CycleComponent {
    let found = this.ordered.get(index);
    if (found === undefined) {
      found = this.order(index);
      this.ordered.set(index, found);
    }
    return found;
  }

  private successors(): (id: number) => ArrayLike<number> {
    if (this.steps !== undefined) return stepSuccessors(this.graph, this.steps);
    const search = this.stepSearch as PathSearch;
    return (id) => search.from(id);
  }

  private memberSets(): number[][] {
    if (this.components === undefined) {
      // For single steps the run's shared components serve (a search of the same steps may have made them already).
      const assignment = this.steps !== undefined ? this.arena.stepComponents(this.graph, this.steps) : undefined;
      const columns = this.steps !== undefined ? stepColumns(this.graph, this.steps) : undefined;
      const components = cyclicComponents(this.graph.nodeCount, columns ?? this.successors(), undefined, assignment);
      const componentOf = new Int32Array(this.graph.nodeCount);
      components.forEach((members, index) => {
        for (const member of members) componentOf[member] = index + 1;
      });
      this.components = components;
      this.componentOf = componentOf;
    }
    return this.components;
  }

  private order(index: number): CycleComponent {
    const graph = this.graph;
    const members = this.memberIds(index);
    const componentOf = index < 0 ? (this.localComponentOf as Int32Array) : (this.componentOf as Int32Array);
    const mark = index < 0 ? -index : index + 1;
    // The walk starts at the in-scope member whose term sorts first (the finding's focus), so a cycle
    // through borrowed terms is still reported on a term of the graph's own; with none in scope,
    // at the member that sorts first.
    const inScope = members.filter((member) => graph.is('in-scope', member));
    const candidates = inScope.length > 0 ? inScope : members;
    let first = candidates[0];
    let firstTerm = graph.term(first);
    for (const member of candidates) {
      const term = graph.term(member);
      if (term < firstTerm) {
        first = member;
        firstTerm = term;
      }
    }
    // Successors are taken in term order, so the walk (and the finding's node order) depends only on
    // the statements, never on the order they were read in (nor on an endpoint's row order).
    const successors = this.successors();
    const inComponent = (id: number): boolean => componentOf[id] === mark;
    const termOrder = (id: number): number[] => Array.from(successors(id)).filter(inComponent).sort((left, right) => compareTerms(graph, left, right));
    const walkNodes = shortestClosedWalk(first, termOrder, inComponent);
    if (walkNodes === undefined) throw new Error(`no closed walk through ${firstTerm} in its own component`);
    let rest: number[] = [];
    // A walk that leaves members out (two loops through one node) lists the others after it, by term.
    if (walkNodes.length - 1 < members.length) {
      const onWalk = new Set(walkNodes);
      rest = members.filter((member) => !onWalk.has(member)).sort((left, right) => compareTerms(graph, left, right));
    }
    const walk: WalkedEdge[] = [];
    for (let index = 1; index < walkNodes.length; index++) walk.push(...this.hop(walkNodes[index - 1], walkNodes[index]));
    return { members: [...walkNodes.slice(0, -1), ...rest], walk };
  }

  /** The edges of one step of the relation from a node to the next one on the walk. */
  private hop(from: number, to: number): WalkedEdge[] {
    if (this.steps !== undefined) {
      for (const { role, direction } of this.steps) {
        if (direction === FORWARD && this.graph.hasEdge(role, from, to)) return [{ role, from, to }];
        if (direction !== FORWARD && this.graph.hasEdge(role, to, from)) return [{ role, from: to, to: from }];
      }
      throw new Error(`no edge from ${this.graph.term(from)} to ${this.graph.term(to)} on a walk that uses it`);
    }
    const edges = (this.stepSearch as PathSearch).witness(from, to);
    if (edges === undefined) throw new Error(`no walk from ${this.graph.term(from)} to ${this.graph.term(to)} on a cycle that uses it`);
    return edges;
  }
}

/** The nodes reached from a start (itself included) over successors that pass `keep`. */
function reachFrom(start: number, successors: (id: number) => ArrayLike<number>, keep: (id: number) => boolean): Set<number> {
  const reached = new Set<number>([start]);
  const queue = [start];
  for (let head = 0; head < queue.length; head++) {
    const next = successors(queue[head]);
    for (let index = 0; index < next.length; index++) {
      const id = next[index];
      if (reached.has(id) || !keep(id)) continue;
      reached.add(id);
      queue.push(id);
    }
  }
  return reached;
}

function compareTerms(graph: HierarchyGraph, left: number, right: number): number {
  const a = graph.term(left);
  const b = graph.term(right);
  return a < b ? -1 : a > b ? 1 : 0;
}
