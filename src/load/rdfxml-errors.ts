// Turning an RDF/XML parser's or XML reader's error into an InputError that says what is wrong and how to fix it.
import type { InputError } from './statement.js';
import type { LineColumn } from './line-counter.js';

interface RdfXmlErrorKind {
  pattern: RegExp;
  hint: (match: RegExpMatchArray) => string;
}

// RDF 1.1 XML Syntax (W3C Recommendation, 2014) is the grammar these hints refer to; the patterns are
// the messages of rdfxml-streaming-parser 3.3.0 and saxes, most specific first.
const ERROR_KINDS: readonly RdfXmlErrorKind[] = [
  {
    pattern: /unbound namespace prefix: "?([^"\s]*)"?/i,
    hint: (match) => `declare the prefix with xmlns:${match[1]}="..." on this element or one around it`,
  },
  {
    pattern: /^Illegal (node|property) element name: (\S+)/,
    hint: (match) =>
      match[1] === 'node'
        ? `rdf:${match[2]} cannot name a node element; use rdf:Description or a class name`
        : `rdf:${match[2]} cannot name a property element; use a property IRI`,
  },
  {
    pattern: /^Only one of rdf:about, rdf:nodeID and rdf:ID/,
    hint: () => 'a node element names its subject once: keep one of rdf:about, rdf:ID and rdf:nodeID',
  },
  {
    pattern: /^Not a valid NCName/,
    hint: () => 'rdf:ID and rdf:nodeID values are XML names: a letter or _ first, then letters, digits, ., - or _',
  },
  {
    pattern: /^Found multiple occurrences of rdf:ID/,
    hint: () => 'each rdf:ID value names one resource per base IRI; use rdf:about to say more about it',
  },
  {
    pattern: /rdf:parseType is not allowed|Found both|Found illegal rdf:\* properties/,
    hint: () => 'a property element has one object: rdf:resource, rdf:nodeID, rdf:parseType, rdf:datatype with text, or nested content',
  },
  {
    pattern: /is not supported\.$/,
    hint: () => 'rdf:bagID, rdf:aboutEach and rdf:aboutEachPrefix were removed from RDF/XML; state the statements directly',
  },
  {
    pattern: /IRI|URI/,
    hint: () => 'IRIs have no spaces, quotes or {}|^` in them (escape them as %20 and the like), and need a scheme or a base to resolve against',
  },
  {
    pattern: /unclosed tag|unexpected end|text data outside of root node|document must contain a root element/i,
    hint: () => 'every element that is opened must be closed, inside one root element (usually rdf:RDF)',
  },
  {
    pattern: /./,
    hint: () => 'check the XML at this place: tags closed in order, attribute values quoted, & written as &amp;',
  },
];

/** The InputError for the first failure of an RDF/XML document, at the given place. */
export function rdfXmlSyntaxError(file: string, error: Error, place: LineColumn): InputError {
  const description = plainMessage(error.message);
  const kind = ERROR_KINDS.find((candidate) => candidate.pattern.test(description)) as RdfXmlErrorKind;
  return {
    file,
    line: place.line,
    column: place.column,
    message: `RDF/XML syntax error: ${description}. The rest of the file was not read.`,
    hint: kind.hint(description.match(kind.pattern) as RegExpMatchArray),
  };
}

/** A message without the position the parsers prefix (`Line 3 column 7: ` or `3:7: `) and without a closing dot. */
function plainMessage(message: string): string {
  return message
    .replace(/^Line \d+ column \d+: /, '')
    .replace(/^\d+:\d+: /, '')
    .replace(/\.$/, '');
}
