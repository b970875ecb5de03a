// The graph's reading of RDF written as SPARQL 1.1: role predicates, axiom structures, node kinds, scope.
import type { NodeKind } from '../graph/hierarchy-graph.js';
import { SYMMETRIC_ROLES, type Role, type RoleMap } from '../roles/role.js';
import {
  BUILT_IN_VOCABULARY_NAMESPACES,
  OWL_ALL_DIFFERENT,
  OWL_ALL_DISJOINT_CLASSES,
  OWL_AXIOM,
  OWL_COMPLEMENT_OF,
  OWL_DEPRECATED,
  OWL_INTERSECTION_OF,
  OWL_MEMBERS,
  OWL_NAMESPACE,
  OWL_ONE_OF,
  OWL_RESTRICTION,
  OWL_UNION_OF,
  RDF_FIRST,
  RDF_NIL,
  RDF_REST,
  RDF_TYPE,
  XSD_BOOLEAN,
  XSD_STRING,
} from '../roles/vocabulary.js';
import { iriRef, stringLiteral } from './sparql-text.js';

/** What a query is compiled for: the run's roles, scope prefixes and roots, and optionally one named graph. */
export interface PushDownSetting {
  roleMap: RoleMap;
  scope: string[];
  roots: string[];
  graph?: string;
}

/** Types that make a term an axiom structure (as src/graph/owl-axioms.ts reads them). */
const AXIOM_TYPES = [OWL_ALL_DISJOINT_CLASSES, OWL_ALL_DIFFERENT, OWL_AXIOM, OWL_RESTRICTION];
/** Predicates whose blank subject is an axiom structure (as src/graph/owl-axioms.ts reads them). */
const STRUCTURE_PREDICATES = [RDF_FIRST, RDF_REST, OWL_UNION_OF, OWL_INTERSECTION_OF, OWL_COMPLEMENT_OF, OWL_ONE_OF, OWL_MEMBERS, `${OWL_NAMESPACE}onProperty`];

/** Fresh variable names that collide with no rule variable. */
export class VariableNames {
  private counter = 0;

  constructor(private readonly taken: ReadonlySet<string>) {}

  /** A new variable `?_vN` not used anywhere else in the query. */
  fresh(): string {
    let name: string;
    do name = `?_v${++this.counter}`;
    while (this.taken.has(name));
    return name;
  }
}

/** One direction of one role's predicates as SPARQL path elements: `<p>` forwards, `^<p>` backwards. */
function roleElements(roleMap: RoleMap, role: Role, backward: boolean): string[] {
  const elements: string[] = [];
  for (const predicate of [...roleMap.predicates].sort()) {
    const mapping = roleMap.get(predicate);
    if (mapping === undefined || mapping.role !== role) continue;
    const iri = iriRef(predicate, `predicate of role ${role}`);
    if (SYMMETRIC_ROLES.has(role)) elements.push(iri, `^${iri}`);
    else elements.push(mapping.inverse !== backward ? `^${iri}` : iri);
  }
  return elements;
}

/** The SPARQL fragments of one setting; every IRI in them was validated on the way in. */
export class GraphTerms {
  readonly readsAllDisjointClasses: boolean;
  private readonly inScopeTemplate: (term: string, fresh: () => string, blankSubject?: string) => string;

  constructor(
    readonly setting: PushDownSetting,
    readonly names: VariableNames,
  ) {
    this.readsAllDisjointClasses = setting.roleMap.readsAllDisjointClasses;
    this.inScopeTemplate = inScopeExpression(setting.scope);
    for (const root of setting.roots) iriRef(root, 'root');
  }

  /** The path elements of a role in a direction (empty when no predicate plays it). */
  roleElements(role: Role, backward: boolean): string[] {
    return roleElements(this.setting.roleMap, role, backward);
  }

  /** A role as one path primary, `(<p>|^<q>)`, or undefined when no predicate plays it. */
  rolePath(role: Role, backward = false): string | undefined {
    const elements = this.roleElements(role, backward);
    if (elements.length === 0) return undefined;
    return elements.length === 1 ? elements[0] : `(${elements.join('|')})`;
  }

  /** Every mapped predicate, forwards: a statement with any of them makes both its ends nodes. */
  private anyRolePath(): string | undefined {
    const predicates = [...this.setting.roleMap.predicates].sort().map((predicate) => iriRef(predicate, 'role predicate'));
    if (predicates.length === 0) return undefined;
    return predicates.length === 1 ? predicates[0] : `(${predicates.join('|')})`;
  }

