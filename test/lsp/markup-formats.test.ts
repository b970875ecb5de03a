// RDF/XML and JSON-LD documents in the workspace: linted with the others, edited as buffers, placed at their elements.
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { temporaryTree } from '../load/temp-tree.js';
import { startServer, uriOf, type ServerSession } from './lsp-client.js';

const VEHICLES = `@prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .
@prefix nv: <https://data.northvale-rail.example/def/> .
nv:RollingStock rdfs:subClassOf nv:Asset .
nv:Wagon rdfs:subClassOf nv:RollingStock .
`;

/** RDF/XML of the RDF 1.1 XML Syntax: one node element with a property element per statement. */
function freightXml(extraSuperclass: string): string {
  return `<?xml version="1.0"?>
<rdf:RDF xmlns:rdf="http://www.w3.org/1999/02/22-rdf-syntax-ns#"
         xmlns:rdfs="http://www.w3.org/2000/01/rdf-schema#">
  <rdf:Description rdf:about="https://data.northvale-rail.example/def/FreightWagon">
    <rdfs:subClassOf rdf:resource="https://data.northvale-rail.example/def/Wagon"/>
  </rdf:Description>
  <rdf:Description rdf:about="https://data.northvale-rail.example/def/RollingStock">
    <rdfs:subClassOf rdf:resource="https://data.northvale-rail.example/def/${extraSuperclass}"/>
  </rdf:Description>
</rdf:RDF>
`;
}

/** JSON-LD 1.1 with an inline context: one node object. */
const TANK_JSONLD = `{
  "@context": { "rdfs": "http://www.w3.org/2000/01/rdf-schema#", "nv": "https://data.northvale-rail.example/def/" },
  "@id": "nv:TankWagon",
  "rdfs:subClassOf": { "@id": "nv:FreightWagon" }
}
`;

const CONFIG = `scope: [https://data.northvale-rail.example/]
roots: [https://data.northvale-rail.example/def/Asset]
`;

describe('isapart lsp with RDF/XML and JSON-LD documents', () => {
  const tree = temporaryTree('isapart-lsp-markup-');
  let session: ServerSession;
  const xmlUri = uriOf(path.join(tree.root, 'freight.rdf'));
  const jsonUri = uriOf(path.join(tree.root, 'tank.jsonld'));
  const turtleUri = uriOf(path.join(tree.root, 'vehicles.ttl'));

  beforeAll(async () => {
    tree.write('isapart.yaml', CONFIG);
    tree.write('vehicles.ttl', VEHICLES);
    tree.write('freight.rdf', freightXml('Asset'));
    tree.write('tank.jsonld', TANK_JSONLD);
    session = await startServer({ folders: [tree.root], initializationOptions: { lintDelayMs: 20 } });
    // RollingStock ⊑ Asset is stated in two files, which is one edge: the workspace starts without findings.
    await session.waitFor(xmlUri, (params) => params.diagnostics.length === 0, 'an empty list');
  });

  afterAll(async () => {
    expect(await session.close()).toBe(0);
  });

  it('shows a cycle closed in an RDF/XML buffer in all three files, at the property element', async () => {
    let freight = session.open(xmlUri, freightXml('Asset'));
    // TankWagon ⊑ FreightWagon ⊑ Wagon ⊑ RollingStock; RollingStock ⊑ TankWagon closes the cycle.
    freight = session.replace(freight, freightXml('TankWagon'));
    const here = await session.waitFor(
      xmlUri,
      (params) => params.version === freight.version && params.diagnostics.some((d) => d.code === 'subclass-cycle'),
      'a subclass-cycle',
    );
    await session.waitFor(jsonUri, (params) => params.diagnostics.some((d) => d.code === 'subclass-cycle'), 'a subclass-cycle');
    await session.waitFor(turtleUri, (params) => params.diagnostics.some((d) => d.code === 'subclass-cycle'), 'a subclass-cycle');
    const cycle = here.diagnostics.find((d) => d.code === 'subclass-cycle')!;
    // The first statement of the cycle in this file is FreightWagon ⊑ Wagon, the property element on line 5 (0-based 4).
    expect(cycle.range.start.line).toBe(4);
    expect(new Set(cycle.relatedInformation!.map((info) => info.location.uri))).toEqual(new Set([xmlUri, jsonUri, turtleUri]));

    freight = session.replace(freight, freightXml('Asset'));
    await session.waitFor(xmlUri, (params) => params.version === freight.version && !params.diagnostics.some((d) => d.code === 'subclass-cycle'), 'no cycle');
  });

  it('reports malformed XML typed into the buffer as one syntax error at the mismatched end tag', async () => {
    let freight = session.open(xmlUri, freightXml('Asset'));
    freight = session.replace(freight, freightXml('Asset').replace('</rdf:Description>\n  <rdf:Description', '</rdf:Descr>\n  <rdf:Description'));
    const broken = await session.waitFor(xmlUri, (params) => params.version === freight.version && params.diagnostics.some((d) => d.code === 'input-error'), 'a syntax error');
    const syntax = broken.diagnostics.filter((d) => d.code === 'input-error');
    expect(syntax).toHaveLength(1);
    expect(syntax[0].range.start.line).toBe(5);
  });
});
