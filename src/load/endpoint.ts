// Reading the hierarchy out of a SPARQL 1.1 endpoint: one paged SELECT per predicate the graph reads.
import { Parser as N3Parser } from 'n3';
import { iriProblem } from '../config/iri-check.js';
import type { RoleMap } from '../roles/role.js';
import {
  DCTERMS_NAMESPACE,
  OWL_COMPLEMENT_OF,
  OWL_DEPRECATED,
  OWL_INTERSECTION_OF,
  OWL_MEMBERS,
  OWL_NAMESPACE,
  OWL_ONE_OF,
  OWL_UNION_OF,
  RDF_FIRST,
  RDF_NAMESPACE,
  RDF_REST,
  RDF_TYPE,
  RDFS_NAMESPACE,
  SCHEMA_NAMESPACE,
  SKOS_NAMESPACE,
  XSD_NAMESPACE,
} from '../roles/vocabulary.js';
import { EndpointFailure, SPARQL_JSON, SparqlClient } from './endpoint-client.js';
import { endpointPosition } from './endpoint-location.js';
import { BlankLabels, integerOf, MalformedResults, nodeOf, objectOf, parseResultsJson, type ResultRow } from './endpoint-results.js';
import type { EndpointSettings } from './endpoint-settings.js';
import type { InputError, LoadedSource, LoadResult, Statement } from './statement.js';

/** owl:onProperty, an axiom-structure predicate the graph reads (src/graph/owl-axioms.ts). */
const OWL_ON_PROPERTY = `${OWL_NAMESPACE}onProperty`;

/** Predicates of OWL axiom structures and RDF lists, read as in src/graph/owl-axioms.ts. */
const STRUCTURE_PREDICATES = [RDF_FIRST, RDF_REST, OWL_UNION_OF, OWL_INTERSECTION_OF, OWL_COMPLEMENT_OF, OWL_ONE_OF, OWL_MEMBERS, OWL_ON_PROPERTY];

/** Prefixes an endpoint source offers the reports, so messages name common terms briefly (the endpoint declares none). */
const ENDPOINT_PREFIXES: Readonly<Record<string, string>> = {
  rdf: RDF_NAMESPACE,
  rdfs: RDFS_NAMESPACE,
  owl: OWL_NAMESPACE,
  xsd: XSD_NAMESPACE,
  skos: SKOS_NAMESPACE,
  dcterms: DCTERMS_NAMESPACE,
  schema: SCHEMA_NAMESPACE,
};

/** What `loadEndpoint` reads and how. */
export interface EndpointRequest {
  /** The endpoint URL, as given with --endpoint. */
  endpoint: string;
  /** A named graph to read; without it, the endpoint's default graph. */
  graph?: string;
  roleMap: RoleMap;
  settings: EndpointSettings;
  /** Where the environment variable named by `authorizationEnv` is looked up. */
  env: Readonly<Record<string, string | undefined>>;
  /** Replaces the waits between retries (tests). */
  sleep?: (milliseconds: number) => Promise<void>;
  /** Called after each page with the predicate, rows read so far and its count. */
  progress?: (predicate: string, read: number, total: number) => void;
}

/** What an extraction read, plus the number of requests it took. */
export interface EndpointLoadResult extends LoadResult {
  requests: number;
}

/** The predicates whose statements the graph reads, in a fixed order: role predicates, rdf:type, owl:deprecated, axiom structures. */
export function extractionPredicates(roleMap: RoleMap): string[] {
  const predicates = new Set<string>([...roleMap.predicates].sort());
  predicates.add(RDF_TYPE);
  if (roleMap.readsDeprecated) predicates.add(OWL_DEPRECATED);
  for (const predicate of STRUCTURE_PREDICATES) predicates.add(predicate);
  return [...predicates];
}

