// --endpoint extraction and --push-down against a SPARQL 1.1 server on loopback answered by oxigraph.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { check } from '../../src/check.js';
import { countQuery, extractionPredicates, pageQuery } from '../../src/load/endpoint.js';
import { buildRoleMap } from '../../src/roles/role-map.js';
import { RDF_TYPE, RDFS_SUBCLASS_OF } from '../../src/roles/vocabulary.js';
import { Parser as SparqlParser } from 'sparqljs';
import { runCli } from '../cli/terminal-fake.js';
import { comparableFindings, DEMO, DEMO_GRAPH, demoConfigFolder, demoStore } from './endpoint-fixtures.js';
import { startSparqlServer, type TestSparqlServer } from './sparql-server.js';

let server: TestSparqlServer;
let folder: string;

beforeAll(async () => {
  server = await startSparqlServer(demoStore());
  // A small page size, so every predicate with more than 25 statements is read over several pages.
  folder = demoConfigFolder('endpoint: { page-size: 25, retry-delay: 0.01 }');
});

afterAll(async () => {
  await server.close();
});

describe('extraction queries', () => {
  it('are valid SPARQL 1.1 with the predicate and graph as IRIs', () => {
    // sparqljs is an independent SPARQL 1.1 grammar.
    const parser = new SparqlParser();
    const page = parser.parse(pageQuery(RDFS_SUBCLASS_OF, DEMO_GRAPH, 100, 200)) as unknown as { limit: number; offset: number; order: unknown[]; from: { default: { value: string }[] } };
    expect(page.limit).toBe(100);
    expect(page.offset).toBe(200);
    expect(page.order).toHaveLength(2);
    expect(page.from.default[0].value).toBe(DEMO_GRAPH);
    expect(() => parser.parse(countQuery(RDF_TYPE, undefined))).not.toThrow();
  });

  it('cover the role predicates, rdf:type, owl:deprecated and the axiom structures', () => {
    const predicates = extractionPredicates(buildRoleMap(['rdfs', 'owl', 'dcterms'], {}));
    expect(predicates).toContain(RDFS_SUBCLASS_OF);
    expect(predicates).toContain('http://purl.org/dc/terms/hasPart');
    expect(predicates).toContain('http://www.w3.org/2002/07/owl#deprecated');
    expect(predicates).toContain('http://www.w3.org/1999/02/22-rdf-syntax-ns#rest');
    expect(new Set(predicates).size).toBe(predicates.length);
  });
});

