// End-to-end specification of `isapart check`: exit codes, inputs, outputs.
import { execFileSync, spawnSync } from 'node:child_process';
import { readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { folderWith, runCli } from './terminal-fake.js';

const PREFIXES = `@prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .
@prefix dcterms: <http://purl.org/dc/terms/> .
@prefix nv: <https://data.northvale-rail.example/def/> .
`;
const CLEAN = `${PREFIXES}nv:Bogie rdfs:subClassOf nv:Component .\nnv:Component rdfs:subClassOf nv:Asset .\n`;
const CYCLE = `${PREFIXES}nv:Car rdfs:subClassOf nv:Vehicle .\nnv:Vehicle rdfs:subClassOf nv:Car .\n`;
const BROKEN = `${PREFIXES}nv:Signal rdfs:subClassOf nv:Equipment .\nnv:Lamp rdfs:subClassOf nv:Signal\nnv:Mast rdfs:subClassOf .\n`;

const run = runCli;

describe('isapart check', () => {
  it('exits 0 on a clean hierarchy', async () => {
    const dir = folderWith({ 'clean.ttl': CLEAN });
    const result = await run(dir, ['check', 'clean.ttl', '--root', 'https://data.northvale-rail.example/def/Asset']);
    expect(result.code).toBe(0);
    expect(result.out).toMatch(/0 errors/);
  });

  it('exits 1 on an error-level finding and names the rule and location', async () => {
    const dir = folderWith({ 'cycle.ttl': CYCLE });
    const result = await run(dir, ['check', 'cycle.ttl']);
    expect(result.code).toBe(1);
    expect(result.out).toContain('subclass-cycle');
    expect(result.out).toMatch(/cycle\.ttl:\d+:\d+/);
  });

  it('exits 0 with --fail-on never and 1 with --fail-on note when only notes are found', async () => {
    const dir = folderWith({ 'clean.ttl': CLEAN });
    expect((await run(dir, ['check', 'clean.ttl', '--fail-on', 'never'])).code).toBe(0);
    // without --root, nv:Asset is an orphan class (a note)
    expect((await run(dir, ['check', 'clean.ttl', '--fail-on', 'note'])).code).toBe(1);
  });

  it('exits 2 on a broken file beside a good one, and still reports the good one', async () => {
    const dir = folderWith({ 'a-broken.ttl': BROKEN, 'b-cycle.ttl': CYCLE });
    const result = await run(dir, ['check', '.', '-f', 'json']);
    expect(result.code).toBe(2);
    const report = JSON.parse(result.out);
    expect(report.inputErrors.length).toBeGreaterThan(0);
    expect(report.inputErrors[0].file).toContain('a-broken.ttl');
    expect(report.inputErrors[0].line).toBe(6);
    expect(report.findings.some((f: { ruleId: string }) => f.ruleId === 'subclass-cycle')).toBe(true);
  });

  it('reads standard input with a sniffed format', async () => {
    const dir = folderWith({});
    const result = await run(dir, ['check', '-', '-f', 'json'], CYCLE);
    expect(result.code).toBe(1);
    const report = JSON.parse(result.out);
    expect(report.findings.map((f: { ruleId: string }) => f.ruleId)).toContain('subclass-cycle');
  });

  it('lints a folder recursively', async () => {
    const dir = folderWith({ 'data/one/a.ttl': CLEAN, 'data/two/b.ttl': CYCLE, 'data/notes.txt': 'not rdf' });
    const result = await run(dir, ['check', 'data', '-f', 'json']);
    const report = JSON.parse(result.out);
    expect(report.inputs.map((i: { file: string }) => i.file).sort()).toEqual(['data/one/a.ttl', 'data/two/b.ttl']);
  });

  it('writes -o atomically and prints nothing on stdout', async () => {
    const dir = folderWith({ 'cycle.ttl': CYCLE });
    const result = await run(dir, ['check', 'cycle.ttl', '-f', 'sarif', '-o', 'out.sarif']);
    expect(result.code).toBe(1);
    expect(result.out).toBe('');
    const sarif = JSON.parse(readFileSync(path.join(dir, 'out.sarif'), 'utf8'));
    expect(sarif.version).toBe('2.1.0');
    expect(readdirSync(dir).filter((name) => name.endsWith('.tmp'))).toEqual([]);
  });

  it('refuses a malformed --rule with exit 2', async () => {
    const dir = folderWith({ 'clean.ttl': CLEAN });
    const result = await run(dir, ['check', 'clean.ttl', '--rule', 'orphan-class=loud']);
    expect(result.code).toBe(2);
    expect(result.err).toContain('ID=LEVEL');
  });

  it('turns a rule off with --rule ID=off', async () => {
    const dir = folderWith({ 'cycle.ttl': CYCLE });
    const result = await run(dir, ['check', 'cycle.ttl', '--rule', 'subclass-cycle=off', '-f', 'json']);
    const report = JSON.parse(result.out);
    expect(report.findings.map((f: { ruleId: string }) => f.ruleId)).not.toContain('subclass-cycle');
  });

  it('rejects an unknown option with exit 2', async () => {
    const dir = folderWith({});
    expect((await run(dir, ['check', '--formt', 'json'])).code).toBe(2);
  });

  it('writes messages and evidence with the same prefix when two names are declared for one namespace', async () => {
    const first = '@prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .\n@prefix aa: <https://data.northvale-rail.example/def/> .\naa:Car rdfs:subClassOf aa:Vehicle .\n';
    const second = '@prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .\n@prefix zz: <https://data.northvale-rail.example/def/> .\nzz:Vehicle rdfs:subClassOf zz:Car .\n';
    const dir = folderWith({ 'a.ttl': first, 'b.ttl': second });
    const result = await run(dir, ['check', '.']);
    expect(result.out).toContain('aa:Car → aa:Vehicle → aa:Car');
    expect(result.out).toContain('aa:Vehicle rdfs:subClassOf aa:Car');
    expect(result.out).not.toContain('zz:');
  });

  it('teaches in --help: examples, exit codes, suppression', async () => {
    const result = await run(folderWith({}), ['check', '--help']);
    expect(result.code).toBe(0);
    expect(result.out).toContain('Examples:');
    expect(result.out).toContain('Exit codes');
    expect(result.out).toContain('isapart-allow');
  });
});

describe('the shipped demo', () => {
  it('lints with exit 0 under --fail-on never and shows a finding of every built-in rule', async () => {
    const root = path.resolve(__dirname, '../..');
    const result = await run(root, ['check', 'fixtures/demo', '--fail-on', 'never']);
    expect(result.code).toBe(0);
    const builtIn = readdirSync(path.join(root, 'rules')).filter((name) => name.endsWith('.yaml')).map((name) => name.replace(/\.yaml$/, ''));
    expect(builtIn).toHaveLength(9);
    for (const ruleId of builtIn) expect(result.out).toContain(`  ${ruleId}  `);
  });
});

describe('the isapart binary', () => {
  it('runs as a process with the exit code of the run', () => {
    const root = path.resolve(__dirname, '../..');
    const dir = folderWith({ 'cycle.ttl': CYCLE });
    const run = spawnSync(process.execPath, [path.join(root, 'bin/isapart.js'), 'check', path.join(dir, 'cycle.ttl')], {
      encoding: 'utf8',
      env: { ...process.env, NO_COLOR: '1' },
    });
    expect(run.status).toBe(1);
    expect(run.stdout).toContain('subclass-cycle');
    expect(run.stdout).not.toMatch(/\u001b\[/);
  });

  it('prints its version', () => {
    const root = path.resolve(__dirname, '../..');
    const version = JSON.parse(readFileSync(path.join(root, 'package.json'), 'utf8')).version;
    expect(execFileSync(process.execPath, [path.join(root, 'bin/isapart.js'), '--version'], { encoding: 'utf8' }).trim()).toBe(version);
  });
});

describe('the unused-allow rule', () => {
  it('flags its flagged example and not its clean one, like every rule', async () => {
    const { UNUSED_ALLOW_RULE } = await import('../../src/engine/suppress.js');
    const root = 'https://data.northvale-rail.example/def/Asset';
    const flagged = await run(folderWith({ 'a.ttl': UNUSED_ALLOW_RULE.examples.flagged }), ['check', 'a.ttl', '--root', root, '-f', 'json']);
    const clean = await run(folderWith({ 'a.ttl': UNUSED_ALLOW_RULE.examples.clean }), ['check', 'a.ttl', '--root', root, '-f', 'json']);
    expect(JSON.parse(flagged.out).findings.map((f: { ruleId: string }) => f.ruleId)).toEqual(['unused-allow']);
    expect(JSON.parse(clean.out).findings).toEqual([]);
  });
});

describe('a cycle through a borrowed term', () => {
  it('is reported on the in-scope member, even when the borrowed term sorts first', async () => {
    // "http://purl.org/…" sorts before "https://data.northvale-rail.example/…".
    const text = `${PREFIXES}nv:Carriage rdfs:subClassOf <http://purl.org/borrowed/Vehicle> .\n<http://purl.org/borrowed/Vehicle> rdfs:subClassOf nv:Carriage .\n`;
    const dir = folderWith({ 'a.ttl': text });
    const result = await run(dir, ['check', 'a.ttl', '--scope', 'https://data.northvale-rail.example/', '-f', 'json']);
    const cycles = JSON.parse(result.out).findings.filter((f: { ruleId: string }) => f.ruleId === 'subclass-cycle');
    expect(cycles.map((f: { focus: string; nodes: string[] }) => [f.focus, f.nodes])).toEqual([
      // The nodes are the members by term, whichever is the focus.
      ['https://data.northvale-rail.example/def/Carriage', ['http://purl.org/borrowed/Vehicle', 'https://data.northvale-rail.example/def/Carriage']],
    ]);
  });
});
