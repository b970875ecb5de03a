// A small HierarchyGraph for engine tests, built from edge lists with typed-array adjacency.
import type { GraphStats, HierarchyGraph, NodeKind } from '../../src/graph/hierarchy-graph.js';
import type { Statement } from '../../src/load/statement.js';
import { ROLES, SYMMETRIC_ROLES, type Role } from '../../src/roles/role.js';

/** The namespace of the demo scenario (Northvale Rail, invented for the project). */
export const NV = 'https://data.northvale-rail.example/';

/** Edges of one role as parallel arrays of node ids, with the line each was stated on. */
export interface RoleEdges {
  from: Int32Array;
  to: Int32Array;
  lines?: Int32Array;
}

/** Everything the fixture needs: node count, terms, edges per role, and node kinds. */
export interface FixtureOptions {
  nodeCount: number;
  term: (id: number) => string;
  edges: Partial<Record<Role, RoleEdges>>;
  /** Node ids per kind; 'class' and 'individual' default as design.md defines them, 'in-scope' to every node. */
  kinds?: Partial<Record<NodeKind, number[]>>;
  file?: string;
}

interface Adjacency {
  offsets: Int32Array;
  targets: Int32Array;
  /** Index of the stated edge behind each adjacency entry. */
  edgeIndex: Int32Array;
}

function buildAdjacency(nodeCount: number, from: Int32Array, to: Int32Array, index: Int32Array): Adjacency {
  const counts = new Int32Array(nodeCount + 1);
  for (let i = 0; i < from.length; i++) counts[from[i] + 1]++;
  for (let i = 0; i < nodeCount; i++) counts[i + 1] += counts[i];
  const fill = counts.slice(0, nodeCount);
  const order = new Int32Array(from.length);
  for (let i = 0; i < from.length; i++) order[fill[from[i]]++] = i;
  const targets = new Int32Array(from.length);
  const edgeIndex = new Int32Array(from.length);
  const offsets = new Int32Array(nodeCount + 1);
  let written = 0;
  for (let node = 0; node < nodeCount; node++) {
    offsets[node] = written;
    const slice = Array.from(order.subarray(counts[node], counts[node + 1])).sort((a, b) => to[a] - to[b]);
    let last = -1;
    for (const position of slice) {
      if (to[position] === last) continue;
      last = to[position];
      targets[written] = to[position];
      edgeIndex[written] = index[position];
      written++;
    }
  }
  offsets[nodeCount] = written;
  return { offsets, targets: targets.slice(0, written), edgeIndex: edgeIndex.slice(0, written) };
}

