// Compressed sparse row adjacency of one role: edges sorted and deduplicated, statements per edge.

/** Raw edges as they are read: parallel growable columns of source, target and statement index. */
export class EdgeCollector {
  sources: Int32Array = new Int32Array(16);
  targets: Int32Array = new Int32Array(16);
  statements: Int32Array = new Int32Array(16);
  length = 0;

  /** Appends one stated edge. */
  add(source: number, target: number, statement: number): void {
    if (this.length === this.sources.length) this.grow();
    this.sources[this.length] = source;
    this.targets[this.length] = target;
    this.statements[this.length] = statement;
    this.length++;
  }

  private grow(): void {
    const size = this.sources.length * 2;
    const resize = (column: Int32Array): Int32Array => {
      const grown = new Int32Array(size);
      grown.set(column);
      return grown;
    };
    this.sources = resize(this.sources);
    this.targets = resize(this.targets);
    this.statements = resize(this.statements);
  }
}

/**
 * One role's edges. Edge k runs from the node whose range `offsets[n]..offsets[n+1]` holds k to
 * `targets[k]`; its statements are `evidence[evidenceOffsets[k]..evidenceOffsets[k+1]]`, in source
 * order. `reverseSources` lists, per node, the sources of its incoming edges the same way.
 */
export interface RoleAdjacency {
  offsets: Int32Array;
  targets: Int32Array;
  evidenceOffsets: Int32Array;
  evidence: Int32Array;
  reverseOffsets: Int32Array;
  reverseSources: Int32Array;
  /** Edges whose source is their target. */
  selfLoops: number;
}

/** Stable counting sort of the positions `order` by `keys[position]` (keys in 0..bucketCount-1). */
function countingSort(order: Int32Array, keys: Int32Array, bucketCount: number): Int32Array {
  const starts = new Int32Array(bucketCount + 1);
  for (let index = 0; index < order.length; index++) starts[keys[order[index]] + 1]++;
  for (let bucket = 0; bucket < bucketCount; bucket++) starts[bucket + 1] += starts[bucket];
  const sorted = new Int32Array(order.length);
  for (let index = 0; index < order.length; index++) sorted[starts[keys[order[index]]]++] = order[index];
  return sorted;
}

/**
 * Builds the adjacency from collected edges: two stable counting sorts (by target, then by source)
 * order edges by source then target with statements in reading order, then equal edges are merged.
 */
export function buildAdjacency(nodeCount: number, collected: EdgeCollector): RoleAdjacency {
  const rawCount = collected.length;
  const identity = new Int32Array(rawCount);
  for (let index = 0; index < rawCount; index++) identity[index] = index;
  const order = countingSort(countingSort(identity, collected.targets, nodeCount), collected.sources, nodeCount);

  const offsets = new Int32Array(nodeCount + 1);
  const uniqueTargets = new Int32Array(rawCount);
  const evidenceStarts = new Int32Array(rawCount + 1);
  const evidence = new Int32Array(rawCount);
  let edgeCount = 0;
  let evidenceCount = 0;
  let selfLoops = 0;
  let previousSource = -1;
  let previousTarget = -1;
  for (let index = 0; index < rawCount; index++) {
    const raw = order[index];
    const source = collected.sources[raw];
    const target = collected.targets[raw];
    const statement = collected.statements[raw];
    if (source !== previousSource || target !== previousTarget) {
      evidenceStarts[edgeCount] = evidenceCount;
      uniqueTargets[edgeCount++] = target;
      offsets[source + 1]++;
      if (source === target) selfLoops++;
      previousSource = source;
      previousTarget = target;
    } else if (evidence[evidenceCount - 1] === statement) {
      // The same statement gave this edge twice (a symmetric self-loop, a repeated list member).
      continue;
    }
    evidence[evidenceCount++] = statement;
  }
  evidenceStarts[edgeCount] = evidenceCount;
  for (let node = 0; node < nodeCount; node++) offsets[node + 1] += offsets[node];

  const targets = uniqueTargets.slice(0, edgeCount);
  const { reverseOffsets, reverseSources } = reverse(nodeCount, offsets, targets);
  return {
    offsets,
    targets,
    evidenceOffsets: evidenceStarts.slice(0, edgeCount + 1),
    evidence: evidence.slice(0, evidenceCount),
    reverseOffsets,
    reverseSources,
    selfLoops,
  };
}

/** The incoming adjacency; walking sources in ascending order keeps each node's sources ascending. */
function reverse(
  nodeCount: number,
  offsets: Int32Array,
  targets: Int32Array,
): { reverseOffsets: Int32Array; reverseSources: Int32Array } {
  const reverseOffsets = new Int32Array(nodeCount + 1);
  for (let edge = 0; edge < targets.length; edge++) reverseOffsets[targets[edge] + 1]++;
  for (let node = 0; node < nodeCount; node++) reverseOffsets[node + 1] += reverseOffsets[node];
  const fill = reverseOffsets.slice(0, nodeCount);
  const reverseSources = new Int32Array(targets.length);
  for (let source = 0; source < nodeCount; source++) {
    for (let edge = offsets[source]; edge < offsets[source + 1]; edge++) reverseSources[fill[targets[edge]]++] = source;
  }
  return { reverseOffsets, reverseSources };
}

