// A test client for `isapart lsp`: spawns the built server and talks LSP to it through vscode-languageserver-protocol.
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import {
  createProtocolConnection,
  StreamMessageReader,
  StreamMessageWriter,
  type CodeAction,
  type Diagnostic,
  type Hover,
  type ProtocolConnection,
  type PublishDiagnosticsParams,
  type TextEdit,
  type WorkspaceEdit,
} from 'vscode-languageserver-protocol/node.js';
import { TextDocument } from 'vscode-languageserver-textdocument';

const repositoryRoot = path.resolve(fileURLToPath(import.meta.url), '../../..');

/** How long a test waits for the server to publish what it expects before failing. */
const WAIT_MS = 20_000;

/** The built server as a child process with an LSP connection to it, and what it has published. */
export interface ServerSession {
  connection: ProtocolConnection;
  child: ChildProcess;
  /** The latest diagnostics per URI, and the version they were published for. */
  latest: Map<string, PublishDiagnosticsParams>;
  /** Every publish, in order of arrival. */
  published: PublishDiagnosticsParams[];
  /** What the server wrote on standard error. */
  stderr(): string;
  /** Resolves with the diagnostics of a URI once `accept` holds for them (checked on every publish). */
  waitFor(uri: string, accept: (params: PublishDiagnosticsParams) => boolean, what: string): Promise<PublishDiagnosticsParams>;
  /** Opens a document with its text. */
  open(uri: string, text: string, languageId?: string): TextDocument;
  /** Replaces a document's whole text (a full-content change, allowed with incremental sync). */
  replace(document: TextDocument, text: string): TextDocument;
  /** Sends one incremental change of a range. */
  edit(document: TextDocument, edit: TextEdit): TextDocument;
  hover(uri: string, line: number, character: number): Promise<Hover | null>;
  codeActions(uri: string, diagnostics: Diagnostic[]): Promise<CodeAction[]>;
  /** Shutdown and exit; resolves with the exit code. */
  close(): Promise<number | null>;
}

/** Options of `startServer`. */
export interface StartOptions {
  folders: string[];
  initializationOptions?: Record<string, unknown>;
  /** Node flags, e.g. --expose-gc. */
  nodeFlags?: string[];
  /** Whether the client claims versioned document changes in workspace edits. */
  documentChanges?: boolean;
}

/** Spawns `node bin/isapart.js lsp --stdio` (run `npm run build` first) and initializes it with workspace folders. */
export async function startServer(options: StartOptions): Promise<ServerSession> {
  const child = spawn(process.execPath, [...(options.nodeFlags ?? []), path.join(repositoryRoot, 'bin/isapart.js'), 'lsp', '--stdio'], {
    stdio: ['pipe', 'pipe', 'pipe'],
  });
  let stderr = '';
  child.stderr!.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
  const connection = createProtocolConnection(new StreamMessageReader(child.stdout!), new StreamMessageWriter(child.stdin!));
  const latest = new Map<string, PublishDiagnosticsParams>();
  const published: PublishDiagnosticsParams[] = [];
  const waiters: { uri: string; accept: (params: PublishDiagnosticsParams) => boolean; resolve: (params: PublishDiagnosticsParams) => void }[] = [];
  connection.onNotification('textDocument/publishDiagnostics', (params: PublishDiagnosticsParams) => {
    latest.set(params.uri, params);
    published.push(params);
    for (const waiter of [...waiters]) {
      if (waiter.uri === params.uri && waiter.accept(params)) {
        waiters.splice(waiters.indexOf(waiter), 1);
        waiter.resolve(params);
      }
    }
  });
  // The server registers file watchers dynamically; a test client accepts and sends the events itself.
  connection.onRequest('client/registerCapability', () => null);
  connection.onNotification('window/logMessage', () => undefined);
  connection.listen();

  await connection.sendRequest('initialize', {
    processId: process.pid,
    rootUri: null,
    workspaceFolders: options.folders.map((folder) => ({ uri: pathToFileURL(folder).href, name: path.basename(folder) })),
    initializationOptions: options.initializationOptions ?? {},
    capabilities: {
      workspace: {
        workspaceFolders: true,
        didChangeWatchedFiles: { dynamicRegistration: true },
        workspaceEdit: { documentChanges: options.documentChanges ?? false },
      },
      textDocument: { publishDiagnostics: { relatedInformation: true, versionSupport: true } },
    },
  });
  connection.sendNotification('initialized', {});

  const documents = new Map<string, TextDocument>();
  const session: ServerSession = {
    connection,
    child,
    latest,
    published,
    stderr: () => stderr,
    waitFor(uri, accept, what) {
      const known = latest.get(uri);
      if (known !== undefined && accept(known)) return Promise.resolve(known);
      return new Promise((resolve, reject) => {
        const timer = setTimeout(() => {
          const seen = JSON.stringify(latest.get(uri)?.diagnostics.map((d) => [d.code, d.range.start, d.message]) ?? null);
          reject(new Error(`no diagnostics for ${uri} with ${what} within ${WAIT_MS} ms; last seen: ${seen}; stderr: ${stderr}`));
        }, WAIT_MS);
        waiters.push({ uri, accept, resolve: (params) => (clearTimeout(timer), resolve(params)) });
      });
    },
    open(uri, text, languageId = 'turtle') {
      const document = TextDocument.create(uri, languageId, 1, text);
      documents.set(uri, document);
      connection.sendNotification('textDocument/didOpen', { textDocument: { uri, languageId, version: 1, text } });
      return document;
    },
    replace(document, text) {
      const next = TextDocument.update(document, [{ text }], document.version + 1);
      documents.set(document.uri, next);
      connection.sendNotification('textDocument/didChange', { textDocument: { uri: document.uri, version: next.version }, contentChanges: [{ text }] });
      return next;
    },
    edit(document, edit) {
      const next = TextDocument.update(document, [{ range: edit.range, text: edit.newText }], document.version + 1);
      documents.set(document.uri, next);
      connection.sendNotification('textDocument/didChange', {
        textDocument: { uri: document.uri, version: next.version },
        contentChanges: [{ range: edit.range, text: edit.newText }],
      });
      return next;
    },
    hover: (uri, line, character) => connection.sendRequest('textDocument/hover', { textDocument: { uri }, position: { line, character } }),
    codeActions: (uri, diagnostics) =>
      connection.sendRequest('textDocument/codeAction', {
        textDocument: { uri },
        range: diagnostics[0]?.range ?? { start: { line: 0, character: 0 }, end: { line: 0, character: 0 } },
        context: { diagnostics, only: ['quickfix'] },
      }),
    async close() {
      const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
      if (child.exitCode !== null) return child.exitCode;
      await connection.sendRequest('shutdown');
      connection.sendNotification('exit');
      const code = await exited;
      connection.dispose();
      return code;
    },
  };
  return session;
}

/** The text edits of a workspace edit for one URI, from `changes` or `documentChanges`. */
export function editsFor(edit: WorkspaceEdit, uri: string): TextEdit[] {
  if (edit.changes) return edit.changes[uri] ?? [];
  return (edit.documentChanges ?? []).flatMap((change) => ('textDocument' in change && change.textDocument.uri === uri ? change.edits : []));
}

/** The URIs a workspace edit touches. */
export function urisOf(edit: WorkspaceEdit): string[] {
  if (edit.changes) return Object.keys(edit.changes);
  return (edit.documentChanges ?? []).flatMap((change) => ('textDocument' in change ? [change.textDocument.uri] : []));
}

/** A file's `file:` URI, as the server publishes it. */
export function uriOf(file: string): string {
  return pathToFileURL(file).href;
}
