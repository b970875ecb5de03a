// Writes WordNet noun synsets as N-Triples with this test's own IRIs, and the isapart.yaml that maps them.
import { writeFileSync } from 'node:fs';
import type { NounSynset } from './noun-data.js';

/** Namespace of everything this test writes; also the configured scope. */
export const WORDNET_NAMESPACE = 'https://wordnet.isapart.example/';

/** The predicates of our own that stand for WordNet's pointers. */
export const WORDNET_PREDICATES = {
  hypernym: `${WORDNET_NAMESPACE}def/hypernym`,
  instanceHypernym: `${WORDNET_NAMESPACE}def/instanceHypernym`,
  partHolonym: `${WORDNET_NAMESPACE}def/partHolonym`,
  partMeronym: `${WORDNET_NAMESPACE}def/partMeronym`,
} as const;

/** One of our WordNet predicates by name. */
export type WordnetPredicateName = keyof typeof WORDNET_PREDICATES;

/** The `data.noun` pointer symbol of each predicate (wndb(5WN), and /work/shared/standards/README.md). */
export const POINTER_SYMBOLS: Record<WordnetPredicateName, string> = {
  hypernym: '@',
  instanceHypernym: '@i',
  partHolonym: '#p',
  partMeronym: '%p',
};

const RDFS_LABEL = 'http://www.w3.org/2000/01/rdf-schema#label';
const OWL_DISJOINT_WITH = 'http://www.w3.org/2002/07/owl#disjointWith';
const OWL_DEPRECATED = 'http://www.w3.org/2002/07/owl#deprecated';
const XSD_BOOLEAN = 'http://www.w3.org/2001/XMLSchema#boolean';

/** The IRI of a noun synset, from its 8-digit offset. */
export function synsetIri(offset: string): string {
  return `${WORDNET_NAMESPACE}synset/n${offset}`;
}

/** A statement added to the WordNet data on purpose: a WordNet-style edge, an OWL disjointness or a deprecation. */
export type PlantedStatement =
  | { kind: WordnetPredicateName; subject: string; object: string }
  | { kind: 'disjointWith'; subject: string; object: string }
  | { kind: 'deprecated'; subject: string };

/** What the writer wrote, per predicate, and the pointers it left out per symbol. */
export interface WriteCounts {
  triples: number;
  labels: number;
  perPredicate: Record<WordnetPredicateName, number>;
  /** Pointers of data.noun that are not part of the hierarchy (antonyms, member holonyms, ...). */
  pointersLeftOut: Record<string, number>;
}

/** Writes one N-Triples file: an rdfs:label per synset (its first word) and one triple per hierarchy pointer. */
export function writeWordnetNTriples(options: { synsets: NounSynset[]; file: string }): WriteCounts {
  const symbolToName = new Map<string, WordnetPredicateName>(
    Object.entries(POINTER_SYMBOLS).map(([name, symbol]) => [symbol, name as WordnetPredicateName]),
  );
  const counts: WriteCounts = {
    triples: 0,
    labels: 0,
    perPredicate: { hypernym: 0, instanceHypernym: 0, partHolonym: 0, partMeronym: 0 },
    pointersLeftOut: {},
  };
  const lines: string[] = [];
  for (const synset of options.synsets) {
    const subject = synsetIri(synset.offset);
    lines.push(`<${subject}> <${RDFS_LABEL}> "${escapeLiteral(synset.words[0].replace(/_/g, ' '))}" .`);
    counts.labels += 1;
    for (const pointer of synset.pointers) {
      const name = symbolToName.get(pointer.symbol);
      if (name === undefined) {
        counts.pointersLeftOut[pointer.symbol] = (counts.pointersLeftOut[pointer.symbol] ?? 0) + 1;
        continue;
      }
      lines.push(`<${subject}> <${WORDNET_PREDICATES[name]}> <${synsetIri(pointer.target)}> .`);
      counts.perPredicate[name] += 1;
    }
  }
  counts.triples = lines.length;
  writeFileSync(options.file, `${lines.join('\n')}\n`);
  return counts;
}

/** Writes planted statements as N-Triples; returns how many triples were written. */
export function writePlantedNTriples(options: { planted: PlantedStatement[]; file: string }): number {
  const lines = options.planted.map((statement) => {
    if (statement.kind === 'deprecated') {
      return `<${statement.subject}> <${OWL_DEPRECATED}> "true"^^<${XSD_BOOLEAN}> .`;
    }
    const predicate = statement.kind === 'disjointWith' ? OWL_DISJOINT_WITH : WORDNET_PREDICATES[statement.kind];
    return `<${statement.subject}> <${predicate}> <${statement.object}> .`;
  });
  writeFileSync(options.file, `${lines.join('\n')}\n`);
  return lines.length;
}

/** Writes an isapart.yaml mapping our predicates to roles, with the WordNet scope and the given root. */
export function writeWordnetConfig(options: { file: string; root: string; presets: string[] }): void {
  const yaml = [
    '# isapart config for the WordNet noun hierarchy written by test/wordnet.',
    `presets: [${options.presets.join(', ')}]`,
    'roles:',
    `  subclass-of: [${WORDNET_PREDICATES.hypernym}]`,
    `  instance-of: [${WORDNET_PREDICATES.instanceHypernym}]`,
    `  part-of: { iri: [${WORDNET_PREDICATES.partHolonym}], inverse: [${WORDNET_PREDICATES.partMeronym}] }`,
    `scope: [${WORDNET_NAMESPACE}]`,
    `roots: [${options.root}]`,
    '',
  ].join('\n');
  writeFileSync(options.file, yaml);
}

/** Escapes a string for an N-Triples literal (RDF 1.1 N-Triples, ECHAR). */
function escapeLiteral(text: string): string {
  return text.replace(/\\/g, '\\\\').replace(/"/g, '\\"').replace(/\n/g, '\\n').replace(/\r/g, '\\r');
}
