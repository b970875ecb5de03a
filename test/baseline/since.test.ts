// --since REV in temporary git repositories: two commits, files added and deleted, no repository, a shallow clone.
import { appendFileSync, cpSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { describe, expect, it } from 'vitest';
import { runCli } from '../cli/terminal-fake.js';
import { sarifValidator } from '../report/sarif-validator.js';
import { commitAll, DEMO_FOLDER, demoCopy, git, PLANTED_CYCLE } from './demo-copy.js';

const validateSarif = sarifValidator();

/** A repository holding the demo in `data/`, committed as shipped; returns the work tree. */
function demoRepository(): string {
  const repo = mkdtempSync(path.join(tmpdir(), 'isapart-since-'));
  cpSync(DEMO_FOLDER, path.join(repo, 'data'), { recursive: true });
  commitAll(repo, 'Northvale Rail asset graph as shipped', true);
  return repo;
}

describe('--since REV', () => {
  it('with a second commit that plants an error: exactly that one is new, exit 1; at HEAD nothing is new', async () => {
    const repo = demoRepository();
    appendFileSync(path.join(repo, 'data', 'components.ttl'), PLANTED_CYCLE);
    commitAll(repo, 'Fit pantograph P9');
    const since = await runCli(repo, ['check', 'data', '--since', 'HEAD~1']);
    expect(since.code).toBe(1);
    expect(since.out).toMatch(/compared with git revision HEAD~1 \([0-9a-f]{12}\): 1 new, \d+ unchanged \(not listed\), none no longer found/);
    expect(since.out.match(/^ {2}(error|warning|note) /gm)).toEqual(['  error ']);
    expect(since.out).toContain('part-cycle');
    const head = await runCli(repo, ['check', 'data', '--since', 'HEAD']);
    expect(head.code).toBe(0);
    expect(head.out).toMatch(/: 0 new, \d+ unchanged/);
  });

  it('reads the revision from git, not the work tree: uncommitted edits are what is new', async () => {
    const repo = demoRepository();
    appendFileSync(path.join(repo, 'data', 'components.ttl'), PLANTED_CYCLE);
    const since = await runCli(repo, ['check', 'data', '-f', 'sarif', '--since', 'HEAD']);
    expect(since.code).toBe(1);
    const log = JSON.parse(since.out);
    expect(validateSarif(log)).toBe(true);
    const states = log.runs[0].results.map((result: { baselineState: string }) => result.baselineState);
    expect(states.filter((state: string) => state === 'new')).toHaveLength(1);
    expect(states.every((state: string) => state === 'new' || state === 'unchanged')).toBe(true);
    // No checkout was touched: the work tree still holds the edit.
    expect(git(repo, 'status', '--porcelain')).toBe(' M data/components.ttl\n');
  });

  it('reads a file added since as empty at the revision, and a deleted file’s findings as absent', async () => {
    const repo = demoRepository();
    writeFileSync(path.join(repo, 'data', 'pantographs.ttl'), `@prefix dcterms: <http://purl.org/dc/terms/> .\n@prefix fleet: <https://data.northvale-rail.example/fleet/> .\n${PLANTED_CYCLE}`);
    rmSync(path.join(repo, 'data', 'depots.nt'));
    commitAll(repo, 'Pantographs in their own file; depot register moved out');
    const since = await runCli(repo, ['check', 'data', '-f', 'json', '--since', 'HEAD~1']);
    const document = JSON.parse(since.out);
    const byState = (state: string) => document.findings.filter((finding: { baselineState: string }) => finding.baselineState === state);
    // New: the planted cycle, and the config's allow entry for WorkOrder, which now suppresses nothing.
    expect(byState('new').map((finding: { ruleId: string }) => finding.ruleId).sort()).toEqual(['part-cycle', 'unused-allow']);
    // The depot register held two orphan classes (one allowed in config) and nothing else of the demo's findings.
    expect(byState('absent').map((finding: { ruleId: string; focus: string }) => [finding.ruleId, finding.focus.replace('https://data.northvale-rail.example/', '')]).sort()).toEqual([
      ['orphan-class', 'def/Sideing'],
      ['orphan-class', 'def/WorkOrder'],
    ]);
    expect(document.summary.baseline).toMatchObject({ new: 2, absent: 2 });
    // A file named on the command line that did not exist at the revision is read as empty there.
    const named = await runCli(repo, ['check', 'data/pantographs.ttl', '--since', 'HEAD~1', '-c', 'data/isapart.yaml']);
    expect(named.code).toBe(1);
    // Unchanged: the config's unused allow entry, reported in both runs.
    expect(named.out).toMatch(/: 1 new, 1 unchanged \(not listed\)/);
  });

  it('outside a git work tree: exit 2 and a hint to use --baseline', async () => {
    const dir = demoCopy();
    const outside = await runCli(dir, ['check', '.', '--since', 'HEAD~1']);
    expect(outside.code).toBe(2);
    expect(outside.err).toMatch(/^isapart: error: --since: .* is not inside a git work tree/);
    expect(outside.err).toContain('hint: run isapart inside the clone of the repository, or compare with a saved report using --baseline FILE');
    expect(outside.out).toBe('');
  });

  it('a revision the repository lacks, and one in a shallow clone: exit 2 with how to fetch it', async () => {
    const repo = demoRepository();
    appendFileSync(path.join(repo, 'data', 'components.ttl'), PLANTED_CYCLE);
    commitAll(repo, 'Fit pantograph P9');
    const unknown = await runCli(repo, ['check', 'data', '--since', 'release-2024']);
    expect(unknown.code).toBe(2);
    expect(unknown.err).toContain('the revision release-2024 is not in this clone');
    expect(unknown.err).toContain('git fetch origin release-2024');
    // A depth-1 clone, as CI services make them, holds HEAD but not its parent.
    const clone = mkdtempSync(path.join(tmpdir(), 'isapart-shallow-'));
    git(clone, 'clone', '-q', '--depth', '1', pathToFileURL(repo).href, 'work');
    const shallow = await runCli(path.join(clone, 'work'), ['check', 'data', '--since', 'HEAD~1']);
    expect(shallow.code).toBe(2);
    expect(shallow.err).toContain('the revision HEAD~1 is not in this clone (a shallow clone)');
    expect(shallow.err).toContain('git fetch --no-tags --depth=1 origin HEAD~1');
    expect(shallow.err).toContain('git fetch --unshallow');
    // Once fetched, the same command works.
    git(path.join(clone, 'work'), 'fetch', '-q', '--unshallow');
    expect((await runCli(path.join(clone, 'work'), ['check', 'data', '--since', 'HEAD~1'])).code).toBe(1);
  });

  it('refuses standard input and an option-like revision', async () => {
    const repo = demoRepository();
    const stdin = await runCli(repo, ['check', '-', '--since', 'HEAD']);
    expect(stdin.code).toBe(2);
    expect(stdin.err).toContain('--since cannot read standard input at a revision');
    const option = await runCli(repo, ['check', 'data', '--since=--output=x']);
    expect(option.code).toBe(2);
    expect(option.err).toContain('a revision cannot start with "-"');
  });
});
