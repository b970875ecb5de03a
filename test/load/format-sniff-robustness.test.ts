// Sniffing line-based input with a bad line: the dump's own parser is chosen, and it errs on the bad line only.
import { readFileSync } from 'node:fs';
import { Readable } from 'node:stream';
import { describe, expect, it } from 'vitest';
import { detectFormat, sniffFormat } from '../../src/load/format.js';
import { parseSource } from '../../src/load/parse.js';
import { loadSources } from '../../src/load/sources.js';
import { readManifest } from './w3c-manifest.js';

const NV = 'https://data.northvale-rail.example/def/';
const SUBCLASS = 'http://www.w3.org/2000/01/rdf-schema#subClassOf';
const triple = (subject: string, object: string) => `<${NV}${subject}> <${SUBCLASS}> <${NV}${object}> .`;
const quad = (subject: string, object: string) => `<${NV}${subject}> <${SUBCLASS}> <${NV}${object}> <${NV}fleet-2024> .`;

/** Parses text as the sniffer says, as if it came through stdin. */
function sniffAndParse(text: string) {
  const format = detectFormat('-', text);
  if (format === undefined || format === 'rdf-xml' || format === 'json-ld') throw new Error(`the sniffer gave ${format ?? 'no format'}, not one of n3's`);
  return { format, source: parseSource(text, '<stdin>', format) };
}

describe('sniffing N-Quads with one bad line', () => {
  it('reads the review repro as N-Quads, keeps the good first quad and errs on line 2', () => {
    // The repro from review: a valid quad, then a line with five terms.
    const text = `${quad('Wagon', 'RollingStock')}\n<${NV}Coach> <${SUBCLASS}> <${NV}Car> <${NV}fleet-2024> <${NV}extra> .\n`;
    const { format, source } = sniffAndParse(text);
    expect(format).toBe('n-quads');
    expect(source.statements[0]).toMatchObject({ subject: `${NV}Wagon`, graph: `${NV}fleet-2024`, position: { line: 1, column: 1 } });
    expect(source.errors).toHaveLength(1);
    expect(source.errors[0].line).toBe(2);
    expect(source.errors[0].message).toMatch(/^N-Quads syntax error/);
    expect(source.errors[0].hint).toContain('optional graph');
  });

  it('chooses N-Quads when the bad line comes first and quads follow', () => {
    const text = [`<${NV}Axle> <${SUBCLASS}> .`, quad('Bogie', 'Part'), quad('Wheel', 'Part'), quad('Axle', 'Part')].join('\n');
    const { format, source } = sniffAndParse(text);
    expect(format).toBe('n-quads');
    expect(source.errors.map((error) => error.line)).toEqual([1]);
  });

  it('reads the same repro from stdin through loadSources with the error on the bad line', async () => {
    const text = `${quad('Wagon', 'RollingStock')}\n${quad('Coach', 'Car').replace(' .', ` <${NV}extra> .`)}\n`;
    const result = await loadSources(['-'], { stdin: Readable.from([Buffer.from(text)]) });
    expect(result.errors).toEqual([]);
    expect(result.sources[0].format).toBe('n-quads');
    expect(result.sources[0].errors).toEqual([expect.objectContaining({ file: '<stdin>', line: 2 })]);
  });
});

