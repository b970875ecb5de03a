// The path automaton and its search against a naive set-based evaluator of the same path, on random graphs.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatPath, parsePath, type PathExpression } from '../../src/engine/path.js';
import { PathSearch, SearchArena, type WalkedEdge } from '../../src/engine/path-search.js';
import type { HierarchyGraph } from '../../src/graph/hierarchy-graph.js';
import { SYMMETRIC_ROLES, type Role } from '../../src/roles/role.js';
import { fixtureGraph } from './graph-fixture.js';

const TEST_ROLES: Role[] = ['subclass-of', 'part-of', 'instance-of', 'disjoint-with'];

/** A relation as pair → length of its shortest walk. */
type Relation = Map<string, number>;

const key = (from: number, to: number) => `${from},${to}`;
const unkey = (text: string) => text.split(',').map(Number) as [number, number];

function union(left: Relation, right: Relation): Relation {
  const joined = new Map(left);
  for (const [pair, length] of right) joined.set(pair, Math.min(length, joined.get(pair) ?? Infinity));
  return joined;
}

function compose(left: Relation, right: Relation): Relation {
  const joined: Relation = new Map();
  for (const [leftPair, leftLength] of left) {
    const [a, b] = unkey(leftPair);
    for (const [rightPair, rightLength] of right) {
      const [c, d] = unkey(rightPair);
      if (b !== c) continue;
      const pair = key(a, d);
      joined.set(pair, Math.min(leftLength + rightLength, joined.get(pair) ?? Infinity));
    }
  }
  return joined;
}

function sameRelation(left: Relation, right: Relation): boolean {
  if (left.size !== right.size) return false;
  for (const [pair, length] of left) if (right.get(pair) !== length) return false;
  return true;
}

/**
 * Naive evaluation following SPARQL 1.1 Query §9.3 and §18.5 (ZeroLengthPath, ArbitraryLengthPath):
 * `p?` adds every node to itself, `p*` is that plus the transitive closure, `p+` the closure alone.
 * Lengths are walk lengths in edges, so the shortest witness can be checked too.
 */
function naive(path: PathExpression, nodeCount: number, edges: [Role, number, number][]): Relation {
  const identity: Relation = new Map(Array.from({ length: nodeCount }, (_, id) => [key(id, id), 0]));
  switch (path.type) {
    case 'role': {
      const relation: Relation = new Map();
      for (const [role, from, to] of edges) {
        if (role !== path.role) continue;
        relation.set(key(from, to), 1);
        if (SYMMETRIC_ROLES.has(role)) relation.set(key(to, from), 1);
      }
      return relation;
    }
    case 'inverse':
      return new Map([...naive(path.path, nodeCount, edges)].map(([pair, length]) => {
        const [a, b] = unkey(pair);
        return [key(b, a), length];
      }));
    case 'sequence':
      return path.steps.map((step) => naive(step, nodeCount, edges)).reduce(compose);
    case 'alternative':
      return path.options.map((option) => naive(option, nodeCount, edges)).reduce(union);
    case 'modified': {
      const inner = naive(path.path, nodeCount, edges);
      if (path.modifier === '?') return union(identity, inner);
      let closure = inner;
      for (;;) {
        const next = union(closure, compose(closure, inner));
        if (sameRelation(next, closure)) break;
        closure = next;
      }
      return path.modifier === '*' ? union(identity, closure) : closure;
    }
  }
}

const pathArbitrary: fc.Arbitrary<PathExpression> = fc.letrec<{ path: PathExpression }>((tie) => ({
  path: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    fc.constantFrom(...TEST_ROLES).map((role): PathExpression => ({ type: 'role', role })),
    tie('path').map((path): PathExpression => ({ type: 'inverse', path })),
    fc.array(tie('path'), { minLength: 2, maxLength: 3 }).map((steps): PathExpression => ({ type: 'sequence', steps })),
    fc.array(tie('path'), { minLength: 2, maxLength: 3 }).map((options): PathExpression => ({ type: 'alternative', options })),
    fc.tuple(fc.constantFrom<'?' | '*' | '+'>('?', '*', '+'), tie('path')).map(([modifier, path]): PathExpression => ({ type: 'modified', modifier, path })),
  ),
})).path;

