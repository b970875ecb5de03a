// Literals and escapes of SPARQL 1.1 text (W3C SPARQL 1.1 Query §19.2, §19.7, §19.8), as the edit reader turns tokens into terms.
import type { Literal } from '../load/statement.js';

const XSD = 'http://www.w3.org/2001/XMLSchema#';

/** A number token as a literal: xsd:integer, xsd:decimal or xsd:double by its form (SPARQL 1.1 §19.8). */
export function numberLiteral(text: string): Literal {
  // sparqljs 3.7.4, the reference parser, drops a leading '+' from the lexical form; kept the same here.
  const value = text.startsWith('+') ? text.slice(1) : text;
  const datatype = /[eE]/.test(text) ? 'double' : text.includes('.') ? 'decimal' : 'integer';
  return { value, datatype: `${XSD}${datatype}`, language: '' };
}

const STRING_ESCAPES: Record<string, string> = { t: '\t', b: '\b', n: '\n', r: '\r', f: '\f', '"': '"', "'": "'", '\\': '\\' };

/** A string body with its escapes read (SPARQL 1.1 §19.7 ECHAR, and \u/\U code points). */
export function unescapeString(body: string): string {
  return body.replace(/\\(u[0-9A-Fa-f]{4}|U[0-9A-Fa-f]{8}|.)/gs, (whole, escape: string) => {
    if (escape.length > 1) return String.fromCodePoint(Number.parseInt(escape.slice(1), 16));
    return STRING_ESCAPES[escape] ?? whole;
  });
}

/** Text with its \u and \U escapes read as code points (SPARQL 1.1 §19.2). */
export function unescapeCodepoints(text: string): string {
  return text.replace(/\\u([0-9A-Fa-f]{4})|\\U([0-9A-Fa-f]{8})/g, (_whole, short?: string, long?: string) =>
    String.fromCodePoint(Number.parseInt(short ?? long ?? '0', 16)),
  );
}