/** Why the --endpoint URL or --graph IRI cannot be used, as input errors (none when both are fine). */
export function endpointProblems(endpoint: string, graph: string | undefined): InputError[] {
  const problems: InputError[] = [];
  const place = { file: '<command line>', line: 0, column: 0 };
  let url: URL | undefined;
  try {
    url = new URL(endpoint);
  } catch {
    problems.push({ ...place, message: `--endpoint: \`${endpoint}\` is not a URL`, hint: 'give the SPARQL service URL, such as --endpoint http://127.0.0.1:8890/sparql' });
  }
  if (url !== undefined && url.protocol !== 'http:' && url.protocol !== 'https:') {
    problems.push({ ...place, message: `--endpoint: \`${endpoint}\` is not an http or https URL`, hint: 'the SPARQL 1.1 Protocol runs over HTTP; give a URL starting with http:// or https://' });
  }
  if (url !== undefined && (url.username !== '' || url.password !== '')) {
    problems.push({
      ...place,
      message: '--endpoint: the URL carries a user name or password, which would be shown in every report',
      hint: 'put the Authorization header value in an environment variable and name it in isapart.yaml: `endpoint: { authorization-env: NAME }`',
    });
  }
  if (graph !== undefined) {
    const problem = iriProblem(graph);
    if (problem !== undefined) {
      problems.push({ ...place, message: `--graph: \`${graph}\` is not an absolute IRI: ${problem}`, hint: 'give the graph IRI in full, such as --graph https://data.northvale-rail.example/graph/assets' });
    }
  }
  return problems;
}

/** The client for a request, or the input error that stops it (the credentials variable is missing). */
export function endpointClient(request: EndpointRequest): SparqlClient | InputError {
  const location = endpointPosition(request.endpoint, request.graph).file;
  const variable = request.settings.authorizationEnv;
  let authorization: string | undefined;
  if (variable !== undefined) {
    authorization = request.env[variable];
    if (authorization === undefined || authorization === '') {
      return {
        file: location,
        line: 0,
        column: 0,
        message: `the environment variable ${variable}, named by \`endpoint: authorization-env\` in the config, is not set`,
        hint: `set ${variable} to the Authorization header value (such as "Bearer ..." or "Basic ...") before running isapart`,
      };
    }
  }
  return new SparqlClient({ endpoint: request.endpoint, location, settings: request.settings, authorization, sleep: request.sleep });
}

/** `<IRI>` for an IRI checked to be absolute and free of `<>"{}|\\^\``, spaces and controls, so it cannot end early. */
function iriRef(iri: string): string {
  const problem = iriProblem(iri);
  if (problem !== undefined) throw new Error(`internal error: the IRI '${iri}' reached a query unchecked (${problem})`);
  return `<${iri}>`;
}

/** `FROM <graph>` when one graph is read. */
function fromClause(graph: string | undefined): string {
  return graph === undefined ? '' : `FROM ${iriRef(graph)}\n`;
}

/** The query counting the distinct statements of a predicate. */
export function countQuery(predicate: string, graph: string | undefined): string {
  return `# isapart extraction: how many statements of <${predicate}>\nSELECT (COUNT(*) AS ?count)\n${fromClause(graph)}WHERE { SELECT DISTINCT ?s ?o WHERE { ?s ${iriRef(predicate)} ?o } }\n`;
}

/** The query of one page of a predicate's statements, in a stable order. */
export function pageQuery(predicate: string, graph: string | undefined, limit: number, offset: number): string {
  return `# isapart extraction: statements of <${predicate}>\nSELECT DISTINCT ?s ?o\n${fromClause(graph)}WHERE { ?s ${iriRef(predicate)} ?o }\nORDER BY ?s ?o\nLIMIT ${limit}\nOFFSET ${offset}\n`;
}

/** The query of one page as triples: the same window as `pageQuery`, as a CONSTRUCT of its solutions. */
export function constructPageQuery(predicate: string, graph: string | undefined, limit: number, offset: number): string {
  const p = iriRef(predicate);
  return `# isapart extraction: statements of <${predicate}>\nCONSTRUCT { ?s ${p} ?o }\n${fromClause(graph)}WHERE { SELECT DISTINCT ?s ?o WHERE { ?s ${p} ?o } ORDER BY ?s ?o LIMIT ${limit} OFFSET ${offset} }\n`;
}

/** Media types of a CONSTRUCT page, most wanted first (RFC 9110 quality values). */
const TRIPLES_ACCEPT = 'application/n-triples, text/plain;q=0.9, text/turtle;q=0.8';

