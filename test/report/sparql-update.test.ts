// The fix script: parsed by sparqljs, applied to the demo in the oxigraph store, and the result linted again.
import { mkdtempSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import * as oxigraph from 'oxigraph';
import sparqljs from 'sparqljs';
import { describe, expect, it } from 'vitest';
import { check } from '../../src/check.js';
import type { Finding } from '../../src/engine/finding.js';
import type { Literal } from '../../src/load/statement.js';
import { toSparqlUpdate } from '../../src/report/sparql-update.js';
import { demoCopy } from '../baseline/demo-copy.js';
import { runCli } from '../cli/terminal-fake.js';
import { DEF, PANTOGRAPH_FINDING, ROLLING_STOCK, RDFS_SUBCLASS_OF, context, statement } from './report-fixtures.js';

/** A triple as text, from either sparqljs's or oxigraph's terms. */
type Term = { termType: string; value: string; language?: string; datatype?: { value: string } };
function tripleKey(subject: Term, predicate: Term, object: Term, graph = ''): string {
  const literal = object.termType === 'Literal' ? `"${object.value}"@${object.language ?? ''}^^${object.datatype?.value ?? ''}` : `<${object.value}>`;
  return `<${subject.value}> <${predicate.value}> ${literal} ${graph}`;
}

/**
 * The triples the script deletes, as sparqljs (a general-purpose SPARQL 1.1 parser) reads them,
 * one list per DELETE DATA operation; a script sparqljs rejects throws here.
 */
function deletedTriples(script: string): string[][] {
  const parsed = new sparqljs.Parser().parse(script) as { type?: string; updates?: { updateType: string; delete: { type: string; name?: Term; triples: { subject: Term; predicate: Term; object: Term }[] }[] }[] };
  if (parsed.type === undefined) return [];
  expect(parsed.type).toBe('update');
  return (parsed.updates ?? []).map((update) => {
    expect(update.updateType).toBe('delete');
    return update.delete.flatMap((group) => group.triples.map((triple) => tripleKey(triple.subject, triple.predicate, triple.object, group.type === 'graph' ? `<${group.name?.value}>` : '')));
  });
}

const MEDIA_TYPE: Record<string, string> = { '.ttl': 'text/turtle', '.nt': 'application/n-triples', '.trig': 'application/trig', '.nq': 'application/n-quads' };

/** The RDF files of a folder loaded into a fresh oxigraph store, each with its file URL as base. */
function storeOf(dir: string): oxigraph.Store {
  const store = new oxigraph.Store();
  for (const name of readdirSync(dir)) {
    const mediaType = MEDIA_TYPE[path.extname(name)];
    if (mediaType === undefined) continue;
    const file = path.join(dir, name);
    store.load(readFileSync(file, 'utf8'), { format: mediaType, base_iri: pathToFileURL(file).href });
  }
  return store;
}

function storeKeys(store: oxigraph.Store): Set<string> {
  return new Set(store.match().map((quad) => tripleKey(quad.subject as Term, quad.predicate as Term, quad.object as Term, quad.graph.termType === 'DefaultGraph' ? '' : `<${quad.graph.value}>`)));
}

/** Lints the store's content, written as N-Quads beside the folder's config. */
async function lintStore(store: oxigraph.Store, configFrom: string): Promise<Finding[]> {
  const dir = mkdtempSync(path.join(tmpdir(), 'isapart-fixed-'));
  writeFileSync(path.join(dir, 'graph.nq'), store.dump({ format: 'application/n-quads' }));
  writeFileSync(path.join(dir, 'isapart.yaml'), readFileSync(path.join(configFrom, 'isapart.yaml')));
  const result = await check({ paths: ['.'], cwd: dir });
  expect(result.context.inputErrors).toEqual([]);
  return result.findings;
}

describe('--format sparql-update on the demo', () => {
  it('parses with sparqljs, removes exactly the listed statements in oxigraph, and the re-lint no longer has those findings', async () => {
    const dir = demoCopy();
    const run = await runCli(dir, ['check', '.', '-f', 'sparql-update']);
    // The exit code is the lint's, whatever the format.
    expect(run.code).toBe(1);
    const script = run.out;
    expect(script.split('\n').slice(0, 3).join(' ')).toMatch(/CAUTION: running it changes your data, and isapart never runs it/);
    expect(script).toMatch(/Review every block/);
    expect(script).toMatch(/against a copy of the graph first/);
    const operations = deletedTriples(script);
    const before = await check({ paths: ['.'], cwd: dir });
    const fixable = before.findings.filter((finding) => finding.fix && !finding.suppression);
    expect(fixable.length).toBeGreaterThan(0);
    expect(operations).toHaveLength(fixable.length);
    // Each block comments the finding it belongs to.
    for (const finding of fixable) expect(script).toContain(`# ${finding.ruleId} (${finding.level}): ${finding.message}`);

    const store = storeOf(dir);
    const listed = new Set(operations.flat());
    const held = storeKeys(store);
    for (const triple of listed) expect(held.has(triple)).toBe(true);
    // oxigraph is the SPARQL 1.1 Update engine here (npm oxigraph).
    store.update(script);
    const after = storeKeys(store);
    expect(after.size).toBe(held.size - listed.size);
    for (const triple of held) expect(after.has(triple)).toBe(!listed.has(triple));

    const relinted = await lintStore(store, dir);
    const fixed = new Set(fixable.map((finding) => finding.fingerprint));
    const remaining = (findings: Finding[]) => findings.filter((finding) => finding.ruleId !== 'unused-allow').map((finding) => finding.fingerprint).sort();
    // Allow comments do not survive the store, so unused-allow findings are left out of the comparison.
    expect(remaining(relinted)).toEqual(remaining(before.findings).filter((fingerprint) => !fixed.has(fingerprint)));
  });
});

describe('--format sparql-update on named graphs and blank nodes', () => {
  const TRIG = `@prefix rdfs: <http://www.w3.org/2000/01/rdf-schema#> .
@prefix nv: <https://data.northvale-rail.example/def/> .
nv:signalling {
  nv:MainSignal rdfs:subClassOf nv:Signal .
  nv:MainSignal rdfs:subClassOf nv:Equipment .
  nv:Signal rdfs:subClassOf nv:Equipment .
}
_:kit rdfs:subClassOf nv:Signal .
_:kit rdfs:subClassOf nv:Equipment .
nv:Equipment rdfs:subClassOf nv:Asset .
`;

  it('deletes inside a GRAPH block, and comments a blank-node fix instead of naming the blank node', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'isapart-sparql-'));
    writeFileSync(path.join(dir, 'signals.trig'), TRIG);
    writeFileSync(path.join(dir, 'isapart.yaml'), 'roots: [https://data.northvale-rail.example/def/Asset]\n');
    const script = (await runCli(dir, ['check', '.', '-f', 'sparql-update'])).out;
    const operations = deletedTriples(script);
    expect(operations).toEqual([[`<${DEF}MainSignal> <${RDFS_SUBCLASS_OF}> <${DEF}Equipment> <${DEF}signalling>`]]);
    expect(script).toContain(`GRAPH <${DEF}signalling> {`);
    // Blank nodes are not allowed in DELETE DATA (SPARQL 1.1 Update); both reference engines refuse one.
    expect(() => new sparqljs.Parser().parse('DELETE DATA { _:kit <http://www.w3.org/2000/01/rdf-schema#subClassOf> <https://data.northvale-rail.example/def/Signal> }')).toThrow();
    expect(() => new oxigraph.Store().update('DELETE DATA { _:kit <http://www.w3.org/2000/01/rdf-schema#subClassOf> <https://data.northvale-rail.example/def/Signal> }')).toThrow();
    expect(script).toMatch(/# No operation for this finding: a statement cannot be deleted here, as it names a blank node, which DELETE DATA cannot name/);
    expect(script).not.toMatch(/^\s*_:/m);
    const store = storeOf(dir);
    const size = store.size;
    store.update(script);
    expect(store.size).toBe(size - 1);
  });
});

