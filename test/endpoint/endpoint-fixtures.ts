// Shared pieces of the endpoint tests: the demo in an oxigraph store, a config folder, finding comparison.
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import oxigraph from 'oxigraph';
import type { Finding } from '../../src/engine/finding.js';
import { folderWith } from '../cli/terminal-fake.js';

/** The demo folder shipped with isapart. */
export const DEMO = path.resolve('fixtures/demo');

/** The named graph the demo is loaded into. */
export const DEMO_GRAPH = 'https://data.northvale-rail.example/graph/demo';

/**
 * The demo files loaded into an oxigraph store by oxigraph's own Turtle and N-Triples parsers (an
 * independent reader of the same files), into the named graph, or the default graph for null.
 */
export function demoStore(graph: string | null = DEMO_GRAPH): oxigraph.Store {
  const store = new oxigraph.Store();
  for (const name of readdirSync(DEMO).sort()) {
    const format = name.endsWith('.ttl') ? 'text/turtle' : name.endsWith('.nt') ? 'application/n-triples' : undefined;
    if (format === undefined) continue;
    const file = path.join(DEMO, name);
    store.load(readFileSync(file, 'utf8'), {
      format,
      base_iri: `file://${file}`,
      to_graph_name: graph === null ? oxigraph.defaultGraph() : oxigraph.namedNode(graph),
    });
  }
  return store;
}

/** A folder holding the demo's isapart.yaml with an `endpoint:` section added. */
export function demoConfigFolder(endpointSection: string): string {
  const config = readFileSync(path.join(DEMO, 'isapart.yaml'), 'utf8');
  return folderWith({ 'isapart.yaml': `${config.trimEnd()}\n${endpointSection}\n` });
}

/** A finding reduced to what the file run and the endpoint run must agree on; blank nodes as `_:` (labels differ by source). */
export interface SameFinding {
  ruleId: string;
  focus: string;
  nodes: string[];
}

/** Findings of the hierarchy rules (unused-allow reads comments in files), suppression left aside, sorted. */
export function comparableFindings(findings: Finding[]): SameFinding[] {
  const blank = (term: string) => (term.startsWith('_:') ? '_:' : term);
  return findings
    .filter((finding) => finding.ruleId !== 'unused-allow')
    .map((finding) => ({ ruleId: finding.ruleId, focus: blank(finding.focus), nodes: finding.nodes.map(blank) }))
    .sort((left, right) => {
      const a = JSON.stringify(left);
      const b = JSON.stringify(right);
      return a < b ? -1 : a > b ? 1 : 0;
    });
}
