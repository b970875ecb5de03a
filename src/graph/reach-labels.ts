// Interval labels on the component graph: an O(1) "cannot reach" test and a "surely reaches" test for reachability queries.
import { stronglyConnected, type ComponentAssignment } from './scc.js';

/** How many depth-first labellings are kept; each one prunes queries the others let through. */
const LABELLINGS = 3;

/**
 * Reachability labels over ids 0..nodeCount-1 for one successor function. The strongly connected
 * components are contracted to a DAG; each of a few depth-first traversals of that DAG (in
 * different child orders) numbers the components in post-order and gives each component the
 * interval [lowest post-order number it reaches, its own number]. When u reaches v, v's interval
 * lies inside u's in every labelling, so one interval outside another proves v unreachable from u
 * (the interval labelling of Yildirim, Chaoji and Zaki, "GRAIL: scalable reachability index for
 * large graphs", VLDB 2010, from memory). The depth-first trees give the converse for free: v in
 * u's subtree of a traversal proves that u reaches v.
 */
export class ReachLabels {
  /** The component of every node, in Tarjan's order (a walk from u to v needs component[u] >= component[v]). */
  readonly component: Int32Array;
  private readonly post: Int32Array;
  private readonly low: Int32Array;
  /** Per labelling and component: the smallest post-order number in its depth-first subtree. */
  private readonly subtreeStart: Int32Array;
  private readonly componentCount: number;

  constructor(nodeCount: number, successors: (id: number) => ArrayLike<number>, assignment?: ComponentAssignment) {
    const { component, count } = assignment ?? stronglyConnected(nodeCount, successors);
    this.component = component;
    this.componentCount = count;
    const { start, targets } = componentEdges(nodeCount, successors, component, count);
    this.post = new Int32Array(LABELLINGS * count);
    this.low = new Int32Array(LABELLINGS * count);
    this.subtreeStart = new Int32Array(LABELLINGS * count);
    for (let labelling = 0; labelling < LABELLINGS; labelling++) this.label(labelling, start, targets);
  }

  /** False when `to` is surely not reachable from `from` (zero or more steps); true means it may be. */
  mayReach(from: number, to: number): boolean {
    const source = this.component[from];
    const target = this.component[to];
    if (source === target) return true;
    if (source < target) return false;
    const { post, low, componentCount } = this;
    for (let offset = 0; offset < post.length; offset += componentCount) {
      if (post[offset + target] > post[offset + source] || low[offset + target] < low[offset + source]) return false;
    }
    return true;
  }

  /** True when `to` is surely reachable from `from` (zero or more steps); false means it may not be. */
  surelyReaches(from: number, to: number): boolean {
    const source = this.component[from];
    const target = this.component[to];
    if (source === target) return true;
    const { post, subtreeStart, componentCount } = this;
    for (let offset = 0; offset < post.length; offset += componentCount) {
      const number = post[offset + target];
      if (number <= post[offset + source] && number >= subtreeStart[offset + source]) return true;
    }
    return false;
  }

  /** One iterative depth-first traversal of the component DAG; the labelling's number picks the root and child order. */
  private label(labelling: number, start: Int32Array, targets: Int32Array): void {
    const count = this.componentCount;
    const offset = labelling * count;
    const visited = new Uint8Array(count);
    const frameComponent = new Int32Array(count);
    const frameNext = new Int32Array(count);
    const frameFirst = new Int32Array(count);
    let nextNumber = 0;
    let seed = 0x9e3779b9 ^ labelling;
    // A fixed pseudo-random sequence (xorshift), so the labels and thus the work done are the same every run.
    const random = (): number => {
      seed ^= seed << 13;
      seed ^= seed >>> 17;
      seed ^= seed << 5;
      return seed >>> 0;
    };
    for (let index = 0; index < count; index++) {
      // Labelling 0 starts from the highest components (sources first), 1 from the lowest, the rest at random.
      const root = labelling === 0 ? count - 1 - index : labelling === 1 ? index : random() % count;
      if (visited[root] === 1) continue;
      visited[root] = 1;
      let top = 0;
      frameComponent[0] = root;
      frameNext[0] = 0;
      frameFirst[0] = nextNumber;
      top = 1;
      while (top > 0) {
        const frame = top - 1;
        const current = frameComponent[frame];
        const degree = start[current + 1] - start[current];
        if (frameNext[frame] < degree) {
          const step = frameNext[frame]++;
          // Children in stored order, reversed, or from a rotating offset, so the labellings differ.
          const childIndex = labelling === 0 ? step : labelling === 1 ? degree - 1 - step : (step + current) % degree;
          const child = targets[start[current] + childIndex];
          if (visited[child] === 1) continue;
          visited[child] = 1;
          frameComponent[top] = child;
          frameNext[top] = 0;
          frameFirst[top] = nextNumber;
          top++;
          continue;
        }
        this.close(offset, start, targets, current, nextNumber++, frameFirst[frame]);
        top--;
      }
    }
    // Roots drawn at random may miss components; number the rest in Tarjan's order (children close first).
    if (nextNumber < count) this.labelRest(labelling, start, targets, visited, nextNumber);
  }

  /** Numbers the components a random-root traversal left out, each after all it reaches (Tarjan's order is topological). */
  private labelRest(labelling: number, start: Int32Array, targets: Int32Array, visited: Uint8Array, firstNumber: number): void {
    const offset = labelling * this.componentCount;
    let nextNumber = firstNumber;
    for (let current = 0; current < this.componentCount; current++) {
      if (visited[current] === 1) continue;
      visited[current] = 1;
      const number = nextNumber++;
      this.close(offset, start, targets, current, number, number);
    }
  }

  /**
   * Gives a component whose successors are all numbered its post-order number, the lowest number
   * it reaches (its own or a successor's lowest), and the first number of its depth-first subtree.
   */
  private close(offset: number, start: Int32Array, targets: Int32Array, current: number, number: number, firstInSubtree: number): void {
    const { post, low, subtreeStart } = this;
    let lowest = number;
    for (let edge = start[current]; edge < start[current + 1]; edge++) {
      const childLow = low[offset + targets[edge]];
      if (childLow < lowest) lowest = childLow;
    }
    post[offset + current] = number;
    low[offset + current] = lowest;
    subtreeStart[offset + current] = firstInSubtree;
  }
}

/** The edges between different components, as compressed rows (duplicates kept: they only cost a repeated look). */
function componentEdges(
  nodeCount: number,
  successors: (id: number) => ArrayLike<number>,
  component: Int32Array,
  count: number,
): { start: Int32Array; targets: Int32Array } {
  const start = new Int32Array(count + 1);
  for (let node = 0; node < nodeCount; node++) {
    const list = successors(node);
    const from = component[node];
    for (let index = 0; index < list.length; index++) if (component[list[index]] !== from) start[from + 1]++;
  }
  for (let index = 0; index < count; index++) start[index + 1] += start[index];
  const fill = start.slice(0, count);
  const targets = new Int32Array(start[count]);
  for (let node = 0; node < nodeCount; node++) {
    const list = successors(node);
    const from = component[node];
    for (let index = 0; index < list.length; index++) {
      const to = component[list[index]];
      if (to !== from) targets[fill[from]++] = to;
    }
  }
  return { start, targets };
}
