// LineWindow: the lines a lexer is still in, with n3's line ends, and nothing before them.
import { describe, expect, it } from 'vitest';
import { LineWindow } from '../../src/load/line-window.js';
import { parseSource } from '../../src/load/parse.js';
import { parseCutBytes, everyByte } from './chunked-turtle.js';

describe('LineWindow', () => {
  it('numbers lines at LF, CRLF and a lone CR, as n3 does', () => {
    const window = new LineWindow();
    window.append('one\ntwo\r\nthree\rfour');
    expect([1, 2, 3, 4, 5].map((line) => window.textOfLine(line))).toEqual(['one', 'two', 'three', 'four', '']);
  });

  it('drops the lines before the one the unread text starts in, with any line end', () => {
    for (const newline of ['\n', '\r\n', '\r']) {
      const window = new LineWindow();
      window.append(['a .', 'b .', 'c .', 'd "unfinished'].join(newline));
      // The lexer holds `"unfinished` unread: line 4 is kept, lines 1 to 3 are gone.
      window.dropBefore('"unfinished'.length);
      expect([1, 3, 4].map((line) => window.textOfLine(line)), JSON.stringify(newline)).toEqual(['', '', 'd "unfinished']);
      window.append(`${newline}e .`);
      expect(window.textOfLine(5)).toBe('e .');
    }
  });

  it('keeps a CR whose LF may come in the next chunk with its line', () => {
    const window = new LineWindow();
    window.append('a .\r');
    window.dropBefore(0);
    window.append('\nb .');
    window.dropBefore(0);
    expect(window.textOfLine(1)).toBe('');
    expect(window.textOfLine(2)).toBe('b .');
  });
});

describe('a lexical error in a file with lone CR line ends', () => {
  it('is placed at its column on its own line, in one chunk and byte by byte', () => {
    const text = '@prefix nv: <https://data.northvale-rail.example/def/> .\rnv:Car nv:partOf nv:Train .\rnv:Car nv:label "Wagen\rnv:Axle nv:partOf nv:Bogie .\r';
    const whole = parseSource(text, 'fleet.ttl', 'turtle');
    // n3 ends a line at a lone CR (common practice for old Mac files), so the string opens on line 3, column 17.
    expect(whole.errors).toHaveLength(1);
    expect(whole.errors[0]).toMatchObject({ line: 3, column: 17 });
    expect(whole.statements).toHaveLength(1);
    const bytes = Buffer.from(text);
    expect(parseCutBytes(bytes, everyByte(bytes.length), 'fleet.ttl', 'turtle')).toEqual(whole);
  });
});
