// Turning an n3 syntax error into an InputError that says what was found, what was expected, and how to fix it.
import type { InputError, N3Format, RdfFormat } from './statement.js';
import type { N3ErrorContext, N3Token } from './n3-tokens.js';

/** What the loader knows when n3 stops with a syntax error. */
export interface SyntaxErrorSite {
  file: string;
  format: N3Format;
  /** The text of a 1-based line of the source, without its line end: only the error's line is asked for. */
  textOfLine: (line: number) => string;
  error: Error & { context?: N3ErrorContext };
  /** Whether the text is one line of a larger source whose other lines are still read. */
  singleLine?: boolean;
}

interface ErrorKind {
  pattern: RegExp;
  expected: (match: RegExpMatchArray, format: N3Format) => string;
  hint: (match: RegExpMatchArray, format: N3Format) => string;
}

const isLineBased = (format: N3Format): boolean => format === 'n-triples' || format === 'n-quads';

const STATEMENT_END_HINT = (format: N3Format): string =>
  isLineBased(format)
    ? 'each line holds one statement: subject, predicate, object' +
      (format === 'n-quads' ? ', optional graph,' : '') +
      " and a closing ' .'"
    : "a Turtle statement ends with ' .'; separate predicates with ';' and objects with ','";

const IRI_HINT =
  'IRIs are written <...>, with no spaces, quotes or {}|^` inside (escape them as %20 and the like)';

const GRAPH_BLOCK_HINT = 'graph blocks { ... } belong to TriG: name the file .trig, or remove the braces';

// n3's messages, most specific first (they are matched against the message without " on line N.").
const ERROR_KINDS: readonly ErrorKind[] = [
  {
    pattern: /^Undefined prefix "([^"]*):"/,
    expected: (match) => `a prefix declared before use (@prefix ${match[1]}: <...> .)`,
    hint: (match) =>
      `check that the prefix "${match[1]}:" is declared with @prefix (or PREFIX) before this line, and its spelling`,
  },
  {
    pattern: /^(?:Expected punctuation to follow|Expected dot to follow|Expected declaration to end with a dot)/,
    expected: (_match, format) => (isLineBased(format) ? "' .'" : "'.', ';' or ','"),
    hint: (_match, format) => STATEMENT_END_HINT(format),
  },
  {
    pattern: /^(?:Invalid IRI|Expected valid IRI|Expected IRI to follow)/,
    expected: () => 'an IRI written <...>',
    hint: () => IRI_HINT,
  },
  {
    pattern: /^Expected prefix to follow @prefix/,
    expected: () => 'a prefix name ending in ":"',
    hint: () => 'declare a prefix as @prefix name: <namespace-IRI> .',
  },
  {
    pattern: /^Unclosed graph/,
    expected: () => "'}' closing the graph block",
    hint: () => "every '{' that opens a graph block needs a matching '}'",
  },
  {
    pattern: /^(?:Unexpected graph|Invalid graph label)/,
    expected: (_match, format) => (format === 'trig' ? 'a graph label (an IRI or blank node) before {' : 'a statement'),
    hint: (_match, format) =>
      format === 'trig'
        ? 'a graph block is written <graph-IRI> { ... } at the top level'
        : GRAPH_BLOCK_HINT,
  },
  {
    pattern: /^(?:Disallowed blank node as predicate|Expected predicate)/,
    expected: () => 'a predicate (an IRI, a prefixed name or a)',
    hint: () => 'a predicate must be an IRI; blank nodes and literals cannot be predicates',
  },
  {
    pattern: /^Unexpected literal/,
    expected: () => 'an IRI or blank node',
    hint: () => 'a literal can only stand in the object position of a statement',
  },
  {
    pattern: /language tag|languaged-tagged/i,
    expected: () => 'a language tag such as @en or @de-CH',
    hint: () => 'a literal has either a language tag or a datatype, and tag parts have at most 8 letters',
  },
  {
    pattern: /^Expected entity but got (\S+)/,
    expected: () => 'an RDF term (an IRI, a prefixed name, a blank node or a literal)',
    hint: (match, format) =>
      match[1] === '{' && format !== 'trig'
        ? GRAPH_BLOCK_HINT
        : isLineBased(format)
          ? 'a statement is <subject> <predicate> <object> .; terms are <IRIs>, _:labels or "literals"'
          : 'a statement needs a subject, a predicate and an object before its closing .',
  },
  {
    pattern: /^Unexpected "(.*)"$/s,
    expected: (_match, format) =>
      isLineBased(format) ? "an <IRI>, a _:label, a \"literal\" or the closing ' .'" : 'an RDF term or punctuation',
    hint: (match, format) => lexicalHint(match[1] ?? '', format),
  },
  {
    pattern: /^Unexpected (\S+)/,
    expected: (_match, format) => (isLineBased(format) ? "a term or ' .'" : "a term, or '.', ';' or ','"),
    hint: (_match, format) => STATEMENT_END_HINT(format),
  },
];

