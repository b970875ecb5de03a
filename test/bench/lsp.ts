// Benchmark: the language server's edit-to-diagnostics latency on a 50,000-statement workspace of 20 files, next to a full check.
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { cpus, loadavg, tmpdir, totalmem } from 'node:os';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { check } from '../../src/check.js';
import { LintFolder } from '../../src/lsp/lint-folder.js';
import type { HeapReport } from '../../src/lsp/server.js';
import { startServer, uriOf } from '../lsp/lsp-client.js';
import { writeWorkspace } from './lsp-workspace.js';

const STATEMENTS = 50_000;
const FILES = 20;
const CHECK_RUNS = 5;
const EDITS = Number(process.env.BENCH_EDITS ?? 40);
/** The target for diagnostics after an edit. */
const TARGET_MS = 300;

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}

function percentile(values: number[], share: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil(share * sorted.length) - 1)];
}

const folder = mkdtempSync(path.join(tmpdir(), 'isapart-bench-lsp-'));
try {
  const workspace = writeWorkspace(folder, STATEMENTS, FILES);

  // A full check of the same workspace, in process: read, parse every file, graph, rules, suppression.
  const checkTimes: number[] = [];
  let findings = 0;
  for (let run = 0; run < CHECK_RUNS; run++) {
    const start = performance.now();
    const result = await check({ paths: ['.'], cwd: folder });
    checkTimes.push(performance.now() - start);
    findings = result.findings.length;
  }

  // The server's own step in process: one buffer changed, that buffer parsed, the folder linted.
  const inProcess = new LintFolder(folder, { parses: 0, lints: 0 });
  await inProcess.loadAll();
  const changedFile = workspace.files[Math.floor(FILES / 2)];
  const changedText = readFileSync(changedFile, 'utf8');
  const relintTimes: number[] = [];
  for (let run = 0; run < CHECK_RUNS * 2; run++) {
    inProcess.setBuffer(changedFile, run % 2 === 0 ? `${changedText}c:C1 rdfs:subClassOf c:C${9000 + run} .\n` : changedText);
    const start = performance.now();
    await inProcess.lint();
    relintTimes.push(performance.now() - start);
  }

  const session = await startServer({ folders: [folder] });
  const startupStart = performance.now();
  for (const file of workspace.files) await session.waitFor(uriOf(file), () => true, 'the first lint');
  const startup = performance.now() - startupStart;

  // Edits to one file in the middle: a statement added at its end (closing a cycle on odd edits), then taken away.
  const uri = uriOf(changedFile);
  const original = changedText;
  let document = session.open(uri, original);
  await session.waitFor(uri, (params) => params.version === 1, 'the opened buffer linted');
  const latencies: number[] = [];
  for (let edit = 0; edit < EDITS; edit++) {
    const text = edit % 2 === 0 ? `${original}c:C1 rdfs:subClassOf c:C${9000 + edit} .\n` : original;
    const start = performance.now();
    document = session.replace(document, text);
    const version = document.version;
    await session.waitFor(uri, (params) => params.version === version, `version ${version}`);
    latencies.push(performance.now() - start);
  }
  const heap = (await session.connection.sendRequest('isapart/heap')) as HeapReport;
  await session.close();

  const checkMedian = median(checkTimes);
  const latencyMedian = median(latencies);
  console.log('');
  console.log(`machine: ${cpus().length} × ${cpus()[0]?.model ?? 'unknown CPU'}, ${(totalmem() / 2 ** 30).toFixed(0)} GiB, Node ${process.version}`);
  console.log(`input: ${workspace.statements} statements in ${FILES} Turtle files (generated, test/bench/lsp-workspace.ts), ${findings} findings`);
  console.log(`runs: ${CHECK_RUNS} full checks and ${CHECK_RUNS * 2} re-lints in process, then ${EDITS} edits to one file through the spawned server (lint delay 60 ms included)`);
  console.log('| measure | median ms | p90 ms | ratio to full check |');
  console.log('| --- | ---: | ---: | ---: |');
  console.log(`| isapart check of the workspace (in process) | ${checkMedian.toFixed(0)} | ${percentile(checkTimes, 0.9).toFixed(0)} | 1.00 |`);
  console.log(`| re-lint after one buffer changed (in process: parse it, graph, rules) | ${median(relintTimes).toFixed(0)} | ${percentile(relintTimes, 0.9).toFixed(0)} | ${(median(relintTimes) / checkMedian).toFixed(2)} |`);
  console.log(`| server start to diagnostics for all ${FILES} files | ${startup.toFixed(0)} | – | ${(startup / checkMedian).toFixed(2)} |`);
  console.log(`| edit to diagnostics of the edited file | ${latencyMedian.toFixed(0)} | ${percentile(latencies, 0.9).toFixed(0)} | ${(latencyMedian / checkMedian).toFixed(2)} |`);
  console.log(`target: diagnostics within ${TARGET_MS} ms of an edit: ${latencyMedian <= TARGET_MS ? 'met' : 'not met'} at the median, ${percentile(latencies, 0.9) <= TARGET_MS ? 'met' : 'not met'} at p90; load average ${loadavg()[0].toFixed(1)} at the end; server heap after the edits ${(heap.heapUsed / 2 ** 20).toFixed(0)} MiB`);
} finally {
  rmSync(folder, { recursive: true, force: true });
}
