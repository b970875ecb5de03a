// Push-down of user rules: rule files written as a team would, compiled and held to the in-memory findings.
import path from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { loadConfig } from '../../src/config/load-config.js';
import { parseRuleFile } from '../../src/engine/rule-file.js';
import type { RuleDefinition } from '../../src/engine/rule.js';
import { loadSources } from '../../src/load/sources.js';
import { buildRoleMap } from '../../src/roles/role-map.js';
import { bothWays, comparable } from './sparql-harness.js';
import { graphs, randomRun } from './sparql-random-graphs.js';
import { userRuleText } from './rule-text.js';

/** A rule file for the push-down tests. */
function ruleText(id: string, match: string, report: string): string {
  return userRuleText(id, match, report, 'push-down tests');
}

/** User rules covering what the built-in rules do not: kind generators, inverse, ?, equivalence, a longer cycle path, unordered foci. */
const USER_RULES: Record<string, string> = {
  'lone-in-scope-term': ruleText(
    'lone-in-scope-term',
    `- { is: [?x, in-scope] }
- { absent: [?x, instance-of|subclass-of|part-of] }
- not:
    - [?y, part-of, ?x]`,
    `focus: ?x
nodes: [?x]
message: "{x} stands alone"`,
  ),
  'root-with-superclass': ruleText(
    'root-with-superclass',
    `- { is: [?r, root] }
- [?r, subclass-of+, ?p]`,
    `focus: ?r
nodes: [?r, ?p]
message: "root {r} is below {p}"`,
  ),
  'part-of-a-kind': ruleText(
    'part-of-a-kind',
    `- [?a, ^part-of/subclass-of?, ?b]
- { differ: [?a, ?b] }
- { is: [?b, class] }`,
    `focus: ?a
nodes: [?a, ?b]
message: "{a} has a part that is (a kind of) {b}"`,
  ),
  'equivalence-loop': ruleText(
    'equivalence-loop',
    `- cycle: { path: equivalent-to|subclass-of, members: ?m }`,
    `focus: ?m
nodes: [?m]
message: "{m}"`,
  ),
  'two-step-part-cycle': ruleText(
    'two-step-part-cycle',
    `- cycle: { path: (part-of/part-of)+, members: ?m }`,
    `focus: ?m
nodes: [?m]
message: "{m}"`,
  ),
  'disjoint-pair': ruleText(
    'disjoint-pair',
    `- [?a, disjoint-with, ?b]
- { differ: [?a, ?b] }`,
    `focus: ?a
nodes: [?a, ?b]
unordered:
  - [?a, ?b]
message: "{a} and {b} are disjoint"`,
  ),
  'deprecated-individual-type': ruleText(
    'deprecated-individual-type',
    `- { is: [?i, individual] }
- [?i, instance-of, ?c]
- { is: [?c, deprecated] }
- not:
    - { is: [?c, declared-class] }`,
    `focus: ?i
nodes: [?i, ?c]
message: "{i} is typed with {c}"`,
  ),
};

function userRules(): RuleDefinition[] {
  return Object.entries(USER_RULES).map(([id, text]) => {
    const { rule, errors } = parseRuleFile(text, `team-rules/${id}.yaml`);
    expect(errors).toEqual([]);
    if (rule === undefined) throw new Error(`rule ${id} did not parse`);
    return rule;
  });
}

const DEMO = path.resolve(import.meta.dirname, '../../fixtures/demo');

describe('push-down of user rules', () => {
  const rules = userRules();

  it('gives the in-memory findings on the demo', async () => {
    const { config } = loadConfig(path.join(DEMO, 'isapart.yaml'));
    const sources = (await loadSources([DEMO], { cwd: DEMO })).sources;
    const setting = { roleMap: buildRoleMap(config.presets, config.roles), scope: config.scope, roots: config.roots };
    const { memory, pushed } = bothWays(sources, rules, setting);
    expect(memory.length).toBeGreaterThan(0);
    expect(comparable(pushed)).toEqual(comparable(memory));
  });

  it('gives the in-memory findings on 150 random graphs', { timeout: 300_000 }, () => {
    const seen = new Set<string>();
    fc.assert(
      fc.property(graphs, (graph) => {
        const { sources, setting } = randomRun(graph);
        const { memory, pushed } = bothWays(sources, rules, setting);
        for (const finding of memory) seen.add(finding.ruleId);
        expect(comparable(pushed)).toEqual(comparable(memory));
      }),
      { numRuns: 150, seed: 6 },
    );
    // Every user rule must have had findings to compare on some graph.
    expect([...seen].sort()).toEqual(rules.map((rule) => rule.id).sort());
  });
});
