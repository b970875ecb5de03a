// 1,000 rapid random edits, garbage included: the server answers throughout, never exits, and its heap stays bounded.
import { cpSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { TextDocument } from 'vscode-languageserver-textdocument';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { HeapReport } from '../../src/lsp/server.js';
import { startServer, uriOf, type ServerSession } from './lsp-client.js';
import { randomSource } from '../random-source.js';

const repositoryRoot = path.resolve(fileURLToPath(import.meta.url), '../../..');
const EDITS = 1000;

// Pieces a typist or a bad paste might insert: Turtle fragments, stray punctuation, astral and control characters.
const PIECES = [
  'nv:', ' a ', ' ;', ' .', ',', '<', '>', '"', '"""', '[', ']', '(', ')', '{', '}', '@prefix', '#', '\n', '\r\n', '\t',
  'rdfs:subClassOf nv:Asset', 'dcterms:isPartOf', '_:b', '^^', '@en', '\u{1F686}', '\u{1D4AF}', '\uD800', '\u0000', 'é', '\\u00e9', '# isapart-allow orphan-class: x',
];

describe('isapart lsp under rapid random edits', () => {
  let session: ServerSession;
  let folder: string;
  let original: string;
  let uri: string;

  beforeAll(async () => {
    folder = mkdtempSync(path.join(tmpdir(), 'isapart-lsp-robust-'));
    cpSync(path.join(repositoryRoot, 'fixtures/demo'), folder, { recursive: true });
    uri = uriOf(path.join(folder, 'components.ttl'));
    original = readFileSync(path.join(folder, 'components.ttl'), 'utf8');
    // --expose-gc lets isapart/heap collect garbage before it measures, so the two readings compare live memory.
    session = await startServer({ folders: [folder], nodeFlags: ['--expose-gc'] });
  });

  afterAll(async () => {
    expect(await session.close()).toBe(0);
  });

  it('answers hovers and code actions throughout, does not exit, and keeps its heap within 2× of the first lint', async () => {
    let document: TextDocument = session.open(uri, original);
    const first = await session.waitFor(uri, (params) => params.version === 1, 'the first lint');
    const firstDiagnostics = first.diagnostics.map((d) => [d.code, d.range.start.line, d.range.start.character]);
    const heapAfterFirst = (await session.connection.sendRequest('isapart/heap')) as HeapReport;
    expect(heapAfterFirst.collected).toBe(true);

    const random = randomSource(20261201);
    let answered = 0;
    for (let step = 0; step < EDITS; step++) {
      const text = document.getText();
      const start = document.positionAt(Math.floor(random() * (text.length + 1)));
      const choice = random();
      if (choice < 0.45) {
        document = session.edit(document, { range: { start, end: start }, newText: PIECES[Math.floor(random() * PIECES.length)] });
      } else if (choice < 0.85) {
        const endOffset = Math.min(text.length, document.offsetAt(start) + Math.floor(random() * 40));
        document = session.edit(document, { range: { start, end: document.positionAt(endOffset) }, newText: '' });
      } else if (choice < 0.97) {
        const line = Math.floor(random() * document.lineCount);
        document = session.edit(document, { range: { start: { line, character: 0 }, end: { line: line + 1, character: 0 } }, newText: `${PIECES[Math.floor(random() * PIECES.length)]}\n` });
      } else {
        // Now and then the whole buffer is replaced by garbage or by the original again.
        document = session.replace(document, random() < 0.5 ? original : String.fromCharCode(...Array.from({ length: 200 }, () => Math.floor(random() * 0x3000))));
      }
      if (step % 50 === 49) {
        // Requests in the middle of the stream must be answered (a hover may be null; an answer is what counts).
        const position = document.positionAt(Math.floor(random() * (document.getText().length + 1)));
        await session.hover(uri, position.line, position.character);
        const known = session.latest.get(uri)?.diagnostics ?? [];
        const actions = await session.codeActions(uri, known.slice(0, 5));
        expect(Array.isArray(actions)).toBe(true);
        answered += 2;
        // A pause longer than the server's lint delay (60 ms) lets a lint of the mangled text run between bursts.
        await new Promise((resolve) => setTimeout(resolve, 100));
      }
    }
    expect(answered).toBe((EDITS / 50) * 2);
    expect(session.child.exitCode).toBeNull();

    document = session.replace(document, original);
    const restored = await session.waitFor(uri, (params) => params.version === document.version, 'the restored text linted');
    expect(restored.diagnostics.map((d) => [d.code, d.range.start.line, d.range.start.character])).toEqual(firstDiagnostics);

    const heapAfterRun = (await session.connection.sendRequest('isapart/heap')) as HeapReport;
    // Every change was handled: more than one lint ran, and buffers were parsed at lint time only, not per edit.
    // About one lint per pause; a loaded machine may merge a few, so the bound is loose.
    expect(heapAfterRun.lints - heapAfterFirst.lints).toBeGreaterThanOrEqual(5);
    expect(heapAfterRun.parses).toBeLessThan(heapAfterFirst.parses + EDITS);
    expect(heapAfterRun.heapUsed).toBeLessThan(2 * heapAfterFirst.heapUsed);
    expect(session.stderr()).not.toMatch(/internal error/);
    console.log(
      `robustness: heap after first lint ${(heapAfterFirst.heapUsed / 2 ** 20).toFixed(1)} MiB, after ${EDITS} edits ${(heapAfterRun.heapUsed / 2 ** 20).toFixed(1)} MiB; ` +
        `${heapAfterRun.lints - heapAfterFirst.lints} lints, ${heapAfterRun.parses - heapAfterFirst.parses} parses`,
    );
  });
});
