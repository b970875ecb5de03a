// Several workspace folders, each linted with its own isapart.yaml, and a document outside all of them.
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { temporaryTree } from '../load/temp-tree.js';
import { startServer, uriOf, type ServerSession } from './lsp-client.js';

const TEXT = `@prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .
@prefix nv: <https://data.northvale-rail.example/def/> .
nv:Turnout rdfs:subClassOf nv:TrackAsset .
`;

describe('isapart lsp with several folders', () => {
  const tree = temporaryTree('isapart-lsp-roots-');
  let session: ServerSession;

  beforeAll(async () => {
    tree.write('east/isapart.yaml', 'scope: [https://data.northvale-rail.example/]\n');
    tree.write('east/track.ttl', TEXT);
    tree.write('west/isapart.yaml', 'scope: [https://data.northvale-rail.example/]\nrules: { orphan-class: off }\n');
    tree.write('west/track.ttl', TEXT);
    session = await startServer({ folders: [path.join(tree.root, 'east'), path.join(tree.root, 'west')], initializationOptions: { lintDelayMs: 10 } });
  });

  afterAll(async () => {
    expect(await session.close()).toBe(0);
  });

  it('lints each folder with the config found there', async () => {
    const east = await session.waitFor(uriOf(path.join(tree.root, 'east/track.ttl')), () => true, 'diagnostics');
    const west = await session.waitFor(uriOf(path.join(tree.root, 'west/track.ttl')), () => true, 'diagnostics');
    expect(east.diagnostics.map((d) => d.code)).toEqual(['orphan-class']);
    expect(west.diagnostics).toEqual([]);
  });

  it('lints a document outside every folder on its own, and clears it when closed', async () => {
    const uri = uriOf(path.join(tree.root, 'loose.ttl'));
    const document = session.open(uri, TEXT);
    const loose = await session.waitFor(uri, (params) => params.version === document.version, 'the loose document linted');
    // No isapart.yaml above it: every IRI is in scope, and TrackAsset has no superclass.
    expect(loose.diagnostics.map((d) => d.code)).toEqual(['orphan-class']);
    session.connection.sendNotification('textDocument/didClose', { textDocument: { uri } });
    await session.waitFor(uri, (params) => params.diagnostics.length === 0, 'its diagnostics cleared');
  });

  it('drops a folder the editor removes, clearing its diagnostics', async () => {
    const east = uriOf(path.join(tree.root, 'east/track.ttl'));
    session.connection.sendNotification('workspace/didChangeWorkspaceFolders', {
      event: { added: [], removed: [{ uri: uriOf(path.join(tree.root, 'east')), name: 'east' }] },
    });
    await session.waitFor(east, (params) => params.diagnostics.length === 0, 'its diagnostics cleared');
  });
});
