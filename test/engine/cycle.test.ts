// The cycle entry against graphlib's Tarjan components (an external reference implementation).
import { Graph, alg } from '@dagrejs/graphlib';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { runRules } from '../../src/engine/run.js';
import type { RuleDefinition } from '../../src/engine/rule.js';
import type { HierarchyGraph } from '../../src/graph/hierarchy-graph.js';
import type { Role } from '../../src/roles/role.js';
import { fixtureGraph } from './graph-fixture.js';

function cycleRule(path: string): RuleDefinition {
  return {
    id: 'test-cycle',
    level: 'error',
    summary: 'cycle',
    description: 'cycle',
    match: [{ type: 'cycle', path, members: '?m' }],
    report: { focus: '?m', nodes: ['?m'], unordered: [], message: '{m}' },
    examples: { flagged: '', clean: '' },
    file: 'test',
  };
}

const term = (id: number) => `https://data.northvale-rail.example/n${String(id).padStart(2, '0')}`;

function buildGraph(nodeCount: number, edges: [Role, number, number][]): HierarchyGraph {
  const perRole: Partial<Record<Role, { from: Int32Array; to: Int32Array }>> = {};
  for (const role of ['subclass-of', 'part-of'] as Role[]) {
    const mine = edges.filter(([edgeRole]) => edgeRole === role);
    perRole[role] = { from: Int32Array.from(mine, ([, from]) => from), to: Int32Array.from(mine, ([, , to]) => to) };
  }
  return fixtureGraph({ nodeCount, term, edges: perRole });
}

/** graphlib's components of a relation given as pairs, keeping those with a cycle (more than one member, or a self-loop). */
function referenceComponents(nodeCount: number, pairs: [number, number][]): string[][] {
  const reference = new Graph({ directed: true });
  for (let id = 0; id < nodeCount; id++) reference.setNode(term(id));
  for (const [from, to] of pairs) reference.setEdge(term(from), term(to));
  // graphlib alg.tarjan returns every strongly connected component, singletons included.
  return alg
    .tarjan(reference)
    .filter((component: string[]) => component.length > 1 || reference.hasEdge(component[0], component[0]))
    .map((component: string[]) => [...component].sort())
    .sort((left: string[], right: string[]) => (left[0] < right[0] ? -1 : 1));
}

const graphArbitrary = fc.integer({ min: 1, max: 9 }).chain((nodeCount) =>
  fc.record({
    nodeCount: fc.constant(nodeCount),
    edges: fc.array(fc.tuple(fc.constantFrom<Role>('subclass-of', 'part-of'), fc.nat(nodeCount - 1), fc.nat(nodeCount - 1)), { maxLength: 16 }),
  }),
);

/** The member list starts with its smallest term; the evidence is a closed walk of stated edges from it. */
function checkWalk(members: string[], evidence: { subject: string; object: unknown }[]): void {
  expect(members[0]).toBe([...members].sort()[0]);
  expect(evidence.length).toBeGreaterThan(0);
  expect(evidence[0].subject).toBe(members[0]);
  evidence.forEach((statement, index) => expect(statement.object).toBe(evidence[(index + 1) % evidence.length].subject));
}

describe('cycle components equal graphlib alg.tarjan (external reference)', () => {
  it('for a single role, on random graphs', () => {
    fc.assert(
      fc.property(graphArbitrary, ({ nodeCount, edges }) => {
        const graph = buildGraph(nodeCount, edges);
        const { findings, failures } = runRules(graph, [{ rule: cycleRule('subclass-of'), level: 'error' }]);
        expect(failures).toEqual([]);
        const pairs = edges.filter(([role]) => role === 'subclass-of').map(([, from, to]) => [from, to] as [number, number]);
        const found = findings.map((finding) => [...finding.nodes].sort()).sort((left, right) => (left[0] < right[0] ? -1 : 1));
        expect(found).toEqual(referenceComponents(nodeCount, pairs));
        for (const finding of findings) checkWalk(finding.nodes, finding.evidence);
      }),
      { numRuns: 300 },
    );
  });

  it('for a union of steps and for a two-step path, on random graphs', () => {
    fc.assert(
      fc.property(graphArbitrary, ({ nodeCount, edges }) => {
        const graph = buildGraph(nodeCount, edges);
        const union: [number, number][] = edges.map(([, from, to]) => [from, to]);
        const subclass = edges.filter(([role]) => role === 'subclass-of');
        const part = edges.filter(([role]) => role === 'part-of');
        const twoStep: [number, number][] = [];
        for (const [, a, b] of subclass) for (const [, c, d] of part) if (b === c) twoStep.push([a, d]);
        for (const [path, pairs] of [
          ['(subclass-of|part-of)+', union],
          ['subclass-of/part-of', twoStep],
        ] as [string, [number, number][]][]) {
          const { findings, failures } = runRules(graph, [{ rule: cycleRule(path), level: 'error' }]);
          expect(failures).toEqual([]);
          const found = findings.map((finding) => [...finding.nodes].sort()).sort((left, right) => (left[0] < right[0] ? -1 : 1));
          expect(found).toEqual(referenceComponents(nodeCount, pairs));
          for (const finding of findings) checkWalk(finding.nodes, finding.evidence);
        }
      }),
      { numRuns: 300 },
    );
  });
});
