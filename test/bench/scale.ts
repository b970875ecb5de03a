// Benchmark at dump scale: `isapart check` on generated hierarchies next to a newline scan, n3's bare parse
// and an oxigraph store with SPARQL queries for four rules, alternating in one run; prints tables and targets.
import { createHash } from 'node:crypto';
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { cpus, loadavg, totalmem } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { Command, InvalidArgumentError } from 'commander';
import { hotSpots } from './cpu-profile.js';
import { runNodeChild, type ChildBounds, type ChildResult } from './scale-child.js';
import { cacheFolder, generatedInput, removeInput, type GeneratedInput } from './scale-inputs.js';
import { ruleQueries, type BenchScope } from './sparql-rules.js';
import { BENCH_NAMESPACE, classIri, type GeneratedSyntax } from './generate.js';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const MEASURES_SCRIPT = path.join(ROOT, 'test', 'bench', 'scale-measures.ts');
const GIB = 2 ** 30;

/** The scope and root every run uses: the generator's namespace, and its class 0. */
const SCOPE: BenchScope = { prefixes: [BENCH_NAMESPACE], roots: [classIri(0)] };

type Measure = 'newline-scan' | 'n3-parse' | 'check' | 'check-other' | 'oxigraph';
const MEASURE_NAMES: Record<Measure, string> = {
  'newline-scan': 'raw newline scan (fs chunks, count 0x0A)',
  'n3-parse': "n3's bare streaming parse (StreamParser, keep nothing)",
  check: 'isapart check (child process, JSON to a file)',
  'check-other': 'isapart check of the --also-isapart build (same flags)',
  oxigraph: 'oxigraph 0.5.11: load into Store + 4 SPARQL queries',
};

/** One input size of the benchmark. */
interface SizeSpec {
  key: string;
  classes: number;
  syntax: GeneratedSyntax;
  runs: number;
  /** Runs of the oxigraph measure (0: not measured on this input). */
  oxigraphRuns: number;
}
const SIZES: SizeSpec[] = [
  // A quick size for trying the runner; not in the default list.
  { key: '20k', classes: 20_000, syntax: 'n-triples', runs: 3, oxigraphRuns: 3 },
  { key: '200k', classes: 200_000, syntax: 'n-triples', runs: 5, oxigraphRuns: 5 },
  { key: 'turtle-200k', classes: 200_000, syntax: 'turtle', runs: 5, oxigraphRuns: 0 },
  { key: '2m', classes: 2_000_000, syntax: 'n-triples', runs: 3, oxigraphRuns: 1 },
];

/** One measured run of one measure. */
interface Sample {
  /** The time the ratios use: the reference's own work time, or check's whole wall time. */
  ms: number;
  /** CPU time: the reference's own work, or the whole check process. */
  cpuMs: number | null;
  rssBytes: number | null;
  values: Record<string, number>;
  /** check only: digest of the findings (rule, nodes, evidence lines), to compare runs and builds. */
  digest?: string;
}

/** All runs of all measures on one input. */
interface InputResult {
  size: SizeSpec;
  input: GeneratedInput;
  samples: Map<Measure, Sample[]>;
  failures: Map<Measure, string>;
  checkFindings?: Record<string, number>;
  startupMs: number[];
  /** One-minute load averages when the input's runs started and ended: other work on the machine. */
  load: [number, number];
}

const DEFAULT_SIZES = '200k,turtle-200k,2m';
const BOUNDS: ChildBounds = { timeoutMs: 15 * 60_000, maxRssBytes: 10 * GIB };

/** Median of a non-empty list of numbers. */
function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}

/** Why a child run does not count, or undefined when it does. */
function failureOf(result: ChildResult): string | undefined {
  if (result.stopped) return result.stopped;
  if (result.exitCode !== 0) {
    const lines = result.stderr.split('\n').filter((line) => line.trim() !== '');
    return `exit ${result.exitCode}: ${lines.length > 0 ? lines.slice(-3).join(' / ').slice(0, 300) : 'nothing on stderr'}`;
  }
  return undefined;
}