const graphArbitrary = fc.integer({ min: 1, max: 6 }).chain((nodeCount) =>
  fc.record({
    nodeCount: fc.constant(nodeCount),
    edges: fc.array(fc.tuple(fc.constantFrom(...TEST_ROLES), fc.nat(nodeCount - 1), fc.nat(nodeCount - 1)), { maxLength: 12 }),
  }),
);

function buildGraph(nodeCount: number, edges: [Role, number, number][]): HierarchyGraph {
  const perRole: Partial<Record<Role, { from: Int32Array; to: Int32Array }>> = {};
  for (const role of TEST_ROLES) {
    const mine = edges.filter(([edgeRole]) => edgeRole === role);
    perRole[role] = { from: Int32Array.from(mine, ([, from]) => from), to: Int32Array.from(mine, ([, , to]) => to) };
  }
  return fixtureGraph({ nodeCount, term: (id) => `https://data.northvale-rail.example/n${id}`, edges: perRole });
}

/** The walk as a tiny graph of positions 0..length, to check that the path accepts the walk itself. */
function walkAccepted(path: PathExpression, start: number, walk: WalkedEdge[], graph: HierarchyGraph): boolean {
  const positions: [Role, number, number][] = [];
  let current = start;
  walk.forEach((edge, index) => {
    expect(graph.hasEdge(edge.role, edge.from, edge.to)).toBe(true);
    // A self-loop, or an edge of a symmetric role, can be walked either way: the position graph gets both.
    const eitherWay = edge.from === edge.to || SYMMETRIC_ROLES.has(edge.role);
    if (edge.from === current) {
      positions.push([edge.role, index, index + 1]);
      if (eitherWay) positions.push([edge.role, index + 1, index]);
      current = edge.to;
    } else {
      expect(edge.to).toBe(current);
      positions.push([edge.role, index + 1, index]);
      if (eitherWay) positions.push([edge.role, index, index + 1]);
      current = edge.from;
    }
  });
  return naive(path, walk.length + 1, positions).has(key(0, walk.length));
}

describe('PathSearch equals a naive set-based evaluator (SPARQL 1.1 Query §9.3 semantics)', () => {
  it('gives the same end nodes, start nodes, holds, reachesAny and shortest witnesses', () => {
    fc.assert(
      fc.property(graphArbitrary, pathArbitrary, ({ nodeCount, edges }, generated) => {
        const text = formatPath(generated);
        const reparsed = parsePath(text);
        expect(reparsed.ok).toBe(true);
        if (!reparsed.ok) return;
        const graph = buildGraph(nodeCount, edges);
        const search = new PathSearch(graph, reparsed.path, new SearchArena(nodeCount));
        const expected = naive(generated, nodeCount, edges);
        for (let start = 0; start < nodeCount; start++) {
          const ends = [...expected.keys()].map(unkey).filter(([a]) => a === start).map(([, b]) => b).sort((a, b) => a - b);
          const starts = [...expected.keys()].map(unkey).filter(([, b]) => b === start).map(([a]) => a).sort((a, b) => a - b);
          expect([...search.from(start)]).toEqual(ends);
          expect([...search.from(start)]).toEqual(ends);
          expect([...search.to(start)]).toEqual(starts);
          expect(search.reachesAny(start)).toBe(ends.length > 0);
          for (let end = 0; end < nodeCount; end++) {
            const shortest = expected.get(key(start, end));
            expect(search.holds(start, end)).toBe(shortest !== undefined);
            const walk = search.witness(start, end);
            expect(walk?.length).toBe(shortest);
            if (walk !== undefined) expect(walkAccepted(generated, start, walk, graph)).toBe(true);
          }
        }
      }),
      { numRuns: 400 },
    );
  });

  it('lets a node reach itself through * and ? even with no edges (zero-length path, §9.3)', () => {
    const graph = buildGraph(2, []);
    for (const text of ['subclass-of*', 'part-of?', 'subclass-of+']) {
      const parsed = parsePath(text);
      if (!parsed.ok) throw new Error(text);
      const search = new PathSearch(graph, parsed.path, new SearchArena(2));
      expect([...search.from(1)]).toEqual(text === 'subclass-of+' ? [] : [1]);
      expect(search.witness(1, 1)).toEqual(text === 'subclass-of+' ? undefined : []);
    }
  });
});
