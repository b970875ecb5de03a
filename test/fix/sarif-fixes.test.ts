// SARIF fixes: applied as SARIF 2.1.0 says regions are read, they leave files that parse without exactly the fixed statements.
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { Parser } from 'n3';
import type * as RDF from '@rdfjs/types';
import { isomorphic } from 'rdf-isomorphic';
import { describe, expect, it } from 'vitest';
import { runCli } from '../cli/terminal-fake.js';
import { sarifValidator } from '../report/sarif-validator.js';

const validateSarif = sarifValidator();

const HEAD = `@prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .
@prefix nv: <https://data.northvale-rail.example/def/> .
`;
// Four redundant-subclass findings: two on their own lines (one with a comment, one over two lines),
// one in a , list and one in a ; list, which cannot be removed as whole lines.
const COMPONENTS = `${HEAD}nv:Component rdfs:subClassOf nv:Asset .
nv:Equipment rdfs:subClassOf nv:Component .
nv:Motor rdfs:subClassOf nv:Equipment .
nv:Motor rdfs:subClassOf nv:Component .   # stated again by the 2019 import
nv:Brake rdfs:subClassOf nv:Equipment .
nv:Brake
    rdfs:subClassOf nv:Asset .
nv:Door rdfs:subClassOf nv:Equipment , nv:Component .
nv:Seat rdfs:subClassOf nv:Equipment ;
  rdfs:subClassOf nv:Asset .
`;
const SIGNALS = `<https://data.northvale-rail.example/def/Signal> <http://www.w3.org/2000/01/rdf-schema#subClassOf> <https://data.northvale-rail.example/def/Equipment> .\r
<https://data.northvale-rail.example/def/Signal> <http://www.w3.org/2000/01/rdf-schema#subClassOf> <https://data.northvale-rail.example/def/Asset> .\r
`;

interface Region {
  startLine: number;
  startColumn?: number;
  endLine?: number;
  endColumn?: number;
  snippet?: { text: string };
}

/**
 * The offset of a line and column in a text, as SARIF 2.1.0 §3.30 counts them: 1-based lines
 * separated by CR LF, LF or CR, 1-based columns in UTF-16 code units (the log's columnKind); the
 * line after the last one starts at the end of the text.
 */
function offsetOf(text: string, line: number, column: number): number {
  let offset = 0;
  for (let current = 1; current < line; current++) {
    const next = text.slice(offset).search(/\r\n|\r|\n/);
    if (next < 0) return text.length;
    offset += next + (text.startsWith('\r\n', offset + next) ? 2 : 1);
  }
  return offset + column - 1;
}

/** Applies a SARIF artifact change's replacements (deletions here) to a text, last first. */
function applyReplacements(text: string, replacements: { deletedRegion: Region; insertedContent?: { text: string } }[]): string {
  const spans = replacements.map(({ deletedRegion: region, insertedContent }) => {
    const start = offsetOf(text, region.startLine, region.startColumn ?? 1);
    const end = offsetOf(text, region.endLine ?? region.startLine, region.endColumn ?? 1);
    // The snippet is the region's own text (SARIF 2.1.0 §3.30.13).
    if (region.snippet) expect(text.slice(start, end)).toBe(region.snippet.text);
    return { start, end, inserted: insertedContent?.text ?? '' };
  });
  let edited = text;
  for (const span of spans.sort((left, right) => right.start - left.start)) edited = edited.slice(0, span.start) + span.inserted + edited.slice(span.end);
  return edited;
}

function quadsOf(text: string, file: string): RDF.Quad[] {
  return new Parser({ format: file.endsWith('.nt') ? 'N-Triples' : 'Turtle', baseIRI: pathToFileURL(file).href }).parse(text);
}

