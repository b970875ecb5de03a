// N3SourceReader and the UTF-8 chunk decoder: however the bytes are cut, a source reads exactly as when given whole.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseSource } from '../../src/load/parse.js';
import { decodeText } from '../../src/load/source-text.js';
import { StatementStore } from '../../src/load/statement-store.js';
import { StoringSink } from '../../src/load/stored-source.js';
import type { LoadedSource, N3Format } from '../../src/load/statement.js';
import { randomSource } from '../random-source.js';
import { readManifest, SUITES } from './w3c-manifest.js';
import { everyByte, generatedDocument, parseCutBytes, randomCuts } from './chunked-turtle.js';

/** The whole-text parse every chunked parse is held to. */
function parseWhole(bytes: Uint8Array, file: string, format: N3Format, baseIri?: string): LoadedSource {
  const decoded = decodeText(bytes, file);
  if ('error' in decoded) throw new Error(decoded.error.message);
  return parseSource(decoded.text, file, format, { baseIri });
}

// Source: W3C rdf-tests repository, commit ad541a5f0479f0798608c4801369d97b8e08b36f, rdf/rdf11/rdf-turtle and
// rdf-trig (copied unchanged into test/standards/w3c-rdf-tests): every action file, positive, negative and eval.
for (const suite of SUITES.filter((entry) => entry.format === 'turtle' || entry.format === 'trig')) {
  const tests = readManifest(suite.folder);
  describe(`W3C RDF 1.1 ${suite.folder} suite read in chunks`, () => {
    it('lists the suite files (so the checks below are not vacuous)', () => {
      expect(tests.length).toBeGreaterThan(250);
      expect(tests.filter((test) => test.kind === 'negative-syntax').length).toBeGreaterThan(30);
    });

    it.each(tests)('$name: one-byte and random chunks read as the whole text', (test) => {
      const bytes = readFileSync(test.actionPath);
      const whole = parseWhole(bytes, test.actionPath, suite.format, test.baseIri);
      const random = randomSource(0x5eed + bytes.length);
      expect(parseCutBytes(bytes, everyByte(bytes.length), test.actionPath, suite.format, { baseIri: test.baseIri })).toEqual(whole);
      for (let round = 0; round < 4; round++) {
        const cuts = randomCuts(random, bytes.length, 1 + Math.floor(random() * 64));
        expect(parseCutBytes(bytes, cuts, test.actionPath, suite.format, { baseIri: test.baseIri })).toEqual(whole);
      }
    });
  });
}

