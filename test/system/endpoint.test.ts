// Against a real SPARQL server (Virtuoso Open Source from Debian): extraction and push-down give the file's findings.
import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { check } from '../../src/check.js';
import { main } from '../../src/cli/main.js';
import { writeHierarchy } from '../bench/generate.js';
import { fakeTerminal } from '../cli/terminal-fake.js';
import type { InputError } from '../../src/load/statement.js';
import { comparableFindings, DEMO, DEMO_GRAPH } from '../endpoint/endpoint-fixtures.js';
import { startVirtuoso, type VirtuosoInstance } from './virtuoso.js';

/** The graph the generated hierarchy is loaded into. */
const GENERATED_GRAPH = 'https://data.northvale-rail.example/graph/generated-20k';

/**
 * Virtuoso 7.2 never answers a direct POST of the query (`application/sparql-query`), so the
 * form POST of the SPARQL 1.1 Protocol is used; rows are paged at its ResultSetMaxRows.
 */
const VIRTUOSO_ENDPOINT_SECTION = 'endpoint: { post: form, page-size: 10000, timeout: 600, retries: 1, retry-delay: 0.1 }';

let virtuoso: VirtuosoInstance;
let work: string;
let generated: string;

beforeAll(async () => {
  // MaxSortedTopRows is raised above the largest role count: Virtuoso refuses ORDER BY with an OFFSET beyond it (SR353).
  virtuoso = await startVirtuoso({ maxSortedTopRows: 1_000_000, buffers: 100_000 });
  work = mkdtempSync(path.join(virtuoso.folder, 'work-'));
  // Virtuoso's own Turtle parser reads the demo files: an independent reading of the same data.
  for (const name of readdirSync(DEMO).filter((file) => /\.(ttl|nt)$/.test(file)).sort()) virtuoso.load(path.join(DEMO, name), DEMO_GRAPH);
  generated = path.join(work, 'generated-20k.nt');
  await writeHierarchy(generated, { classes: 20_000, seed: 7 }, 'n-triples');
  virtuoso.load(generated, GENERATED_GRAPH);
  writeFileSync(path.join(work, 'isapart.yaml'), `${readDemoConfig()}\n${VIRTUOSO_ENDPOINT_SECTION}\n`);
  writeFileSync(path.join(work, 'generated.yaml'), `${VIRTUOSO_ENDPOINT_SECTION}\n`);
});

afterAll(async () => {
  await virtuoso?.stop();
});

