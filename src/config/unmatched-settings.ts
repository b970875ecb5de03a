// Configured scope prefixes and roots that name nothing in the linted graph, reported as input warnings.
import type { HierarchyGraph } from '../graph/hierarchy-graph.js';
import type { InputError } from '../load/statement.js';
import type { IsapartConfig } from './config.js';
import { COMMAND_LINE_SOURCE } from './load-config.js';

/** Where each setting came from: the values given on the command line (the rest came from the config file). */
export interface SettingOrigins {
  commandLineScope: readonly string[];
  commandLineRoots: readonly string[];
}

/** The file an unmatched setting is reported against: the command line, or the config file (no line kept). */
function originOf(value: string, fromCommandLine: readonly string[], config: IsapartConfig): string {
  return fromCommandLine.includes(value) || config.file === undefined ? COMMAND_LINE_SOURCE : config.file;
}

/** Whether a value looks like a prefixed name (`nv:` or `nv:Asset`) rather than a full IRI. */
function looksPrefixed(value: string): boolean {
  return /^[A-Za-z][\w.-]*:(?!\/\/)/.test(value) && !/^(urn|tag|mailto|info|data):/i.test(value);
}

/**
 * Warnings for scope prefixes that start no node's IRI (every node would be out of scope, and
 * nothing reported for it) and for roots that are not nodes of the graph (a misspelt root hides
 * nothing but protects nothing). A graph with no nodes gets none: there is nothing to match.
 */
export function unmatchedSettingWarnings(graph: HierarchyGraph, config: IsapartConfig, origins: SettingOrigins): InputError[] {
  if (graph.nodeCount === 0) return [];
  const warnings: InputError[] = [];
  const unmatched = new Set(config.scope);
  for (let id = 0; id < graph.nodeCount && unmatched.size > 0; id++) {
    const term = graph.term(id);
    for (const prefix of unmatched) if (term.startsWith(prefix)) unmatched.delete(prefix);
  }
  for (const prefix of config.scope) {
    if (!unmatched.has(prefix)) continue;
    const prefixedHint = looksPrefixed(prefix) ? ' Prefixed names are not expanded in settings: write the full namespace IRI.' : '';
    warnings.push({
      file: originOf(prefix, origins.commandLineScope, config),
      line: 0,
      column: 0,
      message: `the scope prefix \`${prefix}\` starts no IRI of the linted graph, so it puts nothing in scope`,
      hint: `write the namespace of your own terms in full, such as https://data.northvale-rail.example/.${prefixedHint}`,
    });
  }
  for (const root of config.roots) {
    if (graph.idOf(root) >= 0) continue;
    const prefixedHint = looksPrefixed(root) ? ' Prefixed names are not expanded in settings: write the full IRI.' : '';
    warnings.push({
      file: originOf(root, origins.commandLineRoots, config),
      line: 0,
      column: 0,
      message: `the root \`${root}\` is not a node of the linted graph`,
      hint: `check its spelling against the class IRIs in the data, such as https://data.northvale-rail.example/def/Asset.${prefixedHint}`,
    });
  }
  return warnings;
}
