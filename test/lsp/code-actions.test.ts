// Quick fixes: each returned workspace edit, applied to the buffer, makes its finding go from the next diagnostics.
import path from 'node:path';
import { TextDocument } from 'vscode-languageserver-textdocument';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { temporaryTree } from '../load/temp-tree.js';
import { editsFor, startServer, uriOf, urisOf, type ServerSession } from './lsp-client.js';

const PREFIXES = [
  '@prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .',
  '@prefix nv: <https://data.northvale-rail.example/def/> .',
  '',
].join('\n');

// TractionMotor ⊑ Component is stated directly and implied through ElectricalEquipment: redundant-subclass,
// whose rule file names the direct statement as safe to remove. The Pantograph is a kind of and a part of the Roof.
const COMPONENTS = `${PREFIXES}nv:Component rdfs:subClassOf nv:Asset .
nv:ElectricalEquipment rdfs:subClassOf nv:Component .
nv:TractionMotor rdfs:subClassOf nv:ElectricalEquipment .
nv:TractionMotor rdfs:subClassOf nv:Component .
nv:Roof rdfs:subClassOf nv:Component .
nv:Pantograph rdfs:subClassOf nv:Roof ;
  <https://data.northvale-rail.example/def/partOf> nv:Roof .
nv:Bogie rdfs:subClassOf nv:Component .  # isapart-allow orphan-class: Bogie had no superclass once
`;

const CONFIG = `scope: [https://data.northvale-rail.example/]
roots: [https://data.northvale-rail.example/def/Asset]
roles:
  part-of: [https://data.northvale-rail.example/def/partOf]
`;

