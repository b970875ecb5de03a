// Edits in open buffers: a cycle typed across two files and taken back, a half-typed statement, characters outside the BMP.
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { temporaryTree } from '../load/temp-tree.js';
import { startServer, uriOf, type ServerSession } from './lsp-client.js';

const PREFIXES = [
  '@prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .',
  '@prefix nv: <https://data.northvale-rail.example/def/> .',
  '',
].join('\n');

const VEHICLES = `${PREFIXES}nv:RollingStock rdfs:subClassOf nv:Asset .
nv:Wagon rdfs:subClassOf nv:RollingStock .
`;

const FREIGHT = `${PREFIXES}nv:FreightWagon rdfs:subClassOf nv:Wagon .
nv:TankWagon rdfs:subClassOf nv:FreightWagon .
`;

const CONFIG = `scope: [https://data.northvale-rail.example/]
roots: [https://data.northvale-rail.example/def/Asset]
`;

describe('isapart lsp on edits', () => {
  const tree = temporaryTree('isapart-lsp-edits-');
  let session: ServerSession;
  const vehiclesUri = uriOf(path.join(tree.root, 'vehicles.ttl'));
  const freightUri = uriOf(path.join(tree.root, 'freight.ttl'));

  beforeAll(async () => {
    tree.write('isapart.yaml', CONFIG);
    tree.write('vehicles.ttl', VEHICLES);
    tree.write('freight.ttl', FREIGHT);
    session = await startServer({ folders: [tree.root], initializationOptions: { lintDelayMs: 20 } });
    await session.waitFor(vehiclesUri, (params) => params.diagnostics.length === 0, 'an empty list');
    await session.waitFor(freightUri, (params) => params.diagnostics.length === 0, 'an empty list');
  });

  afterAll(async () => {
    expect(await session.close()).toBe(0);
  });

  it('shows a cycle typed across two files in both, and clears both when it is taken back', async () => {
    let vehicles = session.open(vehiclesUri, VEHICLES);
    // With TankWagon ⊑ FreightWagon ⊑ Wagon ⊑ RollingStock, RollingStock ⊑ TankWagon closes a cycle of four classes.
    const cyclic = VEHICLES.replace('nv:RollingStock rdfs:subClassOf nv:Asset .', 'nv:RollingStock rdfs:subClassOf nv:Asset, nv:TankWagon .');
    vehicles = session.replace(vehicles, cyclic);
    const here = await session.waitFor(
      vehiclesUri,
      (params) => params.version === vehicles.version && params.diagnostics.some((d) => d.code === 'subclass-cycle'),
      'a subclass-cycle',
    );
    const there = await session.waitFor(freightUri, (params) => params.diagnostics.some((d) => d.code === 'subclass-cycle'), 'a subclass-cycle');
    const cycle = here.diagnostics.find((d) => d.code === 'subclass-cycle')!;
    // The cycle has four edges; one diagnostic per file, the other three statements as related information.
    expect(cycle.relatedInformation).toHaveLength(3);
    expect(new Set(cycle.relatedInformation!.map((info) => info.location.uri))).toEqual(new Set([vehiclesUri, freightUri]));
    expect(there.diagnostics.filter((d) => d.code === 'subclass-cycle')).toHaveLength(1);
    expect((there.diagnostics[0].data as { fingerprint: string }).fingerprint).toBe((cycle.data as { fingerprint: string }).fingerprint);

    vehicles = session.replace(vehicles, VEHICLES);
    await session.waitFor(vehiclesUri, (params) => params.version === vehicles.version && params.diagnostics.length === 0, 'an empty list');
    await session.waitFor(freightUri, (params) => params.diagnostics.length === 0, 'an empty list');
  });

  it('reports a statement typed halfway as one syntax error at its place, and keeps the other files linted', async () => {
    let freight = session.open(freightUri, FREIGHT);
    // Plant a finding in the other file first, so "others intact" has something to keep.
    let vehicles = session.replace(session.open(vehiclesUri, VEHICLES), `${VEHICLES}nv:Coach rdfs:subClassOf nv:Asset, nv:RollingStock .\n`);
    await session.waitFor(vehiclesUri, (params) => params.version === vehicles.version && params.diagnostics.some((d) => d.code === 'redundant-subclass'), 'redundant-subclass');

    // Line 5 (0-based 4) is being typed: the object is missing before the end of the file.
    const halfTyped = `${FREIGHT}nv:Flatbed rdfs:subClassOf \n`;
    freight = session.replace(freight, halfTyped);
    const broken = await session.waitFor(freightUri, (params) => params.version === freight.version && params.diagnostics.length > 0, 'a syntax error');
    expect(broken.diagnostics).toHaveLength(1);
    const syntax = broken.diagnostics[0];
    expect(syntax.code).toBe('input-error');
    expect(syntax.severity).toBe(1);
    // n3 reports the unexpected end of input after the last token; the line is the half-typed one or the empty line after it.
    expect([4, 5]).toContain(syntax.range.start.line);
    const afterBreak = session.latest.get(vehiclesUri)!;
    expect(afterBreak.diagnostics.map((d) => d.code)).toContain('redundant-subclass');

    // A mistake in the middle of a line: a stray `]` where the object should be.
    freight = session.replace(freight, `${PREFIXES}nv:FreightWagon rdfs:subClassOf ] .\nnv:TankWagon rdfs:subClassOf nv:FreightWagon .\n`);
    const midLine = await session.waitFor(freightUri, (params) => params.version === freight.version && params.diagnostics.length > 0, 'a syntax error');
    expect(midLine.diagnostics).toHaveLength(1);
    expect(midLine.diagnostics[0].range.start).toEqual({ line: 2, character: 'nv:FreightWagon rdfs:subClassOf '.length });

    freight = session.replace(freight, FREIGHT);
    await session.waitFor(freightUri, (params) => params.version === freight.version && params.diagnostics.length === 0, 'an empty list');
    vehicles = session.replace(vehicles, VEHICLES);
    await session.waitFor(vehiclesUri, (params) => params.version === vehicles.version && params.diagnostics.length === 0, 'an empty list');
  });

  it('counts columns in UTF-16 code units on a line with characters outside the BMP', async () => {
    // U+1F686 TRAIN and U+1D4AF MATHEMATICAL SCRIPT CAPITAL T are two UTF-16 code units each (Unicode, surrogate pairs).
    const label = '"Zug \u{1F686}\u{1F686} Ⓣ \u{1D4AF}"';
    const text = `${PREFIXES}<https://data.northvale-rail.example/def/Z\u{1F686}ug> rdfs:label ${label} . nv:Orphan\u{1D4AF}Class rdfs:subClassOf nv:Thing .\n`;
    let document = session.open(uriOf(path.join(tree.root, 'astral.ttl')), text);
    document = session.replace(document, text);
    const params = await session.waitFor(document.uri, (p) => p.version === document.version && p.diagnostics.some((d) => d.code === 'orphan-class'), 'orphan-class');
    const line = text.split('\n')[2];
    const orphan = params.diagnostics.find((d) => d.code === 'orphan-class' && d.message.includes('Thing'))!;
    expect(orphan).toBeDefined();
    // String.prototype.indexOf counts UTF-16 code units, as LSP's default position encoding does (LSP 3.17, Position).
    const start = line.indexOf('nv:Orphan');
    expect(orphan.range.start).toEqual({ line: 2, character: start });
    expect(orphan.range.end).toEqual({ line: 2, character: line.length });
    expect(start).toBeGreaterThan([...line.slice(0, start)].length);
  });

  it('parses only the changed document again; the other files stay as parsed', async () => {
    type Counters = { parses: number; lints: number };
    const before = (await session.connection.sendRequest('isapart/heap')) as Counters;
    let extra = session.open(uriOf(path.join(tree.root, 'extra.ttl')), `${PREFIXES}nv:Hopper rdfs:subClassOf nv:FreightWagon .\n`);
    await session.waitFor(extra.uri, (params) => params.version === extra.version, 'the new buffer linted');
    extra = session.replace(extra, `${PREFIXES}nv:Hopper rdfs:subClassOf nv:Wagon .\n`);
    await session.waitFor(extra.uri, (params) => params.version === extra.version, 'the change linted');
    const after = (await session.connection.sendRequest('isapart/heap')) as Counters;
    // Two lints of the whole folder (three files and the buffer), one parse each: of the buffer alone.
    expect(after.lints - before.lints).toBe(2);
    expect(after.parses - before.parses).toBe(2);
  });
});
