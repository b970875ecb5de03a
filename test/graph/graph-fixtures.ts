// Test helpers for the graph: a small RoleMap, statements by hand, and Turtle read with n3's own parser.
import { Parser, type Quad, type Term } from 'n3';
import type { Literal, LoadedSource, Statement } from '../../src/load/statement.js';
import type { PredicateMapping, RoleMap } from '../../src/roles/role.js';
import {
  DCTERMS_HAS_PART,
  DCTERMS_IS_PART_OF,
  OWL_CLASS,
  OWL_DISJOINT_WITH,
  OWL_EQUIVALENT_CLASS,
  RDF_TYPE,
  RDFS_CLASS,
  RDFS_SUBCLASS_OF,
  XSD_STRING,
} from '../../src/roles/vocabulary.js';

/** The Northvale Rail demo namespace (our own scenario). */
export const NORTHVALE = 'https://data.northvale-rail.example/def/';

/** A RoleMap like the rdfs, owl and dcterms presets, written out here so the graph tests stand alone. */
export function testRoleMap(options: { readsDeprecated?: boolean; readsAllDisjointClasses?: boolean } = {}): RoleMap {
  const mappings = new Map<string, PredicateMapping>([
    [RDF_TYPE, { role: 'instance-of', inverse: false }],
    [RDFS_SUBCLASS_OF, { role: 'subclass-of', inverse: false }],
    [DCTERMS_IS_PART_OF, { role: 'part-of', inverse: false }],
    [DCTERMS_HAS_PART, { role: 'part-of', inverse: true }],
    [OWL_DISJOINT_WITH, { role: 'disjoint-with', inverse: false }],
    [OWL_EQUIVALENT_CLASS, { role: 'equivalent-to', inverse: false }],
  ]);
  return {
    get: (predicate) => mappings.get(predicate),
    classTypes: new Set([RDFS_CLASS, OWL_CLASS]),
    readsDeprecated: options.readsDeprecated ?? true,
    readsAllDisjointClasses: options.readsAllDisjointClasses ?? true,
    predicates: new Set(mappings.keys()),
  };
}

/** A plain string literal. */
export function literal(value: string, language = '', datatype = XSD_STRING): Literal {
  return { value, datatype, language };
}

/** One statement at a given line of a file. */
export function statement(
  subject: string,
  predicate: string,
  object: string | Literal,
  where: { file?: string; line: number },
): Statement {
  const file = where.file ?? 'northvale.ttl';
  return { subject, predicate, object, graph: '', position: { file, line: where.line, column: 1 }, objectLine: where.line };
}

/** A source holding the statements, with optional prefixes. */
export function source(statements: Statement[], prefixes: Record<string, string> = {}, file = 'northvale.ttl'): LoadedSource {
  return { file, format: 'turtle', statements, errors: [], allowComments: [], prefixes };
}

function termText(term: Term): string | Literal {
  if (term.termType === 'BlankNode') return `_:${term.value}`;
  if (term.termType === 'Literal') return { value: term.value, datatype: term.datatype.value, language: term.language };
  return term.value;
}

/**
 * Reads Turtle with n3's own parser (the reference parser, not our loader). Positions are the
 * statement's ordinal as its line, since only the graph is under test here.
 */
export function parseTurtle(text: string, file: string): LoadedSource {
  const prefixes: Record<string, string> = {};
  const quads: Quad[] = new Parser({ baseIRI: `file:///${file}` }).parse(text, null, (prefix, iri) => {
    prefixes[prefix] = iri.value;
  });
  const statements = quads.map((quad, index) =>
    statement(termText(quad.subject) as string, quad.predicate.value, termText(quad.object), {
      file,
      line: index + 1,
    }),
  );
  return source(statements, prefixes, file);
}
