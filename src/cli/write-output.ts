// Writes a report file atomically: a temporary file beside it, then a rename.
import { randomBytes } from 'node:crypto';
import { statSync, promises as fs } from 'node:fs';
import path from 'node:path';

/** Writes text to file so that readers see the old content or the whole new one, never a part. */
export async function writeFileAtomically(file: string, text: string): Promise<void> {
  const temporary = path.join(path.dirname(file), `.${path.basename(file)}.${randomBytes(6).toString('hex')}.tmp`);
  try {
    await fs.writeFile(temporary, text, 'utf8');
    await fs.rename(temporary, file);
  } catch (error) {
    await fs.rm(temporary, { force: true });
    throw error;
  }
}

/** Why a report cannot be written to a path, with a hint. */
export interface OutputPathProblem {
  reason: string;
  hint: string;
}

/** Why a report cannot be written to this path (its folder is missing, or it is a folder), or undefined. */
export function outputPathProblem(file: string): OutputPathProblem | undefined {
  const folder = path.dirname(file);
  const folderStat = statSync(folder, { throwIfNoEntry: false });
  if (folderStat === undefined) return { reason: `the folder ${folder} does not exist`, hint: `create it first (mkdir -p ${folder}), or write into an existing folder` };
  if (!folderStat.isDirectory()) return { reason: `${folder} is a file, not a folder`, hint: 'give a path whose folder part names a folder' };
  if (statSync(file, { throwIfNoEntry: false })?.isDirectory()) {
    return { reason: `${file} is a folder`, hint: `name a file, such as ${path.join(file, 'isapart-report.txt')}` };
  }
  return undefined;
}

/** The reason of a failed write in words, from its error code where it has one. */
export function writeFailureReason(error: unknown): string {
  const code = (error as NodeJS.ErrnoException).code;
  if (code === 'EACCES' || code === 'EPERM') return 'permission to write there is denied';
  if (code === 'ENOSPC') return 'the disk is full';
  if (code === 'EROFS') return 'the file system is read-only';
  return error instanceof Error ? error.message : String(error);
}
