// Short display names: prefixed names from the sources' declared prefixes, else <IRI> or _:label.
import type { LoadedSource } from '../load/statement.js';
import { isBlank } from './owl-axioms.js';

/** A simple PN_LOCAL (Turtle): letters, digits, `_`, then also `.` and `-`, not ending in `.`. */
const SIMPLE_LOCAL = /^(?:[A-Za-z_0-9](?:[A-Za-z_0-9.-]*[A-Za-z_0-9_-])?)?$/;

/** The prefixes declared over all sources, for shortening IRIs. */
export class PrefixTable {
  /** (namespace, prefix) pairs, longest namespace first. */
  private readonly entries: { namespace: string; prefix: string }[] = [];

  /**
   * Collects prefixes in source order. A prefix name keeps its first namespace, and a namespace its
   * first prefix name, so a shortened name never means two IRIs.
   */
  constructor(sources: readonly LoadedSource[]) {
    const prefixNames = new Set<string>();
    const namespaces = new Set<string>();
    for (const source of sources) {
      for (const [prefix, namespace] of Object.entries(source.prefixes)) {
        if (prefixNames.has(prefix) || namespaces.has(namespace) || namespace === '') continue;
        prefixNames.add(prefix);
        namespaces.add(namespace);
        this.entries.push({ namespace, prefix });
      }
    }
    this.entries.sort((a, b) => b.namespace.length - a.namespace.length);
  }

  /** `prefix:local` with the longest namespace whose local part is simple, else `<IRI>`; blank nodes as they are. */
  shorten(term: string): string {
    if (isBlank(term)) return term;
    for (const { namespace, prefix } of this.entries) {
      if (!term.startsWith(namespace)) continue;
      const local = term.slice(namespace.length);
      if (SIMPLE_LOCAL.test(local)) return `${prefix}:${local}`;
    }
    return `<${term}>`;
  }
}
