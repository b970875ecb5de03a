// Random graphs and random edits for the incremental-evaluation tests, and the comparisons they make.
import fc from 'fast-check';
import { expect } from 'vitest';
import { editedSources, statementKey, type EditDelta } from '../../src/edit/delta.js';
import type { Finding } from '../../src/engine/finding.js';
import { parseRuleFile } from '../../src/engine/rule-file.js';
import type { RuleDefinition } from '../../src/engine/rule.js';
import type { RuleToRun } from '../../src/engine/run.js';
import type { HierarchyGraph, ScopeOptions } from '../../src/graph/hierarchy-graph.js';
import { NODE_KINDS } from '../../src/graph/hierarchy-graph.js';
import type { Literal, LoadedSource, Statement } from '../../src/load/statement.js';
import { ROLES } from '../../src/roles/role.js';
import {
  DCTERMS_HAS_PART,
  DCTERMS_IS_PART_OF,
  OWL_CLASS,
  OWL_DEPRECATED,
  OWL_DISJOINT_WITH,
  OWL_EQUIVALENT_CLASS,
  OWL_NAMESPACE,
  RDF_TYPE,
  RDFS_LABEL,
  RDFS_SUBCLASS_OF,
  XSD_BOOLEAN,
} from '../../src/roles/vocabulary.js';
import { userRuleText } from '../engine/rule-text.js';

export const NV = 'https://data.northvale-rail.example/def/';
const OTHER = 'https://vocabulary.example.org/';
export const PART_OF = `${NV}partOf`;
export const HAS_PART = `${NV}hasPart`;

/** Terms of the random graphs: in-scope rolling-stock classes, an out-of-scope IRI, a built-in term. */
export const TERMS = [
  `${NV}Vehicle`,
  `${NV}Railcar`,
  `${NV}Bogie`,
  `${NV}Wheelset`,
  `${NV}Axle`,
  `${NV}Pantograph`,
  `${NV}unit-417`,
  `${NV}Coupler`,
  `${OTHER}Thing`,
  `${OWL_NAMESPACE}Thing`,
];

const TRUE: Literal = { value: 'true', datatype: XSD_BOOLEAN, language: '' };

/** What a random statement says: a role predicate between two terms, a class declaration, a deprecation, a label. */
const PREDICATES = [RDF_TYPE, RDFS_SUBCLASS_OF, RDFS_SUBCLASS_OF, RDFS_SUBCLASS_OF, DCTERMS_IS_PART_OF, DCTERMS_HAS_PART, PART_OF, HAS_PART, OWL_DISJOINT_WITH, OWL_EQUIVALENT_CLASS];

/** A statement drawn as numbers: [subject, kind, object]; kinds past the predicates are declaration, deprecation, label. */
const drawn = fc.tuple(fc.nat(TERMS.length - 1), fc.nat(PREDICATES.length + 2), fc.nat(TERMS.length - 1));

/** A random graph and a random edit of it. */
export const graphsWithEdits = fc.record({
  data: fc.array(drawn, { minLength: 0, maxLength: 16 }),
  /** Which data statements the edit removes (by index, modulo the data's length). */
  removeIndexes: fc.array(fc.nat(40), { maxLength: 5 }),
  /** Statements the edit removes that the data may not have. */
  removeOther: fc.array(drawn, { maxLength: 2 }),
  add: fc.array(drawn, { maxLength: 7 }),
  /** Some of the additions repeat data statements (an edit that states what is there). */
  repeat: fc.array(fc.nat(40), { maxLength: 2 }),
  roots: fc.subarray(TERMS.slice(0, 4), { maxLength: 2 }),
  scope: fc.constantFrom([NV], [], [NV, OTHER]),
});

export type GraphWithEdit = typeof graphsWithEdits extends fc.Arbitrary<infer T> ? T : never;

function statementOf([subject, kind, object]: [number, number, number], file: string, line: number): Statement {
  const position = { file, line, column: 1 };
  const base = { subject: TERMS[subject], graph: '', position, objectLine: line };
  if (kind < PREDICATES.length) return { ...base, predicate: PREDICATES[kind], object: TERMS[object] };
  if (kind === PREDICATES.length) return { ...base, predicate: RDF_TYPE, object: OWL_CLASS };
  if (kind === PREDICATES.length + 1) return { ...base, predicate: OWL_DEPRECATED, object: TRUE };
  return { ...base, predicate: RDFS_LABEL, object: { value: `label ${object}`, datatype: '', language: object % 2 === 0 ? '' : 'de' } };
}

/** One source holding the given statements, as the loader would hand it over. */
export function sourceOf(file: string, statements: Statement[]): LoadedSource {
  return { file, format: 'n-triples', statements, errors: [], allowComments: [], prefixes: { nv: NV } };
}

