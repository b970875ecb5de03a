// A temporary folder for loader tests, with a writer that makes a file's folders as needed.
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/** A fresh temporary folder and a function writing a file below it (folders made as needed). */
export function temporaryTree(prefix: string): { root: string; write(relative: string, content: string | Uint8Array): void } {
  const root = mkdtempSync(join(tmpdir(), prefix));
  return {
    root,
    write(relative, content) {
      const path = join(root, relative);
      mkdirSync(join(path, '..'), { recursive: true });
      writeFileSync(path, content);
    },
  };
}
