// Telling which RDF syntax a source is written in: by file extension, else by sniffing its first lines.
import type { RdfFormat } from './statement.js';

/** The file extensions isapart reads, each also accepted with a trailing `.gz`. */
export const RDF_EXTENSIONS: readonly string[] = Object.freeze(['.ttl', '.trig', '.nt', '.nq']);

const FORMAT_OF_EXTENSION: Readonly<Record<string, RdfFormat>> = Object.freeze({
  '.ttl': 'turtle',
  '.trig': 'trig',
  '.nt': 'n-triples',
  '.nq': 'n-quads',
});

/** How many characters of a source's start are enough to sniff its syntax. */
export const SNIFF_LENGTH = 64 * 1024;

/** The format named by a file's extension (`.ttl`, `.ttl.gz`, ...), or undefined for any other name. */
export function formatFromExtension(fileName: string): RdfFormat | undefined {
  const lowerName = fileName.toLowerCase();
  const withoutGzip = lowerName.endsWith('.gz') ? lowerName.slice(0, -3) : lowerName;
  const dot = withoutGzip.lastIndexOf('.');
  if (dot < 0 || withoutGzip.lastIndexOf('/') > dot) return undefined;
  return FORMAT_OF_EXTENSION[withoutGzip.slice(dot)];
}

/**
 * The format of a source: by its extension, or for `-` and unknown extensions by its content.
 * Returns undefined when the content does not look like any RDF syntax isapart reads.
 */
export function detectFormat(fileName: string, head: string): RdfFormat | undefined {
  return formatFromExtension(fileName) ?? sniffFormat(head);
}

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

/** Guesses the syntax of a source from its first characters; undefined when it is none of ours. */
export function sniffFormat(head: string): RdfFormat | undefined {
  const lines = completeLines(head)
    .map((line) => line.trim())
    .filter((line) => line !== '' && !line.startsWith('#'));
  // An empty document (or one of comments only) is valid in every syntax; Turtle reads them all.
  if (lines.length === 0) return 'turtle';
  const scrubbed = scrubTerms(lines.join('\n'));
  if (scrubbed.includes('{')) return 'trig';
  if (lines.every((line) => TRIPLE_LINE.test(line))) return 'n-triples';
  if (lines.every((line) => TRIPLE_LINE.test(line) || QUAD_LINE.test(line))) return 'n-quads';
  if (
    TURTLE_DIRECTIVE.test(scrubbed) ||
    TURTLE_PUNCTUATION.test(scrubbed) ||
    PREFIXED_NAME.test(scrubbed) ||
    ABBREVIATED_TYPE.test(scrubbed) ||
    QUOTED_STRING_OF_TURTLE.test(head) ||
    STATEMENT_OF_IRIS.test(head)
  ) {
    return 'turtle';
  }
  return undefined;
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
