// A 1,000,000-long subclass chain and a 1,000,000-member cycle run through the built-in rules without overflowing the stack.
import { describe, expect, it } from 'vitest';
import { loadBuiltinRules } from '../../src/engine/rule-file.js';
import { runRules } from '../../src/engine/run.js';
import type { RuleDefinition } from '../../src/engine/rule.js';
import { NV, fixtureGraph } from './graph-fixture.js';

const SIZE = 1_000_000;

function builtin(id: string): RuleDefinition {
  const rule = loadBuiltinRules().rules.find((candidate) => candidate.id === id);
  if (rule === undefined) throw new Error(`built-in rule ${id} is missing`);
  return rule;
}

/** Node i subclass-of node i + 1; with `closed`, the last node points back to node 0. */
function chain(closed: boolean) {
  const edgeCount = closed ? SIZE : SIZE - 1;
  const from = new Int32Array(edgeCount);
  const to = new Int32Array(edgeCount);
  for (let index = 0; index < edgeCount; index++) {
    from[index] = index;
    to[index] = (index + 1) % SIZE;
  }
  return fixtureGraph({ nodeCount: SIZE, term: (id) => `${NV}c${String(id).padStart(7, '0')}`, edges: { 'subclass-of': { from, to } } });
}

describe('scale', () => {
  it('runs every built-in rule on a 1,000,000-long chain: only its top class is reported (no superclass)', () => {
    const graph = chain(false);
    const rules = loadBuiltinRules().rules;
    expect(rules.map((rule) => rule.id)).toContain('redundant-subclass');
    const { findings, failures } = runRules(graph, rules.map((rule) => ({ rule, level: rule.level })));
    expect(failures).toEqual([]);
    expect(findings.map((finding) => [finding.ruleId, finding.focus])).toEqual([['orphan-class', `${NV}c0999999`]]);
  });

  it('finds the one cycle of 1,000,000 members, ordered from the smallest term, and adds no redundant edge', () => {
    const graph = chain(true);
    const { findings, failures } = runRules(graph, [
      { rule: builtin('subclass-cycle'), level: 'error' },
      { rule: builtin('redundant-subclass'), level: 'warning' },
    ]);
    expect(failures).toEqual([]);
    expect(findings).toHaveLength(1);
    const [cycle] = findings;
    expect(cycle.ruleId).toBe('subclass-cycle');
    expect(cycle.nodes).toHaveLength(SIZE);
    expect(cycle.nodes[0]).toBe(`${NV}c0000000`);
    expect(cycle.nodes[1]).toBe(`${NV}c0000001`);
    expect(cycle.nodes[SIZE - 1]).toBe(`${NV}c0999999`);
    expect(cycle.evidence).toHaveLength(SIZE);
    expect(cycle.evidence[SIZE - 1].object).toBe(`${NV}c0000000`);
  });

  it('flags every shortcut edge of a 200,000-long chain where each class also points two steps up', () => {
    // Each node i also points to i + 2: every such edge is redundant through i + 1. The deep chain
    // makes a search without pruning quadratic; 200,000 keeps the 199,998 findings quick to build.
    const SIZE = 200_000;
    const count = SIZE - 1 + SIZE - 2;
    const from = new Int32Array(count);
    const to = new Int32Array(count);
    let next = 0;
    for (let index = 0; index + 1 < SIZE; index++) {
      from[next] = index;
      to[next++] = index + 1;
      if (index + 2 < SIZE) {
        from[next] = index;
        to[next++] = index + 2;
      }
    }
    const graph = fixtureGraph({ nodeCount: SIZE, term: (id) => `${NV}c${String(id).padStart(7, '0')}`, edges: { 'subclass-of': { from, to } } });
    const { findings, failures } = runRules(graph, [{ rule: builtin('redundant-subclass'), level: 'warning' }]);
    expect(failures).toEqual([]);
    expect(findings).toHaveLength(SIZE - 2);
    expect(findings[0].nodes).toEqual([`${NV}c0000000`, `${NV}c0000002`]);
  });

  it('finds one disjoint-overlap at the top of a 200,000-long chain whose every class falls under both classes', () => {
    // Every class of the chain is under both disjoint classes; only the most general one is the fact.
    // Checking each class against a fixed class by a fresh upward search would be quadratic here.
    const SIZE = 200_000;
    const chainEdges = SIZE - 1 + Math.floor((SIZE - 2) / 2);
    const from = new Int32Array(chainEdges + 2);
    const to = new Int32Array(chainEdges + 2);
    let next = 0;
    for (let index = 0; index + 1 < SIZE; index++) {
      from[next] = index;
      to[next++] = index + 1;
      if (index % 2 === 0 && index + 2 < SIZE) {
        from[next] = index;
        to[next++] = index + 2;
      }
    }
    const [left, right] = [SIZE, SIZE + 1];
    from[next] = SIZE - 1;
    to[next++] = left;
    from[next] = SIZE - 1;
    to[next++] = right;
    const graph = fixtureGraph({
      nodeCount: SIZE + 2,
      term: (id) => (id === left ? `${NV}Left` : id === right ? `${NV}Right` : `${NV}c${String(id).padStart(7, '0')}`),
      edges: {
        'subclass-of': { from: from.slice(0, next), to: to.slice(0, next) },
        'disjoint-with': { from: Int32Array.of(left), to: Int32Array.of(right) },
      },
    });
    const { findings, failures } = runRules(graph, [{ rule: builtin('disjoint-overlap'), level: 'error' }]);
    expect(failures).toEqual([]);
    expect(findings.map((finding) => finding.nodes)).toEqual([[`${NV}c0199999`, `${NV}Left`, `${NV}Right`]]);
  });
});
