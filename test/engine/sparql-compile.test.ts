// Specification of the SPARQL compiler: safe IRIs and strings, valid SPARQL 1.1, refusals with reasons.
import { Parser as SparqlParser } from 'sparqljs';
import { describe, expect, it } from 'vitest';
import { parseConfig } from '../../src/config/load-config.js';
import { loadBuiltinRules } from '../../src/engine/rule-file.js';
import type { RuleDefinition } from '../../src/engine/rule.js';
import { compileRuleToSparql, PushDownError, pushDownVariables } from '../../src/engine/sparql-compile.js';
import { iriRef, stringLiteral } from '../../src/engine/sparql-text.js';
import { buildRoleMap } from '../../src/roles/role-map.js';

const NV = 'https://data.northvale-rail.example/';
const rules = loadBuiltinRules().rules;
const kindAndPart = rules.find((rule) => rule.id === 'kind-and-part') as RuleDefinition;
const sparql = new SparqlParser();

/** A setting with the default presets and the given scope, roots, graph and extra part-of predicate. */
function settingWith(options: { scope?: string[]; roots?: string[]; graph?: string; partOf?: string } = {}) {
  const roles = options.partOf === undefined ? {} : { 'part-of': { iri: [options.partOf], inverse: [] } };
  return { roleMap: buildRoleMap(['rdfs', 'owl', 'dcterms', 'schema', 'obo'], roles), scope: options.scope ?? [NV], roots: options.roots ?? [], graph: options.graph };
}

/** IRIs that would end an `<IRI>` early or break out of a string, each as config might hold it. */
const HOSTILE = [
  `${NV}def/Asset> } ; DROP ALL ; SELECT * { ?s ?p <x:y`,
  `${NV}def/Rolling Stock`,
  `${NV}def/"quoted"`,
  `${NV}def/back\\slash`,
  `${NV}def/line\nbreak`,
];