/** The n3 syntax of a triples answer's media type (N-Triples once was served as text/plain), or undefined. */
function triplesFormat(contentType: string): 'N-Triples' | 'Turtle' | undefined {
  if (contentType === 'application/n-triples' || contentType === 'text/plain') return 'N-Triples';
  if (contentType === 'text/turtle') return 'Turtle';
  return undefined;
}

/** One CONSTRUCT page as statements of the predicate; anything else in the answer is an EndpointFailure. */
async function constructStatements(read: PredicateRead, offset: number): Promise<Statement[]> {
  const { client, request, predicate } = read;
  const purpose = `<${predicate}> statements`;
  const answer = await client.send(constructPageQuery(predicate, request.graph, request.settings.pageSize, offset), TRIPLES_ACCEPT, purpose);
  const malformed = (reason: string): EndpointFailure =>
    new EndpointFailure({ file: read.file, line: 0, column: 0, message: `the SPARQL endpoint's answer to the query for ${purpose} cannot be read: ${reason}`, hint: 'set `endpoint: { results: json }` to read SELECT results instead' });
  const maxRows = Number(answer.headers.get('x-sparql-maxrows') ?? Number.NaN);
  if (Number.isFinite(maxRows) && maxRows < request.settings.pageSize) {
    throw malformed(`the server returns at most ${maxRows} rows per answer (X-SPARQL-MaxRows), fewer than the page size ${request.settings.pageSize}; set \`endpoint: { page-size: ${maxRows} }\``);
  }
  const format = triplesFormat(answer.contentType);
  if (format === undefined) throw malformed(`it is \`${answer.contentType || 'of no stated media type'}\`, not N-Triples or Turtle`);
  let quads;
  try {
    quads = new N3Parser({ format, blankNodePrefix: '' }).parse(answer.body);
  } catch (error) {
    throw malformed(error instanceof Error ? error.message : String(error));
  }
  return quads.map((quad) => {
    if (quad.predicate.value !== predicate) throw malformed(`it holds a statement of <${quad.predicate.value}>, which was not asked for`);
    const node = (term: typeof quad.subject | typeof quad.object): string =>
      term.termType === 'BlankNode' ? read.blanks.label(term.value) : term.value;
    if (quad.subject.termType !== 'NamedNode' && quad.subject.termType !== 'BlankNode') throw malformed('a subject is neither an IRI nor a blank node');
    const object = quad.object.termType === 'Literal' ? { value: quad.object.value, datatype: quad.object.datatype.value, language: quad.object.language } : node(quad.object);
    return { subject: node(quad.subject), predicate, object, graph: '', position: { file: read.file, line: 0, column: 0 }, objectLine: 0 };
  });
}

/**
 * Reads the statements the hierarchy graph needs from an endpoint into one LoadedSource whose
 * positions name the endpoint (and graph). Each predicate is counted, then read page by page;
 * the offset moves by the rows received, so a server that caps its answers silently still gives
 * every row, and a total that differs from the count is an error. Any failure stops the
 * extraction and is returned as the only result: a partial graph would give misleading findings.
 */
export async function loadEndpoint(request: EndpointRequest): Promise<EndpointLoadResult> {
  const problems = endpointProblems(request.endpoint, request.graph);
  if (problems.length > 0) return { sources: [], errors: problems, requests: 0 };
  const client = endpointClient(request);
  if (!(client instanceof SparqlClient)) return { sources: [], errors: [client], requests: 0 };
  const position = endpointPosition(request.endpoint, request.graph);
  const source: LoadedSource = { file: position.file, format: 'n-triples', statements: [], errors: [], allowComments: [], prefixes: { ...ENDPOINT_PREFIXES } };
  const blanks = new BlankLabels(position.file);
  try {
    for (const predicate of extractionPredicates(request.roleMap)) {
      await readPredicate({ client, request, predicate, blanks, statements: source.statements, file: position.file });
    }
  } catch (error) {
    if (error instanceof EndpointFailure) return { sources: [], errors: [error.problem], requests: client.requests };
    if (error instanceof MalformedResults) {
      const problem = { file: position.file, line: 0, column: 0, message: `the SPARQL endpoint's answer cannot be read: ${error.message}`, hint: 'the server sent results that are not RDF terms where statements belong; check its SPARQL JSON output' };
      return { sources: [], errors: [problem], requests: client.requests };
    }
    throw error;
  }
  return { sources: [source], errors: [], requests: client.requests };
}

