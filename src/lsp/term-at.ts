// Finding the RDF term under the cursor: an `<IRI>` or a prefixed name, resolved to a full IRI.

/** A term found in a line: the IRI it stands for, and where it is written (0-based UTF-16 columns, end exclusive). */
export interface TermAtCursor {
  iri: string;
  written: string;
  start: number;
  end: number;
}

// A prefixed name (W3C RDF 1.1 Turtle, PNAME_LN / PNAME_NS), loosely: a prefix of name characters, `:`, a local part
// of name characters, `.` inside, `%XX` and `\` escapes. Non-ASCII letters count (PN_CHARS_BASE), astral ones too.
const PREFIXED_NAME = /(?:[\p{L}_][\p{L}\p{N}_.-]*)?:(?:[\p{L}\p{N}_:-]|%[0-9A-Fa-f]{2}|\\[-_~.!$&'()*+,;=/?#@%]|\.(?=[\p{L}\p{N}_:%\\-]))*/gu;

/**
 * The IRI or prefixed name at a 0-based UTF-16 character of a line, resolved against the declared
 * prefixes and the base IRI; undefined when the cursor is on neither or a prefix is undeclared.
 */
export function termAt(lineText: string, character: number, prefixes: Record<string, string>, baseIri: string): TermAtCursor | undefined {
  const iri = iriAt(lineText, character, baseIri);
  if (iri !== undefined) return iri;
  for (const match of lineText.matchAll(PREFIXED_NAME)) {
    const start = match.index ?? 0;
    const end = start + match[0].length;
    if (character < start || character > end) continue;
    // A prefixed name never follows a name character directly (that would be inside another word, e.g. `http:`).
    if (start > 0 && /[\p{L}\p{N}_\-<"']/u.test(lineText[start - 1])) continue;
    const colon = match[0].indexOf(':');
    const namespace = prefixes[match[0].slice(0, colon)];
    if (namespace === undefined) return undefined;
    const local = match[0].slice(colon + 1).replace(/\\(.)/g, '$1');
    return { iri: namespace + local, written: match[0], start, end };
  }
  return undefined;
}

/** The `<IRI>` around a character, resolved against the base; undefined when the cursor is on none. */
function iriAt(lineText: string, character: number, baseIri: string): TermAtCursor | undefined {
  const open = lineText.lastIndexOf('<', character);
  if (open < 0) return undefined;
  const close = lineText.indexOf('>', open);
  // The cursor may stand on the closing `>`, or just after it, and still mean the term.
  if (close < 0 || character > close + 1) return undefined;
  const inner = lineText.slice(open + 1, close);
  if (/[\s<>"{}|^`]/.test(inner)) return undefined;
  let iri: string;
  try {
    iri = new URL(inner, baseIri).href;
  } catch {
    iri = inner;
  }
  // An absolute IRI stays as written: the URL parser would normalise it (case, dot segments), which RDF does not.
  if (/^[A-Za-z][A-Za-z0-9+.-]*:/.test(inner)) iri = inner;
  return { iri, written: lineText.slice(open, close + 1), start: open, end: close + 1 };
}
