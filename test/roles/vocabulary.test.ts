// Checks the vocabulary constants against the published RDF and RDFS vocabularies (test/standards/w3c-rdf-schema).
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Parser, type Quad } from 'n3';
import { describe, expect, it } from 'vitest';
import * as vocabulary from '../../src/roles/vocabulary.js';

const STANDARDS = fileURLToPath(new URL('../standards/w3c-rdf-schema/', import.meta.url));
const RDF_TYPE_IRI = 'http://www.w3.org/1999/02/22-rdf-syntax-ns#type';
const RDFS_SUBCLASS_OF_IRI = 'http://www.w3.org/2000/01/rdf-schema#subClassOf';

/** Statements and prefixes of one published vocabulary file, read with n3's own parser. */
function readVocabulary(name: string): { quads: Quad[]; prefixes: Record<string, string> } {
  const prefixes: Record<string, string> = {};
  const quads = new Parser().parse(readFileSync(`${STANDARDS}${name}`, 'utf8'), null, (prefix, iri) => {
    prefixes[prefix] = typeof iri === 'string' ? iri : iri.value;
  });
  return { quads, prefixes };
}

const rdf = readVocabulary('rdf.ttl');
const rdfs = readVocabulary('rdfs.ttl');
const published = [...rdf.quads, ...rdfs.quads];
const definedTerms = new Set(published.filter((quad) => quad.predicate.value === RDF_TYPE_IRI).map((quad) => quad.subject.value));

const exported: [string, string][] = Object.entries(vocabulary as Record<string, unknown>).flatMap(([name, value]) =>
  typeof value === 'string' ? [[name, value] as [string, string]] : [],
);
const rdfAndRdfsTerms = exported.filter(
  ([name, iri]) => !name.endsWith('_NAMESPACE') && (iri.startsWith(vocabulary.RDF_NAMESPACE) || iri.startsWith(vocabulary.RDFS_NAMESPACE)),
);

describe('rdf: and rdfs: terms of src/roles/vocabulary.ts', () => {
  it('names the terms isapart reads (so the check below is not empty)', () => {
    expect(rdfAndRdfsTerms.map(([name]) => name).sort()).toEqual(
      ['RDF_FIRST', 'RDF_NIL', 'RDF_REST', 'RDF_TYPE', 'RDFS_CLASS', 'RDFS_DATATYPE', 'RDFS_LABEL', 'RDFS_SUBCLASS_OF'].sort(),
    );
  });

  // Source: W3C rdf-schema repository ns/rdf.ttl and ns/rdfs.ttl — each term is the subject of an rdf:type statement there.
  it.each(rdfAndRdfsTerms)('%s is defined in the published rdf.ttl or rdfs.ttl', (_name, iri) => {
    expect(definedTerms.has(iri)).toBe(true);
  });

  // Source: rdf.ttl and rdfs.ttl each describe their namespace IRI as an owl:Ontology.
  it('uses the namespace IRIs the published files describe as ontologies', () => {
    const ontologies = published
      .filter((quad) => quad.predicate.value === RDF_TYPE_IRI && quad.object.value === `${vocabulary.OWL_NAMESPACE}Ontology`)
      .map((quad) => quad.subject.value);
    expect(ontologies).toContain(vocabulary.RDF_NAMESPACE);
    expect(ontologies).toContain(vocabulary.RDFS_NAMESPACE);
  });

  // Source: rdf.ttl declares the prefixes rdf:, rdfs: and owl: it uses.
  it('agrees with the prefixes rdf.ttl declares for rdf:, rdfs: and owl:', () => {
    expect(rdf.prefixes.rdf).toBe(vocabulary.RDF_NAMESPACE);
    expect(rdf.prefixes.rdfs).toBe(vocabulary.RDFS_NAMESPACE);
    expect(rdf.prefixes.owl).toBe(vocabulary.OWL_NAMESPACE);
  });

  // Source: rdfs.ttl states rdfs:Datatype rdfs:subClassOf rdfs:Class, which is why the rdfs preset
  // counts rdf:type rdfs:Datatype as declaring a class (RDF Schema 1.1 section 2.4, from memory).
  it('rdfs:Datatype is a subclass of rdfs:Class in rdfs.ttl', () => {
    const stated = rdfs.quads.some(
      (quad) => quad.subject.value === vocabulary.RDFS_DATATYPE && quad.predicate.value === RDFS_SUBCLASS_OF_IRI && quad.object.value === vocabulary.RDFS_CLASS,
    );
    expect(stated).toBe(true);
  });

  // Source: rdf.ttl states rdf:nil a rdf:List, and rdf:first / rdf:rest as properties of lists.
  it('rdf:nil is an rdf:List in rdf.ttl', () => {
    const stated = rdf.quads.some(
      (quad) => quad.subject.value === vocabulary.RDF_NIL && quad.predicate.value === RDF_TYPE_IRI && quad.object.value === `${vocabulary.RDF_NAMESPACE}List`,
    );
    expect(stated).toBe(true);
  });
});

describe('namespaces of the other vocabularies', () => {
  it('end in `#` or `/` so that a term is the namespace plus a local name (common practice)', () => {
    for (const [name, iri] of exported.filter(([exportName]) => exportName.endsWith('_NAMESPACE'))) {
      expect(`${name} ${iri}`).toMatch(/[#/]$/);
    }
  });

  it('keep out-of-scope namespaces for RDF, RDFS, OWL, XSD and SKOS only (design.md "Roles")', () => {
    expect(vocabulary.BUILT_IN_VOCABULARY_NAMESPACES).toEqual([
      'http://www.w3.org/1999/02/22-rdf-syntax-ns#',
      'http://www.w3.org/2000/01/rdf-schema#',
      'http://www.w3.org/2002/07/owl#',
      // XSD and SKOS namespace IRIs: from memory.
      'http://www.w3.org/2001/XMLSchema#',
      'http://www.w3.org/2004/02/skos/core#',
    ]);
  });
});
