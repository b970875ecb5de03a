// An edit run's new, unchanged and absent findings are the fingerprint difference of two full lints: of the data, and of the data as oxigraph leaves it after running the same update.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import oxigraph from 'oxigraph';
import { afterAll, describe, expect, it } from 'vitest';
import { check, type CheckOptions } from '../../src/check.js';
import { checkEdit, prepareEdit } from '../../src/edit/check-edit.js';
import type { Finding } from '../../src/engine/finding.js';
import { randomSource } from '../random-source.js';

const NV = 'https://data.northvale-rail.example/def/';
const CLASSES = ['Asset', 'Vehicle', 'Car', 'MotorCar', 'Bogie', 'Wheelset', 'Axle', 'Brake', 'Unit'].map((name) => `${NV}${name}`);
const PREDICATES = [
  'http://www.w3.org/2000/01/rdf-schema#subClassOf',
  'http://www.w3.org/2000/01/rdf-schema#subClassOf',
  `${NV}partOf`,
  'http://www.w3.org/1999/02/22-rdf-syntax-ns#type',
  'http://www.w3.org/2002/07/owl#disjointWith',
];
const CONFIG = [
  'presets: [rdfs, owl]',
  `roles: { part-of: { iri: [${NV}partOf], inverse: [${NV}hasPart] } }`,
  'scope: [https://data.northvale-rail.example/]',
  `roots: [${NV}Asset]`,
  '',
].join('\n');
const PROLOGUE = `PREFIX nv: <${NV}>\nPREFIX rdfs: <http://www.w3.org/2000/01/rdf-schema#>\nPREFIX owl: <http://www.w3.org/2002/07/owl#>\n`;

const folders: string[] = [];
afterAll(() => {
  for (const folder of folders) rmSync(folder, { recursive: true, force: true });
});

/** The operations of the random edits; `$a`, `$b`, `$c` stand for classes drawn per operation. */
const OPERATIONS = [
  'INSERT DATA { $a rdfs:subClassOf $b }',
  'INSERT DATA { $a nv:partOf $b . $b nv:hasPart $c }',
  'INSERT DATA { $a a $b }',
  'INSERT DATA { $a owl:disjointWith $b }',
  'DELETE DATA { $a rdfs:subClassOf $b }',
  'DELETE WHERE { $a rdfs:subClassOf ?x }',
  'DELETE { ?x nv:partOf $a } INSERT { ?x rdfs:subClassOf $a } WHERE { ?x nv:partOf $a }',
  'INSERT { ?x nv:partOf ?y } WHERE { ?x rdfs:subClassOf ?y . ?y rdfs:subClassOf $a }',
  'DELETE { ?x a ?c } INSERT { ?x rdfs:subClassOf ?c } WHERE { ?x a ?c }',
];

function randomCase(seed: number): { data: string; edit: string } {
  const random = randomSource(seed);
  const pick = <T>(items: readonly T[]): T => items[Math.floor(random() * items.length)];
  const lines: string[] = [];
  const count = 4 + Math.floor(random() * 10);
  for (let index = 0; index < count; index++) lines.push(`<${pick(CLASSES)}> <${pick(PREDICATES)}> <${pick(CLASSES)}> .`);
  const operations: string[] = [];
  const steps = 1 + Math.floor(random() * 3);
  for (let index = 0; index < steps; index++) {
    operations.push(pick(OPERATIONS).replaceAll('$a', `<${pick(CLASSES)}>`).replaceAll('$b', `<${pick(CLASSES)}>`).replaceAll('$c', `<${pick(CLASSES)}>`));
  }
  return { data: `${lines.join('\n')}\n`, edit: `${PROLOGUE}${operations.join(' ;\n')}\n` };
}

const fingerprints = (findings: Finding[]) => findings.map((finding) => `${finding.ruleId} ${finding.fingerprint}`).sort();

describe('an edit run against two full lints', () => {
  it('gives as new exactly what only the edited data has, as absent what only the data has, on 60 random cases', async () => {
    let changedCases = 0;
    for (let seed = 1; seed <= 60; seed++) {
      const { data, edit } = randomCase(seed);
      const folder = mkdtempSync(path.join(tmpdir(), 'isapart-edit-relint-'));
      folders.push(folder);
      writeFileSync(path.join(folder, 'isapart.yaml'), CONFIG);
      writeFileSync(path.join(folder, 'data.nq'), data);
      writeFileSync(path.join(folder, 'edit.ru'), edit);
      // oxigraph (npm), a SPARQL 1.1 Update engine, applies the update; its store is written back as N-Quads.
      const store = new oxigraph.Store();
      store.load(data, { format: 'application/n-quads' });
      store.update(edit);
      writeFileSync(path.join(folder, 'after.nq'), store.dump({ format: 'application/n-quads' }));

      const options = (file: string): CheckOptions => ({ paths: [file], cwd: folder });
      const before = fingerprints((await check(options('data.nq'))).findings);
      const after = fingerprints((await check(options('after.nq'))).findings);
      const prepared = await prepareEdit({ editFile: 'edit.ru' }, options('data.nq'));
      if ('errors' in prepared) throw new Error(prepared.errors[0].message);
      const result = await checkEdit(options('data.nq'), prepared);
      if ('errors' in result) throw new Error(result.errors[0].message);
      expect(result.context.inputErrors, edit).toEqual([]);
      const state = (wanted: string) => fingerprints(result.findings.filter((finding) => finding.baselineState === wanted));
      const inBoth = after.filter((print) => before.includes(print));
      expect(state('new'), `seed ${seed}\n${data}${edit}`).toEqual(after.filter((print) => !before.includes(print)));
      expect(state('absent'), `seed ${seed}`).toEqual(before.filter((print) => !after.includes(print)));
      expect(state('unchanged'), `seed ${seed}`).toEqual(inBoth);
      if (state('new').length + state('absent').length > 0) changedCases += 1;
    }
    // Most random edits change the findings, so the comparison is not one of empty differences.
    expect(changedCases).toBeGreaterThan(20);
  });
});
