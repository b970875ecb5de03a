// relativePath and fileUri: report paths relative to the run folder, and URIs that resolve back to the file.
import { pathToFileURL } from 'node:url';
import { describe, expect, it } from 'vitest';
import { fileUri, folderUri, relativePath, STDIN_FILE } from '../../src/report/paths.js';

const CWD = '/srv/northvale';

describe('relativePath', () => {
  it('makes paths relative to the run folder, and leaves stdin as -', () => {
    expect(relativePath('/srv/northvale/data/rolling-stock.ttl', CWD)).toBe('data/rolling-stock.ttl');
    expect(relativePath('data/rolling-stock.ttl', CWD)).toBe('data/rolling-stock.ttl');
    expect(relativePath('/srv/shared/vocab.ttl', CWD)).toBe('../shared/vocab.ttl');
    expect(relativePath(STDIN_FILE, CWD)).toBe(STDIN_FILE);
  });
});

describe('fileUri', () => {
  it('percent-encodes each segment, and the reference resolves to the file', () => {
    const base = folderUri(CWD);
    expect(base).toBe('file:///srv/northvale/');
    for (const file of ['/srv/northvale/data/signal plans/signals.nt', '/srv/northvale/data/50%-draft#2.ttl', '/srv/shared/vocab.ttl', '/srv/northvale/a:b.ttl', "/srv/northvale/data/depot@north;v=2+(old),&$[1]'!*.ttl", '/srv/northvale/data/Zugführer ü.ttl']) {
      const uri = fileUri(file, CWD)!;
      expect(uri).not.toMatch(/[ #]/);
      // The WHATWG URL parser and node's pathToFileURL are the reference for what the URI names.
      expect(new URL(uri, base).href).toBe(pathToFileURL(file).href);
    }
    expect(fileUri('/srv/northvale/data/signal plans/signals.nt', CWD)).toBe('data/signal%20plans/signals.nt');
    expect(fileUri('/srv/northvale/a:b.ttl', CWD)).toBe('./a:b.ttl');
    expect(fileUri(STDIN_FILE, CWD)).toBeUndefined();
  });
});