describe('generated Turtle and TriG read in chunks', () => {
  const FILE = 'fleet/generated.ttl';
  for (const format of ['turtle', 'trig'] as const) {
    it(`${format}: a cut inside each multi-byte character, token, comment and """ string, alone, reads as the whole`, () => {
      const random = randomSource(format === 'turtle' ? 7 : 8);
      const document = generatedDocument(random, 60, format);
      const bytes = Buffer.from(document.text);
      const whole = parseWhole(bytes, FILE, format);
      // The generator's features are all there, so the cuts below hit each of them.
      expect(whole.errors).toEqual([]);
      expect(whole.statements.length).toBeGreaterThan(200);
      expect(whole.allowComments.some((comment) => comment.ownLine)).toBe(true);
      expect(whole.allowComments.some((comment) => !comment.ownLine)).toBe(true);
      for (const [feature, cuts] of Object.entries(document.cuts)) {
        expect(cuts.length, feature).toBeGreaterThan(5);
        for (const cut of cuts) expect(parseCutBytes(bytes, [cut], FILE, format), `${feature} cut at byte ${cut}`).toEqual(whole);
      }
    });

    it(`${format}: 200 documents in random chunks, and small ones byte by byte, read as the whole`, () => {
      const random = randomSource(format === 'turtle' ? 11 : 12);
      for (let round = 0; round < 200; round++) {
        const bytes = Buffer.from(generatedDocument(random, 1 + Math.floor(random() * 12), format).text);
        const whole = parseWhole(bytes, FILE, format);
        expect(whole.errors).toEqual([]);
        expect(parseCutBytes(bytes, randomCuts(random, bytes.length, 1 + Math.floor(random() * 300)), FILE, format)).toEqual(whole);
        if (round % 10 === 0) expect(parseCutBytes(bytes, everyByte(bytes.length), FILE, format)).toEqual(whole);
      }
    });

    it(`${format}: a syntax error anywhere gives the same error, line, column and statements before it in chunks`, () => {
      const random = randomSource(format === 'turtle' ? 21 : 22);
      const breakers = ['<not an iri>', '"unclosed', ' ] ', ' . . ', 'nv:', '@prefix', '"""never closed', ' , ', ' _:1x ', ' ^^ ', ' @de '];
      let seen = 0;
      for (let round = 0; round < 150; round++) {
        const text = generatedDocument(random, 1 + Math.floor(random() * 8), format).text;
        const at = Math.floor(random() * text.length);
        const bytes = Buffer.from(text.slice(0, at) + breakers[round % breakers.length] + text.slice(at));
        const whole = parseWhole(bytes, FILE, format);
        if (whole.errors.length > 0) seen++;
        expect(parseCutBytes(bytes, randomCuts(random, bytes.length, 1 + Math.floor(random() * 40)), FILE, format)).toEqual(whole);
        if (round % 5 === 0) expect(parseCutBytes(bytes, everyByte(bytes.length), FILE, format)).toEqual(whole);
      }
      // Most of the inserted texts break the document (half at least), so the errors themselves were compared.
      expect(seen).toBeGreaterThan(75);
    });
  }

  it('the column of a lexical error on a line the lexer began many chunks earlier is the same in chunks', () => {
    const head = generatedDocument(randomSource(5), 10, 'turtle').text;
    const texts = [
      // An unclosed long string: n3 reports it at its opening line, read long before the text ends.
      `${head}nv:Car nv:note """never closed\nline two\nline three\n`,
      `${head}nv:Car nv:partOf <https://data.northvale-rail.example/def/not an iri> .\n`,
      `${head}nv:Car nv:label "Wagen\nnv:Car nv:partOf nv:Train .\n`,
      `${head}nv:Car nv:note """closed\nover lines""" ; nv:partOf ~nv:Train .\n`,
    ];
    for (const text of texts) {
      const bytes = Buffer.from(text);
      const whole = parseWhole(bytes, FILE, 'turtle');
      expect(whole.errors).toHaveLength(1);
      // The column comes from the error line's text, so it is a real check of the lines kept.
      expect(whole.errors[0].column).toBeGreaterThan(1);
      expect(parseCutBytes(bytes, everyByte(bytes.length), FILE, 'turtle')).toEqual(whole);
      expect(parseCutBytes(bytes, randomCuts(randomSource(bytes.length), bytes.length, 7), FILE, 'turtle')).toEqual(whole);
    }
  });

  it('a byte order mark, cut anywhere, is dropped as from the whole text', () => {
    const bytes = Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(generatedDocument(randomSource(3), 4, 'turtle').text)]);
    const whole = parseWhole(bytes, FILE, 'turtle');
    expect(whole.statements[0].position.column).toBe(1);
    for (const cut of [1, 2, 3, 4]) expect(parseCutBytes(bytes, [cut], FILE, 'turtle')).toEqual(whole);
  });

  it('statements stored as they are parsed are the ones a whole parse gives, with the unkept ones counted', () => {
    const random = randomSource(31);
    const bytes = Buffer.from(generatedDocument(random, 80, 'trig').text);
    const whole = parseWhole(bytes, FILE, 'trig');
    const keep = new Set(['https://data.northvale-rail.example/def/partOf', 'http://www.w3.org/1999/02/22-rdf-syntax-ns#type']);
    const store = new StatementStore();
    const sink = new StoringSink(store, keep, FILE);
    const parsed = parseCutBytes(bytes, randomCuts(random, bytes.length, 50), FILE, 'trig', { sink });
    const stored = sink.stored(parsed);
    const kept = whole.statements.filter((statement) => keep.has(statement.predicate));
    expect(kept.length).toBeGreaterThan(100);
    expect(stored.statements).toEqual(kept);
    expect(stored.statementCount).toBe(whole.statements.length);
    expect(stored.unkeptStatements).toBe(whole.statements.length - kept.length);
    expect(stored.allowComments).toEqual(whole.allowComments);
    expect(stored.prefixes).toEqual(whole.prefixes);
  });
});
