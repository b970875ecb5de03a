// The README's formats table names exactly the extensions the loader reads, each with its syntax.
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { formatFromExtension, isReadInFolders, RDF_EXTENSIONS } from '../../src/load/format.js';
import { formatName } from '../../src/load/syntax-error.js';

const README = readFileSync(fileURLToPath(new URL('../../README.md', import.meta.url)), 'utf8');

describe('README formats table', () => {
  it('lists each syntax with the extensions that select it, and only those', () => {
    const section = README.slice(README.indexOf('### Formats'));
    // The table runs from the section's first '|' line to the first line that is not one.
    const table = section.slice(section.indexOf('\n|'), section.indexOf('\n\n', section.indexOf('\n|')));
    const rows = table.split('\n').filter((line) => line.startsWith('| ') && !line.startsWith('| syntax') && !line.startsWith('| ---'));
    expect(rows.length).toBe(6);
    const listed: string[] = [];
    for (const row of rows) {
      const [syntax, extensions] = row.split(' | ').map((cell) => cell.replace(/^\| /, ''));
      for (const [, extension] of extensions.matchAll(/`(\.[a-z]+)`/g)) {
        listed.push(extension);
        expect(formatName(formatFromExtension(`file${extension}`) ?? 'turtle'), extension).toBe(syntax);
        expect(formatFromExtension(`file${extension}`), extension).toBeDefined();
      }
    }
    expect(listed.filter((extension) => isReadInFolders(`file${extension}`)).sort()).toEqual([...RDF_EXTENSIONS].sort());
    expect(listed.filter((extension) => !isReadInFolders(`file${extension}`))).toEqual(['.xml']);
  });
});
