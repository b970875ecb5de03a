// Telling which RDF syntax a source is written in: by file extension, else by sniffing its first lines.
import type { N3Format, RdfFormat } from './statement.js';
import { firstErrorLine } from './first-error-line.js';

/** The file extensions read inside folders, each also accepted with a trailing `.gz`. */
export const RDF_EXTENSIONS: readonly string[] = Object.freeze(['.ttl', '.trig', '.nt', '.nq', '.rdf', '.owl', '.jsonld']);

/**
 * The syntax of each extension. `.xml` is read as RDF/XML only when a file is named on the command
 * line: most XML files in a project folder (build files, editor settings) are not RDF.
 */
const FORMAT_OF_EXTENSION: Readonly<Record<string, RdfFormat>> = Object.freeze({
  '.ttl': 'turtle',
  '.trig': 'trig',
  '.nt': 'n-triples',
  '.nq': 'n-quads',
  '.rdf': 'rdf-xml',
  '.owl': 'rdf-xml',
  '.xml': 'rdf-xml',
  '.jsonld': 'json-ld',
});

/** How many characters of a source's start are enough to sniff its syntax. */
export const SNIFF_LENGTH = 64 * 1024;

/** The format named by a file's extension (`.ttl`, `.ttl.gz`, `.owl`, ...), or undefined for any other name. */
export function formatFromExtension(fileName: string): RdfFormat | undefined {
  return FORMAT_OF_EXTENSION[extensionOf(fileName)];
}

/** Whether a folder walk reads a file of this name (its extension is one of `RDF_EXTENSIONS`, maybe with `.gz`). */
export function isReadInFolders(fileName: string): boolean {
  return RDF_EXTENSIONS.includes(extensionOf(fileName));
}

/**
 * The format of a source: by its extension, or for `-` and unknown extensions by its content.
 * Returns undefined when the content does not look like any RDF syntax isapart reads.
 */
export function detectFormat(fileName: string, head: string): RdfFormat | undefined {
  return FORMAT_OF_EXTENSION[extensionOf(fileName)] ?? sniffMarkupFormat(head) ?? sniffFormat(head);
}

/**
 * RDF/XML when a text starts as an XML document does, JSON-LD when it is a JSON object (or array
 * of objects) with one of JSON-LD's keywords as a key; otherwise undefined.
 */
export function sniffMarkupFormat(head: string): RdfFormat | undefined {
  const start = head.trimStart();
  if (XML_START.test(start)) return 'rdf-xml';
  if (JSON_START.test(start) && JSON_LD_KEYWORD.test(head)) return 'json-ld';
  return undefined;
}

/** The lower-case extension of a file name without a trailing `.gz` (`.ttl` for `A.TTL.gz`), or ''. */
function extensionOf(fileName: string): string {
  const lowerName = fileName.toLowerCase();
  const withoutGzip = lowerName.endsWith('.gz') ? lowerName.slice(0, -3) : lowerName;
  const dot = withoutGzip.lastIndexOf('.');
  if (dot < 0 || withoutGzip.lastIndexOf('/') > dot) return '';
  return withoutGzip.slice(dot);
}

