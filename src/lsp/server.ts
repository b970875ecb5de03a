// The language server: LSP 3.17 over a pair of streams, linting the workspace as `isapart check` would.
import { pathToFileURL } from 'node:url';
import {
  createConnection,
  FileChangeType,
  DidChangeWatchedFilesNotification,
  TextDocumentSyncKind,
  TextDocuments,
  type CodeAction,
  type Connection,
  type Diagnostic,
  type Hover,
  type InitializeResult,
} from 'vscode-languageserver/node.js';
import { TextDocument } from 'vscode-languageserver-textdocument';
import { RDF_EXTENSIONS } from '../load/format.js';
import { defaultBaseIri } from '../load/parse.js';
import { toolVersion } from '../version.js';
import { quickFixes, toCodeAction } from './code-actions.js';
import type { FindingData } from './diagnostics.js';
import { hoverMarkdown } from './hover.js';
import { termAt } from './term-at.js';
import { DEFAULT_LINT_DELAY_MS, fileOfUri, LintWorkspace, type DiskChange } from './workspace.js';

/** The custom request that reports the server's memory and work counters (see README, "Editors"). */
export const HEAP_REQUEST = 'isapart/heap';

/** What `isapart/heap` answers: `process.memoryUsage()` in bytes (after a full collection when node runs with --expose-gc), and counters. */
export interface HeapReport {
  heapUsed: number;
  heapTotal: number;
  rss: number;
  /** Whether a garbage collection ran first (node started with --expose-gc). */
  collected: boolean;
  /** Documents parsed so far. */
  parses: number;
  /** Lints run so far. */
  lints: number;
}

/** Options the client may pass in `initializationOptions`. */
export interface InitializationOptions {
  /** Milliseconds of quiet after a change before the workspace is linted again. */
  lintDelayMs?: number;
}

