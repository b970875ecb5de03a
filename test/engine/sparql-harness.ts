// Runs rules both ways on the same statements: in memory, and pushed down to the oxigraph SPARQL store.
import oxigraph from 'oxigraph';
import { Parser as SparqlParser } from 'sparqljs';
import { expect } from 'vitest';
import type { Finding } from '../../src/engine/finding.js';
import type { RuleDefinition } from '../../src/engine/rule.js';
import { runRules } from '../../src/engine/run.js';
import { compileRuleToSparql } from '../../src/engine/sparql-compile.js';
import { findingsFromRows, type SparqlBinding } from '../../src/engine/sparql-findings.js';
import { buildHierarchyGraph } from '../../src/graph/build.js';
import type { LoadedSource, Statement } from '../../src/load/statement.js';
import type { RoleMap } from '../../src/roles/role.js';

/** The run's setting: roles, scope prefixes, roots. */
export interface HarnessSetting {
  roleMap: RoleMap;
  scope: string[];
  roots: string[];
}

/** A finding reduced to what both ways must agree on. */
export interface ComparedFinding {
  ruleId: string;
  focus: string;
  nodes: string[];
  fingerprint: string;
}

/** What both ways agree on, sorted. */
export function comparable(findings: Finding[]): ComparedFinding[] {
  return findings
    .map(({ ruleId, focus, nodes, fingerprint }) => ({ ruleId, focus, nodes, fingerprint }))
    .sort((left, right) => (left.ruleId + left.fingerprint < right.ruleId + right.fingerprint ? -1 : 1));
}

/** An RDF/JS term of oxigraph for a statement term; blank labels are kept (without `_:`), so both ways name them alike. */
function oxigraphTerm(term: Statement['object']): oxigraph.NamedNode | oxigraph.BlankNode | oxigraph.Literal {
  if (typeof term !== 'string') {
    if (term.language !== '') return oxigraph.literal(term.value, term.language);
    return oxigraph.literal(term.value, oxigraph.namedNode(term.datatype === '' ? 'http://www.w3.org/2001/XMLSchema#string' : term.datatype));
  }
  return term.startsWith('_:') ? oxigraph.blankNode(term.slice(2)) : oxigraph.namedNode(term);
}

/** An oxigraph store holding the statements of the sources in its default graph. */
export function storeOf(sources: LoadedSource[]): oxigraph.Store {
  const store = new oxigraph.Store();
  for (const source of sources) {
    for (const statement of source.statements) {
      store.add(
        oxigraph.quad(
          oxigraphTerm(statement.subject) as oxigraph.NamedNode,
          oxigraph.namedNode(statement.predicate),
          oxigraphTerm(statement.object),
          oxigraph.defaultGraph(),
        ),
      );
    }
  }
  return store;
}

const sparqlParser = new SparqlParser();
/** Queries sparqljs has parsed already (parsing is the slow part of a small run). */
const parsedQueries = new Set<string>();

/** The push-down findings of a rule on a store: compile, check that sparqljs parses the query, run it, read the JSON rows. */
export function pushDown(store: oxigraph.Store, rule: RuleDefinition, setting: HarnessSetting): Finding[] {
  const { sparql } = compileRuleToSparql(rule, setting);
  // sparqljs is an independent SPARQL 1.1 grammar: every generated query must parse.
  if (!parsedQueries.has(sparql)) {
    expect(() => sparqlParser.parse(sparql)).not.toThrow();
    parsedQueries.add(sparql);
  }
  const json = store.query(sparql, { results_format: 'application/sparql-results+json' }) as string;
  const rows = (JSON.parse(json) as { results: { bindings: SparqlBinding[] } }).results.bindings;
  return findingsFromRows(rule, rule.level, rows, { endpoint: 'http://127.0.0.1/sparql' });
}

/** The in-memory findings of the rules on the sources, at each rule's own level. */
export function inMemory(sources: LoadedSource[], rules: RuleDefinition[], setting: HarnessSetting): Finding[] {
  const graph = buildHierarchyGraph(sources, setting.roleMap, { prefixes: setting.scope, roots: setting.roots });
  const memory = runRules(
    graph,
    rules.map((rule) => ({ rule, level: rule.level })),
  );
  expect(memory.failures).toEqual([]);
  return memory.findings;
}

/** Both ways' findings of each rule on the same sources. */
export function bothWays(sources: LoadedSource[], rules: RuleDefinition[], setting: HarnessSetting): { memory: Finding[]; pushed: Finding[] } {
  const memory = { findings: inMemory(sources, rules, setting) };
  const store = storeOf(sources);
  const pushed = rules.flatMap((rule) => pushDown(store, rule, setting));
  return { memory: memory.findings, pushed };
}

/** One source holding the given statements, as the loader would hand it over. */
export function sourceOf(file: string, statements: Statement[]): LoadedSource {
  return { file, format: 'n-triples', statements, errors: [], allowComments: [], prefixes: {} };
}