/** One finding as the JSON report gives it, the parts the benchmark reads. */
interface ReportedFinding {
  ruleId: string;
  nodes: string[];
  evidence: { line: number }[];
}

/** Per-rule finding counts from a JSON report, plus the members of all subclass cycles, and a digest of the findings. */
function findingCounts(reportFile: string): { counts: Record<string, number>; digest: string } {
  const report = JSON.parse(readFileSync(reportFile, 'utf8')) as { summary: { statements: number; inputErrors: number }; findings: ReportedFinding[] };
  const digest = createHash('sha256')
    .update(JSON.stringify(report.findings.map((finding) => [finding.ruleId, finding.nodes, finding.evidence.map((statement) => statement.line)])))
    .digest('hex')
    .slice(0, 16);
  const counts: Record<string, number> = { statements: report.summary.statements, inputErrors: report.summary.inputErrors };
  for (const finding of report.findings) {
    counts[finding.ruleId] = (counts[finding.ruleId] ?? 0) + 1;
    if (finding.ruleId === 'subclass-cycle') counts['subclass-cycle.members'] = (counts['subclass-cycle.members'] ?? 0) + finding.nodes.length;
  }
  return { counts, digest };
}

/** The standard error of the last child, for the log when it failed. */
let lastStderr = '';

/** Runs one measure once on one input. */
async function measureOnce(measure: Measure, input: GeneratedInput, work: { folder: string; config: string; checkFlags: string[]; profileDir?: string }): Promise<Sample | string> {
  if (measure === 'check' || measure === 'check-other') {
    const output = path.join(work.folder, 'findings.json');
    const nodeOptions = work.profileDir ? ['--cpu-prof', '--cpu-prof-dir', work.profileDir] : [];
    const args = [measure === 'check' ? BIN : (OTHER_BIN as string), 'check', input.file, '-c', work.config, '--format', 'json', '-o', output, '--fail-on', 'never', ...work.checkFlags];
    const result = await runNodeChild(args, ROOT, BOUNDS, nodeOptions);
    lastStderr = result.stderr;
    const failure = failureOf(result);
    if (failure) return failure;
    const { counts, digest } = findingCounts(output);
    return { ms: result.wallMs, cpuMs: result.cpuMs, rssBytes: result.maxRssBytes, values: counts, digest };
  }
  const args = ['--import', 'tsx', MEASURES_SCRIPT, measure, input.file, input.syntax, JSON.stringify(SCOPE)];
  const result = await runNodeChild(args, ROOT, BOUNDS);
  lastStderr = result.stderr;
  const failure = failureOf(result);
  if (failure) return failure;
  const values = JSON.parse(result.stdout.trim().split('\n').pop() ?? '{}') as Record<string, number>;
  return { ms: values.ms, cpuMs: values.cpuMs ?? null, rssBytes: result.maxRssBytes, values };
}

/** All measures on one input, alternating run by run; a measure that fails once is not run again. */
async function measureInput(size: SizeSpec, input: GeneratedInput, work: { folder: string; config: string; checkFlags: string[] }, log: (line: string) => void): Promise<InputResult> {
  const measures: Measure[] = ['newline-scan', 'n3-parse', 'check', ...(OTHER_BIN === undefined ? [] : ['check-other' as const]), 'oxigraph'];
  const result: InputResult = { size, input, samples: new Map(), failures: new Map(), startupMs: [], load: [loadavg()[0], 0] };
  for (let run = 0; run < size.runs; run += 1) {
    for (const measure of measures) {
      if (result.failures.has(measure) || (measure === 'oxigraph' && run >= size.oxigraphRuns)) continue;
      const sample = await measureOnce(measure, input, work);
      if (typeof sample === 'string') {
        result.failures.set(measure, sample);
        log(`  run ${run + 1}: ${measure} not measured: ${sample}`);
        if (lastStderr.trim() !== '') log(`  its standard error, first 3000 characters:\n${lastStderr.slice(0, 3000)}`);
        continue;
      }
      const list = result.samples.get(measure) ?? [];
      list.push(sample);
      result.samples.set(measure, list);
      if (measure === 'check') result.checkFindings = sample.values;
      log(`  run ${run + 1}: ${measure} ${sample.ms.toFixed(0)} ms, ${sample.rssBytes === null ? '?' : (sample.rssBytes / 2 ** 20).toFixed(0)} MB`);
    }
    const startup = await runNodeChild([BIN, '--version'], ROOT, BOUNDS);
    result.startupMs.push(startup.wallMs);
  }
  result.load[1] = loadavg()[0];
  return result;
}

