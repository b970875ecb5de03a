// runRules: solutions to findings — evidence, messages, merging, ordering, fingerprints, scope and failure isolation.
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { fingerprintOf } from '../../src/engine/fingerprint.js';
import { runRules } from '../../src/engine/run.js';
import type { MatchEntry, RuleDefinition } from '../../src/engine/rule.js';
import type { HierarchyGraph } from '../../src/graph/hierarchy-graph.js';
import type { Role } from '../../src/roles/role.js';
import { NV, graphOf } from './graph-fixture.js';

/** A rule definition for tests; paths and entries as a rule file would give them. */
function defineRule(id: string, match: MatchEntry[], report: Partial<RuleDefinition['report']> & { focus: string }, fix?: RuleDefinition['fix']): RuleDefinition {
  return {
    id,
    level: 'warning',
    summary: `${id} summary`,
    description: `${id} description`,
    match,
    report: { nodes: [report.focus], unordered: [], message: `{${report.focus.slice(1)}}`, ...report },
    ...(fix === undefined ? {} : { fix }),
    examples: { flagged: '', clean: '' },
    file: `rules/${id}.yaml`,
  };
}

const path = (subject: string, text: string, object: string): MatchEntry => ({ type: 'path', subject, path: text, object });

const kindAndPart = defineRule(
  'kind-and-part',
  [path('?a', 'part-of', '?b'), path('?a', 'subclass-of+|instance-of/subclass-of*', '?b')],
  { focus: '?a', nodes: ['?a', '?b'], message: '{a} is part of {b} and also a kind of {b}' },
  { remove: [{ subject: '?a', role: 'part-of', object: '?b' }] },
);