describe('toSparqlUpdate', () => {
  const literal: Literal = { value: 'Line 1 "north"\nand \\ back\r\tend', datatype: '', language: 'en-GB' };
  const typed: Literal = { value: '12', datatype: 'http://www.w3.org/2001/XMLSchema#integer', language: '' };
  const withLiterals: Finding = {
    ...PANTOGRAPH_FINDING,
    fix: {
      remove: [
        statement({ subject: `${DEF}Pantograph`, predicate: 'http://www.w3.org/2000/01/rdf-schema#comment', object: literal, file: ROLLING_STOCK, line: 20 }),
        statement({ subject: `${DEF}Pantograph`, predicate: `${DEF}count`, object: typed, file: ROLLING_STOCK, line: 21 }),
      ],
    },
  };

  it('escapes literals so that sparqljs reads back the same value, language and datatype', () => {
    const [operation] = deletedTriples(toSparqlUpdate([withLiterals], context()));
    // SPARQL 1.1 grammar: STRING_LITERAL_QUOTE with ECHAR escapes; a language-tagged literal has datatype rdf:langString (RDF 1.1).
    expect(operation).toEqual([
      tripleKey({ termType: 'NamedNode', value: `${DEF}Pantograph` }, { termType: 'NamedNode', value: 'http://www.w3.org/2000/01/rdf-schema#comment' }, { termType: 'Literal', value: literal.value, language: 'en-gb', datatype: { value: 'http://www.w3.org/1999/02/22-rdf-syntax-ns#langString' } }),
      tripleKey({ termType: 'NamedNode', value: `${DEF}Pantograph` }, { termType: 'NamedNode', value: `${DEF}count` }, { termType: 'Literal', value: '12', language: '', datatype: { value: typed.datatype } }),
    ]);
  });

  it('writes no operation for an IRI that SPARQL cannot hold, and leaves out suppressed and absent findings', () => {
    const spaced: Finding = { ...PANTOGRAPH_FINDING, fingerprint: 'b'.repeat(64), fix: { remove: [statement({ subject: `${DEF}Pan tograph`, predicate: RDFS_SUBCLASS_OF, object: `${DEF}Locomotive`, file: ROLLING_STOCK, line: 3 })] } };
    const suppressed: Finding = { ...PANTOGRAPH_FINDING, suppression: { kind: 'inSource', justification: 'kit', file: ROLLING_STOCK, line: 11 } };
    const absent: Finding = { ...PANTOGRAPH_FINDING, baselineState: 'absent' };
    const script = toSparqlUpdate([spaced, suppressed, absent], context());
    expect(deletedTriples(script)).toEqual([]);
    expect(script).toContain('# Findings with a fix: 1; operations: 0.');
    expect(script).toContain('it holds a term that SPARQL cannot write as it is');
  });

  it('is a valid, empty request when nothing has a fix', () => {
    const script = toSparqlUpdate([], context());
    expect(script).toContain('# No finding has a fix to apply, so this request holds no operation.');
    expect(deletedTriples(script)).toEqual([]);
    const store = new oxigraph.Store();
    expect(() => store.update(script)).not.toThrow();
  });
});
