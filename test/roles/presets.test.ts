// Specification of the built-in presets: which predicate IRIs each maps, to which role, which way.
import { describe, expect, it } from 'vitest';
import { DEFAULT_PRESETS, KNOWN_PRESETS } from '../../src/config/config.js';
import { isPresetName, PRESETS, presetByName } from '../../src/roles/presets.js';

/** A preset's mappings as `IRI -> role[ inverse]` lines, for readable expectations. */
function mappingLines(name: string): string[] {
  return (presetByName(name)?.predicates ?? []).map((p) => `${p.iri} -> ${p.role}${p.inverse ? ' inverse' : ''}`);
}

describe('presets', () => {
  it('are exactly the known presets of the config contract', () => {
    expect(Object.keys(PRESETS).sort()).toEqual([...KNOWN_PRESETS].sort());
    expect(isPresetName('skos')).toBe(true);
    expect(isPresetName('toString')).toBe(false);
    expect(presetByName('rdf')).toBeUndefined();
  });

  it('default to rdfs, owl, dcterms, schema, obo; skos is opt-in (design.md "Roles")', () => {
    expect([...DEFAULT_PRESETS]).toEqual(['rdfs', 'owl', 'dcterms', 'schema', 'obo']);
  });

  // Source: RDF Schema 1.1 (rdf:type, rdfs:subClassOf, rdfs:Class, rdfs:Datatype); IRIs checked in vocabulary.test.ts.
  it('rdfs maps rdf:type to instance-of and rdfs:subClassOf to subclass-of; rdfs:Class and rdfs:Datatype declare classes', () => {
    expect(mappingLines('rdfs')).toEqual([
      'http://www.w3.org/1999/02/22-rdf-syntax-ns#type -> instance-of',
      'http://www.w3.org/2000/01/rdf-schema#subClassOf -> subclass-of',
    ]);
    expect(PRESETS.rdfs.classTypes).toEqual(['http://www.w3.org/2000/01/rdf-schema#Class', 'http://www.w3.org/2000/01/rdf-schema#Datatype']);
    expect(PRESETS.rdfs.readsDeprecated).toBe(false);
    expect(PRESETS.rdfs.readsAllDisjointClasses).toBe(false);
  });

  // Source: OWL 2 Web Ontology Language Mapping to RDF Graphs (owl:disjointWith, owl:equivalentClass,
  // owl:AllDisjointClasses, owl:deprecated, owl:Class); IRIs from memory.
  it('owl maps disjointWith and equivalentClass, reads deprecated and AllDisjointClasses; owl:Class declares classes', () => {
    expect(mappingLines('owl')).toEqual([
      'http://www.w3.org/2002/07/owl#disjointWith -> disjoint-with',
      'http://www.w3.org/2002/07/owl#equivalentClass -> equivalent-to',
    ]);
    expect(PRESETS.owl.classTypes).toEqual(['http://www.w3.org/2002/07/owl#Class']);
    expect(PRESETS.owl.readsDeprecated).toBe(true);
    expect(PRESETS.owl.readsAllDisjointClasses).toBe(true);
  });

  // Source: DCMI Metadata Terms (dcterms:isPartOf, dcterms:hasPart); IRIs from memory.
  it('dcterms maps isPartOf to part-of and hasPart to inverse part-of', () => {
    expect(mappingLines('dcterms')).toEqual(['http://purl.org/dc/terms/isPartOf -> part-of', 'http://purl.org/dc/terms/hasPart -> part-of inverse']);
  });

  // Source: schema.org (isPartOf, hasPart), published under https and http (common practice); IRIs from memory.
  it('schema maps isPartOf and inverse hasPart in both the https and the http form', () => {
    expect(mappingLines('schema').sort()).toEqual(
      [
        'https://schema.org/isPartOf -> part-of',
        'https://schema.org/hasPart -> part-of inverse',
        'http://schema.org/isPartOf -> part-of',
        'http://schema.org/hasPart -> part-of inverse',
      ].sort(),
    );
  });

  // Source: OBO Relations Ontology, "part of" BFO_0000050 and "has part" BFO_0000051; IRIs from memory.
  it('obo maps part of (BFO_0000050) and inverse has part (BFO_0000051)', () => {
    expect(mappingLines('obo')).toEqual([
      'http://purl.obolibrary.org/obo/BFO_0000050 -> part-of',
      'http://purl.obolibrary.org/obo/BFO_0000051 -> part-of inverse',
    ]);
  });

  // Source: SKOS Reference (skos:broader, skos:narrower) and ISO 25964 SKOS extension
  // (iso-thes:broaderPartitive, narrowerPartitive); IRIs from memory.
  it('skos maps broader to subclass-of, broaderPartitive to part-of, and the narrower forms inverse', () => {
    expect(mappingLines('skos')).toEqual([
      'http://www.w3.org/2004/02/skos/core#broader -> subclass-of',
      'http://www.w3.org/2004/02/skos/core#narrower -> subclass-of inverse',
      'http://purl.org/iso25964/skos-thes#broaderPartitive -> part-of',
      'http://purl.org/iso25964/skos-thes#narrowerPartitive -> part-of inverse',
    ]);
  });

  it('switch on node flags only in the rdfs and owl presets (design.md "Roles")', () => {
    for (const name of ['dcterms', 'schema', 'obo', 'skos'] as const) {
      expect(PRESETS[name].classTypes).toEqual([]);
      expect(PRESETS[name].readsDeprecated).toBe(false);
      expect(PRESETS[name].readsAllDisjointClasses).toBe(false);
    }
  });

  it('never map one predicate twice across all presets', () => {
    const all = Object.values(PRESETS).flatMap((preset) => preset.predicates.map((predicate) => predicate.iri));
    expect(new Set(all).size).toBe(all.length);
  });
});