/** Starts the server on the streams (stdin and stdout for `isapart lsp`); it runs until the client says exit. */
export function startLanguageServer(input: NodeJS.ReadableStream, output: NodeJS.WritableStream): Connection {
  const connection = createConnection(input, output);
  if (output === process.stdout) {
    // Standard output carries the protocol: anything logged there would break it, so it goes to the client's log.
    console.log = (...values: unknown[]) => connection.console.log(values.map(String).join(' '));
    console.info = console.log;
  }
  const documents = new TextDocuments(TextDocument);
  let workspace: LintWorkspace | undefined;
  let roots: string[] = [];
  let versionedEdits = false;
  let watchFilesDynamically = false;
  let watchFolders = false;

  const editor = {
    publish: (uri: string, diagnostics: Diagnostic[], version: number | undefined) =>
      void connection.sendDiagnostics({ uri, diagnostics, ...(version === undefined ? {} : { version }) }),
    log: (message: string) => connection.console.error(message),
  };

  connection.onInitialize((params): InitializeResult => {
    const options = (params.initializationOptions ?? {}) as InitializationOptions;
    const delay = typeof options.lintDelayMs === 'number' && options.lintDelayMs >= 0 ? options.lintDelayMs : DEFAULT_LINT_DELAY_MS;
    workspace = new LintWorkspace(editor, delay);
    const folders = params.workspaceFolders ?? (params.rootUri ? [{ uri: params.rootUri, name: 'root' }] : []);
    roots = folderPaths(folders);
    const capabilities = params.capabilities;
    versionedEdits = capabilities.workspace?.workspaceEdit?.documentChanges === true;
    watchFilesDynamically = capabilities.workspace?.didChangeWatchedFiles?.dynamicRegistration === true;
    watchFolders = capabilities.workspace?.workspaceFolders === true;
    return {
      capabilities: {
        textDocumentSync: TextDocumentSyncKind.Incremental,
        hoverProvider: true,
        codeActionProvider: { codeActionKinds: ['quickfix'] },
        ...(watchFolders ? { workspace: { workspaceFolders: { supported: true, changeNotifications: true } } } : {}),
      },
      serverInfo: { name: 'isapart', version: toolVersion() },
    };
  });

  connection.onInitialized(() => {
    if (watchFilesDynamically) {
      const extensions = RDF_EXTENSIONS.map((extension) => extension.slice(1));
      void connection.client.register(DidChangeWatchedFilesNotification.type, {
        watchers: [{ globPattern: `**/*.{${extensions.join(',')}}` }, { globPattern: `**/*.{${extensions.join(',')}}.gz` }, { globPattern: '**/*.{yaml,yml}' }],
      });
    }
    if (watchFolders) {
      connection.workspace.onDidChangeWorkspaceFolders((event) => {
        void workspace?.removeFolders(folderPaths(event.removed));
        void workspace?.addFolders(folderPaths(event.added));
      });
    }
    void workspace?.addFolders(roots);
  });

  documents.onDidChangeContent((event) => workspace?.changeBuffer(event.document.uri, event.document.version, event.document.getText()));
  documents.onDidClose((event) => workspace?.closeBuffer(event.document.uri));

  connection.onDidChangeWatchedFiles((params) => {
    const kinds: Record<number, DiskChange> = { [FileChangeType.Created]: 'created', [FileChangeType.Changed]: 'changed', [FileChangeType.Deleted]: 'deleted' };
    void workspace?.changeOnDisk(params.changes.map((change) => ({ uri: change.uri, change: kinds[change.type] ?? 'changed' })));
  });

  connection.onHover((params): Hover | null => {
    const document = documents.get(params.textDocument.uri);
    const linted = workspace?.resultFor(params.textDocument.uri);
    if (document === undefined || linted === undefined) return null;
    const line = document.getText({ start: { line: params.position.line, character: 0 }, end: { line: params.position.line + 1, character: 0 } });
    const prefixes = linted.folder.sourceOf(linted.file)?.prefixes ?? {};
    const term = termAt(line.replace(/\r?\n$/, ''), params.position.character, prefixes, defaultBaseIri(linted.file));
    if (term === undefined) return null;
    const markdown = hoverMarkdown(linted.result.graph, term.iri, linted.result.findings);
    if (markdown === undefined) return null;
    return {
      contents: { kind: 'markdown', value: markdown },
      range: { start: { line: params.position.line, character: term.start }, end: { line: params.position.line, character: term.end } },
    };
  });

  connection.onCodeAction((params): CodeAction[] => {
    const uri = params.textDocument.uri;
    const linted = workspace?.resultFor(uri);
    if (workspace === undefined || linted === undefined) return [];
    // Edits are computed on the text the last lint saw; for a buffer changed since, wait for the next lint.
    const document = documents.get(uri);
    if (document !== undefined && !workspace.isLintedVersion(uri, document.version)) return [];
    const files = {
      textOf: (file: string) => linted.folder.textOf(file),
      formatOf: (file: string) => linted.folder.sourceOf(file)?.format,
      baseIriOf: (file: string) => pathToFileURL(file).href,
      uriOf: (file: string) => workspace!.uriOf(file),
    };
    const actions: CodeAction[] = [];
    for (const diagnostic of params.context.diagnostics) {
      const data = diagnostic.data as Partial<FindingData> | undefined;
      if (typeof data?.fingerprint !== 'string') continue;
      const finding = linted.result.findings.find((candidate) => candidate.fingerprint === data.fingerprint && !candidate.suppression);
      if (finding === undefined) continue;
      for (const fix of quickFixes(finding, linted.file, files, linted.result.context.prefixes ?? {})) {
        actions.push(toCodeAction(fix, diagnostic, (target) => workspace!.versionOf(target), versionedEdits));
      }
    }
    return actions;
  });

  connection.onRequest(HEAP_REQUEST, async (): Promise<HeapReport> => {
    await workspace?.settled();
    const gc = (globalThis as { gc?: () => void }).gc;
    if (gc !== undefined) gc();
    const memory = process.memoryUsage();
    return {
      heapUsed: memory.heapUsed,
      heapTotal: memory.heapTotal,
      rss: memory.rss,
      collected: gc !== undefined,
      parses: workspace?.counters.parses ?? 0,
      lints: workspace?.counters.lints ?? 0,
    };
  });

  documents.listen(connection);
  connection.listen();
  return connection;
}

/** The absolute paths of workspace folders; folders that are not `file:` URIs (a remote file system) are not linted. */
function folderPaths(folders: readonly { uri: string }[]): string[] {
  return folders.flatMap((folder) => {
    const file = fileOfUri(folder.uri);
    return file === undefined ? [] : [file];
  });
}