/** Statements without repeats (by statementKey), first kept. */
function distinct(statements: Statement[]): Statement[] {
  const seen = new Set<string>();
  return statements.filter((statement) => {
    const key = statementKey(statement);
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

/** The data source, the edit as a delta, and the scope of a drawn case. */
export function caseOf(drawnCase: GraphWithEdit): { sources: LoadedSource[]; delta: EditDelta; scope: ScopeOptions } {
  const data = drawnCase.data.map((tuple, index) => statementOf(tuple, 'data.nt', index + 1));
  let line = 0;
  const editStatement = (statement: Statement): Statement => {
    line++;
    return { ...statement, position: { file: 'edit.ru', line, column: 1 }, objectLine: line };
  };
  const removed = [
    ...(data.length === 0 ? [] : drawnCase.removeIndexes.map((index) => data[index % data.length])),
    ...drawnCase.removeOther.map((tuple) => statementOf(tuple, 'edit.ru', 0)),
  ].map(editStatement);
  const added = [
    ...drawnCase.add.map((tuple) => statementOf(tuple, 'edit.ru', 0)),
    ...(data.length === 0 ? [] : drawnCase.repeat.map((index) => data[index % data.length])),
  ].map(editStatement);
  return {
    sources: [sourceOf('data.nt', data)],
    delta: { file: 'edit.ru', added: distinct(added), removed: distinct(removed), ignored: 0 },
    scope: { prefixes: [...drawnCase.scope], roots: drawnCase.roots },
  };
}

/** A rule file with the given match and report, in the format of rules/. */
export function userRule(id: string, match: string, report: string): RuleDefinition {
  const text = userRuleText(id, match, report, 'incremental tests');
  const { rule, errors } = parseRuleFile(text, `${id}.yaml`);
  expect(errors).toEqual([]);
  return rule as RuleDefinition;
}

/** User rules for what the built-in ones leave out: kind generators, inverse and alternative paths, nested not, absent, ?, a longer cycle path. */
export const USER_RULES: RuleDefinition[] = [
  userRule(
    'lone-in-scope-term',
    `- { is: [?x, in-scope] }
- { absent: [?x, instance-of|subclass-of|^part-of] }
- not:
    - [?y, part-of, ?x]`,
    `focus: ?x
nodes: [?x]
message: "{x} stands alone"`,
  ),
  userRule(
    'part-without-kind',
    `- [?a, ^part-of/subclass-of?, ?b]
- { differ: [?a, ?b] }
- not:
    - [?b, subclass-of*, ?k]
    - { is: [?k, declared-class] }
    - not:
        - { is: [?k, deprecated] }`,
    `focus: ?a
nodes: [?a]
message: "{a} has a part {b} of no declared kind"`,
  ),
  userRule(
    'equivalent-under-part',
    `- [?x, equivalent-to|disjoint-with, ?y]
- [?y, (part-of|^subclass-of)+, ?z]
- { is: [?z, in-scope] }`,
    `focus: ?x
nodes: [?x, ?z]
unordered:
  - [?x, ?z]
message: "{x} and {z} meet through {y}"`,
  ),
  userRule(
    'part-off-cycle',
    `- [?x, part-of, ?y]
- not:
    - [?x, subclass-of+, ?x]`,
    `focus: ?x
nodes: [?x, ?y]
message: "{x} is a part of {y} and on no subclass cycle"`,
  ),
  userRule(
    'mixed-cycle',
    `- cycle: { path: (subclass-of|part-of)+, members: ?m }
- not:
    - { is: [?m0, root] }
    - [?m0, subclass-of, ?m0]`,
    `focus: ?m
nodes: [?m]
message: "mixed chain {m}"`,
  ),
];

/** What two runs must agree on per finding. */
export function comparableFindings(findings: readonly Finding[]): string[] {
  return findings
    .map(({ ruleId, level, focus, nodes, message, fingerprint }) => JSON.stringify({ fingerprint, ruleId, level, focus, nodes, message }))
    .sort();
}

/** Rules at their own level. */
export function atOwnLevel(rules: RuleDefinition[]): RuleToRun[] {
  return rules.map((rule) => ({ rule, level: rule.level }));
}

function evidenceText(statements: Statement[]): string[] {
  return statements.map((statement) => `${statementKey(statement)} @${statement.position.file}:${statement.position.line}`).sort();
}

/** Holds a patched graph to the graph rebuilt from the edited sources: edges and their statements per role, kinds, first statements, labels, counts. */
export function expectSameGraph(patched: HierarchyGraph, rebuilt: HierarchyGraph): void {
  const live = (graph: HierarchyGraph): number[] => {
    const ids: number[] = [];
    for (let id = 0; id < graph.nodeCount; id++) if (graph.vanished?.(id) !== true) ids.push(id);
    return ids;
  };
  const describe = (graph: HierarchyGraph): Record<string, unknown> => {
    const nodes: Record<string, unknown> = {};
    for (const id of live(graph)) {
      const edges: Record<string, unknown> = {};
      for (const role of ROLES) {
        // The reverse columns in full: every source of an edge into the node, ascending by id, none missing.
        const sources = Array.from(graph.predecessors(role, id));
        expect(sources).toEqual([...sources].sort((left, right) => left - right));
        if (sources.length > 0) edges[`^${role}`] = sources.map((source) => graph.term(source)).sort();
        const targets = Array.from(graph.successors(role, id)).map((target) => graph.term(target));
        if (targets.length === 0) continue;
        edges[role] = Object.fromEntries(
          Array.from(graph.successors(role, id)).map((target) => [graph.term(target), evidenceText(graph.edgeStatements(role, id, target))]),
        );
        expect(Array.from(graph.predecessors(role, id)).every((source) => graph.hasEdge(role, source, id))).toBe(true);
      }
      const first = graph.firstStatement(id);
      nodes[graph.term(id)] = {
        kinds: NODE_KINDS.filter((kind) => graph.is(kind, id)),
        edges,
        first: first === undefined ? undefined : evidenceText([first])[0],
        label: graph.label(id),
      };
    }
    const { statements, roleStatements, edges, skippedRoleStatements, nodes: nodeCount } = graph.stats;
    return { nodes, stats: { statements, roleStatements, edges, skippedRoleStatements, nodeCount }, problems: graph.problems };
  };
  expect(describe(patched)).toEqual(describe(rebuilt));
}

export { editedSources };
