// Benchmark of the stages of a check (parse, graph, rules) on WordNet's nouns, each next to n3's bare parse.
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { cpus, totalmem } from 'node:os';
import { Parser } from 'n3';
import { loadConfig } from '../../src/config/load-config.js';
import { loadBuiltinRules } from '../../src/engine/rule-file.js';
import { runRules, type RuleToRun } from '../../src/engine/run.js';
import { buildHierarchyGraph } from '../../src/graph/build.js';
import type { HierarchyGraph } from '../../src/graph/hierarchy-graph.js';
import { parseSource } from '../../src/load/parse.js';
import type { LoadedSource } from '../../src/load/statement.js';
import { ROLES } from '../../src/roles/role.js';
import { buildRoleMap } from '../../src/roles/role-map.js';
import { writeWordnetInput } from './wordnet-input.js';
import { median, timed } from './timing.js';

const RUNS = Number(process.env.BENCH_RUNS ?? 9);


/** A digest of everything the stages produce, so two checkouts can be compared for identical results. */
function digestOf(source: LoadedSource, graph: HierarchyGraph, findings: unknown): string {
  const hash = createHash('sha256');
  hash.update(JSON.stringify(source));
  hash.update(JSON.stringify({ stats: graph.stats, problems: graph.problems }));
  for (let id = 0; id < graph.nodeCount; id++) {
    const kinds = ['class', 'individual', 'declared-class', 'deprecated', 'root', 'in-scope'] as const;
    const parts: unknown[] = [graph.term(id), graph.label(id), graph.displayName(id), graph.firstStatement(id)];
    parts.push(kinds.map((kind) => graph.is(kind, id)));
    for (const role of ROLES) {
      const successors = [...graph.successors(role, id)];
      parts.push(successors, [...graph.predecessors(role, id)]);
      parts.push(successors.map((to) => graph.edgeStatements(role, id, to)));
    }
    hash.update(JSON.stringify(parts));
  }
  hash.update(JSON.stringify(findings));
  return hash.digest('hex').slice(0, 16);
}

const { file, configFile, counts } = writeWordnetInput();

const { config, errors: configErrors } = loadConfig(configFile);
if (configErrors.length > 0) throw new Error(`config errors: ${JSON.stringify(configErrors)}`);
const roleMap = buildRoleMap(config.presets, config.roles);
const scope = { prefixes: config.scope, roots: config.roots };
const rules: RuleToRun[] = loadBuiltinRules().rules.map((rule) => ({ rule, level: rule.level }));
const text = readFileSync(file, 'utf8');

const times = { bare: [] as number[], parse: [] as number[], graph: [] as number[], rules: [] as number[] };
let digest = '';
for (let run = 0; run < RUNS; run += 1) {
  times.bare.push(timed(() => new Parser({ format: 'N-Triples' }).parse(text).length).ms);
  // A fixed file name and base IRI, so the digest does not depend on the temporary folder or the checkout.
  const parsed = timed(() => parseSource(text, 'wordnet-nouns.nt', 'n-triples', { baseIri: 'file:///bench/wordnet-nouns.nt' }));
  times.parse.push(parsed.ms);
  const built = timed(() => buildHierarchyGraph([parsed.value], roleMap, scope));
  times.graph.push(built.ms);
  const ran = timed(() => runRules(built.value, rules));
  times.rules.push(ran.ms);
  if (run === 0) digest = digestOf(parsed.value, built.value, ran.value);
}

const bare = median(times.bare);
const row = (name: string, values: number[]): string => `| ${name} | ${median(values).toFixed(0)} | ${(median(values) / bare).toFixed(2)} |`;
console.log(`machine: ${cpus().length} × ${cpus()[0]?.model ?? 'unknown CPU'}, ${(totalmem() / 2 ** 30).toFixed(0)} GiB, Node ${process.version}`);
console.log(`input: WordNet nouns as N-Triples, ${counts.triples} triples, text in memory; runs: ${RUNS}, medians`);
console.log(`result digest (statements, graph, findings): ${digest}`);
console.log('| stage | median ms | ratio to n3 bare parse |');
console.log('| --- | ---: | ---: |');
console.log(row('n3 bare parse (in memory, keep nothing)', times.bare));
console.log(row('parseSource (statements with positions)', times.parse));
console.log(row('buildHierarchyGraph', times.graph));
console.log(row(`runRules (${rules.length} rules)`, times.rules));
