// Large N-Triples through the fast path: a bad line mid-file, truncated gzip, standard input, a million-long chain and cycle.
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { Readable } from 'node:stream';
import { gzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { check } from '../../src/check.js';
import { writeLines } from './scale-fixtures.js';
import { runCli } from '../cli/terminal-fake.js';
import { writeHierarchy } from '../bench/generate.js';

const SUBCLASS_OF = '<http://www.w3.org/2000/01/rdf-schema#subClassOf>';
const RDFS_COMMENT = '<http://www.w3.org/2000/01/rdf-schema#comment>';

describe('a bad line in the middle of a large N-Triples file', () => {
  let dir = '';
  let lines: string[] = [];
  let badLine = 0;
  beforeAll(async () => {
    // Invented data from test/bench/generate.ts; one rdfs:comment line halfway is cut short.
    dir = mkdtempSync(path.join(tmpdir(), 'isapart-bad-line-'));
    await writeHierarchy(path.join(dir, 'clean.nt'), { classes: 20_000 }, 'n-triples');
    lines = readFileSync(path.join(dir, 'clean.nt'), 'utf8').split('\n');
    badLine = lines.findIndex((line, index) => index > lines.length / 2 && line.includes(RDFS_COMMENT)) + 1;
    const broken = [...lines];
    broken[badLine - 1] = broken[badLine - 1].replace(/" \.$/, ' .');
    writeFileSync(path.join(dir, 'broken.nt'), broken.join('\n'));
  });
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('is an error at its exact line, the rest of the file is still read, and the exit code is 2', async () => {
    const broken = await runCli(dir, ['check', 'broken.nt', '-f', 'json', '--fail-on', 'never']);
    const clean = await runCli(dir, ['check', 'clean.nt', '-f', 'json', '--fail-on', 'never']);
    expect(broken.code).toBe(2);
    expect(clean.code).toBe(0);
    const brokenReport = JSON.parse(broken.out);
    const cleanReport = JSON.parse(clean.out);
    expect(brokenReport.inputErrors).toHaveLength(1);
    expect(brokenReport.inputErrors[0]).toMatchObject({ file: 'broken.nt', line: badLine });
    expect(brokenReport.inputErrors[0].message).toContain('the lines after it were read');
    expect(broken.err).toContain(`broken.nt:${badLine}:`);
    // Every other statement was read, and the findings (of statements on both sides of the line) are the clean file's.
    expect(brokenReport.summary.statements).toBe(cleanReport.summary.statements - 1);
    const fingerprints = (report: { findings: { fingerprint: string }[] }) => report.findings.map((finding) => finding.fingerprint);
    expect(fingerprints(brokenReport)).toEqual(fingerprints(cleanReport));
    expect(cleanReport.findings.length).toBeGreaterThan(0);
  });

  it('a truncated .nt.gz is an error naming gzip, not a silent short read', async () => {
    const whole = gzipSync(readFileSync(path.join(dir, 'clean.nt')));
    writeFileSync(path.join(dir, 'cut.nt.gz'), whole.subarray(0, Math.floor(whole.length / 2)));
    writeFileSync(path.join(dir, 'whole.nt.gz'), whole);
    const cut = await check({ paths: ['cut.nt.gz'], cwd: dir });
    const complete = await check({ paths: ['whole.nt.gz'], cwd: dir });
    expect(complete.context.inputErrors).toEqual([]);
    expect(complete.context.sources[0].statements).toBe(lines.filter((line) => line !== '').length);
    expect(cut.context.inputErrors).toHaveLength(1);
    expect(cut.context.inputErrors[0].message).toMatch(/cut\.nt\.gz starts as gzip but cannot be decompressed .*the rest was not/);
    expect(cut.context.inputErrors[0].hint).toContain('gzip -t');
    expect(cut.context.sources[0].statements).toBeLessThan(complete.context.sources[0].statements);
  });

  it('reads N-Triples from standard input in chunks, with the same findings as from the file', async () => {
    const bytes = readFileSync(path.join(dir, 'clean.nt'));
    const chunks = Array.from({ length: Math.ceil(bytes.length / 65_521) }, (_, index) => bytes.subarray(index * 65_521, (index + 1) * 65_521));
    const piped = await check({ paths: ['-'], cwd: dir, stdin: Readable.from(chunks) });
    const file = await check({ paths: ['clean.nt'], cwd: dir });
    expect(piped.context.sources[0]).toMatchObject({ file: '<stdin>', format: 'n-triples', statements: file.context.sources[0].statements });
    expect(piped.findings.map((finding) => finding.fingerprint)).toEqual(file.findings.map((finding) => finding.fingerprint));
  });
});

describe('a million statements through the fast path', () => {
  const SIZE = 1_000_000;
  const iri = (index: number) => `<https://data.northvale-rail.example/def/Level${index}>`;

  it('a 1,000,000-long subclass-of chain gives the orphan top and the one shortcut', async () => {
    // Invented data: Level0 ⊑ Level1 ⊑ ... ⊑ Level999999, plus the shortcut Level0 ⊑ Level2.
    const dir = mkdtempSync(path.join(tmpdir(), 'isapart-chain-'));
    await writeLines(path.join(dir, 'chain.nt'), SIZE, (index) =>
      index + 1 < SIZE ? `${iri(index)} ${SUBCLASS_OF} ${iri(index + 1)} .` : `${iri(0)} ${SUBCLASS_OF} ${iri(2)} .`,
    );
    const result = await check({ paths: ['chain.nt'], cwd: dir });
    rmSync(dir, { recursive: true, force: true });
    expect(result.context.inputErrors).toEqual([]);
    expect(result.graph.nodeCount).toBe(SIZE);
    const unsuppressed = result.findings.filter((finding) => finding.ruleId !== 'unused-allow');
    expect(unsuppressed.map((finding) => [finding.ruleId, finding.nodes]).sort()).toEqual([
      ['orphan-class', ['https://data.northvale-rail.example/def/Level999999']],
      ['redundant-subclass', ['https://data.northvale-rail.example/def/Level0', 'https://data.northvale-rail.example/def/Level2']],
    ]);
    // The shortcut was stated on the last line, column 1.
    const shortcut = unsuppressed.find((finding) => finding.ruleId === 'redundant-subclass');
    expect(shortcut?.evidence.map((statement) => statement.position)).toContainEqual({ file: 'chain.nt', line: SIZE, column: 1 });
  }, 120_000);

  it('a 1,000,000-member subclass-of cycle is one finding whose evidence walks all of it', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'isapart-cycle-'));
    await writeLines(path.join(dir, 'cycle.nt'), SIZE, (index) => `${iri(index)} ${SUBCLASS_OF} ${iri((index + 1) % SIZE)} .`);
    const result = await check({ paths: ['cycle.nt'], cwd: dir });
    rmSync(dir, { recursive: true, force: true });
    expect(result.context.inputErrors).toEqual([]);
    const cycles = result.findings.filter((finding) => finding.ruleId === 'subclass-cycle');
    expect(cycles).toHaveLength(1);
    expect(cycles[0].nodes).toHaveLength(SIZE);
    expect(cycles[0].evidence).toHaveLength(SIZE);
    expect(new Set(cycles[0].evidence.map((statement) => statement.position.line)).size).toBe(SIZE);
  }, 120_000);
});
