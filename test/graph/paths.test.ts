// Breadth-first path helpers, held against a naive breadth-first search written here.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { reachableFrom, shortestClosedWalk, shortestPath } from '../../src/graph/paths.js';

interface RandomGraph {
  lists: number[][];
  from: number;
  to: number;
}

const randomGraph: fc.Arbitrary<RandomGraph> = fc.integer({ min: 1, max: 30 }).chain((nodeCount) =>
  fc
    .record({
      edges: fc.array(fc.tuple(fc.nat(nodeCount - 1), fc.nat(nodeCount - 1)), { maxLength: nodeCount * 2 }),
      from: fc.nat(nodeCount - 1),
      to: fc.nat(nodeCount - 1),
    })
    .map(({ edges, from, to }) => {
      const lists: number[][] = Array.from({ length: nodeCount }, () => []);
      for (const [a, b] of edges) if (!lists[a].includes(b)) lists[a].push(b);
      return { lists, from, to };
    }),
);

/** Naive BFS: edge distance from start to every node by one or more edges (Infinity when unreached). */
function distancesByOneOrMoreEdges(lists: number[][], start: number): number[] {
  const distance = lists.map(() => Infinity);
  let frontier = [...lists[start]];
  let depth = 1;
  while (frontier.length > 0) {
    const next: number[] = [];
    for (const node of frontier) {
      if (distance[node] !== Infinity) continue;
      distance[node] = depth;
      next.push(...lists[node]);
    }
    frontier = next;
    depth++;
  }
  return distance;
}

/** Whether every consecutive pair of the walk is an edge. */
function followsEdges(lists: number[][], walk: number[]): boolean {
  return walk.every((node, index) => index === 0 || lists[walk[index - 1]].includes(node));
}

describe('reachableFrom', () => {
  it('equals a naive BFS on random graphs (start only when on a cycle)', () => {
    fc.assert(
      fc.property(randomGraph, ({ lists, from }) => {
        const distance = distancesByOneOrMoreEdges(lists, from);
        const expected = distance.flatMap((value, id) => (value === Infinity ? [] : [id]));
        expect(Array.from(reachableFrom(from, (id) => lists[id]))).toEqual(expected);
      }),
      { numRuns: 500 },
    );
  });

  it('includes the start of a cycle and excludes an acyclic start', () => {
    const lists = [[1], [2], [0, 3], []];
    expect(Array.from(reachableFrom(0, (id) => lists[id]))).toEqual([0, 1, 2, 3]);
    expect(Array.from(reachableFrom(3, (id) => lists[id]))).toEqual([]);
  });
});

describe('shortestPath', () => {
  it('has the length of a naive BFS and follows edges, on random graphs', () => {
    fc.assert(
      fc.property(randomGraph, ({ lists, from, to }) => {
        const path = shortestPath(from, to, (id) => lists[id]);
        if (from === to) {
          expect(path).toEqual([from]);
          return;
        }
        const distance = distancesByOneOrMoreEdges(lists, from)[to];
        if (distance === Infinity) {
          expect(path).toBeUndefined();
          return;
        }
        expect(path).toBeDefined();
        expect(path!.length - 1).toBe(distance);
        expect(path![0]).toBe(from);
        expect(path![path!.length - 1]).toBe(to);
        expect(followsEdges(lists, path!)).toBe(true);
      }),
      { numRuns: 500 },
    );
  });

  it('keeps to allowed nodes', () => {
    const lists = [[1, 2], [3], [4], [], [3]];
    expect(shortestPath(0, 3, (id) => lists[id])).toEqual([0, 1, 3]);
    expect(shortestPath(0, 3, (id) => lists[id], (id) => id !== 1)).toEqual([0, 2, 4, 3]);
    expect(shortestPath(0, 3, (id) => lists[id], (id) => id !== 1 && id !== 4)).toBeUndefined();
  });
});

describe('shortestClosedWalk', () => {
  it('has the length of the shortest return found by a naive BFS, on random graphs', () => {
    fc.assert(
      fc.property(randomGraph, ({ lists, from }) => {
        const walk = shortestClosedWalk(from, (id) => lists[id]);
        const distance = distancesByOneOrMoreEdges(lists, from)[from];
        if (distance === Infinity) {
          expect(walk).toBeUndefined();
          return;
        }
        expect(walk).toBeDefined();
        expect(walk!.length - 1).toBe(distance);
        expect(walk![0]).toBe(from);
        expect(walk![walk!.length - 1]).toBe(from);
        expect(followsEdges(lists, walk!)).toBe(true);
      }),
      { numRuns: 500 },
    );
  });

  it('gives [start, start] for a self-loop and respects allowed nodes', () => {
    const lists = [[0, 1], [0]];
    expect(shortestClosedWalk(0, (id) => lists[id])).toEqual([0, 0]);
    const triangle = [[1, 2], [0], [0]];
    expect(shortestClosedWalk(0, (id) => triangle[id], (id) => id !== 1)).toEqual([0, 2, 0]);
    expect(shortestClosedWalk(0, (id) => triangle[id], () => false)).toBeUndefined();
  });

  it('stays correct when called again from inside a successor function', () => {
    const lists = [[1], [2], [0]];
    const nested = (id: number): number[] => {
      expect(shortestPath(0, 2, (inner) => lists[inner])).toEqual([0, 1, 2]);
      return lists[id];
    };
    expect(shortestClosedWalk(0, nested)).toEqual([0, 1, 2, 0]);
  });
});