function medianMs(result: InputResult, measure: Measure): number | undefined {
  const samples = result.samples.get(measure);
  return samples && samples.length > 0 ? median(samples.map((sample) => sample.ms)) : undefined;
}
function medianCpuMs(result: InputResult, measure: Measure): number | undefined {
  const values = (result.samples.get(measure) ?? []).flatMap((sample) => (sample.cpuMs === null ? [] : [sample.cpuMs]));
  return values.length > 0 ? median(values) : undefined;
}
function peakRss(result: InputResult, measure: Measure): number | undefined {
  const values = (result.samples.get(measure) ?? []).map((sample) => sample.rssBytes ?? 0);
  return values.length > 0 ? Math.max(...values) : undefined;
}
function medianValue(result: InputResult, measure: Measure, key: string): number | undefined {
  const values = (result.samples.get(measure) ?? []).map((sample) => sample.values[key]).filter((value) => value !== undefined);
  return values.length > 0 ? median(values) : undefined;
}

/** The markdown table of one input: each measure's median, peak RSS, and ratios to the scan and to check. */
function printInputTable(result: InputResult): void {
  const { size, input } = result;
  const reference: Measure = size.syntax === 'turtle' ? 'n3-parse' : 'newline-scan';
  const referenceMs = medianMs(result, reference);
  const checkMs = medianMs(result, 'check');
  console.log(`\n### ${size.classes.toLocaleString('en')} classes, ${size.syntax}: ${(input.counts.bytes / 2 ** 20).toFixed(0)} MiB, ${input.counts.statements.toLocaleString('en')} statements`);
  console.log(`runs: ${size.runs} alternating (oxigraph: ${size.oxigraphRuns}); medians; peak RSS is the largest of the runs; load average ${result.load[0].toFixed(1)} at the start, ${result.load[1].toFixed(1)} at the end (${cpus().length} cores)`);
  const referenceCpu = medianCpuMs(result, reference);
  console.log(`| measure | runs | median ms | peak RSS MiB | ratio to ${reference} | ratio to check | median CPU ms | CPU ratio to ${reference} |`);
  console.log('| --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: |');
  for (const measure of ['newline-scan', 'n3-parse', 'check', 'check-other', 'oxigraph'] as Measure[]) {
    if (measure === 'oxigraph' && size.oxigraphRuns === 0) continue;
    if (measure === 'check-other' && OTHER_BIN === undefined) continue;
    const ms = medianMs(result, measure);
    if (ms === undefined) {
      console.log(`| ${MEASURE_NAMES[measure]} | 0 | — | — | — (${result.failures.get(measure) ?? 'not run'}) | — | — | — |`);
      continue;
    }
    const rss = peakRss(result, measure);
    const toReference = referenceMs ? (ms / referenceMs).toFixed(2) : '—';
    const toCheck = checkMs ? (ms / checkMs).toFixed(2) : '—';
    const cpu = medianCpuMs(result, measure);
    const cpuRatio = cpu !== undefined && referenceCpu ? (cpu / referenceCpu).toFixed(2) : '—';
    console.log(`| ${MEASURE_NAMES[measure]} | ${result.samples.get(measure)!.length} | ${ms.toFixed(0)} | ${rss ? (rss / 2 ** 20).toFixed(0) : '?'} | ${toReference} | ${toCheck} | ${cpu?.toFixed(0) ?? '—'} | ${cpuRatio} |`);
  }
  const loadMs = medianValue(result, 'oxigraph', 'loadMs');
  if (loadMs !== undefined) {
    const parts = ruleQueries(SCOPE).map((query) => `${query.ruleId} ${medianValue(result, 'oxigraph', `${query.ruleId}.ms`)!.toFixed(0)}`);
    console.log(`oxigraph split (median ms): load ${loadMs.toFixed(0)}; queries: ${parts.join(', ')}`);
  }
  console.log(`check's wall time includes Node's start and module loading: \`isapart --version\` takes ${median(result.startupMs).toFixed(0)} ms (median); the references' times are their work only.`);
  const statements = [`generator ${input.counts.statements}`, `n3 ${medianValue(result, 'n3-parse', 'quads') ?? '—'}`, `check ${result.checkFindings?.statements ?? '—'}`];
  if (size.oxigraphRuns > 0) statements.push(`oxigraph store ${medianValue(result, 'oxigraph', 'quads') ?? '—'}`);
  console.log(`statements read: ${statements.join(', ')}; check input errors: ${result.checkFindings?.inputErrors ?? '—'}`);
  const digests = new Set((result.samples.get('check') ?? []).map((sample) => sample.digest));
  if (digests.size > 0) console.log(`findings digest (rule, nodes, evidence lines): ${[...digests].join(', ')}${digests.size > 1 ? ' — runs differ' : ', the same in every run'}`);
  const otherDigests = new Set((result.samples.get('check-other') ?? []).map((sample) => sample.digest));
  if (otherDigests.size > 0) console.log(`findings digest of the --also-isapart build: ${[...otherDigests].join(', ')}${otherDigests.size === 1 && digests.size === 1 && [...otherDigests][0] === [...digests][0] ? ', the same as check' : ' — differs from check'}`);
  printCountsTable(result);
}

