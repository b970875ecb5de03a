// `isapart rules --sparql RULE-ID`: the query printed with its setting, and clear errors otherwise.
import oxigraph from 'oxigraph';
import { Parser as SparqlParser } from 'sparqljs';
import { describe, expect, it } from 'vitest';
import { loadBuiltinRules } from '../../src/engine/rule-file.js';
import { findingsFromRows, type SparqlBinding } from '../../src/engine/sparql-findings.js';
import { folderWith, runCli } from '../cli/terminal-fake.js';

const NV = 'https://data.northvale-rail.example/';
const CONFIG = `presets: [rdfs, owl, dcterms]
roles:
  part-of: { iri: [${NV}def/partOf], inverse: [${NV}def/hasPart] }
scope: [${NV}]
roots: [${NV}def/Asset]
rule-dirs: [./team-rules]
`;
const TEAM_RULE = `id: part-without-whole
level: note
summary: A part-of statement whose whole is not a class.
description: |
  A team rule.
match:
  - [?a, part-of, ?b]
  - not:
      - { is: [?b, class] }
report:
  focus: ?a
  nodes: [?a, ?b]
  message: "{a} is part of {b}, which is not a class"
examples:
  flagged: |
    @prefix nv: <${NV}def/> .
    nv:Pantograph nv:partOf nv:roof-7 .
  clean: |
    @prefix nv: <${NV}def/> .
    nv:Pantograph nv:partOf nv:Roof . nv:Roof a <http://www.w3.org/2002/07/owl#Class> .
`;

describe('isapart rules --sparql', () => {
  it('prints the query with the roles, scope, roots and graph it was compiled for', async () => {
    const dir = folderWith({ 'isapart.yaml': CONFIG, 'team-rules/part-without-whole.yaml': TEAM_RULE });
    const result = await runCli(dir, ['rules', '--sparql', 'kind-and-part', '--graph', `${NV}graph/assets`]);
    expect(result.err).toBe('');
    expect(result.code).toBe(0);
    expect(result.out).toContain(`#   part-of: ^<http://purl.org/dc/terms/hasPart>, <http://purl.org/dc/terms/isPartOf>, ^<${NV}def/hasPart>, <${NV}def/partOf>\n`);
    expect(result.out).toContain(`#   scope: "${NV}"`);
    expect(result.out).toContain(`#   roots: <${NV}def/Asset>`);
    expect(result.out).toContain(`FROM <${NV}graph/assets>`);
    // The printed text, comments and all, is a query a user can paste into any SPARQL 1.1 store.
    expect(() => new SparqlParser().parse(result.out)).not.toThrow();
  });

  it('prints a rule from rule-dirs, and the printed query finds what the rule flags when run by hand', async () => {
    const dir = folderWith({ 'isapart.yaml': CONFIG, 'team-rules/part-without-whole.yaml': TEAM_RULE });
    const result = await runCli(dir, ['rules', '--sparql', 'part-without-whole']);
    expect(result.code).toBe(0);
    const store = new oxigraph.Store();
    store.load(`<${NV}def/Pantograph> <${NV}def/partOf> <${NV}fleet/roof-7> .\n<${NV}def/Bogie> <${NV}def/partOf> <${NV}def/Car> .\n<${NV}def/Car> <http://www.w3.org/2000/01/rdf-schema#subClassOf> <${NV}def/Asset> .\n`, {
      format: 'application/n-triples',
    });
    const rows = (JSON.parse(store.query(result.out, { results_format: 'application/sparql-results+json' }) as string) as { results: { bindings: SparqlBinding[] } }).results.bindings;
    expect(rows).toEqual([{ a: { type: 'uri', value: `${NV}def/Pantograph` }, b: { type: 'uri', value: `${NV}fleet/roof-7` } }]);
    const rule = { ...loadBuiltinRules().rules[0], id: 'part-without-whole', report: { focus: '?a', nodes: ['?a', '?b'], unordered: [], message: '{a} is part of {b}' } };
    const findings = findingsFromRows(rule, 'note', rows, { endpoint: 'http://127.0.0.1:8890/sparql', graph: `${NV}graph/assets` });
    expect(findings.map((finding) => [finding.focus, finding.message, finding.location?.file])).toEqual([
      [`${NV}def/Pantograph`, `<${NV}def/Pantograph> is part of <${NV}fleet/roof-7>`, `http://127.0.0.1:8890/sparql?default-graph-uri=${encodeURIComponent(`${NV}graph/assets`)}`],
    ]);
  });

  it('refuses an unknown rule id with the nearest id as a hint', async () => {
    const dir = folderWith({ 'isapart.yaml': CONFIG, 'team-rules/part-without-whole.yaml': TEAM_RULE });
    const result = await runCli(dir, ['rules', '--sparql', 'kind-and-prat']);
    expect(result.code).toBe(2);
    expect(result.out).toBe('');
    expect(result.err).toContain("no rule 'kind-and-prat'");
    expect(result.err).toContain('did you mean `kind-and-part`?');
  });

  it.each([
    ['a space', `${NV}def/Rolling Stock`],
    ['a closing bracket', `${NV}def/Asset> } ; DROP ALL ; SELECT * { ?s ?p ?o`],
    ['a quote', `${NV}def/"Asset"`],
  ])('refuses a --root with %s and prints no query', async (_what, iri) => {
    const dir = folderWith({ 'isapart.yaml': CONFIG, 'team-rules/part-without-whole.yaml': TEAM_RULE });
    const result = await runCli(dir, ['rules', '--sparql', 'orphan-class', '--root', iri]);
    expect(result.code).toBe(2);
    expect(result.out).toBe('');
    expect(result.err).toContain('--root');
  });

  it('refuses a --graph that is not an IRI and prints no query', async () => {
    const dir = folderWith({ 'isapart.yaml': CONFIG, 'team-rules/part-without-whole.yaml': TEAM_RULE });
    const result = await runCli(dir, ['rules', '--sparql', 'kind-and-part', '--graph', `${NV}graph/a b`]);
    expect(result.code).toBe(2);
    expect(result.out).toBe('');
    expect(result.err).toContain('cannot be pushed down');
    expect(result.err).toContain('it contains a space');
  });

  it('refuses scope prefixes in the config with a space, > or a quote, naming the line', async () => {
    const dir = folderWith({ 'isapart.yaml': `scope: ["${NV}def/a b", "${NV}def/x>y", '${NV}def/"q"']\n` });
    const result = await runCli(dir, ['rules', '--sparql', 'orphan-class']);
    expect(result.code).toBe(2);
    expect(result.out).toBe('');
    expect(result.err).toMatch(/isapart\.yaml:1:\d+: error: .*space/);
  });
});