describe('compileRuleToSparql', () => {
  it('writes every built-in rule as a query that sparqljs parses, for several settings', () => {
    const settings = [
      settingWith(),
      settingWith({ scope: [], roots: [`${NV}def/Asset`], graph: `${NV}graph/assets` }),
      { roleMap: buildRoleMap(['rdfs', 'owl', 'skos'], {}), scope: [NV, 'http://www.w3.org/2004/02/skos/core#'], roots: [] },
      // Only rdfs: part-of, disjoint-with and equivalent-to have no predicate at all.
      { roleMap: buildRoleMap(['rdfs'], {}), scope: [NV], roots: [] },
    ];
    for (const setting of settings) {
      for (const rule of rules) {
        const query = compileRuleToSparql(rule, setting);
        expect(query.ruleId).toBe(rule.id);
        // sparqljs implements the SPARQL 1.1 grammar; a query it rejects would be rejected by a store too.
        const parsed = sparql.parse(query.sparql) as { queryType: string; distinct?: boolean; variables: { value: string }[] };
        expect(parsed.queryType).toBe('SELECT');
        expect(parsed.distinct).toBe(true);
        const variables = pushDownVariables(rule);
        const expected = [...variables.nodes, ...variables.cycles.flatMap((cycle) => [cycle.members, cycle.next, cycle.inScope]), ...variables.inScope.values()];
        expect(parsed.variables.map((variable) => `?${variable.value}`)).toEqual(expected);
      }
    }
  });

  it('names the graph with FROM when one is given', () => {
    const query = compileRuleToSparql(kindAndPart, settingWith({ graph: `${NV}graph/assets` })).sparql;
    const parsed = sparql.parse(query) as { from?: { default: { value: string }[] } };
    expect(parsed.from?.default.map((graph) => graph.value)).toEqual([`${NV}graph/assets`]);
  });

  it('reads a role with no predicate as matching nothing', () => {
    const query = compileRuleToSparql(kindAndPart, { roleMap: buildRoleMap(['rdfs'], {}), scope: [NV], roots: [] }).sparql;
    expect(query).toContain('FILTER(false)');
  });

  it.each(HOSTILE)('refuses the IRI %j as a scope prefix, root, graph or predicate', (iri) => {
    for (const setting of [settingWith({ scope: [iri] }), settingWith({ roots: [iri] }), settingWith({ graph: iri }), settingWith({ partOf: iri })]) {
      expect(() => compileRuleToSparql(kindAndPart, setting)).toThrow(PushDownError);
    }
  });

  it('refuses a disjoint-with step inside a longer path while owl:AllDisjointClasses is read, and says why', () => {
    const rule: RuleDefinition = { ...kindAndPart, id: 'disjoint-chain', match: [{ type: 'path', subject: '?a', path: 'disjoint-with/subclass-of*', object: '?b' }] };
    expect(() => compileRuleToSparql(rule, settingWith())).toThrow(/owl:AllDisjointClasses/);
    // Without the owl preset there are no such axioms, and the path is an ordinary property path.
    const withoutOwl = compileRuleToSparql(rule, { roleMap: buildRoleMap(['rdfs'], { 'disjoint-with': { iri: [`${NV}def/excludes`], inverse: [] } }), scope: [NV], roots: [] });
    expect(() => sparql.parse(withoutOwl.sparql)).not.toThrow();
  });
});

  // The forms below are those that Virtuoso 7.2.5 answers as SPARQL 1.1 specifies (docs/push-down.md,
  // measured with test/system); the differential tests check that oxigraph gives the same solutions.
  it('joins a closure to the patterns before it as a sub-SELECT, but not inside a not that uses outer variables', () => {
    const redundant = rules.find((rule) => rule.id === 'redundant-subclass') as RuleDefinition;
    const query = compileRuleToSparql(redundant, settingWith()).sparql;
    const subClassOf = '<http://www.w3.org/2000/01/rdf-schema#subClassOf>';
    expect(query).toMatch(/\{ SELECT DISTINCT \?a \?c \?b WHERE \{\n\s+\?a <[^>]+subClassOf> \?c \.\n\s+\?a <[^>]+subClassOf> \?b \.\n\s+\} \}\n\s+\?b \(<[^>]+subClassOf>\)\+ \?c \./);
    // The cycle exclusion [?a, subclass-of+, ?a] with ?a bound: a closure from ?a to a fresh node, one step back.
    expect(query).toMatch(new RegExp(`\\?a \\(${subClassOf.replace(/[.#/]/g, '\\$&')}\\)\\* (\\?_v\\d+) \\. \\1 ${subClassOf.replace(/[.#/]/g, '\\$&')} \\?a \\.`));
    expect(query).not.toMatch(/\?a \(<[^>]+subClassOf>\)\+ \?a/);
    // Inside FILTER NOT EXISTS the patterns name ?a from outside, so they stay plain joins.
    const notExists = query.slice(query.indexOf('FILTER NOT EXISTS'));
    expect(notExists).not.toContain('SELECT');
    expect(() => sparql.parse(query)).not.toThrow();
  });

describe('config IRIs on their way to a query', () => {
  it.each([
    ['scope', `scope: ["${NV}def/Rolling Stock"]`],
    ['roots', `roots: ["${NV}def/Asset>"]`],
    ['roles', `roles: { part-of: ['${NV}def/part"Of'] }`],
  ])('are refused in %s with a line and a hint when they hold a space, > or a quote', (_key, text) => {
    const { errors } = parseConfig(`${text}\n`, '/project/isapart.yaml');
    expect(errors.length).toBeGreaterThan(0);
    expect(errors[0]).toMatchObject({ file: '/project/isapart.yaml', line: 1 });
    expect(errors[0].hint).toBeTruthy();
  });
});

describe('SPARQL text', () => {
  it('writes strings as literals that sparqljs reads back unchanged', () => {
    const text = 'a "quoted" back\\slash, a\ttab and a\nline';
    const parsed = sparql.parse(`SELECT * WHERE { ?s ?p ${stringLiteral(text)} }`) as { where: { triples: { object: { value: string } }[] }[] };
    expect(parsed.where[0].triples[0].object.value).toBe(text);
  });

  it('writes a valid IRI in angle brackets and refuses any other', () => {
    expect(iriRef(`${NV}def/Asset`, 'root')).toBe(`<${NV}def/Asset>`);
    expect(() => iriRef('_:b1', 'root')).toThrow(/blank node/);
    expect(() => iriRef('def/Asset', 'root')).toThrow(/no scheme/);
  });
});
