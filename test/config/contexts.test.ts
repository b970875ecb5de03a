// The contexts: key of isapart.yaml: JSON-LD context IRIs mapped to local files, every error placed.
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseConfig } from '../../src/config/load-config.js';

const FILE = path.resolve('/projects/northvale/isapart.yaml');
const CONTEXT_IRI = 'https://data.northvale-rail.example/context.jsonld';

/** The errors of a config text as `line:column message | hint` lines. */
function errorsOf(text: string): string[] {
  return parseConfig(text, FILE).errors.map((error) => `${error.line}:${error.column} ${error.message} | ${error.hint ?? ''}`);
}

describe('contexts: in isapart.yaml', () => {
  it('maps each context IRI to its file, relative to the config file', () => {
    const text = `contexts:\n  ${CONTEXT_IRI}: ./contexts/northvale.jsonld\n  "https://schema.example/ctx": /opt/contexts/schema.jsonld\n`;
    const { config, errors } = parseConfig(text, FILE);
    expect(errors).toEqual([]);
    expect(config.contexts).toEqual({
      [CONTEXT_IRI]: path.resolve('/projects/northvale/contexts/northvale.jsonld'),
      'https://schema.example/ctx': path.resolve('/opt/contexts/schema.jsonld'),
    });
  });

  it('is empty when the key is absent', () => {
    expect(parseConfig('scope: []\n', FILE).config.contexts).toEqual({});
  });

  it('refuses a list, a relative IRI and a path that is not text, each at its line', () => {
    expect(errorsOf(`contexts: [${CONTEXT_IRI}]\n`)).toEqual([
      '1:11 `contexts` must be a mapping from context IRI to a local file, found a list | write `contexts: { "https://data.northvale-rail.example/context.jsonld": ./contexts/northvale.jsonld }`',
    ]);
    const errors = errorsOf(`contexts:\n  context.jsonld: ./a.jsonld\n  ${CONTEXT_IRI}: [a, b]\n`);
    expect(errors).toHaveLength(2);
    expect(errors[0]).toMatch(/^2:3 `context.jsonld` in `contexts` is not an absolute IRI: /);
    expect(errors[1]).toMatch(/^3:\d+ the local file for the context `https:\/\/data\.northvale-rail\.example\/context\.jsonld` must be a path, found a list \| write a path relative to this config file/);
  });
});
