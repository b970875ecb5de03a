// Push-down against a server known to answer a rule's query wrongly: that rule runs locally on an extracted graph, with a warning.
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { check } from '../../src/check.js';
import { KNOWN_SERVERS, knownServer, ruleNamedByTable } from '../../src/endpoint-known-servers.js';
import { OWL_DISJOINT_WITH } from '../../src/roles/vocabulary.js';
import { runCli } from '../cli/terminal-fake.js';
import { comparableFindings, DEMO, DEMO_GRAPH, demoConfigFolder, demoStore } from './endpoint-fixtures.js';
import { startSparqlServer, type TestSparqlServer } from './sparql-server.js';

/** The Server header Debian's Virtuoso 7.2.5 sends (as seen by the system test, test/system/endpoint.test.ts). */
const VIRTUOSO_HEADER = 'Virtuoso/07.20.3229 (Linux) x86_64-pc-linux-gnu';

let server: TestSparqlServer;
let folder: string;

beforeAll(async () => {
  server = await startSparqlServer(demoStore());
  folder = demoConfigFolder('endpoint: { page-size: 25, retry-delay: 0.01 }');
});

afterAll(async () => {
  await server.close();
});

beforeEach(() => {
  server.serverHeader = undefined;
});

/** Push-down rule queries (paged by the runner, not extraction pages) that test owl:disjointWith. */
function disjointRuleQueries(from: number): string[] {
  return server.requests
    .slice(from)
    .map((request) => request.query)
    .filter((query) => /\nORDER BY [^\n]+\nLIMIT 25\nOFFSET \d+\n$/.test(query) && !query.includes('WHERE { ?s <') && query.includes(OWL_DISJOINT_WITH));
}

describe('the table of known servers', () => {
  it('recognises Virtuoso 7.x from its Server header and no other server', () => {
    expect(knownServer(VIRTUOSO_HEADER)?.wrongRules).toEqual(['disjoint-overlap', 'kind-and-part']);
    expect(knownServer('Virtuoso/07.10.3211 (Linux)')?.name).toBe('Virtuoso 7.x');
    expect(knownServer('Virtuoso/08.03.3330 (Linux)')).toBeUndefined();
    expect(knownServer('Apache Jena Fuseki (5.0.0)')).toBeUndefined();
    expect(knownServer(undefined)).toBeUndefined();
    expect(ruleNamedByTable('disjoint-overlap')).toBe(true);
    expect(ruleNamedByTable('subclass-cycle')).toBe(false);
    // Every entry points at written evidence.
    expect(KNOWN_SERVERS.every((entry) => entry.evidence === 'docs/push-down.md')).toBe(true);
  });
});

