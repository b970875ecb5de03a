// The statements of a run as integer columns: term numbers of subject and object, and a predicate number.
import type { LoadedSource, Statement } from '../load/statement.js';
import { TermInterner } from './interner.js';

/** The object column's value for a literal object. */
export const LITERAL_OBJECT = -1;

/**
 * All statements of all sources in source order, with row i's subject and object as term numbers
 * of `terms` (a literal object as LITERAL_OBJECT) and its predicate as an index into `predicateIris`.
 */
export interface StatementTable {
  statements: readonly Statement[];
  terms: TermInterner;
  subjects: Int32Array;
  objects: Int32Array;
  predicates: Int32Array;
  /** Each distinct predicate IRI once, in first-seen order. */
  predicateIris: readonly string[];
}

/** Numbers the terms and predicates of every statement, one map lookup per term occurrence. */
export function tabulateStatements(sources: readonly LoadedSource[]): StatementTable {
  const statements: Statement[] = [];
  for (const source of sources) for (const statement of source.statements) statements.push(statement);
  const terms = new TermInterner();
  const subjects = new Int32Array(statements.length);
  const objects = new Int32Array(statements.length);
  const predicates = new Int32Array(statements.length);
  const predicateNumbers = new Map<string, number>();
  const predicateIris: string[] = [];
  for (let row = 0; row < statements.length; row++) {
    const { subject, predicate, object } = statements[row];
    subjects[row] = terms.number(subject);
    objects[row] = typeof object === 'string' ? terms.number(object) : LITERAL_OBJECT;
    let predicateNumber = predicateNumbers.get(predicate);
    if (predicateNumber === undefined) {
      predicateNumber = predicateIris.length;
      predicateNumbers.set(predicate, predicateNumber);
      predicateIris.push(predicate);
    }
    predicates[row] = predicateNumber;
  }
  return { statements, terms, subjects, objects, predicates, predicateIris };
}