describe('runRules findings', () => {
  it('reports a solution with evidence in match order, message, fix and fingerprint', () => {
    // Lines: 1 DrivingCab part-of DrivingCar, 2 DrivingCab subclass-of Cab, 3 Cab subclass-of DrivingCar.
    const graph = graphOf([
      ['DrivingCab', 'part-of', 'DrivingCar'],
      ['DrivingCab', 'subclass-of', 'Cab'],
      ['Cab', 'subclass-of', 'DrivingCar'],
      ['Bogie', 'part-of', 'Wagon'],
    ]);
    const { findings, failures } = runRules(graph, [{ rule: kindAndPart, level: 'error' }]);
    expect(failures).toEqual([]);
    expect(findings).toHaveLength(1);
    const [finding] = findings;
    expect(finding.ruleId).toBe('kind-and-part');
    expect(finding.level).toBe('error');
    expect(finding.focus).toBe(`${NV}DrivingCab`);
    expect(finding.nodes).toEqual([`${NV}DrivingCab`, `${NV}DrivingCar`]);
    expect(finding.message).toBe('nv:DrivingCab is part of nv:DrivingCar and also a kind of nv:DrivingCar');
    expect(finding.evidence.map((statement) => statement.position.line)).toEqual([1, 2, 3]);
    expect(finding.fix?.remove.map((statement) => statement.position.line)).toEqual([1]);
    // The fingerprint is sha-256 of ruleId and nodes joined by newlines (design.md, Findings), computed here with node:crypto.
    const expected = createHash('sha256').update(`kind-and-part\n${NV}DrivingCab\n${NV}DrivingCar`).digest('hex');
    expect(finding.fingerprint).toBe(expected);
    expect(fingerprintOf('kind-and-part', finding.nodes)).toBe(expected);
  });

  it('merges solutions with the same nodes, sorting unordered pairs, and keeps the first evidence', () => {
    const rule = defineRule(
      'disjoint-overlap',
      [
        path('?c1', 'disjoint-with', '?c2'),
        path('?x', 'instance-of/subclass-of*', '?c1'),
        path('?x', 'instance-of/subclass-of*', '?c2'),
      ],
      { focus: '?x', nodes: ['?x', '?c1', '?c2'], unordered: [['?c1', '?c2']], message: '{x} is under {c1} and {c2}' },
    );
    const graph = graphOf([
      ['Wagon', 'disjoint-with', 'Locomotive'],
      ['unit-407', 'instance-of', 'Locomotive'],
      ['unit-407', 'instance-of', 'Wagon'],
    ]);
    const { findings } = runRules(graph, [{ rule, level: 'error' }]);
    expect(findings).toHaveLength(1);
    expect(findings[0].nodes).toEqual([`${NV}unit-407`, `${NV}Locomotive`, `${NV}Wagon`]);
    expect(findings[0].message).toBe('nv:unit-407 is under nv:Locomotive and nv:Wagon');
    expect(findings[0].evidence.map((statement) => statement.position.line).sort()).toEqual([1, 2, 3]);
  });

  it('reports only findings whose focus is in scope', () => {
    const graph = graphOf(
      [
        ['Pantograph', 'part-of', 'Roof'],
        ['Pantograph', 'subclass-of', 'Roof'],
        ['Borrowed', 'part-of', 'Other'],
        ['Borrowed', 'subclass-of', 'Other'],
      ],
      { 'in-scope': ['Pantograph', 'Roof', 'Other'] },
    );
    const { findings } = runRules(graph, [{ rule: kindAndPart, level: 'warning' }]);
    expect(findings.map((finding) => finding.focus)).toEqual([`${NV}Pantograph`]);
  });

  it('sorts findings by primary evidence position, then rule id, then fingerprint', () => {
    const graph = graphOf([
      ['B', 'part-of', 'C'],
      ['A', 'part-of', 'C'],
      ['B', 'subclass-of', 'C'],
      ['A', 'subclass-of', 'C'],
    ]);
    const copy = { ...kindAndPart, id: 'another-rule' };
    const { findings } = runRules(graph, [
      { rule: kindAndPart, level: 'warning' },
      { rule: copy, level: 'note' },
    ]);
    expect(findings.map((finding) => [finding.evidence[0].position.line, finding.ruleId])).toEqual([
      [1, 'another-rule'],
      [1, 'kind-and-part'],
      [2, 'another-rule'],
      [2, 'kind-and-part'],
    ]);
  });

  it('uses the focus node first statement as evidence when no path gives any', () => {
    const orphan = defineRule('orphan-class', [
      { type: 'is', variable: '?c', kind: 'class' },
      { type: 'absent', variable: '?c', path: 'subclass-of' },
      { type: 'not', entries: [{ type: 'is', variable: '?c', kind: 'root' }] },
    ], { focus: '?c', message: '{c} has no superclass' });
    const graph = graphOf(
      [
        ['Asset', 'instance-of', 'Class'],
        ['Wagon', 'subclass-of', 'RollingStock'],
        ['RollingStock', 'subclass-of', 'Asset'],
      ],
      { root: ['Asset'] },
    );
    const { findings } = runRules(graph, [{ rule: orphan, level: 'note' }]);
    // Class is a class (object of instance-of) with no superclass; Asset is a configured root.
    expect(findings.map((finding) => finding.focus)).toEqual([`${NV}Class`]);
    expect(findings[0].evidence).toEqual([]);
  });

  it('reports a cycle once: its nodes by term, its message along the walk from the member that sorts first, closing back to it', () => {
    const cycle = defineRule('subclass-cycle', [{ type: 'cycle', path: 'subclass-of', members: '?m' }], {
      focus: '?m',
      nodes: ['?m'],
      message: '{m} form a cycle',
    });
    // Lines 1–3 form the cycle Wagon → Freight → Bogie → Wagon; line 4 is a self-loop.
    const graph = graphOf([
      ['Wagon', 'subclass-of', 'Freight'],
      ['Freight', 'subclass-of', 'Bogie'],
      ['Bogie', 'subclass-of', 'Wagon'],
      ['Signal', 'subclass-of', 'Signal'],
      ['Signal', 'subclass-of', 'Asset'],
    ]);
    const { findings } = runRules(graph, [{ rule: cycle, level: 'error' }]);
    expect(findings.map((finding) => finding.nodes)).toEqual([[`${NV}Bogie`, `${NV}Freight`, `${NV}Wagon`], [`${NV}Signal`]]);
    expect(findings[0].message).toBe('nv:Bogie → nv:Wagon → nv:Freight → nv:Bogie form a cycle');
    expect(findings[0].focus).toBe(`${NV}Bogie`);
    expect(findings[0].evidence.map((statement) => statement.position.line)).toEqual([3, 1, 2]);
    expect(findings[1].message).toBe('nv:Signal → nv:Signal form a cycle');
    expect(findings[1].evidence.map((statement) => statement.position.line)).toEqual([4]);
  });

  it('lists members off the shortest closed walk after it, by term, when a component has two loops', () => {
    const cycle = defineRule('part-cycle', [{ type: 'cycle', path: 'part-of', members: '?m' }], { focus: '?m', nodes: ['?m'], message: '{m}' });
    // Axle → Bogie → Axle is the shortest closed walk from Axle; Wheel and Hub form a longer loop through Axle.
    const graph = graphOf([
      ['Axle', 'part-of', 'Wheel'],
      ['Wheel', 'part-of', 'Hub'],
      ['Hub', 'part-of', 'Axle'],
      ['Axle', 'part-of', 'Bogie'],
      ['Bogie', 'part-of', 'Axle'],
    ]);
    const { findings } = runRules(graph, [{ rule: cycle, level: 'error' }]);
    expect(findings).toHaveLength(1);
    expect(findings[0].nodes).toEqual([`${NV}Axle`, `${NV}Bogie`, `${NV}Hub`, `${NV}Wheel`]);
    expect(findings[0].evidence.map((statement) => statement.position.line)).toEqual([4, 5]);
  });

  it('evaluates not as an anti-join with the outer bindings, and nested not inside it', () => {
    // "x is under c with no stated step to a y that is itself under c" — nested not keeps y ≠ x.
    const rule = defineRule(
      'most-general',
      [
        path('?x', 'subclass-of+', '?c'),
        { type: 'is', variable: '?c', kind: 'deprecated' },
        { type: 'not', entries: [path('?x', 'subclass-of', '?y'), path('?y', 'subclass-of+', '?c'), { type: 'not', entries: [path('?y', 'subclass-of+', '?x')] }] },
      ],
      { focus: '?x', nodes: ['?x', '?c'], message: '{x} under {c}' },
    );
    const graph = graphOf(
      [
        ['Tamper', 'subclass-of', 'MaintenanceVehicle'],
        ['MaintenanceVehicle', 'subclass-of', 'OldStock'],
      ],
      { deprecated: ['OldStock'] },
    );
    const { findings } = runRules(graph, [{ rule, level: 'note' }]);
    expect(findings.map((finding) => finding.focus)).toEqual([`${NV}MaintenanceVehicle`]);
  });
});

