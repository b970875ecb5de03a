// The scale benchmark's SPARQL queries ask what four rules flag: oxigraph's answers equal check's findings.
import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import oxigraph from 'oxigraph';
import { describe, expect, it } from 'vitest';
import { parse as parseYaml } from 'yaml';
import { check } from '../../src/check.js';
import { BENCH_NAMESPACE, classIri, writeHierarchy } from '../bench/generate.js';
import { ruleQueries, type BenchScope, type RuleQuery } from '../bench/sparql-rules.js';

const NORTHVALE = 'https://data.northvale-rail.example/';
const RULE_IDS = ruleQueries({ prefixes: [NORTHVALE], roots: [] }).map((query) => query.ruleId);
const folder = mkdtempSync(path.join(tmpdir(), 'isapart-sparql-rules-'));

/** One input to compare on: a file, its syntax for oxigraph, and the scope it is linted under. */
interface Case {
  name: string;
  file: string;
  mediaType: string;
  scope: BenchScope;
}

/** A finding's or a row's identity: its nodes joined, in the rule's order. */
function key(values: string[]): string {
  return values.join(' ');
}

/** What check flags for a rule, as the set the query's rows are compared with. */
async function flagged(input: Case, ruleId: RuleQuery['ruleId']): Promise<Set<string>> {
  const { findings } = await check({ paths: [input.file], scope: input.scope.prefixes, roots: input.scope.roots, cwd: folder });
  const own = findings.filter((finding) => finding.ruleId === ruleId);
  // A cycle is one finding per component; the query lists members, so members are compared.
  if (ruleId === 'subclass-cycle') return new Set(own.flatMap((finding) => finding.nodes));
  return new Set(own.map((finding) => key(finding.nodes)));
}

/** What the query answers, oxigraph 0.5.11 (npm) being the SPARQL 1.1 engine of reference. */
function answered(input: Case, query: RuleQuery): Set<string> {
  const store = new oxigraph.Store();
  store.load(readFileSync(input.file, 'utf8'), { format: input.mediaType, base_iri: `file://${input.file}` });
  const rows = store.query(query.sparql) as Map<string, { value: string }>[];
  return new Set(rows.map((row) => key([...row.values()].map((term) => term.value))));
}

/** The rule's own examples (flagged and clean) and its per-rule fixture cases, as Turtle files. */
function ruleCases(ruleId: string): Case[] {
  const cases: Case[] = [];
  const rule = parseYaml(readFileSync(path.join('rules', `${ruleId}.yaml`), 'utf8')) as { examples: Record<string, string> };
  for (const [kind, text] of Object.entries(rule.examples)) {
    const file = path.join(folder, `${ruleId}-example-${kind}.ttl`);
    writeFileSync(file, text);
    cases.push({ name: `example ${kind}`, file, mediaType: 'text/turtle', scope: { prefixes: [NORTHVALE], roots: [] } });
  }
  const caseFolder = path.join('fixtures', 'rules', ruleId);
  for (const name of readdirSync(caseFolder).filter((entry) => entry.endsWith('.ttl'))) {
    const text = readFileSync(path.join(caseFolder, name), 'utf8');
    const header = (field: string): string[] => [...text.matchAll(new RegExp(`^# ${field}: (\\S+)`, 'gm'))].map((match) => match[1]);
    // A case without a scope line has every IRI in scope; all case IRIs are under the Northvale namespace.
    const prefixes = header('scope');
    const file = path.join(folder, `${ruleId}-${name}`);
    writeFileSync(file, text);
    cases.push({ name, file, mediaType: 'text/turtle', scope: { prefixes: prefixes.length > 0 ? prefixes : [NORTHVALE], roots: header('roots') } });
  }
  return cases;
}

describe('SPARQL queries of the scale benchmark', () => {
  it('hold every IRI of the fixture cases under the Northvale namespace, so the default scope stands in for "no scope"', () => {
    for (const ruleId of RULE_IDS) {
      for (const input of ruleCases(ruleId)) {
        const iris = [...readFileSync(input.file, 'utf8').matchAll(/@prefix \w*: <([^>]+)>/g)].map((match) => match[1]);
        const own = iris.filter((iri) => !/w3\.org|purl\.org|schema\.org|obolibrary/.test(iri));
        expect(own.every((iri) => iri.startsWith(NORTHVALE)), `${ruleId} ${input.name}`).toBe(true);
      }
    }
  });

  for (const ruleId of RULE_IDS) {
    it(`find what ${ruleId} flags in its examples and fixture cases`, async () => {
      const cases = ruleCases(ruleId);
      let nonEmpty = 0;
      for (const input of cases) {
        const query = ruleQueries(input.scope).find((entry) => entry.ruleId === ruleId)!;
        const expected = await flagged(input, ruleId);
        if (expected.size > 0) nonEmpty += 1;
        expect([...answered(input, query)].sort(), `${ruleId} ${input.name}`).toEqual([...expected].sort());
      }
      // The comparison means something only if some case is flagged.
      expect(nonEmpty).toBeGreaterThan(0);
    });
  }

  it('find what the four rules flag in a generated 3,000-class N-Triples file with 12 planted cycles', async () => {
    const file = path.join(folder, 'generated.nt');
    await writeHierarchy(file, { classes: 3_000, seed: 5, plantedCycles: 12 }, 'n-triples');
    const input: Case = { name: 'generated', file, mediaType: 'application/n-triples', scope: { prefixes: [BENCH_NAMESPACE], roots: [classIri(0)] } };
    for (const query of ruleQueries(input.scope)) {
      const expected = await flagged(input, query.ruleId);
      expect([...answered(input, query)].sort(), query.ruleId).toEqual([...expected].sort());
    }
    expect((await flagged(input, 'subclass-cycle')).size).toBeGreaterThanOrEqual(12);
  });
});