  /** Whether a term is read as an OWL axiom structure rather than a node: typed as an axiom, or a blank subject of list or class-expression predicates. */
  structure(term: string): string {
    const predicate = this.names.fresh();
    const value = this.names.fresh();
    const types = AXIOM_TYPES.map((iri) => iriRef(iri, 'axiom type')).join(', ');
    const predicates = STRUCTURE_PREDICATES.map((iri) => iriRef(iri, 'structure predicate')).join(', ');
    return (
      `EXISTS { ${term} ${predicate} ${value} . ` +
      `FILTER((sameTerm(${predicate}, ${iriRef(RDF_TYPE, 'rdf:type')}) && ${value} IN (${types})) || (isBlank(${term}) && ${predicate} IN (${predicates}))) }`
    );
  }

  /** Whether a term can be a node at all: not a literal, not an axiom structure. */
  valid(term: string): string {
    return `(!isLiteral(${term}) && !${this.structure(term)})`;
  }

  /** The pattern of owl:AllDisjointClasses member pairs, `left` and `right` distinct members of one list. */
  allDisjointPairs(left: string, right: string): string {
    const axiom = this.names.fresh();
    const list = this.names.fresh();
    const first = iriRef(RDF_FIRST, 'rdf:first');
    const rest = iriRef(RDF_REST, 'rdf:rest');
    return (
      `${axiom} ${iriRef(OWL_MEMBERS, 'owl:members')} ${list} . ${axiom} ${iriRef(RDF_TYPE, 'rdf:type')} ${iriRef(OWL_ALL_DISJOINT_CLASSES, 'owl:AllDisjointClasses')} . ` +
      `${list} ${rest}* ${iriRef(RDF_NIL, 'rdf:nil')} . ${list} ${rest}*/${first} ${left} . ${list} ${rest}*/${first} ${right} . FILTER(!sameTerm(${left}, ${right}))`
    );
  }

  /** Whether a bound term is of a node kind (the term is known to be a node or checked by the caller). */
  kind(kind: NodeKind, term: string): string {
    switch (kind) {
      case 'class':
        return this.isClass(term);
      case 'individual': {
        const instanceOf = this.rolePath('instance-of');
        if (instanceOf === undefined) return 'false';
        return `(${this.edgeExists(term, instanceOf, 'out')} && !${this.isClass(term)})`;
      }
      case 'declared-class':
        return this.declaredClass(term);
      case 'deprecated':
        return this.deprecated(term);
      case 'root':
        return this.setting.roots.length === 0 ? 'false' : `(${term} IN (${this.setting.roots.map((root) => iriRef(root, 'root')).join(', ')}))`;
      case 'in-scope':
        return this.inScopeTemplate(term, () => this.names.fresh());
    }
  }

  /**
   * Patterns that bind `flag` to whether a bound term is in scope, for the end of the top-level
   * group. EXISTS inside BIND is refused by some stores (Virtuoso 7.2), so a blank node's
   * statements are looked up with an OPTIONAL instead (SELECT DISTINCT folds the extra rows).
   */
  inScopeFlag(term: string, flag: string): string[] {
    const predicate = this.names.fresh();
    const object = this.names.fresh();
    return [
      `OPTIONAL { ${term} ${predicate} ${object} . FILTER(isBlank(${term})) }`,
      `BIND(${this.inScopeTemplate(term, () => this.names.fresh(), `BOUND(${predicate})`)} AS ${flag})`,
    ];
  }

  /** A group pattern binding an unbound variable to every node of a kind. */
  kindGenerator(kind: NodeKind, variable: string): string {
    // A class is bound exactly by its edges to valid nodes (and declarations), so no test follows.
    const candidates = kind === 'in-scope' ? this.nodeCandidates(variable) : kind === 'class' ? this.classes(variable) : this.kindCandidates(kind, variable);
    if (candidates.length === 0) return 'FILTER(false)';
    const union = candidates.map((candidate) => `{ ${candidate} }`).join(' UNION ');
    const exact =
      kind === 'class' ? '' : ` && ${kind === 'in-scope' || kind === 'root' ? `${this.isNode(variable)} && ${this.kind(kind, variable)}` : this.kind(kind, variable)}`;
    return `{ SELECT DISTINCT ${variable} WHERE { ${union} } } FILTER(${this.valid(variable)}${exact})`;
  }

