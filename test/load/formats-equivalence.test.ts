// The same Northvale components in Turtle, RDF/XML and JSON-LD: the same graph, the same findings, each placed in its own file.
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Parser } from 'n3';
import { isomorphic } from 'rdf-isomorphic';
import { describe, expect, it } from 'vitest';
import { check } from '../../src/check.js';
import { loadSources } from '../../src/load/sources.js';
import { statementsAsQuads } from './w3c-manifest.js';

const FOLDER = fileURLToPath(new URL('../../fixtures/formats/', import.meta.url));
const CONFIG = `${FOLDER}isapart.yaml`;
const FILES = ['components.ttl', 'components.rdf', 'components.jsonld'] as const;
const NAMESPACES: Record<string, string> = {
  rdf: 'http://www.w3.org/1999/02/22-rdf-syntax-ns#',
  rdfs: 'http://www.w3.org/2000/01/rdf-schema#',
  owl: 'http://www.w3.org/2002/07/owl#',
  nv: 'https://data.northvale-rail.example/def/',
  fleet: 'https://data.northvale-rail.example/fleet/',
};

/** An IRI as prefix:local with the fixtures' prefixes. */
function compact(iri: string): string {
  for (const [prefix, namespace] of Object.entries(NAMESPACES)) if (iri.startsWith(namespace)) return `${prefix}:${iri.slice(namespace.length)}`;
  return iri;
}

/** The text of a file from a 1-based line and column on. */
function textFrom(text: string, line: number, column: number): string {
  const lines = text.split('\n');
  return [lines[line - 1].slice(column - 1), ...lines.slice(line)].join('\n');
}

/** Runs the whole check on one file of the fixture folder, with the folder's config. */
function checkFile(name: string) {
  return check({ paths: [name], cwd: FOLDER, configFile: CONFIG });
}

describe('one hierarchy in Turtle, RDF/XML and JSON-LD', () => {
  it('is one graph: each file gives statements isomorphic to what n3 reads from the Turtle', async () => {
    // Reference: n3's own parser on the Turtle file (the library the Turtle loader is built on).
    const reference = new Parser({ baseIRI: NAMESPACES.nv }).parse(readFileSync(`${FOLDER}components.ttl`, 'utf8'));
    expect(reference.length).toBe(24);
    for (const name of FILES) {
      const loaded = await loadSources([name], { cwd: FOLDER });
      expect(loaded.errors, name).toEqual([]);
      expect(loaded.sources[0].errors, name).toEqual([]);
      const quads = statementsAsQuads(loaded.sources[0].statements);
      expect(quads.length, name).toBe(reference.length);
      expect(isomorphic(quads, reference), name).toBe(true);
    }
  });

  it('gives the same findings, by rule and fingerprint, in every syntax', async () => {
    const findingsOf = async (name: string) =>
      (await checkFile(name)).findings.map((finding) => `${finding.ruleId} ${finding.fingerprint}`).sort();
    const turtle = await findingsOf('components.ttl');
    // The three mistakes the fixture was written with: a redundant subclass link, a kind-and-part clash, an orphan.
    expect(turtle.map((entry) => entry.split(' ')[0])).toEqual(['kind-and-part', 'orphan-class', 'redundant-subclass']);
    expect(await findingsOf('components.rdf')).toEqual(turtle);
    expect(await findingsOf('components.jsonld')).toEqual(turtle);
  });

  it('places RDF/XML evidence at the property element of the statement, or the node element of a type', async () => {
    const text = readFileSync(`${FOLDER}components.rdf`, 'utf8');
    const result = await checkFile('components.rdf');
    const evidence = result.findings.flatMap((finding) => finding.evidence);
    expect(evidence.length).toBe(6);
    for (const statement of evidence) {
      const tag = /^<([\w:]+)([^>]*)>/.exec(textFrom(text, statement.position.line, statement.position.column));
      expect(tag, JSON.stringify(statement.position)).not.toBeNull();
      const [, name, attributes] = tag as RegExpExecArray;
      if (statement.predicate === `${NAMESPACES.rdf}type`) {
        expect(name).toBe(compact(statement.object as string));
        expect(attributes).toContain(`rdf:about="${compact(statement.subject).replace(/^nv:/, '')}"`);
      } else {
        expect(name).toBe(compact(statement.predicate));
      }
    }
  });

  it('places JSON-LD evidence at the { of the node object whose @id is the subject', async () => {
    const text = readFileSync(`${FOLDER}components.jsonld`, 'utf8');
    const result = await checkFile('components.jsonld');
    const evidence = result.findings.flatMap((finding) => finding.evidence);
    expect(evidence.length).toBe(6);
    for (const statement of evidence) {
      const from = textFrom(text, statement.position.line, statement.position.column);
      expect(from.startsWith('{'), JSON.stringify(statement.position)).toBe(true);
      expect(firstId(from)).toBe(compact(statement.subject));
    }
  });

  it('places Turtle evidence at the subject of the statement', async () => {
    const text = readFileSync(`${FOLDER}components.ttl`, 'utf8');
    const result = await checkFile('components.ttl');
    for (const statement of result.findings.flatMap((finding) => finding.evidence)) {
      expect(textFrom(text, statement.position.line, statement.position.column).startsWith(compact(statement.subject))).toBe(true);
    }
  });
});

/** The @id of the JSON object a text starts with. */
function firstId(text: string): string | undefined {
  let depth = 0;
  for (let index = 0; index < text.length; index++) {
    if (text[index] === '{') depth++;
    else if (text[index] === '}' && --depth === 0) return (JSON.parse(text.slice(0, index + 1)) as { '@id'?: string })['@id'];
  }
  return undefined;
}