describe('SARIF fixes', () => {
  it('delete whole lines only where that is safe; applied, n3 reads the graph less exactly those statements, and the findings go', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'isapart-fixes-'));
    writeFileSync(path.join(dir, 'components.ttl'), COMPONENTS);
    writeFileSync(path.join(dir, 'signals.nt'), SIGNALS);
    writeFileSync(path.join(dir, 'isapart.yaml'), 'roots: [https://data.northvale-rail.example/def/Asset]\n');
    const run = await runCli(dir, ['check', '.', '-f', 'sarif', '--fail-on', 'never']);
    const log = JSON.parse(run.out);
    expect(validateSarif(log)).toBe(true);
    expect(validateSarif.errors ?? []).toEqual([]);
    const results = log.runs[0].results as { ruleId: string; message: { text: string }; fixes?: any[]; properties: { fix?: { description: string } } }[];
    const redundant = results.filter((result) => result.ruleId === 'redundant-subclass');
    expect(redundant).toHaveLength(5);
    const withFixes = redundant.filter((result) => result.fixes !== undefined);
    const described = redundant.filter((result) => result.fixes === undefined);
    // Motor, Brake and Signal are on their own lines; Door and Seat share theirs with other triples.
    expect(withFixes.map((result) => result.message.text.split(' ')[0]).sort()).toEqual(['nv:Brake', 'nv:Motor', 'nv:Signal']);
    expect(described.map((result) => result.message.text.split(' ')[0]).sort()).toEqual(['nv:Door', 'nv:Seat']);
    for (const result of described) expect(result.properties.fix?.description).toMatch(/^Remove the statement: /);

    const texts = new Map<string, string>();
    for (const name of ['components.ttl', 'signals.nt']) texts.set(name, readFileSync(path.join(dir, name), 'utf8'));
    // Every fix's regions are of the file as linted, so all fixes of a file are applied to it at once.
    const replacements = new Map<string, { deletedRegion: Region }[]>();
    for (const result of withFixes) {
      expect(result.fixes).toHaveLength(1);
      expect(result.fixes?.[0].description.text).toMatch(/^Remove the statement: .*Review the change before applying it\.$/);
      for (const change of result.fixes?.[0].artifactChanges ?? []) {
        const name = decodeURIComponent(change.artifactLocation.uri);
        replacements.set(name, [...(replacements.get(name) ?? []), ...change.replacements]);
      }
    }
    expect([...replacements.values()].flat()).toHaveLength(3);
    const edited = new Map([...texts].map(([name, text]) => [name, applyReplacements(text, replacements.get(name) ?? [])]));
    // n3's parser and rdf-isomorphic (general-purpose libraries) compare the graphs before and after.
    for (const [name, text] of texts) {
      const file = path.join(dir, name);
      const before = quadsOf(text, file);
      const after = quadsOf(edited.get(name) as string, file);
      const dropped = before.filter((quad) => !after.some((kept) => kept.equals(quad)));
      expect(after.length).toBe(before.length - dropped.length);
      expect(isomorphic(after, before.filter((quad) => !dropped.includes(quad)))).toBe(true);
      const expectedDrops = name === 'components.ttl' ? 2 : 1;
      expect(dropped).toHaveLength(expectedDrops);
      writeFileSync(file, edited.get(name) as string);
    }
    const relinted = JSON.parse((await runCli(dir, ['check', '.', '-f', 'sarif', '--fail-on', 'never'])).out);
    const left = relinted.runs[0].results.filter((result: { ruleId: string }) => result.ruleId === 'redundant-subclass');
    expect(left.map((result: { message: { text: string } }) => result.message.text.split(' ')[0]).sort()).toEqual(['nv:Door', 'nv:Seat']);
  });

  it('with a baseline, every result has a baselineState, fixes stay, and the log still validates', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'isapart-fixes-'));
    writeFileSync(path.join(dir, 'components.ttl'), COMPONENTS);
    await runCli(dir, ['check', '.', '-f', 'sarif', '-o', 'before.sarif']);
    writeFileSync(path.join(dir, 'components.ttl'), `${COMPONENTS}nv:Lamp rdfs:subClassOf nv:Equipment .\nnv:Lamp rdfs:subClassOf nv:Asset .\n`);
    const log = JSON.parse((await runCli(dir, ['check', '.', '-f', 'sarif', '--baseline', 'before.sarif'])).out);
    expect(validateSarif(log)).toBe(true);
    const results = log.runs[0].results as { baselineState?: string; fixes?: unknown[]; message: { text: string } }[];
    expect(results.every((result) => result.baselineState !== undefined)).toBe(true);
    const added = results.filter((result) => result.baselineState === 'new');
    expect(added.map((result) => result.message.text.split(' ')[0])).toEqual(['nv:Lamp']);
    expect(added[0].fixes).toHaveLength(1);
  });
});
