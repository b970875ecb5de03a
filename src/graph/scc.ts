// Strongly connected components: Tarjan's algorithm with explicit typed-array stacks (no recursion).

/** The component of every node (0..count-1, in the order Tarjan's algorithm closes them) and their count. */
export interface ComponentAssignment {
  component: Int32Array;
  count: number;
}

/** A successor list per node as a CSR column: node i's successors are `neighbours[offsets[i]..offsets[i+1])`; nodes past `offsets` have none. */
export interface NeighbourColumns {
  offsets: Int32Array;
  neighbours: Int32Array;
}

/** The successors of each node: a function returning a node's list, or the lists packed as columns (read in place, no list made per node). */
export type Successors = ((id: number) => ArrayLike<number>) | NeighbourColumns;

const UNVISITED = -1;
/** Put in a closed frame's place so its successor list can be collected. */
const EMPTY: ArrayLike<number> = new Int32Array(0);

/**
 * Tarjan's strongly connected components over ids 0..nodeCount-1, iteratively, so a graph with a
 * path a million nodes long needs no call stack depth. Components come out in reverse topological order.
 */
export function stronglyConnected(nodeCount: number, successors: Successors): ComponentAssignment {
  const component = new Int32Array(nodeCount).fill(UNVISITED);
  const discovery = new Int32Array(nodeCount).fill(UNVISITED);
  const lowLink = new Int32Array(nodeCount);
  const onStack = new Uint8Array(nodeCount);
  // The Tarjan stack of nodes not yet assigned to a component.
  const memberStack = new Int32Array(nodeCount);
  let memberTop = 0;
  // The depth-first call stack: the node of each frame, the list holding its successors, the next position to walk and where they end.
  const frameNode = new Int32Array(nodeCount);
  const frameNext = new Int32Array(nodeCount);
  const frameEnd = new Int32Array(nodeCount);
  const frameSuccessors: ArrayLike<number>[] = [];
  let frameTop = 0;
  let nextDiscovery = 0;
  let count = 0;
  const columns = typeof successors === 'function' ? undefined : successors;
  const listOf = typeof successors === 'function' ? successors : undefined;
  const open = (node: number): void => {
    frameNode[frameTop] = node;
    if (columns !== undefined) {
      const { offsets } = columns;
      frameSuccessors[frameTop] = columns.neighbours;
      frameNext[frameTop] = node + 1 < offsets.length ? offsets[node] : 0;
      frameEnd[frameTop] = node + 1 < offsets.length ? offsets[node + 1] : 0;
    } else {
      const list = (listOf as (id: number) => ArrayLike<number>)(node);
      frameSuccessors[frameTop] = list;
      frameNext[frameTop] = 0;
      frameEnd[frameTop] = list.length;
    }
    frameTop++;
  };

  for (let root = 0; root < nodeCount; root++) {
    if (discovery[root] !== UNVISITED) continue;
    discovery[root] = lowLink[root] = nextDiscovery++;
    memberStack[memberTop++] = root;
    onStack[root] = 1;
    open(root);

    while (frameTop > 0) {
      const frame = frameTop - 1;
      const node = frameNode[frame];
      const nodeSuccessors = frameSuccessors[frame];
      if (frameNext[frame] < frameEnd[frame]) {
        const target = nodeSuccessors[frameNext[frame]++];
        if (discovery[target] === UNVISITED) {
          discovery[target] = lowLink[target] = nextDiscovery++;
          memberStack[memberTop++] = target;
          onStack[target] = 1;
          open(target);
        } else if (onStack[target] === 1 && discovery[target] < lowLink[node]) {
          lowLink[node] = discovery[target];
        }
        continue;
      }
      // Every successor walked: close the node, then hand its low link back to its caller.
      if (lowLink[node] === discovery[node]) {
        let member: number;
        do {
          member = memberStack[--memberTop];
          onStack[member] = 0;
          component[member] = count;
        } while (member !== node);
        count++;
      }
      frameSuccessors[frame] = EMPTY;
      frameTop--;
      if (frameTop > 0) {
        const caller = frameNode[frameTop - 1];
        if (lowLink[node] < lowLink[caller]) lowLink[caller] = lowLink[node];
      }
    }
  }
  return { component, count };
}

/**
 * The components that hold a cycle: more than one member, or one member with a self-loop.
 * Members ascending; components ordered by their smallest member. `assignment` is the components
 * of the same successors when already known.
 */
export function cyclicComponents(
  nodeCount: number,
  successors: Successors,
  hasSelfLoop: (id: number) => boolean = (id) => includesSelf(successors, id),
  assignment?: ComponentAssignment,
): number[][] {
  const { component, count } = assignment ?? stronglyConnected(nodeCount, successors);
  const sizes = new Int32Array(count);
  for (let id = 0; id < nodeCount; id++) sizes[component[id]]++;
  const groups: (number[] | undefined)[] = new Array(count);
  const ordered: number[][] = [];
  // Walking ids ascending gives ascending members and orders groups by their smallest member.
  for (let id = 0; id < nodeCount; id++) {
    const index = component[id];
    let group = groups[index];
    if (group === undefined) {
      if (sizes[index] === 1 && !hasSelfLoop(id)) continue;
      group = [];
      groups[index] = group;
      ordered.push(group);
    }
    group.push(id);
  }
  return ordered;
}

/** Whether a node is among its own successors. */
function includesSelf(successors: Successors, id: number): boolean {
  if (typeof successors === 'function') {
    const values = successors(id);
    for (let index = 0; index < values.length; index++) if (values[index] === id) return true;
    return false;
  }
  const { offsets, neighbours } = successors;
  if (id + 1 >= offsets.length) return false;
  for (let index = offsets[id]; index < offsets[id + 1]; index++) if (neighbours[index] === id) return true;
  return false;
}
