// Config edits, and files created, changed or deleted on disk, are picked up without a restart.
import { rmSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { temporaryTree } from '../load/temp-tree.js';
import { startServer, uriOf, type ServerSession } from './lsp-client.js';

const PREFIXES = [
  '@prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .',
  '@prefix nv: <https://data.northvale-rail.example/def/> .',
  '',
].join('\n');

const CONFIG = `scope: [https://data.northvale-rail.example/]
roots: [https://data.northvale-rail.example/def/Asset]
`;

// LSP 3.17 FileChangeType: Created 1, Changed 2, Deleted 3.
const CREATED = 1;
const CHANGED = 2;
const DELETED = 3;

describe('isapart lsp on changes to the workspace', () => {
  const tree = temporaryTree('isapart-lsp-changes-');
  let session: ServerSession;
  const signalsUri = uriOf(path.join(tree.root, 'signals.ttl'));
  const configUri = uriOf(path.join(tree.root, 'isapart.yaml'));

  const notify = (uri: string, type: number) => session.connection.sendNotification('workspace/didChangeWatchedFiles', { changes: [{ uri, type }] });

  beforeAll(async () => {
    tree.write('isapart.yaml', CONFIG);
    // An orphan: Signal has no superclass and is not the root.
    tree.write('signals.ttl', `${PREFIXES}nv:MainSignal rdfs:subClassOf nv:Signal .\n`);
    session = await startServer({ folders: [tree.root], initializationOptions: { lintDelayMs: 10 } });
    await session.waitFor(signalsUri, (params) => params.diagnostics.some((d) => d.code === 'orphan-class'), 'orphan-class');
  });

  afterAll(async () => {
    expect(await session.close()).toBe(0);
  });

  it('reads a config change: a rule switched off goes, a bad key is an error in isapart.yaml at its line', async () => {
    tree.write('isapart.yaml', `${CONFIG}rules: { orphan-class: off }\n`);
    notify(configUri, CHANGED);
    await session.waitFor(signalsUri, (params) => params.diagnostics.length === 0, 'no orphan-class');

    tree.write('isapart.yaml', `${CONFIG}rules: { orphan-class: off }\nscopes: []\n`);
    notify(configUri, CHANGED);
    const config = await session.waitFor(configUri, (params) => params.diagnostics.some((d) => d.code === 'input-error'), 'a config error');
    const error = config.diagnostics.find((d) => d.code === 'input-error')!;
    // 0-based line 3 is the fourth line, `scopes: []`.
    expect(error.range.start.line).toBe(3);
    expect(error.message).toMatch(/unknown key `scopes`[\s\S]*did you mean `scope`/);

    tree.write('isapart.yaml', CONFIG);
    notify(configUri, CHANGED);
    await session.waitFor(configUri, (params) => !params.diagnostics.some((d) => d.code === 'input-error'), 'the config error cleared');
    await session.waitFor(signalsUri, (params) => params.diagnostics.some((d) => d.code === 'orphan-class'), 'orphan-class back');
  });

  it('reads a file created on disk, and forgets it when deleted', async () => {
    const classesFile = path.join(tree.root, 'sub', 'classes.ttl');
    tree.write('sub/classes.ttl', `${PREFIXES}nv:Signal rdfs:subClassOf nv:Asset .\n`);
    notify(uriOf(classesFile), CREATED);
    // Signal now has its superclass, stated in the new file.
    await session.waitFor(signalsUri, (params) => params.diagnostics.length === 0, 'no orphan-class');

    tree.write('sub/classes.ttl', `${PREFIXES}nv:Signal rdfs:subClassOf nv:Signal .\n`);
    notify(uriOf(classesFile), CHANGED);
    await session.waitFor(uriOf(classesFile), (params) => params.diagnostics.some((d) => d.code === 'subclass-cycle'), 'a self-loop');

    rmSync(path.join(tree.root, 'sub'), { recursive: true });
    // Deleting the folder: the client reports the folder, not each file in it.
    notify(uriOf(path.join(tree.root, 'sub')), DELETED);
    await session.waitFor(uriOf(classesFile), (params) => params.diagnostics.length === 0, 'its diagnostics cleared');
    await session.waitFor(signalsUri, (params) => params.diagnostics.some((d) => d.code === 'orphan-class'), 'orphan-class back');
  });

  it('lets an open buffer stand for a file, and the file on disk again once it is closed', async () => {
    const document = session.open(signalsUri, `${PREFIXES}nv:MainSignal rdfs:subClassOf nv:Asset .\n`);
    await session.waitFor(signalsUri, (params) => params.version === document.version && params.diagnostics.length === 0, 'no orphan in the buffer');
    session.connection.sendNotification('textDocument/didClose', { textDocument: { uri: signalsUri } });
    await session.waitFor(signalsUri, (params) => params.version === undefined && params.diagnostics.some((d) => d.code === 'orphan-class'), 'the disk file again');
  });

  it('skips files in dot-folders and node_modules, as the loader does', async () => {
    tree.write('node_modules/pkg/a.ttl', `${PREFIXES}nv:Signal rdfs:subClassOf nv:Asset .\n`);
    notify(uriOf(path.join(tree.root, 'node_modules/pkg/a.ttl')), CREATED);
    // A change that does lint, to know the one before it was handled (work is done in order of arrival).
    tree.write('signals.ttl', `${PREFIXES}nv:MainSignal rdfs:subClassOf nv:Signal .\n\n`);
    notify(signalsUri, CHANGED);
    const heap = await session.connection.sendRequest('isapart/heap');
    expect((heap as { lints: number }).lints).toBeGreaterThan(0);
    expect(session.latest.get(signalsUri)!.diagnostics.some((d) => d.code === 'orphan-class')).toBe(true);
  });
});
