// Writes a generated Northvale Rail hierarchy with many planted problems into a temporary folder, for large-report tests.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';

export const NV = 'https://data.northvale-rail.example/def/';
export const ASSET = `${NV}Asset`;

/** The findings each generated group plants, by rule. */
export const PLANTED_PER_GROUP = { 'subclass-cycle': 1, 'kind-and-part': 1, 'redundant-subclass': 1, 'orphan-class': 1 } as const;

/**
 * Writes `groups` groups of classes spread over `files` Turtle files. Each group plants a subclass
 * cycle of three classes, a cab that is both a kind of and a part of its car, a redundant direct
 * superclass, and a declared class with no superclass; everything else hangs under nv:Asset.
 */
export function writePlantedGraph(groups: number, files: number): { folder: string; paths: string[] } {
  const folder = mkdtempSync(path.join(tmpdir(), 'isapart-html-large-'));
  const chunks: string[][] = Array.from({ length: files }, () => []);
  for (let group = 0; group < groups; group++) {
    chunks[group % files].push(
      [
        `nv:Vehicle${group} rdfs:subClassOf nv:RailVehicle${group} ; rdfs:label "Vehicle ${group}" .`,
        `nv:RailVehicle${group} rdfs:subClassOf nv:Stock${group} .`,
        `nv:Stock${group} rdfs:subClassOf nv:Vehicle${group} .`,
        `nv:Car${group} rdfs:subClassOf nv:Asset ; rdfs:label "Car ${group}" .`,
        `nv:Cab${group} rdfs:subClassOf nv:Car${group} ; dcterms:isPartOf nv:Car${group} .`,
        `nv:Equipment${group} rdfs:subClassOf nv:Asset .`,
        `nv:Motor${group} rdfs:subClassOf nv:Equipment${group}, nv:Asset .`,
        `nv:Loose${group} a owl:Class ; rdfs:label "Loose class ${group}" .`,
      ].join('\n'),
    );
  }
  const header = [
    '@prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .',
    '@prefix owl: <http://www.w3.org/2002/07/owl#> .',
    '@prefix dcterms: <http://purl.org/dc/terms/> .',
    `@prefix nv: <${NV}> .`,
    'nv:Asset a owl:Class .',
  ].join('\n');
  const paths = chunks.map((chunk, index) => {
    const file = path.join(folder, `stock-${String(index).padStart(2, '0')}.ttl`);
    writeFileSync(file, `${header}\n${chunk.join('\n')}\n`);
    return file;
  });
  return { folder, paths };
}
