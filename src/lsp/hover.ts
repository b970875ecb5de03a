// What a hover on a term shows: its label, its superclass chains up to a root, what it is part of, and its findings.
import type { Finding } from '../engine/finding.js';
import type { HierarchyGraph } from '../graph/hierarchy-graph.js';
import type { Role } from '../roles/role.js';

/** How many chains of one kind a hover lists, shortest first. */
export const CHAINS_SHOWN = 3;

/** How many partial chains the search may extend before it stops (the graph may be wide). */
const CHAIN_SEARCH_LIMIT = 20_000;

/** Chains of one role from a node, each a list of node ids starting with the node. */
export interface Chains {
  /** Complete chains, each ending at a node with no further edge of the role, shortest first. */
  chains: number[][];
  /** Whether some chain leads back into itself (a cycle), so it has no end. */
  cyclic: boolean;
}

/**
 * Up to `limit` chains of a role from a node to nodes with no outgoing edge of that role (for
 * subclass-of, the roots of the hierarchy), shortest first, found breadth first. A chain that
 * returns to a node already on it is dropped and reported as `cyclic`.
 */
export function chainsFrom(graph: HierarchyGraph, role: Role, start: number, limit: number = CHAINS_SHOWN): Chains {
  const chains: number[][] = [];
  let cyclic = false;
  const queue: number[][] = [[start]];
  for (let next = 0; next < queue.length && chains.length < limit && queue.length < CHAIN_SEARCH_LIMIT; next++) {
    const chain = queue[next];
    const successors = graph.successors(role, chain[chain.length - 1]);
    if (successors.length === 0) {
      if (chain.length > 1) chains.push(chain);
      continue;
    }
    for (const successor of successors) {
      if (chain.includes(successor)) cyclic = true;
      else queue.push([...chain, successor]);
    }
  }
  return { chains, cyclic };
}

/** The hover text of a term as Markdown, or undefined when the last lint's graph has no such node. */
export function hoverMarkdown(graph: HierarchyGraph, iri: string, findings: readonly Finding[]): string | undefined {
  const id = graph.idOf(iri);
  if (id < 0) return undefined;
  const name = (node: number) => `\`${graph.displayName(node)}\``;
  const lines: string[] = [];
  const label = graph.label(id);
  lines.push(label === undefined ? `**${name(id)}**` : `**${name(id)}** — ${label}`);
  lines.push('', `<${graph.term(id)}>`);

  const kinds = (['class', 'individual', 'declared-class', 'deprecated', 'root', 'in-scope'] as const).filter((kind) => graph.is(kind, id));
  if (kinds.length > 0) lines.push('', `is: ${kinds.join(', ')}`);

  const types = [...graph.successors('instance-of', id)];
  if (types.length > 0) lines.push('', `instance of: ${types.map(name).join(', ')}`);

  lines.push(...chainSection(graph, 'subclass-of', id, 'superclass chains', 'no superclass (a root of the hierarchy)', name));
  lines.push(...chainSection(graph, 'part-of', id, 'part of', undefined, name));

  const involved = findings.filter((finding) => finding.nodes.includes(iri) || finding.focus === iri);
  if (involved.length > 0) {
    lines.push('', '**findings**');
    for (const finding of involved) {
      const allowed = finding.suppression ? ` (allowed: ${finding.suppression.justification})` : '';
      lines.push(`- ${finding.level} \`${finding.ruleId}\`: ${finding.message}${allowed}`);
    }
  }
  return lines.join('\n');
}

/** A titled list of chains of one role, or the `none` line (nothing when `none` is undefined). */
function chainSection(
  graph: HierarchyGraph,
  role: Role,
  id: number,
  title: string,
  none: string | undefined,
  name: (node: number) => string,
): string[] {
  const { chains, cyclic } = chainsFrom(graph, role, id);
  if (chains.length === 0 && !cyclic) return none === undefined ? [] : ['', none];
  const lines = ['', `${title}:`];
  for (const chain of chains) lines.push(`- ${chain.map(name).join(' → ')}`);
  if (cyclic) lines.push(`- (a chain of ${role} statements comes back to a node already on it: a cycle)`);
  return lines;
}
