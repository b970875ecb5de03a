// Reading files as they were at a git revision, with `git` run directly (no shell, no checkout touched).
import { execFile } from 'node:child_process';
import { realpathSync } from 'node:fs';
import path from 'node:path';
import type { InputError } from '../load/statement.js';

/** Output of one git command; `code` is its exit status (or undefined when git could not be started). */
interface GitOutput {
  code: number | undefined;
  stdout: Buffer;
  stderr: string;
  startError?: NodeJS.ErrnoException;
}

/** Largest file `git show` may hand over: 2 GiB, above any RDF file isapart can parse in memory. */
const MAX_BUFFER = 2 ** 31 - 1;

/** Runs git with arguments in a folder; never through a shell, so a revision or path is never interpreted. */
export function runGit(cwd: string, args: string[]): Promise<GitOutput> {
  return new Promise((resolve) => {
    execFile('git', args, { cwd, encoding: 'buffer', maxBuffer: MAX_BUFFER, env: { ...process.env, GIT_TERMINAL_PROMPT: '0' } }, (error, stdout, stderr) => {
      const failure = error as (NodeJS.ErrnoException & { code?: number | string }) | null;
      if (failure !== null && typeof failure.code === 'string') {
        resolve({ code: undefined, stdout: Buffer.alloc(0), stderr: '', startError: failure });
        return;
      }
      resolve({ code: failure === null ? 0 : (failure.code as number | undefined) ?? 1, stdout, stderr: stderr.toString('utf8') });
    });
  });
}

/** A git work tree and the commit a revision names in it. */
export interface Revision {
  /** The work tree's top folder, as git gives it (symbolic links resolved). */
  topFolder: string;
  /** What the user typed. */
  name: string;
  /** The full commit id it names. */
  commit: string;
}

/**
 * Finds the work tree around `cwd` and resolves `name` to a commit. Outside a work tree, without
 * git, or with a revision the clone lacks (a shallow CI clone), the error says how to get it.
 */
export async function resolveRevision(cwd: string, name: string): Promise<{ revision: Revision } | { error: InputError }> {
  const top = await runGit(cwd, ['rev-parse', '--show-toplevel']);
  if (top.startError !== undefined) {
    return { error: sinceError(`git could not be run (${top.startError.code ?? top.startError.message})`, 'install git and make sure it is on PATH, or compare with a saved report using --baseline FILE') };
  }
  if (top.code !== 0) {
    return {
      error: sinceError(
        `${cwd} is not inside a git work tree, so there is no revision ${name} to read the files at`,
        'run isapart inside the clone of the repository, or compare with a saved report using --baseline FILE',
      ),
    };
  }
  const topFolder = top.stdout.toString('utf8').trim();
  if (name.startsWith('-')) return { error: sinceError(`--since ${name}: a revision cannot start with "-"`, 'give a branch, tag or commit id, such as origin/main or HEAD~1') };
  const commit = await runGit(cwd, ['rev-parse', '--verify', '--quiet', '--end-of-options', `${name}^{commit}`]);
  if (commit.code === 0) return { revision: { topFolder, name, commit: commit.stdout.toString('utf8').trim() } };
  const shallow = (await runGit(cwd, ['rev-parse', '--is-shallow-repository'])).stdout.toString('utf8').trim() === 'true';
  const fetch = shallow
    ? `this clone is shallow and lacks it: fetch it first, for example git fetch --no-tags --depth=1 origin ${name} (or git fetch --unshallow for the whole history); in CI, check out with full history or fetch the base branch`
    : `fetch it first (for example git fetch origin ${name}), or check the spelling with git rev-parse ${name}`;
  return { error: sinceError(`the revision ${name} is not in this clone${shallow ? ' (a shallow clone)' : ''}`, fetch) };
}

/** A path inside the work tree as git names it: relative to the top folder, `/`-separated; undefined when outside it. */
export function pathInWorkTree(revision: Revision, absolutePath: string): string | undefined {
  const real = realPathOfExistingPart(absolutePath);
  const relative = path.relative(revision.topFolder, real);
  if (relative.startsWith('..') || path.isAbsolute(relative)) return undefined;
  return relative.split(path.sep).join('/');
}

/** The files at the revision under a work-tree path (the path itself when it was a file), sorted. */
export async function filesAtRevision(revision: Revision, treePath: string): Promise<string[]> {
  const listed = await runGit(revision.topFolder, ['ls-tree', '-r', '-z', '--name-only', '--full-tree', revision.commit, '--', treePath === '' ? '.' : treePath]);
  if (listed.code !== 0) return [];
  return listed.stdout
    .toString('utf8')
    .split('\0')
    .filter((name) => name !== '')
    .sort((left, right) => (left < right ? -1 : left > right ? 1 : 0));
}

/** A file's bytes at the revision, or undefined when it did not exist there. */
export async function fileAtRevision(revision: Revision, treePath: string): Promise<Buffer | undefined> {
  const shown = await runGit(revision.topFolder, ['cat-file', 'blob', `${revision.commit}:${treePath}`]);
  return shown.code === 0 ? shown.stdout : undefined;
}

/** The real path of a path whose last parts may not exist (a file deleted since): the existing part resolved, the rest kept. */
function realPathOfExistingPart(absolutePath: string): string {
  let existing = absolutePath;
  const rest: string[] = [];
  for (;;) {
    try {
      return path.join(realpathSync(existing), ...rest);
    } catch {
      const parent = path.dirname(existing);
      if (parent === existing) return absolutePath;
      rest.unshift(path.basename(existing));
      existing = parent;
    }
  }
}

function sinceError(message: string, hint: string): InputError {
  return { file: '', line: 0, column: 0, message: `--since: ${message}`, hint };
}