/** The index of the edge source → target, or -1 (binary search in the source's sorted targets). */
export function findEdge(adjacency: RoleAdjacency, source: number, target: number): number {
  let low = adjacency.offsets[source];
  let high = adjacency.offsets[source + 1] - 1;
  while (low <= high) {
    const middle = (low + high) >>> 1;
    const value = adjacency.targets[middle];
    if (value === target) return middle;
    if (value < target) low = middle + 1;
    else high = middle - 1;
  }
  return -1;
}

/** Statements an edit adds to one role: raw edges (source, target, statement index), in statement order. */
export interface AddedEdges {
  sources: Int32Array;
  targets: Int32Array;
  statements: Int32Array;
  length: number;
}

/**
 * The adjacency with some statements dropped and some added, for `nodeCount` nodes (at least the
 * old count): what `buildAdjacency` would make from the old edges' remaining statements followed by
 * the added ones. Nodes the change leaves alone are copied in bulk; only `touched` sources are
 * merged. O(V + E) array work, no sort of the whole edge list.
 */
export function patchAdjacency(
  old: RoleAdjacency,
  nodeCount: number,
  change: { removed: ReadonlySet<number>; added: AddedEdges | undefined; touched: ReadonlySet<number> },
): RoleAdjacency {
  const oldCount = old.offsets.length - 1;
  const addedBySource = new Map<number, { target: number; statement: number }[]>();
  const added = change.added;
  for (let index = 0; added !== undefined && index < added.length; index++) {
    const list = addedBySource.get(added.sources[index]) ?? [];
    list.push({ target: added.targets[index], statement: added.statements[index] });
    addedBySource.set(added.sources[index], list);
  }
  const touched = [...new Set([...change.touched, ...addedBySource.keys()])].sort((left, right) => left - right);
  // The merged edges of each touched source: targets ascending, each with its statements in order.
  const merged = new Map<number, { target: number; statements: number[] }[]>();
  let edgeDelta = 0;
  let evidenceDelta = 0;
  let selfLoops = old.selfLoops;
  for (const source of touched) {
    const byTarget = new Map<number, number[]>();
    let oldEdges = 0;
    let oldEvidence = 0;
    if (source < oldCount) {
      for (let edge = old.offsets[source]; edge < old.offsets[source + 1]; edge++) {
        oldEdges++;
        if (old.targets[edge] === source) selfLoops--;
        for (let index = old.evidenceOffsets[edge]; index < old.evidenceOffsets[edge + 1]; index++) {
          oldEvidence++;
          const statement = old.evidence[index];
          if (change.removed.has(statement)) continue;
          const list = byTarget.get(old.targets[edge]) ?? [];
          list.push(statement);
          byTarget.set(old.targets[edge], list);
        }
      }
    }
    for (const { target, statement } of addedBySource.get(source) ?? []) {
      const list = byTarget.get(target) ?? [];
      // The same statement gave this edge twice (a symmetric self-loop): one statement, as buildAdjacency keeps it.
      if (list[list.length - 1] !== statement) list.push(statement);
      byTarget.set(target, list);
    }
    const edges = [...byTarget].map(([target, statements]) => ({ target, statements })).sort((left, right) => left.target - right.target);
    for (const edge of edges) if (edge.target === source) selfLoops++;
    merged.set(source, edges);
    edgeDelta += edges.length - oldEdges;
    evidenceDelta += edges.reduce((sum, edge) => sum + edge.statements.length, 0) - oldEvidence;
  }
  const edgeCount = old.targets.length + edgeDelta;
  const offsets = new Int32Array(nodeCount + 1);
  const targets = new Int32Array(edgeCount);
  const evidenceOffsets = new Int32Array(edgeCount + 1);
  const evidence = new Int32Array(old.evidence.length + evidenceDelta);
  let edge = 0;
  let statement = 0;
  let next = 0;
  /** Copies the old sources from..to-1 as they are. */
  const copy = (from: number, to: number): void => {
    const end = Math.min(to, oldCount);
    if (from >= end) {
      for (let source = from; source < to; source++) offsets[source + 1] = edge;
      return;
    }
    const firstEdge = old.offsets[from];
    const lastEdge = old.offsets[end];
    targets.set(old.targets.subarray(firstEdge, lastEdge), edge);
    const firstStatement = old.evidenceOffsets[firstEdge];
    evidence.set(old.evidence.subarray(firstStatement, old.evidenceOffsets[lastEdge]), statement);
    const shiftEdges = edge - firstEdge;
    const shiftStatements = statement - firstStatement;
    for (let source = from; source < end; source++) offsets[source + 1] = old.offsets[source + 1] + shiftEdges;
    for (let index = firstEdge; index < lastEdge; index++) evidenceOffsets[index + shiftEdges] = old.evidenceOffsets[index] + shiftStatements;
    edge += lastEdge - firstEdge;
    statement += old.evidenceOffsets[lastEdge] - firstStatement;
    for (let source = end; source < to; source++) offsets[source + 1] = edge;
  };
  for (const source of touched) {
    copy(next, source);
    for (const { target, statements } of merged.get(source) ?? []) {
      targets[edge] = target;
      evidenceOffsets[edge] = statement;
      for (const row of statements) evidence[statement++] = row;
      edge++;
    }
    offsets[source + 1] = edge;
    next = source + 1;
  }
  copy(next, nodeCount);
  evidenceOffsets[edge] = statement;
  const { reverseOffsets, reverseSources } = reverse(nodeCount, offsets, targets);
  return { offsets, targets, evidenceOffsets, evidence, reverseOffsets, reverseSources, selfLoops };
}
