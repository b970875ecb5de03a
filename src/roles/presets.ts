// The built-in presets: which predicate IRIs play which role, and which node flags they switch on.
import { KNOWN_PRESETS } from '../config/config.js';
import type { Role } from './role.js';
import {
  DCTERMS_HAS_PART,
  DCTERMS_IS_PART_OF,
  ISO_THES_BROADER_PARTITIVE,
  ISO_THES_NARROWER_PARTITIVE,
  OBO_HAS_PART,
  OBO_PART_OF,
  OWL_CLASS,
  OWL_DISJOINT_WITH,
  OWL_EQUIVALENT_CLASS,
  RDF_TYPE,
  RDFS_CLASS,
  RDFS_DATATYPE,
  RDFS_SUBCLASS_OF,
  SCHEMA_HAS_PART,
  SCHEMA_HTTP_HAS_PART,
  SCHEMA_HTTP_IS_PART_OF,
  SCHEMA_IS_PART_OF,
  SKOS_BROADER,
  SKOS_NARROWER,
} from './vocabulary.js';

/** The name of a built-in preset. */
export type PresetName = (typeof KNOWN_PRESETS)[number];

/** One predicate a preset maps: its IRI, its role, and whether it points the role's way or back. */
export interface PresetPredicate {
  iri: string;
  role: Role;
  inverse: boolean;
}

/** A built-in preset: predicate mappings plus the node-flag vocabulary it reads. */
export interface Preset {
  name: PresetName;
  /** One line for `isapart rules` and the starter config. */
  summary: string;
  predicates: readonly PresetPredicate[];
  /** Objects of rdf:type that make the subject a declared class. */
  classTypes: readonly string[];
  /** Whether `owl:deprecated true` marks a term deprecated. */
  readsDeprecated: boolean;
  /** Whether `owl:AllDisjointClasses` axioms with `owl:members` lists are read as disjoint-with. */
  readsAllDisjointClasses: boolean;
}

function forward(iri: string, role: Role): PresetPredicate {
  return { iri, role, inverse: false };
}

function backward(iri: string, role: Role): PresetPredicate {
  return { iri, role, inverse: true };
}

const NO_FLAGS = { classTypes: [], readsDeprecated: false, readsAllDisjointClasses: false } as const;

/** Every built-in preset by name, as in design.md's Roles table. */
export const PRESETS: Readonly<Record<PresetName, Preset>> = Object.freeze({
  rdfs: {
    name: 'rdfs',
    summary: 'RDF Schema 1.1: rdf:type, rdfs:subClassOf; rdfs:Class and rdfs:Datatype declare classes',
    predicates: [forward(RDF_TYPE, 'instance-of'), forward(RDFS_SUBCLASS_OF, 'subclass-of')],
    classTypes: [RDFS_CLASS, RDFS_DATATYPE],
    readsDeprecated: false,
    readsAllDisjointClasses: false,
  },
  owl: {
    name: 'owl',
    summary: 'OWL 2: owl:disjointWith, owl:AllDisjointClasses, owl:equivalentClass, owl:deprecated; owl:Class declares classes',
    predicates: [forward(OWL_DISJOINT_WITH, 'disjoint-with'), forward(OWL_EQUIVALENT_CLASS, 'equivalent-to')],
    classTypes: [OWL_CLASS],
    readsDeprecated: true,
    readsAllDisjointClasses: true,
  },
  dcterms: {
    name: 'dcterms',
    summary: 'DCMI Metadata Terms: dcterms:isPartOf, and dcterms:hasPart read backwards',
    predicates: [forward(DCTERMS_IS_PART_OF, 'part-of'), backward(DCTERMS_HAS_PART, 'part-of')],
    ...NO_FLAGS,
  },
  schema: {
    name: 'schema',
    summary: 'schema.org: schema:isPartOf, and schema:hasPart read backwards (https and http forms)',
    // schema.org publishes its terms under both https://schema.org/ and http://schema.org/, and data
    // in the wild uses both (common practice), so each property is mapped in both forms.
    predicates: [
      forward(SCHEMA_IS_PART_OF, 'part-of'),
      backward(SCHEMA_HAS_PART, 'part-of'),
      forward(SCHEMA_HTTP_IS_PART_OF, 'part-of'),
      backward(SCHEMA_HTTP_HAS_PART, 'part-of'),
    ],
    ...NO_FLAGS,
  },
  obo: {
    name: 'obo',
    summary: 'OBO Relations Ontology: part of (BFO_0000050), and has part (BFO_0000051) read backwards',
    predicates: [forward(OBO_PART_OF, 'part-of'), backward(OBO_HAS_PART, 'part-of')],
    ...NO_FLAGS,
  },
  skos: {
    name: 'skos',
    summary: 'SKOS (opt-in): skos:broader as subclass-of, iso-thes:broaderPartitive as part-of, narrower forms read backwards',
    predicates: [
      forward(SKOS_BROADER, 'subclass-of'),
      backward(SKOS_NARROWER, 'subclass-of'),
      forward(ISO_THES_BROADER_PARTITIVE, 'part-of'),
      backward(ISO_THES_NARROWER_PARTITIVE, 'part-of'),
    ],
    ...NO_FLAGS,
  },
});

/** Whether a name is a built-in preset. */
export function isPresetName(name: string): name is PresetName {
  return Object.prototype.hasOwnProperty.call(PRESETS, name);
}

/** The preset of a name, or undefined when isapart has no such preset. */
export function presetByName(name: string): Preset | undefined {
  return isPresetName(name) ? PRESETS[name] : undefined;
}
