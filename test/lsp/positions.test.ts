// The position arithmetic of the server: lines of a document, statement ranges, and the term under the cursor.
import { TextDocument } from 'vscode-languageserver-textdocument';
import { describe, expect, it } from 'vitest';
import { DocumentText } from '../../src/lsp/document-text.js';
import { termAt } from '../../src/lsp/term-at.js';

describe('DocumentText', () => {
  it('splits lines at LF, CR LF and a lone CR, as vscode-languageserver-textdocument does', () => {
    const text = 'a .\r\nbb .\rccc .\ndddd .';
    const ours = new DocumentText(text);
    // The reference: the TextDocument implementation that LSP clients and servers of the vscode family share.
    const reference = TextDocument.create('file:///x.ttl', 'turtle', 1, text);
    expect(ours.lineCount).toBe(reference.lineCount);
    for (let line = 0; line < reference.lineCount; line++) {
      const full = reference.getText({ start: { line, character: 0 }, end: { line: line + 1, character: 0 } });
      expect(ours.lineText(line)).toBe(full.replace(/\r?\n$|\r$/, ''));
      expect(ours.offsetAt(line, 1)).toBe(reference.offsetAt({ line, character: 1 }));
    }
  });

  it('ranges a statement from its subject to the end of its object line, leaving out a trailing comment', () => {
    const text = [
      'nv:Pantograph a owl:Class ;',
      '  rdfs:subClassOf <https://data.northvale-rail.example/def/Roof#part> .  # isapart-allow x: y',
      'nv:A rdfs:label "a # in a string" .',
    ].join('\n');
    const document = new DocumentText(text);
    // Statement at 1-based line 1, column 1, object on line 2.
    expect(document.statementRange(1, 1, 2)).toEqual({ start: { line: 0, character: 0 }, end: { line: 1, character: text.split('\n')[1].indexOf(' .  #') + 2 } });
    expect(document.statementRange(3, 1, 3).end.character).toBe(text.split('\n')[2].length);
    // A whole-file problem (line 0) marks the first line.
    expect(document.statementRange(0, 0, 0).start).toEqual({ line: 0, character: 0 });
  });
});

describe('termAt', () => {
  const prefixes = { nv: 'https://data.northvale-rail.example/def/', '': 'https://data.northvale-rail.example/' };
  const base = 'file:///work/data/assets.ttl';

  it('finds a prefixed name under the cursor, with escapes and letters outside the BMP (W3C RDF 1.1 Turtle, PN_LOCAL)', () => {
    const line = 'nv:Car\\-Body rdfs:subClassOf nv:\u{1D4AF}rain .';
    expect(termAt(line, 3, prefixes, base)).toMatchObject({ iri: 'https://data.northvale-rail.example/def/Car-Body', start: 0, end: 12 });
    const astral = line.indexOf('nv:\u{1D4AF}');
    expect(termAt(line, astral + 4, prefixes, base)).toMatchObject({ iri: 'https://data.northvale-rail.example/def/\u{1D4AF}rain', start: astral, end: line.length - 2 });
    // The default prefix, and a name that ends before the statement's closing dot.
    expect(termAt(':fleet .', 2, prefixes, base)).toMatchObject({ iri: 'https://data.northvale-rail.example/fleet', end: 6 });
  });

  it('finds an <IRI>, resolving a relative one against the base (RFC 3986 reference resolution)', () => {
    expect(termAt('<https://x.example/a> a <B> .', 5, prefixes, base)).toMatchObject({ iri: 'https://x.example/a', start: 0, end: 21 });
    expect(termAt('<https://x.example/a> a <B> .', 25, prefixes, base)).toMatchObject({ iri: 'file:///work/data/B' });
  });

  it('finds nothing between terms or for an undeclared prefix', () => {
    expect(termAt('nv:A   nv:B .', 5, prefixes, base)).toBeUndefined();
    expect(termAt('other:A a nv:B .', 2, prefixes, base)).toBeUndefined();
  });
});