describe('isapart lsp code actions', () => {
  const tree = temporaryTree('isapart-lsp-actions-');
  const uri = uriOf(path.join(tree.root, 'components.ttl'));

  beforeAll(() => {
    tree.write('isapart.yaml', CONFIG);
    tree.write('components.ttl', COMPONENTS);
  });

  for (const documentChanges of [false, true]) {
    describe(documentChanges ? 'with versioned document changes' : 'with plain changes', () => {
      let session: ServerSession;
      let document: TextDocument;

      beforeAll(async () => {
        session = await startServer({ folders: [tree.root], initializationOptions: { lintDelayMs: 10 }, documentChanges });
        document = session.open(uri, COMPONENTS);
        await session.waitFor(uri, (params) => params.version === 1 && params.diagnostics.length >= 3, 'three findings');
      });

      afterAll(async () => {
        expect(await session.close()).toBe(0);
      });

      /** Asks for the quick fixes of the diagnostic with the code, applies the one whose title matches, and returns the next diagnostics. */
      async function applyFix(code: string, title: RegExp) {
        const current = session.latest.get(uri)!;
        const diagnostic = current.diagnostics.find((candidate) => candidate.code === code)!;
        expect(diagnostic, code).toBeDefined();
        const actions = await session.codeActions(uri, [diagnostic]);
        const action = actions.find((candidate) => title.test(candidate.title));
        expect(action, `${actions.map((candidate) => candidate.title).join(' | ')}`).toBeDefined();
        expect(action!.kind).toBe('quickfix');
        expect(urisOf(action!.edit!)).toEqual([uri]);
        if (documentChanges) expect(action!.edit!.documentChanges).toBeDefined();
        const edited = TextDocument.applyEdits(document, editsFor(action!.edit!, uri));
        document = session.replace(document, edited);
        const version = document.version;
        return session.waitFor(uri, (params) => params.version === version, `the diagnostics of version ${version}`);
      }

      it('removes the redundant statement, and the finding is gone', async () => {
        const next = await applyFix('redundant-subclass', /^Remove the statement nv:TractionMotor rdfs:subClassOf nv:Component$/);
        expect(next.diagnostics.map((d) => d.code)).not.toContain('redundant-subclass');
        expect(document.getText()).not.toContain('nv:TractionMotor rdfs:subClassOf nv:Component .');
        expect(document.getText()).toContain('nv:TractionMotor rdfs:subClassOf nv:ElectricalEquipment .');
      });

      it('inserts an allow comment above the statement, which allows the finding once its reason is written', async () => {
        const next = await applyFix('kind-and-part', /^Allow kind-and-part here/);
        const lines = document.getText().split('\n');
        const comment = lines.findIndex((line) => line.includes('# isapart-allow kind-and-part: '));
        // Alone on the line above the part-of statement's object line, with that line's indentation.
        expect(lines[comment]).toBe('  # isapart-allow kind-and-part: ');
        expect(lines[comment + 1]).toContain('partOf> nv:Roof .');
        // The comment has no reason yet: the loader reports that at the comment, and the finding stays until one is written.
        expect(next.diagnostics.map((d) => d.code)).toContain('kind-and-part');
        const malformed = next.diagnostics.find((d) => d.code === 'input-error');
        expect(malformed?.message).toMatch(/reason after ":" is empty/);
        expect(malformed?.range.start.line).toBe(comment);

        document = session.replace(document, document.getText().replace('# isapart-allow kind-and-part: ', '# isapart-allow kind-and-part: the roof kit is sold as one unit'));
        const version = document.version;
        const reasoned = await session.waitFor(uri, (params) => params.version === version, 'the reasoned comment linted');
        expect(reasoned.diagnostics.map((d) => d.code)).not.toContain('input-error');
        expect(reasoned.diagnostics.map((d) => d.code)).not.toContain('kind-and-part');
      });

      it('removes an allow comment that allows nothing', async () => {
        const unused = session.latest.get(uri)!.diagnostics.find((d) => d.code === 'unused-allow');
        // LSP 3.17 DiagnosticTag.Unnecessary is 1.
        expect(unused?.tags).toEqual([1]);
        const next = await applyFix('unused-allow', /^Remove the unused isapart-allow comment$/);
        expect(next.diagnostics.map((d) => d.code)).not.toContain('unused-allow');
        expect(document.getText()).toContain('nv:Bogie rdfs:subClassOf nv:Component .\n');
      });
    });
  }

  describe('on a buffer changed since the last lint', () => {
    let session: ServerSession;

    beforeAll(async () => {
      // A long pause, so the change below is certainly not linted when the request arrives.
      session = await startServer({ folders: [tree.root], initializationOptions: { lintDelayMs: 1500 } });
    });

    afterAll(async () => {
      expect(await session.close()).toBe(0);
    });

    it('offers nothing, since its edits would be computed on text the editor no longer has', async () => {
      let document = session.open(uri, COMPONENTS);
      const first = await session.waitFor(uri, (params) => params.version === 1 && params.diagnostics.length > 0, 'findings');
      const diagnostic = first.diagnostics.find((d) => d.code === 'redundant-subclass')!;
      expect(await session.codeActions(uri, [diagnostic])).not.toEqual([]);
      document = session.replace(document, `${COMPONENTS}\n`);
      expect(await session.codeActions(uri, [diagnostic])).toEqual([]);
      const version = document.version;
      await session.waitFor(uri, (params) => params.version === version, 'the change linted');
      const linted = session.latest.get(uri)!.diagnostics.find((d) => d.code === 'redundant-subclass')!;
      expect(await session.codeActions(uri, [linted])).not.toEqual([]);
    });
  });

  describe('across files', () => {
    const crossTree = temporaryTree('isapart-lsp-actions-cross-');
    let session: ServerSession;

    beforeAll(async () => {
      crossTree.write('isapart.yaml', CONFIG);
      // The redundant direct statement is in motors.ttl; the longer way round goes through equipment.ttl.
      crossTree.write('equipment.ttl', `${PREFIXES}nv:Component rdfs:subClassOf nv:Asset .\nnv:ElectricalEquipment rdfs:subClassOf nv:Component .\n`);
      crossTree.write('motors.ttl', `${PREFIXES}nv:TractionMotor rdfs:subClassOf nv:ElectricalEquipment .\nnv:TractionMotor rdfs:subClassOf nv:Component .\n`);
      session = await startServer({ folders: [crossTree.root], initializationOptions: { lintDelayMs: 10 } });
    });

    afterAll(async () => {
      expect(await session.close()).toBe(0);
    });

    it('offers, from the other file of the finding, the removal in the file that holds the statement', async () => {
      const motors = uriOf(path.join(crossTree.root, 'motors.ttl'));
      const equipment = uriOf(path.join(crossTree.root, 'equipment.ttl'));
      const published = await session.waitFor(equipment, (params) => params.diagnostics.some((d) => d.code === 'redundant-subclass'), 'redundant-subclass');
      const diagnostic = published.diagnostics.find((d) => d.code === 'redundant-subclass')!;
      const actions = await session.codeActions(equipment, [diagnostic]);
      const removal = actions.find((action) => action.title.startsWith('Remove the statement'));
      expect(removal).toBeDefined();
      expect(urisOf(removal!.edit!)).toEqual([motors]);
      // Line 3 (0-based) of motors.ttl, with its line break.
      expect(editsFor(removal!.edit!, motors)).toEqual([{ range: { start: { line: 3, character: 0 }, end: { line: 4, character: 0 } }, newText: '' }]);
      // The allow comment goes where the diagnostic is: above the finding's statement in equipment.ttl.
      const allow = actions.find((action) => action.title.startsWith('Allow'));
      expect(urisOf(allow!.edit!)).toEqual([equipment]);
    });
  });
});
