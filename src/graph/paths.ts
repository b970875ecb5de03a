// Breadth-first search helpers over a successor function, with scratch arrays reused between calls.

/** Successors of a node id. */
export type Successors = (id: number) => ArrayLike<number>;

/** Whether a search may pass through (or end at) a node id. */
export type NodeFilter = (id: number) => boolean;

const NO_PARENT = -1;

/**
 * Scratch space for one search: visit marks stamped with a generation number (so nothing is
 * cleared between searches), parents and a queue. Arrays grow to the largest id seen, never shrink.
 */
class SearchScratch {
  stamps = new Uint32Array(64);
  parents = new Int32Array(64);
  queue = new Int32Array(64);
  generation = 0;
  busy = false;

  /** Starts a search: every node counts as unvisited again. */
  begin(): void {
    if (this.generation === 0xffffffff) {
      this.stamps.fill(0);
      this.generation = 0;
    }
    this.generation++;
  }

  /** Whether the node was visited in this search. */
  visited(id: number): boolean {
    return id < this.stamps.length && this.stamps[id] === this.generation;
  }

  /** Marks the node visited with its parent on the search tree. */
  visit(id: number, parent: number): void {
    if (id >= this.stamps.length) this.growMarks(id + 1);
    this.stamps[id] = this.generation;
    this.parents[id] = parent;
  }

  /** Puts a node at the given queue position, growing the queue when needed. */
  enqueue(position: number, id: number): void {
    if (position >= this.queue.length) {
      const queue = new Int32Array(Math.max(this.queue.length * 2, position + 1));
      queue.set(this.queue);
      this.queue = queue;
    }
    this.queue[position] = id;
  }

  private growMarks(minimum: number): void {
    const size = Math.max(this.stamps.length * 2, minimum);
    const stamps = new Uint32Array(size);
    stamps.set(this.stamps);
    const parents = new Int32Array(size);
    parents.set(this.parents);
    this.stamps = stamps;
    this.parents = parents;
  }
}

const sharedScratch = new SearchScratch();

/** Runs a search on the shared scratch, or on a fresh one when a search is already running (re-entry). */
function withScratch<T>(search: (scratch: SearchScratch) => T): T {
  const scratch = sharedScratch.busy ? new SearchScratch() : sharedScratch;
  scratch.busy = true;
  try {
    scratch.begin();
    return search(scratch);
  } finally {
    scratch.busy = false;
  }
}

/** Follows parent links back from `end` to a node whose parent is NO_PARENT; returns the path in forward order. */
function pathTo(scratch: SearchScratch, end: number, prefix: number[]): number[] {
  const backwards: number[] = [];
  for (let node = end; node !== NO_PARENT; node = scratch.parents[node]) backwards.push(node);
  backwards.reverse();
  return prefix.concat(backwards);
}

/**
 * A shortest path from `from` to `to` as a node sequence (from first, to last), or undefined when
 * there is none. `from === to` gives `[from]`. `allowed` limits the nodes after `from`.
 */
export function shortestPath(
  from: number,
  to: number,
  successors: Successors,
  allowed?: NodeFilter,
): number[] | undefined {
  if (from === to) return [from];
  return withScratch((scratch) => {
    scratch.visit(from, NO_PARENT);
    scratch.enqueue(0, from);
    let head = 0;
    let tail = 1;
    while (head < tail) {
      const node = scratch.queue[head++];
      const targets = successors(node);
      for (let index = 0; index < targets.length; index++) {
        const target = targets[index];
        if (scratch.visited(target) || (allowed !== undefined && !allowed(target))) continue;
        scratch.visit(target, node);
        if (target === to) return pathTo(scratch, to, []);
        scratch.enqueue(tail++, target);
      }
    }
    return undefined;
  });
}

/**
 * A shortest closed walk from `start` back to `start` of at least one edge (start first and last),
 * or undefined when start is on no cycle. A self-loop gives `[start, start]`. `allowed` limits the
 * nodes between the two ends.
 */
export function shortestClosedWalk(
  start: number,
  successors: Successors,
  allowed?: NodeFilter,
): number[] | undefined {
  return withScratch((scratch) => {
    // Start is left unmarked so that reaching it again ends the search.
    let tail = 0;
    const first = successors(start);
    for (let index = 0; index < first.length; index++) {
      const target = first[index];
      if (target === start) return [start, start];
      if (scratch.visited(target) || (allowed !== undefined && !allowed(target))) continue;
      scratch.visit(target, NO_PARENT);
      scratch.enqueue(tail++, target);
    }
    let head = 0;
    while (head < tail) {
      const node = scratch.queue[head++];
      const targets = successors(node);
      for (let index = 0; index < targets.length; index++) {
        const target = targets[index];
        if (target === start) return pathTo(scratch, node, [start]).concat(start);
        if (scratch.visited(target) || (allowed !== undefined && !allowed(target))) continue;
        scratch.visit(target, node);
        scratch.enqueue(tail++, target);
      }
    }
    return undefined;
  });
}

/**
 * Every node reachable from `start` by ONE OR MORE edges, ascending. `start` itself is included only
 * when it lies on a cycle (so this is the `+` closure; add start for `*`).
 */
export function reachableFrom(start: number, successors: Successors): Int32Array {
  return withScratch((scratch) => {
    scratch.enqueue(0, start);
    let head = 0;
    let tail = 1;
    const reached: number[] = [];
    while (head < tail) {
      const node = scratch.queue[head++];
      const targets = successors(node);
      for (let index = 0; index < targets.length; index++) {
        const target = targets[index];
        if (scratch.visited(target)) continue;
        scratch.visit(target, node);
        reached.push(target);
        // Start's successors are already queued; reaching it again only records it.
        if (target !== start) scratch.enqueue(tail++, target);
      }
    }
    return Int32Array.from(reached).sort();
  });
}
