// The FILTER expressions an edit's WHERE can evaluate exactly (W3C SPARQL 1.1 Query §17: operators, effective boolean values and errors), and what it refuses.
import type * as Sparql from 'sparqljs';
import type { Literal } from '../load/statement.js';
import { boundKey, type BoundTerm } from './statement-index.js';
import { XSD_STRING } from '../roles/vocabulary.js';

/** One solution: variable name → bound value. */
export type FilterSolution = Map<string, BoundTerm>;

/** A FILTER's value: true, false, or a type error (§17.2: a FILTER whose expression is an error drops the solution). */
type Truth = boolean | 'error';

/** A comparison this evaluator does not decide (literals compared by value), raised while evaluating. */
export class UnevaluatedFilter extends Error {}


const OPERATORS = new Set(['&&', '||', '!', '=', '!=', 'sameterm', 'isiri', 'isuri', 'isblank', 'isliteral', 'bound', 'in', 'notin', 'exists', 'notexists']);

/** The hint for a FILTER this evaluator does not read. */
export const FILTER_HINT =
  'a FILTER may use &&, ||, !, =, !=, IN, NOT IN, sameTerm, isIRI, isBlank, isLiteral, bound, EXISTS and NOT EXISTS on IRIs and plain strings; rewrite the others as INSERT DATA / DELETE DATA, or list the statements in --add / --remove files';

/** The first part of an expression that is not evaluated here (its operator or function), with the patterns EXISTS reads; undefined when all is. */
export function unsupportedExpression(expression: Sparql.Expression, checkPatterns: (patterns: Sparql.Pattern[]) => string | undefined): string | undefined {
  if (Array.isArray(expression)) {
    for (const item of expression) {
      const inner = unsupportedExpression(item, checkPatterns);
      if (inner !== undefined) return inner;
    }
    return undefined;
  }
  if ('termType' in expression) return expression.termType === 'Quad' ? 'an RDF-star quoted triple in a FILTER' : undefined;
  if (expression.type === 'functionCall') {
    const name = typeof expression.function === 'string' ? expression.function : `<${expression.function.value}>`;
    return `the function ${name} in a FILTER`;
  }
  if (expression.type !== 'operation') return `${expression.type} in a FILTER`;
  const operation = expression as Sparql.OperationExpression;
  if (!OPERATORS.has(operation.operator)) return `the operator ${operation.operator.toUpperCase()} in a FILTER`;
  if (operation.operator === 'exists' || operation.operator === 'notexists') return checkPatterns(operation.args as Sparql.Pattern[]);
  const logical = operation.operator === '&&' || operation.operator === '||' || operation.operator === '!';
  const operands = operation.operator === 'in' || operation.operator === 'notin' ? [operation.args[0], ...(operation.args[1] as unknown as Sparql.Expression[])] : operation.args;
  for (const argument of operands) {
    // Logical operators take tests; the tests take terms (a value computed from terms is left to a SPARQL engine).
    const isTerm = typeof argument === 'object' && argument !== null && 'termType' in argument;
    if (logical && isTerm) return `a term used as a truth value in a FILTER`;
    if (!logical && !isTerm) return `a computed value inside ${operation.operator.toUpperCase()} in a FILTER`;
    const inner = unsupportedExpression(argument as Sparql.Expression, checkPatterns);
    if (inner !== undefined) return inner;
  }
  return undefined;
}

/** Whether a whole FILTER expression is a test this evaluator reads (not a lone term). */
export function unsupportedFilter(expression: Sparql.Expression, checkPatterns: (patterns: Sparql.Pattern[]) => string | undefined): string | undefined {
  if (Array.isArray(expression) || 'termType' in expression) return 'a term used as a truth value in a FILTER';
  return unsupportedExpression(expression, checkPatterns);
}

/** Whether a FILTER keeps a solution; `exists` evaluates an EXISTS pattern with the solution's values substituted (§18.6). */
export function filterKeeps(expression: Sparql.Expression, solution: FilterSolution, exists: (patterns: Sparql.Pattern[], solution: FilterSolution) => boolean): boolean {
  return truth(expression, solution, exists) === true;
}