describe('--push-down against a server named in the table', () => {
  it('evaluates disjoint-overlap locally, says so, and still gives the in-memory findings', async () => {
    const files = await check({ paths: [DEMO], cwd: DEMO, configFile: `${DEMO}/isapart.yaml` });
    expect(files.findings.filter((finding) => finding.ruleId === 'disjoint-overlap').length).toBeGreaterThan(0);
    server.serverHeader = VIRTUOSO_HEADER;
    const before = server.requests.length;
    const pushed = await check({ paths: [], cwd: folder, configFile: `${folder}/isapart.yaml`, endpoint: server.url, graph: DEMO_GRAPH, pushDown: true });
    expect(pushed.context.inputErrors).toEqual([]);
    expect(pushed.context.ruleFailures).toEqual([]);
    expect(comparableFindings(pushed.findings)).toEqual(comparableFindings(files.findings));
    expect(disjointRuleQueries(before)).toEqual([]);
    // The local graph was extracted from the same endpoint.
    expect(server.requests.slice(before).some((request) => request.query.includes(`WHERE { ?s <${OWL_DISJOINT_WITH}> ?o }`))).toBe(true);
    const warnings = pushed.context.inputWarnings.filter((warning) => warning.message.includes('disjoint-overlap'));
    expect(warnings).toHaveLength(1);
    expect(warnings[0].message).toContain('Virtuoso 7.x');
    expect(warnings[0].message).toContain(VIRTUOSO_HEADER);
    expect(warnings[0].hint).toContain('docs/push-down.md');
  });

  it('prints the warning in text, JSON and SARIF', async () => {
    server.serverHeader = VIRTUOSO_HEADER;
    const args = ['check', '--endpoint', server.url, '--graph', DEMO_GRAPH, '--push-down', '--fail-on', 'never', '--no-color'];
    const text = await runCli(folder, args);
    expect(text.code).toBe(0);
    expect(text.out + text.err).toContain('rule disjoint-overlap was not pushed down: the endpoint is Virtuoso 7.x');
    const json = JSON.parse((await runCli(folder, [...args, '-f', 'json'])).out) as { inputWarnings: { message: string; hint?: string }[] };
    expect(json.inputWarnings.some((warning) => warning.message.includes('rule disjoint-overlap was not pushed down') && (warning.hint ?? '').includes('docs/push-down.md'))).toBe(true);
    const sarif = JSON.parse((await runCli(folder, [...args, '-f', 'sarif'])).out) as {
      runs: { invocations: { toolExecutionNotifications: { level: string; message: { text: string } }[] }[] }[];
    };
    const notes = sarif.runs[0].invocations[0].toolExecutionNotifications;
    // SARIF 2.1.0, section 3.58: a notification's level is one of none, note, warning, error.
    expect(notes.some((note) => note.level === 'warning' && note.message.text.includes('rule disjoint-overlap was not pushed down'))).toBe(true);
  });

  it('without the header sends the disjoint-overlap query and warns of nothing', async () => {
    const before = server.requests.length;
    const pushed = await check({ paths: [], cwd: folder, configFile: `${folder}/isapart.yaml`, endpoint: server.url, graph: DEMO_GRAPH, pushDown: true });
    expect(pushed.context.inputErrors).toEqual([]);
    expect(disjointRuleQueries(before).length).toBeGreaterThan(0);
    expect(pushed.context.inputWarnings.filter((warning) => warning.message.includes('not pushed down'))).toEqual([]);
    // No extraction either: every request was a rule query.
    expect(server.requests.slice(before).some((request) => request.query.includes('WHERE { ?s <'))).toBe(false);
  });

  it('with `endpoint: { trust-server: true }` sends the query anyway and warns of nothing', async () => {
    server.serverHeader = VIRTUOSO_HEADER;
    const trusting = demoConfigFolder('endpoint: { page-size: 25, retry-delay: 0.01, trust-server: true }');
    const before = server.requests.length;
    const pushed = await check({ paths: [], cwd: trusting, configFile: `${trusting}/isapart.yaml`, endpoint: server.url, graph: DEMO_GRAPH, pushDown: true });
    expect(pushed.context.inputErrors).toEqual([]);
    expect(disjointRuleQueries(before).length).toBeGreaterThan(0);
    expect(pushed.context.inputWarnings.filter((warning) => warning.message.includes('not pushed down'))).toEqual([]);
  });

  it('with only the suspect rule active, asks the server once to learn which it is', async () => {
    server.serverHeader = VIRTUOSO_HEADER;
    const only = demoConfigFolder(
      'endpoint: { page-size: 25, retry-delay: 0.01 }\n' +
        'rules: { subclass-cycle: off, part-cycle: off, kind-and-part: off, instance-and-subclass: off, orphan-class: off, redundant-subclass: off, individual-as-class: off, deprecated-in-use: off }',
    );
    const before = server.requests.length;
    const pushed = await check({ paths: [], cwd: only, configFile: `${only}/isapart.yaml`, endpoint: server.url, graph: DEMO_GRAPH, pushDown: true });
    expect(pushed.context.inputErrors).toEqual([]);
    expect(server.requests[before].query).toBe('ASK { }');
    expect(disjointRuleQueries(before)).toEqual([]);
    expect(pushed.findings.filter((finding) => finding.ruleId === 'disjoint-overlap').length).toBeGreaterThan(0);
  });
});
