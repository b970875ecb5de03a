// Baselines end to end on a copy of the demo: identical runs, a planted error and a fixed one, in JSON and SARIF.
import { appendFileSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { Ajv } from 'ajv';
import { describe, expect, it } from 'vitest';
import { runCli } from '../cli/terminal-fake.js';
import { sarifValidator } from '../report/sarif-validator.js';
import { demoCopy, PLANTED_CYCLE } from './demo-copy.js';

const validateSarif = sarifValidator();
const findingsSchema = JSON.parse(readFileSync(path.resolve(__dirname, '../../docs/findings.schema.json'), 'utf8'));
const validateJson = new Ajv({ allErrors: true }).compile(findingsSchema);

/** The line of components.ttl that states TractionMotor ⊑ Component twice over; dropping `, nv:Component` fixes the redundant-subclass finding. */
const REDUNDANT = '  rdfs:subClassOf nv:ElectricalEquipment, nv:Component ;';

type Format = 'json' | 'sarif';

/** The baselineState of every finding or result, and the states counted. */
function states(format: Format, text: string): string[] {
  const document = JSON.parse(text);
  if (format === 'json') {
    const valid = validateJson(document);
    expect(validateJson.errors ?? []).toEqual([]);
    expect(valid).toBe(true);
    return document.findings.map((finding: { baselineState?: string }) => finding.baselineState ?? '(none)');
  }
  const valid = validateSarif(document);
  expect(validateSarif.errors ?? []).toEqual([]);
  expect(valid).toBe(true);
  const results = document.runs[0].results as { baselineState?: string }[];
  // SARIF 2.1.0 §3.27.24: baselineState on all results or on none.
  const withState = results.filter((result) => result.baselineState !== undefined).length;
  expect([0, results.length]).toContain(withState);
  return results.map((result) => result.baselineState ?? '(none)');
}

function count(list: string[], state: string): number {
  return list.filter((item) => item === state).length;
}

describe.each<Format>(['json', 'sarif'])('a %s baseline of the demo', (format) => {
  async function baselineOf(dir: string): Promise<string> {
    const written = await runCli(dir, ['check', '.', '-f', format, '-o', `before.${format}`]);
    expect(written.code).toBe(1);
    const text = readFileSync(path.join(dir, `before.${format}`), 'utf8');
    expect(count(states(format, text), '(none)')).toBe(JSON.parse(text).findings?.length ?? JSON.parse(text).runs[0].results.length);
    return `before.${format}`;
  }

  it('an identical run: every finding unchanged, exit 0, and the text summary counts nothing new', async () => {
    const dir = demoCopy();
    const baseline = await baselineOf(dir);
    const again = await runCli(dir, ['check', '.', '-f', format, '--baseline', baseline]);
    expect(again.code).toBe(0);
    const found = states(format, again.out);
    expect(found.length).toBeGreaterThan(10);
    expect(count(found, 'unchanged')).toBe(found.length);
    const text = await runCli(dir, ['check', '.', '--baseline', baseline]);
    expect(text.code).toBe(0);
    expect(text.out).toContain(`compared with ${baseline}: 0 new, ${found.length} unchanged (not listed), none no longer found`);
    expect(text.out).toMatch(/^0 new errors, 0 new warnings, 0 new notes; 0 allowed; \d+ unchanged; 0 no longer found;/m);
  });

  it('one planted error: exactly one new finding, exit 1, and the text lists only it', async () => {
    const dir = demoCopy();
    const baseline = await baselineOf(dir);
    appendFileSync(path.join(dir, 'components.ttl'), PLANTED_CYCLE);
    const after = await runCli(dir, ['check', '.', '-f', format, '--baseline', baseline]);
    expect(after.code).toBe(1);
    const found = states(format, after.out);
    expect(count(found, 'new')).toBe(1);
    expect(count(found, 'absent')).toBe(0);
    const text = await runCli(dir, ['check', '.', '--baseline', baseline]);
    expect(text.code).toBe(1);
    expect(text.out.match(/^ {2}(error|warning|note) /gm)).toHaveLength(1);
    expect(text.out).toContain('part-cycle');
    expect(text.out).toMatch(/^1 new error, 0 new warnings, 0 new notes;/m);
  });

  it('one fixed finding: exactly one absent, none new, exit 0', async () => {
    const dir = demoCopy();
    const baseline = await baselineOf(dir);
    const file = path.join(dir, 'components.ttl');
    const text = readFileSync(file, 'utf8');
    expect(text).toContain(REDUNDANT);
    writeFileSync(file, text.replace(REDUNDANT, '  rdfs:subClassOf nv:ElectricalEquipment ;'));
    const after = await runCli(dir, ['check', '.', '-f', format, '--baseline', baseline]);
    expect(after.code).toBe(0);
    const found = states(format, after.out);
    expect(count(found, 'absent')).toBe(1);
    expect(count(found, 'new')).toBe(0);
    const shown = await runCli(dir, ['check', '.', '--baseline', baseline]);
    expect(shown.out).toMatch(/no longer found \(1\)\n {2}note {5}redundant-subclass {2}nv:TractionMotor/);
  });

  it('an error-level finding the baseline already has does not fail the run, but --fail-on counts new notes', async () => {
    const dir = demoCopy();
    const baseline = await baselineOf(dir);
    // A new orphan class is a note: below the default --fail-on error, at or above --fail-on note.
    appendFileSync(path.join(dir, 'components.ttl'), '\nnv:Pantograph2 a owl:Class .\n');
    expect((await runCli(dir, ['check', '.', '--baseline', baseline])).code).toBe(0);
    expect((await runCli(dir, ['check', '.', '--baseline', baseline, '--fail-on', 'note'])).code).toBe(1);
    // --quiet leaves out the new note and says so; the unchanged findings are still counted.
    const quiet = await runCli(dir, ['check', '.', '--baseline', baseline, '-q']);
    expect(quiet.out).toContain('--quiet: 1 note below level error not shown');
    expect(quiet.out).toMatch(/; 15 unchanged; 0 no longer found;/);
  });
});

describe('--baseline errors', () => {
  it('a missing file, a text report and an old version are usage errors (exit 2) with a hint, before linting', async () => {
    const dir = demoCopy();
    const missing = await runCli(dir, ['check', '.', '--baseline', 'nowhere.json']);
    expect(missing.code).toBe(2);
    expect(missing.err).toMatch(/the baseline nowhere\.json cannot be read \(ENOENT\)\n {2}hint: /);
    expect(missing.out).toBe('');
    writeFileSync(path.join(dir, 'before.txt'), (await runCli(dir, ['check', '.'])).out);
    const text = await runCli(dir, ['check', '.', '--baseline', 'before.txt']);
    expect(text.code).toBe(2);
    expect(text.err).toContain('is not JSON');
    const json = JSON.parse((await runCli(dir, ['check', '.', '-f', 'json'])).out);
    writeFileSync(path.join(dir, 'old.json'), JSON.stringify({ ...json, version: 1 }));
    const old = await runCli(dir, ['check', '.', '--baseline', 'old.json']);
    expect(old.code).toBe(2);
    expect(old.err).toContain('version 1');
    expect(old.err).toContain('hint: write the baseline again with this isapart');
  });

  it('--baseline and --since together are refused', async () => {
    const dir = demoCopy();
    const both = await runCli(dir, ['check', '.', '--baseline', 'a.json', '--since', 'HEAD']);
    expect(both.code).toBe(2);
    expect(both.err).toContain('use one of them');
  });
});
