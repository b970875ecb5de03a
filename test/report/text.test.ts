// toText: findings grouped by file, allowed ones counted, problems first, a summary line, colour only when asked.
import { describe, expect, it } from 'vitest';
import { toText } from '../../src/report/text.js';
import { ALL_FINDINGS, DEF, PANTOGRAPH_FINDING, context } from './report-fixtures.js';

// Any ANSI escape sequence (ECMA-48 CSI: ESC '[').
const ANSI_ESCAPE = /\u001b\[/;

const PREFIXES = {
  nv: DEF,
  rdfs: 'http://www.w3.org/2000/01/rdf-schema#',
  dcterms: 'http://purl.org/dc/terms/',
};

function fullText(color = false): string {
  return toText(ALL_FINDINGS, { ...context({ problems: true, color }), prefixes: PREFIXES });
}

describe('toText', () => {
  it('groups findings under their files, sorted, with paths relative to the run folder', () => {
    const lines = fullText().split('\n');
    const headers = lines.filter((line) => line.startsWith('data/') && !line.includes(' '.repeat(2)));
    expect(headers).toEqual(['data/infrastructure.trig', 'data/rolling-stock.ttl', 'data/signal plans/signals.nt']);
    const rollingStock = lines.indexOf('data/rolling-stock.ttl');
    expect(lines.slice(rollingStock, rollingStock + 7)).toEqual([
      'data/rolling-stock.ttl',
      '  warning  kind-and-part  nv:Pantograph is part of nv:Locomotive and also a kind of nv:Locomotive',
      '      data/rolling-stock.ttl:12:1  nv:Pantograph dcterms:isPartOf nv:Locomotive',
      '      data/rolling-stock.ttl:13:5  nv:Pantograph rdfs:subClassOf nv:Locomotive',
      '      fix: remove data/rolling-stock.ttl:12:1  nv:Pantograph dcterms:isPartOf nv:Locomotive',
      '  warning  unused-allow  the allow comment for part-cycle suppresses no finding',
      '      data/rolling-stock.ttl:31:40',
    ]);
  });

  it('lists input errors and rule failures first', () => {
    const text = fullText();
    expect(text.startsWith('input errors (2)\n')).toBe(true);
    expect(text).toContain('  data/broken.ttl:4:17  error    Expected a term after the predicate, found "."\n      hint: write an object before the full stop\n');
    expect(text).toContain('  data/missing.ttl  error    No such file\n      hint: check the path\n');
    expect(text).toContain('rule failures (1)\n  error    subclass-cycle  the rule failed: path compilation failed at "subclass-of+"\n');
    expect(text).toContain('input warnings (1)\n  data/rolling-stock.ttl:12:1  warning  the object of dcterms:isPartOf is a literal');
    expect(text.indexOf('rule failures')).toBeLessThan(text.indexOf('data/infrastructure.trig'));
  });

  it('counts allowed findings per rule instead of listing them', () => {
    const text = fullText();
    expect(text).toContain('allowed (3)\n  kind-and-part  2 allowed (1 by allow comment, 1 by config)\n  subclass-cycle  1 allowed (1 by config)\n');
    expect(text).not.toContain('nv:Bogie');
    expect(text).not.toContain('nv:Coupler');
    expect(text).not.toContain(':20:');
  });

  it('ends with one summary line of counts per level, allowed, problems and what was read', () => {
    const lines = fullText().trimEnd().split('\n');
    expect(lines.at(-1)).toBe('1 error, 2 warnings, 1 note; 3 allowed; 2 input errors; 1 rule failure; 3 files and 173 statements read');
    expect(toText([], context()).trimEnd()).toBe('0 errors, 0 warnings, 0 notes; 0 allowed; 3 files and 173 statements read');
  });

  it('writes full IRIs in <> without prefixes, and prefixed names with them', () => {
    const withoutPrefixes = toText([PANTOGRAPH_FINDING], context());
    expect(withoutPrefixes).toContain(`  <${DEF}Pantograph> <http://purl.org/dc/terms/isPartOf> <${DEF}Locomotive>\n`);
    expect(fullText()).toContain(`nv:SemaphoreSignal <http://www.w3.org/2002/07/owl#deprecated> "true"^^<http://www.w3.org/2001/XMLSchema#boolean>`);
  });

  it('has no ANSI escapes when colour is off, and coloured level words and dim locations when on', () => {
    expect(fullText(false)).not.toMatch(ANSI_ESCAPE);
    const coloured = fullText(true);
    expect(coloured).toMatch(ANSI_ESCAPE);
    // SGR codes (ECMA-48): 33 yellow, 39 default colour, 2 faint, 22 normal intensity.
    expect(coloured).toContain('\u001b[33mwarning\u001b[39m');
    expect(coloured).toContain('\u001b[2mdata/rolling-stock.ttl:12:1\u001b[22m');
    expect(coloured.replace(/\u001b\[\d+m/g, '')).toBe(fullText(false));
  });

  it('gives the same text for the findings in any order', () => {
    const reversed = toText([...ALL_FINDINGS].reverse(), { ...context({ problems: true }), prefixes: PREFIXES });
    expect(reversed).toBe(fullText());
  });
});