/** A hint for text the lexer could not read as any token. */
function lexicalHint(found: string, format: N3Format): string {
  if (found.startsWith('<')) return IRI_HINT;
  if (found.startsWith('"') || found.startsWith("'")) {
    return 'check that the string is closed on the same line (or uses """...""") and that its \\ escapes are valid';
  }
  if (found.startsWith('{') && format !== 'trig') {
    return GRAPH_BLOCK_HINT;
  }
  if (found.startsWith('_:')) return 'a blank node label is _: followed by letters, digits, _ or -';
  if (isLineBased(format)) {
    return `${format === 'n-triples' ? 'N-Triples' : 'N-Quads'} has no prefixed names or abbreviations: write every IRI in full as <...>`;
  }
  return 'check the spelling: prefixed names are prefix:local with a declared prefix, and IRIs are written <...>';
}

/** The InputError for an n3 syntax error, placed at the offending token (column 1 when n3 gives none). */
export function toInputError(site: SyntaxErrorSite): InputError {
  const { error, format } = site;
  const context = error.context;
  const description = error.message.replace(/ on line \d+\.$/, '').replace(/\.$/, '');
  const line = context?.token?.line ?? context?.line ?? 1;
  const column = context?.token ? context.token.start + 1 : lexicalErrorColumn(site, line, description);
  const kind = ERROR_KINDS.map((candidate) => ({ candidate, match: description.match(candidate.pattern) })).find(
    (entry) => entry.match !== null,
  );
  const expected = kind ? kind.candidate.expected(kind.match as RegExpMatchArray, format) : 'valid syntax';
  const hint = kind
    ? kind.candidate.hint(kind.match as RegExpMatchArray, format)
    : `check the text at this place against the ${formatName(format)} grammar`;
  const unreadable = context?.token ? undefined : unreadableText(description);
  const what =
    unreadable === undefined
      ? `${description}; found ${context?.token ? describeToken(context.token) : 'text that is not a token'}`
      : `found '${unreadable}', which cannot be read as ${formatName(format)}`;
  return {
    file: site.file,
    line,
    column,
    message: `${formatName(format)} syntax error: ${what}, expected ${expected}. ${site.singleLine === true ? 'The line was skipped; the lines after it were read.' : 'The rest of the file was not read.'}`,
    hint,
  };
}

/** The readable name of a format. */
export function formatName(format: RdfFormat): string {
  const names: Record<RdfFormat, string> = {
    turtle: 'Turtle',
    trig: 'TriG',
    'n-triples': 'N-Triples',
    'n-quads': 'N-Quads',
    'rdf-xml': 'RDF/XML',
    'json-ld': 'JSON-LD',
  };
  return names[format];
}

/** A short description of a token for a message. */
function describeToken(token: N3Token): string {
  const shortened = (value: string): string => (value.length > 60 ? `${value.slice(0, 57)}...` : value);
  switch (token.type) {
    case 'eof':
      return 'the end of the file';
    case 'IRI':
      return `the IRI <${shortened(token.value)}>`;
    case 'prefixed':
      return `the prefixed name ${shortened(`${token.prefix}:${token.value}`)}`;
    case 'blank':
      return `the blank node _:${shortened(token.value)}`;
    case 'literal':
      return `the literal "${shortened(token.value)}"`;
    case 'langcode':
      return `the language tag @${token.value}`;
    case 'abbreviation':
      return `'${token.value}'`;
    default:
      return token.value ? `'${shortened(token.value)}'` : `'${token.type}'`;
  }
}

/** The text the lexer stopped at, taken from its message. */
function unreadableText(description: string): string | undefined {
  return description.match(/^Unexpected "(.*)"$/s)?.[1];
}

/** The column of text the lexer rejected: found on the error line after the last token read. */
function lexicalErrorColumn(site: SyntaxErrorSite, line: number, description: string): number {
  const issue = unreadableText(description);
  if (!issue) return 1;
  const lineText = site.textOfLine(line);
  const previous = site.error.context?.previousToken;
  const searchFrom = previous && (previous.endLine ?? previous.line) === line ? previous.end : 0;
  const index = lineText.indexOf(issue, searchFrom);
  return index < 0 ? 1 : index + 1;
}
