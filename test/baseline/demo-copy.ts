// Test helpers for baselines: a copy of the Northvale Rail demo in a temporary folder, and git in it.
import { cpSync, mkdtempSync } from 'node:fs';
import { execFileSync } from 'node:child_process';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

/** The shipped demo folder. */
export const DEMO_FOLDER = fileURLToPath(new URL('../../fixtures/demo/', import.meta.url));

/** A fresh copy of fixtures/demo in a temporary folder; returns the folder. */
export function demoCopy(): string {
  const dir = mkdtempSync(path.join(tmpdir(), 'isapart-gate-'));
  cpSync(DEMO_FOLDER, dir, { recursive: true });
  return dir;
}

/** A planted error for the demo: a part-of cycle between two new components, appended to components.ttl. */
export const PLANTED_CYCLE = `
fleet:pantograph-P9 dcterms:isPartOf fleet:roof-R9 .
fleet:roof-R9 dcterms:isPartOf fleet:pantograph-P9 .
`;

/** Runs git in a folder without a shell, with a fixed identity and no user or system config. */
export function git(dir: string, ...args: string[]): string {
  return execFileSync('git', args, {
    cwd: dir,
    encoding: 'utf8',
    env: {
      ...process.env,
      GIT_CONFIG_NOSYSTEM: '1',
      GIT_CONFIG_GLOBAL: '/dev/null',
      GIT_AUTHOR_NAME: 'Northvale Data Steward',
      GIT_AUTHOR_EMAIL: 'steward@northvale-rail.example',
      GIT_COMMITTER_NAME: 'Northvale Data Steward',
      GIT_COMMITTER_EMAIL: 'steward@northvale-rail.example',
    },
  });
}

/** Makes the folder a git repository whose first commit holds its files. */
export function commitAll(dir: string, message: string, init = false): void {
  if (init) git(dir, 'init', '-q', '-b', 'main');
  git(dir, 'add', '-A');
  git(dir, 'commit', '-q', '-m', message);
}