/** Side by side: isapart's findings per rule and the rows of the rule's SPARQL query. */
function printCountsTable(result: InputResult): void {
  const findings = result.checkFindings;
  const hasQueries = result.samples.has('oxigraph');
  if (!findings && !hasQueries) return;
  console.log('| rule | isapart findings | SPARQL rows (what) | same |');
  console.log('| --- | ---: | ---: | --- |');
  for (const query of ruleQueries(SCOPE)) {
    const found = findings?.[query.ruleId] ?? (findings ? 0 : undefined);
    const compared = query.ruleId === 'subclass-cycle' ? (findings ? (findings['subclass-cycle.members'] ?? 0) : undefined) : found;
    const rows = hasQueries ? medianValue(result, 'oxigraph', `${query.ruleId}.rows`) : undefined;
    const shown = query.ruleId === 'subclass-cycle' && found !== undefined ? `${found} (${compared} members)` : `${found ?? '—'}`;
    const same = compared === undefined || rows === undefined ? '—' : compared === rows ? 'yes' : 'no';
    console.log(`| ${query.ruleId} | ${shown} | ${rows ?? '—'} (${query.counts}) | ${same} |`);
  }
  const others = Object.entries(findings ?? {}).filter(([key]) => !key.includes('.') && key !== 'statements' && key !== 'inputErrors' && !ruleQueries(SCOPE).some((query) => query.ruleId === key));
  if (others.length > 0) console.log(`other rules' findings: ${others.map(([key, value]) => `${key} ${value}`).join(', ')}`);
}