interface PredicateRead {
  client: SparqlClient;
  request: EndpointRequest;
  predicate: string;
  blanks: BlankLabels;
  statements: Statement[];
  file: string;
}

/** Counts a predicate's statements, then reads them page by page into `statements`. */
async function readPredicate(read: PredicateRead): Promise<void> {
  const { client, request, predicate } = read;
  const purpose = `<${predicate}> statements`;
  const total = integerOf(await selectRows(client, countQuery(predicate, request.graph), purpose, read.file), 'count');
  let received = 0;
  while (received < total) {
    const page = request.settings.results === 'n-triples' ? await constructStatements(read, received) : await selectStatements(read, received);
    if (page.length === 0) break;
    for (const statement of page) read.statements.push(statement);
    received += page.length;
    request.progress?.(predicate, received, total);
  }
  if (received !== total) {
    throw new EndpointFailure({
      file: read.file,
      line: 0,
      column: 0,
      message: `the endpoint counted ${total} statements of <${predicate}> but returned ${received}`,
      hint: 'the data changed during the extraction, or the server drops rows; run again when no load is running',
    });
  }
}

/** One SELECT page as statements of the predicate. */
async function selectStatements(read: PredicateRead, offset: number): Promise<Statement[]> {
  const { client, request, predicate } = read;
  const rows = await selectRows(client, pageQuery(predicate, request.graph, request.settings.pageSize, offset), `<${predicate}> statements`, read.file, request.settings.pageSize);
  return rows.map((row) => ({
    subject: nodeOf(row.s, 's', read.blanks),
    predicate,
    object: objectOf(row.o, 'o', read.blanks),
    graph: '',
    position: { file: read.file, line: 0, column: 0 },
    objectLine: 0,
  }));
}

/** Sends a SELECT and reads its rows; an answer that is not SPARQL JSON results is an EndpointFailure. */
export async function selectRows(client: SparqlClient, query: string, purpose: string, file: string, limit?: number): Promise<ResultRow[]> {
  const answer = await client.send(query, SPARQL_JSON, purpose);
  const malformed = (reason: string): EndpointFailure =>
    new EndpointFailure({
      file,
      line: 0,
      column: 0,
      message: `the SPARQL endpoint's answer to the query for ${purpose} cannot be read: ${reason}`,
      hint: 'check that the URL given with --endpoint is the SPARQL service itself (often ending in /sparql), not a web page in front of it',
    });
  // Virtuoso marks an answer cut short by its execution time limit with this header (Virtuoso's "anytime" queries; from memory).
  const sqlState = answer.headers.get('x-sql-state');
  if (sqlState !== null && sqlState !== '00000') throw malformed(`the server marked it incomplete (X-SQL-State ${sqlState}); raise its query time limit`);
  // Virtuoso cuts answers at its ResultSetMaxRows silently but for this header (seen on Virtuoso 7.2.5).
  const maxRows = Number(answer.headers.get('x-sparql-maxrows') ?? Number.NaN);
  if (limit !== undefined && Number.isFinite(maxRows) && maxRows < limit) {
    throw new EndpointFailure({
      file,
      line: 0,
      column: 0,
      message: `the SPARQL endpoint returns at most ${maxRows} rows per answer (X-SPARQL-MaxRows), fewer than the page size ${limit}, so rows would be lost`,
      hint: `set \`endpoint: { page-size: ${maxRows} }\` in isapart.yaml, or raise the server's limit (Virtuoso: ResultSetMaxRows in section [SPARQL])`,
    });
  }
  if (answer.contentType !== SPARQL_JSON && answer.contentType !== 'application/json') {
    throw malformed(`it is ${answer.contentType === '' ? 'of no stated media type' : `\`${answer.contentType}\``}, not ${SPARQL_JSON}`);
  }
  try {
    return parseResultsJson(answer.body);
  } catch (error) {
    if (error instanceof MalformedResults) throw malformed(error.message);
    throw error;
  }
}