// The start of an XML document: a declaration, a doctype, a comment, rdf:RDF, or an element with attributes.
// None of these is an IRI, since IRIs hold no spaces (an IRI <rdf:RDF> is not taken for the element).
const XML_START = /^(?:<\?xml[\s?]|<!DOCTYPE\s|<!--\s|<rdf:RDF\s|<[A-Za-z_][\w.-]*(?::[\w.-]+)?\s+[\w.:-]+\s*=\s*["'])/;
// A JSON object or array of objects whose first key is a string, which no Turtle or TriG statement starts with.
const JSON_START = /^(?:\{\s*"|\[\s*\{\s*")/;
// JSON-LD's keywords that mark a JSON document as linked data (JSON-LD 1.1, section 1.7; from memory).
const JSON_LD_KEYWORD = /"(@context|@id|@graph|@type)"\s*:/;

// One term of a line-based syntax: an IRI, a blank node label, or a literal with its tag or datatype.
const IRI_CHARACTERS = String.raw`(?:[^<>"{}|^\x60\\\s]|\\u[0-9A-Fa-f]{4}|\\U[0-9A-Fa-f]{8})*`;
// N-Triples and N-Quads allow absolute IRIs only.
const IRI_TERM = `<[A-Za-z][A-Za-z0-9+.-]*:${IRI_CHARACTERS}>`;
const BLANK_TERM = String.raw`_:[^\s<>"]+`;
const LITERAL_TERM = String.raw`"(?:[^"\\\n\r]|\\.)*"(?:\^\^${IRI_TERM}|@[a-zA-Z]+(?:-[a-zA-Z0-9]+)*)?`;
const RESOURCE = `(?:${IRI_TERM}|${BLANK_TERM})`;
const TRAILING = String.raw`\s*\.\s*(?:#.*)?$`;
const TRIPLE_LINE = new RegExp(`^\\s*${RESOURCE}\\s*${IRI_TERM}\\s*(?:${RESOURCE}|${LITERAL_TERM})${TRAILING}`);
const QUAD_LINE = new RegExp(
  `^\\s*${RESOURCE}\\s*${IRI_TERM}\\s*(?:${RESOURCE}|${LITERAL_TERM})\\s*${RESOURCE}${TRAILING}`,
);

// Signs of Turtle once strings, IRIs and comments are blanked out.
const TURTLE_DIRECTIVE = /(?:^|\s)(?:@prefix|@base|prefix|base)\s/im;
const TURTLE_PUNCTUATION = /[;[\]()]/;
const PREFIXED_NAME = /(?:^|[\s,;([])(?:[A-Za-z][\w.-]*)?:[\w-]/;
const ABBREVIATED_TYPE = /\sa\s/;
const QUOTED_STRING_OF_TURTLE = /"{3}|'/;
// A statement that opens with two IRIs (relative ones too): its object may be in Turtle's own forms.
const STATEMENT_OF_IRIS = new RegExp(`^\\s*<${IRI_CHARACTERS}>\\s*<${IRI_CHARACTERS}>`, 'm');

/**
 * Guesses which of n3's syntaxes a source is in from its first complete lines; undefined when it
 * is none of them (XML and JSON are left to `sniffMarkupFormat`).
 * When only some lines have the shape of N-Triples or N-Quads lines (one bad line in a dump, or
 * Turtle written partly line by line), the syntax whose parser reads further into them wins, and on
 * a tie the shape most lines have, so a bad line is reported by the parser of the file's own syntax.
 */
export function sniffFormat(head: string): N3Format | undefined {
  const start = head.trimStart();
  // XML and JSON hold characters the signs below would take for Turtle's.
  if (XML_START.test(start) || JSON_START.test(start)) return undefined;
  const sniffedLines = completeLines(head);
  const lines = sniffedLines.map((line) => line.trim()).filter((line) => line !== '' && !line.startsWith('#'));
  // An empty document (or one of comments only) is valid in every syntax; Turtle reads them all.
  if (lines.length === 0) return 'turtle';
  let tripleLines = 0;
  let quadLines = 0;
  for (const line of lines) {
    if (TRIPLE_LINE.test(line)) tripleLines++;
    else if (QUAD_LINE.test(line)) quadLines++;
  }
  const lineShaped = tripleLines + quadLines;
  // A quad line is N-Quads only: neither Turtle nor TriG has a statement of four terms.
  const lineFormat: N3Format = quadLines > 0 ? 'n-quads' : 'n-triples';
  if (lineShaped === lines.length) return lineFormat;
  const mostlyLineShaped = lineShaped * 2 >= lines.length;
  const bySigns = formatBySigns(lines, head);
  if (lineShaped === 0) return bySigns;
  if (bySigns === undefined) return mostlyLineShaped ? lineFormat : undefined;
  const text = sniffedLines.join('\n');
  const lineFormatReach = firstErrorLine(text, lineFormat);
  const bySignsReach = firstErrorLine(text, bySigns);
  if (lineFormatReach !== bySignsReach) return lineFormatReach > bySignsReach ? lineFormat : bySigns;
  return mostlyLineShaped ? lineFormat : bySigns;
}

/** TriG when a graph block shows, Turtle when a sign of Turtle does, else undefined. */
function formatBySigns(lines: string[], head: string): N3Format | undefined {
  const scrubbed = scrubTerms(lines.join('\n'));
  if (scrubbed.includes('{')) return 'trig';
  const turtle =
    TURTLE_DIRECTIVE.test(scrubbed) ||
    TURTLE_PUNCTUATION.test(scrubbed) ||
    PREFIXED_NAME.test(scrubbed) ||
    ABBREVIATED_TYPE.test(scrubbed) ||
    QUOTED_STRING_OF_TURTLE.test(head) ||
    STATEMENT_OF_IRIS.test(head);
  return turtle ? 'turtle' : undefined;
}

/** The lines of a head, leaving out a last line cut off by the sniff limit. */
function completeLines(head: string): string[] {
  const lines = head.split(/\r\n|\n|\r/);
  const cutOff = head.length >= SNIFF_LENGTH && lines.length > 1;
  return cutOff ? lines.slice(0, -1) : lines;
}

/** Blanks out string literals, IRIs and comments so their characters are not taken for syntax. */
function scrubTerms(text: string): string {
  return text
    .replace(/"""[\s\S]*?"""|'''[\s\S]*?'''/g, '""')
    .replace(/"(?:[^"\\\n]|\\.)*"|'(?:[^'\\\n]|\\.)*'/g, '""')
    .replace(/<[^<>\s]*>/g, '<>')
    .replace(/(^|\s)#.*$/gm, '$1');
}
