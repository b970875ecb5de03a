// RDF/JS terms from the streaming parsers (RDF/XML, JSON-LD) turned into the loader's statements.
import type * as RDF from '@rdfjs/types';
import { DataFactory } from 'n3';
import type { InputError, LoadedSource } from './statement.js';
import { formatName } from './syntax-error.js';
import type { StatementSink } from './statement-sink.js';

/** Where a streaming parser's statement was stated, and the line its object was written on. */
export interface StatementPlace {
  line: number;
  column: number;
  objectLine: number;
}

/**
 * A data factory whose blank nodes carry the file's label prefix: a document's own label `x`
 * becomes `PREFIXx`, an anonymous node `PREFIX-N`. No label of RDF/XML (an XML name) or JSON-LD
 * (a Turtle blank node label) starts with `-`, so the two kinds never meet.
 */
export function prefixedBlankNodeFactory(labelPrefix: string): RDF.DataFactory {
  let anonymousCount = 0;
  return {
    ...DataFactory,
    // jsonld-streaming-parser passes null for "no language", which n3's factory takes for a tag object.
    literal: (value: string, languageOrDatatype?: string | RDF.NamedNode | RDF.DirectionalLanguage | null) =>
      // n3 2.13.12 also takes a { language, direction } object, which its typings leave out.
      (DataFactory.literal as (value: string, tag?: string | RDF.NamedNode | RDF.DirectionalLanguage) => RDF.Literal)(value, languageOrDatatype ?? undefined),
    blankNode: (label?: string) =>
      DataFactory.blankNode(label === undefined ? `${labelPrefix}-${++anonymousCount}` : `${labelPrefix}${label}`),
  };
}

/** Hands one parsed quad to the sink, or adds an InputError to the source when it holds an RDF 1.2 triple term. */
export function addQuad(source: LoadedSource, sink: StatementSink, quad: RDF.BaseQuad, place: StatementPlace): void {
  const { subject, object, graph } = quad;
  if (subject.termType === 'Quad' || object.termType === 'Quad' || graph.termType === 'Quad') {
    source.errors.push(tripleTermError(source, place));
    return;
  }
  sink.add(quad, place.line, place.column, place.objectLine);
}

function tripleTermError(source: LoadedSource, place: StatementPlace): InputError {
  return {
    file: source.file,
    line: place.line,
    column: place.column,
    message: `${formatName(source.format)} statement with an RDF 1.2 triple term was skipped: isapart reads RDF 1.1 statements only.`,
    hint: 'state the relation as a plain statement between IRIs or blank nodes',
  };
}
