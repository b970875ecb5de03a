// Benchmark, not a test: a generated hierarchy linted three ways — from the file, extracted from Virtuoso, pushed down to it.
// Run: node --import tsx test/bench/endpoint.ts [CLASSES]   (default 200000; needs Debian's virtuoso-opensource)
import { mkdtempSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { check, type CheckResult } from '../../src/check.js';
import { startVirtuoso } from '../system/virtuoso.js';
import { writeHierarchy } from './generate.js';

const GRAPH = 'https://data.northvale-rail.example/graph/bench';

/** Runs a check and says how long it took, in seconds. */
async function timed(what: string, run: () => Promise<CheckResult>): Promise<{ seconds: number; result: CheckResult }> {
  const start = process.hrtime.bigint();
  const result = await run();
  const seconds = Number(process.hrtime.bigint() - start) / 1e9;
  const failures = result.context.ruleFailures.map((failure) => failure.ruleId);
  console.log(
    `${what.padEnd(34)} ${seconds.toFixed(1).padStart(7)} s  ${String(result.findings.length).padStart(7)} findings  ${result.context.inputErrors.length} input errors` +
      (failures.length > 0 ? `  rule failures: ${failures.join(', ')}` : ''),
  );
  return { seconds, result };
}

function countsByRule(result: CheckResult): string {
  const counts = new Map<string, number>();
  for (const finding of result.findings) counts.set(finding.ruleId, (counts.get(finding.ruleId) ?? 0) + 1);
  return [...counts].sort().map(([rule, count]) => `${rule} ${count}`).join(', ');
}

const classes = Number(process.argv[2] ?? 200_000);
const work = mkdtempSync(path.join(tmpdir(), 'isapart-bench-endpoint-'));
const virtuoso = await startVirtuoso({ maxSortedTopRows: 10_000_000, buffers: 680_000 });
try {
  const file = path.join(virtuoso.folder, 'bench.nt');
  const counts = await writeHierarchy(file, { classes, seed: 1 }, 'n-triples');
  console.log(`generated: ${counts.classes} classes, ${counts.statements} statements, ${(statSync(file).size / 1e6).toFixed(0)} MB N-Triples`);
  const loadStart = process.hrtime.bigint();
  virtuoso.bulkLoad(file, GRAPH);
  console.log(`Virtuoso bulk load (not part of any of the three ways): ${(Number(process.hrtime.bigint() - loadStart) / 1e9).toFixed(1)} s`);
  const config = path.join(work, 'isapart.yaml');
  writeFileSync(config, 'endpoint: { post: form, page-size: 10000, timeout: 3600, retries: 0 }\n');
  const options = { paths: [], cwd: work, configFile: config };
  const fromFile = await timed('load the file and lint it', () => check({ ...options, paths: [file] }));
  const extracted = await timed('--endpoint: extraction + local lint', () => check({ ...options, endpoint: virtuoso.sparqlUrl, graph: GRAPH }));
  const pushed = await timed('--endpoint --push-down', () => check({ ...options, endpoint: virtuoso.sparqlUrl, graph: GRAPH, pushDown: true }));
  console.log(`ratios to the file run (same machine, same run): extraction ${(extracted.seconds / fromFile.seconds).toFixed(2)}, push-down ${(pushed.seconds / fromFile.seconds).toFixed(2)}`);
  console.log(`findings from the file:    ${countsByRule(fromFile.result)}`);
  console.log(`findings from extraction:  ${countsByRule(extracted.result)}`);
  console.log(`findings from push-down:   ${countsByRule(pushed.result)}`);
} finally {
  await virtuoso.stop();
  rmSync(work, { recursive: true, force: true });
}
