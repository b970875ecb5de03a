// A deterministic workspace for the language server benchmark: one class hierarchy spread over many Turtle files.
// Invented data in the Northvale Rail namespace: it stands in for a modeller's project, it is not a fact of the trade.
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { randomSource } from '../random-source.js';

/** The namespace of the generated classes and assets. */
export const WORKSPACE_NAMESPACE = 'https://data.northvale-rail.example/bench-lsp/';

/** What was written: the files (absolute paths) and how many statements they hold in all. */
export interface GeneratedWorkspace {
  files: string[];
  statements: number;
}

const PREFIXES = `@prefix rdf: <http://www.w3.org/1999/02/22-rdf-syntax-ns#> .
@prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .
@prefix owl: <http://www.w3.org/2002/07/owl#> .
@prefix dcterms: <http://purl.org/dc/terms/> .
@prefix c: <${WORKSPACE_NAMESPACE}class/> .
@prefix a: <${WORKSPACE_NAMESPACE}asset/> .

`;

/**
 * Writes `fileCount` Turtle files under `folder` holding about `statements` statements, and an
 * isapart.yaml. Class i has one or two superclasses of lower number, often in another file, so the
 * hierarchy spans the files; some classes are part of another, most have an instance.
 */
export function writeWorkspace(folder: string, statements: number, fileCount: number): GeneratedWorkspace {
  mkdirSync(folder, { recursive: true });
  writeFileSync(path.join(folder, 'isapart.yaml'), `scope: [${WORKSPACE_NAMESPACE}]\nroots: [${WORKSPACE_NAMESPACE}class/C0]\n`);
  const random = randomSource(5);
  const perFile = Math.ceil(statements / fileCount);
  const files: string[] = [];
  let written = 0;
  let nextClass = 0;
  for (let fileIndex = 0; fileIndex < fileCount; fileIndex++) {
    const blocks: string[] = [];
    let inFile = 0;
    while (inFile < perFile && written + inFile < statements) {
      const id = nextClass++;
      const lines = [`c:C${id} a owl:Class`, `rdfs:label "Asset class ${id}"`];
      if (id > 0) lines.push(`rdfs:subClassOf c:C${Math.floor(random() * id)}`);
      if (id > 10 && random() < 0.3) lines.push(`rdfs:subClassOf c:C${Math.floor(random() * id)}`);
      if (id > 10 && random() < 0.03) lines.push(`dcterms:isPartOf c:C${Math.floor(random() * id)}`);
      blocks.push(`${lines.join(' ;\n  ')} .`);
      inFile += lines.length;
      if (random() < 0.5) {
        blocks.push(`a:A${id} a c:C${id} ;\n  rdfs:label "Asset ${id}" .`);
        inFile += 2;
      }
    }
    written += inFile;
    const file = path.join(folder, `assets-${String(fileIndex).padStart(2, '0')}.ttl`);
    writeFileSync(file, `${PREFIXES}${blocks.join('\n')}\n`);
    files.push(file);
  }
  return { files, statements: written };
}
