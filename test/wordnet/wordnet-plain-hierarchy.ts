// Builds the independent side's plain-map hierarchy straight from parsed data.noun records, not through isapart.
import { addPlainEdge, createPlainHierarchy, type PlainHierarchy, type PlainRole } from './independent-counts.js';
import type { NounSynset } from './noun-data.js';
import { POINTER_SYMBOLS, WORDNET_NAMESPACE, synsetIri, type PlantedStatement } from './wordnet-rdf.js';

/** The role each WordNet pointer symbol plays, per /work/shared/standards/README.md and design.md's role table. */
const POINTER_ROLES: Record<string, { role: PlainRole; inverse: boolean }> = {
  '@': { role: 'subclass-of', inverse: false },
  '@i': { role: 'instance-of', inverse: false },
  '#p': { role: 'part-of', inverse: false },
  '%p': { role: 'part-of', inverse: true },
};

/** The hierarchy of the synsets' pointers plus the planted statements, with scope and root as configured. */
export function plainHierarchy(options: { synsets: NounSynset[]; planted: PlantedStatement[]; root: string }): PlainHierarchy {
  const hierarchy = createPlainHierarchy({ scopePrefixes: [WORDNET_NAMESPACE], roots: [options.root] });
  const addPointer = (subject: string, symbol: string, object: string): void => {
    const meaning = POINTER_ROLES[symbol];
    if (meaning === undefined) return;
    const [from, to] = meaning.inverse ? [object, subject] : [subject, object];
    addPlainEdge(hierarchy, { role: meaning.role, subject: from, object: to });
  };
  for (const synset of options.synsets) {
    for (const pointer of synset.pointers) addPointer(synsetIri(synset.offset), pointer.symbol, synsetIri(pointer.target));
  }
  for (const statement of options.planted) {
    if (statement.kind === 'deprecated') hierarchy.deprecated.add(statement.subject);
    else if (statement.kind === 'disjointWith') addPlainEdge(hierarchy, { role: 'disjoint-with', ...statement });
    else addPointer(statement.subject, POINTER_SYMBOLS[statement.kind], statement.object);
  }
  return hierarchy;
}
