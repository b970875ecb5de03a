// The server's diagnostics on the demo workspace hold the same findings as `isapart check --format json`.
import { execFileSync } from 'node:child_process';
import { cpSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { JsonReport } from '../../src/report/json.js';
import { startServer, uriOf, type ServerSession } from './lsp-client.js';

const repositoryRoot = path.resolve(fileURLToPath(import.meta.url), '../../..');
const demoFiles = ['components.ttl', 'depots.nt', 'infrastructure.ttl', 'rolling-stock.ttl'];

/** One finding's place as a diagnostic should show it: rule, file, 0-based line and character. */
type Place = [rule: string, file: string, line: number, character: number];

function byPlace(a: Place, b: Place): number {
  return a.join('\u0000') < b.join('\u0000') ? -1 : a.join('\u0000') > b.join('\u0000') ? 1 : 0;
}

describe('isapart lsp on the demo workspace', () => {
  let folder: string;
  let session: ServerSession;
  let report: JsonReport;

  beforeAll(async () => {
    folder = mkdtempSync(path.join(tmpdir(), 'isapart-lsp-demo-'));
    cpSync(path.join(repositoryRoot, 'fixtures/demo'), folder, { recursive: true });
    // `check` exits 1 on the demo's errors; the report on stdout is what is compared.
    const output = (() => {
      try {
        return execFileSync(process.execPath, [path.join(repositoryRoot, 'bin/isapart.js'), 'check', '.', '--format', 'json'], { cwd: folder, encoding: 'utf8' });
      } catch (error) {
        return (error as { stdout: string }).stdout;
      }
    })();
    report = JSON.parse(output) as JsonReport;
    session = await startServer({ folders: [folder] });
  });

  afterAll(async () => {
    expect(await session.close()).toBe(0);
  });

  it('publishes to every RDF file of the folder without any being opened, with the findings of isapart check', async () => {
    const expected: Place[] = [];
    for (const finding of report.findings) {
      if (finding.suppression) continue;
      if (finding.evidence.length === 0 && finding.location) {
        expected.push([finding.ruleId, finding.location.file, finding.location.line - 1, finding.location.column - 1]);
        continue;
      }
      // One diagnostic per file the evidence points into, at its first statement there.
      const seen = new Set<string>();
      for (const statement of finding.evidence) {
        if (seen.has(statement.file)) continue;
        seen.add(statement.file);
        expected.push([finding.ruleId, statement.file, statement.line - 1, statement.column - 1]);
      }
    }
    expect(expected.length).toBeGreaterThanOrEqual(14);

    const actual: Place[] = [];
    for (const file of demoFiles) {
      const params = await session.waitFor(uriOf(path.join(folder, file)), () => true, 'any diagnostics');
      for (const diagnostic of params.diagnostics) {
        expect(diagnostic.source).toBe('isapart');
        if (diagnostic.code === 'input-error' || diagnostic.code === 'input-warning') continue;
        actual.push([String(diagnostic.code), file, diagnostic.range.start.line, diagnostic.range.start.character]);
      }
    }
    expect(actual.sort(byPlace)).toEqual(expected.sort(byPlace));
  });

  it('gives each diagnostic the severity of its level, its message, and the fingerprint in data', async () => {
    const params = await session.waitFor(uriOf(path.join(folder, 'rolling-stock.ttl')), () => true, 'any diagnostics');
    for (const finding of report.findings.filter((candidate) => !candidate.suppression && candidate.evidence[0]?.file === 'rolling-stock.ttl')) {
      const diagnostic = params.diagnostics.find((candidate) => (candidate.data as { fingerprint?: string })?.fingerprint === finding.fingerprint);
      expect(diagnostic, finding.message).toBeDefined();
      // LSP 3.17 DiagnosticSeverity: Error 1, Warning 2, Information 3.
      expect(diagnostic!.severity).toBe({ error: 1, warning: 2, note: 3 }[finding.level]);
      expect(diagnostic!.message).toBe(finding.message);
      expect(diagnostic!.code).toBe(finding.ruleId);
    }
  });

  it('relates the other evidence statements of a cycle across files', async () => {
    const params = await session.waitFor(uriOf(path.join(folder, 'rolling-stock.ttl')), () => true, 'any diagnostics');
    const cycle = params.diagnostics.find((diagnostic) => diagnostic.code === 'part-cycle');
    const finding = report.findings.find((candidate) => candidate.ruleId === 'part-cycle')!;
    expect(cycle).toBeDefined();
    const related = (cycle!.relatedInformation ?? []).map((info) => [info.location.uri, info.location.range.start.line, info.location.range.start.character]);
    const expected = finding.evidence.slice(1).map((statement) => [uriOf(path.join(folder, statement.file)), statement.line - 1, statement.column - 1]);
    expect(related).toEqual(expected);
    expect(related.some(([uri]) => uri === uriOf(path.join(folder, 'components.ttl')))).toBe(true);
    // The other file of the cycle carries the finding too.
    const other = await session.waitFor(uriOf(path.join(folder, 'components.ttl')), () => true, 'any diagnostics');
    expect(other.diagnostics.some((diagnostic) => (diagnostic.data as { fingerprint?: string })?.fingerprint === finding.fingerprint)).toBe(true);
  });
});
