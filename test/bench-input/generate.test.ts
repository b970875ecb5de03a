// The benchmark generator: deterministic, and its files parse to what it says it wrote.
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { Graph, alg } from '@dagrejs/graphlib';
import { Parser } from 'n3';
import { describe, expect, it } from 'vitest';
import { check } from '../../src/check.js';
import { emptyCounts, hierarchyChunks, writeHierarchy } from '../bench/generate.js';

const SUBCLASS_OF = 'http://www.w3.org/2000/01/rdf-schema#subClassOf';

describe('benchmark generator', () => {
  it('gives the same text for the same spec and another for another seed', () => {
    const text = (seed: number) => [...hierarchyChunks({ classes: 2_000, seed }, 'n-triples', emptyCounts())].join('');
    expect(text(7)).toBe(text(7));
    expect(text(7)).not.toBe(text(8));
  });

  it.each(['n-triples', 'turtle'] as const)('writes %s that n3 parses to the counted statements', async (syntax) => {
    const dir = mkdtempSync(path.join(tmpdir(), 'isapart-generate-'));
    const file = path.join(dir, syntax === 'turtle' ? 'h.ttl' : 'h.nt');
    const counts = await writeHierarchy(file, { classes: 3_000, seed: 3 }, syntax);
    // n3's own parser is the reference for what the file holds.
    const quads = new Parser({ format: syntax === 'turtle' ? 'Turtle' : 'N-Triples' }).parse(readFileSync(file, 'utf8'));
    expect(quads.length).toBe(counts.statements);
    expect(quads.filter((quad) => quad.predicate.value === SUBCLASS_OF).length).toBe(counts.subclassStatements);
    expect(counts.bytes).toBe(readFileSync(file).length);
  });

  it('plants exactly the cycles it counts: graphlib finds them, and check reports one subclass-cycle each', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'isapart-generate-'));
    const file = path.join(dir, 'h.nt');
    const counts = await writeHierarchy(file, { classes: 5_000, seed: 11, plantedCycles: 4 }, 'n-triples');
    expect(counts.plantedCycles).toBe(4);
    const graph = new Graph({ directed: true });
    for (const quad of new Parser({ format: 'N-Triples' }).parse(readFileSync(file, 'utf8'))) {
      if (quad.predicate.value === SUBCLASS_OF) graph.setEdge(quad.subject.value, quad.object.value);
    }
    // graphlib's alg.findCycles is the reference for the cycles in the subclass graph.
    expect(alg.findCycles(graph).length).toBe(4);
    const result = await check({ paths: [file], cwd: dir });
    expect(result.findings.filter((finding) => finding.ruleId === 'subclass-cycle').length).toBe(4);
  });
});
