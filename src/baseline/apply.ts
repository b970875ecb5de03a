// Putting a run beside its baseline: a baseline file or the same paths at a git revision.
import path from 'node:path';
import type { CheckOptions, CheckResult } from '../check.js';
import type { Finding } from '../engine/finding.js';
import type { InputError } from '../load/statement.js';
import { readBaselineFile } from './baseline-file.js';
import { compareWithBaseline } from './compare.js';
import { resolveRevision } from './git-revision.js';
import { lintAtRevision } from './lint-at-revision.js';

/** Where the baseline comes from: an earlier JSON or SARIF report, or a git revision to lint. */
export type BaselineSource = { file: string } | { revision: string };

/** A baseline read and ready to compare with, or the error that kept it from being read. */
export type PreparedBaseline = { prepared: (result: CheckResult) => Promise<CheckResult | { error: InputError }> } | { error: InputError };

/**
 * Reads what can be checked before the lint (the baseline file, or that the revision exists), so
 * a wrong baseline fails fast; the returned step then compares a run's findings with it. With a
 * revision, the same paths are linted at that revision with the run's config.
 */
export async function prepareBaseline(source: BaselineSource, options: CheckOptions): Promise<PreparedBaseline> {
  const cwd = options.cwd ?? process.cwd();
  if ('file' in source) {
    const read = await readBaselineFile(path.resolve(cwd, source.file), source.file);
    if ('error' in read) return read;
    return { prepared: async (result) => compared(result, read.findings, source.file, []) };
  }
  const resolved = await resolveRevision(cwd, source.revision);
  if ('error' in resolved) return resolved;
  return {
    prepared: async (result) => {
      const earlier = await lintAtRevision(options, source.revision, result.context.configFile);
      if ('error' in earlier) return earlier;
      const label = `git revision ${source.revision} (${earlier.revision.commit.slice(0, 12)})`;
      return compared(result, earlier.result.findings, label, baseRunWarnings(earlier.result, source.revision));
    },
  };
}

/** The run with its findings compared and the baseline named in its context. */
function compared(result: CheckResult, baseline: Finding[], label: string, warnings: InputError[]): CheckResult {
  return {
    ...result,
    findings: compareWithBaseline(result.findings, baseline),
    context: { ...result.context, baseline: { source: label }, inputWarnings: [...result.context.inputWarnings, ...warnings] },
  };
}

/** A warning when the lint at the revision had input errors: what it could not read counts as new now. */
function baseRunWarnings(base: CheckResult, revision: string): InputError[] {
  const errors = base.context.inputErrors;
  if (errors.length === 0) return [];
  const first = errors[0];
  return [
    {
      file: first.file,
      line: first.line,
      column: first.column,
      message: `at ${revision}, ${errors.length === 1 ? 'one input error' : `${errors.length} input errors`} kept the baseline from being complete (first: ${first.message}); findings it missed count as new`,
      hint: `run isapart check on a checkout of ${revision} to see its errors; they do not change this run's exit code`,
    },
  ];
}
