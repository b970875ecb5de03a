// Finding the source lines that hold one statement alone, so deleting them removes exactly that statement.
import type * as RDF from '@rdfjs/types';
import { Parser } from 'n3';
import { createLexer, N3_FORMAT_NAME, type N3Token } from '../load/n3-tokens.js';
import { defaultBaseIri } from '../load/parse.js';
import type { Literal, N3Format, RdfFormat, Statement } from '../load/statement.js';

/** Whole lines of a source file that hold exactly one statement and nothing else but whitespace and comments. */
export interface LineRemoval {
  file: string;
  /** 1-based, inclusive */
  firstLine: number;
  /** 1-based, inclusive */
  lastLine: number;
  /** the removed lines, with their line ends */
  text: string;
}

/** Options of `removableLines`. */
export interface RemovalOptions {
  /** The IRI the file's relative IRIs resolve against, as the loader used it; default the file's `file://` URL. */
  baseIri?: string;
}

/** Tokens that may stand in a single-triple statement; anything else (brackets, braces, directives) makes it unsafe. */
const STATEMENT_TOKENS = new Set(['IRI', 'prefixed', 'blank', 'literal', 'type', 'typeIRI', 'langcode', 'abbreviation', '(', ')', ';', ',', '.']);

/** Tokens that open a directive, whose text the candidate is parsed after. */
const DIRECTIVE_TOKENS = new Set(['@prefix', '@base', 'PREFIX', 'BASE']);