describe('sniffing N-Triples with one bad line', () => {
  const good = [triple('Wagon', 'RollingStock'), triple('Coach', 'Wagon'), triple('Locomotive', 'RollingStock'), triple('Bogie', 'Part')];

  it('chooses N-Triples for a missing object in the middle, and the error is on that line', () => {
    const text = [good[0], good[1], `<${NV}Pantograph> <${SUBCLASS}> .`, good[2], good[3]].join('\n');
    const { format, source } = sniffAndParse(text);
    expect(format).toBe('n-triples');
    expect(source.statements).toHaveLength(2);
    expect(source.errors.map((error) => [error.line, error.message.slice(0, 24)])).toEqual([[3, 'N-Triples syntax error: ']]);
  });

  it('chooses N-Triples for a prefixed name in a dump, where Turtle would stop on the same line', () => {
    // A tie between the two parsers goes to the shape most lines have.
    const text = [good[0], good[1], `<${NV}Pantograph> <${SUBCLASS}> nv:Part .`, good[2]].join('\n');
    expect(sniffFormat(text)).toBe('n-triples');
  });

  it('still chooses Turtle when Turtle reads further than N-Triples', () => {
    // Full-IRI lines with one object list and one integer object: valid Turtle, not N-Triples.
    const text = [good[0], `<${NV}Pantograph> <${SUBCLASS}> <${NV}Part>, <${NV}RoofEquipment> .`, good[1], `<${NV}Coach> <${NV}seats> 64 .`].join('\n');
    const { format, source } = sniffAndParse(text);
    expect(format).toBe('turtle');
    expect(source.errors).toEqual([]);
    expect(source.statements).toHaveLength(5);
  });

  it('reads a statement broken over two lines in full', () => {
    // n3's N-Triples reader, like its Turtle reader, takes a line break inside a statement as white
    // space (seen with n3 2.13.12), so either choice reads all four statements.
    const text = [good[0], `<${NV}Pantograph> <${SUBCLASS}>`, `    <${NV}Part> .`, good[1], good[2]].join('\n');
    const { format, source } = sniffAndParse(text);
    expect(['n-triples', 'turtle']).toContain(format);
    expect(source.errors).toEqual([]);
    expect(source.statements.map((statement) => statement.position.line)).toEqual([1, 2, 4, 5]);
  });

  it('still chooses Turtle for a Turtle file with a bad line after its prefixes', () => {
    const text = [`@prefix nv: <${NV}> .`, good[0], good[1], 'nv:Pantograph nv:partOf .', good[2]].join('\n');
    const { format, source } = sniffAndParse(text);
    expect(format).toBe('turtle');
    expect(source.errors.map((error) => error.line)).toEqual([4]);
  });

  it('still chooses TriG for graph blocks whose inner lines look like N-Triples', () => {
    const text = [`<${NV}fleet-2024> {`, good[0], good[1], good[2], '}'].join('\n');
    const { format, source } = sniffAndParse(text);
    expect(format).toBe('trig');
    expect(source.errors).toEqual([]);
  });
});

describe('sniffing the W3C negative N-Triples and N-Quads documents after good lines', () => {
  // Source: W3C rdf-tests rdf/rdf11 N-Triples and N-Quads suites, rdft:TestNTriplesNegativeSyntax and
  // rdft:TestNQuadsNegativeSyntax (test/standards/w3c-rdf-tests). Each bad document is put after
  // three good lines of the same syntax: whatever the sniffer picks, the good lines must be read and
  // no error may fall on them (one bad line must not flip the guess onto a parser that rejects them).
  const cases = [
    { folder: 'rdf-n-triples', line: triple },
    { folder: 'rdf-n-quads', line: quad },
  ];
  for (const { folder, line } of cases) {
    it(`keeps the three good lines before each ${folder} negative syntax test`, () => {
      let checked = 0;
      for (const test of readManifest(folder).filter((entry) => entry.kind === 'negative-syntax')) {
        const bad = readFileSync(test.actionPath, 'utf8');
        const text = `${line('Wagon', 'RollingStock')}\n${line('Coach', 'Wagon')}\n${line('Bogie', 'Part')}\n${bad}`;
        const { source } = sniffAndParse(text);
        expect(source.statements.length, test.name).toBeGreaterThanOrEqual(3);
        expect(source.statements.slice(0, 3).map((statement) => statement.position.line), test.name).toEqual([1, 2, 3]);
        for (const error of source.errors) expect(error.line, test.name).toBeGreaterThan(3);
        checked++;
      }
      expect(checked).toBeGreaterThan(20);
    });
  }

  it('picks the line-based parser, not Turtle, for each N-Quads negative test after good quads', () => {
    // Source: as above. Turtle and TriG cannot read a four-term line, so only N-Quads may be chosen.
    let checked = 0;
    for (const test of readManifest('rdf-n-quads').filter((entry) => entry.kind === 'negative-syntax')) {
      const bad = readFileSync(test.actionPath, 'utf8');
      const text = `${quad('Wagon', 'RollingStock')}\n${quad('Coach', 'Wagon')}\n${quad('Bogie', 'Part')}\n${bad}`;
      expect(sniffFormat(text), test.name).toBe('n-quads');
      checked++;
    }
    expect(checked).toBeGreaterThan(20);
  });
});