describe('--endpoint on the demo', () => {
  it('gives the same findings as linting the demo files', async () => {
    const files = await check({ paths: [DEMO], cwd: DEMO, configFile: `${DEMO}/isapart.yaml` });
    const before = server.requests.length;
    const endpoint = await check({ paths: [], cwd: folder, configFile: `${folder}/isapart.yaml`, endpoint: server.url, graph: DEMO_GRAPH });
    expect(endpoint.context.inputErrors).toEqual([]);
    expect(files.findings.length).toBeGreaterThan(5);
    expect(comparableFindings(endpoint.findings)).toEqual(comparableFindings(files.findings));
    // Paging: rdf:type (over 25 statements in the demo) was read over several pages.
    const typePages = server.requests.slice(before).filter((request) => request.query.includes(`WHERE { ?s <${RDF_TYPE}> ?o }\nORDER BY`));
    expect(typePages.length).toBeGreaterThan(2);
    expect(typePages.map((request) => /OFFSET (\d+)/.exec(request.query)?.[1])).toEqual(typePages.map((_, index) => String(index * 25)));
    // Every request was a direct POST of the query (SPARQL 1.1 Protocol, section 2.1.3).
    expect(server.requests.slice(before).every((request) => request.contentType.startsWith('application/sparql-query'))).toBe(true);
  });

  it('gives the same findings with CONSTRUCT pages read as N-Triples (results: n-triples)', async () => {
    const triples = demoConfigFolder('endpoint: { page-size: 25, retry-delay: 0.01, results: n-triples }');
    const files = await check({ paths: [DEMO], cwd: DEMO, configFile: `${DEMO}/isapart.yaml` });
    const before = server.requests.length;
    const endpoint = await check({ paths: [], cwd: triples, configFile: `${triples}/isapart.yaml`, endpoint: server.url, graph: DEMO_GRAPH });
    expect(endpoint.context.inputErrors).toEqual([]);
    expect(comparableFindings(endpoint.findings)).toEqual(comparableFindings(files.findings));
    const constructs = server.requests.slice(before).filter((request) => request.query.includes('\nCONSTRUCT {'));
    expect(constructs.length).toBeGreaterThan(3);
    // sparqljs, an independent SPARQL 1.1 grammar, reads every CONSTRUCT page query.
    for (const request of constructs) expect(() => new SparqlParser().parse(request.query)).not.toThrow();
  });

  it('reads the default graph when no --graph is given, and a graph-less store gives nothing from a named graph', async () => {
    const other = await startSparqlServer(demoStore(null));
    try {
      const endpoint = await check({ paths: [], cwd: folder, configFile: `${folder}/isapart.yaml`, endpoint: other.url });
      const files = await check({ paths: [DEMO], cwd: DEMO, configFile: `${DEMO}/isapart.yaml` });
      expect(comparableFindings(endpoint.findings)).toEqual(comparableFindings(files.findings));
      const named = await check({ paths: [], cwd: folder, configFile: `${folder}/isapart.yaml`, endpoint: other.url, graph: DEMO_GRAPH });
      expect(named.context.sources[0].statements).toBe(0);
    } finally {
      await other.close();
    }
  });

  it('labels blank nodes the same way on every run', async () => {
    const first = await check({ paths: [], cwd: folder, configFile: `${folder}/isapart.yaml`, endpoint: server.url, graph: DEMO_GRAPH });
    const second = await check({ paths: [], cwd: folder, configFile: `${folder}/isapart.yaml`, endpoint: server.url, graph: DEMO_GRAPH });
    const blanks = (result: typeof first) => result.findings.flatMap((finding) => finding.evidence.flatMap((statement) => [statement.subject, String(statement.object)])).filter((term) => term.startsWith('_:'));
    expect(blanks(first).length).toBeGreaterThan(0);
    expect(blanks(second)).toEqual(blanks(first));
    expect(blanks(first).every((label) => /^_:e[0-9a-f]{8}_[A-Za-z0-9_-]+$/.test(label))).toBe(true);
  });

  it('reports endpoint findings at the endpoint and graph, with the focus as logical location in SARIF', async () => {
    const { code, out } = await runCli(folder, ['check', '--endpoint', server.url, '--graph', DEMO_GRAPH, '-f', 'sarif', '--fail-on', 'never']);
    expect(code).toBe(0);
    const log = JSON.parse(out) as { runs: { artifacts: { location: { uri: string } }[]; results: { locations: { physicalLocation: { artifactLocation: { uri: string; uriBaseId?: string }; region?: unknown }; logicalLocations: { fullyQualifiedName: string }[] }[] }[] }[] };
    const run = log.runs[0];
    const where = `${server.url}?default-graph-uri=${encodeURIComponent(DEMO_GRAPH)}`;
    expect(run.artifacts.map((artifact) => artifact.location.uri)).toEqual([where]);
    expect(run.results.length).toBeGreaterThan(0);
    for (const result of run.results) {
      const location = result.locations[0];
      expect(location.physicalLocation.artifactLocation.uri).toBe(where);
      // An absolute URI needs no base, and the endpoint gives no line.
      expect(location.physicalLocation.artifactLocation.uriBaseId).toBeUndefined();
      expect(location.physicalLocation.region).toBeUndefined();
      expect(location.logicalLocations[0].fullyQualifiedName).toMatch(/^(https:\/\/data\.northvale-rail\.example\/|_:)/);
    }
  });

  it('heads the text report with the endpoint and shows each evidence statement without a line', async () => {
    const { code, out } = await runCli(folder, ['check', '--endpoint', server.url, '--graph', DEMO_GRAPH, '--fail-on', 'never', '--no-color']);
    expect(code).toBe(0);
    const where = `${server.url}?default-graph-uri=${encodeURIComponent(DEMO_GRAPH)}`;
    expect(out.split('\n')[0]).toBe(where);
    expect(out).toContain('      <https://data.northvale-rail.example/def/DrivingCab> <https://data.northvale-rail.example/def/partOf> <https://data.northvale-rail.example/def/DrivingCar>\n');
    expect(out).toMatch(/; 1 file and \d+ statements read\n$/);
  });
});

describe('--push-down on the demo', () => {
  it('gives the same findings as the in-memory engine, through the command line and HTTP', async () => {
    const memory = await check({ paths: [], cwd: folder, configFile: `${folder}/isapart.yaml`, endpoint: server.url, graph: DEMO_GRAPH });
    const before = server.requests.length;
    const pushed = await check({ paths: [], cwd: folder, configFile: `${folder}/isapart.yaml`, endpoint: server.url, graph: DEMO_GRAPH, pushDown: true });
    expect(pushed.context.inputErrors).toEqual([]);
    expect(pushed.context.ruleFailures).toEqual([]);
    expect(comparableFindings(pushed.findings)).toEqual(comparableFindings(memory.findings));
    // One query per active rule at least, each paged by the runner.
    const queries = server.requests.slice(before).map((request) => request.query);
    expect(queries.length).toBeGreaterThanOrEqual(9);
    expect(queries.every((query) => /\nORDER BY [^\n]+\nLIMIT 25\nOFFSET \d+\n$/.test(query))).toBe(true);
  });

  it('exits 1 on error findings and 0 with --fail-on never, as a file run does', async () => {
    expect((await runCli(folder, ['check', '--endpoint', server.url, '--graph', DEMO_GRAPH, '--push-down'])).code).toBe(1);
    expect((await runCli(folder, ['check', '--endpoint', server.url, '--graph', DEMO_GRAPH, '--push-down', '--fail-on', 'never'])).code).toBe(0);
  });
});
