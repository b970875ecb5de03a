// Allow comments, blank node labels and base IRIs as parseSource gives them.
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { blankNodeLabelPrefix, parseSource } from '../../src/load/parse.js';
import { readAllowComment } from '../../src/load/allow-comments.js';

const NV = 'https://data.northvale-rail.example/def/';

describe('allow comments', () => {
  const text = [
    `@prefix nv: <${NV}> .`,
    'nv:Pantograph nv:partOf nv:Locomotive . # isapart-allow kind-and-part: sold as one kit',
    '   # isapart-allow orphan-class:   top of the rolling stock tree  ',
    'nv:RollingStock a nv:Class .',
    '# an ordinary comment mentioning isapart-allowed things',
    `<${NV}Coupler#a> nv:label "# isapart-allow kind-and-part: inside a string" .`,
  ].join('\n');

  it('collects trailing and own-line allow comments with line, column, rule id and trimmed reason', () => {
    const source = parseSource(text, 'allow.ttl', 'turtle');
    expect(source.errors).toEqual([]);
    // The '#' inside an IRI and inside a string literal starts no comment.
    expect(source.statements).toHaveLength(3);
    expect(source.statements[2].subject).toBe(`${NV}Coupler#a`);
    // Column counted by hand: the '#' is the 41st character of line 2.
    expect(source.allowComments).toEqual([
      { file: 'allow.ttl', line: 2, column: 41, ruleId: 'kind-and-part', reason: 'sold as one kit', ownLine: false },
      { file: 'allow.ttl', line: 3, column: 4, ruleId: 'orphan-class', reason: 'top of the rolling stock tree', ownLine: true },
    ]);
  });

  it('reads allow comments in N-Triples too', () => {
    const line = `<${NV}Bogie> <${NV}partOf> <${NV}Car> . # isapart-allow part-cycle: shared bogie`;
    const source = parseSource(line, 'allow.nt', 'n-triples');
    expect(source.allowComments).toEqual([
      { file: 'allow.nt', line: 1, column: line.indexOf('#') + 1, ruleId: 'part-cycle', reason: 'shared bogie', ownLine: false },
    ]);
  });

  it('reports a malformed allow comment as an error with the right form as hint, and keeps parsing', () => {
    const broken = [
      `@prefix nv: <${NV}> .`,
      '# isapart-allow',
      'nv:Car a nv:Wagon . # isapart-allow kind-and-part',
      '# isapart-allow kind-and-part:   ',
      '# isapart-allow : no rule id',
      'nv:Axle a nv:Part .',
    ].join('\n');
    const source = parseSource(broken, 'malformed.ttl', 'turtle');
    expect(source.statements).toHaveLength(2);
    expect(source.allowComments).toEqual([]);
    expect(source.errors.map((error) => [error.line, error.column])).toEqual([
      [2, 1],
      [3, 21],
      [4, 1],
      [5, 1],
    ]);
    expect(source.errors[0].message).toContain('no rule id');
    expect(source.errors[1].message).toContain('no ":" followed by a reason');
    expect(source.errors[2].message).toContain('reason after ":" is empty');
    for (const error of source.errors) expect(error.hint).toContain('# isapart-allow RULE-ID: reason');
  });

  it('leaves words that only start like the marker alone', () => {
    const site = { file: 'x.ttl', line: 1, column: 1, ownLine: true };
    expect(readAllowComment(' isapart-allowed: yes', site)).toEqual({ kind: 'ordinary' });
    expect(readAllowComment(' see isapart-allow docs', site)).toEqual({ kind: 'ordinary' });
    expect(readAllowComment(' isapart-allow a b: two words', site).kind).toBe('malformed');
  });
});

