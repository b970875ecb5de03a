// SPARQL 1.1 SELECT queries that ask what four built-in rules flag, for the benchmark's store-based comparison.
// Each query follows its rule's file in rules/ and design.md's definitions of class, scope and root;
// the predicates of each role come from the built-in presets, so the queries see what `check` sees.
import { DEFAULT_PRESETS } from '../../src/config/config.js';
import { PRESETS } from '../../src/roles/presets.js';
import type { Role } from '../../src/roles/role.js';
import { RDF_TYPE, RDFS_SUBCLASS_OF } from '../../src/roles/vocabulary.js';

/** The scope and roots a benchmark run uses, as in isapart.yaml. */
export interface BenchScope {
  /** In-scope IRI prefixes; must not be empty (the queries test scope by prefix). */
  prefixes: string[];
  roots: string[];
}

/** One query, named by the rule it stands for, and which variable's distinct values it counts. */
export interface RuleQuery {
  ruleId: 'subclass-cycle' | 'kind-and-part' | 'instance-and-subclass' | 'orphan-class';
  /** What a result row is, for the side-by-side table. */
  counts: string;
  sparql: string;
}

/** A SPARQL 1.1 property path for one role under the default presets: `<p>|^<q>|...`. */
export function rolePath(role: Role): string {
  const alternatives: string[] = [];
  for (const name of DEFAULT_PRESETS) {
    for (const predicate of PRESETS[name].predicates) {
      if (predicate.role === role) alternatives.push(`${predicate.inverse ? '^' : ''}<${predicate.iri}>`);
    }
  }
  if (alternatives.length === 0) throw new Error(`no predicate of role ${role} in the default presets`);
  return alternatives.length === 1 ? alternatives[0] : `(${alternatives.join('|')})`;
}

/** The rdf:type objects that declare a class under the default presets. */
function classTypes(): string[] {
  return DEFAULT_PRESETS.flatMap((name) => PRESETS[name].classTypes.map((iri) => `<${iri}>`));
}

/** A filter expression: `variable` is an IRI under one of the scope prefixes. */
function inScope(variable: string, scope: BenchScope): string {
  if (scope.prefixes.length === 0) throw new Error('the benchmark queries need at least one scope prefix');
  const tests = scope.prefixes.map((prefix) => `STRSTARTS(STR(${variable}), ${JSON.stringify(prefix)})`);
  return `isIRI(${variable}) && (${tests.join(' || ')})`;
}

/** The four queries, each equivalent to one built-in rule under the given scope and roots. */
export function ruleQueries(scope: BenchScope): RuleQuery[] {
  const instanceOf = rolePath('instance-of');
  const subclassOf = rolePath('subclass-of');
  const partOf = rolePath('part-of');
  // The rules only ever use rdf:type and rdfs:subClassOf for these two roles under the default presets.
  if (instanceOf !== `<${RDF_TYPE}>` || subclassOf !== `<${RDFS_SUBCLASS_OF}>`) throw new Error('unexpected preset predicates');
  const roots = scope.roots.map((iri) => `<${iri}>`).join(', ');
  return [
    {
      // subclass-cycle reports one finding per strongly connected component; SPARQL has no components,
      // so the query lists every class on a closed subclass-of chain and the runner compares member totals.
      ruleId: 'subclass-cycle',
      counts: 'classes on a cycle',
      sparql: `SELECT DISTINCT ?c WHERE { ?c ${subclassOf}+ ?c }`,
    },
    {
      ruleId: 'kind-and-part',
      counts: '(a, b) pairs',
      sparql: `SELECT DISTINCT ?a ?b WHERE {
  ?a ${partOf} ?b .
  ?a (${subclassOf}+|${instanceOf}/${subclassOf}*) ?b .
  FILTER(${inScope('?a', scope)})
}`,
    },
    {
      ruleId: 'instance-and-subclass',
      counts: '(x, c) pairs',
      sparql: `SELECT DISTINCT ?x ?c WHERE {
  ?x ${instanceOf} ?c .
  ?x ${subclassOf}+ ?c .
  FILTER(${inScope('?x', scope)})
}`,
    },
    {
      // A class: object of instance-of, subject or object of subclass-of, or declared (design.md).
      ruleId: 'orphan-class',
      counts: 'classes',
      sparql: `SELECT DISTINCT ?c WHERE {
  { ?c ${instanceOf} ?type . VALUES ?type { ${classTypes().join(' ')} } }
  UNION { [] ${instanceOf} ?c }
  UNION { ?c ${subclassOf} [] }
  UNION { [] ${subclassOf} ?c }
  FILTER(${inScope('?c', scope)})
  FILTER NOT EXISTS { ?c ${subclassOf} [] }
  ${roots ? `FILTER(?c NOT IN (${roots}))` : ''}
  FILTER NOT EXISTS { ?c ${instanceOf} ?k . FILTER(${inScope('?k', scope)}) }
}`,
    },
  ];
}
