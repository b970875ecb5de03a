// A buffer the editor opens while the server is still reading the workspace is linted as the buffer, with the workspace.
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { temporaryTree } from '../load/temp-tree.js';
import { startServer, uriOf, type ServerSession } from './lsp-client.js';

const PREFIXES = '@prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .\n@prefix nv: <https://data.northvale-rail.example/def/> .\n';

describe('isapart lsp at startup', () => {
  const tree = temporaryTree('isapart-lsp-startup-');
  let session: ServerSession;

  afterAll(async () => {
    expect(await session.close()).toBe(0);
  });

  it('lints a buffer opened at once with the folder, the buffer standing for its file', async () => {
    tree.write('isapart.yaml', 'scope: [https://data.northvale-rail.example/]\nroots: [https://data.northvale-rail.example/def/Asset]\n');
    // Many files, so that reading them takes a while after initialize.
    for (let index = 0; index < 40; index++) tree.write(`part-${index}.ttl`, `${PREFIXES}nv:Part${index} rdfs:subClassOf nv:Asset .\n`);
    // On disk the signal is an orphan; the buffer gives it its superclass, stated in another file of the folder.
    tree.write('signals.ttl', `${PREFIXES}nv:Signal rdfs:subClassOf nv:Part7 .\n`);
    const uri = uriOf(path.join(tree.root, 'signals.ttl'));
    session = await startServer({ folders: [tree.root], initializationOptions: { lintDelayMs: 10 } });
    const document = session.open(uri, `${PREFIXES}nv:Signal rdfs:subClassOf nv:Part7 .\nnv:MainSignal rdfs:subClassOf nv:Signal, nv:Part7 .\n`);
    const linted = await session.waitFor(uri, (params) => params.version === document.version, 'the buffer linted');
    // The redundant link is in the buffer only, and Part7's superclass is in another file: both were in the lint.
    expect(linted.diagnostics.map((d) => d.code)).toEqual(['redundant-subclass']);
    // Every later publish for the document keeps the buffer's findings (none falls back to the file on disk).
    await session.connection.sendRequest('isapart/heap');
    const later = session.published.filter((params) => params.uri === uri && session.published.indexOf(params) > session.published.indexOf(linted));
    for (const params of later) expect(params.diagnostics.map((d) => d.code)).toEqual(['redundant-subclass']);
  });
});