describe('blank node labels', () => {
  const text = `@prefix nv: <${NV}> .\n_:x nv:partOf nv:Train .\n[ a nv:Coupler ] nv:partOf _:x .\n`;

  it('are the same when the same text is parsed twice', () => {
    const first = parseSource(text, 'fixtures/a.ttl', 'turtle');
    const second = parseSource(text, 'fixtures/a.ttl', 'turtle');
    expect(second.statements).toEqual(first.statements);
    expect(first.statements[0].subject).toMatch(/^_:b[0-9a-f]{8}_x$/);
  });

  it('differ between files, while a label keeps its name after the file prefix', () => {
    const first = parseSource(text, 'fixtures/a.ttl', 'turtle');
    const second = parseSource(text, 'fixtures/b.ttl', 'turtle');
    const labelA = first.statements[0].subject;
    const labelB = second.statements[0].subject;
    expect(labelA).not.toBe(labelB);
    expect(labelA.endsWith('_x')).toBe(true);
    expect(labelB.endsWith('_x')).toBe(true);
    // The anonymous [ ] node never collides with the labelled one.
    const anonymous = first.statements[1].subject;
    expect(anonymous).not.toBe(labelA);
    expect(first.statements[2].object).toBe(labelA);
  });
});

describe('blank node labels by normalised path', () => {
  const text = `@prefix nv: <${NV}> .\n_:x nv:partOf nv:Train .\n`;
  const cwd = '/srv/northvale/graph';
  const labelOf = (file: string, options: { cwd?: string } = { cwd }) => parseSource(text, file, 'turtle', options).statements[0].subject;

  it('are the same for blank.ttl, ./blank.ttl, sub/../blank.ttl and the absolute path', () => {
    const label = labelOf('blank.ttl');
    expect(labelOf('./blank.ttl')).toBe(label);
    expect(labelOf('sub/../blank.ttl')).toBe(label);
    expect(labelOf(`${cwd}/blank.ttl`)).toBe(label);
    // The prefix is the SHA-1 of the path relative to cwd (node:crypto is the reference).
    expect(label).toBe(`_:b${createHash('sha1').update('blank.ttl').digest('hex').slice(0, 8)}_x`);
    expect(blankNodeLabelPrefix('./blank.ttl', cwd)).toBe(label.slice(2, -1));
  });

  it('still differ between two different files, also under another folder of the same name', () => {
    expect(labelOf('other.ttl')).not.toBe(labelOf('blank.ttl'));
    expect(labelOf('sub/blank.ttl')).not.toBe(labelOf('blank.ttl'));
  });

  it('hash a file outside cwd by its relative path with ../', () => {
    const expected = `_:b${createHash('sha1').update('../depots/blank.ttl').digest('hex').slice(0, 8)}_x`;
    expect(labelOf('/srv/northvale/depots/blank.ttl')).toBe(expected);
    expect(labelOf('../depots/./blank.ttl')).toBe(expected);
  });

  it('keep one fixed prefix for standard input, whatever the cwd', () => {
    expect(labelOf('<stdin>', { cwd: '/srv/a' })).toBe(labelOf('<stdin>', { cwd: '/srv/b' }));
    expect(labelOf('<stdin>')).toBe(`_:b${createHash('sha1').update('<stdin>').digest('hex').slice(0, 8)}_x`);
  });
});

describe('base IRI', () => {
  it('resolves relative IRIs against the file URL by default, or against baseIri', () => {
    const text = '<Car> <partOf> <../Train> .';
    const byFile = parseSource(text, '/data/rolling-stock/cars.ttl', 'turtle');
    expect(byFile.statements[0]).toMatchObject({
      subject: 'file:///data/rolling-stock/Car',
      predicate: 'file:///data/rolling-stock/partOf',
      object: 'file:///data/Train',
    });
    const byOption = parseSource(text, 'cars.ttl', 'turtle', { baseIri: 'https://data.northvale-rail.example/def/' });
    expect(byOption.statements[0].object).toBe('https://data.northvale-rail.example/Train');
  });

  it('keeps literals as Literal objects with datatype and language', () => {
    const source = parseSource(`<${NV}Car> <${NV}label> "Wagen"@de, "4"^^<http://www.w3.org/2001/XMLSchema#integer> .`, 'l.ttl', 'turtle');
    // RDF 1.1 Concepts: a language-tagged string has datatype rdf:langString (from memory: section 3.3).
    expect(source.statements.map((statement) => statement.object)).toEqual([
      { value: 'Wagen', datatype: 'http://www.w3.org/1999/02/22-rdf-syntax-ns#langString', language: 'de' },
      { value: '4', datatype: 'http://www.w3.org/2001/XMLSchema#integer', language: '' },
    ]);
  });
});