/** The issue's targets, each with the measured number (wall time, and CPU time beside it) and met or missed. */
function printTargets(results: InputResult[]): void {
  const bySize = new Map(results.map((result) => [result.size.key, result]));
  const rows: string[] = [];
  type Value = number | undefined;
  const row = (target: string, value: Value, cpuValue: Value, limit: number, atMost: boolean, format: (n: number) => string, why?: string): void => {
    if (value === undefined) {
      rows.push(`| ${target} | — | — | not measured${why ? ` (${why})` : ''} |`);
      return;
    }
    const met = (n: number): string => ((atMost ? n <= limit : n >= limit) ? 'met' : 'missed');
    const cpuText = cpuValue === undefined ? '—' : `${format(cpuValue)} (${met(cpuValue)})`;
    rows.push(`| ${target} | ${format(value)} | ${cpuText} | ${met(value)} |`);
  };
  const ratio = (n: number): string => `${n.toFixed(2)} ×`;
  const nt = bySize.get('200k');
  const big = bySize.get('2m');
  const turtle = bySize.get('turtle-200k');
  const quotient = (a: Value, b: Value): Value => (a !== undefined && b !== undefined ? a / b : undefined);
  const wall = (result: InputResult | undefined, measure: Measure): Value => (result ? medianMs(result, measure) : undefined);
  const cpu = (result: InputResult | undefined, measure: Measure): Value => (result ? medianCpuMs(result, measure) : undefined);
  const both = (a: [InputResult | undefined, Measure], b: [InputResult | undefined, Measure]): [Value, Value] => [quotient(wall(...a), wall(...b)), quotient(cpu(...a), cpu(...b))];
  const reason = (result: InputResult | undefined, measure: Measure): string | undefined => (result ? result.failures.get(measure) : 'size not run');
  row('check(200k NT) / newline scan ≤ 3', ...both([nt, 'check'], [nt, 'newline-scan']), 3, true, ratio, reason(nt, 'check'));
  row('oxigraph load + 4 queries (200k NT) / check ≥ 10', ...both([nt, 'oxigraph'], [nt, 'check']), 10, false, ratio, reason(nt, 'oxigraph') ?? reason(nt, 'check'));
  row('oxigraph load + 4 queries (2M NT) / check ≥ 10', ...both([big, 'oxigraph'], [big, 'check']), 10, false, ratio, reason(big, 'oxigraph') ?? reason(big, 'check'));
  row('check(2M NT) peak RSS ≤ 1.5 GiB', big && peakRss(big, 'check'), undefined, 1.5 * GIB, true, (n) => `${(n / GIB).toFixed(2)} GiB`, reason(big, 'check'));
  row('time check(2M NT) / check(200k NT) ≤ 11', ...both([big, 'check'], [nt, 'check']), 11, true, ratio, reason(big, 'check') ?? reason(nt, 'check'));
  row('check(Turtle 200k) / n3 parse(Turtle 200k) ≤ 1.3', ...both([turtle, 'check'], [turtle, 'n3-parse']), 1.3, true, ratio, reason(turtle, 'check'));
  console.log('\n### Targets (met or missed is judged on wall time)');
  console.log('| target | wall | CPU | |');
  console.log('| --- | ---: | ---: | --- |');
  for (const line of rows) console.log(line);
}

/** One profiled check of an input; prints the functions with the most self time. */
async function printProfile(input: GeneratedInput, work: { folder: string; config: string; checkFlags: string[] }): Promise<void> {
  const profileDir = path.join(work.folder, 'profile');
  const sample = await measureOnce('check', input, { ...work, profileDir });
  if (typeof sample === 'string') {
    console.log(`profile: check failed: ${sample}`);
    return;
  }
  const profiles = readdirSync(profileDir).filter((name) => name.endsWith('.cpuprofile'));
  console.log(`\n### Where check spends its time (node --cpu-prof, one run, ${path.basename(input.file)}; self time)`);
  console.log('| function | where | self ms | share |');
  console.log('| --- | --- | ---: | ---: |');
  for (const name of profiles) {
    for (const spot of hotSpots(path.join(profileDir, name), path.dirname(path.dirname(BIN)), 12)) {
      console.log(`| ${spot.name} | ${spot.location} | ${spot.selfMs.toFixed(0)} | ${(spot.share * 100).toFixed(1)} % |`);
    }
  }
}

function positiveInteger(value: string): number {
  const number = Number(value);
  if (!Number.isInteger(number) || number < 1) throw new InvalidArgumentError('a whole number of 1 or more');
  return number;
}

