// The server's view of the workspace: one LintFolder per workspace folder, debounced lints, and what was published where.
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { Diagnostic } from 'vscode-languageserver';
import type { CheckResult } from '../check.js';
import { CONFIG_FILE_NAME } from '../config/load-config.js';
import { formatFromExtension } from '../load/format.js';
import { diagnosticsByFile } from './diagnostics.js';
import type { DocumentText } from './document-text.js';
import { LintFolder, type LintCounters } from './lint-folder.js';

/** How long the server waits after the last change before it lints, by default. */
export const DEFAULT_LINT_DELAY_MS = 60;

/** What the workspace tells the editor: diagnostics per document, and messages for its log. */
export interface WorkspaceOutput {
  publish(uri: string, diagnostics: Diagnostic[], version: number | undefined): void;
  log(message: string): void;
}

/** The kind of a change to a file on disk, as LSP's FileChangeType numbers it. */
export type DiskChange = 'created' | 'changed' | 'deleted';

/**
 * Every folder the editor opened, linted as a whole: a hierarchy spans files, so a change to one
 * file re-lints its folder (only that file is parsed again). Work on disk and lints run one after
 * another, in order of arrival.
 */
export class LintWorkspace {
  readonly counters: LintCounters = { parses: 0, lints: 0 };
  private folders: LintFolder[] = [];
  /** Folders for open documents outside every workspace folder: the document's own folder, buffers only. */
  private readonly looseFolders = new Map<string, LintFolder>();
  private readonly results = new Map<LintFolder, CheckResult>();
  private readonly published = new Map<LintFolder, Set<string>>();
  private readonly timers = new Map<LintFolder, NodeJS.Timeout>();
  /** The URI and version of each open document, by absolute path. */
  private readonly open = new Map<string, { uri: string; version: number; text: string }>();
  /** The version of each open document the last lint of its folder saw, by URI. */
  private readonly lintedVersions = new Map<string, number>();
  private queue: Promise<void> = Promise.resolve();

  constructor(
    private readonly output: WorkspaceOutput,
    private readonly lintDelayMs: number = DEFAULT_LINT_DELAY_MS,
  ) {}

  /**
   * Adds workspace folders (absolute paths), reads their files and lints them. The folders are known
   * at once, so a buffer opened while their files are still being read is linted with them.
   */
  addFolders(roots: string[]): Promise<void> {
    const added = roots.filter((root) => !this.folders.some((folder) => folder.root === root)).map((root) => new LintFolder(root, this.counters));
    this.folders.push(...added);
    // Buffers opened outside every folder that now lie inside one move into it.
    for (const [file, loose] of [...this.looseFolders]) {
      const folder = added.find((candidate) => candidate.contains(file));
      if (folder === undefined) continue;
      this.clearPublished(loose);
      this.looseFolders.delete(file);
      const open = this.open.get(file);
      if (open !== undefined) folder.setBuffer(file, open.text);
    }
    return this.enqueue(async () => {
      for (const folder of added) {
        await folder.loadAll();
        this.lintNow(folder);
      }
    });
  }

  /** Removes workspace folders; their documents' diagnostics are cleared, and their open buffers are linted on their own. */
  removeFolders(roots: string[]): Promise<void> {
    const removed = this.folders.filter((folder) => roots.includes(folder.root));
    this.folders = this.folders.filter((folder) => !roots.includes(folder.root));
    for (const folder of removed) {
      clearTimeout(this.timers.get(folder));
      this.timers.delete(folder);
      this.clearPublished(folder);
      this.results.delete(folder);
    }
    for (const [file, open] of this.open) {
      if (removed.some((folder) => folder.contains(file))) this.changeBuffer(open.uri, open.version, open.text);
    }
    return this.enqueue(async () => undefined);
  }

  /** An editor buffer opened or changed: it replaces the file until closed; its folder lints after a pause. */
  changeBuffer(uri: string, version: number, text: string): void {
    const file = fileOfUri(uri);
    if (file === undefined) return;
    this.open.set(file, { uri, version, text });
    const folder = this.folderOf(file, true) as LintFolder;
    folder.setBuffer(file, text);
    this.schedule(folder);
  }

  /** An editor buffer closed: the file on disk (if any) counts again. */
  closeBuffer(uri: string): void {
    const file = fileOfUri(uri);
    if (file === undefined) return;
    this.open.delete(file);
    this.lintedVersions.delete(uri);
    const folder = this.folderOf(file, false);
    if (folder === undefined) return;
    folder.closeBuffer(file);
    if (this.looseFolders.get(file) === folder) {
      this.looseFolders.delete(file);
      this.clearPublished(folder);
      return;
    }
    this.schedule(folder);
  }

