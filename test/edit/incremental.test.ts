// Incremental evaluation of an edit: the patched graph and the seeded re-run against a full rebuild and a full lint.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { compareWithBaseline } from '../../src/baseline/compare.js';
import { rerunRules } from '../../src/engine/incremental.js';
import { loadBuiltinRules } from '../../src/engine/rule-file.js';
import { runRules } from '../../src/engine/run.js';
import { applyEditToGraph } from '../../src/graph/apply-edit.js';
import { buildHierarchyGraph } from '../../src/graph/build.js';
import { buildRoleMap } from '../../src/roles/role-map.js';
import { OWL_ALL_DISJOINT_CLASSES, OWL_MEMBERS, RDF_TYPE, RDFS_SUBCLASS_OF } from '../../src/roles/vocabulary.js';
import {
  HAS_PART,
  NV,
  PART_OF,
  USER_RULES,
  atOwnLevel,
  caseOf,
  comparableFindings,
  editedSources,
  expectSameGraph,
  graphsWithEdits,
  sourceOf,
  type GraphWithEdit,
} from './edit-harness.js';

const roleMap = buildRoleMap(['rdfs', 'owl', 'dcterms'], { 'part-of': { iri: [PART_OF], inverse: [HAS_PART] } });
const builtins = loadBuiltinRules().rules;
const rules = atOwnLevel([...builtins, ...USER_RULES]);

/** Rules run in full by the re-runs, by reason. */
const fullRunReasons = new Map<string, Set<string>>();

/** Every comparison one drawn case makes; returns whether the graph was patched (not rebuilt). */
function checkCase(drawn: GraphWithEdit): boolean {
  const { sources, delta, scope } = caseOf(drawn);
  const before = buildHierarchyGraph(sources, roleMap, scope);
  const beforeResult = runRules(before, rules);
  const applied = applyEditToGraph(before, delta, roleMap, scope);
  const rebuilt = buildHierarchyGraph(editedSources(sources, delta), roleMap, scope);
  const full = runRules(rebuilt, rules);
  expect(full.failures).toEqual([]);
  if (!applied.changes.rebuilt) expectSameGraph(applied.graph, rebuilt);
  // A full lint of the patched graph is a full lint of the rebuilt one.
  expect(comparableFindings(runRules(applied.graph, rules).findings)).toEqual(comparableFindings(full.findings));
  const incremental = rerunRules({ graph: before, result: beforeResult }, applied, rules);
  expect(incremental.failures).toEqual([]);
  if (!applied.changes.rebuilt) {
    for (const { ruleId, reason } of incremental.fullRuns) {
      if (!fullRunReasons.has(ruleId)) fullRunReasons.set(ruleId, new Set());
      fullRunReasons.get(ruleId)?.add(reason);
    }
  }
  expect(comparableFindings(incremental.findings)).toEqual(comparableFindings(full.findings));
  // The new and absent sets are the fingerprint difference of the two full lints.
  const compared = compareWithBaseline(incremental.findings, beforeResult.findings);
  const beforeFingerprints = new Set(beforeResult.findings.map((finding) => finding.fingerprint));
  const afterFingerprints = new Set(full.findings.map((finding) => finding.fingerprint));
  const states = (state: string): string[] => compared.filter((finding) => finding.baselineState === state).map((finding) => finding.fingerprint).sort();
  expect(states('new')).toEqual([...afterFingerprints].filter((fingerprint) => !beforeFingerprints.has(fingerprint)).sort());
  expect(states('absent')).toEqual([...beforeFingerprints].filter((fingerprint) => !afterFingerprints.has(fingerprint)).sort());
  return !applied.changes.rebuilt;
}

