// Namespace and term IRIs of the open vocabularies isapart reads, as plain string constants.
//
// Sources: rdf: and rdfs: terms are checked against the published `rdf.ttl` and `rdfs.ttl` of the
// W3C rdf-schema repository (RDF 1.1 Concepts, RDF Schema 1.1; see test/roles/vocabulary.test.ts).
// owl: terms follow the OWL 2 Mapping to RDF Graphs, skos: terms the SKOS Reference, dcterms: terms
// the DCMI Metadata Terms, schema: terms schema.org, obo: terms the OBO Relations Ontology / BFO, and
// the partitive SKOS extension ISO 25964 (iso-thes); those IRIs are from memory.

/** RDF namespace (RDF 1.1 Concepts; checked against rdf.ttl). */
export const RDF_NAMESPACE = 'http://www.w3.org/1999/02/22-rdf-syntax-ns#';
/** RDFS namespace (RDF Schema 1.1; checked against rdfs.ttl). */
export const RDFS_NAMESPACE = 'http://www.w3.org/2000/01/rdf-schema#';
/** OWL namespace (OWL 2 Mapping to RDF Graphs; from memory, also the `owl:` prefix of rdf.ttl). */
export const OWL_NAMESPACE = 'http://www.w3.org/2002/07/owl#';
/** XML Schema datatypes namespace (XSD 1.1 Part 2, as used by RDF 1.1; from memory). */
export const XSD_NAMESPACE = 'http://www.w3.org/2001/XMLSchema#';
/** SKOS namespace (SKOS Reference; from memory). */
export const SKOS_NAMESPACE = 'http://www.w3.org/2004/02/skos/core#';
/** DCMI Metadata Terms namespace (DCMI terms; from memory). */
export const DCTERMS_NAMESPACE = 'http://purl.org/dc/terms/';
/** schema.org namespace in its https form (schema.org; from memory). */
export const SCHEMA_NAMESPACE = 'https://schema.org/';
/** schema.org namespace in its older http form, still published and widely used (common practice). */
export const SCHEMA_HTTP_NAMESPACE = 'http://schema.org/';
/** OBO Foundry PURL namespace (OBO Relations Ontology / BFO; from memory). */
export const OBO_NAMESPACE = 'http://purl.obolibrary.org/obo/';
/** ISO 25964 SKOS extension namespace (iso-thes; from memory). */
export const ISO_THES_NAMESPACE = 'http://purl.org/iso25964/skos-thes#';

/** rdf:type — the subject is an instance of the object (RDF 1.1 Concepts). */
export const RDF_TYPE = `${RDF_NAMESPACE}type`;
/** rdf:first — the first item of an RDF collection node. */
export const RDF_FIRST = `${RDF_NAMESPACE}first`;
/** rdf:rest — the rest of an RDF collection node. */
export const RDF_REST = `${RDF_NAMESPACE}rest`;
/** rdf:nil — the empty RDF collection. */
export const RDF_NIL = `${RDF_NAMESPACE}nil`;

/** rdfs:subClassOf — every member of the subject is a member of the object (RDF Schema 1.1). */
export const RDFS_SUBCLASS_OF = `${RDFS_NAMESPACE}subClassOf`;
/** rdfs:Class — the class of classes. */
export const RDFS_CLASS = `${RDFS_NAMESPACE}Class`;
/** rdfs:Datatype — the class of datatypes (itself a subclass of rdfs:Class). */
export const RDFS_DATATYPE = `${RDFS_NAMESPACE}Datatype`;
/** rdfs:label — a human-readable name. */
export const RDFS_LABEL = `${RDFS_NAMESPACE}label`;

