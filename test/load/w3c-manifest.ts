// Reading a W3C RDF 1.1 test suite manifest (test/standards/w3c-rdf-tests) with n3 itself.
import { readFileSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { DataFactory, Parser, Store } from 'n3';
import type * as RDF from '@rdfjs/types';
import type { N3Format, Statement } from '../../src/load/statement.js';

const RDF_NS = 'http://www.w3.org/1999/02/22-rdf-syntax-ns#';
const MF = 'http://www.w3.org/2001/sw/DataAccess/tests/test-manifest#';
const RDFT = 'http://www.w3.org/ns/rdftest#';

/** The four suites n3's parser is held to, by folder under rdf/rdf11/ (RDF/XML's is read on its own). */
export const SUITES: ReadonlyArray<{ folder: string; format: N3Format }> = [
  { folder: 'rdf-turtle', format: 'turtle' },
  { folder: 'rdf-trig', format: 'trig' },
  { folder: 'rdf-n-triples', format: 'n-triples' },
  { folder: 'rdf-n-quads', format: 'n-quads' },
];

/** What a manifest says a test checks. */
export type TestKind = 'positive-syntax' | 'negative-syntax' | 'eval' | 'negative-eval';

/** One entry of a manifest. */
export interface SuiteTest {
  name: string;
  kind: TestKind;
  actionPath: string;
  /** The IRI the action's relative IRIs resolve against: mf:assumedTestBase + the action's path in the suite. */
  baseIri: string | undefined;
  resultPath: string | undefined;
}

/** The folder of a suite in the project's copy of the W3C tests. */
export function suiteFolder(folder: string): string {
  return fileURLToPath(new URL(`../standards/w3c-rdf-tests/rdf/rdf11/${folder}/`, import.meta.url));
}

/** Every entry of a suite's manifest.ttl, in the order of its mf:entries list. */
export function readManifest(folder: string): SuiteTest[] {
  const manifestPath = `${suiteFolder(folder)}manifest.ttl`;
  const manifestUrl = pathToFileURL(manifestPath).href;
  const store = new Store(new Parser({ baseIRI: manifestUrl }).parse(readFileSync(manifestPath, 'utf8')));
  const one = (subject: RDF.Term, predicate: string): RDF.Term | undefined =>
    store.getObjects(subject, DataFactory.namedNode(predicate), null)[0];
  const manifest = DataFactory.namedNode(manifestUrl);
  const assumedBase = one(manifest, `${MF}assumedTestBase`)?.value;
  const tests: SuiteTest[] = [];
  // mf:entries is an RDF collection; walked with a loop, not recursion.
  for (let list = one(manifest, `${MF}entries`); list && list.value !== `${RDF_NS}nil`; list = one(list, `${RDF_NS}rest`)) {
    const entry = one(list, `${RDF_NS}first`);
    if (!entry) throw new Error(`${folder}: a manifest list node has no rdf:first`);
    const type = one(entry, `${RDF_NS}type`)?.value ?? '';
    const action = one(entry, `${MF}action`)?.value;
    if (!action) throw new Error(`${folder}: ${entry.value} has no mf:action`);
    const actionPath = fileURLToPath(action);
    // The action's path inside the suite folder (RDF/XML's tests sit in subfolders, the others' do not).
    const actionName = actionPath.slice(suiteFolder(folder).length);
    const result = one(entry, `${MF}result`)?.value;
    tests.push({
      name: one(entry, `${MF}name`)?.value ?? entry.value,
      kind: kindOf(type, folder),
      actionPath,
      baseIri: assumedBase === undefined ? undefined : assumedBase + actionName,
      resultPath: result === undefined ? undefined : fileURLToPath(result),
    });
  }
  return tests;
}

function kindOf(type: string, folder: string): TestKind {
  const local = type.startsWith(RDFT) ? type.slice(RDFT.length) : '';
  if (local.endsWith('NegativeEval')) return 'negative-eval';
  if (local.endsWith('PositiveSyntax')) return 'positive-syntax';
  if (local.endsWith('NegativeSyntax')) return 'negative-syntax';
  if (local.endsWith('Eval')) return 'eval';
  throw new Error(`${folder}: unknown test type ${type}`);
}

/** The expected quads of an eval test: its mf:result file parsed by n3 (N-Triples, or N-Quads for .nq). */
export function expectedQuads(resultPath: string): RDF.Quad[] {
  const format = resultPath.endsWith('.nq') ? 'N-Quads' : 'N-Triples';
  return new Parser({ format }).parse(readFileSync(resultPath, 'utf8'));
}

/** Our statements turned back into RDF/JS quads with n3's DataFactory. */
export function statementsAsQuads(statements: Statement[]): RDF.Quad[] {
  const { quad, namedNode, blankNode, literal, defaultGraph } = DataFactory;
  const resource = (text: string): RDF.NamedNode | RDF.BlankNode =>
    text.startsWith('_:') ? blankNode(text.slice(2)) : namedNode(text);
  return statements.map((statement) => {
    const object = statement.object;
    return quad(
      resource(statement.subject),
      namedNode(statement.predicate),
      typeof object === 'string'
        ? resource(object)
        : literal(object.value, object.language !== '' ? object.language : namedNode(object.datatype)),
      statement.graph === '' ? defaultGraph() : resource(statement.graph),
    );
  });
}