/** What the lines after the closing `.` may hold on its own line: whitespace, then perhaps a comment. */
const TRAILING_REST = /^[ \t]*(#.*)?$/;

/**
 * The lines to delete to remove `statement` from `sourceText` (its file's text), or undefined when that is not safe.
 * Safe means: the statement's subject starts its line (after whitespace), the statement ends with
 * `.` followed by nothing but whitespace or a comment, it uses no `[ ]`, `{ }` or directive, and
 * n3 parsing those lines after the file's earlier directives yields exactly this one triple. Lines
 * inside a TriG graph block may go, since the block stays valid (possibly empty); a last triple
 * closed by `}` instead of `.` is not removable.
 */
export function removableLines(
  statement: Statement,
  sourceText: string,
  format: RdfFormat,
  options: RemovalOptions = {},
): LineRemoval | undefined {
  // RDF/XML and JSON-LD statements are not whole lines of text; their removal is left to the user.
  if (format === 'rdf-xml' || format === 'json-ld') return undefined;
  const analysis = analysed(sourceText);
  const lines = analysis.lines;
  const firstLine = statement.position.line;
  if (firstLine < 1 || firstLine > lines.count) return undefined;
  const firstText = lines.text(firstLine);
  const before = firstText.slice(0, statement.position.column - 1);
  if (!/^[ \t]*$/.test(before)) return undefined;
  const end = statementEnd(lines, firstLine, Math.max(firstLine, statement.objectLine), format);
  if (end === undefined) return undefined;
  const candidate = lines.slice(firstLine, end.lastLine);
  const preamble = format === 'turtle' || format === 'trig' ? directivesBefore(analysis, firstLine) : '';
  const baseIri = options.baseIri ?? defaultBaseIri(statement.position.file);
  if (!yieldsExactly(preamble + candidate, statement, format, baseIri)) return undefined;
  return { file: statement.position.file, firstLine, lastLine: end.lastLine, text: candidate };
}

/** The line that holds the statement's closing `.`, when it ends cleanly and uses only plain statement tokens. */
function statementEnd(lines: SourceLines, firstLine: number, objectLine: number, format: N3Format): { lastLine: number } | undefined {
  // The window starts at the object's line and grows, since an object literal may run over many lines.
  for (let windowEnd = objectLine; ; windowEnd = Math.min(lines.count, firstLine + 2 * (windowEnd - firstLine + 1))) {
    const tokens = lexed(lines.slice(firstLine, windowEnd), format);
    const dot = tokens?.findIndex((token) => token.type === '.') ?? -1;
    if (tokens !== undefined && dot >= 0) {
      if (!tokens.slice(0, dot).every((token) => STATEMENT_TOKENS.has(token.type))) return undefined;
      const closing = tokens[dot];
      const lastLine = firstLine + closing.line - 1;
      if (!TRAILING_REST.test(lines.text(lastLine).slice(closing.end))) return undefined;
      return { lastLine };
    }
    if (windowEnd >= lines.count) return undefined;
  }
}

/** The tokens of a text, or undefined when n3's lexer rejects it (for a window, often a literal cut off). */
function lexed(text: string, format: N3Format): N3Token[] | undefined {
  try {
    const lineMode = format === 'n-triples' || format === 'n-quads';
    return createLexer(lineMode).tokenize(text) as unknown as N3Token[];
  } catch {
    return undefined;
  }
}

/** Whether n3 reads exactly one quad from the text and it is the statement (TriG block lines read as default graph). */
function yieldsExactly(text: string, statement: Statement, format: N3Format, baseIri: string): boolean {
  let quads: RDF.Quad[];
  try {
    quads = new Parser({ format: N3_FORMAT_NAME[format], baseIRI: baseIri, blankNodePrefix: '' }).parse(text);
  } catch {
    return false;
  }
  if (quads.length !== 1) return false;
  const [quad] = quads;
  const graphMatches =
    format === 'n-quads'
      ? sameTerm(statement.graph, quad.graph)
      : quad.graph.termType === 'DefaultGraph' && (format === 'trig' || statement.graph === '');
  return (
    graphMatches &&
    sameTerm(statement.subject, quad.subject) &&
    quad.predicate.termType === 'NamedNode' &&
    quad.predicate.value === statement.predicate &&
    sameObject(statement.object, quad.object)
  );
}

/** Whether a statement's term is the parsed term; a blank node's label is the file's label prefix and the label in the text. */
function sameTerm(expected: string, term: RDF.Term): boolean {
  if (term.termType === 'DefaultGraph') return expected === '';
  if (term.termType === 'NamedNode') return expected === term.value;
  if (term.termType !== 'BlankNode') return false;
  return /^_:b[0-9a-f]{8}_(.*)$/s.exec(expected)?.[1] === term.value;
}

function sameObject(expected: string | Literal, term: RDF.Term): boolean {
  if (typeof expected === 'string') return sameTerm(expected, term);
  return (
    term.termType === 'Literal' &&
    term.value === expected.value &&
    term.datatype.value === expected.datatype &&
    term.language === expected.language
  );
}

/** The text of every `@prefix`, `@base`, `PREFIX` and `BASE` directive that ends before a line, in order. */
function directivesBefore(analysis: TextAnalysis, line: number): string {
  analysis.directives ??= directivesOf(analysis.text, analysis.lines);
  let text = '';
  for (const directive of analysis.directives) {
    if (directive.lastLine >= line) break;
    text += `${directive.text}\n`;
  }
  return text;
}

/** A directive's text and the line it ends on. */
interface Directive {
  text: string;
  lastLine: number;
}

/** What is worked out once per source text: its lines, and its directives when first needed. */
interface TextAnalysis {
  text: string;
  lines: SourceLines;
  directives?: Directive[];
}

// A report asks about many statements of the same file in a row, so the last text's analysis is kept.
let lastAnalysis: TextAnalysis | undefined;

function analysed(sourceText: string): TextAnalysis {
  if (lastAnalysis?.text !== sourceText) lastAnalysis = { text: sourceText, lines: linesOf(sourceText) };
  return lastAnalysis;
}

function directivesOf(sourceText: string, lines: SourceLines): Directive[] {
  const directives: Directive[] = [];
  const tokens = lexedUntilError(sourceText.slice(lines.offset(1)));
  for (let index = 0; index < tokens.length; index++) {
    const type = tokens[index].type;
    if (!DIRECTIVE_TOKENS.has(type)) continue;
    // `@prefix p: <iri> .` and `@base <iri> .` end at their dot; `PREFIX p: <iri>` and `BASE <iri>` at their IRI.
    const last = index + (type === '@prefix' ? 3 : type === '@base' || type === 'PREFIX' ? 2 : 1);
    if (last >= tokens.length) break;
    const first = tokens[index];
    const closing = tokens[last];
    const endLine = closing.endLine ?? closing.line;
    directives.push({ text: sourceText.slice(lines.offset(first.line) + first.start, lines.offset(endLine) + closing.end), lastLine: endLine });
    index = last;
  }
  return directives;
}

/** The tokens n3's lexer reads from a text up to its first lexical error. */
function lexedUntilError(text: string): N3Token[] {
  const tokens: N3Token[] = [];
  const lexer = createLexer(false);
  lexer.tokenize(text, (error, token) => {
    if (error === null && token !== undefined && token !== null && token.type !== 'comment') tokens.push(token as unknown as N3Token);
  });
  return tokens;
}

/** A text's lines as n3 counts them (CR LF, CR or LF ends one); a leading BOM is not part of line 1. */
interface SourceLines {
  count: number;
  /** The offset where a 1-based line starts. */
  offset(line: number): number;
  /** A line's text without its line end. */
  text(line: number): string;
  /** Lines `first`..`last` with their line ends. */
  slice(first: number, last: number): string;
}

function linesOf(sourceText: string): SourceLines {
  const starts = [sourceText.startsWith('\ufeff') ? 1 : 0];
  const contentEnds: number[] = [];
  for (let index = starts[0]; index < sourceText.length; index++) {
    const code = sourceText.charCodeAt(index);
    if (code !== 10 && code !== 13) continue;
    contentEnds.push(index);
    if (code === 13 && sourceText.charCodeAt(index + 1) === 10) index++;
    starts.push(index + 1);
  }
  contentEnds.push(sourceText.length);
  // A final line end starts no further line.
  if (starts.length > 1 && starts[starts.length - 1] === sourceText.length) {
    starts.pop();
    contentEnds.pop();
  }
  const nextStart = (line: number): number => (line < starts.length ? starts[line] : sourceText.length);
  return {
    count: starts.length,
    offset: (line) => starts[line - 1],
    text: (line) => sourceText.slice(starts[line - 1], contentEnds[line - 1]),
    slice: (first, last) => sourceText.slice(starts[first - 1], nextStart(last)),
  };
}
