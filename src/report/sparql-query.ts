// A rule's push-down query as `isapart rules --sparql` prints it: the setting it was compiled for, then the query.
import type { PushDownQuery, PushDownSetting } from '../engine/sparql-compile.js';
import { ROLES } from '../roles/role.js';

/** The predicates of each role as the query uses them, `^<IRI>` for those read backwards; validated IRIs only. */
function roleLines(setting: PushDownSetting): string[] {
  return ROLES.map((role) => {
    const predicates = [...setting.roleMap.predicates]
      .sort()
      .filter((predicate) => setting.roleMap.get(predicate)?.role === role)
      .map((predicate) => (setting.roleMap.get(predicate)?.inverse ? `^<${predicate}>` : `<${predicate}>`));
    const extra = role === 'disjoint-with' && setting.roleMap.readsAllDisjointClasses ? ['owl:AllDisjointClasses members'] : [];
    const all = [...predicates, ...extra];
    return `#   ${role}: ${all.length === 0 ? '(no predicate: matches nothing)' : all.join(', ')}`;
  });
}

/**
 * The query with a comment header naming the config file, the roles, scope, roots and graph it was
 * compiled for, and how isapart reads its rows; the SPARQL itself follows unchanged.
 */
export function pushDownQueryText(query: PushDownQuery, setting: PushDownSetting, configFile: string | undefined): string {
  const scope =
    setting.scope.length === 0 ? '(none: every IRI but the RDF, RDFS, OWL, XSD and SKOS namespaces)' : setting.scope.map((prefix) => `"${prefix}"`).join(', ');
  const roots = setting.roots.length === 0 ? '(none)' : setting.roots.map((root) => `<${root}>`).join(', ');
  const header = [
    `# The SPARQL 1.1 query of rule ${query.ruleId}, as 'isapart check --endpoint URL --push-down' sends it.`,
    `# Compiled for ${configFile === undefined ? 'the defaults (no isapart.yaml found)' : configFile} with:`,
    ...roleLines(setting),
    `#   scope: ${scope}`,
    `#   roots: ${roots}`,
    `#   graph: ${setting.graph === undefined ? "(the endpoint's default graph)" : `<${setting.graph}>`}`,
    '# Each row is one solution; isapart makes one finding per distinct set of reported nodes.',
    '# Rows of a cycle entry are edges inside a cycle; isapart groups them into components.',
  ];
  return `${header.join('\n')}\n${query.sparql}`;
}
