// Fingerprints hash the rule and the nodes, never positions: reordering, moving and renaming change none.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { check } from '../src/check.js';

const PREFIXES = [
  '@prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .',
  '@prefix owl: <http://www.w3.org/2002/07/owl#> .',
  '@prefix dcterms: <http://purl.org/dc/terms/> .',
  '@prefix nv: <https://data.northvale-rail.example/def/> .',
];
/** One statement per line, with findings of several rules among them. */
const STATEMENTS = [
  'nv:Car rdfs:subClassOf nv:Vehicle .',
  'nv:Vehicle rdfs:subClassOf nv:Car .',
  'nv:Cab rdfs:subClassOf nv:Car .',
  'nv:Cab dcterms:isPartOf nv:Car .',
  'nv:Bogie rdfs:subClassOf nv:Component .',
  'nv:Bogie rdfs:subClassOf nv:Asset .',
  'nv:Component rdfs:subClassOf nv:Asset .',
  'nv:Electric owl:disjointWith nv:Diesel .',
  'nv:BiMode rdfs:subClassOf nv:Electric , nv:Diesel .',
  'nv:unit-7 a nv:BiMode .',
];

/** Lints the statements split over files with the given names; returns the fingerprints by rule. */
async function fingerprints(parts: string[][], names: string[]): Promise<string[]> {
  const dir = mkdtempSync(path.join(tmpdir(), 'isapart-fingerprints-'));
  parts.forEach((statements, index) => writeFileSync(path.join(dir, names[index]), [...PREFIXES, ...statements, ''].join('\n')));
  const result = await check({ paths: [dir], cwd: dir });
  expect(result.context.inputErrors).toEqual([]);
  return result.findings.map((finding) => `${finding.ruleId} ${finding.fingerprint}`).sort();
}

describe('fingerprints', () => {
  it('are the same however the statements are ordered, split over files, and the files named', async () => {
    const reference = await fingerprints([STATEMENTS], ['hierarchy.ttl']);
    expect(new Set(reference.map((line) => line.split(' ')[0]))).toEqual(
      new Set(['subclass-cycle', 'kind-and-part', 'redundant-subclass', 'disjoint-overlap', 'orphan-class']),
    );
    await fc.assert(
      fc.asyncProperty(fc.shuffledSubarray(STATEMENTS, { minLength: STATEMENTS.length }), fc.integer({ min: 1, max: STATEMENTS.length - 1 }), async (order, cut) => {
        const moved = await fingerprints([order.slice(0, cut), order.slice(cut)], ['renamed-one.ttl', 'another-name.ttl']);
        expect(moved).toEqual(reference);
      }),
      { numRuns: 25 },
    );
  });
});
