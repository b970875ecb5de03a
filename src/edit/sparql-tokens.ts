// A tokenizer for SPARQL 1.1 Update text (W3C SPARQL 1.1 Query §19.8, the grammar's terminals), keeping each token's line and column.

/** The kinds of token the edit reader tells apart. */
export type TokenKind = 'iri' | 'pname' | 'blank' | 'variable' | 'string' | 'number' | 'langtag' | 'word' | 'punct';

/** One token: its kind, its text as written, and where it starts (1-based line and column, UTF-16 code units). */
export interface Token {
  kind: TokenKind;
  text: string;
  line: number;
  column: number;
  /** Offset of the token's first character in the text. */
  offset: number;
}

/** A comment: its text after `#`, where its `#` is, and whether it stands alone on its line. */
export interface Comment {
  text: string;
  line: number;
  column: number;
  ownLine: boolean;
}

/** A character the tokenizer cannot start a token with, with its place. */
export interface TokenError {
  message: string;
  line: number;
  column: number;
}

// The character classes of the SPARQL 1.1 grammar (§19.8, productions 164–173).
const PN_CHARS_BASE =
  'A-Za-z\\u00C0-\\u00D6\\u00D8-\\u00F6\\u00F8-\\u02FF\\u0370-\\u037D\\u037F-\\u1FFF\\u200C-\\u200D\\u2070-\\u218F\\u2C00-\\u2FEF\\u3001-\\uD7FF\\uF900-\\uFDCF\\uFDF0-\\uFFFD\\u{10000}-\\u{EFFFF}';
const PN_CHARS_U = `${PN_CHARS_BASE}_`;
const PN_CHARS = `${PN_CHARS_U}\\-0-9\\u00B7\\u0300-\\u036F\\u203F-\\u2040`;
const PLX = "%[0-9A-Fa-f]{2}|\\\\[_~.\\-!$&'()*+,;=/?#@%]";
const PN_PREFIX = `[${PN_CHARS_BASE}](?:[${PN_CHARS}.]*[${PN_CHARS}])?`;
const PN_LOCAL = `(?:[${PN_CHARS_U}:0-9]|${PLX})(?:(?:[${PN_CHARS}.:]|${PLX})*(?:[${PN_CHARS}:]|${PLX}))?`;

const PATTERNS: [TokenKind, RegExp][] = [
  ['iri', /<[^<>"{}|^`\\\u0000-\u0020]*>/y],
  ['string', /"""(?:[^"\\]|\\.|"(?!""))*"""|'''(?:[^'\\]|\\.|'(?!''))*'''|"(?:[^"\\\n\r]|\\.)*"|'(?:[^'\\\n\r]|\\.)*'/suy],
  ['blank', new RegExp(`_:[${PN_CHARS_U}0-9](?:[${PN_CHARS}.]*[${PN_CHARS}])?`, 'uy')],
  ['variable', new RegExp(`[?$][${PN_CHARS_U}0-9][${PN_CHARS_U}0-9\\u00B7\\u0300-\\u036F\\u203F-\\u2040]*`, 'uy')],
  ['pname', new RegExp(`(?:${PN_PREFIX})?:(?:${PN_LOCAL})?`, 'uy')],
  ['langtag', /@[a-zA-Z]+(?:-[a-zA-Z0-9]+)*/y],
  ['number', /[+-]?(?:\d+\.\d*[eE][+-]?\d+|\.\d+[eE][+-]?\d+|\d+[eE][+-]?\d+|\d*\.\d+|\d+)/y],
  ['word', /[A-Za-z_][A-Za-z0-9_]*/y],
  ['punct', /\^\^|&&|\|\||!=|<=|>=|[{}()[\];,.=<>!+\-*/^|?]/y],
];

/**
 * The tokens of a SPARQL text, comments and white space left out. A sign before digits is read as
 * part of a number, as data and templates need; in a WHERE expression (`?x -1`), which this
 * tokenizer only passes over, that keeps the brackets and `;` where they are.
 */
export function tokenize(text: string): { tokens: Token[]; comments: Comment[]; error?: TokenError } {
  const tokens: Token[] = [];
  const comments: Comment[] = [];
  let offset = 0;
  let line = 1;
  let lineStart = 0;
  while (offset < text.length) {
    const code = text.charCodeAt(offset);
    if (code === 0x0a) {
      line += 1;
      lineStart = offset + 1;
      offset += 1;
      continue;
    }
    if (code === 0x20 || code === 0x09 || code === 0x0d) {
      offset += 1;
      continue;
    }
    if (code === 0x23) {
      const end = text.indexOf('\n', offset);
      const stop = end < 0 ? text.length : end;
      const ownLine = tokens.length === 0 || tokens[tokens.length - 1].line < line;
      comments.push({ text: text.slice(offset + 1, stop).replace(/\r$/, ''), line, column: offset - lineStart + 1, ownLine });
      offset = stop;
      continue;
    }
    const match = matchAt(text, offset);
    if (match === undefined) {
      return { tokens, comments, error: { message: `unexpected character ${JSON.stringify(text[offset])}`, line, column: offset - lineStart + 1 } };
    }
    tokens.push({ kind: match.kind, text: match.text, line, column: offset - lineStart + 1, offset });
    // A long string may span lines.
    for (let index = 0; index < match.text.length; index++) {
      if (match.text.charCodeAt(index) === 0x0a) {
        line += 1;
        lineStart = offset + index + 1;
      }
    }
    offset += match.text.length;
  }
  return { tokens, comments };
}

function matchAt(text: string, offset: number): { kind: TokenKind; text: string } | undefined {
  for (const [kind, pattern] of PATTERNS) {
    pattern.lastIndex = offset;
    const found = pattern.exec(text);
    if (found !== null && found[0].length > 0) return { kind, text: found[0] };
  }
  return undefined;
}
