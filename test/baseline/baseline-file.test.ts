// Reading baselines: isapart's own JSON and SARIF reports round-trip; anything else is a clear error.
import { describe, expect, it } from 'vitest';
import { parseBaseline } from '../../src/baseline/baseline-file.js';
import { compareWithBaseline, countBaselineStates } from '../../src/baseline/compare.js';
import { JSON_REPORT_VERSION, toJson } from '../../src/report/json.js';
import { FINDINGS_VERSION_PROPERTY, toSarif } from '../../src/report/sarif.js';
import { ALL_FINDINGS, DEPRECATED_FINDING, PANTOGRAPH_FINDING, SIGNAL_CYCLE_FINDING, context } from '../report/report-fixtures.js';

const fingerprints = (findings: { fingerprint: string }[]) => findings.map((finding) => finding.fingerprint).sort();

function errorOf(text: string): string {
  const read = parseBaseline(text, 'before.json');
  expect('error' in read).toBe(true);
  if (!('error' in read)) return '';
  expect(read.error.hint).toBeTruthy();
  return read.error.message;
}

describe('parseBaseline', () => {
  it('reads back every finding of a JSON report, with rule, level, message, nodes and evidence', () => {
    const read = parseBaseline(toJson(ALL_FINDINGS, context()), 'before.json');
    if ('error' in read) throw new Error(read.error.message);
    expect(fingerprints(read.findings)).toEqual(fingerprints(ALL_FINDINGS));
    const pantograph = read.findings.find((finding) => finding.fingerprint === PANTOGRAPH_FINDING.fingerprint);
    expect(pantograph?.message).toBe(PANTOGRAPH_FINDING.message);
    expect(pantograph?.nodes).toEqual(PANTOGRAPH_FINDING.nodes);
    expect(pantograph?.evidence.map((statement) => [statement.subject, statement.position.line])).toEqual(
      PANTOGRAPH_FINDING.evidence.map((statement) => [statement.subject, statement.position.line]),
    );
  });

  it('reads back every result of a SARIF report by its isapart/v1 partial fingerprint', () => {
    const read = parseBaseline(toSarif(ALL_FINDINGS, context()), 'before.sarif');
    if ('error' in read) throw new Error(read.error.message);
    expect(fingerprints(read.findings)).toEqual(fingerprints(ALL_FINDINGS));
    const cycle = read.findings.find((finding) => finding.fingerprint === SIGNAL_CYCLE_FINDING.fingerprint);
    expect([cycle?.ruleId, cycle?.level, cycle?.focus, cycle?.nodes]).toEqual([SIGNAL_CYCLE_FINDING.ruleId, SIGNAL_CYCLE_FINDING.level, SIGNAL_CYCLE_FINDING.focus, SIGNAL_CYCLE_FINDING.nodes]);
    expect(cycle?.location?.file).toBe('data/infrastructure.trig');
    // A relative artifact URI is percent-encoded; the path read back is not.
    const deprecated = read.findings.find((finding) => finding.fingerprint === DEPRECATED_FINDING.fingerprint);
    expect(deprecated?.location?.file).toBe('data/signal plans/signals.nt');
  });

  it('leaves out what a compared report itself marked absent', () => {
    const compared = compareWithBaseline([PANTOGRAPH_FINDING], [PANTOGRAPH_FINDING, DEPRECATED_FINDING]);
    expect(countBaselineStates(compared)).toEqual({ new: 0, unchanged: 1, absent: 1 });
    for (const text of [toJson(compared, context()), toSarif(compared, context())]) {
      const read = parseBaseline(text, 'compared');
      if ('error' in read) throw new Error(read.error.message);
      expect(fingerprints(read.findings)).toEqual([PANTOGRAPH_FINDING.fingerprint]);
    }
  });

  it('refuses a JSON report of another version, naming both versions and how to make a new baseline', () => {
    const older = JSON.parse(toJson(ALL_FINDINGS, context()));
    older.version = 1;
    const message = errorOf(JSON.stringify(older));
    expect(message).toContain('version 1');
    expect(message).toContain(`version ${JSON_REPORT_VERSION} only`);
  });

  it('refuses a SARIF log without isapart’s findings version, of another SARIF version, or of another tool', () => {
    const log = JSON.parse(toSarif(ALL_FINDINGS, context()));
    expect(log.runs[0].properties[FINDINGS_VERSION_PROPERTY]).toBe(JSON_REPORT_VERSION);
    delete log.runs[0].properties;
    expect(errorOf(JSON.stringify(log))).toContain('names no findings version');
    const other = JSON.parse(toSarif(ALL_FINDINGS, context()));
    other.version = '2.0.0';
    expect(errorOf(JSON.stringify(other))).toContain('SARIF 2.0.0');
    const tool = JSON.parse(toSarif(ALL_FINDINGS, context()));
    tool.runs[0].tool.driver.name = 'another-linter';
    expect(errorOf(JSON.stringify(tool))).toContain('no run of isapart');
  });

  it('refuses text that is not JSON, JSON that is no report, and a finding without a fingerprint', () => {
    expect(errorOf('0 errors, 0 warnings, 0 notes; 0 allowed\n')).toContain('is not JSON');
    expect(errorOf('{"findings": []}')).toContain('neither an isapart findings document nor a SARIF log');
    expect(errorOf('[]')).toContain('not a JSON object');
    const broken = JSON.parse(toJson(ALL_FINDINGS, context()));
    delete broken.findings[1].fingerprint;
    expect(errorOf(JSON.stringify(broken))).toContain('finding 2 of the baseline before.json is malformed');
  });
});

describe('compareWithBaseline', () => {
  it('marks findings new or unchanged by fingerprint and adds baseline-only ones as absent', () => {
    const compared = compareWithBaseline([PANTOGRAPH_FINDING, SIGNAL_CYCLE_FINDING], [SIGNAL_CYCLE_FINDING, DEPRECATED_FINDING]);
    expect(compared.map((finding) => [finding.fingerprint, finding.baselineState])).toEqual([
      [PANTOGRAPH_FINDING.fingerprint, 'new'],
      [SIGNAL_CYCLE_FINDING.fingerprint, 'unchanged'],
      [DEPRECATED_FINDING.fingerprint, 'absent'],
    ]);
  });

  it('matches a fingerprint held twice at most twice', () => {
    const compared = compareWithBaseline([PANTOGRAPH_FINDING, PANTOGRAPH_FINDING, PANTOGRAPH_FINDING], [PANTOGRAPH_FINDING, PANTOGRAPH_FINDING]);
    expect(compared.map((finding) => finding.baselineState)).toEqual(['unchanged', 'unchanged', 'new']);
  });
});
