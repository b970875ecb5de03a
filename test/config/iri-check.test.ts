// Specification of the absolute-IRI check applied to IRIs written in config.
import fc from 'fast-check';
import { Parser } from 'n3';
import { describe, expect, it } from 'vitest';
import { iriProblem } from '../../src/config/iri-check.js';

/** Whether n3's own Turtle parser accepts the text as an IRI in `<...>` (the reference for IRIREF). */
function n3AcceptsIri(text: string): boolean {
  try {
    new Parser({ format: 'text/turtle' }).parse(`<${text}> <http://e.example/p> <http://e.example/o> .`);
    return true;
  } catch {
    return false;
  }
}

describe('iriProblem', () => {
  it('accepts absolute IRIs of several schemes', () => {
    expect(iriProblem('https://data.northvale-rail.example/def/Asset')).toBeUndefined();
    expect(iriProblem('http://purl.obolibrary.org/obo/BFO_0000050')).toBeUndefined();
    expect(iriProblem('urn:isbn:0451450523')).toBeUndefined();
    expect(iriProblem('https://data.northvale-rail.example/def/Gleis%C3%BCbergang')).toBeUndefined();
    expect(iriProblem('https://data.northvale-rail.example/def/Gleisübergang')).toBeUndefined();
  });

  it('says why a string is not an absolute IRI', () => {
    expect(iriProblem('')).toBe('it is empty');
    expect(iriProblem('data.northvale-rail.example/def/Asset')).toBe('it has no scheme; an absolute IRI starts with a scheme such as `https:`');
    expect(iriProblem('https://data.northvale-rail.example/def/Rolling Stock')).toBe('it contains a space at character 48');
    expect(iriProblem('<https://data.northvale-rail.example/>')).toBe('write the IRI without the angle brackets `<` and `>`');
    expect(iriProblem('https://data.northvale-rail.example/{id}')).toBe('it contains `{` at character 37, which an IRI may not contain');
    expect(iriProblem('https://data.northvale-rail.example/a\tb')).toBe('it contains a tab at character 38');
    expect(iriProblem('_:b0')).toBe('it is a blank node label; only IRIs can be named in config');
    expect(iriProblem('1http://x.example/')).toBe('it has no scheme; an absolute IRI starts with a scheme such as `https:`');
  });

  // RDF 1.1 Turtle, production IRIREF (from memory): `<` ([^#x00-#x20<>"{}|^`\] | UCHAR)* `>`.
  it.each(['<', '>', '"', '{', '}', '|', '^', '`', '\\', ' '])('rejects `%s`, which IRIREF excludes', (character) => {
    expect(iriProblem(`https://data.northvale-rail.example/a${character}b`)).toMatch(/contains/);
  });

  // Cross-check with n3's Turtle lexer (a reference library): after an absolute prefix, a string of
  // these characters passes our check exactly when n3 accepts it as an IRI. The backslash is left out
  // because Turtle allows \u escapes inside <...>, which config does not.
  it('agrees with n3 on which characters an IRI may contain', () => {
    const alphabet = ['a', 'Z', '0', '/', '#', '%', '-', '.', '~', ':', '?', '&', '=', 'é', ' ', '\t', '<', '>', '"', '{', '}', '|', '^', '`', '\u0001'];
    fc.assert(
      fc.property(fc.string({ unit: fc.constantFrom(...alphabet), maxLength: 8 }), (tail) => {
        const iri = `http://e.example/${tail}`;
        expect(iriProblem(iri) === undefined).toBe(n3AcceptsIri(iri));
      }),
      { numRuns: 500 },
    );
  });
});