describe('incremental evaluation of an edit', () => {
  it('equals a full re-lint on 1,000 random graphs with random edits (fast-check)', () => {
    let patched = 0;
    let withChanges = 0;
    fc.assert(
      fc.property(graphsWithEdits, (drawn) => {
        if (checkCase(drawn)) patched++;
        if (drawn.add.length + drawn.removeIndexes.length > 0) withChanges++;
      }),
      { numRuns: 1000, seed: 20261202 },
    );
    // The cases patch the graph (not only rebuild it) and most of them change something.
    expect(patched).toBe(1000);
    expect(withChanges).toBeGreaterThan(800);
    // Only the user rule whose not block shares no variable runs in full; the seeded re-run covers the others.
    expect([...fullRunReasons.keys()]).toEqual(['mixed-cycle']);
  });

  it('makes and breaks cycles, makes new nodes and changes kinds, all patched', () => {
    const { sources, delta, scope } = caseOf({
      data: [
        [0, 1, 1],
        [1, 1, 2],
        [2, 1, 0],
        [3, 4, 2],
        [6, 0, 1],
      ],
      removeIndexes: [2, 4],
      removeOther: [],
      add: [
        [4, 1, 3],
        [3, 1, 4],
        [7, 0, 3],
        [5, 10, 5],
      ],
      repeat: [0],
      roots: [],
      scope: [NV],
    });
    const before = buildHierarchyGraph(sources, roleMap, scope);
    const applied = applyEditToGraph(before, delta, roleMap, scope);
    expect(applied.changes.rebuilt).toBe(false);
    const subclass = applied.changes.edges['subclass-of'];
    expect(subclass.removed.map(([from, to]) => [before.term(from), before.term(to)])).toEqual([[`${NV}Bogie`, `${NV}Vehicle`]]);
    expect(subclass.added.map(([from, to]) => [applied.graph.term(from), applied.graph.term(to)])).toEqual([
      [`${NV}Axle`, `${NV}Wheelset`],
      [`${NV}Wheelset`, `${NV}Axle`],
    ]);
    // Vehicle subclass-of Railcar is stated again by the edit: same edge, one more statement.
    expect(subclass.restated.map(([from, to]) => [before.term(from), before.term(to)])).toEqual([[`${NV}Vehicle`, `${NV}Railcar`]]);
    expect(applied.changes.addedNodes.map((id) => applied.graph.term(id)).sort()).toEqual(['http://www.w3.org/2002/07/owl#Class', `${NV}Axle`, `${NV}Coupler`, `${NV}Pantograph`]);
    // unit-417 lost its only statement (rdf:type Railcar).
    expect(applied.changes.vanishedNodes.map((id) => before.term(id))).toEqual([`${NV}unit-417`]);
    expect(checkCase({
      data: [[0, 1, 1], [1, 1, 2], [2, 1, 0], [3, 4, 2], [6, 0, 1]],
      removeIndexes: [2, 4],
      removeOther: [],
      add: [[4, 1, 3], [3, 1, 4], [7, 0, 3], [5, 10, 5]],
      repeat: [0],
      roots: [],
      scope: [NV],
    })).toBe(true);
  });

  it('re-reads a cycle that an edit merges with another, or splits, though it holds no end of a changed edge', () => {
    // Vehicle ⇄ Railcar is a cycle; Railcar → Bogie and Wheelset → Vehicle exist. Adding Bogie → Wheelset merges all four.
    const data: GraphWithEdit['data'] = [
      [0, 1, 1],
      [1, 1, 0],
      [1, 1, 2],
      [3, 1, 0],
    ];
    const merge = { data, removeIndexes: [], removeOther: [], add: [[2, 1, 3]], repeat: [], roots: [], scope: [NV] } satisfies GraphWithEdit;
    expect(checkCase(merge)).toBe(true);
    // The inverse edit on the merged data splits the component again.
    const split = { ...merge, data: [...data, [2, 1, 3]], add: [], removeIndexes: [4] } satisfies GraphWithEdit;
    expect(checkCase(split)).toBe(true);
  });

  it('rebuilds, and says why, when an edit touches OWL axiom structure', () => {
    const data = sourceOf('data.nt', [
      { subject: `${NV}Bogie`, predicate: RDFS_SUBCLASS_OF, object: `${NV}Vehicle`, graph: '', position: { file: 'data.nt', line: 1, column: 1 }, objectLine: 1 },
    ]);
    const scope = { prefixes: [NV], roots: [] };
    const before = buildHierarchyGraph([data], roleMap, scope);
    const at = (line: number) => ({ graph: '', position: { file: 'edit.ru', line, column: 1 }, objectLine: line });
    const delta = {
      file: 'edit.ru',
      added: [
        { subject: `${NV}axiom-1`, predicate: RDF_TYPE, object: OWL_ALL_DISJOINT_CLASSES, ...at(1) },
        { subject: `${NV}axiom-1`, predicate: OWL_MEMBERS, object: '_:list', ...at(2) },
      ],
      removed: [],
      ignored: 0,
    };
    const applied = applyEditToGraph(before, delta, roleMap, scope);
    expect(applied.changes.rebuilt).toBe(true);
    expect(applied.changes.reason).toContain('OWL axiom structure');
    expect(applied.changes.reason).toContain('edit.ru:1');
    const result = rerunRules({ graph: before, result: runRules(before, rules) }, applied, rules);
    expect(comparableFindings(result.findings)).toEqual(comparableFindings(runRules(buildHierarchyGraph(editedSources([data], delta), roleMap, scope), rules).findings));
  });
});
