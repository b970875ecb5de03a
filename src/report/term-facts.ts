// What a report may show about the terms of the findings beyond their IRIs: labels and predicate roles.
import type { Finding } from '../engine/finding.js';
import type { HierarchyGraph } from '../graph/hierarchy-graph.js';
import type { PredicateMapping, RoleMap } from '../roles/role.js';

/** Labels of the nodes the findings name, and the roles of the predicates in their evidence. */
export interface FindingTermFacts {
  labels: Record<string, string>;
  predicateRoles: Record<string, PredicateMapping>;
}

/** Collects, once per run, the label of every node and the role of every predicate the findings mention. */
export function findingTermFacts(findings: readonly Finding[], graph: HierarchyGraph, roleMap: RoleMap): FindingTermFacts {
  const labels: Record<string, string> = {};
  const predicateRoles: Record<string, PredicateMapping> = {};
  const addLabel = (term: string) => {
    if (term in labels) return;
    const id = graph.idOf(term);
    const label = id < 0 ? undefined : graph.label(id);
    if (label !== undefined) labels[term] = label;
  };
  for (const finding of findings) {
    addLabel(finding.focus);
    for (const node of finding.nodes) addLabel(node);
    for (const statement of finding.evidence) {
      addLabel(statement.subject);
      if (typeof statement.object === 'string') addLabel(statement.object);
      const mapping = roleMap.get(statement.predicate);
      if (mapping !== undefined) predicateRoles[statement.predicate] = { role: mapping.role, inverse: mapping.inverse };
    }
  }
  return { labels, predicateRoles };
}