  /** Patterns that bind exactly the classes, but for the check that the variable itself is valid. */
  private classes(variable: string): string[] {
    const instanceOf = this.rolePath('instance-of');
    const subclassOf = this.rolePath('subclass-of');
    const edge = (pattern: string, other: string): string => `${pattern} . FILTER(${this.valid(other)})`;
    const patterns: string[] = [];
    if (instanceOf !== undefined) {
      const other = this.names.fresh();
      patterns.push(edge(`${other} ${instanceOf} ${variable}`, other));
    }
    if (subclassOf !== undefined) {
      const above = this.names.fresh();
      const below = this.names.fresh();
      patterns.push(edge(`${variable} ${subclassOf} ${above}`, above), edge(`${below} ${subclassOf} ${variable}`, below));
    }
    const types = [...this.setting.roleMap.classTypes].sort();
    if (types.length > 0) {
      const type = this.names.fresh();
      patterns.push(`${variable} ${iriRef(RDF_TYPE, 'rdf:type')} ${type} . FILTER(${type} IN (${types.map((iri) => iriRef(iri, 'class type')).join(', ')}))`);
    }
    return patterns;
  }

  /** A group pattern binding an unbound variable to every node of the graph. */
  nodeGenerator(variable: string): string {
    const candidates = this.nodeCandidates(variable);
    if (candidates.length === 0) return 'FILTER(false)';
    const union = candidates.map((candidate) => `{ ${candidate} }`).join(' UNION ');
    return `{ SELECT DISTINCT ${variable} WHERE { ${union} } } FILTER(${this.valid(variable)} && ${this.isNode(variable)})`;
  }

  private kindCandidates(kind: NodeKind, variable: string): string[] {
    const other = this.names.fresh();
    const instanceOf = this.rolePath('instance-of');
    const subclassOf = this.rolePath('subclass-of');
    switch (kind) {
      case 'class':
        return [
          ...(instanceOf === undefined ? [] : [`${other} ${instanceOf} ${variable}`]),
          ...(subclassOf === undefined ? [] : [`${variable} ${subclassOf} ${other}`, `${other} ${subclassOf} ${variable}`]),
          ...this.kindCandidates('declared-class', variable),
        ];
      case 'individual':
        return instanceOf === undefined ? [] : [`${variable} ${instanceOf} ${other}`];
      case 'declared-class':
        return this.setting.roleMap.classTypes.size === 0 ? [] : [`${variable} ${iriRef(RDF_TYPE, 'rdf:type')} ${other}`];
      case 'deprecated':
        return this.setting.roleMap.readsDeprecated ? [`${variable} ${iriRef(OWL_DEPRECATED, 'owl:deprecated')} ${other}`] : [];
      case 'root':
        return this.setting.roots.length === 0 ? [] : [`VALUES ${variable} { ${this.setting.roots.map((root) => iriRef(root, 'root')).join(' ')} }`];
      case 'in-scope':
        return this.nodeCandidates(variable);
    }
  }

  /** Patterns that together bind every node (and some terms that are not: the exact test follows). */
  private nodeCandidates(variable: string): string[] {
    const candidates: string[] = [];
    const any = this.anyRolePath();
    const other = this.names.fresh();
    if (any !== undefined) candidates.push(`${variable} ${any} ${other}`, `${other} ${any} ${variable}`);
    candidates.push(...this.kindCandidates('declared-class', variable), ...this.kindCandidates('deprecated', variable));
    if (this.setting.roots.length > 0) {
      const roots = this.setting.roots.map((root) => iriRef(root, 'root')).join(' ');
      candidates.push(`VALUES ${variable} { ${roots} }`);
    }
    if (this.readsAllDisjointClasses) {
      const list = this.names.fresh();
      candidates.push(`${this.names.fresh()} ${iriRef(OWL_MEMBERS, 'owl:members')} ${list} . ${list} ${iriRef(RDF_REST, 'rdf:rest')}*/${iriRef(RDF_FIRST, 'rdf:first')} ${variable}`);
    }
    return candidates;
  }

