// The planner: join order by bindings and estimated cost, filters as soon as their variables are bound.
import { describe, expect, it } from 'vitest';
import { SearchArena } from '../../src/engine/path-search.js';
import { PlanContext, planRule, type PlanStep } from '../../src/engine/plan.js';
import { compileRule } from '../../src/engine/program.js';
import { loadBuiltinRules } from '../../src/engine/rule-file.js';
import type { MatchEntry, RuleDefinition } from '../../src/engine/rule.js';
import { graphOf } from './graph-fixture.js';

const graph = graphOf([
  ['Wagon', 'subclass-of', 'RollingStock'],
  ['FlatWagon', 'subclass-of', 'Wagon'],
  ['FlatWagon', 'subclass-of', 'RollingStock'],
  ['Bogie', 'part-of', 'Wagon'],
  ['unit-12', 'instance-of', 'FlatWagon'],
]);

function stepsOf(rule: RuleDefinition): PlanStep[] {
  return planRule(compileRule(rule), new PlanContext(graph, new SearchArena(graph.nodeCount))).steps;
}

function builtin(id: string): RuleDefinition {
  const rule = loadBuiltinRules().rules.find((candidate) => candidate.id === id);
  if (rule === undefined) throw new Error(`missing built-in ${id}`);
  return rule;
}

function ruleWith(match: MatchEntry[]): RuleDefinition {
  return { ...builtin('kind-and-part'), match, report: { focus: '?a', nodes: ['?a'], unordered: [], message: '{a}' } };
}

describe('planRule', () => {
  it('generates from the single-role edges, then checks the closure with both ends bound', () => {
    expect(stepsOf(builtin('kind-and-part')).map((step) => step.kind)).toEqual(['generate', 'path-check']);
  });

  it('runs the anti-join on ?a as soon as ?a is bound, and differ right after ?b is bound', () => {
    // redundant-subclass: [?a sc ?c], [?a sc ?b], differ, [?b sc+ ?c], not [?a sc+ ?a], not [?c sc+ ?b].
    const steps = stepsOf(builtin('redundant-subclass'));
    expect(steps.map((step) => step.kind)).toEqual(['generate', 'anti-join', 'expand', 'differ', 'path-check', 'anti-join']);
    // The anti-join's [?a, subclass-of+, ?a] is a single check, answered from cyclic components.
    const antiJoin = steps[1] as Extract<PlanStep, { kind: 'anti-join' }>;
    expect(antiJoin.steps.map((step) => step.kind)).toEqual(['path-check']);
  });

  it('plans filters on a node-kind generator in the order their variables allow', () => {
    const steps = stepsOf(builtin('orphan-class'));
    expect(steps.map((step) => step.kind)).toEqual(['is', 'is', 'anti-join', 'absent', 'anti-join']);
    expect((steps[0] as Extract<PlanStep, { kind: 'is' }>).generate).toBe(true);
    expect((steps[1] as Extract<PlanStep, { kind: 'is' }>).generate).toBe(false);
    const last = steps[4] as Extract<PlanStep, { kind: 'anti-join' }>;
    expect(last.steps.map((step) => step.kind)).toEqual(['expand', 'is']);
  });

  it('expands from the bound end, walking the path backwards when only the object is bound', () => {
    const steps = stepsOf(ruleWith([
      { type: 'is', variable: '?b', kind: 'deprecated' },
      { type: 'path', subject: '?a', path: 'instance-of/subclass-of*', object: '?b' },
    ]));
    expect(steps.map((step) => step.kind)).toEqual(['is', 'expand']);
    const expand = steps[1] as Extract<PlanStep, { kind: 'expand' }>;
    expect(expand.bound).not.toBe(expand.free);
    expect(expand.search.path).toEqual({
      type: 'sequence',
      steps: [
        { type: 'modified', modifier: '*', path: { type: 'inverse', path: { type: 'role', role: 'subclass-of' } } },
        { type: 'inverse', path: { type: 'role', role: 'instance-of' } },
      ],
    });
  });

  it('fails for a filter whose variable no positive entry binds', () => {
    expect(() => stepsOf(ruleWith([
      { type: 'path', subject: '?a', path: 'part-of', object: '?b' },
      { type: 'differ', left: '?a', right: '?z' },
    ]))).toThrow(/no positive entry binds/);
  });
});
