// Fingerprints of symmetric findings (cycles, disjoint pairs) are canonical, and prefixes never matter.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { check } from '../../src/check.js';
import { fingerprintOf } from '../../src/engine/fingerprint.js';

const NV = 'https://data.northvale-rail.example/def/';
const HEAD = [
  '@prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .',
  '@prefix owl: <http://www.w3.org/2002/07/owl#> .',
  '@prefix dcterms: <http://purl.org/dc/terms/> .',
  `@prefix nv: <${NV}> .`,
];

/** Lints files (name → lines after the prefixes) with extra check options; returns the findings. */
async function lint(files: Record<string, string[]>, options: { scope?: string[]; head?: string[] } = {}) {
  const dir = mkdtempSync(path.join(tmpdir(), 'isapart-canonical-'));
  for (const [name, lines] of Object.entries(files)) writeFileSync(path.join(dir, name), [...(options.head ?? HEAD), ...lines, ''].join('\n'));
  const result = await check({ paths: [dir], cwd: dir, scope: options.scope });
  expect(result.context.inputErrors).toEqual([]);
  return result.findings;
}

/** The `ruleId fingerprint` lines of a lint, sorted. */
async function fingerprints(files: Record<string, string[]>, options: { scope?: string[]; head?: string[] } = {}): Promise<string[]> {
  return (await lint(files, options)).map((finding) => `${finding.ruleId} ${finding.fingerprint}`).sort();
}

// A part-of component with two loops through Axle (Axle–Bogie and Axle–Hub): which loop the
// shortest closed walk takes depends on the order of the statements, so the walk order cannot be the identity.
const TWO_LOOPS = ['nv:Axle dcterms:isPartOf nv:Bogie .', 'nv:Bogie dcterms:isPartOf nv:Axle .', 'nv:Axle dcterms:isPartOf nv:Hub .', 'nv:Hub dcterms:isPartOf nv:Axle .'];
// A three-class subclass cycle and a disjointness stated in one direction or the other.
const RING = ['nv:Coach rdfs:subClassOf nv:Car .', 'nv:Car rdfs:subClassOf nv:Vehicle .', 'nv:Vehicle rdfs:subClassOf nv:Coach .'];

describe('cycle fingerprints', () => {
  it('are the rule id and the members sorted by term, whatever the walk', async () => {
    const [line] = await fingerprints({ 'parts.ttl': TWO_LOOPS });
    // sha-256 recomputed here from the documented input: the rule id, then the nodes sorted by term.
    expect(line).toBe(`part-cycle ${fingerprintOf('part-cycle', [`${NV}Axle`, `${NV}Bogie`, `${NV}Hub`])}`);
  });

  it('do not change with statement order, and neither does the walk the message follows', async () => {
    const reference = await fingerprints({ 'parts.ttl': TWO_LOOPS });
    const walks = new Set<string>();
    await fc.assert(
      fc.asyncProperty(fc.shuffledSubarray(TWO_LOOPS, { minLength: TWO_LOOPS.length }), async (order) => {
        const findings = await lint({ 'parts.ttl': order });
        for (const finding of findings) walks.add(finding.message);
        expect(findings.map((finding) => `${finding.ruleId} ${finding.fingerprint}`).sort()).toEqual(reference);
      }),
      { numRuns: 12, examples: [[TWO_LOOPS], [[...TWO_LOOPS.slice(2), ...TWO_LOOPS.slice(0, 2)]]] },
    );
    // The walk takes successors in term order (src/engine/cycle.ts), so every order gives one message,
    // as an endpoint, which knows no statement order, must give it too.
    expect(walks.size).toBe(1);
  });

  it('do not change with the member that is the focus (the first in scope)', async () => {
    const all = await fingerprints({ 'ring.ttl': RING });
    // With only Vehicle in scope the walk starts at Vehicle instead of Car.
    const narrowed = await fingerprints({ 'ring.ttl': RING }, { scope: [`${NV}Vehicle`] });
    expect(narrowed).toEqual(all.filter((line) => line.startsWith('subclass-cycle ')));
  });
});

describe('fingerprints and the way terms are written', () => {
  const statements = [...RING, 'nv:Cab rdfs:subClassOf nv:Car .', 'nv:Cab dcterms:isPartOf nv:Car .', 'nv:Electric owl:disjointWith nv:Diesel .', 'nv:BiMode rdfs:subClassOf nv:Electric , nv:Diesel .'];

  it('do not change when prefixes are renamed, dropped for full IRIs, or replaced by a base', async () => {
    const reference = await fingerprints({ 'a.ttl': statements });
    expect(reference.length).toBeGreaterThanOrEqual(3);
    const renamed = statements.map((line) => line.replaceAll('nv:', 'rail:'));
    const renamedHead = [...HEAD.slice(0, 3), `PREFIX rail: <${NV}>`];
    expect(await fingerprints({ 'a.ttl': renamed }, { head: renamedHead })).toEqual(reference);
    const based = statements.map((line) => line.replace(/nv:([A-Za-z]+)/g, '<$1>'));
    expect(await fingerprints({ 'a.ttl': based }, { head: [...HEAD.slice(0, 3), `@base <${NV}> .`] })).toEqual(reference);
  });

  it('do not change when a disjointness is stated the other way round', async () => {
    const reference = await fingerprints({ 'a.ttl': statements });
    const turned = statements.map((line) => line.replace('nv:Electric owl:disjointWith nv:Diesel', 'nv:Diesel owl:disjointWith nv:Electric'));
    expect(await fingerprints({ 'a.ttl': turned })).toEqual(reference);
  });

  it('change when a node IRI changes', async () => {
    const reference = await lint({ 'a.ttl': statements });
    const changed = await lint({ 'a.ttl': statements.map((line) => line.replaceAll('nv:Car', 'nv:RailCar')) });
    expect(changed.map((finding) => finding.ruleId).sort()).toEqual(reference.map((finding) => finding.ruleId).sort());
    const before = new Set(reference.map((finding) => finding.fingerprint));
    for (const finding of changed) {
      // A finding about Car (now RailCar) has a new fingerprint; the others keep theirs.
      expect(before.has(finding.fingerprint)).toBe(!finding.nodes.includes(`${NV}RailCar`));
    }
    expect(changed.filter((finding) => finding.nodes.includes(`${NV}RailCar`)).length).toBeGreaterThanOrEqual(2);
  });
});
