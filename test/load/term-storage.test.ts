// Terms and literals kept as bytes: the arena, the store's term numbering and its literal table give back exactly what went in.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ByteArena } from '../../src/load/byte-arena.js';
import { LiteralTable } from '../../src/load/literal-table.js';
import { StatementStore } from '../../src/load/statement-store.js';
import { hasLoneSurrogate } from '../../src/load/term-bytes.js';

// Any code point, lone surrogates included (fast-check's 'binary' unit), so non-ASCII text and
// text UTF-8 cannot encode are both drawn.
const anyText = fc.string({ unit: 'binary', maxLength: 40 });
// Text as a real term is: IRIs sharing long starts, with non-ASCII and escapes' results (quotes, backslashes, line breaks).
const termText = fc
  .tuple(
    fc.constantFrom('https://data.northvale-rail.example/asset/', 'http://www.w3.org/2000/01/rdf-schema#', '_:b', 'urn:x-', ''),
    fc.string({ unit: fc.constantFrom('a', 'Z', '0', 'é', 'Ü', '中', '😀', '"', '\\', '\n', '\t', ' ', '>', '\uD800', '\uDC00'), maxLength: 12 }),
  )
  .map(([start, rest]) => start + rest);

describe('ByteArena', () => {
  it('gives back every stored string, across block ends, for strings longer than a block and for empty ones', () => {
    const arena = new ByteArena();
    const stored: { offset: number; bytes: Buffer }[] = [];
    const add = (bytes: Buffer) => stored.push({ offset: arena.append(bytes, 0, bytes.length), bytes });
    // 3,000 strings of 0.5–1.5 KiB fill about three 1 MiB blocks, so many strings meet a block's end.
    for (let index = 0; index < 3000; index++) add(Buffer.from(`${index}:`.padEnd(512 + ((index * 7919) % 1024), 'é')));
    add(Buffer.alloc(3 * 2 ** 20 + 5, 'x'));
    add(Buffer.alloc(0));
    add(Buffer.from('after the long one', 'utf8'));
    for (const { offset, bytes } of stored) {
      expect(arena.text(offset, bytes.length)).toBe(bytes.toString('utf8'));
      expect(arena.startsWith(offset, bytes.length, bytes.subarray(0, 3))).toBe(true);
    }
    // Each block of short strings wastes less than one string at its end; the long string takes four
    // blocks of its own, and the string after it starts one more.
    const short = stored.slice(0, 3000).map(({ bytes }) => bytes.length);
    const shortBlocks = Math.ceil(short.reduce((sum, length) => sum + length, 0) / (2 ** 20 - Math.max(...short)));
    expect(arena.allocatedBytes).toBeLessThanOrEqual((shortBlocks + 4 + 1) * 2 ** 20);
  });

  it('keeps a string in its block while the arena grows past it, once the first block is full', () => {
    const arena = new ByteArena();
    // 1,100 KB fill the first block (1 MiB) and start the second.
    for (let index = 0; index < 1100; index++) arena.append(Buffer.alloc(1000, 'a'), 0, 1000);
    const first = Buffer.from('https://data.northvale-rail.example/def/Bogie');
    const offset = arena.append(first, 0, first.length);
    const blockBefore = arena.blockOf(offset);
    for (let index = 0; index < 5000; index++) arena.append(Buffer.alloc(1000, 'a'), 0, 1000);
    expect(arena.blockOf(offset)).toBe(blockBefore);
    expect(arena.text(offset, first.length)).toBe('https://data.northvale-rail.example/def/Bogie');
  });

  it('starts small: the first block is 64 KiB and doubles, keeping what it holds, up to 1 MiB', () => {
    const arena = new ByteArena();
    const word = Buffer.from('Drehgestell ü', 'utf8');
    const offset = arena.append(word, 0, word.length);
    expect(arena.allocatedBytes).toBe(2 ** 16);
    for (let index = 0; index < 100; index++) arena.append(Buffer.alloc(1000, 'b'), 0, 1000);
    expect(arena.allocatedBytes).toBe(2 ** 17);
    for (let index = 0; index < 1500; index++) arena.append(Buffer.alloc(1000, 'c'), 0, 1000);
    // The first block grew to 1 MiB, then a second one was started.
    expect(arena.allocatedBytes).toBe(2 * 2 ** 20);
    expect(arena.text(offset, word.length)).toBe('Drehgestell ü');
  });
});

