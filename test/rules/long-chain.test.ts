// The nine rules over a 1,000,000-long subclass-of chain: no stack overflow, and the right findings.
import { describe, expect, it } from 'vitest';
import { DEFAULT_PRESETS } from '../../src/config/config.js';
import { loadBuiltinRules } from '../../src/engine/rule-file.js';
import { runRules } from '../../src/engine/run.js';
import { buildHierarchyGraph } from '../../src/graph/build.js';
import type { Statement } from '../../src/load/statement.js';
import { buildRoleMap } from '../../src/roles/role-map.js';

const CHAIN_LENGTH = 1_000_000;
const CLASS = 'https://data.northvale-rail.example/def/Level';
const SUBCLASS_OF = 'http://www.w3.org/2000/01/rdf-schema#subClassOf';

function subclassStatement(subject: string, object: string, line: number): Statement {
  return { subject, predicate: SUBCLASS_OF, object, graph: '', position: { file: 'chain.nt', line, column: 1 }, objectLine: line };
}

describe('a 1,000,000-long subclass-of chain', () => {
  it('gives exactly the orphan top and the one shortcut, without overflowing the stack', () => {
    // Level0 ⊑ Level1 ⊑ ... ⊑ Level999999, plus the shortcut Level0 ⊑ Level2 (invented data).
    const statements: Statement[] = [];
    for (let index = 0; index + 1 < CHAIN_LENGTH; index++) {
      statements.push(subclassStatement(`${CLASS}${index}`, `${CLASS}${index + 1}`, index + 1));
    }
    statements.push(subclassStatement(`${CLASS}0`, `${CLASS}2`, CHAIN_LENGTH));
    const source = { file: 'chain.nt', format: 'n-triples' as const, statements, errors: [], allowComments: [], prefixes: {} };
    const graph = buildHierarchyGraph([source], buildRoleMap(DEFAULT_PRESETS, {}), { prefixes: [], roots: [] });
    const { rules } = loadBuiltinRules();
    const { findings, failures } = runRules(graph, rules.map((rule) => ({ rule, level: rule.level })));
    expect(failures).toEqual([]);
    expect(findings.map((finding) => [finding.ruleId, finding.nodes]).sort()).toEqual([
      ['orphan-class', [`${CLASS}${CHAIN_LENGTH - 1}`]],
      ['redundant-subclass', [`${CLASS}0`, `${CLASS}2`]],
    ]);
  });
});
