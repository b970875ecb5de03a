// Strongly connected components, held against graphlib's alg.tarjan on random graphs.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Graph, alg } from '@dagrejs/graphlib';
import { cyclicComponents, stronglyConnected, type NeighbourColumns } from '../../src/graph/scc.js';
import { randomGraph, successorLists } from './random-graph.js';

/** Sorted successor lists of a random graph. */
const adjacency = successorLists;

/** A partition as a sorted list of sorted member lists, so two partitions compare with toEqual. */
/** The same random graph as a graphlib directed graph, the reference implementation's input. */
function graphlibGraph(graph: { nodeCount: number; edges: [number, number][] }): Graph {
  const reference = new Graph({ directed: true });
  for (let id = 0; id < graph.nodeCount; id++) reference.setNode(String(id));
  for (const [from, to] of graph.edges) reference.setEdge(String(from), String(to));
  return reference;
}

/**
 * The lists packed as CSR columns. The offsets end after the last node with successors, as a
 * patched graph's unchanged role does before the nodes an edit added.
 */
function packedColumns(lists: number[][]): NeighbourColumns {
  let covered = lists.length;
  while (covered > 0 && lists[covered - 1].length === 0) covered--;
  const offsets = new Int32Array(covered + 1);
  for (let id = 0; id < covered; id++) offsets[id + 1] = offsets[id] + lists[id].length;
  return { offsets, neighbours: Int32Array.from(lists.slice(0, covered).flat()) };
}

function canonical(groups: number[][]): string[] {
  return groups.map((group) => [...group].sort((a, b) => a - b).join(',')).sort();
}

describe('stronglyConnected', () => {
  it('gives the same partition as graphlib alg.tarjan on 1,000 random graphs', () => {
    // Reference: @dagrejs/graphlib 4 alg.tarjan, a general-purpose graph library's Tarjan SCC.
    fc.assert(
      fc.property(randomGraph, (graph) => {
        const lists = adjacency(graph);
        const reference = graphlibGraph(graph);
        const expected = canonical(alg.tarjan(reference).map((group) => group.map(Number)));

        const { component, count } = stronglyConnected(graph.nodeCount, (id) => lists[id]);
        const groups: number[][] = Array.from({ length: count }, () => []);
        for (let id = 0; id < graph.nodeCount; id++) groups[component[id]].push(id);
        expect(groups.every((group) => group.length > 0)).toBe(true);
        expect(canonical(groups)).toEqual(expected);
      }),
      { numRuns: 1000 },
    );
  });

  it('reads successors packed as CSR columns to the same partition as graphlib alg.tarjan', () => {
    // Reference: @dagrejs/graphlib 4 alg.tarjan, as above; the columns are read in place instead of a list per node.
    fc.assert(
      fc.property(randomGraph, (graph) => {
        const expected = canonical(alg.tarjan(graphlibGraph(graph)).map((group) => group.map(Number)));
        const { component, count } = stronglyConnected(graph.nodeCount, packedColumns(adjacency(graph)));
        const groups: number[][] = Array.from({ length: count }, () => []);
        for (let id = 0; id < graph.nodeCount; id++) groups[component[id]].push(id);
        expect(canonical(groups)).toEqual(expected);
      }),
      { numRuns: 500 },
    );
  });

  it('numbers components in reverse topological order', () => {
    // Tarjan closes a component only after every component it reaches (common practice: textbook Tarjan).
    const lists = [[1], [2], [1, 3], []];
    const { component, count } = stronglyConnected(4, (id) => lists[id]);
    expect(count).toBe(3);
    expect(component[1]).toBe(component[2]);
    expect(component[3]).toBeLessThan(component[1]);
    expect(component[1]).toBeLessThan(component[0]);
  });
});

describe('cyclicComponents', () => {
  it('keeps components of more than one member and self-loops, ordered by smallest member', () => {
    const lists = [[0], [2], [], [4], [3, 5], [], [7], [6]];
    expect(cyclicComponents(8, (id) => lists[id])).toEqual([[0], [3, 4], [6, 7]]);
  });

  it('uses the given self-loop test instead of scanning successors', () => {
    const lists = [[0], [1]];
    expect(cyclicComponents(2, (id) => lists[id], (id) => id === 1)).toEqual([[1]]);
  });

  it('matches the components of graphlib alg.findCycles on random graphs', () => {
    // Reference: @dagrejs/graphlib 4 alg.findCycles (SCCs with more than one node or a self-loop).
    fc.assert(
      fc.property(randomGraph, (graph) => {
        const lists = adjacency(graph);
        const reference = graphlibGraph(graph);
        const expected = canonical(alg.findCycles(reference).map((group) => group.map(Number)));
        const found = cyclicComponents(graph.nodeCount, (id) => lists[id]);
        expect(canonical(found)).toEqual(expected);
        // The same lists as CSR columns: the self-loop test reads them in place.
        expect(cyclicComponents(graph.nodeCount, packedColumns(lists))).toEqual(found);
        for (const group of found) expect(group).toEqual([...group].sort((a, b) => a - b));
        const firsts = found.map((group) => group[0]);
        expect(firsts).toEqual([...firsts].sort((a, b) => a - b));
      }),
      { numRuns: 300 },
    );
  });
});
