// The commented isapart.yaml that `isapart init` writes: every key, its meaning, a Northvale Rail example.
import { DEFAULT_PRESETS } from './config.js';

/**
 * Each key's active line keeps the built-in behaviour, so a fresh config lints like no config; the
 * `# Example:` line above it shows the key in use for Northvale Rail's asset graph.
 */
const STARTER_LINES = [
  '# isapart.yaml: settings for linting the class hierarchy of an RDF knowledge graph.',
  '# isapart finds this file by searching upward from the first linted path; `--config FILE` names one.',
  '# Every key is optional. IRIs are written in full (no prefixes), without angle brackets.',
  '',
  '# presets: which built-in vocabularies map predicates to roles. Listing presets replaces the default',
  '# list. Known presets: rdfs (rdf:type, rdfs:subClassOf), owl (disjointWith, equivalentClass,',
  '# deprecated), dcterms (isPartOf/hasPart), schema (schema.org isPartOf/hasPart), obo (BFO part of /',
  '# has part), skos (opt-in: broader/narrower as subclass-of, broaderPartitive as part-of).',
  '# Example: presets: [rdfs, owl, dcterms, schema, obo, skos]',
  `presets: [${DEFAULT_PRESETS.join(', ')}]`,
  '',
  '# roles: your own predicates, per role (instance-of, subclass-of, part-of, disjoint-with,',
  '# equivalent-to). A list maps predicates that point the role\'s way; `{ iri: [...], inverse: [...] }`',
  '# also maps predicates that point the other way (a has-part property is an inverse part-of).',
  '# Example: roles: { subclass-of: [https://data.northvale-rail.example/def/kindOf], part-of: { iri: [https://data.northvale-rail.example/def/partOf], inverse: [https://data.northvale-rail.example/def/hasPart] } }',
  'roles: {}',
  '',
  '# scope: IRI prefixes of the terms you own. Findings are reported only for in-scope nodes, so terms',
  '# borrowed from other vocabularies are not blamed. An empty list puts every IRI in scope (except',
  '# the RDF, RDFS, OWL, XSD and SKOS namespaces).',
  '# Example: scope: [https://data.northvale-rail.example/]',
  'scope: []',
  '',
  '# roots: classes that are allowed to have no superclass (the top of your hierarchy).',
  '# Example: roots: [https://data.northvale-rail.example/def/Asset, https://data.northvale-rail.example/def/Infrastructure]',
  'roots: []',
  '',
  '# rules: change a rule\'s level: error, warning, note, or off. `isapart rules` lists the rules.',
  '# Example: rules: { redundant-subclass: note, orphan-class: off }',
  'rules: {}',
  '',
  '# rule-dirs: folders of extra rule files (same format as the built-in rules), relative to this file.',
  '# Example: rule-dirs: [./team-rules]',
  'rule-dirs: []',
  '',
  '# allow: findings to suppress, each by rule id and the IRI the finding is anchored on (its focus),',
  '# with a reason for the next reader. In a Turtle file, `# isapart-allow RULE-ID: reason` does the same.',
  '# Example: allow: [{ rule: kind-and-part, focus: https://data.northvale-rail.example/def/Pantograph, reason: "the pantograph class also names the fitted assembly" }]',
  'allow: []',
  '',
  '# contexts: local copies of JSON-LD contexts, by the IRI documents name them with in "@context".',
  '# isapart never fetches a remote context; a document whose context is neither mapped here nor a',
  '# local file is an input error naming the IRI. Paths are relative to this file.',
  '# Example: contexts: { "https://data.northvale-rail.example/context.jsonld": ./contexts/northvale.jsonld }',
  'contexts: {}',
  '',
  '# endpoint: how `isapart check --endpoint URL` talks to a SPARQL 1.1 endpoint: page-size (rows per',
  '# request), timeout and retry-delay (seconds), retries (after a 5xx answer or a reset connection),',
  '# post (query: the query as the POST body; form: as a form field, which Virtuoso 7.2 needs),',
  '# results (json: SELECT pages as SPARQL JSON; n-triples: CONSTRUCT pages as N-Triples or Turtle), and',
  '# authorization-env: the NAME of an environment variable holding the Authorization header value',
  '# (the credentials themselves never go in this file). trust-server: true makes --push-down send every',
  '# rule\'s query even to a server known to answer some wrongly (docs/push-down.md lists them).',
  '# Example: endpoint: { page-size: 10000, timeout: 120, authorization-env: NORTHVALE_SPARQL_AUTH }',
  'endpoint: {}',
];

/** The text of a commented starter isapart.yaml; it parses with no errors. */
export function starterConfig(): string {
  return `${STARTER_LINES.join('\n')}\n`;
}
