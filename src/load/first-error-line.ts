// How far n3 reads a text in one syntax before its first syntax error: the format sniffer's tie-breaker.
import { DataFactory } from 'n3';
import type * as RDF from '@rdfjs/types';
import type { N3Format } from './statement.js';
import { createLexer, N3_FORMAT_NAME, parseWithTokens } from './n3-tokens.js';

/** The 1-based line of the first syntax error n3 finds reading `text` as `format`; Infinity when it reads it all. */
export function firstErrorLine(text: string, format: N3Format): number {
  let errorLine = Number.POSITIVE_INFINITY;
  parseWithTokens(
    text,
    {
      format: N3_FORMAT_NAME[format],
      // Only whether the text parses matters here, so relative IRIs get any fixed base.
      baseIRI: 'file:///',
      blankNodePrefix: '',
      factory: DataFactory as RDF.DataFactory,
      lexer: createLexer(format === 'n-triples' || format === 'n-quads'),
    },
    {
      onQuad: (error) => {
        if (error && errorLine === Number.POSITIVE_INFINITY) errorLine = error.context?.line ?? 1;
      },
    },
  );
  return errorLine;
}
