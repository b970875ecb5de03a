// Benchmark: `check` on WordNet's noun hierarchy next to n3's bare parse of the same file, in one run.
import { readFileSync } from 'node:fs';
import { cpus, totalmem } from 'node:os';
import { performance } from 'node:perf_hooks';
import { Parser } from 'n3';
import { check } from '../../src/check.js';
import { writeWordnetInput } from './wordnet-input.js';

const RUNS = 5;

/** Median of a list of numbers. */
function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}

/** Times n3's bare parse of a file: read the text, parse every quad, keep nothing. */
function timeBareParse(file: string): { ms: number; quads: number } {
  const start = performance.now();
  const text = readFileSync(file, 'utf8');
  // Without callbacks n3 parses synchronously and returns the quads.
  const quads = new Parser({ format: 'N-Triples' }).parse(text).length;
  return { ms: performance.now() - start, quads };
}

/** Times a whole `check` of the file with its config: load, graph, rules, suppression. */
async function timeCheck(file: string, configFile: string): Promise<{ ms: number; findings: number }> {
  const start = performance.now();
  const result = await check({ paths: [file], configFile });
  return { ms: performance.now() - start, findings: result.findings.length };
}

const { file, configFile, synsets, counts } = writeWordnetInput();

const parseTimes: number[] = [];
const checkTimes: number[] = [];
let quads = 0;
let findings = 0;
for (let run = 0; run < RUNS; run += 1) {
  const bare = timeBareParse(file);
  parseTimes.push(bare.ms);
  quads = bare.quads;
  const linted = await timeCheck(file, configFile);
  checkTimes.push(linted.ms);
  findings = linted.findings;
}

const ratio = median(checkTimes) / median(parseTimes);
console.log(`machine: ${cpus().length} × ${cpus()[0]?.model ?? 'unknown CPU'}, ${(totalmem() / 2 ** 30).toFixed(0)} GiB, Node ${process.version}`);
console.log(`input: WordNet nouns (${synsets} synsets) as N-Triples, ${counts.triples} triples, ${quads} parsed by n3`);
console.log(`runs: ${RUNS}, alternating; medians below`);
console.log(`| measure | median ms | ratio to n3 bare parse |`);
console.log(`| --- | ---: | ---: |`);
console.log(`| n3 bare parse (read + parse, keep nothing) | ${median(parseTimes).toFixed(0)} | 1.00 |`);
console.log(`| isapart check (load with positions, graph, 9 rules, ${findings} findings) | ${median(checkTimes).toFixed(0)} | ${ratio.toFixed(2)} |`);