describe('runRules failure isolation', () => {
  it('turns a rule that throws into a RuleFailure and still reports the other rules', () => {
    const graph = graphOf([
      ['Pantograph', 'part-of', 'Roof'],
      ['Pantograph', 'subclass-of', 'Roof'],
      ['Coupler', 'equivalent-to', 'Coupling'],
    ]);
    // A graph stub whose equivalent-to adjacency throws, as a broken graph or rule would.
    const broken: HierarchyGraph = new Proxy(graph, {
      get(target, property, receiver) {
        if (property === 'successors' || property === 'predecessors') {
          const original = target[property];
          return (role: Role, id: number) => {
            if (role === 'equivalent-to') throw new Error('equivalent-to adjacency is unavailable');
            return original.call(target, role, id);
          };
        }
        return Reflect.get(target, property, receiver);
      },
    });
    const failing = defineRule('equivalent-chain', [path('?a', 'equivalent-to/equivalent-to', '?b')], { focus: '?a' });
    const invalid = defineRule('broken-path', [path('?a', 'part-of/', '?b')], { focus: '?a' });
    const { findings, failures } = runRules(broken, [
      { rule: failing, level: 'error' },
      { rule: kindAndPart, level: 'warning' },
      { rule: invalid, level: 'error' },
    ]);
    expect(failures).toEqual([
      { ruleId: 'equivalent-chain', message: 'equivalent-to adjacency is unavailable' },
      { ruleId: 'broken-path', message: expect.stringContaining("invalid path 'part-of/'") },
    ]);
    expect(findings.map((finding) => finding.ruleId)).toEqual(['kind-and-part']);
  });
});
