// Scale: a 1,000,000-long subclass chain and a 1,000,000-member cycle, built and searched without recursion.
import { describe, expect, it } from 'vitest';
import { buildHierarchyGraph } from '../../src/graph/build.js';
import { reachableFrom, shortestClosedWalk, shortestPath } from '../../src/graph/paths.js';
import { cyclicComponents } from '../../src/graph/scc.js';
import type { Statement } from '../../src/load/statement.js';
import { RDFS_SUBCLASS_OF } from '../../src/roles/vocabulary.js';
import { NORTHVALE, source, testRoleMap } from './graph-fixtures.js';

const SIZE = 1_000_000;
const terms = Array.from({ length: SIZE }, (_, index) => `${NORTHVALE}Class${index}`);

/** `Class{i} rdfs:subClassOf Class{i+1}`, one statement per line; `closed` adds the edge back to Class0. */
function chainStatements(closed: boolean): Statement[] {
  const statements: Statement[] = [];
  const last = closed ? SIZE : SIZE - 1;
  for (let index = 0; index < last; index++) {
    const line = index + 1;
    statements.push({
      subject: terms[index],
      predicate: RDFS_SUBCLASS_OF,
      object: terms[(index + 1) % SIZE],
      graph: '',
      position: { file: 'chain.nt', line, column: 1 },
      objectLine: line,
    });
  }
  return statements;
}

describe('a million-node hierarchy', () => {
  it('finds no cycle in a 1,000,000-long subclass chain, and walks it end to end', () => {
    const graph = buildHierarchyGraph([source(chainStatements(false), {}, 'chain.nt')], testRoleMap(), { prefixes: [], roots: [] });
    expect(graph.nodeCount).toBe(SIZE);
    expect(graph.stats.edges['subclass-of']).toBe(SIZE - 1);
    const successors = (id: number): Int32Array => graph.successors('subclass-of', id);
    expect(cyclicComponents(graph.nodeCount, successors)).toEqual([]);
    expect(shortestClosedWalk(0, successors)).toBeUndefined();
    const path = shortestPath(0, SIZE - 1, successors);
    expect(path?.length).toBe(SIZE);
    expect(reachableFrom(0, successors).length).toBe(SIZE - 1);
    expect(graph.edgeStatements('subclass-of', SIZE - 2, SIZE - 1)[0].position.line).toBe(SIZE - 1);
  });

  it('finds one component of 1,000,000 members in a 1,000,000-member cycle, with a closed walk through all', () => {
    const graph = buildHierarchyGraph([source(chainStatements(true), {}, 'cycle.nt')], testRoleMap(), { prefixes: [], roots: [] });
    expect(graph.nodeCount).toBe(SIZE);
    const successors = (id: number): Int32Array => graph.successors('subclass-of', id);
    const cycles = cyclicComponents(graph.nodeCount, successors);
    expect(cycles).toHaveLength(1);
    expect(cycles[0]).toHaveLength(SIZE);
    expect(cycles[0][0]).toBe(0);
    expect(cycles[0][SIZE - 1]).toBe(SIZE - 1);
    const walk = shortestClosedWalk(0, successors);
    expect(walk).toHaveLength(SIZE + 1);
    expect(walk![0]).toBe(0);
    expect(walk![1]).toBe(1);
    expect(walk![SIZE]).toBe(0);
    // A second search on the same graph reuses the scratch arrays and still sees the whole cycle.
    expect(shortestClosedWalk(SIZE - 1, successors)).toHaveLength(SIZE + 1);
  });
});
