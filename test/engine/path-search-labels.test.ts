// Path checks between two bound nodes once reachability labels prune them, held against graphlib and unpruned searches.
import { Graph, alg } from '@dagrejs/graphlib';
import { describe, expect, it } from 'vitest';
import { parseValidPath } from '../../src/engine/path.js';
import { BACKWARD, FORWARD } from '../../src/engine/automaton.js';
import { PathSearch, SearchArena } from '../../src/engine/path-search.js';
import { NV, fixtureGraph } from './graph-fixture.js';

const CLASSES = 3000;
const INDIVIDUALS = 300;

/**
 * A hierarchy shaped like the benchmark's generated one: each class has one or two superclasses
 * among the classes numbered below it, a few part-of edges to lower classes, two planted 2-cycles,
 * and individuals that are instances of random classes (a fixed linear congruential sequence).
 */
function generatedHierarchy() {
  let seed = 2024;
  const next = (bound: number): number => {
    seed = (seed * 1103515245 + 12345) % 2 ** 31;
    return seed % bound;
  };
  const subclass: [number, number][] = [];
  const partOf: [number, number][] = [];
  for (let id = 1; id < CLASSES; id++) {
    const supers = new Set([next(id)]);
    if (id > 1 && next(2) === 1) supers.add(next(id));
    for (const to of supers) subclass.push([id, to]);
    if (next(33) === 0) partOf.push([id, next(id)]);
  }
  // Two planted 2-cycles, so two components have more than one member.
  subclass.push([10, 500], [500, 10], [700, 1500], [1500, 700]);
  const instance: [number, number][] = [];
  for (let id = CLASSES; id < CLASSES + INDIVIDUALS; id++) instance.push([id, next(CLASSES)]);
  const edges = (pairs: [number, number][]) => ({ from: Int32Array.from(pairs, (pair) => pair[0]), to: Int32Array.from(pairs, (pair) => pair[1]) });
  const graph = fixtureGraph({
    nodeCount: CLASSES + INDIVIDUALS,
    term: (id) => `${NV}def/C${id}`,
    edges: { 'subclass-of': edges(subclass), 'part-of': edges(partOf), 'instance-of': edges(instance) },
  });
  return { graph, subclass };
}

/** Per class, every class it reaches by subclass-of in zero or more steps, from graphlib's depth-first preorder. */
function referenceReach(subclass: [number, number][]): Set<number>[] {
  // Reference: @dagrejs/graphlib 4 alg.preorder, a general-purpose graph library's depth-first walk.
  const reference = new Graph({ directed: true });
  for (let id = 0; id < CLASSES; id++) reference.setNode(String(id));
  for (const [from, to] of subclass) reference.setEdge(String(from), String(to));
  return Array.from({ length: CLASSES }, (_, id) => new Set(alg.preorder(reference, [String(id)]).map(Number)));
}

/** The labels a search has built (a private field: read here only to show that the checks below went through them). */
function hasLabels(search: PathSearch): boolean {
  return (search as unknown as { reachLabels?: unknown }).reachLabels !== undefined;
}

describe('path checks pruned by reachability labels', () => {
  const { graph, subclass } = generatedHierarchy();

  it('answers subclass-of+ and subclass-of* between 40,000 class pairs as graphlib reachability does', () => {
    const reach = referenceReach(subclass);
    const arena = new SearchArena(graph.nodeCount);
    const plus = new PathSearch(graph, parseValidPath('subclass-of+'), arena);
    const star = new PathSearch(graph, parseValidPath('subclass-of*'), arena);
    const wrong: string[] = [];
    let reachable = 0;
    for (let from = 0; from < CLASSES; from += 15) {
      for (let to = 0; to < CLASSES; to += 15) {
        if (from === to) continue;
        const expected = reach[from].has(to);
        if (expected) reachable++;
        if (plus.holds(from, to) !== expected) wrong.push(`subclass-of+ ${from} ${to}`);
        if (star.holds(from, to) !== expected) wrong.push(`subclass-of* ${from} ${to}`);
      }
    }
    expect(wrong).toEqual([]);
    // Both kinds of answer occur (244 of the pairs are reachable here), and the later checks went through the labels.
    expect(reachable).toBeGreaterThan(100);
    expect(reachable).toBeLessThan(39_000);
    expect(hasLabels(plus)).toBe(true);
    expect(hasLabels(star)).toBe(true);
  });

  it('answers paths that mix roles as an unpruned search from the start does', () => {
    const arena = new SearchArena(graph.nodeCount);
    for (const text of ['subclass-of+|instance-of/subclass-of*', 'part-of/subclass-of*', '(subclass-of|part-of)+', '^subclass-of+']) {
      const checked = new PathSearch(graph, parseValidPath(text), arena);
      // `from` walks the whole path without an end to prune towards: the answers to compare with.
      const plain = new PathSearch(graph, parseValidPath(text), arena);
      const wrong: string[] = [];
      let holding = 0;
      for (let from = 0; from < graph.nodeCount; from += 11) {
        const ends = new Set(plain.from(from));
        for (let to = 0; to < CLASSES; to += 13) {
          const expected = ends.has(to);
          if (expected) holding++;
          if (checked.holds(from, to) !== expected) wrong.push(`${text} ${from} ${to}`);
        }
      }
      expect(wrong, text).toEqual([]);
      expect(holding, text).toBeGreaterThan(0);
      expect(hasLabels(checked), text).toBe(true);
    }
  });

  it('shares one component assignment per union of steps, numbered backwards for the steps walked the other way', () => {
    const arena = new SearchArena(graph.nodeCount);
    const up = arena.stepComponents(graph, [{ role: 'subclass-of', direction: FORWARD }]);
    const down = arena.stepComponents(graph, [{ role: 'subclass-of', direction: BACKWARD }]);
    expect(arena.stepComponents(graph, [{ role: 'subclass-of', direction: FORWARD }])).toBe(up);
    // Reference: @dagrejs/graphlib 4 alg.tarjan gives the partition; the planted 2-cycles are its only groups of two.
    const reference = new Graph({ directed: true });
    for (let id = 0; id < CLASSES; id++) reference.setNode(String(id));
    for (const [from, to] of subclass) reference.setEdge(String(from), String(to));
    const pairs = alg.tarjan(reference).filter((group) => group.length > 1).map((group) => group.map(Number).sort((a, b) => a - b));
    expect(pairs.sort((a, b) => a[0] - b[0])).toEqual([[10, 500], [700, 1500]]);
    expect(up.count).toBe(graph.nodeCount - 2);
    expect(down.count).toBe(up.count);
    expect(up.component[10]).toBe(up.component[500]);
    expect(down.component[700]).toBe(down.component[1500]);
    // Every edge goes from a higher or equal component to a lower one in its own walking direction.
    const misordered = subclass.filter(([from, to]) => up.component[from] < up.component[to] || down.component[to] < down.component[from]);
    expect(misordered).toEqual([]);
  });
});
