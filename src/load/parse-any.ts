// Choosing the parser for a source's syntax: n3 for Turtle, TriG, N-Triples and N-Quads, the streaming parsers for RDF/XML and JSON-LD.
import type { LoadedSource, RdfFormat } from './statement.js';
import { N3SourceReader } from './parse.js';
import { parseRdfXml } from './rdfxml.js';
import { parseJsonLd, type JsonLdParseOptions } from './jsonld.js';

/** Options of `parseAnySource`: the base IRI, the run folder and JSON-LD's local contexts. */
export type SourceParseOptions = JsonLdParseOptions;

/** Parses one source, given as text chunks, with the parser of its syntax; every parser reads the chunks as they come. */
export async function parseAnySource(
  chunks: AsyncIterable<string>,
  file: string,
  format: RdfFormat,
  options: SourceParseOptions = {},
): Promise<LoadedSource> {
  if (format === 'rdf-xml') return parseRdfXml(chunks, file, options);
  if (format === 'json-ld') return parseJsonLd(chunks, file, options);
  const reader = new N3SourceReader(file, format, options);
  for await (const chunk of chunks) {
    // After a syntax error n3 reads no more; the rest is still drained, so a broken stream is still told apart.
    if (!reader.stopped) reader.write(chunk);
  }
  return options.brokenOff?.() === true ? reader.stop() : reader.end();
}

/** A whole text as the chunks the streaming parsers take. */
export async function* textChunks(text: string): AsyncGenerator<string> {
  yield text;
}