/** owl:Class — the class of OWL classes. */
export const OWL_CLASS = `${OWL_NAMESPACE}Class`;
/** owl:disjointWith — the two classes share no member. */
export const OWL_DISJOINT_WITH = `${OWL_NAMESPACE}disjointWith`;
/** owl:equivalentClass — the two classes have the same members. */
export const OWL_EQUIVALENT_CLASS = `${OWL_NAMESPACE}equivalentClass`;
/** owl:deprecated — annotation marking a term as retired (value true). */
export const OWL_DEPRECATED = `${OWL_NAMESPACE}deprecated`;
/** owl:AllDisjointClasses — an axiom node whose owl:members classes are pairwise disjoint. */
export const OWL_ALL_DISJOINT_CLASSES = `${OWL_NAMESPACE}AllDisjointClasses`;
/** owl:members — the RDF collection of an owl:AllDisjointClasses (or owl:AllDifferent) axiom. */
export const OWL_MEMBERS = `${OWL_NAMESPACE}members`;
/** owl:Restriction — an anonymous class expression over a property. */
export const OWL_RESTRICTION = `${OWL_NAMESPACE}Restriction`;
/** owl:unionOf — a class expression: the union of a collection of classes. */
export const OWL_UNION_OF = `${OWL_NAMESPACE}unionOf`;
/** owl:intersectionOf — a class expression: the intersection of a collection of classes. */
export const OWL_INTERSECTION_OF = `${OWL_NAMESPACE}intersectionOf`;
/** owl:complementOf — a class expression: the complement of a class. */
export const OWL_COMPLEMENT_OF = `${OWL_NAMESPACE}complementOf`;
/** owl:oneOf — a class expression: an enumeration of individuals. */
export const OWL_ONE_OF = `${OWL_NAMESPACE}oneOf`;
/** owl:Axiom — a reified axiom node carrying annotations. */
export const OWL_AXIOM = `${OWL_NAMESPACE}Axiom`;
/** owl:AllDifferent — an axiom node whose owl:members individuals are pairwise different. */
export const OWL_ALL_DIFFERENT = `${OWL_NAMESPACE}AllDifferent`;

/** xsd:boolean — the datatype of `true` in `owl:deprecated true`. */
export const XSD_BOOLEAN = `${XSD_NAMESPACE}boolean`;
/** xsd:string — the datatype of a plain literal in RDF 1.1. */
export const XSD_STRING = `${XSD_NAMESPACE}string`;

/** skos:broader — the object is a broader concept (SKOS Reference). */
export const SKOS_BROADER = `${SKOS_NAMESPACE}broader`;
/** skos:narrower — the object is a narrower concept (inverse of skos:broader). */
export const SKOS_NARROWER = `${SKOS_NAMESPACE}narrower`;
/** skos:prefLabel — the preferred lexical label of a concept. */
export const SKOS_PREF_LABEL = `${SKOS_NAMESPACE}prefLabel`;
/** iso-thes:broaderPartitive — the object is the whole the subject concept is a part of. */
export const ISO_THES_BROADER_PARTITIVE = `${ISO_THES_NAMESPACE}broaderPartitive`;
/** iso-thes:narrowerPartitive — the object is a part of the subject concept. */
export const ISO_THES_NARROWER_PARTITIVE = `${ISO_THES_NAMESPACE}narrowerPartitive`;

/** dcterms:isPartOf — the subject is physically or logically included in the object (DCMI terms). */
export const DCTERMS_IS_PART_OF = `${DCTERMS_NAMESPACE}isPartOf`;
/** dcterms:hasPart — the object is included in the subject (inverse of dcterms:isPartOf). */
export const DCTERMS_HAS_PART = `${DCTERMS_NAMESPACE}hasPart`;

/** schema:isPartOf, https form (schema.org). */
export const SCHEMA_IS_PART_OF = `${SCHEMA_NAMESPACE}isPartOf`;
/** schema:hasPart, https form (schema.org). */
export const SCHEMA_HAS_PART = `${SCHEMA_NAMESPACE}hasPart`;
/** schema:isPartOf, http form (schema.org). */
export const SCHEMA_HTTP_IS_PART_OF = `${SCHEMA_HTTP_NAMESPACE}isPartOf`;
/** schema:hasPart, http form (schema.org). */
export const SCHEMA_HTTP_HAS_PART = `${SCHEMA_HTTP_NAMESPACE}hasPart`;

/** OBO "part of" (BFO_0000050, OBO Relations Ontology). */
export const OBO_PART_OF = `${OBO_NAMESPACE}BFO_0000050`;
/** OBO "has part" (BFO_0000051, inverse of part of). */
export const OBO_HAS_PART = `${OBO_NAMESPACE}BFO_0000051`;

/** Namespaces whose terms are out of scope unless a scope prefix names them (design.md). */
export const BUILT_IN_VOCABULARY_NAMESPACES: readonly string[] = [
  RDF_NAMESPACE,
  RDFS_NAMESPACE,
  OWL_NAMESPACE,
  XSD_NAMESPACE,
  SKOS_NAMESPACE,
];