describe('StatementStore term numbering', () => {
  it('numbers texts as a Map does, in first-seen order, and gives each text back exactly, lone surrogates included', () => {
    fc.assert(
      fc.property(fc.array(fc.oneof(termText, anyText), { maxLength: 60 }), (texts) => {
        const store = new StatementStore();
        // Reference: a JavaScript Map from text to first-seen number.
        const reference = new Map<string, number>();
        for (const text of texts) {
          if (!reference.has(text)) reference.set(text, reference.size);
          expect(store.term(text)).toBe(reference.get(text));
        }
        expect(store.termCount).toBe(reference.size);
        for (const [text, termNumber] of reference) {
          expect(store.text(termNumber)).toBe(text);
          expect(store.termNumberOf(text)).toBe(termNumber);
        }
        expect(store.termNumberOf('never stated \u0001')).toBe(-1);
      }),
      { numRuns: 300 },
    );
  });

  it('takes about the bytes of its terms plus a few integers each, with no string kept per term', () => {
    const store = new StatementStore();
    let keyBytes = 0;
    for (let index = 0; index < 200_000; index++) {
      const bytes = Buffer.from(`<https://data.northvale-rail.example/asset/unit/${index}>`, 'utf8');
      store.termOfBytes(bytes, 1, bytes.length - 1);
      keyBytes += bytes.length - 2;
    }
    const { terms } = store.termBytes;
    // Keys, then per term at most 4 slots of the hash table kept at most half full (it doubles) and
    // 4 entry columns grown by half, 4 bytes each, and one partly filled 1 MiB block: the growth rules of ByteTable and ByteArena.
    expect(terms).toBeGreaterThanOrEqual(keyBytes);
    expect(terms).toBeLessThanOrEqual(keyBytes + 200_000 * (4 * 4 + 4 * 4 * 1.5) + 2 ** 20);
    expect(store.text(123_456)).toBe('https://data.northvale-rail.example/asset/unit/123456');
  });

  it('finds a term stated as UTF-8 bytes and one stated as text as the same term', () => {
    fc.assert(
      fc.property(fc.array(termText.filter((text) => !hasLoneSurrogate(text)), { minLength: 1, maxLength: 30 }), (texts) => {
        const store = new StatementStore();
        const numbers = texts.map((text) => store.term(text));
        texts.forEach((text, index) => {
          // Node's own UTF-8 encoder makes the bytes the fast path would read from a file.
          const bytes = Buffer.from(`<${text}>`, 'utf8');
          expect(store.termOfBytes(bytes, 1, bytes.length - 1)).toBe(numbers[index]);
        });
        expect(store.termCount).toBe(new Set(texts).size);
      }),
      { numRuns: 300 },
    );
  });

  it('tests a prefix on the bytes as String.prototype.startsWith does on the texts', () => {
    fc.assert(
      fc.property(termText, fc.nat(20), termText.filter((text) => !hasLoneSurrogate(text)), (text, cut, other) => {
        const store = new StatementStore();
        const termNumber = store.term(text);
        // A prefix of the text itself (cut at a code point, not inside a pair), and an unrelated one.
        const points = [...text];
        const ownPrefix = points.slice(0, Math.min(cut, points.length)).join('');
        for (const prefix of [ownPrefix, other]) {
          if (hasLoneSurrogate(prefix)) continue;
          expect(store.termStartsWith(termNumber, Buffer.from(prefix, 'utf8'))).toBe(text.startsWith(prefix));
        }
      }),
      { numRuns: 500 },
    );
  });
});

describe('LiteralTable', () => {
  it('gives back each literal with its datatype and language, and stores each kind once', () => {
    const kindArbitrary = fc.constantFrom(
      { datatype: 'http://www.w3.org/2001/XMLSchema#string', language: '' },
      { datatype: 'http://www.w3.org/1999/02/22-rdf-syntax-ns#langString', language: 'en' },
      { datatype: 'http://www.w3.org/1999/02/22-rdf-syntax-ns#langString', language: 'de-ch' },
      { datatype: 'http://www.w3.org/2001/XMLSchema#boolean', language: '' },
    );
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.oneof(anyText, termText), kindArbitrary), { maxLength: 50 }), (entries) => {
        const table = new LiteralTable();
        const numbers = entries.map(([value, kind]) => table.add({ value, ...kind }));
        expect(numbers).toEqual(entries.map((_, index) => index));
        entries.forEach(([value, kind], index) => {
          expect(table.literal(numbers[index])).toEqual({ value, ...kind });
          expect(table.value(numbers[index])).toBe(value);
        });
        // Literals of one kind share one kind object.
        const byKind = new Map(entries.map(([, kind], index) => [`${kind.datatype} ${kind.language}`, table.kind(numbers[index])]));
        entries.forEach(([, kind], index) => expect(table.kind(numbers[index])).toBe(byKind.get(`${kind.datatype} ${kind.language}`)));
      }),
      { numRuns: 300 },
    );
  });

  it('reads a written suffix once: the same suffix gives the same kind without decoding it again', () => {
    const table = new LiteralTable();
    const written = ['"Bogie"@EN-gb', '"Wagon"@EN-gb', '"Axle"@en-GB', '"7"^^<http://www.w3.org/2001/XMLSchema#integer>', '"x"'];
    const line = Buffer.from(written.join(' '), 'utf8');
    // Each suffix runs from after the literal's closing quote to the end of the written literal.
    const suffixes: [number, number][] = [];
    let offset = 0;
    for (const literal of written) {
      suffixes.push([offset + literal.lastIndexOf('"') + 1, offset + literal.length]);
      offset += literal.length + 1;
    }
    let decoded = 0;
    const decode = (start: number, end: number) => () => {
      decoded++;
      const suffix = line.toString('utf8', start, end);
      return suffix.startsWith('@')
        ? { datatype: 'http://www.w3.org/1999/02/22-rdf-syntax-ns#langString', language: suffix.slice(1).toLowerCase() }
        : { datatype: suffix === '' ? 'http://www.w3.org/2001/XMLSchema#string' : suffix.slice(3, -1), language: '' };
    };
    const kinds = suffixes.map(([start, end]) => table.kindOfSuffix(line, start, end, decode(start, end)));
    expect(decoded).toBe(4);
    expect(kinds[0]).toBe(kinds[1]);
    // "@en-GB" is another spelling of the same language tag, so another suffix but the same kind.
    expect(kinds[2]).toBe(kinds[0]);
    expect(new Set(kinds).size).toBe(3);
    const value = table.addBytes(line, 1, 6, kinds[3]);
    expect(table.literal(value)).toEqual({ value: 'Bogie', datatype: 'http://www.w3.org/2001/XMLSchema#integer', language: '' });
  });
});
