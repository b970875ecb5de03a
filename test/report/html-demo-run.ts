// The Northvale Rail demo linted once, as `npm run demo` does, for the HTML report tests.
import { fileURLToPath } from 'node:url';
import { check, type CheckResult } from '../../src/check.js';

/** The demo folder on disk. */
export const DEMO_FOLDER = fileURLToPath(new URL('../../fixtures/demo/', import.meta.url));

/** Runs the library entry point on the demo folder, its config found upward. */
export function lintDemo(): Promise<CheckResult> {
  return check({ paths: ['.'], cwd: DEMO_FOLDER });
}
