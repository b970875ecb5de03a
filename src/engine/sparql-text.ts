// Writing config values into SPARQL text safely: IRIs only after validation, strings escaped.
import { iriProblem } from '../config/iri-check.js';

/** A rule that cannot be compiled to SPARQL for this setting, or a value that may not reach a query. */
export class PushDownError extends Error {
  constructor(
    message: string,
    readonly hint: string,
  ) {
    super(message);
    this.name = 'PushDownError';
  }
}

/**
 * `<IRI>` for a validated absolute IRI (src/config/iri-check.ts: no `<>"{}|\^\``, spaces or
 * controls, a scheme). Anything else is refused, so no text from config or data can end the IRI
 * and continue the query.
 */
export function iriRef(iri: string, what: string): string {
  const problem = iriProblem(iri);
  if (problem !== undefined) {
    throw new PushDownError(`the ${what} '${iri}' cannot be written into a SPARQL query: ${problem}`, 'correct the IRI in the config or on the command line');
  }
  return `<${iri}>`;
}

/** Escapes of SPARQL 1.1 Query §19.7 (ECHAR) for a string between double quotes. */
const STRING_ESCAPES: Readonly<Record<string, string>> = {
  '\\': '\\\\',
  '"': '\\"',
  '\n': '\\n',
  '\r': '\\r',
  '\t': '\\t',
  '\b': '\\b',
  '\f': '\\f',
};

/** A SPARQL string literal `"..."` holding exactly the given text. */
export function stringLiteral(text: string): string {
  let written = '"';
  for (const character of text) written += STRING_ESCAPES[character] ?? character;
  return `${written}"`;
}

/** A SPARQL variable name of the rule (`?a`), checked to be one the grammar allows (VARNAME, ASCII subset). */
export function variableRef(variable: string): string {
  if (!/^\?[A-Za-z_][A-Za-z0-9_]*$/.test(variable)) {
    throw new PushDownError(`'${variable}' is not a variable name SPARQL accepts`, 'name rule variables with letters, digits and _, e.g. ?a');
  }
  return variable;
}