const program = new Command('scale')
  .description('Times isapart check on generated hierarchies next to a newline scan, n3 and oxigraph (needs `npm run build`).')
  .option('--sizes <keys>', `comma-separated, from ${SIZES.map((size) => size.key).join(',')}`, DEFAULT_SIZES)
  .option('--runs <n>', 'runs per measure instead of the defaults (5 at 200k, 3 at 2M)', positiveInteger)
  .option('--oxigraph-runs <n>', 'at most n runs of the oxigraph measure per size (defaults: 5 at 200k, 1 at 2M); 0 skips it', (value) => (value === '0' ? 0 : positiveInteger(value)))
  .option('--isapart <file>', 'the isapart command to time, e.g. a build of an earlier commit', path.join(ROOT, 'bin', 'isapart.js'))
  .option('--also-isapart <file>', 'a second isapart command (e.g. a build of an earlier commit) timed in the same runs, alternating with --isapart')
  .option('--profile', 'also profile one check of the first N-Triples size with node --cpu-prof')
  .option('--keep-inputs', 'keep the 2M file in the cache (it is deleted after its measures otherwise)')
  .addHelpText('after', `\nTables go to standard output as markdown (for test/bench/RESULTS.md), progress to standard error.\nA full run takes tens of minutes and needs about 2 GiB free in the temporary folder for the 2M file.\nGenerated inputs are cached in ${path.join('<tmpdir>', 'isapart-bench-cache')}, keyed by size and the generator's source.\nA child is stopped past ${BOUNDS.timeoutMs / 60_000} min or ${BOUNDS.maxRssBytes / GIB} GiB RSS and its cell marked.`);
program.parse();
const options = program.opts<{ isapart: string; alsoIsapart?: string; sizes: string; runs?: number; oxigraphRuns?: number; profile?: boolean; keepInputs?: boolean }>();
const wanted = options.sizes.split(',').map((key) => key.trim());
const unknown = wanted.filter((key) => !SIZES.some((size) => size.key === key));
if (unknown.length > 0) program.error(`unknown size ${unknown.join(', ')}; known: ${SIZES.map((size) => size.key).join(', ')}`);

const BIN = path.resolve(options.isapart);
const OTHER_BIN = options.alsoIsapart === undefined ? undefined : path.resolve(options.alsoIsapart);
const log = (line: string): void => void process.stderr.write(`${line}\n`);
const folder = mkdtempSync(path.join(cacheFolder(), 'run-'));
const config = path.join(folder, 'isapart.yaml');
writeFileSync(config, `scope: [${SCOPE.prefixes.join(', ')}]\nroots: [${SCOPE.roots.join(', ')}]\n`);
const help = await runNodeChild([BIN, 'check', '--help'], ROOT, BOUNDS);
if (help.exitCode !== 0) throw new Error(`bin/isapart.js does not run (npm run build first?): ${help.stderr.slice(0, 300)}`);
const checkFlags = help.stdout.includes('--no-progress') ? ['--no-progress'] : [];
const work = { folder, config, checkFlags };

const cpu = cpus();
console.log(`machine: ${cpu.length} × ${cpu[0]?.model ?? 'unknown CPU'}, ${(totalmem() / GIB).toFixed(0)} GiB, Node ${process.version}`);
if (OTHER_BIN !== undefined) console.log(`also timed: node ${OTHER_BIN} check, same flags`);
console.log(`check: node ${path.relative(ROOT, BIN) || BIN} check FILE -c isapart.yaml --format json -o FILE --fail-on never ${checkFlags.join(' ')}`);
console.log(`config: scope ${SCOPE.prefixes.join(', ')}; roots ${SCOPE.roots.join(', ')}`);
const results: InputResult[] = [];
let profiled = false;
for (const size of SIZES.filter((spec) => wanted.includes(spec.key))) {
  const runs = options.runs ?? size.runs;
  const spec = { ...size, runs, oxigraphRuns: Math.min(options.oxigraphRuns ?? Infinity, size.oxigraphRuns, runs) };
  let input: GeneratedInput;
  try {
    input = await generatedInput(spec.classes, spec.syntax, log);
  } catch (error) {
    console.log(`\n### ${spec.key}: not measured: ${(error as Error).message}`);
    continue;
  }
  log(`${spec.key}: ${spec.runs} runs`);
  const result = await measureInput(spec, input, work, log);
  results.push(result);
  printInputTable(result);
  if (options.profile && spec.syntax === 'n-triples' && !profiled) {
    profiled = true;
    await printProfile(input, work);
  }
  if (spec.classes > 1_000_000 && !options.keepInputs) removeInput(input);
}
printTargets(results);
rmSync(folder, { recursive: true, force: true });