/** The rules a run's warnings say were evaluated locally, each checked to name the server and the evidence. */
function localRuleWarnings(warnings: InputError[]): string[] {
  const local = warnings.filter((warning) => warning.message.includes('was not pushed down'));
  for (const warning of local) {
    // The Server header Debian's Virtuoso 7.2.5 sends, as the client receives it.
    expect(warning.message).toMatch(/the endpoint is Virtuoso 7\.x \(Server: Virtuoso\/07\.20\./);
    expect(warning.hint).toContain('docs/push-down.md');
  }
  return local.map((warning) => /rule (\S+) was not pushed down/.exec(warning.message)![1]).sort();
}

function readDemoConfig(): string {
  return readFileSync(path.join(DEMO, 'isapart.yaml'), 'utf8').trimEnd();
}

describe('Virtuoso: --endpoint extraction', () => {
  it('gives the findings of linting the demo files', async () => {
    const files = await check({ paths: [DEMO], cwd: DEMO, configFile: path.join(DEMO, 'isapart.yaml') });
    const endpoint = await check({ paths: [], cwd: work, configFile: path.join(work, 'isapart.yaml'), endpoint: virtuoso.sparqlUrl, graph: DEMO_GRAPH });
    expect(endpoint.context.inputErrors).toEqual([]);
    expect(files.findings.length).toBeGreaterThan(5);
    expect(comparableFindings(endpoint.findings)).toEqual(comparableFindings(files.findings));
    expect(endpoint.context.sources[0].statements).toBeGreaterThan(200);
  });

  it('gives the findings of linting the demo files with CONSTRUCT pages read as N-Triples', async () => {
    writeFileSync(path.join(work, 'triples.yaml'), `${readDemoConfig()}\nendpoint: { post: form, results: n-triples, page-size: 40, retries: 0 }\n`);
    const files = await check({ paths: [DEMO], cwd: DEMO, configFile: path.join(DEMO, 'isapart.yaml') });
    const endpoint = await check({ paths: [], cwd: work, configFile: path.join(work, 'triples.yaml'), endpoint: virtuoso.sparqlUrl, graph: DEMO_GRAPH });
    expect(endpoint.context.inputErrors).toEqual([]);
    expect(comparableFindings(endpoint.findings)).toEqual(comparableFindings(files.findings));
  });

  it('gives the findings of linting the generated 20,000-class file, read over several pages', async () => {
    const files = await check({ paths: [generated], cwd: work, configFile: path.join(work, 'generated.yaml') });
    const endpoint = await check({ paths: [], cwd: work, configFile: path.join(work, 'generated.yaml'), endpoint: virtuoso.sparqlUrl, graph: GENERATED_GRAPH });
    expect(endpoint.context.inputErrors).toEqual([]);
    // rdf:type alone has over 20,000 statements (a declaration per class and the instances): three pages or more.
    expect(endpoint.context.sources[0].statements).toBeGreaterThan(50_000);
    // The generator plants subclass cycles (test/bench/generate.ts); the file run must find some.
    expect(files.findings.filter((finding) => finding.ruleId === 'subclass-cycle').length).toBeGreaterThan(0);
    expect(files.findings.length).toBeGreaterThan(20);
    expect(comparableFindings(endpoint.findings)).toEqual(comparableFindings(files.findings));
  });

  it('exits 2 when the page size is above the server\'s row cap, instead of losing rows', async () => {
    const terminal = fakeTerminal(work);
    // A page size above Virtuoso's ResultSetMaxRows (10000 in the Debian ini) is caught by the X-SPARQL-MaxRows header.
    writeFileSync(path.join(work, 'too-big.yaml'), 'endpoint: { post: form, page-size: 20000, retries: 0 }\n');
    const code = await main(['check', '-c', path.join(work, 'too-big.yaml'), '--endpoint', virtuoso.sparqlUrl, '--graph', GENERATED_GRAPH, '--no-color'], terminal);
    const out = terminal.stdout.join('');
    expect(code).toBe(2);
    expect(out).toContain('returns at most 10000 rows per answer (X-SPARQL-MaxRows), fewer than the page size 20000');
  });
});

describe('Virtuoso: --push-down', () => {
  it('gives the in-memory findings on the demo', async () => {
    const files = await check({ paths: [DEMO], cwd: DEMO, configFile: path.join(DEMO, 'isapart.yaml') });
    const pushed = await check({ paths: [], cwd: work, configFile: path.join(work, 'isapart.yaml'), endpoint: virtuoso.sparqlUrl, graph: DEMO_GRAPH, pushDown: true });
    expect(pushed.context.inputErrors).toEqual([]);
    expect(pushed.context.ruleFailures).toEqual([]);
    // Virtuoso 7.x answers the disjoint-overlap query wrongly (docs/push-down.md): it is evaluated locally, and the run says so.
    expect(localRuleWarnings(pushed.context.inputWarnings)).toEqual(['disjoint-overlap', 'kind-and-part']);
    expect(files.findings.filter((finding) => finding.ruleId === 'disjoint-overlap').length).toBeGreaterThan(0);
    expect(comparableFindings(pushed.findings)).toEqual(comparableFindings(files.findings));
  });

  it('learns which server it is with one ASK when only disjoint-overlap is active', async () => {
    const others = ['subclass-cycle', 'part-cycle', 'kind-and-part', 'instance-and-subclass', 'orphan-class', 'redundant-subclass', 'individual-as-class', 'deprecated-in-use'];
    const config = path.join(work, 'only-disjoint.yaml');
    writeFileSync(config, `${readDemoConfig()}
${VIRTUOSO_ENDPOINT_SECTION}
rules: { ${others.map((id) => `${id}: off`).join(', ')} }
`);
    const files = await check({ paths: [DEMO], cwd: DEMO, configFile: config });
    const pushed = await check({ paths: [], cwd: work, configFile: config, endpoint: virtuoso.sparqlUrl, graph: DEMO_GRAPH, pushDown: true });
    expect(pushed.context.inputErrors).toEqual([]);
    expect(localRuleWarnings(pushed.context.inputWarnings)).toEqual(['disjoint-overlap']);
    expect(comparableFindings(pushed.findings)).toEqual(comparableFindings(files.findings));
  });

  it('gives the in-memory findings on the generated 20,000-class graph', async () => {
    const files = await check({ paths: [generated], cwd: work, configFile: path.join(work, 'generated.yaml') });
    const pushed = await check({ paths: [], cwd: work, configFile: path.join(work, 'generated.yaml'), endpoint: virtuoso.sparqlUrl, graph: GENERATED_GRAPH, pushDown: true });
    expect(pushed.context.inputErrors).toEqual([]);
    expect(pushed.context.ruleFailures).toEqual([]);
    expect(files.findings.filter((finding) => finding.ruleId === 'subclass-cycle').length).toBeGreaterThan(0);
    expect(localRuleWarnings(pushed.context.inputWarnings)).toEqual(['disjoint-overlap', 'kind-and-part']);
    expect(comparableFindings(pushed.findings)).toEqual(comparableFindings(files.findings));
  });
});

describe('the private instance', () => {
  it('listens on loopback only', () => {
    expect(virtuoso.sparqlUrl).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/sparql$/);
    const ini = readFileSync(path.join(virtuoso.folder, 'virtuoso.ini'), 'utf8');
    const ports = ini.split('\n').filter((line) => line.startsWith('ServerPort'));
    expect(ports).toEqual([`ServerPort = 127.0.0.1:${virtuoso.sqlPort}`, `ServerPort = 127.0.0.1:${virtuoso.httpPort}`]);
  });
});