/** Builds the fixture graph; statements are made once per stated edge and reused (so identity holds). */
export function fixtureGraph(options: FixtureOptions): HierarchyGraph {
  const { nodeCount, term } = options;
  const file = options.file ?? 'fixture.ttl';
  const forward = new Map<Role, Adjacency>();
  const backward = new Map<Role, Adjacency>();
  const statements = new Map<Role, Map<number, Statement>>();
  const edgeCounts = {} as Record<Role, number>;
  const roleStatements = {} as Record<Role, number>;
  let nextLine = 1;
  const stated = new Map<Role, RoleEdges & { lines: Int32Array }>();
  for (const role of ROLES) {
    const given = options.edges[role] ?? { from: new Int32Array(0), to: new Int32Array(0) };
    const lines = given.lines ?? Int32Array.from(given.from, () => nextLine++);
    stated.set(role, { from: given.from, to: given.to, lines });
    const index = Int32Array.from(given.from, (_, i) => i);
    let from: Int32Array = given.from;
    let to: Int32Array = given.to;
    let edgeIndex: Int32Array = index;
    if (SYMMETRIC_ROLES.has(role)) {
      from = concat(given.from, given.to);
      to = concat(given.to, given.from);
      edgeIndex = concat(index, index);
    }
    forward.set(role, buildAdjacency(nodeCount, from, to, edgeIndex));
    backward.set(role, buildAdjacency(nodeCount, to, from, edgeIndex));
    statements.set(role, new Map());
    const distinct = new Set<string>();
    for (let i = 0; i < given.from.length; i++) {
      const [a, b] = SYMMETRIC_ROLES.has(role) && given.from[i] > given.to[i] ? [given.to[i], given.from[i]] : [given.from[i], given.to[i]];
      distinct.add(`${a} ${b}`);
    }
    edgeCounts[role] = distinct.size;
    roleStatements[role] = given.from.length;
  }
  const statementOf = (role: Role, index: number): Statement => {
    const cache = statements.get(role) as Map<number, Statement>;
    let found = cache.get(index);
    if (found === undefined) {
      const edges = stated.get(role) as RoleEdges & { lines: Int32Array };
      found = {
        subject: term(edges.from[index]),
        predicate: `urn:x-isapart-test:${role}`,
        object: term(edges.to[index]),
        graph: '',
        position: { file, line: edges.lines[index], column: 1 },
        objectLine: edges.lines[index],
      };
      cache.set(index, found);
    }
    return found;
  };
  const kinds = new Map<NodeKind, Uint8Array>();
  const kindArray = (kind: NodeKind, ids: number[] | undefined, fallback: (id: number) => boolean): Uint8Array => {
    const array = new Uint8Array(nodeCount);
    if (ids !== undefined) for (const id of ids) array[id] = 1;
    else for (let id = 0; id < nodeCount; id++) array[id] = fallback(id) ? 1 : 0;
    kinds.set(kind, array);
    return array;
  };
  const degree = (adjacencies: Map<Role, Adjacency>, role: Role, id: number) => {
    const adjacency = adjacencies.get(role) as Adjacency;
    return adjacency.offsets[id + 1] - adjacency.offsets[id];
  };
  const declared = kindArray('declared-class', options.kinds?.['declared-class'], () => false);
  // design.md, Roles: a class is an object of instance-of, an end of subclass-of, or declared.
  const classes = kindArray('class', options.kinds?.class, (id) =>
    declared[id] === 1 || degree(backward, 'instance-of', id) > 0 || degree(forward, 'subclass-of', id) > 0 || degree(backward, 'subclass-of', id) > 0,
  );
  kindArray('individual', options.kinds?.individual, (id) => classes[id] === 0 && degree(forward, 'instance-of', id) > 0);
  kindArray('deprecated', options.kinds?.deprecated, () => false);
  kindArray('root', options.kinds?.root, () => false);
  kindArray('in-scope', options.kinds?.['in-scope'], () => true);
  const ids = new Map<string, number>();
  const stats: GraphStats = {
    statements: Object.values(roleStatements).reduce((sum, count) => sum + count, 0),
    roleStatements,
    edges: edgeCounts,
    axiomStatements: 0,
    skippedRoleStatements: 0,
    nodes: nodeCount,
  };
  const edgeEntry = (role: Role, from: number, to: number): number => {
    const adjacency = forward.get(role) as Adjacency;
    let low = adjacency.offsets[from];
    let high = adjacency.offsets[from + 1] - 1;
    while (low <= high) {
      const middle = (low + high) >>> 1;
      if (adjacency.targets[middle] === to) return middle;
      if (adjacency.targets[middle] < to) low = middle + 1;
      else high = middle - 1;
    }
    return -1;
  };
  return {
    nodeCount,
    stats,
    term,
    idOf(wanted) {
      if (ids.size === 0) for (let id = 0; id < nodeCount; id++) ids.set(term(id), id);
      return ids.get(wanted) ?? -1;
    },
    successors: (role, id) => {
      const adjacency = forward.get(role) as Adjacency;
      return adjacency.targets.subarray(adjacency.offsets[id], adjacency.offsets[id + 1]);
    },
    predecessors: (role, id) => {
      const adjacency = backward.get(role) as Adjacency;
      return adjacency.targets.subarray(adjacency.offsets[id], adjacency.offsets[id + 1]);
    },
    hasEdge: (role, from, to) => edgeEntry(role, from, to) !== -1,
    edgeStatements(role, from, to) {
      const entry = edgeEntry(role, from, to);
      if (entry === -1) return [];
      const adjacency = forward.get(role) as Adjacency;
      return [statementOf(role, adjacency.edgeIndex[entry])];
    },
    is: (kind, id) => (kinds.get(kind) as Uint8Array)[id] === 1,
    firstStatement(id) {
      for (const role of ROLES) {
        const edges = stated.get(role) as RoleEdges & { lines: Int32Array };
        for (let i = 0; i < edges.from.length; i++) if (edges.from[i] === id) return statementOf(role, i);
      }
      return undefined;
    },
    displayName: (id) => {
      const text = term(id);
      return text.startsWith(NV) ? `nv:${text.slice(NV.length)}` : `<${text}>`;
    },
    label: () => undefined,
  };
}

function concat(left: Int32Array, right: Int32Array): Int32Array {
  const joined = new Int32Array(left.length + right.length);
  joined.set(left);
  joined.set(right, left.length);
  return joined;
}

/** A fixture from triples of local names, e.g. ['Bogie', 'part-of', 'Wagon']; terms are NV IRIs in order of appearance. */
export function graphOf(triples: [string, Role, string][], kinds: Partial<Record<NodeKind, string[]>> = {}): HierarchyGraph {
  const names: string[] = [];
  const idOf = new Map<string, number>();
  const intern = (name: string): number => {
    let id = idOf.get(name);
    if (id === undefined) {
      id = names.length;
      names.push(name);
      idOf.set(name, id);
    }
    return id;
  };
  for (const [subject, , object] of triples) {
    intern(subject);
    intern(object);
  }
  for (const list of Object.values(kinds)) for (const name of list ?? []) intern(name);
  const perRole: Partial<Record<Role, { from: number[]; to: number[]; lines: number[] }>> = {};
  triples.forEach(([subject, role, object], index) => {
    const edges = (perRole[role] ??= { from: [], to: [], lines: [] });
    edges.from.push(intern(subject));
    edges.to.push(intern(object));
    edges.lines.push(index + 1);
  });
  const edges: Partial<Record<Role, RoleEdges>> = {};
  for (const role of ROLES) {
    const given = perRole[role];
    if (given !== undefined) edges[role] = { from: Int32Array.from(given.from), to: Int32Array.from(given.to), lines: Int32Array.from(given.lines) };
  }
  const kindIds: Partial<Record<NodeKind, number[]>> = {};
  for (const [kind, list] of Object.entries(kinds) as [NodeKind, string[]][]) kindIds[kind] = list.map((name) => intern(name));
  return fixtureGraph({ nodeCount: names.length, term: (id) => `${NV}${names[id]}`, edges, kinds: kindIds });
}