  /** Files created, changed or deleted on disk: RDF files are read again, config and rule files re-lint, other paths rescan. */
  changeOnDisk(changes: { uri: string; change: DiskChange }[]): Promise<void> {
    return this.enqueue(async () => {
      const touched = new Set<LintFolder>();
      for (const { uri, change } of changes) {
        const file = fileOfUri(uri);
        if (file === undefined) continue;
        for (const folder of this.folders) {
          if (!folder.contains(file) && !isSettingsFile(file)) continue;
          touched.add(folder);
          if (formatFromExtension(file) !== undefined) {
            if (change === 'deleted') folder.removeFile(file);
            else if (!folder.walks(file)) continue;
            else await folder.reloadFile(file);
          } else if (!isSettingsFile(file) && folder.contains(file)) {
            // A folder created or deleted, or a file renamed: read the folder's listing again.
            await folder.loadAll();
          }
        }
      }
      for (const folder of touched) this.lintNow(folder);
    });
  }

  /** The last lint's result and the folder holding a file, if any lint has covered it. */
  resultFor(uri: string): { result: CheckResult; folder: LintFolder; file: string } | undefined {
    const file = fileOfUri(uri);
    if (file === undefined) return undefined;
    const folder = this.folderOf(file, false);
    const result = folder === undefined ? undefined : this.results.get(folder);
    return folder === undefined || result === undefined ? undefined : { result, folder, file };
  }

  /** Whether the last lint saw this version of a document's buffer (so edits computed on its text fit the editor's). */
  isLintedVersion(uri: string, version: number): boolean {
    return this.lintedVersions.get(uri) === version;
  }

  /** The version of an open document by URI, or null when it is not open. */
  versionOf(uri: string): number | null {
    const file = fileOfUri(uri);
    return file === undefined ? null : (this.open.get(file)?.version ?? null);
  }

  /** The URI to publish a file under: the one the editor opened it with, else its `file:` URL. */
  uriOf(file: string): string {
    return this.open.get(file)?.uri ?? pathToFileURL(file).href;
  }

  /** Resolves once every piece of work queued so far (disk reads, lints) is done. */
  settled(): Promise<void> {
    return this.queue;
  }

  private enqueue(work: () => Promise<void>): Promise<void> {
    const run = this.queue.then(work).catch((error: unknown) => {
      this.output.log(`isapart: internal error: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}`);
    });
    this.queue = run;
    return run;
  }

  private schedule(folder: LintFolder): void {
    clearTimeout(this.timers.get(folder));
    this.timers.set(
      folder,
      setTimeout(() => {
        this.timers.delete(folder);
        void this.enqueue(async () => this.lintNow(folder));
      }, this.lintDelayMs),
    );
  }

  /** Lints a folder and publishes to every file it holds or a diagnostic points into; files left with none get an empty list. */
  private async lintNow(folder: LintFolder): Promise<void> {
    if (!this.folders.includes(folder) && ![...this.looseFolders.values()].includes(folder)) return;
    const versions = new Map<string, number>();
    for (const [file, { uri, version }] of this.open) if (folder.contains(file) || this.looseFolders.get(file) === folder) versions.set(uri, version);
    const result = await folder.lint();
    this.results.set(folder, result);
    for (const failure of result.context.ruleFailures) this.output.log(`isapart: rule ${failure.ruleId} failed: ${failure.message}`);
    const textOf = (file: string): DocumentText | undefined => folder.textOf(file);
    const byFile = diagnosticsByFile(result, { textOf, uriOf: (file) => this.uriOf(file) });
    const targets = new Set([...folder.files(), ...byFile.keys()]);
    const before = this.published.get(folder) ?? new Set<string>();
    for (const file of before) targets.add(file);
    const held = new Set(folder.files());
    const now = new Set<string>();
    for (const file of targets) {
      const diagnostics = byFile.get(file) ?? [];
      const uri = this.uriOf(file);
      const version = versions.get(uri);
      if (version !== undefined) this.lintedVersions.set(uri, version);
      if (diagnostics.length > 0 || before.has(file) || held.has(file)) this.output.publish(uri, diagnostics, version);
      if (diagnostics.length > 0) now.add(file);
    }
    this.published.set(folder, now);
  }

  private clearPublished(folder: LintFolder): void {
    for (const file of this.published.get(folder) ?? []) this.output.publish(this.uriOf(file), [], undefined);
    this.published.delete(folder);
  }

  /** The folder a file belongs to: the innermost workspace folder holding it, else (when asked) a loose one of its own. */
  private folderOf(file: string, create: boolean): LintFolder | undefined {
    const holding = this.folders.filter((folder) => folder.contains(file)).sort((a, b) => b.root.length - a.root.length);
    if (holding.length > 0) return holding[0];
    const loose = this.looseFolders.get(file);
    if (loose !== undefined || !create) return loose;
    const folder = new LintFolder(path.dirname(file), this.counters);
    this.looseFolders.set(file, folder);
    return folder;
  }
}

/** Whether a file is a config file or a YAML file that may be a rule file, which changes what every lint does. */
function isSettingsFile(file: string): boolean {
  const name = path.basename(file);
  return name === CONFIG_FILE_NAME || name.endsWith('.yaml') || name.endsWith('.yml');
}

/** The absolute path of a `file:` URI; undefined for other schemes (an unsaved buffer), which are not linted. */
export function fileOfUri(uri: string): string | undefined {
  if (!uri.startsWith('file:')) return undefined;
  try {
    return path.resolve(fileURLToPath(uri));
  } catch {
    return undefined;
  }
}
