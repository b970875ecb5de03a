// Two builds of isapart side by side on the scale inputs: wall time, CPU time and peak RSS of check, run by run alternately.
import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { cpus, loadavg, totalmem } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { Command, InvalidArgumentError } from 'commander';
import { BENCH_NAMESPACE, classIri } from './generate.js';
import { runNodeChild } from './scale-child.js';
import { cacheFolder, generatedInput } from './scale-inputs.js';

const ROOT = path.resolve(fileURLToPath(new URL('../..', import.meta.url)));
const BOUNDS = { timeoutMs: 15 * 60_000, maxRssBytes: 10 * 2 ** 30 };
const CLASSES: Record<string, number> = { '20k': 20_000, '200k': 200_000, '2m': 2_000_000 };
/** Runs per build when --runs is not given: the 2M file takes most of a minute and 1.6 GiB a run. */
const DEFAULT_RUNS: Record<string, number> = { '20k': 5, '200k': 5, '2m': 2 };

/** One check run of one build. */
interface Run {
  wallMs: number;
  cpuMs: number;
  rssBytes: number;
  /** Digest of the whole JSON report with its times and output name taken out. */
  digest: string;
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = sorted.length >> 1;
  return sorted.length % 2 === 1 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}

/** The report without what differs from run to run (times, and the tool's start and end). */
function reportDigest(file: string): string {
  const report = JSON.parse(readFileSync(file, 'utf8')) as Record<string, unknown>;
  const stable = JSON.stringify(report, (key, value: unknown) => (/time|duration/i.test(key) ? undefined : value));
  return createHash('sha256').update(stable).digest('hex').slice(0, 16);
}

async function checkOnce(bin: string, file: string, work: { folder: string; config: string }): Promise<Run> {
  const output = path.join(work.folder, 'report.json');
  rmSync(output, { force: true });
  const args = [bin, 'check', file, '-c', work.config, '--format', 'json', '-o', output, '--fail-on', 'never', '--no-progress'];
  const result = await runNodeChild(args, ROOT, BOUNDS);
  if (result.exitCode !== 0 || result.maxRssBytes === null || result.cpuMs === null) {
    throw new Error(`${bin} exited ${result.exitCode}${result.stopped ? ` (${result.stopped})` : ''}: ${result.stderr.slice(0, 500)}`);
  }
  return { wallMs: result.wallMs, cpuMs: result.cpuMs, rssBytes: result.maxRssBytes, digest: reportDigest(output) };
}

function positiveInteger(value: string): number {
  const number = Number(value);
  if (!Number.isInteger(number) || number < 1) throw new InvalidArgumentError('a whole number of 1 or more');
  return number;
}

const program = new Command('compare-builds')
  .description('Times `isapart check` of two builds on the generated scale inputs, alternating run by run (needs both built).')
  .requiredOption('--before <file>', 'the bin/isapart.js of the earlier build')
  .option('--after <file>', 'the bin/isapart.js of the later build', path.join(ROOT, 'bin', 'isapart.js'))
  .option('--sizes <keys>', `comma-separated, from ${Object.keys(CLASSES).join(',')}`, '200k,2m')
  .option('--runs <n>', 'runs per build and size (default 5, and 2 at 2M)', positiveInteger)
  .addHelpText('after', '\nInputs come from the scale benchmark\'s cache (test/bench/scale-inputs.ts) and are kept there.\nPrints a markdown table per size; the report digests must be equal, or the builds differ in what they report.');
program.parse();
const options = program.opts<{ before: string; after: string; sizes: string; runs?: number }>();
const builds = { before: path.resolve(options.before), after: path.resolve(options.after) };
const log = (line: string): void => void process.stderr.write(`${line}\n`);
const folder = mkdtempSync(path.join(cacheFolder(), 'compare-'));
const config = path.join(folder, 'isapart.yaml');
writeFileSync(config, `scope: [${BENCH_NAMESPACE}]\nroots: [${classIri(0)}]\n`);

const cpu = cpus();
console.log(`machine: ${cpu.length} × ${cpu[0]?.model ?? 'unknown CPU'}, ${(totalmem() / 2 ** 30).toFixed(0)} GiB, Node ${process.version}`);
console.log(`before: ${builds.before}\nafter: ${builds.after}`);
for (const key of options.sizes.split(',').map((size) => size.trim())) {
  const classes = CLASSES[key];
  if (classes === undefined) program.error(`unknown size ${key}; known: ${Object.keys(CLASSES).join(', ')}`);
  const input = await generatedInput(classes, 'n-triples', log);
  const runCount = options.runs ?? DEFAULT_RUNS[key];
  const runs: Record<keyof typeof builds, Run[]> = { before: [], after: [] };
  const loads: number[] = [loadavg()[0]];
  for (let run = 0; run < runCount; run++) {
    // Alternating, and starting with the other build every run, so neither always goes first.
    const order: (keyof typeof builds)[] = run % 2 === 0 ? ['before', 'after'] : ['after', 'before'];
    for (const build of order) {
      const result = await checkOnce(builds[build], input.file, { folder, config });
      runs[build].push(result);
      loads.push(loadavg()[0]);
      log(`${key} run ${run + 1} ${build}: ${result.wallMs.toFixed(0)} ms wall, ${result.cpuMs.toFixed(0)} ms CPU, ${(result.rssBytes / 2 ** 20).toFixed(0)} MiB peak RSS`);
    }
  }
  const row = (build: keyof typeof builds) => {
    const samples = runs[build];
    return {
      wall: median(samples.map((sample) => sample.wallMs)),
      cpu: median(samples.map((sample) => sample.cpuMs)),
      rss: Math.max(...samples.map((sample) => sample.rssBytes)),
    };
  };
  const before = row('before');
  const after = row('after');
  console.log(`\n#### ${key}: ${classes.toLocaleString('en')} classes, ${input.counts.statements.toLocaleString('en')} statements, ${(input.counts.bytes / 2 ** 20).toFixed(0)} MiB`);
  console.log(`${runCount} runs per build, alternating; load average ${Math.min(...loads).toFixed(1)}–${Math.max(...loads).toFixed(1)} (${cpu.length} cores)`);
  console.log('| build | median wall ms | median CPU ms | peak RSS (largest run) | ratio wall after/before | ratio CPU | ratio RSS |');
  console.log('| --- | ---: | ---: | ---: | ---: | ---: | ---: |');
  const rss = (bytes: number) => `${(bytes / 2 ** 20).toFixed(0)} MiB = ${(bytes / 1e9).toFixed(3)} GB`;
  console.log(`| before | ${before.wall.toFixed(0)} | ${before.cpu.toFixed(0)} | ${rss(before.rss)} | 1.00 | 1.00 | 1.00 |`);
  console.log(`| after | ${after.wall.toFixed(0)} | ${after.cpu.toFixed(0)} | ${rss(after.rss)} | ${(after.wall / before.wall).toFixed(2)} | ${(after.cpu / before.cpu).toFixed(2)} | ${(after.rss / before.rss).toFixed(2)} |`);
  const digests = new Set([...runs.before, ...runs.after].map((sample) => sample.digest));
  console.log(`report digest (JSON report without times): ${[...digests].join(', ')}${digests.size === 1 ? ', the same for both builds in every run' : ' — the reports differ'}`);
}
rmSync(folder, { recursive: true, force: true });