  /** Whether a valid term is a node: an end of a role statement, a declared class, deprecated, a stated root or an AllDisjointClasses member. */
  isNode(term: string): string {
    const parts: string[] = [];
    const any = this.anyRolePath();
    if (any !== undefined) parts.push(this.edgeExists(term, any, 'out'), this.edgeExists(term, any, 'in'));
    parts.push(this.declaredClass(term), this.deprecated(term));
    if (this.setting.roots.length > 0) {
      const subject = this.names.fresh();
      const predicate = this.names.fresh();
      const object = this.names.fresh();
      parts.push(
        `(${this.kind('root', term)} && (EXISTS { ${term} ${predicate} ${object} } || EXISTS { ${subject} ${this.names.fresh()} ${term} . FILTER(!${this.structure(subject)}) }))`,
      );
    }
    if (this.readsAllDisjointClasses) {
      const axiom = this.names.fresh();
      const list = this.names.fresh();
      parts.push(
        `EXISTS { ${axiom} ${iriRef(OWL_MEMBERS, 'owl:members')} ${list} . ${axiom} ${iriRef(RDF_TYPE, 'rdf:type')} ${iriRef(OWL_ALL_DISJOINT_CLASSES, 'owl:AllDisjointClasses')} . ` +
          `${list} ${iriRef(RDF_REST, 'rdf:rest')}* ${iriRef(RDF_NIL, 'rdf:nil')} . ${list} ${iriRef(RDF_REST, 'rdf:rest')}*/${iriRef(RDF_FIRST, 'rdf:first')} ${term} }`,
      );
    }
    return `(${parts.join(' || ')})`;
  }

  /** Whether a term has an edge of a path to or from a valid term. */
  private edgeExists(term: string, path: string, direction: 'out' | 'in'): string {
    const other = this.names.fresh();
    const pattern = direction === 'out' ? `${term} ${path} ${other}` : `${other} ${path} ${term}`;
    return `EXISTS { ${pattern} . FILTER(${this.valid(other)}) }`;
  }

  private isClass(term: string): string {
    const parts: string[] = [];
    const instanceOf = this.rolePath('instance-of');
    const subclassOf = this.rolePath('subclass-of');
    if (instanceOf !== undefined) parts.push(this.edgeExists(term, instanceOf, 'in'));
    if (subclassOf !== undefined) parts.push(this.edgeExists(term, subclassOf, 'out'), this.edgeExists(term, subclassOf, 'in'));
    parts.push(this.declaredClass(term));
    return `(${parts.join(' || ')})`;
  }

  private declaredClass(term: string): string {
    const types = [...this.setting.roleMap.classTypes].sort();
    if (types.length === 0) return 'false';
    const type = this.names.fresh();
    return `EXISTS { ${term} ${iriRef(RDF_TYPE, 'rdf:type')} ${type} . FILTER(${type} IN (${types.map((iri) => iriRef(iri, 'class type')).join(', ')})) }`;
  }

  /** owl:deprecated with a true boolean: "true" or "1", plain or xsd:boolean, surrounding white space allowed. */
  private deprecated(term: string): string {
    if (!this.setting.roleMap.readsDeprecated) return 'false';
    const value = this.names.fresh();
    const datatypes = [XSD_STRING, XSD_BOOLEAN].map((iri) => iriRef(iri, 'datatype')).join(', ');
    return (
      `EXISTS { ${term} ${iriRef(OWL_DEPRECATED, 'owl:deprecated')} ${value} . ` +
      `FILTER(isLiteral(${value}) && DATATYPE(${value}) IN (${datatypes}) && REGEX(STR(${value}), ${stringLiteral('^[ \t\n\r]*(true|1)[ \t\n\r]*$')})) }`
    );
  }
}

/** The in-scope test of src/graph/scope.ts and build.ts as a SPARQL expression template over one term. */
function inScopeExpression(prefixes: readonly string[]): (term: string, fresh: () => string, blankSubject?: string) => string {
  for (const prefix of prefixes) iriRef(prefix, 'scope prefix');
  const startsWithAny = (text: string, list: readonly string[]): string =>
    list.length === 0 ? 'false' : `(${list.map((prefix) => `STRSTARTS(${text}, ${stringLiteral(prefix)})`).join(' || ')})`;
  return (term, fresh, blankSubject) => {
    const text = `STR(${term})`;
    // A term of a built-in vocabulary is in scope only under a prefix that names its namespace.
    const builtIn = BUILT_IN_VOCABULARY_NAMESPACES.flatMap((namespace) => {
      const naming = prefixes.filter((prefix) => prefix.startsWith(namespace));
      return naming.length === 0 ? [] : [`(STRSTARTS(${text}, ${stringLiteral(namespace)}) && ${startsWithAny(text, naming)})`];
    });
    const outside = `!${startsWithAny(text, BUILT_IN_VOCABULARY_NAMESPACES)}${prefixes.length === 0 ? '' : ` && ${startsWithAny(text, prefixes)}`}`;
    const iri = `(isIRI(${term}) && (${[...builtIn, `(${outside})`].join(' || ')}))`;
    // A blank node is in scope when it is the subject of a statement (design.md).
    return `(${iri} || (isBlank(${term}) && ${blankSubject ?? `EXISTS { ${term} ${fresh()} ${fresh()} }`}))`;
  };
}
