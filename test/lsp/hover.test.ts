// Hover on a term: its label, superclass chains up to a root (shortest first), what it is part of, its findings.
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { temporaryTree } from '../load/temp-tree.js';
import { startServer, uriOf, type ServerSession } from './lsp-client.js';

const PREFIXES = [
  '@prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .',
  '@prefix dcterms: <http://purl.org/dc/terms/> .',
  '@prefix nv: <https://data.northvale-rail.example/def/> .',
  '',
].join('\n');

// Two ways up from the Pantograph: through CurrentCollector (3 steps to Asset) and through Equipment (4 steps).
const TEXT = `${PREFIXES}nv:Pantograph rdfs:label "Pantograph" ;
  rdfs:subClassOf nv:CurrentCollector, nv:RoofEquipment ;
  dcterms:isPartOf nv:Roof .
nv:CurrentCollector rdfs:subClassOf nv:Component .
nv:RoofEquipment rdfs:subClassOf nv:Equipment .
nv:Equipment rdfs:subClassOf nv:Component .
nv:Component rdfs:subClassOf nv:Asset .
nv:Roof rdfs:subClassOf nv:CarBody .
nv:CarBody rdfs:subClassOf nv:Asset .
nv:Roof dcterms:isPartOf nv:CarBody .
<https://data.northvale-rail.example/def/Loop> rdfs:subClassOf nv:Loop .
`;

describe('isapart lsp hover', () => {
  const tree = temporaryTree('isapart-lsp-hover-');
  const uri = uriOf(path.join(tree.root, 'parts.ttl'));
  let session: ServerSession;
  const lines = TEXT.split('\n');

  beforeAll(async () => {
    tree.write('isapart.yaml', 'scope: [https://data.northvale-rail.example/]\nroots: [https://data.northvale-rail.example/def/Asset]\n');
    tree.write('parts.ttl', TEXT);
    session = await startServer({ folders: [tree.root], initializationOptions: { lintDelayMs: 10 } });
    session.open(uri, TEXT);
    await session.waitFor(uri, (params) => params.version === 1, 'the open buffer linted');
  });

  afterAll(async () => {
    expect(await session.close()).toBe(0);
  });

  it('shows the label, both superclass chains shortest first, and the part-of chain', async () => {
    const line = 3;
    const hover = await session.hover(uri, line, lines[line].indexOf('Pantograph') + 2);
    expect(hover).not.toBeNull();
    const value = (hover!.contents as { value: string }).value;
    expect(value).toContain('**`nv:Pantograph`** — Pantograph');
    expect(value).toContain('<https://data.northvale-rail.example/def/Pantograph>');
    const chains = value.split('\n').filter((text) => text.startsWith('- `nv:Pantograph` → '));
    expect(chains).toEqual([
      '- `nv:Pantograph` → `nv:CurrentCollector` → `nv:Component` → `nv:Asset`',
      '- `nv:Pantograph` → `nv:RoofEquipment` → `nv:Equipment` → `nv:Component` → `nv:Asset`',
      '- `nv:Pantograph` → `nv:Roof` → `nv:CarBody`',
    ]);
    expect(value.indexOf('superclass chains:')).toBeLessThan(value.indexOf('part of:'));
    expect(value.indexOf('part of:')).toBeLessThan(value.indexOf('`nv:Roof` → `nv:CarBody`'));
    // The hover's range is the prefixed name under the cursor.
    expect(hover!.range).toEqual({ start: { line, character: 0 }, end: { line, character: 'nv:Pantograph'.length } });
  });

  it('lists the findings that involve the term, and a cycle it is in', async () => {
    const line = lines.findIndex((text) => text.startsWith('nv:Roof dcterms'));
    const hover = await session.hover(uri, line, 4);
    const value = (hover!.contents as { value: string }).value;
    expect(value).toMatch(/- warning `kind-and-part`: /);

    const loopLine = lines.findIndex((text) => text.startsWith('<https'));
    const loop = await session.hover(uri, loopLine, 10);
    const loopValue = (loop!.contents as { value: string }).value;
    expect(loopValue).toContain('a cycle');
    expect(loopValue).toMatch(/- error `subclass-cycle`: /);
    // An <IRI> term: the hover's range covers it with its angle brackets.
    expect(loop!.range!.start.character).toBe(0);
    expect(loop!.range!.end.character).toBe('<https://data.northvale-rail.example/def/Loop>'.length);
  });

  it('answers null away from a term and for an undeclared prefix', async () => {
    expect(await session.hover(uri, 3, lines[3].length + 5)).toBeNull();
    const text = `${TEXT}undeclared:Thing rdfs:subClassOf nv:Asset .\n`;
    const document = session.replace(session.open(uri, TEXT), text);
    await session.waitFor(uri, (params) => params.version === document.version, 'the change linted');
    expect(await session.hover(uri, text.split('\n').length - 2, 3)).toBeNull();
  });
});