function truth(expression: Sparql.Expression, solution: FilterSolution, exists: (patterns: Sparql.Pattern[], solution: FilterSolution) => boolean): Truth {
  if (Array.isArray(expression) || !('type' in expression) || expression.type !== 'operation') {
    // A lone term's effective boolean value (§17.2.2) depends on literal values; only an unbound variable is decided here.
    const value = termValue(expression as Sparql.Expression, solution);
    if (value === undefined) return 'error';
    if (typeof value === 'string') return 'error';
    throw new UnevaluatedFilter(`the effective boolean value of the literal "${value.value}"`);
  }
  const operation = expression as Sparql.OperationExpression;
  const args = operation.args as Sparql.Expression[];
  const value = (index: number) => termValue(args[index], solution);
  switch (operation.operator) {
    case '&&': {
      const left = truth(args[0], solution, exists);
      const right = truth(args[1], solution, exists);
      // §17.2: false wins over an error in a conjunction.
      if (left === false || right === false) return false;
      return left === true && right === true ? true : 'error';
    }
    case '||': {
      const left = truth(args[0], solution, exists);
      const right = truth(args[1], solution, exists);
      if (left === true || right === true) return true;
      return left === false && right === false ? false : 'error';
    }
    case '!': {
      const inner = truth(args[0], solution, exists);
      return inner === 'error' ? 'error' : !inner;
    }
    case 'bound':
      return value(0) !== undefined;
    case 'isiri':
    case 'isuri':
      return kindTest(value(0), (term) => typeof term === 'string' && !term.startsWith('_:'));
    case 'isblank':
      return kindTest(value(0), (term) => typeof term === 'string' && term.startsWith('_:'));
    case 'isliteral':
      return kindTest(value(0), (term) => typeof term !== 'string');
    case 'sameterm': {
      const left = value(0);
      const right = value(1);
      return left === undefined || right === undefined ? 'error' : boundKey(left) === boundKey(right);
    }
    case '=':
      return equal(value(0), value(1));
    case '!=': {
      const same = equal(value(0), value(1));
      return same === 'error' ? 'error' : !same;
    }
    case 'in':
    case 'notin':
      return membership(value(0), args[1] as unknown as Sparql.Expression[], solution, operation.operator === 'notin');
    case 'exists':
      return exists(operation.args as Sparql.Pattern[], solution);
    case 'notexists':
      return !exists(operation.args as Sparql.Pattern[], solution);
    default:
      throw new UnevaluatedFilter(`the operator ${operation.operator}`);
  }
}

function kindTest(term: BoundTerm | undefined, test: (term: BoundTerm) => boolean): Truth {
  return term === undefined ? 'error' : test(term);
}

/**
 * RDFterm-equal (§17.4.1.7) where it needs no value comparison: terms that are the same are equal;
 * an IRI or blank node differs from any other term; two xsd:string literals compare their strings.
 * Two other literals would be compared by value, which is left to a SPARQL engine.
 */
function equal(left: BoundTerm | undefined, right: BoundTerm | undefined): Truth {
  if (left === undefined || right === undefined) return 'error';
  if (boundKey(left) === boundKey(right)) return true;
  if (typeof left === 'string' || typeof right === 'string') return false;
  if (isPlainString(left) && isPlainString(right)) return false;
  throw new UnevaluatedFilter(`a comparison of the literals "${left.value}" and "${right.value}" by value`);
}

// §17.4.1.9: IN is a disjunction of = tests, NOT IN a conjunction of != tests, with their errors.
function membership(term: BoundTerm | undefined, list: Sparql.Expression[], solution: FilterSolution, negated: boolean): Truth {
  let sawError = false;
  for (const item of list) {
    const same = equal(term, termValue(item, solution));
    if (same === true) return !negated;
    if (same === 'error') sawError = true;
  }
  return sawError ? 'error' : negated;
}

function isPlainString(literal: Literal): boolean {
  return literal.datatype === XSD_STRING && literal.language === '';
}

/** A term's value under the solution: a constant, a bound variable, or undefined for an unbound one. */
function termValue(expression: Sparql.Expression, solution: FilterSolution): BoundTerm | undefined {
  if (Array.isArray(expression) || !('termType' in expression)) throw new UnevaluatedFilter('a nested expression where a term was expected');
  switch (expression.termType) {
    case 'Variable':
      return solution.get(expression.value);
    case 'NamedNode':
      return expression.value;
    case 'Literal':
      return { value: expression.value, datatype: expression.datatype.value, language: expression.language };
    default:
      throw new UnevaluatedFilter('an RDF-star quoted triple');
  }
}
